/**
 * Cure schedules: the metal temperature × hold time points a coating maker gives, read between
 * the points, and the best point for an oven. Kept apart from the heat-up model (cure.ts) so a
 * screen that only reads a schedule does not load it.
 */
import { DomainError, requireInRange } from "./errors";
import { isAtLeast, isBelow } from "./compare";
import { convert } from "./display-units";

const ABSOLUTE_ZERO_C = convert(0, "K", "degC");

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
