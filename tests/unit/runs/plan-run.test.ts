import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { DomainError } from "../../../lib/coating-math/errors";
import { ecoatEstimate } from "../../../lib/coating-math/ecoat";
import { powderEstimate } from "../../../lib/coating-math/powder";
import { coatAreaPerPartM2, planRun, wholeContainers, type PlanRunInput } from "../../../lib/runs/plan-run";
import { batchOven, benchEnd, ecoat, greenPowder, line1, line2, whiteHybrid, zincPrimer } from "./fixtures";

const twoCoat = (over: Partial<PlanRunInput> = {}): PlanRunInput => ({
  part: benchEnd,
  quantity: 100,
  line: line1,
  racking: { clearanceMm: 0, orientations: "upright" },
  coats: [
    { coating: ecoat, filmUm: 20 },
    { coating: greenPowder, filmUm: 70, firstPassEfficiency: 0.5, reclaimEfficiency: 0 },
  ],
  ...over,
});

function fieldOf(fn: () => unknown): string {
  try {
    fn();
  } catch (e) {
    if (e instanceof DomainError) return e.field;
    throw e;
  }
  throw new Error("expected a DomainError");
}

describe("coated area per coat", () => {
  // PRODUCT.md, parts: powder coats the outside only, e-coat (immersion) also the inside; masked area comes off both.
  it.each([
    ["powder", 1.2 - 0.1],
    ["e-coat", 1.2 + 0.3 - 0.1],
  ] as const)("%s: %f m² per part", (kind, expected) => {
    expect(coatAreaPerPartM2(benchEnd, kind)).toBeCloseTo(expected, 12);
  });
});

describe("material of a run", () => {
  it("is the sum over coats of the powder and e-coat calculators' results", () => {
    const plan = planRun(twoCoat());
    // the calculators themselves are checked against their sources in tests/unit/coating-math
    const e = ecoatEstimate({ areaM2: 1.4, filmUm: 20, filmDensityGPerCm3: 1.4, coulombicYieldMgPerC: 30, parts: 100 });
    const p = powderEstimate({ areaM2: 1.1, filmUm: 70, specificGravity: 1.55, firstPassEfficiency: 0.5, reclaimEfficiency: 0, parts: 100 });
    expect(plan.coats[0].materialKg).toBeCloseTo(e.depositedSolidsKg / 0.5, 10);
    expect(plan.coats[1].materialKg).toBeCloseTo(p.powderKg, 10);
    expect(plan.materialKg).toBeCloseTo(e.depositedSolidsKg / 0.5 + p.powderKg, 10);
  });

  it("matches the hand working", () => {
    const plan = planRun(twoCoat());
    // E-coat, hand: 1 m² × 20 µm = 20 cm³ of film; × 1.4 g/cm³ = 28 g/m²; × 140 m² = 3.92 kg of
    // solids; paint at 50 % weight solids = 7.84 kg (derived from the definitions; REFERENCES.md, electrocoat).
    expect(plan.coats[0].areaM2).toBeCloseTo(140, 10);
    expect(plan.coats[0].materialKg).toBeCloseTo(7.84, 10);
    // Paint volume: 20 µm of film / 0.4 volume solids = 0.05 L/m²; × 140 m² = 7 L (Products Finishing, "Estimating the Electrocoat Usage of a Part").
    expect(plan.coats[0].paintL).toBeCloseTo(7, 10);
    // Powder, hand: 110 m² × 70 µm × SG 1.55 / 1000 = 11.935 kg on the parts; at 50 % first-pass
    // efficiency and no reclaim, 23.87 kg sprayed (Products Finishing, "Coverage of Powder", metric form).
    expect(plan.coats[1].areaM2).toBeCloseTo(110, 10);
    expect(plan.coats[1].materialKg).toBeCloseTo(23.87, 9);
    expect(plan.materialKg).toBeCloseTo(31.71, 9);
    // Cost: 7.84 kg × 7.20 + 23.87 kg × 9.40 = 56.448 + 224.378 = 280.826 (common practice, no source).
    expect(plan.materialCost).toBeCloseTo(280.826, 9);
  });

  it("with reclaim uses less powder: U = η / (1 − r(1 − η)) (REFERENCES.md, derived)", () => {
    const plan = planRun(twoCoat({ coats: [{ coating: greenPowder, filmUm: 70, firstPassEfficiency: 0.5, reclaimEfficiency: 0.8 }] }));
    // U = 0.5 / (1 − 0.8 × 0.5) = 0.5 / 0.6 = 0.8333; 11.935 kg / 0.8333 = 14.322 kg
    expect(plan.coats[0].materialUtilization).toBeCloseTo(0.5 / 0.6, 12);
    expect(plan.coats[0].materialKg).toBeCloseTo(14.322, 9);
  });

  it("property: the run's material is always the sum of its coats", () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 5000 }), fc.double({ min: 0.2, max: 1, noNaN: true }), fc.integer({ min: 40, max: 120 }), (qty, fpe, film) => {
        const plan = planRun(twoCoat({ quantity: qty, coats: [{ coating: ecoat, filmUm: 20 }, { coating: greenPowder, filmUm: film, firstPassEfficiency: fpe }] }));
        const sum = plan.coats.reduce((a, c) => a + c.materialKg, 0);
        expect(plan.materialKg).toBeCloseTo(sum, 9);
        expect(plan.coats.every((c) => c.containers * c.containerKg >= c.materialKg - 1e-9)).toBe(true);
      }),
      { numRuns: 50 },
    );
  });
});

describe("whole containers", () => {
  // common practice, no source: order whole boxes or drums, rounding up; float noise above a whole number is not another box.
  it.each([
    [0, 25, 0],
    [23.87, 25, 1],
    [25, 25, 1],
    [0.1 * 3 * 250, 25, 3], // 75.00000000000001 kg in floating point
    [25.01, 25, 2],
    [7.84, 200, 1],
    [400.5, 200, 3],
  ])("%f kg in %f kg containers → %i", (kg, size, n) => {
    expect(wholeContainers(kg, size)).toBe(n);
  });

  it("a run's coats are rounded up to whole boxes and drums", () => {
    const plan = planRun(twoCoat({ quantity: 300 }));
    // 300 parts: e-coat 23.52 kg → 1 drum of 200 kg; powder 71.61 kg → 3 boxes of 25 kg
    expect(plan.coats[0].materialKg).toBeCloseTo(23.52, 9);
    expect(plan.coats[0].containers).toBe(1);
    expect(plan.coats[1].materialKg).toBeCloseTo(71.61, 9);
    expect(plan.coats[1].containers).toBe(3);
  });
});

describe("racking, carriers and line time", () => {
  it("conveyor, hand-worked: 100 bench ends on Line 1 at 3 m/min take 77.7 min", () => {
    const plan = planRun(twoCoat());
    // Upright, the 60 × 450 × 600 mm orientation fits 8 × 3 × 1 = 24 in the 500 × 1500 × 600 mm
    // window, but 45 kg / 6 kg allows 7 per carrier: load decides.
    expect(plan.racking.partsPerCarrier).toBe(7);
    expect(plan.racking.limitedBy).toBe("load");
    // 100 / 7 = 14.3 → 15 carriers
    expect(plan.carriers).toBe(15);
    // Stages: 9+3+3+2+6+3+3+12+4+3+75+15+6+60+20 = 224 m. Carriers × pitch = 15 × 0.6 = 9 m.
    // Line time = (9 + 224) m / 3 m/min = 77.667 min (cost.ts runLineTimeMin; common practice, no source).
    expect(plan.lineLengthM).toBe(224);
    expect(plan.lineTimeMin).toBeCloseTo(233 / 3, 10);
    // one carrier's trip: 224 / 3 = 74.667 min; the entrance is busy 9 / 3 = 3 min
    expect(plan.transitMin).toBeCloseTo(224 / 3, 10);
    expect(plan.loadingMin).toBeCloseTo(3, 10);
    // Cost: 280.826 material + 77.667 min × 410/h = 530.722 → 811.548 for the run, 8.115 per part.
    expect(plan.cost.runTotal).toBeCloseTo(280.826 + (233 / 3 / 60) * 410, 9);
    expect(plan.cost.totalPerPart).toBeCloseTo((280.826 + (233 / 3 / 60) * 410) / 100, 9);
  });

  it("a hand override of parts per carrier is used: 4 per carrier → 25 carriers, (25 × 0.6 + 224) / 3 = 79.667 min", () => {
    const plan = planRun(twoCoat({ racking: { clearanceMm: 0, orientations: "upright", partsPerCarrierOverride: 4 } }));
    expect(plan.racking.overridden).toBe(true);
    expect(plan.racking.plannedPerCarrier).toBe(7);
    expect(plan.carriers).toBe(25);
    expect(plan.lineTimeMin).toBeCloseTo(239 / 3, 10);
  });

  it("each coat's oven dwell and cure margin, hand-worked with the lumped heat-up model", () => {
    const plan = planRun(twoCoat());
    const [e, p] = plan.coats;
    // oven dwell = oven path / line speed (REFERENCES.md): 75 m / 3 = 25 min, 60 m / 3 = 20 min
    expect(e.cure.ovenName).toBe("E-coat bake oven");
    expect(e.cure.dwellMin).toBeCloseTo(25, 12);
    expect(p.cure.ovenName).toBe("Powder cure oven");
    expect(p.cure.dwellMin).toBeCloseTo(20, 12);
    // Çengel ch. 4: τ = ρ c (t/2) / h. E-coat bake (215 °C air, 35 W/m²K, 3 mm): τ = 7850 × 490 × 0.0015 / 35
    // = 164.85 s = 2.7475 min; to 205 °C: 2.7475 × ln(195/10) = 8.161 min + 10 min hold = 18.161 min
    // (the shortest of the three points) → margin 6.839 min.
    expect(e.cure.curePoint).toEqual({ metalTempC: 205, holdMin: 10 });
    expect(e.cure.marginMin!).toBeCloseTo(25 - (2.7475 * Math.log(19.5) + 10), 6);
    // Powder cure (210 °C, 30 W/m²K): τ = 192.325 s = 3.20542 min; to 190 °C: × ln(190/20) = 7.216 + 12 = 19.216 min → margin 0.784.
    expect(p.cure.curePoint).toEqual({ metalTempC: 190, holdMin: 12 });
    expect(p.cure.marginMin!).toBeCloseTo(20 - ((192.325 / 60) * Math.log(9.5) + 12), 6);
    expect(plan.cures).toBe(true);
  });

  it("batch oven, hand-worked: 50 planter brackets, 5 per rack, 4 racks per load", () => {
    const part = { ...benchEnd, number: "PB-20", lengthMm: 300, widthMm: 200, heightMm: 100, massKg: 2, thicknessMm: 2 };
    const plan = planRun({
      part,
      quantity: 50,
      line: batchOven,
      racking: { clearanceMm: 50, orientations: "any", partsPerCarrierOverride: 5 },
      coats: [{ coating: whiteHybrid, filmUm: 60, firstPassEfficiency: 0.6 }],
    });
    // 50 / 5 = 10 racks; 10 / 4 → 3 loads
    expect(plan.carriers).toBe(10);
    expect(plan.loads).toBe(3);
    // τ = 7850 × 490 × 0.001 / 22 = 174.841 s = 2.914015 min. To 190 °C in 200 °C air from 20 °C:
    // 2.914015 × ln(180/10) = 8.4226 min + 12 min hold = 20.4226 (shorter than 180 °C: 6.4027 + 15 = 21.4027).
    // Cycle = 12 load + 20.4226 + 10 unload = 42.4226 min; three loads = 127.268 min.
    const cycle = 12 + (3846.5 / 22 / 60) * Math.log(18) + 12 + 10;
    expect(plan.coats[0].cure.cycleMin!).toBeCloseTo(cycle, 9);
    expect(plan.lineTimeMin).toBeCloseTo(3 * cycle, 9);
    expect(plan.transitMin).toBe(0);
  });

  it("two powder coats on a one-booth line take two passes and a colour change between them", () => {
    const plan = planRun(twoCoat({ coats: [{ coating: zincPrimer, filmUm: 60, firstPassEfficiency: 0.5 }, { coating: greenPowder, filmUm: 70, firstPassEfficiency: 0.5 }] }));
    expect(plan.passes).toBe(2);
    expect(plan.coats.map((c) => c.pass)).toEqual([1, 2]);
    // two trips of (9 + 224) / 3 min plus the booth's 20 min colour change (grey to green)
    expect(plan.colourChangeMin).toBe(20);
    expect(plan.lineTimeMin).toBeCloseTo(2 * (233 / 3) + 20, 10);
  });
});

describe("bad input names the field and says why", () => {
  it("a part too large for the line's window: lineId", () => {
    const big = { ...benchEnd, lengthMm: 1600, widthMm: 100, heightMm: 1600 };
    expect(fieldOf(() => planRun(twoCoat({ part: big })))).toBe("lineId");
    expect(() => planRun(twoCoat({ part: big }))).toThrow(/does not fit on Line 1's carrier: .*larger than the 500 × 1500 × 600 mm window/);
  });

  it("upright only and too tall to stand: the message says how many fit when any orientation is allowed", () => {
    // hand working: 1400 × 100 × 400 mm upright needs a 1400 × 100 footprint, wider than the
    // 500 × 600 mm floor; stood on end (1400 ≤ 1500 mm high, one tier) its 100 × 400 mm
    // footprint packs 7 to the 500 × 600 mm floor: 6 with 400 across (1 × 6 deep) and 1 more in
    // the 100 mm strip left, the most by area (300 000 / 40 000 = 7.5).
    const tall = { ...benchEnd, lengthMm: 1400, widthMm: 100, heightMm: 400 };
    expect(() => planRun(twoCoat({ part: tall }))).toThrow(/in every upright orientation\. Allowing any orientation fits 7 per carrier\.$/);
    // a part too big every way gets no such hint
    expect(() => planRun(twoCoat({ part: { ...benchEnd, lengthMm: 1600, widthMm: 100, heightMm: 1600 } }))).toThrow(/window in every upright orientation\.$/);
  });

  it.each([
    ["quantity 0", { quantity: 0 }, "quantity"],
    ["a fractional quantity", { quantity: 2.5 }, "quantity"],
    ["no coats", { coats: [] }, "coats"],
    ["e-coat in a batch oven", { line: batchOven, coats: [{ coating: ecoat, filmUm: 20 }] }, "coats.0.coatingId"],
    ["e-coat on the powder-only line", { line: line2, coats: [{ coating: ecoat, filmUm: 20 }] }, "coats.0.coatingId"],
    ["a powder coat without its first-pass efficiency", { coats: [{ coating: greenPowder, filmUm: 70 }] }, "coats.0.firstPassEfficiency"],
    ["a first-pass efficiency above 1", { coats: [{ coating: greenPowder, filmUm: 70, firstPassEfficiency: 1.2 }] }, "coats.0.firstPassEfficiency"],
    ["a speed outside the line's range", { lineSpeedMPerMin: 6 }, "lineSpeedMPerMin"],
    ["a line speed in a batch oven", { line: batchOven, lineSpeedMPerMin: 2, coats: [{ coating: whiteHybrid, filmUm: 60, firstPassEfficiency: 0.5 }] }, "lineSpeedMPerMin"],
    ["more parts per carrier than the load limit carries", { racking: { clearanceMm: 0, orientations: "upright" as const, partsPerCarrierOverride: 8 } }, "partsPerCarrierOverride"],
    ["a forced orientation that is not the part's", { racking: { clearanceMm: 0, orientations: "upright" as const, orientation: { alongWidthMm: 1, alongHeightMm: 2, alongDepthMm: 3 } } }, "orientation"],
    ["a part with everything masked", { part: { ...benchEnd, maskedAreaM2: 1.2 } }, "partId"],
  ])("%s → %s", (_what, over, field) => {
    expect(fieldOf(() => planRun(twoCoat(over as Partial<PlanRunInput>)))).toBe(field);
  });

  it("a slow cure is a warning, not a refusal", () => {
    // 8 mm steel in the 20 min powder oven cannot cure at 3 m/min
    const plan = planRun(twoCoat({ part: { ...benchEnd, thicknessMm: 8 } }));
    expect(plan.cures).toBe(false);
    expect(plan.warnings.some((w) => w.startsWith("Coat 2 (PP-410) does not cure"))).toBe(true);
  });

  it("a film outside the coating's range is a warning", () => {
    const plan = planRun(twoCoat({ coats: [{ coating: ecoat, filmUm: 30 }] }));
    expect(plan.warnings).toContain("Coat 1 (EC-200): 30 µm is outside the coating's 18–25 µm film build.");
  });
});
