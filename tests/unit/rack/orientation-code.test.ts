import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  codeOfOrientation,
  codeProblem,
  codesForMode,
  codeWords,
  distinctCodes,
  isOrientationCode,
  ORIENTATION_CODES,
  orientationFromCode,
  type OrientationCode,
} from "@/lib/rack/orientation-code";
import { planRack, planSingleGrid } from "@/lib/rack/plan";
import type { RackPlanInput } from "@/lib/rack/types";
import { bruteSingleGridCount, placementProblems } from "./check-placements";

// A 300 (length) × 200 (width) × 100 (height) mm part in a 1000 × 1500 × 600 mm window with 50 mm
// clearance (the planner page's opening example). Hand-worked, common practice, no source:
// n parts with gap c fit in W when n·s + (n − 1)·c ≤ W, i.e. n = floor((W + c) / (s + c)); the
// window plus clearance is 1050 × 1550 × 650.
const part = { lengthMm: 300, widthMm: 200, heightMm: 100, massKg: 1 };
const base: RackPlanInput = {
  part,
  carrier: { widthMm: 1000, heightMm: 1500, depthMm: 600, maxLoadKg: 1000 },
  clearanceMm: 50,
  orientations: "any",
};

describe("a code names which of the part's dimensions lies along travel, up and across", () => {
  it.each([
    // hand-worked: the code's words read off in x, y, z order
    { code: "length-height-width", mm: [300, 100, 200] },
    { code: "width-height-length", mm: [200, 100, 300] },
    { code: "length-width-height", mm: [300, 200, 100] },
    { code: "width-length-height", mm: [200, 300, 100] },
    { code: "height-width-length", mm: [100, 200, 300] },
    { code: "height-length-width", mm: [100, 300, 200] },
  ] as { code: OrientationCode; mm: number[] }[])("$code → $mm", ({ code, mm }) => {
    expect(orientationFromCode(part, code)).toEqual({ alongWidthMm: mm[0], alongHeightMm: mm[1], alongDepthMm: mm[2] });
    expect(codeOfOrientation(part, orientationFromCode(part, code))).toBe(code);
  });

  it("upright allows only the two codes with the height up", () => {
    // PRODUCT.md: "upright" keeps the part's heightMm along y (as hung from a hook).
    expect(codesForMode("upright")).toEqual(["length-height-width", "width-height-length"]);
    expect(codesForMode("any")).toEqual([...ORIENTATION_CODES]);
    expect(codeProblem("upright", "length-width-height")).toMatch(/height vertical/);
    expect(codeProblem("upright", "width-height-length")).toBeNull();
    expect(codeProblem("any", "height-length-width")).toBeNull();
  });

  it("an orientation that is not the part's own dimensions has no code", () => {
    expect(codeOfOrientation(part, { alongWidthMm: 300, alongHeightMm: 300, alongDepthMm: 100 })).toBeNull();
    expect(isOrientationCode("length-height-width")).toBe(true);
    expect(isOrientationCode("lhw")).toBe(false);
    expect(isOrientationCode(null)).toBe(false);
  });

  it.each([
    // hand-worked: a 300 × 300 × 100 part has length = width, so swapping them changes nothing
    { box: [300, 300, 100], mode: "upright", codes: ["length-height-width"] },
    { box: [300, 300, 100], mode: "any", codes: ["length-height-width", "length-width-height", "height-width-length"] },
    // a cube has one orientation
    { box: [100, 100, 100], mode: "any", codes: ["length-height-width"] },
    // three different sides: all six, or the two upright ones
    { box: [300, 200, 100], mode: "any", codes: [...ORIENTATION_CODES] },
  ] as const)("distinct orientations of $box, $mode", ({ box, mode, codes }) => {
    expect(distinctCodes({ lengthMm: box[0], widthMm: box[1], heightMm: box[2] }, mode)).toEqual(codes);
  });

  it("words", () => {
    expect(codeWords("width-height-length")).toBe("width along travel, height up, length across");
  });
});

describe("planning with one forced orientation", () => {
  // Hand-worked, common practice, no source (pitches = size + 50 in 1050 × 1550 × 650):
  //   length-height-width  (300, 100, 200): 350, 150, 250 → 3 × 10 × 2 = 60
  //   width-height-length  (200, 100, 300): 250, 150, 350 → 4 × 10 × 1 = 40
  //   length-width-height  (300, 200, 100): 350, 250, 150 → 3 ×  6 × 4 = 72
  //   width-length-height  (200, 300, 100): 250, 350, 150 → 4 ×  4 × 4 = 64
  //   height-width-length  (100, 200, 300): 150, 250, 350 → 7 ×  6 × 1 = 42
  //   height-length-width  (100, 300, 200): 150, 350, 250 → 7 ×  4 × 2 = 56
  // The best single grid is 72 (grid.test.ts); the unforced planner finds 80 with mixed blocks.
  it.each([
    { code: "length-height-width", grid: [3, 10, 2], count: 60 },
    { code: "width-height-length", grid: [4, 10, 1], count: 40 },
    { code: "length-width-height", grid: [3, 6, 4], count: 72 },
    { code: "width-length-height", grid: [4, 4, 4], count: 64 },
    { code: "height-width-length", grid: [7, 6, 1], count: 42 },
    { code: "height-length-width", grid: [7, 4, 2], count: 56 },
  ] as { code: OrientationCode; grid: number[]; count: number }[])("$code: $count in one grid $grid", ({ code, grid, count }) => {
    const input = { ...base, orientation: orientationFromCode(part, code) };
    const plan = planRack(input);
    expect(placementProblems(input, plan)).toEqual([]);
    expect(plan.count).toBe(count);
    expect(plan.blocks).toHaveLength(1);
    expect(plan.blocks[0].grid).toEqual(grid);
    expect(plan.placements.every((p) => p.sizeMm.join() === Object.values(orientationFromCode(part, code)).join())).toBe(true);
  });

  it("the unforced plan holds more than any one forced orientation here", () => {
    // hand-worked above: 80 (volume bound floor(1050·1550·650 / (350·250·150)) = 80) against 72
    expect(planRack(base).count).toBe(80);
  });

  it("a forced orientation never yields mixed blocks and equals its single grid, counted independently", () => {
    fc.assert(
      fc.property(
        // 100 mm and up keeps a carrier under the planner's 10,000-part sanity limit
        fc.integer({ min: 100, max: 700 }),
        fc.integer({ min: 100, max: 700 }),
        fc.integer({ min: 100, max: 700 }),
        fc.integer({ min: 0, max: 60 }),
        fc.constantFrom(...ORIENTATION_CODES),
        (l, w, h, c, code) => {
          const p = { lengthMm: l, widthMm: w, heightMm: h, massKg: 0.5 };
          const input: RackPlanInput = { ...base, part: p, clearanceMm: c, orientation: orientationFromCode(p, code) };
          const plan = planRack(input);
          expect(plan.blocks.length).toBeLessThanOrEqual(1);
          expect(plan.spaceCount).toBe(planSingleGrid(input).spaceCount);
          expect(plan.spaceCount).toBe(bruteSingleGridCount(input));
        },
      ),
      { seed: 20261203, numRuns: 300 },
    );
  });
});
