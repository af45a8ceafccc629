/**
 * Unit conversion and display. Every factor comes from mathjs's unit definitions (which follow
 * NIST SP 811; checked in tests/unit/coating-math/units.test.ts), never from a hand-typed number.
 *
 * Only the `unit` function and its dependencies are instantiated so this module stays small in a
 * client bundle (~70 kB gzip instead of ~190 kB for all of mathjs).
 */
import { create, unitDependencies } from "mathjs";
import { DomainError } from "./errors";

const math = create({ unitDependencies });

/**
 * Converts `value` from one mathjs unit string to another, e.g. convert(1, "mil", "um").
 * Offsets (°F ↔ °C) are handled by mathjs for absolute temperatures.
 */
export function convert(value: number, fromUnit: string, toUnit: string): number {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new DomainError("value", `value must be a finite number (got ${String(value)}).`);
  }
  return math.unit(value, fromUnit).toNumber(toUnit);
}

// Film build
export const milToUm = (mil: number): number => convert(mil, "mil", "um");
export const umToMil = (um: number): number => convert(um, "um", "mil");
// Area
export const ft2ToM2 = (ft2: number): number => convert(ft2, "ft^2", "m^2");
export const m2ToFt2 = (m2: number): number => convert(m2, "m^2", "ft^2");
// Mass (avoirdupois pound)
export const lbToKg = (lb: number): number => convert(lb, "lbm", "kg");
export const kgToLb = (kg: number): number => convert(kg, "kg", "lbm");
// Absolute temperature
export const fahrenheitToCelsius = (f: number): number => convert(f, "degF", "degC");
export const celsiusToFahrenheit = (c: number): number => convert(c, "degC", "degF");
// Temperature difference: a °F step equals a °R step, which has no offset.
export const fahrenheitDeltaToKelvin = (deltaF: number): number => convert(deltaF, "degR", "K");
export const kelvinDeltaToFahrenheit = (deltaK: number): number => convert(deltaK, "K", "degR");
// Conveyor speed
export const ftPerMinToMPerMin = (v: number): number => convert(v, "ft/min", "m/min");
export const mPerMinToFtPerMin = (v: number): number => convert(v, "m/min", "ft/min");
// Liquid volume (US gallon = 231 in³)
export const usGalToL = (gal: number): number => convert(gal, "gallon", "L");
export const lToUsGal = (l: number): number => convert(l, "L", "gallon");
// Heat flow (International Table Btu)
export const btuPerHToW = (v: number): number => convert(v, "BTU/h", "W");
export const wToBtuPerH = (w: number): number => convert(w, "W", "BTU/h");
// Lengths
export const inToMm = (inches: number): number => convert(inches, "inch", "mm");
export const mmToIn = (mm: number): number => convert(mm, "mm", "inch");
export const ftToM = (ft: number): number => convert(ft, "ft", "m");
export const mToFt = (m: number): number => convert(m, "m", "ft");
// Mass per area (plate weight tables)
export const lbPerFt2ToKgPerM2 = (v: number): number => convert(v, "lbm/ft^2", "kg/m^2");
export const kgPerM2ToLbPerFt2 = (v: number): number => convert(v, "kg/m^2", "lbm/ft^2");
// Powder coverage
export const ft2PerLbToM2PerKg = (v: number): number => convert(v, "ft^2/lbm", "m^2/kg");
export const m2PerKgToFt2PerLb = (v: number): number => convert(v, "m^2/kg", "ft^2/lbm");
// Specific heat
export const btuPerLbFToJPerKgK = (v: number): number => convert(v, "BTU/(lbm degR)", "J/(kg K)");

// ---------------------------------------------------------------------------------------------
// Display layer: lives in display-units.ts (no mathjs, for client bundles); re-exported here so
// server code can keep one import.
export {
  QUANTITY_UNITS,
  formatQuantity,
  formatSignificant,
  fromDisplay,
  toDisplay,
  unitLabel,
  type DisplayValue,
  type QuantityKind,
  type UnitSystem,
} from "./display-units";
