/**
 * Numbers on the coatings and lines screens, shown and typed in the user's unit system. Stored
 * values are metric; conversions use mathjs's factors (lib/coating-math/display-units.ts).
 */
import { convert, formatSignificant, type UnitSystem } from "@/lib/coating-math/display-units";

interface UnitPair {
  /** mathjs unit of the stored (API) value */
  api: string;
  metric: { math: string; label: string };
  us: { math: string; label: string };
}

const same = (math: string, label: string): UnitPair => ({ api: math, metric: { math, label }, us: { math, label } });

export const UNITS = {
  lengthMm: { api: "mm", metric: { math: "mm", label: "mm" }, us: { math: "inch", label: "in" } },
  lengthM: { api: "m", metric: { math: "m", label: "m" }, us: { math: "ft", label: "ft" } },
  filmUm: { api: "um", metric: { math: "um", label: "µm" }, us: { math: "mil", label: "mil" } },
  massKg: { api: "kg", metric: { math: "kg", label: "kg" }, us: { math: "lbm", label: "lb" } },
  temperatureC: { api: "degC", metric: { math: "degC", label: "°C" }, us: { math: "degF", label: "°F" } },
  speedMPerMin: { api: "m/min", metric: { math: "m/min", label: "m/min" }, us: { math: "ft/min", label: "ft/min" } },
  heatTransferWPerM2K: {
    api: "W/(m^2 K)",
    metric: { math: "W/(m^2 K)", label: "W/(m²·K)" },
    us: { math: "BTU/(h ft^2 degR)", label: "Btu/(h·ft²·°F)" },
  },
  // money per mass: a price per kg is a price per lb × lb per kg
  pricePerKg: { api: "kg^-1", metric: { math: "kg^-1", label: "kg" }, us: { math: "lbm^-1", label: "lb" } },
  timeMin: same("min", "min"),
  densityGPerCm3: same("g/cm^3", "g/cm³"),
} satisfies Record<string, UnitPair>;

export type UnitKind = keyof typeof UNITS;

export function unitOf(kind: UnitKind, system: UnitSystem): string {
  return UNITS[kind][system].label;
}

export function toShown(kind: UnitKind, value: number, system: UnitSystem): number {
  const u = UNITS[kind];
  return convert(value, u.api, u[system].math);
}

export function fromShown(kind: UnitKind, value: number, system: UnitSystem): number {
  const u = UNITS[kind];
  return convert(value, u[system].math, u.api);
}

/** "3.61 min", "9.84 ft/min": a stored value shown in `system`. */
export function show(kind: UnitKind, value: number, system: UnitSystem, sig = 3): string {
  return `${formatSignificant(toShown(kind, value, system), sig)} ${unitOf(kind, system)}`;
}

/** A stored value as the text of an input in `system` (empty for null). */
export function draft(kind: UnitKind, value: number | null | undefined, system: UnitSystem): string {
  if (value === null || value === undefined) return "";
  return formatSignificant(toShown(kind, value, system), 6);
}

/**
 * The stored value of an input's text: undefined when empty, NaN when not a number. Text left as
 * drafted from `original` gives `original` back exactly, so a form saved in inches does not drift
 * its millimetres (1.5 m/min shown as 4.92126 ft/min would come back as 1.49999 m/min).
 */
export function parse(kind: UnitKind, text: string, system: UnitSystem, original?: number | null): number | undefined {
  const t = text.trim();
  if (t === "") return undefined;
  if (original !== null && original !== undefined && t === draft(kind, original, system)) return original;
  const n = Number(t);
  if (!Number.isFinite(n)) return Number.NaN;
  return fromShown(kind, n, system);
}

/** A plain number (no unit): undefined when empty, NaN when not a number. */
export function parsePlain(text: string): number | undefined {
  const t = text.trim();
  if (t === "") return undefined;
  const n = Number(t);
  return Number.isFinite(n) ? n : Number.NaN;
}

export function money(value: number, currency: string): string {
  return new Intl.NumberFormat("en-US", { style: "currency", currency, maximumFractionDigits: 2 }).format(value);
}

/** "1,200 × 1,800 × 600 mm": a window or oven interior, width × height × depth. */
export function dims(w: { widthMm: number; heightMm: number; depthMm: number }, sys: UnitSystem): string {
  const f = (v: number) => show("lengthMm", v, sys, 4).split(" ")[0];
  return `${f(w.widthMm)} × ${f(w.heightMm)} × ${f(w.depthMm)} ${unitOf("lengthMm", sys)}`;
}
