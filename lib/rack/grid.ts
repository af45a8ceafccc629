// Counting along one axis, and the best single-orientation grid.

/** Guards floor() against 2.9999999999999996 where the true quotient is 3. */
const QUOTIENT_TOLERANCE = 1e-9;

/** floor(span / pitch), forgiving floating-point error just below a whole number. */
export function wholeTimes(spanMm: number, pitchMm: number): number {
  if (!(spanMm > 0) || !(pitchMm > 0)) return 0;
  const q = spanMm / pitchMm;
  return Math.max(0, Math.floor(q + QUOTIENT_TOLERANCE * Math.max(1, q)));
}

/**
 * Parts of size s with gap c along a usable length W.
 * common practice, no source: n parts need n·s + (n − 1)·c ≤ W, so n = floor((W + c)/(s + c)).
 */
export function partsAlongAxis(windowMm: number, sizeMm: number, clearanceMm: number): number {
  return wholeTimes(windowMm + clearanceMm, sizeMm + clearanceMm);
}

export interface SingleGrid {
  /** Index into the orientation list given. */
  orientationIndex: number;
  grid: [number, number, number];
  count: number;
}

/**
 * The best single-orientation grid, exact over the orientations given. Ties go to the earlier
 * orientation (the list's order is the planner's preference).
 */
export function bestSingleGrid(
  windowMm: [number, number, number],
  orientations: [number, number, number][],
  clearanceMm: number,
): SingleGrid {
  let best: SingleGrid = { orientationIndex: -1, grid: [0, 0, 0], count: 0 };
  orientations.forEach((dims, orientationIndex) => {
    const grid: [number, number, number] = [
      partsAlongAxis(windowMm[0], dims[0], clearanceMm),
      partsAlongAxis(windowMm[1], dims[1], clearanceMm),
      partsAlongAxis(windowMm[2], dims[2], clearanceMm),
    ];
    const count = grid[0] * grid[1] * grid[2];
    if (count > best.count) best = { orientationIndex, grid, count };
  });
  return best;
}
