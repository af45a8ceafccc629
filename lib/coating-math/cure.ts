/**
 * Cure: lumped-capacitance metal heat-up in a convection oven, cure schedules (metal
 * temperature × hold time) and the product heat load of an oven.
 */
import { DomainError, requireFiniteResult, requireInRange, requirePositive } from "./errors";
import { isAtLeast, isBelow } from "./compare";
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

export interface CurePoint {
  metalTempC: number;
  holdMin: number;
}

function checkedSchedule(points: readonly CurePoint[]): CurePoint[] {
  if (!Array.isArray(points) || points.length === 0) {
    throw new DomainError("points", "A cure schedule needs at least one point.");
  }
  points.forEach((p, i) => {
    requireInRange(`points.${i}.metalTempC`, p.metalTempC, { gt: ABSOLUTE_ZERO_C });
    requireInRange(`points.${i}.holdMin`, p.holdMin, { gte: 0 });
  });
  const sorted = [...points].sort((a, b) => a.metalTempC - b.metalTempC);
  for (let i = 1; i < sorted.length; i += 1) {
    if (sorted[i].metalTempC === sorted[i - 1].metalTempC) {
      throw new DomainError(
        "points",
        `The cure schedule lists ${sorted[i].metalTempC} °C twice; each metal temperature may appear once.`,
      );
    }
  }
  return sorted;
}

/**
 * Hold time at `tempC`, linear between the schedule's points (a coating maker's cure window is
 * a handful of points; straight lines between them are the usual reading, no source).
 */
export function interpolateCureSchedule(points: readonly CurePoint[], tempC: number): number {
  const sorted = checkedSchedule(points);
  requireInRange("tempC", tempC, { gt: ABSOLUTE_ZERO_C });
  const low = sorted[0];
  const high = sorted[sorted.length - 1];
  if (isBelow(tempC, low.metalTempC) || !isAtLeast(high.metalTempC, tempC)) {
    throw new DomainError(
      "tempC",
      `${tempC} °C is outside the schedule (${low.metalTempC}–${high.metalTempC} °C).`,
    );
  }
  if (sorted.length === 1 || !isBelow(tempC, high.metalTempC)) return high.holdMin;
  for (let i = 1; i < sorted.length; i += 1) {
    const a = sorted[i - 1];
    const b = sorted[i];
    if (tempC <= b.metalTempC) {
      const t = Math.max(0, (tempC - a.metalTempC) / (b.metalTempC - a.metalTempC));
      return a.holdMin + t * (b.holdMin - a.holdMin);
    }
  }
  return high.holdMin;
}

export interface BestCurePoint extends CurePoint {
  heatUpMin: number;
  totalMin: number;
}

/**
 * Among the schedule points below the air temperature, the one with the shortest heat-up +
 * hold; ties go to the lower temperature. `heatUpMin(metalTempC)` gives the heat-up to that
 * temperature (e.g. from cureHeatUp). Null when no point is below the air temperature.
 */
export function bestCurePoint(
  points: readonly CurePoint[],
  airTempC: number,
  heatUpMin: (metalTempC: number) => number,
): BestCurePoint | null {
  const sorted = checkedSchedule(points);
  requireInRange("airTempC", airTempC, { gt: ABSOLUTE_ZERO_C });
  let best: BestCurePoint | null = null;
  for (const p of sorted) {
    if (p.metalTempC >= airTempC) continue;
    const up = heatUpMin(p.metalTempC);
    if (!Number.isFinite(up) || up < 0) {
      throw new DomainError("heatUpMin", `Heat-up to ${p.metalTempC} °C must be a finite time ≥ 0 (got ${up}).`);
    }
    const candidate = { ...p, heatUpMin: up, totalMin: up + p.holdMin };
    if (best === null || candidate.totalMin < best.totalMin) best = candidate;
  }
  return best;
}
