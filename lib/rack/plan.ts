// Racking planner: how many parts fit on one carrier, in which orientation(s), with what
// clearance, within the load limit.
//
// What it finds: the best single-orientation grid, exactly (every allowed orientation, counted
// per axis), and then arrangements of several grid blocks made by guillotine cuts — a main grid
// at the window's corner (full size, or one row shorter along an axis) with the cuboids left
// beside, above and behind it filled the same way, recursively, each with its own best grid.
//
// What it does NOT find: non-guillotine arrangements — layouts that no straight cut across the
// whole window separates, such as the pinwheel. Example: a 20 × 30 × 10 part in a 50 × 50 × 10
// window, no clearance: any single grid holds 2, guillotine blocks 3, but four parts fit as a
// pinwheel around a 10 × 10 hole. Nor does it nest parts into each other's bounding boxes, vary
// the clearance, or rotate parts off the axes: each part is its bounding box, axis-aligned.
// The search is bounded (memoised by box size; below the main grid, after a fixed number of
// candidate layouts, leftover boxes get their best plain grid only), so now and then a better
// guillotine layout deeper in the tree is missed. It is never worse than the best single grid,
// because that grid is always a candidate.

import { checkRackInput } from "./check-input";
import { rackReason } from "./explain";
import { bestSingleGrid, wholeTimes } from "./grid";
import { searchBlocks, type Layout } from "./guillotine";
import { allowedOrientations, toTriple } from "./orientations";
import { RackInputError } from "./rack-error";
import type {
  RackBlock,
  RackOrientation,
  RackPlacement,
  RackPlan,
  RackPlanInput,
  Vec3Mm,
} from "./types";

/** More than this many parts on one carrier means the sizes are wrong (e.g. inches as mm). */
export const MAX_PARTS_PER_CARRIER = 10_000;

/** Placements whose coordinates differ by less than this are on the same tier / row. */
const SAME_COORDINATE_MM = 1e-6;

type Triple = [number, number, number];

interface Prepared {
  input: RackPlanInput;
  orientations: RackOrientation[];
  sizesMm: Triple[];
  windowMm: Triple;
}

function prepare(input: RackPlanInput): Prepared {
  checkRackInput(input);
  const orientations = input.orientation
    ? [input.orientation]
    : allowedOrientations(input.part, input.orientations);
  const { widthMm, heightMm, depthMm } = input.carrier;
  return {
    input,
    orientations,
    sizesMm: orientations.map(toTriple),
    windowMm: [widthMm, heightMm, depthMm],
  };
}

/** The full planner: best single grid, then mixed guillotine blocks when they hold more. */
export function planRack(input: RackPlanInput): RackPlan {
  const prep = prepare(input);
  const c = input.clearanceMm;
  const grow = (t: Triple): Triple => [t[0] + c, t[1] + c, t[2] + c];
  const layout = searchBlocks(grow(prep.windowMm), prep.sizesMm.map(grow));
  return buildPlan(prep, layout);
}

/** The best single-orientation grid alone (the baseline the mixed search is measured against). */
export function planSingleGrid(input: RackPlanInput): RackPlan {
  const prep = prepare(input);
  const best = bestSingleGrid(prep.windowMm, prep.sizesMm, input.clearanceMm);
  const layout: Layout =
    best.count === 0
      ? { count: 0, blocks: [] }
      : {
          count: best.count,
          blocks: [{ orientationIndex: best.orientationIndex, grid: best.grid, originMm: [0, 0, 0] }],
        };
  return buildPlan(prep, layout);
}

function compareCoordinate(a: number, b: number): number {
  return Math.abs(a - b) <= SAME_COORDINATE_MM ? 0 : a - b;
}

function buildPlan(prep: Prepared, layout: Layout): RackPlan {
  const { input } = prep;
  const c = input.clearanceMm;
  const spaceCount = layout.count;
  if (spaceCount > MAX_PARTS_PER_CARRIER) {
    throw new RackInputError(
      "part",
      `More than ${MAX_PARTS_PER_CARRIER} parts would fit on one carrier; check that the part and window sizes are in millimetres.`,
    );
  }
  // Whole parts within the load limit; the tolerance keeps 0.3 kg / 0.1 kg at 3, not 2.
  const loadCount = wholeTimes(input.carrier.maxLoadKg, input.part.massKg);
  const count = Math.min(spaceCount, loadCount);
  const limitedBy = spaceCount > 0 && loadCount < spaceCount ? "load" : "space";

  // One placement per part, lowest tier first, then along travel, then across.
  const all: { block: number; placement: RackPlacement }[] = [];
  layout.blocks.forEach((b, block) => {
    const size = prep.sizesMm[b.orientationIndex];
    for (let i = 0; i < b.grid[0]; i++) {
      for (let j = 0; j < b.grid[1]; j++) {
        for (let k = 0; k < b.grid[2]; k++) {
          const minMm: Vec3Mm = [
            b.originMm[0] + i * (size[0] + c),
            b.originMm[1] + j * (size[1] + c),
            b.originMm[2] + k * (size[2] + c),
          ];
          all.push({ block, placement: { minMm, sizeMm: [size[0], size[1], size[2]] } });
        }
      }
    }
  });
  all.sort(
    (a, b) =>
      compareCoordinate(a.placement.minMm[1], b.placement.minMm[1]) ||
      compareCoordinate(a.placement.minMm[0], b.placement.minMm[0]) ||
      compareCoordinate(a.placement.minMm[2], b.placement.minMm[2]),
  );
  const kept = all.slice(0, count);
  const keptPerBlock = new Array<number>(layout.blocks.length).fill(0);
  for (const k of kept) keptPerBlock[k.block] += 1;

  const blocks: RackBlock[] = [];
  layout.blocks.forEach((b, i) => {
    if (keptPerBlock[i] === 0) return;
    blocks.push({
      orientation: { ...prep.orientations[b.orientationIndex] },
      grid: [b.grid[0], b.grid[1], b.grid[2]],
      count: keptPerBlock[i],
      originMm: [b.originMm[0], b.originMm[1], b.originMm[2]],
    });
  });

  return {
    count,
    spaceCount,
    limitedBy,
    reason: rackReason({
      part: prep.input.part,
      windowMm: prep.windowMm,
      maxLoadKg: prep.input.carrier.maxLoadKg,
      clearanceMm: prep.input.clearanceMm,
      orientations: prep.input.orientations,
      orientation: prep.input.orientation,
      count,
      spaceCount,
      limitedBy,
      blocks: layout.blocks,
    }),
    blocks,
    placements: kept.map((k) => k.placement),
  };
}
