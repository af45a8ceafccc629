/**
 * The actual-use feedback loop, pure: a run's measured utilisation (film deposited ÷ powder used)
 * and the running estimate per line × coating over the runs not excluded.
 */
import { requireInRange } from "../coating-math/errors";
import { depositedKg } from "./forecast";

/** Measured figures replace the nominal one from this many runs on (common practice, no source). */
export const MIN_RUNS_FOR_MEASURED = 3;

export interface MeasuredUtilisationInput {
  /** coated area of all parts actually coated */
  areaM2: number;
  filmUm: number;
  specificGravity: number;
  usedKg: number;
}

/**
 * Utilisation = deposited kg ÷ used kg; deposited kg = area × film × SG / 1000 (Products
 * Finishing coverage, metric form; transfer efficiency by weight, "What Impacts Transfer Efficiency?").
 */
export function measuredUtilisation(input: MeasuredUtilisationInput): number {
  requireInRange("areaM2", input.areaM2, { gt: 0 });
  requireInRange("filmUm", input.filmUm, { gt: 0 });
  requireInRange("specificGravity", input.specificGravity, { gt: 0 });
  requireInRange("usedKg", input.usedKg, { gt: 0 });
  return depositedKg(input) / input.usedKg;
}

export interface UsageSample {
  utilisation: number;
  excluded: boolean;
}

export interface RunningEstimate {
  /** mean of the included runs, or null below MIN_RUNS_FOR_MEASURED */
  measured: number | null;
  mean: number | null;
  runs: number;
  /** sample standard deviation (n − 1), null below two runs */
  spread: number | null;
}

export function runningEstimate(samples: readonly UsageSample[]): RunningEstimate {
  const xs = samples.filter((s) => !s.excluded).map((s) => s.utilisation);
  const n = xs.length;
  if (n === 0) return { measured: null, mean: null, runs: 0, spread: null };
  const mean = xs.reduce((a, x) => a + x, 0) / n;
  const spread = n < 2 ? null : Math.sqrt(xs.reduce((a, x) => a + (x - mean) ** 2, 0) / (n - 1));
  return { measured: n >= MIN_RUNS_FOR_MEASURED ? mean : null, mean, runs: n, spread };
}
