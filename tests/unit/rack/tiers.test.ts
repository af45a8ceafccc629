import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { planRack } from "@/lib/rack/plan";
import { tierRows } from "@/lib/rack/tiers";
import type { RackPlacement, RackPlanInput } from "@/lib/rack/types";

// A 200 (length) × 100 (width) × 300 (height) mm part of 1.5 kg upright in a 1000 × 1000 × 100 mm
// window (the API test's example).
const upright: RackPlanInput = {
  part: { lengthMm: 200, widthMm: 100, heightMm: 300, massKg: 1.5 },
  carrier: { widthMm: 1000, heightMm: 1000, depthMm: 100, maxLoadKg: 100 },
  clearanceMm: 50,
  orientations: "upright",
};

describe("tiers from the bottom up", () => {
  it("50 mm clearance: three tiers of four, 250 mm apart along travel", () => {
    // hand-worked, common practice, no source: along x 4·200 + 3·50 = 950 ≤ 1000 → 4, centres
    // 100, 350, 600, 850 (pitch 200 + 50 = 250); up 3·300 + 2·50 = 1000 → lower faces 0, 350, 700;
    // one part across (100 mm deep window).
    const rows = tierRows(planRack(upright).placements);
    const tier = (bottomMm: number) => ({
      bottomMm,
      heightMm: 300,
      count: 4,
      alongCount: 4,
      acrossCount: 1,
      alongPitchMm: { minMm: 250, maxMm: 250 },
      acrossPitchMm: null,
    });
    expect(rows).toEqual([tier(0), tier(350), tier(700)]);
  });

  it("a 10 kg load limit: five on the bottom tier, one on the next", () => {
    // hand-worked: no clearance, 5 × 3 = 15 fit; floor(10 / 1.5) = 6 are kept, lowest tier first.
    const rows = tierRows(planRack({ ...upright, clearanceMm: 0, carrier: { ...upright.carrier, maxLoadKg: 10 } }).placements);
    expect(rows.map((r) => [r.bottomMm, r.count, r.alongPitchMm])).toEqual([
      [0, 5, { minMm: 200, maxMm: 200 }],
      [300, 1, null],
    ]);
  });

  it("parts of different sizes in one tier: centre to centre, and the tallest sets the height", () => {
    // hand-worked: centres along x at 50 (0 + 100/2) and 250 (150 + 200/2) → 200; across, centres
    // 25 and 125 → 100; the 80 mm part is the tallest.
    const placements: RackPlacement[] = [
      { minMm: [0, 0, 0], sizeMm: [100, 50, 50] },
      { minMm: [150, 0, 0], sizeMm: [200, 80, 50] },
      { minMm: [0, 0, 100], sizeMm: [100, 50, 50] },
      { minMm: [0, 400, 0], sizeMm: [100, 50, 50] },
    ];
    expect(tierRows(placements)).toEqual([
      { bottomMm: 0, heightMm: 80, count: 3, alongCount: 2, acrossCount: 2, alongPitchMm: { minMm: 200, maxMm: 200 }, acrossPitchMm: { minMm: 100, maxMm: 100 } },
      { bottomMm: 400, heightMm: 50, count: 1, alongCount: 1, acrossCount: 1, alongPitchMm: null, acrossPitchMm: null },
    ]);
  });

  it("an empty plan has no tiers", () => {
    expect(tierRows([])).toEqual([]);
  });

  it("every part is in exactly one tier, tiers rise, and pitches are at least the part plus clearance", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 50, max: 400 }),
        fc.integer({ min: 50, max: 400 }),
        fc.integer({ min: 50, max: 400 }),
        fc.integer({ min: 0, max: 40 }),
        (l, w, h, c) => {
          const input: RackPlanInput = {
            part: { lengthMm: l, widthMm: w, heightMm: h, massKg: 0.1 },
            carrier: { widthMm: 1000, heightMm: 1200, depthMm: 600, maxLoadKg: 1000 },
            clearanceMm: c,
            orientations: "any",
          };
          const plan = planRack(input);
          const rows = tierRows(plan.placements);
          expect(rows.reduce((n, r) => n + r.count, 0)).toBe(plan.placements.length);
          for (let i = 1; i < rows.length; i++) expect(rows[i].bottomMm).toBeGreaterThan(rows[i - 1].bottomMm);
          const smallest = Math.min(l, w, h) + c;
          for (const r of rows) {
            if (r.alongPitchMm) expect(r.alongPitchMm.minMm).toBeGreaterThanOrEqual(smallest - 1e-6);
            if (r.acrossPitchMm) expect(r.acrossPitchMm.minMm).toBeGreaterThanOrEqual(smallest - 1e-6);
          }
        },
      ),
      { seed: 1203, numRuns: 200 },
    );
  });
});
