/**
 * What the calculator screen shows and accepts for each kind of number, in either unit system.
 * Quantities display-units.ts knows go through its fromDisplay/toDisplay; the few extra compound
 * units below go through its convert(), whose factors are mathjs's (unit-table.generated.ts).
 */
import {
  convert,
  formatSignificant,
  fromDisplay,
  toDisplay,
  unitLabel,
  type QuantityKind,
  type UnitSystem,
} from "@/lib/coating-math/display-units";

interface ExtraUnit {
  /** mathjs unit of the API value */
  api: string;
  metric: { math: string; label: string };
  us: { math: string; label: string };
}

const same = (math: string, label: string) => ({ api: math, metric: { math, label }, us: { math, label } });

const EXTRA = {
  // carrier pitch is an API value in m, but shops talk about it in mm or inches
  pitchM: { api: "m", metric: { math: "mm", label: "mm" }, us: { math: "inch", label: "in" } },
  // paint density: g/cm³ in metric, lb/gal in US paint data sheets
  densityGPerCm3: { api: "g/cm^3", metric: { math: "g/cm^3", label: "g/cm³" }, us: { math: "lbm/gallon", label: "lb/gal" } },
  densityKgPerM3: { api: "kg/m^3", metric: { math: "kg/m^3", label: "kg/m³" }, us: { math: "lbm/ft^3", label: "lb/ft³" } },
  // a °F step is a °R step: no offset inside compound units
  specificHeatJPerKgK: {
    api: "J/(kg K)",
    metric: { math: "J/(kg K)", label: "J/(kg·K)" },
    us: { math: "BTU/(lbm degR)", label: "Btu/(lb·°F)" },
  },
  conductivityWPerMK: {
    api: "W/(m K)",
    metric: { math: "W/(m K)", label: "W/(m·K)" },
    us: { math: "BTU/(h ft degR)", label: "Btu/(h·ft·°F)" },
  },
  heatTransferWPerM2K: {
    api: "W/(m^2 K)",
    metric: { math: "W/(m^2 K)", label: "W/(m²·K)" },
    us: { math: "BTU/(h ft^2 degR)", label: "Btu/(h·ft²·°F)" },
  },
  chargePerAreaCPerM2: { api: "C/m^2", metric: { math: "C/m^2", label: "C/m²" }, us: { math: "C/ft^2", label: "C/ft²" } },
  // money per mass: a price per kg is a price per lb × lb per kg
  pricePerKg: { api: "kg^-1", metric: { math: "kg^-1", label: "per kg" }, us: { math: "lbm^-1", label: "per lb" } },
  chargeC: same("C", "C"),
  currentA: same("A", "A"),
  yieldMgPerC: same("mg/C", "mg/C"),
} satisfies Record<string, ExtraUnit>;

/** "count" and "ratio" have no unit; "percent" shows a fraction × 100. */
export type DisplayKind = QuantityKind | keyof typeof EXTRA | "count" | "ratio" | "percent";

const HUNDRED = 100;

function extra(kind: DisplayKind): ExtraUnit | null {
  return kind in EXTRA ? EXTRA[kind as keyof typeof EXTRA] : null;
}

function isPlain(kind: DisplayKind): boolean {
  return kind === "count" || kind === "ratio" || kind === "percent";
}

/** The unit label shown next to a number of this kind ("" for plain numbers). */
export function unitText(kind: DisplayKind, system: UnitSystem): string {
  if (kind === "percent") return "%";
  if (isPlain(kind)) return "";
  const e = extra(kind);
  return e ? e[system].label : unitLabel(kind as QuantityKind, system);
}

/** API value (metric, unit in the name) → the number shown in `system`. */
export function apiToShown(kind: DisplayKind, value: number, system: UnitSystem): number {
  if (kind === "percent") return value * HUNDRED;
  if (isPlain(kind)) return value;
  const e = extra(kind);
  return e ? convert(value, e.api, e[system].math) : toDisplay(kind as QuantityKind, value, system).value;
}

/** A number typed in `system`'s unit → the API value. */
export function shownToApi(kind: DisplayKind, value: number, system: UnitSystem): number {
  if (kind === "percent") return value / HUNDRED;
  if (isPlain(kind)) return value;
  const e = extra(kind);
  return e ? convert(value, e[system].math, e.api) : fromDisplay(kind as QuantityKind, value, system);
}

/** Text for an input box: enough digits that a round trip through the other system is exact to the eye. */
export function inputText(kind: DisplayKind, apiValue: number, system: UnitSystem): string {
  return formatSignificant(apiToShown(kind, apiValue, system), 6);
}

/** "11.11 m²/kg" for a result. */
export function formatShown(kind: DisplayKind, apiValue: number, system: UnitSystem, sig = 4): string {
  const unit = unitText(kind, system);
  const text = formatSignificant(apiToShown(kind, apiValue, system), sig);
  if (!unit) return text;
  return kind === "percent" ? `${text} %` : `${text} ${unit}`;
}

/** A decimal number as people type it (no hex, no blank-is-zero): "12", "-3.5", ".5", "1e3". */
export function parseDecimal(text: string): number | null {
  const t = text.trim();
  if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(t)) return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : null;
}
