/**
 * Cure verdict of one probe's metal-temperature curve against a coating's cure schedule.
 *
 * The curve is read as straight lines between readings. The cure index is
 *   I = ∫ dt / t_required(T(t))  over the time the metal is at or above the schedule's lowest point,
 * with t_required interpolated linearly between the schedule's points (as interpolateCureSchedule
 * does) and, above the highest point, held at the highest point's time (common practice, no single
 * source; the screen says so). I ≥ 1 (100 %) is cured. Because T is linear in t on each piece
 * and t_required is linear in T between schedule points, each piece integrates exactly:
 *   ∫ dt / r = Δt · ln(r_b / r_a) / (r_b − r_a)   (r linear in t; Δt / r when r is constant).
 */
import type { CurePoint } from "../coating-math/cure";
import { DomainError, requireInRange } from "../coating-math/errors";
import { isAbove, isAtLeast } from "../coating-math/compare";
import { convert } from "../coating-math/display-units";

const S_PER_MIN = convert(1, "min", "s");

export interface ProbeVerdictInput {
  timeS: readonly number[];
  metalC: readonly number[];
  schedule: readonly CurePoint[];
  /** metal temperature above which the coating is over-baked; null = not checked */
  overbakeLimitC?: number | null;
}

export interface PointTime extends CurePoint {
  /** time the metal spent at or above this point's temperature */
  aboveMin: number;
  /** aboveMin ≥ holdMin: this point alone is met */
  met: boolean;
}

export interface ProbeVerdict {
  lowestC: number;
  highestC: number;
  /** first time the metal reached the schedule's lowest temperature; null when it never did */
  reachedLowestAtMin: number | null;
  peakC: number;
  peakAtMin: number;
  points: PointTime[];
  /** Σ dt / t_required(T); 1 = 100 % */
  cureIndex: number;
  /** time above the schedule's highest point, counted at that point's hold time */
  aboveHighestMin: number;
  overbakeLimitC: number | null;
  aboveOverbakeMin: number;
  underCured: boolean;
  overbaked: boolean;
  pass: boolean;
}

/** Sorted schedule with holds above zero (a zero hold would make the index infinite). */
function checkedSchedule(schedule: readonly CurePoint[]): CurePoint[] {
  if (!Array.isArray(schedule) || schedule.length === 0) throw new DomainError("schedule", "The coating has no cure schedule points.");
  const sorted = [...schedule].sort((a, b) => a.metalTempC - b.metalTempC);
  sorted.forEach((p, i) => {
    requireInRange(`schedule.${i}.metalTempC`, p.metalTempC, { gt: -273.15 });
    if (!(p.holdMin > 0) || !Number.isFinite(p.holdMin)) {
      throw new DomainError(`schedule.${i}.holdMin`, `The schedule point at ${p.metalTempC} °C has a hold of ${p.holdMin} min; the cure index needs a hold above 0 at every point.`);
    }
    if (i > 0 && sorted[i - 1].metalTempC === p.metalTempC) {
      throw new DomainError("schedule", `The cure schedule lists ${p.metalTempC} °C twice.`);
    }
  });
  return sorted;
}

/** Required hold (seconds) at T ≥ the lowest point: linear between points, the highest point's above it. */
function requiredS(sorted: CurePoint[], tempC: number): number {
  const high = sorted[sorted.length - 1];
  if (tempC >= high.metalTempC) return high.holdMin * S_PER_MIN;
  for (let i = 1; i < sorted.length; i += 1) {
    const a = sorted[i - 1];
    const b = sorted[i];
    if (tempC <= b.metalTempC) {
      const f = (tempC - a.metalTempC) / (b.metalTempC - a.metalTempC);
      return (a.holdMin + f * (b.holdMin - a.holdMin)) * S_PER_MIN;
    }
  }
  return high.holdMin * S_PER_MIN;
}

/** ∫ dt / r over a piece where r runs linearly from ra to rb (both > 0). */
function pieceIndex(dtS: number, ra: number, rb: number): number {
  const diff = rb - ra;
  // the logarithmic mean tends to the arithmetic one as rb → ra; below this the difference is noise
  if (Math.abs(diff) <= 1e-12 * Math.max(ra, rb)) return dtS / ra;
  return (dtS * Math.log(rb / ra)) / diff;
}

function checkCurve(timeS: readonly number[], metalC: readonly number[]): void {
  if (!Array.isArray(timeS) || !Array.isArray(metalC) || timeS.length !== metalC.length) {
    throw new DomainError("metalC", "Times and temperatures must be lists of the same length.");
  }
  if (timeS.length < 2) throw new DomainError("timeS", "A profile needs at least two readings.");
  timeS.forEach((t, i) => {
    requireInRange(`timeS.${i}`, t, {});
    requireInRange(`metalC.${i}`, metalC[i], {});
    if (i > 0 && !(t > timeS[i - 1])) throw new DomainError(`timeS.${i}`, `Reading ${i + 1} is not later than the one before it.`);
  });
}

/** Time (s) at which a straight piece from (t0, a) to (t1, b) crosses `level`. */
const crossing = (t0: number, a: number, t1: number, b: number, level: number) => t0 + ((level - a) / (b - a)) * (t1 - t0);

/** Seconds the curve spends at or above `level` (linear between readings). */
export function timeAboveS(timeS: readonly number[], tempC: readonly number[], level: number): number {
  let total = 0;
  for (let i = 1; i < timeS.length; i += 1) {
    const [t0, t1, a, b] = [timeS[i - 1], timeS[i], tempC[i - 1], tempC[i]];
    const aUp = a >= level;
    const bUp = b >= level;
    if (aUp && bUp) total += t1 - t0;
    else if (aUp) total += crossing(t0, a, t1, b, level) - t0;
    else if (bUp) total += t1 - crossing(t0, a, t1, b, level);
  }
  return total;
}

/** Σ dt / t_required(T) over the curve, split at every schedule temperature so each piece is exact. */
export function cureIndex(timeS: readonly number[], metalC: readonly number[], schedule: readonly CurePoint[]): number {
  checkCurve(timeS, metalC);
  const sorted = checkedSchedule(schedule);
  const lowest = sorted[0].metalTempC;
  const levels = sorted.map((p) => p.metalTempC);
  let index = 0;
  for (let i = 1; i < timeS.length; i += 1) {
    const [t0, t1, a, b] = [timeS[i - 1], timeS[i], metalC[i - 1], metalC[i]];
    if (Math.max(a, b) < lowest) continue;
    // cut the piece where it crosses a schedule temperature
    const cuts = [t0, ...levels.filter((l) => l > Math.min(a, b) && l < Math.max(a, b)).map((l) => crossing(t0, a, t1, b, l)), t1].sort((x, y) => x - y);
    const at = (t: number) => (t1 === t0 ? a : a + ((b - a) * (t - t0)) / (t1 - t0));
    for (let k = 1; k < cuts.length; k += 1) {
      const [ta, tb] = [cuts[k - 1], cuts[k]];
      if (tb <= ta) continue;
      const [Ta, Tb] = [at(ta), at(tb)];
      // the whole sub-piece lies on one side of `lowest`; its midpoint tells which
      if ((Ta + Tb) / 2 < lowest) continue;
      index += pieceIndex(tb - ta, requiredS(sorted, Math.max(Ta, lowest)), requiredS(sorted, Math.max(Tb, lowest)));
    }
  }
  return index;
}

/** The verdict of one probe: reach time, peak, time above each point, cure index, over-bake. */
export function probeVerdict(input: ProbeVerdictInput): ProbeVerdict {
  const { timeS, metalC } = input;
  checkCurve(timeS, metalC);
  const sorted = checkedSchedule(input.schedule);
  const limit = input.overbakeLimitC ?? null;
  if (limit !== null) requireInRange("overbakeLimitC", limit, {});
  const lowest = sorted[0];
  const highest = sorted[sorted.length - 1];

  let peakAt = 0;
  metalC.forEach((t, i) => {
    if (t > metalC[peakAt]) peakAt = i;
  });
  let reachedAtS: number | null = null;
  for (let i = 0; i < timeS.length && reachedAtS === null; i += 1) {
    if (metalC[i] >= lowest.metalTempC) {
      reachedAtS = i === 0 ? timeS[0] : crossing(timeS[i - 1], metalC[i - 1], timeS[i], metalC[i], lowest.metalTempC);
    }
  }
  const index = cureIndex(timeS, metalC, sorted);
  const points = sorted.map((p) => {
    const aboveMin = timeAboveS(timeS, metalC, p.metalTempC) / S_PER_MIN;
    return { ...p, aboveMin, met: isAtLeast(aboveMin, p.holdMin) };
  });
  const aboveOverbakeMin = limit === null ? 0 : timeAboveS(timeS, metalC, limit) / S_PER_MIN;
  const overbaked = limit !== null && isAbove(metalC[peakAt], limit);
  const underCured = !isAtLeast(index, 1);
  return {
    lowestC: lowest.metalTempC,
    highestC: highest.metalTempC,
    reachedLowestAtMin: reachedAtS === null ? null : (reachedAtS - timeS[0]) / S_PER_MIN,
    peakC: metalC[peakAt],
    peakAtMin: (timeS[peakAt] - timeS[0]) / S_PER_MIN,
    points,
    cureIndex: index,
    aboveHighestMin: points[points.length - 1].aboveMin,
    overbakeLimitC: limit,
    aboveOverbakeMin,
    underCured,
    overbaked,
    pass: !underCured && !overbaked,
  };
}

export interface TemperatureFormat {
  /** an absolute temperature, e.g. "190 °C" */
  temp: (c: number) => string;
  /** a temperature difference, e.g. "20 K" */
  delta: (k: number) => string;
}

const round = (v: number, digits: number) => String(Number(v.toFixed(digits)));
export const metricFormat: TemperatureFormat = { temp: (c) => `${round(c, 0)} °C`, delta: (k) => `${round(k, 1)} K` };
const minutes = (v: number) => `${round(v, 1)} min`;
const percent = (v: number) => `${Math.round(v * 100)} %`;

/**
 * The verdict in sentences, temperatures in the caller's units. `overbakeMarginK` names how the
 * limit was set (highest schedule point + margin) when it was.
 */
export function verdictReasons(v: ProbeVerdict, fmt: TemperatureFormat = metricFormat, overbakeMarginK?: number): string[] {
  const reasons: string[] = [];
  const low = v.points[0];
  if (v.reachedLowestAtMin === null) {
    reasons.push(
      `Under-cured: the metal peaked at ${fmt.temp(v.peakC)} and never reached ${fmt.temp(v.lowestC)}, the lowest temperature of the cure schedule (cure index 0 %).`,
    );
  } else if (v.underCured) {
    const best = [...v.points].sort((a, b) => b.aboveMin / b.holdMin - a.aboveMin / a.holdMin)[0];
    reasons.push(
      `Under-cured: cure index ${percent(v.cureIndex)}. The metal reached ${fmt.temp(v.lowestC)} after ${minutes(v.reachedLowestAtMin)} and peaked at ${fmt.temp(v.peakC)}; ` +
        `it spent ${minutes(best.aboveMin)} at or above ${fmt.temp(best.metalTempC)}, where ${minutes(best.holdMin)} are needed.`,
    );
  } else {
    reasons.push(
      `Cured: cure index ${percent(v.cureIndex)}. The metal reached ${fmt.temp(v.lowestC)} after ${minutes(v.reachedLowestAtMin)}, peaked at ${fmt.temp(v.peakC)} and spent ${minutes(low.aboveMin)} at or above it.`,
    );
  }
  if (v.overbaked && v.overbakeLimitC !== null) {
    const how = overbakeMarginK !== undefined ? ` (highest schedule point ${fmt.temp(v.highestC)} + ${fmt.delta(overbakeMarginK)} margin)` : "";
    reasons.push(`Over-baked: the metal peaked at ${fmt.temp(v.peakC)}, above the ${fmt.temp(v.overbakeLimitC)} limit${how}, for ${minutes(v.aboveOverbakeMin)}.`);
  }
  if (v.aboveHighestMin > 0 && v.points.length > 0) {
    const high = v.points[v.points.length - 1];
    reasons.push(
      `For ${minutes(v.aboveHighestMin)} the metal was at or above ${fmt.temp(high.metalTempC)}, the schedule's highest point; that time counts at its ${minutes(high.holdMin)} hold (common practice, no single source).`,
    );
  }
  return reasons;
}
