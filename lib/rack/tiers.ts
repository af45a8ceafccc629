// A plan's placements as the plain list the person at the rack works from: tiers from the bottom
// up, how many parts each holds, and the centre-to-centre spacing along travel and across.

import type { RackPlacement } from "./types";

/** Coordinates closer than this are the same tier / row (placements are sums of sizes). */
const SAME_MM = 1e-6;

export interface PitchRangeMm {
  minMm: number;
  maxMm: number;
}

export interface TierRow {
  /** lower face above the window floor */
  bottomMm: number;
  /** the tallest part in the tier */
  heightMm: number;
  count: number;
  /** distinct positions along travel and across */
  alongCount: number;
  acrossCount: number;
  /** centre-to-centre distance between neighbours in a row (along) or column (across); null when none */
  alongPitchMm: PitchRangeMm | null;
  acrossPitchMm: PitchRangeMm | null;
}

function distinctSorted(values: number[]): number[] {
  const out: number[] = [];
  for (const v of [...values].sort((a, b) => a - b)) {
    if (out.length === 0 || Math.abs(v - out[out.length - 1]) > SAME_MM * Math.max(1, Math.abs(v))) out.push(v);
  }
  return out;
}

/**
 * Centre-to-centre distances between neighbours along one axis, taken within each line of parts
 * that start at the same coordinate on the other horizontal axis (a row along travel, a column
 * across): parts of different blocks side by side are not mistaken for neighbours.
 */
function pitchRange(parts: RackPlacement[], axis: 0 | 2): PitchRangeMm | null {
  const other = axis === 0 ? 2 : 0;
  const lines = new Map<string, number[]>();
  for (const p of parts) {
    const key = p.minMm[other].toFixed(3);
    const centres = lines.get(key) ?? [];
    centres.push(p.minMm[axis] + p.sizeMm[axis] / 2);
    lines.set(key, centres);
  }
  let minMm = Infinity;
  let maxMm = -Infinity;
  for (const centres of lines.values()) {
    const d = distinctSorted(centres);
    for (let i = 1; i < d.length; i++) {
      minMm = Math.min(minMm, d[i] - d[i - 1]);
      maxMm = Math.max(maxMm, d[i] - d[i - 1]);
    }
  }
  return Number.isFinite(minMm) ? { minMm, maxMm } : null;
}

/** Placements grouped by the height of their lower face, lowest tier first. */
export function tierRows(placements: readonly RackPlacement[]): TierRow[] {
  const groups: { bottomMm: number; parts: RackPlacement[] }[] = [];
  for (const p of placements) {
    const y = p.minMm[1];
    const g = groups.find((t) => Math.abs(t.bottomMm - y) <= SAME_MM * Math.max(1, Math.abs(y)));
    if (g) g.parts.push(p);
    else groups.push({ bottomMm: y, parts: [p] });
  }
  return groups
    .sort((a, b) => a.bottomMm - b.bottomMm)
    .map(({ bottomMm, parts }) => {
      const along = parts.map((p) => p.minMm[0] + p.sizeMm[0] / 2);
      const across = parts.map((p) => p.minMm[2] + p.sizeMm[2] / 2);
      return {
        bottomMm,
        heightMm: Math.max(...parts.map((p) => p.sizeMm[1])),
        count: parts.length,
        alongCount: distinctSorted(along).length,
        acrossCount: distinctSorted(across).length,
        alongPitchMm: pitchRange(parts, 0),
        acrossPitchMm: pitchRange(parts, 2),
      };
    });
}
