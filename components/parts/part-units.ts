/**
 * Part numbers shown and typed in the user's unit system. Stored values are metric with the unit
 * in the name; every conversion goes through lib/coating-math/display-units.ts (mathjs's factors), never a typed one.
 */
import { convert, formatQuantity, formatSignificant, fromDisplay, toDisplay, unitLabel, type QuantityKind, type UnitSystem } from "@/lib/coating-math/display-units";

export type { UnitSystem };

/** Typed text → a number, or null when it is not one ("1,5" is read as 1.5). */
export function parseNumber(text: string): number | null {
  const t = text.trim().replace(",", ".");
  if (t === "" || !/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(t)) return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : null;
}

/** A metric value as the text an input starts with, in `system` (6 significant figures). */
export function inputText(kind: QuantityKind, metric: number | null | undefined, system: UnitSystem): string {
  if (metric === null || metric === undefined || !Number.isFinite(metric)) return "";
  return formatSignificant(toDisplay(kind, metric, system).value, 6);
}

/** Typed text in `system` → the metric value, or null when it is not a number. */
export function metricFrom(kind: QuantityKind, text: string, system: UnitSystem): number | null {
  const n = parseNumber(text);
  return n === null ? null : fromDisplay(kind, n, system);
}

/** The same quantity re-typed for the other unit system (the header's unit switch). */
export function convertText(kind: QuantityKind, text: string, from: UnitSystem, to: UnitSystem): string {
  if (from === to) return text;
  const m = metricFrom(kind, text, from);
  return m === null ? text : inputText(kind, m, to);
}

export function label(text: string, kind: QuantityKind, system: UnitSystem): string {
  return `${text} (${unitLabel(kind, system)})`;
}

export const showLength = (mm: number, system: UnitSystem, sig = 4) => formatQuantity("lengthMm", mm, system, sig);
export const showArea = (m2: number, system: UnitSystem, sig = 4) => formatQuantity("areaM2", m2, system, sig);
export const showMass = (kg: number, system: UnitSystem, sig = 4) => formatQuantity("massKg", kg, system, sig);

/** Metal volume of a part: litres or in³ read better than m³ at this size. */
export function showVolume(m3: number, system: UnitSystem): string {
  return system === "us" ? `${formatSignificant(convert(m3, "m^3", "inch^3"), 4)} in³` : `${formatSignificant(convert(m3, "m^3", "L"), 4)} L`;
}

const DENSITY_UNITS = { metric: { math: "kg/m^3", label: "kg/m³" }, us: { math: "lbm/ft^3", label: "lb/ft³" } } as const;

export const densityUnit = (system: UnitSystem) => DENSITY_UNITS[system].label;

export function showDensity(kgPerM3: number, system: UnitSystem): string {
  return `${formatSignificant(convert(kgPerM3, "kg/m^3", DENSITY_UNITS[system].math), 4)} ${DENSITY_UNITS[system].label}`;
}

export function densityText(kgPerM3: number | null | undefined, system: UnitSystem): string {
  if (kgPerM3 === null || kgPerM3 === undefined) return "";
  return formatSignificant(convert(kgPerM3, "kg/m^3", DENSITY_UNITS[system].math), 6);
}

export function densityFrom(text: string, system: UnitSystem): number | null {
  const n = parseNumber(text);
  return n === null ? null : convert(n, DENSITY_UNITS[system].math, "kg/m^3");
}

/** "648.3 × 48.3 × 974.2 mm" */
export function showBox(lengthMm: number, widthMm: number, heightMm: number, system: UnitSystem): string {
  const f = (mm: number) => formatSignificant(toDisplay("lengthMm", mm, system).value, 4);
  return `${f(lengthMm)} × ${f(widthMm)} × ${f(heightMm)} ${unitLabel("lengthMm", system)}`;
}

export function showBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${formatSignificant(bytes / 1024, 3)} kB`;
  return `${formatSignificant(bytes / (1024 * 1024), 3)} MB`;
}
