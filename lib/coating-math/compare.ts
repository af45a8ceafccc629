/**
 * Bound checks with a small relative tolerance. Standards say "at least" / "no more than", and
 * limits built in floating point miss by an ulp (1.2 × 12 = 14.399999999999999), so a reading
 * exactly on the printed limit must still count as inside it.
 */
export const RELATIVE_TOLERANCE = 1e-9;

function slack(a: number, b: number): number {
  return RELATIVE_TOLERANCE * Math.max(Math.abs(a), Math.abs(b), Number.MIN_VALUE);
}

/** value ≥ limit, within tolerance. */
export function isAtLeast(value: number, limit: number): boolean {
  return value >= limit - slack(value, limit);
}

/** value ≤ limit, within tolerance. */
export function isAtMost(value: number, limit: number): boolean {
  return value <= limit + slack(value, limit);
}

/** value < limit by more than the tolerance (the negation of isAtLeast). */
export function isBelow(value: number, limit: number): boolean {
  return !isAtLeast(value, limit);
}

/** value > limit by more than the tolerance (the negation of isAtMost). */
export function isAbove(value: number, limit: number): boolean {
  return !isAtMost(value, limit);
}

/** Ceiling that ignores float noise just above an integer (1000.0000000000001 → 1000). */
export function tolerantCeil(value: number): number {
  const nearest = Math.round(value);
  if (Math.abs(value - nearest) <= RELATIVE_TOLERANCE * Math.max(1, Math.abs(value))) return nearest;
  return Math.ceil(value);
}
