import { describe, expect, it } from "vitest";
import { bruteSingleGridCount, placementProblems, type CheckedInput, type CheckedPlan } from "./check-placements";

// The checker must itself catch broken plans, or the property tests prove nothing.
const input: CheckedInput = {
  part: { lengthMm: 300, widthMm: 200, heightMm: 100, massKg: 10 },
  carrier: { widthMm: 1000, heightMm: 1500, depthMm: 600, maxLoadKg: 100 },
  clearanceMm: 50,
  orientations: "upright",
};

const plan = (placements: CheckedPlan["placements"], extra: Partial<CheckedPlan> = {}): CheckedPlan => ({
  count: placements.length,
  limitedBy: "space",
  blocks: [{ count: placements.length }],
  placements,
  ...extra,
});

// Upright: 100 (the height) along y.
const a = { minMm: [0, 0, 0], sizeMm: [300, 100, 200] };

describe("independent placement checker", () => {
  it("accepts two parts exactly one clearance apart (300 + 50 = 350)", () => {
    expect(placementProblems(input, plan([a, { minMm: [350, 0, 0], sizeMm: [300, 100, 200] }]))).toEqual([]);
  });

  it.each([
    { name: "gap below clearance", p: plan([a, { minMm: [349, 0, 0], sizeMm: [300, 100, 200] }]) },
    { name: "outside the window", p: plan([{ minMm: [800, 0, 0], sizeMm: [300, 100, 200] }]) },
    { name: "not upright", p: plan([{ minMm: [0, 0, 0], sizeMm: [300, 200, 100] }]) },
    { name: "not the part", p: plan([{ minMm: [0, 0, 0], sizeMm: [300, 100, 250] }]) },
    { name: "count mismatch", p: plan([a], { count: 2 }) },
    { name: "block sum mismatch", p: plan([a], { blocks: [{ count: 3 }] }) },
    { name: "load exceeded (2 · 10 kg > 15 kg)", p: plan([a, { minMm: [350, 0, 0], sizeMm: [300, 100, 200] }]), maxLoadKg: 15 },
    { name: "load blamed with room for one more", p: plan([a], { limitedBy: "load" }) },
  ])("flags $name", ({ p, maxLoadKg }) => {
    const checked = { ...input, carrier: { ...input.carrier, maxLoadKg: maxLoadKg ?? 100 } };
    expect(placementProblems(checked, p).length).toBeGreaterThan(0);
  });

  it("counts single grids by stepping", () => {
    // grid.test.ts table, upright row: 60 (hand working, common practice, no source).
    expect(bruteSingleGridCount({ ...input, carrier: { ...input.carrier, maxLoadKg: 1e6 } })).toBe(60);
  });
});
