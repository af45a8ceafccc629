import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { DomainError } from "@/lib/coating-math/errors";
import {
  filmFromPowderMass,
  firstPassEfficiencyFromWeighTest,
  materialUtilization,
  powderEstimate,
  theoreticalCoverageFt2PerLbPerMil,
  theoreticalCoverageM2PerKg,
} from "@/lib/coating-math/powder";
import { expectRelClose, propertyRuns } from "./expect-close";

// NIST SP 811 exact factors, typed here so the checks do not lean on the code under test.
const UM_PER_MIL = 25.4;
const FT2_PER_LB_PER_M2_PER_KG = 0.45359237 / 0.09290304;

describe("theoretical coverage, metric", () => {
  it.each([
    // source: REFERENCES.md metric form, example "SG 1.5 at 60 µm → 11.11 m²/kg" (1000/90)
    [1.5, 60, 1000 / 90],
    // source: Products Finishing, "Coverage of Powder" — its metric constant per mil is printed as
    // 39.8 m²/kg, an arithmetic slip: 1000 / 25.4 = 39.370…, which is what we expect here.
    [1, 25.4, 39.37007874015748],
    // hand: 1000 / (1.2 × 50) = 16.667
    [1.2, 50, 16.666666666666668],
    // hand: zinc-rich SG 2.8 (REFERENCES.md) at 75 µm: 1000 / 210 = 4.7619
    [2.8, 75, 4.761904761904762],
  ])("SG %d at %d µm covers %d m²/kg", (sg, filmUm, expected) => {
    expectRelClose(theoreticalCoverageM2PerKg(sg, filmUm), expected, 1e-12);
  });
});

describe("theoretical coverage, US trade form", () => {
  it("derives 192.2 ft²/lb per mil at SG 1 from water's density", () => {
    // hand: (1000 / 25.4) m²/kg = 39.370079; × 0.45359237 = 17.857967 kg… ; / 0.09290304
    // = 192.2216 ft²/lb (NIST SP 811 factors)
    expect(Math.abs(theoreticalCoverageFt2PerLbPerMil(1) - 192.2216)).toBeLessThan(0.0001);
  });

  it.each([
    // source: Products Finishing, Q&A "Coverage of Powder" (192.3)
    [192.3],
    // source: PCI magazine, "Technology Interchange — If You Can't Measure It" (2018) (192.4)
    [192.4],
  ])("agrees with the trade constant %d within 0.1 %%", (tradeConstant) => {
    const ours = theoreticalCoverageFt2PerLbPerMil(1);
    expect(Math.abs(ours - tradeConstant) / tradeConstant).toBeLessThan(0.001);
  });

  it.each([
    // source: Products Finishing, "Coverage of Powder": ft²/lb = 192.3 / (SG × mils)
    [1.5, 3],
    [1.2, 2],
    [1.8, 2.5],
    [1.6, 1.5],
    [2.8, 4],
  ])("metric result at SG %d, %d mil agrees with 192.3/(SG × mil) within 0.1 %%", (sg, mil) => {
    const trade = 192.3 / (sg * mil);
    const metricAsUs = theoreticalCoverageM2PerKg(sg, mil * UM_PER_MIL) * FT2_PER_LB_PER_M2_PER_KG;
    expect(Math.abs(metricAsUs - trade) / trade).toBeLessThan(0.001);
    expect(Math.abs(theoreticalCoverageFt2PerLbPerMil(sg) / mil - trade) / trade).toBeLessThan(0.001);
  });
});

describe("material utilisation with reclaim", () => {
  it.each([
    // derived U = η / (1 − r(1 − η)) (REFERENCES.md, no published source); values by hand
    [0.5, 0, 0.5],
    [0.5, 0.9, 0.5 / 0.55],
    // η 0.6, r 0.95 → 0.6 / 0.62 = 0.9677: inside the 95–98 % overall utilisation the Powder
    // Coating Institute quotes for efficient reclaim (REFERENCES.md)
    [0.6, 0.95, 0.6 / 0.62],
    [0.4, 1, 1],
    [1, 0.5, 1],
    [0.45, 0.5, 0.45 / 0.725],
  ])("FPE %d with reclaim %d → %d", (fpe, reclaim, expected) => {
    expectRelClose(materialUtilization(fpe, reclaim), expected, 1e-12);
  });

  it("reaches 95–98 % overall with a 50–60 % first pass and good reclaim", () => {
    // source: Powder Coating Institute as quoted in the trade press (REFERENCES.md): first pass
    // ~40–60 %, overall 95–98 % with an efficient reclaim system
    const u = materialUtilization(0.6, 0.95);
    expect(u).toBeGreaterThanOrEqual(0.95);
    expect(u).toBeLessThanOrEqual(0.98);
  });
});

describe("powderEstimate", () => {
  it("matches the API worked example", () => {
    // hand: 2 m² parts, 60 µm, SG 1.5, FPE 0.6, reclaim 0.95, 100 parts at 12 per kg
    // theoretical 1000/90 = 11.111 m²/kg; U = 0.6/0.62; per part = 2 × 1.5 × 60 / (1000 U)
    // = 0.18 × 0.62/0.6 = 0.186 kg; 100 parts 18.6 kg; cost 223.2
    const r = powderEstimate({
      areaM2: 2,
      filmUm: 60,
      specificGravity: 1.5,
      firstPassEfficiency: 0.6,
      reclaimEfficiency: 0.95,
      parts: 100,
      pricePerKg: 12,
    });
    expectRelClose(r.theoreticalCoverageM2PerKg, 1000 / 90, 1e-12);
    expectRelClose(r.materialUtilization, 0.6 / 0.62, 1e-12);
    expectRelClose(r.practicalCoverageM2PerKg, (1000 / 90) * (0.6 / 0.62), 1e-12);
    expectRelClose(r.powderKgPerPart, 0.186, 1e-12);
    expectRelClose(r.powderKg, 18.6, 1e-12);
    expectRelClose(r.costTotal ?? Number.NaN, 223.2, 1e-12);
  });

  it("defaults to no reclaim, one part and no cost", () => {
    // hand: 1 m², 80 µm, SG 1.6, FPE 0.5 → 1 × 1.6 × 80 / (1000 × 0.5) = 0.256 kg
    const r = powderEstimate({ areaM2: 1, filmUm: 80, specificGravity: 1.6, firstPassEfficiency: 0.5 });
    expectRelClose(r.powderKg, 0.256, 1e-12);
    expect(r.powderKgPerPart).toBe(r.powderKg);
    expect(r.materialUtilization).toBe(0.5);
    expect("costTotal" in r).toBe(false);
  });

  it("gives the same powder mass in metric and US working within 0.1 %", () => {
    // source: Products Finishing, "Coverage of Powder": lb = ft² / (192.3/(SG × mil) × TE)
    // 100 ft² at 2.5 mil, SG 1.4, TE 0.55 (PCI 2018 multiplies by transfer efficiency)
    const lbUs = 100 / ((192.3 / (1.4 * 2.5)) * 0.55);
    const r = powderEstimate({
      areaM2: 100 * 0.09290304,
      filmUm: 2.5 * UM_PER_MIL,
      specificGravity: 1.4,
      firstPassEfficiency: 0.55,
    });
    const lbMetric = r.powderKg / 0.45359237;
    expect(Math.abs(lbMetric - lbUs) / lbUs).toBeLessThan(0.001);
  });

  it.each([
    // the allowed ranges of PRODUCT.md, /api/calc/powder
    [{ areaM2: 0 }, "areaM2", "greater than 0"],
    [{ areaM2: -1 }, "areaM2", "greater than 0"],
    [{ filmUm: 0 }, "filmUm", "greater than 0"],
    [{ specificGravity: -1.5 }, "specificGravity", "greater than 0"],
    [{ firstPassEfficiency: 0 }, "firstPassEfficiency", "greater than 0 and at most 1"],
    [{ firstPassEfficiency: 1.01 }, "firstPassEfficiency", "greater than 0 and at most 1"],
    [{ reclaimEfficiency: -0.1 }, "reclaimEfficiency", "at least 0 and at most 1"],
    [{ reclaimEfficiency: 1.5 }, "reclaimEfficiency", "at least 0 and at most 1"],
    [{ parts: 0 }, "parts", "whole number at least 1"],
    [{ parts: 2.5 }, "parts", "whole number at least 1"],
    [{ pricePerKg: -3 }, "pricePerKg", "at least 0"],
    [{ areaM2: Number.NaN }, "areaM2", "greater than 0"],
    [{ filmUm: Number.POSITIVE_INFINITY }, "filmUm", "greater than 0"],
    [{ firstPassEfficiency: 1e-320, parts: 1e7, areaM2: 1e6 }, "firstPassEfficiency", "finite"],
  ])("rejects %o naming %s", (patch, field, text) => {
    const base = { areaM2: 1, filmUm: 60, specificGravity: 1.5, firstPassEfficiency: 0.6 };
    try {
      powderEstimate({ ...base, ...patch });
      expect.fail("expected a DomainError");
    } catch (error) {
      expect(error).toBeInstanceOf(DomainError);
      expect((error as DomainError).field).toBe(field);
      expect((error as DomainError).message).toContain(text);
    }
  });
});

describe("weigh test and film from powder mass", () => {
  it.each([
    // source: Products Finishing, "What Impacts Transfer Efficiency?" (deposited / sprayed, by weight)
    [0.3, 0.5, 0.6],
    [1.2, 3, 0.4],
    [0, 2, 0],
  ])("%d kg gained of %d kg sprayed → FPE %d", (gained, sprayed, expected) => {
    expectRelClose(firstPassEfficiencyFromWeighTest(gained, sprayed), expected, 1e-12);
  });

  it("refuses a part that gained more than was sprayed", () => {
    expect(() => firstPassEfficiencyFromWeighTest(0.6, 0.5)).toThrow(DomainError);
    expect(() => firstPassEfficiencyFromWeighTest(0.1, 0)).toThrow(/powderSprayedKg/);
  });

  it.each([
    // hand: the coverage formula solved for film, film = 1000 U m / (SG A)
    [0.18, 2, 1.5, 1, 60],
    [0.186, 2, 1.5, 0.6 / 0.62, 60],
    [1, 39.37007874015748, 1, 1, 25.4],
  ])("%d kg over %d m² at SG %d (U %d) is %d µm", (kg, area, sg, u, film) => {
    expectRelClose(
      filmFromPowderMass({ powderKg: kg, areaM2: area, specificGravity: sg, materialUtilization: u }),
      film,
      1e-12,
    );
  });
});

describe("properties (fast-check)", () => {
  const base = {
    areaM2: fc.double({ min: 1e-4, max: 1e6, noNaN: true }),
    filmUm: fc.double({ min: 1, max: 5000, noNaN: true }),
    specificGravity: fc.double({ min: 0.5, max: 20, noNaN: true }),
    firstPassEfficiency: fc.double({ min: 0.01, max: 1, noNaN: true }),
    reclaimEfficiency: fc.double({ min: 0, max: 1, noNaN: true }),
    parts: fc.integer({ min: 1, max: 10_000_000 }),
  };

  it("more film needs more powder", () => {
    fc.assert(
      fc.property(fc.record(base), fc.double({ min: 1e-6, max: 10, noNaN: true }), (input, step) => {
        const thicker = { ...input, filmUm: input.filmUm * (1 + step) };
        expect(powderEstimate(thicker).powderKg).toBeGreaterThan(powderEstimate(input).powderKg);
      }),
      propertyRuns,
    );
  });

  it("a higher first-pass efficiency needs less powder (or the same once reclaim is total)", () => {
    fc.assert(
      fc.property(fc.record(base), fc.double({ min: 1e-6, max: 1, noNaN: true }), (input, step) => {
        const better = { ...input, firstPassEfficiency: Math.min(1, input.firstPassEfficiency * (1 + step)) };
        const before = powderEstimate(input).powderKg;
        const after = powderEstimate(better).powderKg;
        // dU/dη = (1 − r) / (1 − r + rη)²: with reclaim near total the gain vanishes in rounding
        expect(after).toBeLessThanOrEqual(before * (1 + 1e-12));
        if (input.reclaimEfficiency <= 0.99 && better.firstPassEfficiency > input.firstPassEfficiency) {
          expect(after).toBeLessThan(before);
        }
      }),
      propertyRuns,
    );
  });

  it("utilisation stays within [FPE, 1] and every output is finite", () => {
    fc.assert(
      fc.property(fc.record(base), fc.double({ min: 0, max: 1e6, noNaN: true }), (input, price) => {
        const r = powderEstimate({ ...input, pricePerKg: price });
        expect(r.materialUtilization).toBeGreaterThanOrEqual(input.firstPassEfficiency * (1 - 1e-12));
        expect(r.materialUtilization).toBeLessThanOrEqual(1 + 1e-12);
        for (const v of Object.values(r)) expect(Number.isFinite(v)).toBe(true);
      }),
      propertyRuns,
    );
  });

  it("never yields NaN: any numbers either compute to finite values or raise a DomainError", () => {
    const anyNumber = fc.oneof(fc.double(), fc.integer({ min: -5, max: 5 }));
    fc.assert(
      fc.property(
        fc.record({
          areaM2: anyNumber,
          filmUm: anyNumber,
          specificGravity: anyNumber,
          firstPassEfficiency: anyNumber,
          reclaimEfficiency: anyNumber,
          parts: anyNumber,
        }),
        (input) => {
          try {
            const r = powderEstimate(input);
            for (const v of Object.values(r)) expect(Number.isFinite(v)).toBe(true);
          } catch (error) {
            expect(error).toBeInstanceOf(DomainError);
          }
        },
      ),
      propertyRuns,
    );
  });
});
