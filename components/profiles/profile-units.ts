/**
 * Numbers on the oven-profile screens in the user's unit system. Stored values are metric;
 * conversions use the mathjs-derived table (lib/coating-math/display-units.ts), so no mathjs in
 * the browser.
 */
import { convert, formatSignificant, type UnitSystem } from "@/lib/coating-math/display-units";
import type { TemperatureFormat } from "@/lib/profiles/verdict";

/** Colour-blind-safe probe colours (Okabe–Ito order). Here, not in the chart, so importing them does not pull the chart library in. */
export const PROBE_COLOURS = ["#0072b2", "#d55e00", "#009e73", "#cc79a7", "#e69f00", "#56b4e9"];

export const tempUnit = (sys: UnitSystem) => (sys === "us" ? "°F" : "°C");
export const lengthUnit = (sys: UnitSystem) => (sys === "us" ? "in" : "mm");
/** a temperature difference: K, or °F steps (°R, no offset) */
export const deltaUnit = (sys: UnitSystem) => (sys === "us" ? "°F" : "K");
export const hUnit = (sys: UnitSystem) => (sys === "us" ? "Btu/(h·ft²·°F)" : "W/(m²·K)");

/** °C → the number shown */
export const tempShown = (c: number, sys: UnitSystem) => (sys === "us" ? convert(c, "degC", "degF") : c);
export const tempText = (c: number, sys: UnitSystem) => `${Math.round(tempShown(c, sys))} ${tempUnit(sys)}`;
export const deltaText = (k: number, sys: UnitSystem, sig = 2) =>
  `${formatSignificant(sys === "us" ? convert(k, "K", "degR") : k, sig)} ${deltaUnit(sys)}`;
export const lengthText = (mm: number, sys: UnitSystem) => `${formatSignificant(sys === "us" ? convert(mm, "mm", "inch") : mm, 3)} ${lengthUnit(sys)}`;
export const hText = (h: number, sys: UnitSystem) =>
  `${formatSignificant(sys === "us" ? convert(h, "W/(m^2 K)", "BTU/(h ft^2 degR)") : h, 3)} ${hUnit(sys)}`;
export const minutesText = (min: number) => `${formatSignificant(min, 3)} min`;

/** The verdict's sentences in the user's units. */
export const profileFormat = (sys: UnitSystem): TemperatureFormat => ({ temp: (c) => tempText(c, sys), delta: (k) => deltaText(k, sys) });

/** Typed text → metric; undefined when empty, NaN when not a number. */
export function parseLength(text: string, sys: UnitSystem): number | undefined {
  const t = text.trim();
  if (t === "") return undefined;
  const n = Number(t);
  if (!Number.isFinite(n)) return Number.NaN;
  return sys === "us" ? convert(n, "inch", "mm") : n;
}

export function parseDelta(text: string, sys: UnitSystem): number | undefined {
  const t = text.trim();
  if (t === "") return undefined;
  const n = Number(t);
  if (!Number.isFinite(n)) return Number.NaN;
  return sys === "us" ? convert(n, "degR", "K") : n;
}

/** metric → input text */
export const lengthDraft = (mm: number | null, sys: UnitSystem) => (mm === null ? "" : formatSignificant(sys === "us" ? convert(mm, "mm", "inch") : mm, 6));
export const deltaDraft = (k: number, sys: UnitSystem) => formatSignificant(sys === "us" ? convert(k, "K", "degR") : k, 6);

export function durationText(s: number): string {
  const m = Math.floor(s / 60);
  const rest = Math.round(s - m * 60);
  return rest ? `${m} min ${rest} s` : `${m} min`;
}
