import { unit } from "mathjs";
import { describe, expect, it } from "vitest";
import { partBoxFromBboxMm } from "@/lib/rack/part-box";
import { planRack, planSingleGrid } from "@/lib/rack/plan";
import { RackInputError } from "@/lib/rack/rack-error";
import type { RackPlanInput } from "@/lib/rack/types";
import { placementProblems } from "./check-placements";

const mm = (value: number, from: string) => unit(value, from).toNumber("mm");

function expectSound(input: RackPlanInput) {
  const plan = planRack(input);
  expect(placementProblems(input, plan)).toEqual([]);
  return plan;
}

describe("mixed blocks beat the best single grid where a guillotine layout allows", () => {
  // Hand working, common practice, no source.
  // (a) 20 × 30 × 10 part, 50 × 50 × 10 window, no clearance. Only 10 fits across (z), so it is
  //     a 2-D problem: 20 × 30 rectangles in a 50 × 50 square.
  //     single grids: 20 along x → 2 × 1 = 2; 30 along x → 1 × 2 = 2.
  //     blocks: a 2 × 1 grid (40 × 30), then the 40 × 20 strip above holds one part turned 30 × 20
  //     → 3. Every straight first cut leaves strips holding 1 + 2, so 3 is the guillotine best.
  //     The true optimum is 4, a pinwheel round a 10 × 10 hole, which no straight cut separates.
  // (b) 400 × 300 × 100 part, 1000 × 1000 × 100 window, no clearance (again 2-D).
  //     single grids: 2 × 3 = 6 either way round.
  //     blocks: a 1 × 3 column of 400-wide parts (400 × 900) and, in the 600 × 1000 slab beside
  //     it, 2 × 2 parts turned 300 wide × 400 tall → 3 + 4 = 7.
  //     8 do fit, but only interlocked: bottom row 400(h300) + 300(h400) + 300(h400), top row
  //     mirrored, one part turned in each side gap — no straight cut crosses it.
  // (c) 300 × 200 × 100 part, 1000 × 1500 × 600 window, 50 mm clearance: single best 72 (see
  //     grid.test.ts). In pitch space (part + 50, window + 50 = 1050 × 1550 × 650):
  //     7 × 5 × 1 of (100 along x, 200 up, 300 across)   pitch 150,250,350 → 1050 × 1250 × 350: 35
  //     behind it (z from 350, 1050 × 1250 × 300): 3 × 5 × 2 of (300, 200, 100)                : 30
  //     above (y from 1250, 1050 × 300 × 650): 3 × 2 × 2 of (300, 100, 200) → z 500            : 12
  //       and behind that (z from 500, 1050 × 300 × 150): 3 × 1 × 1 of (300, 200, 100)          :  3
  //     = 80 = floor(1050·1550·650 / (350·250·150)) = floor(80.6), the volume bound: optimal.
  it.each([
    {
      name: "20×30×10 in 50×50×10 (pinwheel holds 4)",
      part: { lengthMm: 20, widthMm: 30, heightMm: 10 },
      window: [50, 50, 10],
      clearanceMm: 0,
      single: 2,
      mixed: 3,
    },
    {
      name: "400×300×100 in 1000×1000×100",
      part: { lengthMm: 400, widthMm: 300, heightMm: 100 },
      window: [1000, 1000, 100],
      clearanceMm: 0,
      single: 6,
      mixed: 7,
    },
    {
      name: "300×200×100 in 1000×1500×600, 50 mm clearance",
      part: { lengthMm: 300, widthMm: 200, heightMm: 100 },
      window: [1000, 1500, 600],
      clearanceMm: 50,
      single: 72,
      mixed: 80,
    },
  ])("$name: single $single, blocks $mixed", (row) => {
    const input: RackPlanInput = {
      part: { ...row.part, massKg: 1 },
      carrier: { widthMm: row.window[0], heightMm: row.window[1], depthMm: row.window[2], maxLoadKg: 1000 },
      clearanceMm: row.clearanceMm,
      orientations: "any",
    };
    expect(planSingleGrid(input).count).toBe(row.single);
    const plan = expectSound(input);
    expect(plan.count).toBe(row.mixed);
    expect(plan.limitedBy).toBe("space");
    expect(plan.blocks.length).toBeGreaterThan(1);
    expect(plan.blocks[0].originMm).toEqual([0, 0, 0]);
  });

  it("says how the blocks split the count", () => {
    // Case (a) above: a 2 × 1 main grid and one part turned above it.
    const plan = planRack({
      part: { lengthMm: 20, widthMm: 30, heightMm: 10, massKg: 1 },
      carrier: { widthMm: 50, heightMm: 50, depthMm: 10, maxLoadKg: 1000 },
      clearanceMm: 0,
      orientations: "any",
    });
    expect(plan.reason).toBe(
      "Space limits the carrier to 3 parts: a main grid of 2 along travel × 1 tier × 1 across (2) and 1 more in 1 further block filling the space left, no clearance.",
    );
  });
});

// 200 × 200 × 500 mm part hung upright in a 1000 × 1500 × 600 window, 120 mm clearance: pitches
// 320 (x), 620 (y), 320 (z) in spans 1120, 1620, 720 → 3 × 2 × 2 = 12 (hand working, no source).
const hung = (massKg: number, maxLoadKg: number): RackPlanInput => ({
  part: { lengthMm: 200, widthMm: 200, heightMm: 500, massKg },
  carrier: { widthMm: 1000, heightMm: 1500, depthMm: 600, maxLoadKg },
  clearanceMm: 120,
  orientations: "upright",
});

describe("space or load decides", () => {
  it("space: 12 parts of 15 kg on a 180 kg carrier (12 · 15 = 180, the limit exactly)", () => {
    const plan = expectSound(hung(15, 180));
    expect(plan.count).toBe(12);
    expect(plan.limitedBy).toBe("space");
    expect(plan.reason).toBe(
      "Space limits the carrier to 12 parts: 3 along travel × 2 tiers × 2 across, 120 mm clearance.",
    );
    expect(plan.blocks).toEqual([
      {
        orientation: { alongWidthMm: 200, alongHeightMm: 500, alongDepthMm: 200 },
        grid: [3, 2, 2],
        count: 12,
        originMm: [0, 0, 0],
      },
    ]);
  });

  it("load: 20 kg parts on a 180 kg carrier → 9 of 12, lowest tier first", () => {
    // floor(180 / 20) = 9: the 6 parts of the bottom tier, then the first 3 of the upper tier
    // (y = 500 + 120 = 620), in x then z order. x steps 320, z steps 320.
    const plan = expectSound(hung(20, 180));
    expect(plan.count).toBe(9);
    expect(plan.spaceCount).toBe(12);
    expect(plan.limitedBy).toBe("load");
    expect(plan.reason).toBe("The 180 kg load limit allows 9 of the 12 parts that fit.");
    expect(plan.placements.map((p) => p.minMm)).toEqual([
      [0, 0, 0],
      [0, 0, 320],
      [320, 0, 0],
      [320, 0, 320],
      [640, 0, 0],
      [640, 0, 320],
      [0, 620, 0],
      [0, 620, 320],
      [320, 620, 0],
    ]);
    expect(plan.blocks.map((b) => b.count)).toEqual([9]);
  });

  it("load: 100 mm cubes, 90 of 280 kept, the last six on the fourth tier", () => {
    // Pitch 150 in spans 1050 × 1550 × 650 → 7 × 10 × 4 = 280 (hand working). 180 / 2 = 90 =
    // 3 full tiers of 7 · 4 = 28 (84) + 6 on the tier at y = 3 · 150 = 450:
    // x = 0 with z = 0, 150, 300, 450, then x = 150 with z = 0, 150.
    const input: RackPlanInput = {
      part: { lengthMm: 100, widthMm: 100, heightMm: 100, massKg: 2 },
      carrier: { widthMm: 1000, heightMm: 1500, depthMm: 600, maxLoadKg: 180 },
      clearanceMm: 50,
      orientations: "any",
    };
    const plan = expectSound(input);
    expect(plan.spaceCount).toBe(280);
    expect(plan.count).toBe(90);
    expect(plan.placements.slice(84).map((p) => p.minMm)).toEqual([
      [0, 450, 0],
      [0, 450, 150],
      [0, 450, 300],
      [0, 450, 450],
      [150, 450, 0],
      [150, 450, 150],
    ]);
    expect(plan.placements.filter((p) => p.minMm[1] === 0)).toHaveLength(28);
  });

  it("load limit counts whole parts with a tolerance: 0.3 kg / 0.1 kg is 3 parts", () => {
    // 0.3 / 0.1 = 2.9999999999999996 in binary floating point; the true quotient is 3.
    const plan = expectSound(hung(0.1, 0.3));
    expect(plan.count).toBe(3);
  });
});

describe("count 0 is an answer, not an error", () => {
  it("a part larger than the window in every upright orientation", () => {
    // upright keeps 300 along y; then 1200 along x (> 1000) or along z (> 600): neither fits.
    const input: RackPlanInput = {
      part: { lengthMm: 1200, widthMm: 400, heightMm: 300, massKg: 10 },
      carrier: { widthMm: 1000, heightMm: 1500, depthMm: 600, maxLoadKg: 180 },
      clearanceMm: 50,
      orientations: "upright",
    };
    const plan = expectSound(input);
    expect(plan).toMatchObject({ count: 0, spaceCount: 0, limitedBy: "space", blocks: [], placements: [] });
    expect(plan.reason).toBe(
      "The part (1200 × 400 × 300 mm) is larger than the 1000 × 1500 × 600 mm window in every upright orientation.",
    );
    // Any way round, 1200 can stand up the 1500 mm height (spans 1050 × 1550 × 650):
    //   400, 1200, 300 → pitches 450, 1250, 350 → 2 · 1 · 1 = 2
    //   300, 1200, 400 → pitches 350, 1250, 450 → 3 · 1 · 1 = 3 (the other four: 0)
    expect(planSingleGrid({ ...input, orientations: "any" }).count).toBe(3);
  });

  it("a load limit below one part's mass", () => {
    const plan = expectSound(hung(200, 180));
    expect(plan).toMatchObject({ count: 0, spaceCount: 12, limitedBy: "load", blocks: [], placements: [] });
    expect(plan.reason).toBe(
      "The 180 kg load limit is below one part's mass (200 kg), so the carrier can take none of the 12 parts that fit.",
    );
  });
});

describe("forced orientation", () => {
  const base: RackPlanInput = {
    part: { lengthMm: 300, widthMm: 200, heightMm: 100, massKg: 1 },
    carrier: { widthMm: 1000, heightMm: 1500, depthMm: 600, maxLoadKg: 1000 },
    clearanceMm: 50,
    orientations: "any",
  };

  it("uses only the forced orientation", () => {
    // 200 along x, 300 up, 100 across: pitches 250, 350, 150 in 1050, 1550, 650 → 4 · 4 · 4 = 64.
    const input = { ...base, orientation: { alongWidthMm: 200, alongHeightMm: 300, alongDepthMm: 100 } };
    const plan = expectSound(input);
    expect(plan.count).toBe(64);
    expect(plan.placements.every((p) => p.sizeMm.join() === "200,300,100")).toBe(true);
  });

  it.each([
    { name: "not the part's dimensions", orientations: "any" as const, o: [300, 300, 100] },
    { name: "upright with the height lying", orientations: "upright" as const, o: [100, 300, 200] },
  ])("rejects $name on field orientation", ({ orientations, o }) => {
    const input: RackPlanInput = {
      ...base,
      orientations,
      orientation: { alongWidthMm: o[0], alongHeightMm: o[1], alongDepthMm: o[2] },
    };
    expect(() => planRack(input)).toThrow(RackInputError);
    try {
      planRack(input);
    } catch (e) {
      expect((e as RackInputError).field).toBe("orientation");
    }
  });

  it("accepts upright with length and width swapped (height still along y)", () => {
    // 200 along x, 100 up, 300 across: pitches 250, 150, 350 → 4 · 10 · 1 = 40 (grid.test.ts table).
    const input: RackPlanInput = {
      ...base,
      orientations: "upright",
      orientation: { alongWidthMm: 200, alongHeightMm: 100, alongDepthMm: 300 },
    };
    expect(expectSound(input).count).toBe(40);
  });
});

describe("impossible input is a domain error naming the field", () => {
  const ok = hung(15, 180);
  it.each([
    { field: "part.lengthMm", input: { ...ok, part: { ...ok.part, lengthMm: -1 } } },
    { field: "part.massKg", input: { ...ok, part: { ...ok.part, massKg: 0 } } },
    { field: "carrier.depthMm", input: { ...ok, carrier: { ...ok.carrier, depthMm: Number.NaN } } },
    { field: "carrier.maxLoadKg", input: { ...ok, carrier: { ...ok.carrier, maxLoadKg: 0 } } },
    { field: "clearanceMm", input: { ...ok, clearanceMm: -5 } },
    // larger than 1000, 1500 and 600 alike
    { field: "clearanceMm", input: { ...ok, clearanceMm: 1501 } },
    // 1 mm parts in a 1000 × 1500 × 600 window: 9 × 10⁸ of them, a unit mistake
    { field: "part", input: { ...ok, clearanceMm: 0, part: { lengthMm: 1, widthMm: 1, heightMm: 1, massKg: 1 } } },
  ])("$field", ({ field, input }) => {
    let caught: unknown;
    try {
      planRack(input);
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(RackInputError);
    expect((caught as RackInputError).field).toBe(field);
  });
});

describe("mesh bounding box → part box", () => {
  it("maps CAD x, y, z to length, width, height, so upright keeps CAD z vertical", () => {
    // PRODUCT.md: x → lengthMm, y → widthMm, z → heightMm (CAD files are Z-up).
    const box = partBoxFromBboxMm({ x: 120, y: 40, z: 300 });
    expect(box).toEqual({ lengthMm: 120, widthMm: 40, heightMm: 300 });
    const plan = planRack({
      part: { ...box, massKg: 1 },
      carrier: { widthMm: 1000, heightMm: 1500, depthMm: 600, maxLoadKg: 1000 },
      clearanceMm: 50,
      orientations: "upright",
    });
    expect(plan.placements.every((p) => p.sizeMm[1] === 300)).toBe(true);
  });
});

describe("carrier spacing on an incline", () => {
  // source: Metal Finishing Guidebook 2012–13, "Importance of Rack Density": racks ~20 in wide on
  // 24 in centres clear a 30° incline, because the horizontal spacing there is
  // 24 × cos 30° = 20.8 in. A window that wide takes one 20 in rack along travel, not a 21 in one.
  const windowMm = mm(24, "inch") * Math.cos(Math.PI / 6);
  it.each([
    { rackIn: 20, count: 1 },
    { rackIn: 21, count: 0 },
  ])("$rackIn in rack → $count", ({ rackIn, count }) => {
    const plan = expectSound({
      part: { lengthMm: mm(rackIn, "inch"), widthMm: 100, heightMm: 1000, massKg: 30 },
      carrier: { widthMm: windowMm, heightMm: 1500, depthMm: 150, maxLoadKg: 100 },
      clearanceMm: 0,
      orientations: "upright",
    });
    expect(plan.count).toBe(count);
  });
});
