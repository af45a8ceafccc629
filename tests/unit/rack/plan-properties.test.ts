import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { planRack, planSingleGrid } from "@/lib/rack/plan";
import type { RackPlanInput } from "@/lib/rack/types";
import { bruteSingleGridCount, placementProblems } from "./check-placements";

// Random carriers and parts around a common scale, so that most cases fit a handful to a few
// hundred parts, some fit none, and a carrier holds at most ~1500 (the pairwise check stays
// quick). Sizes are rounded to 0.1 mm to exercise floating-point sums.
const round1 = (v: number) => Math.round(v * 10) / 10;
const ratio = (min: number, max: number) => fc.integer({ min: min * 100, max: max * 100 }).map((v) => v / 100);

const caseArb: fc.Arbitrary<RackPlanInput> = fc
  .record({
    scaleMm: fc.integer({ min: 20, max: 1000 }),
    partRatios: fc.tuple(ratio(0.15, 1), ratio(0.15, 1), ratio(0.15, 1)),
    windowRatios: fc.tuple(ratio(0.8, 7), ratio(0.8, 7), ratio(0.8, 5)),
    massKg: fc.integer({ min: 1, max: 5000 }).map((v) => v / 100),
    maxLoadKg: fc.integer({ min: 1, max: 5000 }),
    clearanceRatio: fc.oneof(fc.constant(0), ratio(0, 0.3)),
    orientations: fc.constantFrom("any" as const, "upright" as const),
    forced: fc.oneof({ weight: 3, arbitrary: fc.constant(null) }, { weight: 1, arbitrary: fc.integer({ min: 0, max: 5 }) }),
  })
  .map(({ scaleMm: s, partRatios: p, windowRatios: w, massKg, maxLoadKg, clearanceRatio, orientations, forced }) => ({
    part: { lengthMm: round1(s * p[0]), widthMm: round1(s * p[1]), heightMm: round1(s * p[2]), massKg },
    carrier: { widthMm: round1(s * w[0]), heightMm: round1(s * w[1]), depthMm: round1(s * w[2]), maxLoadKg },
    clearanceMm: round1(s * clearanceRatio),
    orientations,
    forced,
  }))
  .filter(({ part: p, carrier: w, clearanceMm: c }) => {
    if (c > Math.max(w.widthMm, w.heightMm, w.depthMm)) return false;
    const volumeBound =
      ((w.widthMm + c) * (w.heightMm + c) * (w.depthMm + c)) /
      ((p.lengthMm + c) * (p.widthMm + c) * (p.heightMm + c));
    return volumeBound <= 1500;
  })
  .map(({ forced, ...input }) => {
    if (forced === null) return input;
    // A forced orientation the mode allows, built here from the contract, not from lib/rack.
    const { lengthMm: l, widthMm: w, heightMm: h } = input.part;
    const turns =
      input.orientations === "upright"
        ? [
            [l, h, w],
            [w, h, l],
          ]
        : [
            [l, w, h],
            [l, h, w],
            [w, l, h],
            [w, h, l],
            [h, l, w],
            [h, w, l],
          ];
    const [x, y, z] = turns[forced % turns.length];
    return { ...input, orientation: { alongWidthMm: x, alongHeightMm: y, alongDepthMm: z } };
  });

describe("racking plans on 500 random cases", () => {
  it("pass the independent checker", () => {
    fc.assert(
      fc.property(caseArb, (input) => {
        expect(placementProblems(input, planRack(input))).toEqual([]);
      }),
      { seed: 20261201, numRuns: 500 },
    );
  });

  it("mixed blocks are never worse than the best single grid, counted independently", () => {
    fc.assert(
      fc.property(caseArb, (input) => {
        const full = planRack(input);
        const single = planSingleGrid(input);
        expect(single.spaceCount).toBe(bruteSingleGridCount(input));
        expect(full.spaceCount).toBeGreaterThanOrEqual(single.spaceCount);
        expect(full.count).toBeGreaterThanOrEqual(single.count);
      }),
      { seed: 7031, numRuns: 500 },
    );
  });

  it("keep the lowest tiers when the load decides", () => {
    fc.assert(
      fc.property(caseArb, (input) => {
        const full = planRack(input);
        if (full.limitedBy !== "load" || full.count === 0) return;
        const unlimited = planRack({ ...input, carrier: { ...input.carrier, maxLoadKg: 1e6 } });
        // The kept parts are the first N of the space layout in (y, x, z) order.
        const key = (p: { minMm: number[] }) => p.minMm.map((v) => v.toFixed(6)).join();
        expect(full.placements.map(key)).toEqual(unlimited.placements.slice(0, full.count).map(key));
        const highestKept = Math.max(...full.placements.map((p) => p.minMm[1]));
        const lowestDropped = Math.min(...unlimited.placements.slice(full.count).map((p) => p.minMm[1]));
        expect(highestKept).toBeLessThanOrEqual(lowestDropped + 1e-6);
      }),
      { seed: 4242, numRuns: 300 },
    );
  });
});
