import { describe, expect, it } from "vitest";
import { partsAlongAxis } from "@/lib/rack/grid";
import { planSingleGrid } from "@/lib/rack/plan";
import type { RackPlanInput } from "@/lib/rack/types";
import { placementProblems } from "./check-placements";

describe("parts along one axis: n·s + (n − 1)·c ≤ W", () => {
  // common practice, no source; each row worked by hand.
  it.each([
    // 3·300 + 2·50 = 1000 ≤ 1000 exactly: the bound is inclusive.
    { windowMm: 1000, sizeMm: 300, clearanceMm: 50, n: 3 },
    // one millimetre less and the third part no longer fits: 2·300 + 50 = 650 ≤ 999.
    { windowMm: 999, sizeMm: 300, clearanceMm: 50, n: 2 },
    // one part needs no clearance at all, however large c is.
    { windowMm: 1000, sizeMm: 1000, clearanceMm: 500, n: 1 },
    { windowMm: 1000, sizeMm: 1001, clearanceMm: 0, n: 0 },
    // 3·100.1 + 2·0.2 = 300.7: floating point gives 300.7 + 0.2 = 300.9 over 100.3 = 2.9999…
    { windowMm: 300.7, sizeMm: 100.1, clearanceMm: 0.2, n: 3 },
    // 0.3 / 0.1 is 2.9999999999999996 in binary floating point; three parts still fit.
    { windowMm: 0.3, sizeMm: 0.1, clearanceMm: 0, n: 3 },
    // 10 · 150 + 9 · 10 = 1590 ≤ 1600, an 11th would need 1750.
    { windowMm: 1600, sizeMm: 150, clearanceMm: 10, n: 10 },
  ])("$n parts of $sizeMm mm along $windowMm mm with $clearanceMm mm gaps", (row) => {
    expect(partsAlongAxis(row.windowMm, row.sizeMm, row.clearanceMm)).toBe(row.n);
  });
});

const window = { widthMm: 1000, heightMm: 1500, depthMm: 600, maxLoadKg: 10_000 };

describe("best single-orientation grid", () => {
  // Hand working, common practice, no source. Pitch = size + c; span = window + c.
  // 300 × 200 × 100 part, c = 50, window 1000 × 1500 × 600 → spans 1050 × 1550 × 650.
  //   along (x, y, z)      pitches           per axis        parts
  //   300, 100, 200    350, 150, 250    3, 10, 2          60   (upright)
  //   200, 100, 300    250, 150, 350    4, 10, 1          40   (upright)
  //   300, 200, 100    350, 250, 150    3,  6, 4          72   ← best of "any"
  //   200, 300, 100    250, 350, 150    4,  4, 4          64
  //   100, 200, 300    150, 250, 350    7,  6, 1          42
  //   100, 300, 200    150, 350, 250    7,  4, 2          56
  // 250 mm cube, no clearance, 1000³ window: 4 · 4 · 4 = 64, exactly full.
  // 200 × 200 × 500 (height) upright, c = 120: pitches 320, 620, 320 in spans 1120, 1620, 720
  //   → 3, 2, 2 = 12.
  it.each([
    {
      name: "300×200×100, any",
      part: { lengthMm: 300, widthMm: 200, heightMm: 100 },
      carrier: window,
      clearanceMm: 50,
      orientations: "any" as const,
      count: 72,
      grid: [3, 6, 4],
      along: [300, 200, 100],
    },
    {
      name: "300×200×100, upright",
      part: { lengthMm: 300, widthMm: 200, heightMm: 100 },
      carrier: window,
      clearanceMm: 50,
      orientations: "upright" as const,
      count: 60,
      grid: [3, 10, 2],
      along: [300, 100, 200],
    },
    {
      name: "250 mm cube, exact fill",
      part: { lengthMm: 250, widthMm: 250, heightMm: 250 },
      carrier: { widthMm: 1000, heightMm: 1000, depthMm: 1000, maxLoadKg: 10_000 },
      clearanceMm: 0,
      orientations: "any" as const,
      count: 64,
      grid: [4, 4, 4],
      along: [250, 250, 250],
    },
    {
      name: "200×200×500 hung upright",
      part: { lengthMm: 200, widthMm: 200, heightMm: 500 },
      carrier: window,
      clearanceMm: 120,
      orientations: "upright" as const,
      count: 12,
      grid: [3, 2, 2],
      along: [200, 500, 200],
    },
  ])("$name → $count", (row) => {
    const input: RackPlanInput = {
      part: { ...row.part, massKg: 1 },
      carrier: row.carrier,
      clearanceMm: row.clearanceMm,
      orientations: row.orientations,
    };
    const plan = planSingleGrid(input);
    expect(plan.count).toBe(row.count);
    expect(plan.blocks).toHaveLength(1);
    expect(plan.blocks[0].grid).toEqual(row.grid);
    const o = plan.blocks[0].orientation;
    expect([o.alongWidthMm, o.alongHeightMm, o.alongDepthMm]).toEqual(row.along);
    expect(placementProblems(input, plan)).toEqual([]);
  });
});
