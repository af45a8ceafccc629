import { describe, expect, it } from "vitest";
import { planSingleGrid } from "@/lib/rack/plan";
import { rackPlanInputSchema } from "@/lib/validation/rack";

// PRODUCT.md, POST /api/rack/plan: the request body contract. Bounds are this project's choice
// (common practice, no source): sizes 0 < x ≤ 100,000 mm, clearance ≥ 0.
const valid = {
  part: { lengthMm: 300, widthMm: 200, heightMm: 100, massKg: 2.5 },
  carrier: { widthMm: 1000, heightMm: 1500, depthMm: 600, maxLoadKg: 180 },
  clearanceMm: 50,
  orientations: "upright",
};

function issuePaths(body: unknown): string[] {
  const result = rackPlanInputSchema.safeParse(body);
  return result.success ? [] : result.error.issues.map((i) => i.path.join("."));
}

describe("rackPlanInputSchema", () => {
  it("accepts a valid body, which the planner then takes as is", () => {
    const parsed = rackPlanInputSchema.parse(valid);
    // Best upright single grid, 300×100×200 in 1050 × 1550 × 650 spans: 3 · 10 · 2 = 60
    // (grid.test.ts); 180 kg / 2.5 kg = 72 ≥ 60, so space decides.
    const plan = planSingleGrid(parsed);
    expect(plan.count).toBe(60);
    expect(plan.limitedBy).toBe("space");
  });

  it.each([
    { name: "zero size", body: { ...valid, part: { ...valid.part, lengthMm: 0 } }, path: "part.lengthMm" },
    { name: "negative size", body: { ...valid, carrier: { ...valid.carrier, depthMm: -600 } }, path: "carrier.depthMm" },
    { name: "over 100,000 mm", body: { ...valid, carrier: { ...valid.carrier, widthMm: 100_001 } }, path: "carrier.widthMm" },
    { name: "infinite size", body: { ...valid, part: { ...valid.part, heightMm: Infinity } }, path: "part.heightMm" },
    { name: "size as text", body: { ...valid, part: { ...valid.part, widthMm: "200" } }, path: "part.widthMm" },
    { name: "zero mass", body: { ...valid, part: { ...valid.part, massKg: 0 } }, path: "part.massKg" },
    { name: "zero load limit", body: { ...valid, carrier: { ...valid.carrier, maxLoadKg: 0 } }, path: "carrier.maxLoadKg" },
    { name: "negative clearance", body: { ...valid, clearanceMm: -1 }, path: "clearanceMm" },
    // larger than 1000, 1500 and 600 alike
    { name: "clearance above every window size", body: { ...valid, clearanceMm: 1500.5 }, path: "clearanceMm" },
    { name: "unknown mode", body: { ...valid, orientations: "sideways" }, path: "orientations" },
    { name: "unknown key (strict)", body: { ...valid, colour: "red" }, path: "" },
    { name: "unknown part key (strict)", body: { ...valid, part: { ...valid.part, thicknessMm: 3 } }, path: "part" },
    {
      name: "forced orientation not the part's sizes",
      body: { ...valid, orientations: "any", orientation: { alongWidthMm: 300, alongHeightMm: 300, alongDepthMm: 100 } },
      path: "orientation",
    },
    {
      name: "forced upright orientation with the height lying",
      body: { ...valid, orientation: { alongWidthMm: 300, alongHeightMm: 200, alongDepthMm: 100 } },
      path: "orientation",
    },
  ])("rejects $name at '$path'", ({ body, path }) => {
    expect(issuePaths(body)).toContain(path);
  });

  it("accepts clearance above one window size but not all (600 < 700 < 1000)", () => {
    expect(issuePaths({ ...valid, clearanceMm: 700 })).toEqual([]);
  });

  it("accepts a forced orientation that keeps the height up", () => {
    const body = { ...valid, orientation: { alongWidthMm: 200, alongHeightMm: 100, alongDepthMm: 300 } };
    expect(issuePaths(body)).toEqual([]);
  });
});
