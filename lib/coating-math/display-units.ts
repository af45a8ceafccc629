/**
 * The display layer, safe for client bundles: conversions use UNIT_TABLE, which
 * scripts/generate-unit-table.ts reads from mathjs's unit definitions (tests check the table
 * against mathjs and NIST SP 811), so the browser gets mathjs's factors without mathjs itself.
 * Server code and tests may use lib/coating-math/units.ts, which calls mathjs directly.
 */
import { DomainError } from "./errors";
import { UNIT_TABLE } from "./unit-table.generated";

/** Converts between two units of UNIT_TABLE, e.g. convert(1, "mil", "um"); offsets handled. */
export function convert(value: number, fromUnit: string, toUnit: string): number {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new DomainError("value", `value must be a finite number (got ${String(value)}).`);
  }
  const from = UNIT_TABLE[fromUnit];
  const to = UNIT_TABLE[toUnit];
  if (!from || !to) throw new DomainError("unit", `No conversion for ${!from ? fromUnit : toUnit}.`);
  if (from.dimension !== to.dimension) throw new DomainError("unit", `Cannot convert ${fromUnit} to ${toUnit}.`);
  if (fromUnit === toUnit) return value;
  return (value * from.scale + from.offset - to.offset) / to.scale;
}

// ---------------------------------------------------------------------------------------------
// Display layer: stored values are metric (the unit is in the field name); each user picks a
// system for display, and forms accept either.

export type UnitSystem = "metric" | "us";

/** Kinds of quantity, named after the metric unit of the stored value. */
export type QuantityKind =
  | "lengthMm"
  | "lengthM"
  | "filmUm"
  | "areaM2"
  | "massKg"
  | "temperatureC"
  | "speedMPerMin"
  | "volumeL"
  | "powerW"
  | "coverageM2PerKg"
  | "timeMin"
  | "massRateKgPerH"
  | "areaRateM2PerH";

interface DisplayUnit {
  /** mathjs unit string */
  math: string;
  /** what the user sees */
  label: string;
}

interface QuantityDefinition {
  metric: DisplayUnit;
  us: DisplayUnit;
  /** A larger metric unit used for display once |value| reaches `from` (W → kW). */
  metricLarge?: { unit: DisplayUnit; from: number };
}

export const QUANTITY_UNITS: Readonly<Record<QuantityKind, QuantityDefinition>> = {
  lengthMm: { metric: { math: "mm", label: "mm" }, us: { math: "inch", label: "in" } },
  lengthM: { metric: { math: "m", label: "m" }, us: { math: "ft", label: "ft" } },
  filmUm: { metric: { math: "um", label: "µm" }, us: { math: "mil", label: "mil" } },
  areaM2: { metric: { math: "m^2", label: "m²" }, us: { math: "ft^2", label: "ft²" } },
  massKg: { metric: { math: "kg", label: "kg" }, us: { math: "lbm", label: "lb" } },
  temperatureC: { metric: { math: "degC", label: "°C" }, us: { math: "degF", label: "°F" } },
  speedMPerMin: { metric: { math: "m/min", label: "m/min" }, us: { math: "ft/min", label: "ft/min" } },
  volumeL: { metric: { math: "L", label: "L" }, us: { math: "gallon", label: "gal" } },
  powerW: {
    metric: { math: "W", label: "W" },
    us: { math: "BTU/h", label: "Btu/h" },
    metricLarge: { unit: { math: "kW", label: "kW" }, from: 1000 },
  },
  coverageM2PerKg: {
    metric: { math: "m^2/kg", label: "m²/kg" },
    us: { math: "ft^2/lbm", label: "ft²/lb" },
  },
  timeMin: { metric: { math: "min", label: "min" }, us: { math: "min", label: "min" } },
  massRateKgPerH: { metric: { math: "kg/h", label: "kg/h" }, us: { math: "lbm/h", label: "lb/h" } },
  areaRateM2PerH: { metric: { math: "m^2/h", label: "m²/h" }, us: { math: "ft^2/h", label: "ft²/h" } },
};

export interface DisplayValue {
  value: number;
  unit: string;
}

/** Metric stored value → the number and unit label to show in `system`. */
export function toDisplay(kind: QuantityKind, metricValue: number, system: UnitSystem): DisplayValue {
  const def = QUANTITY_UNITS[kind];
  if (system === "us") {
    return { value: convert(metricValue, def.metric.math, def.us.math), unit: def.us.label };
  }
  if (def.metricLarge && Math.abs(metricValue) >= def.metricLarge.from) {
    const large = def.metricLarge.unit;
    return { value: convert(metricValue, def.metric.math, large.math), unit: large.label };
  }
  // Metric display of a metric value still goes through convert() so non-finite input fails alike.
  return { value: convert(metricValue, def.metric.math, def.metric.math), unit: def.metric.label };
}

/**
 * A value typed in `system`'s main unit for `kind` (the `metric` or `us` unit of
 * QUANTITY_UNITS: W, not kW, for power) → the metric stored value.
 */
export function fromDisplay(kind: QuantityKind, value: number, system: UnitSystem): number {
  const def = QUANTITY_UNITS[kind];
  const shown = system === "us" ? def.us : def.metric;
  return convert(value, shown.math, def.metric.math);
}

/** The label of `system`'s main unit for `kind` (for form fields). */
export function unitLabel(kind: QuantityKind, system: UnitSystem): string {
  const def = QUANTITY_UNITS[kind];
  return system === "us" ? def.us.label : def.metric.label;
}

/**
 * Rounds to `sig` significant figures without scientific notation and without dropping integer
 * digits (12345 stays 12345, 11.111 → "11.1", 0.012345 → "0.0123"); trailing zeros are trimmed.
 */
export function formatSignificant(value: number, sig = 3): string {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new DomainError("value", `value must be a finite number (got ${String(value)}).`);
  }
  if (!Number.isInteger(sig) || sig < 1 || sig > 15) {
    throw new DomainError("sig", "sig must be a whole number from 1 to 15.");
  }
  if (value === 0) return "0";
  const integerDigits = Math.floor(Math.log10(Math.abs(value))) + 1;
  let text: string;
  if (integerDigits >= sig) {
    text = String(Math.round(value));
  } else {
    text = value.toFixed(Math.min(sig - integerDigits, 20));
    if (text.includes(".")) text = text.replace(/0+$/, "").replace(/\.$/, "");
  }
  return text === "-0" ? "0" : text;
}

/** "11.1 m²/kg": a metric stored value shown in `system` with `sig` significant figures. */
export function formatQuantity(
  kind: QuantityKind,
  metricValue: number,
  system: UnitSystem,
  sig = 3,
): string {
  const shown = toDisplay(kind, metricValue, system);
  return `${formatSignificant(shown.value, sig)} ${shown.unit}`;
}
