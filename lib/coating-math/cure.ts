/**
 * Cure: lumped-capacitance metal heat-up in a convection oven, cure schedules (metal
 * temperature × hold time) and the product heat load of an oven.
 */
import { DomainError, requireFiniteResult, requireInRange, requirePositive } from "./errors";
import { isAtLeast } from "./compare";
import { convert } from "./display-units";

const M_PER_MM = convert(1, "mm", "m");
const S_PER_MIN = convert(1, "min", "s");
const S_PER_H = convert(1, "h", "s");
const ABSOLUTE_ZERO_C = convert(0, "K", "degC");
/** Above this Biot number the part's core lags its surface and the lumped model misleads (Çengel, ch. 4). */
export const LUMPED_BIOT_LIMIT = 0.1;

export interface CureHeatUpInput {
  /** equivalent thickness 2·V/A: a plate's thickness, half a round bar's diameter */
  thicknessMm: number;
  airTempC: number;
  startTempC: number;
  targetMetalTempC: number;
  /** time the metal must hold at the target temperature */
  holdMin: number;
  heatTransferCoefficientWPerM2K: number;
  densityKgPerM3?: number;
  specificHeatJPerKgK?: number;
  thermalConductivityWPerMK?: number;
  /** oven dwell available, to report the margin */
  ovenDwellMin?: number;
}

export interface CureHeatUp {
  timeConstantMin: number;
  heatUpMin: number;
  totalMin: number;
  biotNumber: number;
  /** ovenDwellMin − totalMin, when ovenDwellMin is given */
  dwellMarginMin?: number;
  warnings: string[];
}

/**
 * Lumped heat-up (Çengel, Heat Transfer, ch. 4): τ = ρ c L_c / h with L_c = V/A =
 * thickness/2; t = τ · ln((T_air − T₀)/(T_air − T)); valid while Bi = h L_c / k < 0.1.
 */
export function cureHeatUp(input: CureHeatUpInput): CureHeatUp {
  const {
    thicknessMm,
    airTempC,
    startTempC,
    targetMetalTempC,
    holdMin,
    heatTransferCoefficientWPerM2K: h,
    ovenDwellMin,
  } = input;
  const densityKgPerM3 = input.densityKgPerM3 ?? 7850;
  const specificHeatJPerKgK = input.specificHeatJPerKgK ?? 490;
  const thermalConductivityWPerMK = input.thermalConductivityWPerMK ?? 50;
  requirePositive("thicknessMm", thicknessMm);
  requireInRange("airTempC", airTempC, { gt: ABSOLUTE_ZERO_C });
  requireInRange("startTempC", startTempC, { gt: ABSOLUTE_ZERO_C });
  requireInRange("targetMetalTempC", targetMetalTempC, { gt: ABSOLUTE_ZERO_C });
  requireInRange("holdMin", holdMin, { gte: 0 });
  requirePositive("heatTransferCoefficientWPerM2K", h);
  requirePositive("densityKgPerM3", densityKgPerM3);
  requirePositive("specificHeatJPerKgK", specificHeatJPerKgK);
  requirePositive("thermalConductivityWPerMK", thermalConductivityWPerMK);
  if (ovenDwellMin !== undefined) requireInRange("ovenDwellMin", ovenDwellMin, { gte: 0 });
  if (targetMetalTempC >= airTempC) {
    // The metal approaches the air temperature only asymptotically: it never reaches it.
    throw new DomainError(
      "targetMetalTempC",
      `targetMetalTempC (${targetMetalTempC} °C) must be below the oven air temperature (${airTempC} °C).`,
    );
  }

  const characteristicLengthM = (thicknessMm / 2) * M_PER_MM;
  const timeConstantS = (densityKgPerM3 * specificHeatJPerKgK * characteristicLengthM) / h;
  const timeConstantMin = requireFiniteResult("heatTransferCoefficientWPerM2K", timeConstantS / S_PER_MIN, "time constant");
  const heatUpMin =
    startTempC >= targetMetalTempC
      ? 0
      : timeConstantMin * Math.log((airTempC - startTempC) / (airTempC - targetMetalTempC));
  requireFiniteResult("targetMetalTempC", heatUpMin, "heat-up time");
  const totalMin = heatUpMin + holdMin;
  const biotNumber = (h * characteristicLengthM) / thermalConductivityWPerMK;

  const warnings: string[] = [];
  if (isAtLeast(biotNumber, LUMPED_BIOT_LIMIT)) {
    warnings.push(
      `Biot number ${Number(biotNumber.toPrecision(2))} is at or above ${LUMPED_BIOT_LIMIT}: the part's core ` +
        `lags its surface, so this heat-up time is optimistic; measure it with a temperature recorder.`,
    );
  }
  const result: CureHeatUp = { timeConstantMin, heatUpMin, totalMin, biotNumber, warnings };
  if (ovenDwellMin !== undefined) result.dwellMarginMin = ovenDwellMin - totalMin;
  return result;
}

export interface OvenProductHeatLoadInput {
  /** parts, racks and chain passing through per hour */
  massKgPerHour: number;
  specificHeatJPerKgK: number;
  /** temperature rise of that mass */
  deltaTK: number;
}

export interface OvenProductHeatLoad {
  powerW: number;
  powerKw: number;
  btuPerHour: number;
}

/** Q = ṁ · c · ΔT (oven design Q&As; wall losses and exhaust come on top). */
export function ovenProductHeatLoad(input: OvenProductHeatLoadInput): OvenProductHeatLoad {
  const { massKgPerHour, specificHeatJPerKgK, deltaTK } = input;
  requireInRange("massKgPerHour", massKgPerHour, { gte: 0 });
  requirePositive("specificHeatJPerKgK", specificHeatJPerKgK);
  requireInRange("deltaTK", deltaTK, { gte: 0 });
  const powerW = (massKgPerHour * specificHeatJPerKgK * deltaTK) / S_PER_H;
  return { powerW, powerKw: convert(powerW, "W", "kW"), btuPerHour: convert(powerW, "W", "BTU/h") };
}

// Cure schedules live in their own module so screens that only read a schedule do not load the
// heat-up model; they are re-exported here for the code and tests that import them from cure.ts.
export { bestCurePoint, interpolateCureSchedule, type BestCurePoint, type CurePoint } from "./cure-schedule";
