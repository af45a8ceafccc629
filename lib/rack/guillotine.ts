// Guillotine block search. It works in "pitch space": every part is grown by the clearance c and
// the window by c too, so a part of size s takes s + c and a window W offers W + c. Packing
// without gaps there is packing with gap ≥ c between neighbours in real space, for parts within
// one grid and between blocks alike; a part's lower corner has the same coordinates in both.

import { wholeTimes } from "./grid";

type Triple = [number, number, number];

export interface LayoutBlock {
  orientationIndex: number;
  grid: Triple;
  /** Lower front corner of the block, in window coordinates (mm). */
  originMm: Triple;
}

export interface Layout {
  count: number;
  blocks: LayoutBlock[];
}

interface Fill {
  count: number;
  blockCount: number;
  orientationIndex: number;
  grid: Triple;
  subs: { offset: Triple; fill: Fill }[];
}

const EMPTY: Fill = { count: 0, blockCount: 0, orientationIndex: -1, grid: [0, 0, 0], subs: [] };

// Which axis is cut first, second, third when the L-shaped space beside a grid is split into
// three cuboids. [0, 1, 2]: a slab beside along x (full height and depth), then one above
// along y, then one behind along z.
const CUT_ORDERS: Triple[] = [
  [0, 1, 2],
  [0, 2, 1],
  [1, 0, 2],
  [1, 2, 0],
  [2, 0, 1],
  [2, 1, 0],
];

export interface SearchOptions {
  /**
   * Candidate layouts (grid × cut order) tried below the root before leftover boxes fall back
   * to their best plain grid. Bounds the time per plan whatever the sizes.
   */
  maxCandidates: number;
}

// Measured on bench/rack.ts's 1,000 cases: 1000 keeps p95 near 1 ms; an unbounded search finds
// only 0.13 % more parts (205,102 against 204,843) at several times the worst-case time.
export const DEFAULT_SEARCH: SearchOptions = { maxCandidates: 1000 };

/**
 * Best guillotine arrangement of grid blocks found in a window, both in pitch space. The root
 * grid is tried at full extent and shrunk by one row along each axis; every leftover cuboid is
 * filled recursively with its own best grid. Boxes are memoised by size.
 */
export function searchBlocks(
  windowPitchMm: Triple,
  pitchesMm: Triple[],
  options: SearchOptions = DEFAULT_SEARCH,
): Layout {
  const memo = new Map<string, Fill>();
  const count = pitchesMm.length;
  const px = pitchesMm.map((p) => p[0]);
  const py = pitchesMm.map((p) => p[1]);
  const pz = pitchesMm.map((p) => p[2]);
  const unitVolume = px[0] * py[0] * pz[0];
  // Same slack as wholeTimes(): a box a part in 10⁹ short of a pitch still takes the part.
  const reach = 1 + 1e-9;
  let candidates = 0;

  const fitsAny = (x: number, y: number, z: number): boolean => {
    for (let i = 0; i < count; i++) {
      if (px[i] <= x * reach && py[i] <= y * reach && pz[i] <= z * reach) return true;
    }
    return false;
  };

  // Volume bound on what a box can hold; 0 when no orientation fits at all.
  const upperBound = (b: Triple): number =>
    fitsAny(b[0], b[1], b[2]) ? wholeTimes(b[0] * b[1] * b[2], unitVolume) : 0;

  const fill = (box: Triple, root: boolean): Fill => {
    if (!fitsAny(box[0], box[1], box[2])) return EMPTY;
    const key = `${Math.round(box[0] * 1e3)},${Math.round(box[1] * 1e3)},${Math.round(box[2] * 1e3)}`;
    const known = memo.get(key);
    if (known) return known;

    // First the plain grids, so a single block wins every tie with a mixed arrangement.
    let best = EMPTY;
    const grids: { orientationIndex: number; n: Triple }[] = [];
    for (let orientationIndex = 0; orientationIndex < count; orientationIndex++) {
      const n: Triple = [
        wholeTimes(box[0], px[orientationIndex]),
        wholeTimes(box[1], py[orientationIndex]),
        wholeTimes(box[2], pz[orientationIndex]),
      ];
      const parts = n[0] * n[1] * n[2];
      if (parts === 0) continue;
      grids.push({ orientationIndex, n });
      if (parts > best.count) {
        best = { count: parts, blockCount: 1, orientationIndex, grid: n, subs: [] };
      }
    }

    const bound = upperBound(box);
    const withinBudget = root || candidates < options.maxCandidates;
    if (withinBudget && best.count < bound) {
      search: for (const { orientationIndex, n } of grids) {
        const variants: Triple[] = [n];
        if (root) {
          for (let axis = 0; axis < 3; axis++) {
            if (n[axis] > 1) {
              const v: Triple = [n[0], n[1], n[2]];
              v[axis] -= 1;
              variants.push(v);
            }
          }
        }
        for (const v of variants) {
          const base = v[0] * v[1] * v[2];
          const g: Triple = [v[0] * px[orientationIndex], v[1] * py[orientationIndex], v[2] * pz[orientationIndex]];
          for (const order of CUT_ORDERS) {
            if (!root) candidates += 1;
            const subs = leftoverBoxes(box, g, order);
            let optimistic = base;
            for (const s of subs) optimistic += upperBound(s.dims);
            if (optimistic <= best.count) continue;
            let total = base;
            let blockCount = 1;
            const filled: Fill["subs"] = [];
            for (const s of subs) {
              const f = fill(s.dims, false);
              if (f.count === 0) continue;
              total += f.count;
              blockCount += f.blockCount;
              filled.push({ offset: s.offset, fill: f });
            }
            if (total > best.count || (total === best.count && blockCount < best.blockCount)) {
              best = { count: total, blockCount, orientationIndex, grid: v, subs: filled };
              if (best.count >= bound) break search;
            }
          }
        }
      }
    }
    memo.set(key, best);
    return best;
  };

  const top = fill(windowPitchMm, true);
  const blocks: LayoutBlock[] = [];
  const collect = (f: Fill, origin: Triple) => {
    if (f.count === 0) return;
    blocks.push({ orientationIndex: f.orientationIndex, grid: f.grid, originMm: origin });
    for (const s of f.subs) {
      collect(s.fill, [origin[0] + s.offset[0], origin[1] + s.offset[1], origin[2] + s.offset[2]]);
    }
  };
  collect(top, [0, 0, 0]);
  return { count: top.count, blocks };
}

/** The three cuboids left beside a grid of extent g at a box's corner, cut in the given order. */
function leftoverBoxes(box: Triple, g: Triple, [p, q, r]: Triple): { dims: Triple; offset: Triple }[] {
  const first: Triple = [box[0], box[1], box[2]];
  first[p] = box[p] - g[p];
  const firstAt: Triple = [0, 0, 0];
  firstAt[p] = g[p];

  const second: Triple = [0, 0, 0];
  second[p] = g[p];
  second[q] = box[q] - g[q];
  second[r] = box[r];
  const secondAt: Triple = [0, 0, 0];
  secondAt[q] = g[q];

  const third: Triple = [0, 0, 0];
  third[p] = g[p];
  third[q] = g[q];
  third[r] = box[r] - g[r];
  const thirdAt: Triple = [0, 0, 0];
  thirdAt[r] = g[r];

  return [
    { dims: first, offset: firstAt },
    { dims: second, offset: secondAt },
    { dims: third, offset: thirdAt },
  ];
}
