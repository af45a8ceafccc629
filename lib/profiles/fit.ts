/**
 * Calibrating the lumped heat-up model to a measured oven: the heat-transfer coefficient h that
 * best explains a part probe's curve given the air probe's.
 *
 * Lumped capacitance (Çengel, Heat Transfer, ch. 4): ρ c L_c dT/dt = h (T_air − T), L_c = V/A =
 * thickness/2 for a plate heated on both faces. With y = ρ c L_c dT/dt (central differences) and
 * x = T_air − T, least squares through the origin gives h = Σ(y·x) / Σ(x²). Only readings where
 * the air leads the metal by more than `minDeltaK` are used: near equilibrium (and before the
 * oven, and while cooling) x is small and the probe's noise would dominate.
 */
import { LUMPED_BIOT_LIMIT } from "../coating-math/cure";
import { DomainError, requireInRange, requirePositive } from "../coating-math/errors";
import { convert, formatSignificant } from "../coating-math/display-units";

const M_PER_MM = convert(1, "mm", "m");
const S_PER_MIN = convert(1, "min", "s");

/** Steel, as the cure check assumes: a fitted h only reproduces the measured heat-up with the same ρ and c. */
export const STEEL = { densityKgPerM3: 7850, specificHeatJPerKgK: 490, thermalConductivityWPerMK: 50 } as const;
/** Readings with the air less than this above the metal are left out of the fit (common practice, no source). */
export const DEFAULT_MIN_DELTA_K = 10;
const MIN_FIT_SAMPLES = 5;

export interface HeatTransferFitInput {
  timeS: readonly number[];
  airC: readonly number[];
  metalC: readonly number[];
  thicknessMm: number;
  densityKgPerM3?: number;
  specificHeatJPerKgK?: number;
  thermalConductivityWPerMK?: number;
  minDeltaK?: number;
}

export interface HeatTransferFit {
  heatTransferCoefficientWPerM2K: number;
  /** readings used (air ahead of the metal by more than minDeltaK, with a reading either side) */
  samplesUsed: number;
  /** root mean square of (model − measured) over the readings used */
  rmsK: number;
  /** the lumped model run forward with the fitted h and the measured air curve, one value per reading */
  modelC: number[];
  timeConstantMin: number;
  biotNumber: number;
  warnings: string[];
}

export interface LumpedSimulationInput {
  timeS: readonly number[];
  airC: readonly number[];
  startC: number;
  timeConstantS: number;
}

function checkSeries(timeS: readonly number[], named: Record<string, readonly number[]>): void {
  if (!Array.isArray(timeS) || timeS.length < 2) throw new DomainError("timeS", "A profile needs at least two readings.");
  for (const [field, values] of Object.entries(named)) {
    if (!Array.isArray(values) || values.length !== timeS.length) {
      throw new DomainError(field, `${field} must have one value per reading (${timeS.length}).`);
    }
    values.forEach((v, i) => requireInRange(`${field}.${i}`, v, {}));
  }
  timeS.forEach((t, i) => {
    requireInRange(`timeS.${i}`, t, {});
    if (i > 0 && !(t > timeS[i - 1])) throw new DomainError(`timeS.${i}`, `Reading ${i + 1} is not later than the one before it.`);
  });
}

/**
 * The lumped model run forward over a measured air curve, exact for air that is straight between
 * readings: with T_air = A + B·(t − t₀) on a step, T(t) = T_air(t) − B·τ + (T₀ − A + B·τ)·e^(−(t−t₀)/τ)
 * (the first-order response to a ramp, any heat-transfer or control text).
 */
export function simulateLumped(input: LumpedSimulationInput): number[] {
  const { timeS, airC, startC, timeConstantS: tau } = input;
  checkSeries(timeS, { airC });
  requireInRange("startC", startC, {});
  requirePositive("timeConstantS", tau);
  const out = [startC];
  for (let i = 1; i < timeS.length; i += 1) {
    const dt = timeS[i] - timeS[i - 1];
    const slope = (airC[i] - airC[i - 1]) / dt;
    const decay = Math.exp(-dt / tau);
    out.push(airC[i] - slope * tau + (out[i - 1] - airC[i - 1] + slope * tau) * decay);
  }
  return out;
}

/** Fits h for one part probe; throws a DomainError when the curve cannot support a fit. */
export function fitHeatTransfer(input: HeatTransferFitInput): HeatTransferFit {
  const { timeS, airC, metalC } = input;
  const densityKgPerM3 = input.densityKgPerM3 ?? STEEL.densityKgPerM3;
  const specificHeatJPerKgK = input.specificHeatJPerKgK ?? STEEL.specificHeatJPerKgK;
  const thermalConductivityWPerMK = input.thermalConductivityWPerMK ?? STEEL.thermalConductivityWPerMK;
  const minDeltaK = input.minDeltaK ?? DEFAULT_MIN_DELTA_K;
  checkSeries(timeS, { airC, metalC });
  requirePositive("thicknessMm", input.thicknessMm);
  requirePositive("densityKgPerM3", densityKgPerM3);
  requirePositive("specificHeatJPerKgK", specificHeatJPerKgK);
  requirePositive("thermalConductivityWPerMK", thermalConductivityWPerMK);
  requireInRange("minDeltaK", minDeltaK, { gte: 0 });

  // Çengel ch. 4: L_c = V/A = thickness/2 for a plate heated on both faces
  const lcM = (input.thicknessMm / 2) * M_PER_MM;
  const capacityJPerM2K = densityKgPerM3 * specificHeatJPerKgK * lcM;
  let sxy = 0;
  let sxx = 0;
  const used: number[] = [];
  for (let i = 1; i < timeS.length - 1; i += 1) {
    const x = airC[i] - metalC[i];
    if (!(x > minDeltaK)) continue;
    // central difference: dT/dt ≈ (T[i+1] − T[i−1]) / (t[i+1] − t[i−1])
    const dTdt = (metalC[i + 1] - metalC[i - 1]) / (timeS[i + 1] - timeS[i - 1]);
    const y = capacityJPerM2K * dTdt;
    sxy += y * x;
    sxx += x * x;
    used.push(i);
  }
  if (used.length < MIN_FIT_SAMPLES) {
    throw new DomainError(
      "metalC",
      `Only ${used.length} reading${used.length === 1 ? "" : "s"} with the air more than ${minDeltaK} K above the part; at least ${MIN_FIT_SAMPLES} are needed to fit h (was the probe in the oven?).`,
    );
  }
  const h = sxy / sxx;
  if (!(h > 0) || !Number.isFinite(h)) {
    throw new DomainError("metalC", "The part did not warm while the air was hotter than it: no positive heat-transfer coefficient fits this curve (probe on the wrong part, or columns swapped?).");
  }
  const timeConstantS = capacityJPerM2K / h;
  const modelC = simulateLumped({ timeS, airC, startC: metalC[0], timeConstantS });
  const rmsK = Math.sqrt(used.reduce((a, i) => a + (modelC[i] - metalC[i]) ** 2, 0) / used.length);
  // Çengel ch. 4: Bi = h L_c / k; the lumped model holds while Bi < 0.1
  const biotNumber = (h * lcM) / thermalConductivityWPerMK;
  const warnings: string[] = [];
  if (biotNumber >= LUMPED_BIOT_LIMIT) {
    warnings.push(`Biot number ${formatSignificant(biotNumber, 2)} is at or above ${LUMPED_BIOT_LIMIT}: the section's core lags its surface, so one h does not describe it well.`);
  }
  return {
    heatTransferCoefficientWPerM2K: h,
    samplesUsed: used.length,
    rmsK,
    modelC,
    timeConstantMin: timeConstantS / S_PER_MIN,
    biotNumber,
    warnings,
  };
}
