import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { anodeRatioCheck, ecoatEstimate, ecoatPaintUse } from "@/lib/coating-math/ecoat";
import { DomainError } from "@/lib/coating-math/errors";
import { expectRelClose, propertyRuns } from "./expect-close";

describe("ecoatEstimate", () => {
  // Q/A = ρ · DFT / CE and I = (Q/A) · (m²/min) / 60 are derived from the definition of
  // coulombic yield (REFERENCES.md, "Electrocoat"); CE ~30 mg/C and ρ ~1.4 g/cm³ are from memory.
  it.each([
    // hand: 1 m² × 20 µm = 20 cm³; × 1.4 g/cm³ = 28 g; 28 000 mg / 30 mg/C = 933.33 C
    [1, 20, 1.4, 30, 0.028, 933.3333333333334],
    // hand: 2.5 m² × 25 µm = 62.5 cm³; × 1.3 = 81.25 g; / 35 mg/C = 2321.43 C
    [2.5, 25, 1.3, 35, 0.08125, 2321.4285714285716],
    // hand: 0.4 m² × 15 µm = 6 cm³; × 1.5 = 9 g; / 25 = 360 C
    [0.4, 15, 1.5, 25, 0.009, 360],
  ])("%d m² at %d µm, %d g/cm³, %d mg/C → %d kg, %d C", (areaM2, filmUm, rho, ce, kg, coulombs) => {
    const r = ecoatEstimate({ areaM2, filmUm, filmDensityGPerCm3: rho, coulombicYieldMgPerC: ce });
    expectRelClose(r.depositedSolidsKg, kg, 1e-12);
    expectRelClose(r.chargeC, coulombs, 1e-12);
    expectRelClose(r.chargePerAreaCPerM2, coulombs / areaM2, 1e-12);
    expect(r.averageCurrentA).toBeUndefined();
  });

  it("gives the average rectifier current from the coating rate", () => {
    // hand: 120 parts/h of 1 m² = 2 m²/min; I = 933.33 C/m² × 2 m²/min / 60 s/min = 31.11 A;
    // solids 0.028 kg × 120 = 3.36 kg/h
    const r = ecoatEstimate({
      areaM2: 1,
      filmUm: 20,
      filmDensityGPerCm3: 1.4,
      coulombicYieldMgPerC: 30,
      parts: 10,
      partsPerHour: 120,
    });
    expectRelClose(r.averageCurrentA ?? Number.NaN, (933.3333333333334 * 2) / 60, 1e-12);
    expectRelClose(r.solidsKgPerHour ?? Number.NaN, 3.36, 1e-12);
    expectRelClose(r.depositedSolidsKg, 0.28, 1e-12);
    expectRelClose(r.chargeC, 9333.333333333334, 1e-12);
    expectRelClose(r.depositedSolidsKgPerPart, 0.028, 1e-12);
  });

  it.each([
    ["areaM2", { areaM2: 0 }],
    ["filmUm", { filmUm: -5 }],
    ["filmDensityGPerCm3", { filmDensityGPerCm3: 0 }],
    ["coulombicYieldMgPerC", { coulombicYieldMgPerC: Number.NaN }],
    ["parts", { parts: 0.5 }],
    ["partsPerHour", { partsPerHour: 0 }],
    ["coulombicYieldMgPerC", { coulombicYieldMgPerC: 1e-320, areaM2: 1e6, parts: 1e7 }],
  ])("rejects a bad %s", (field, patch) => {
    const base = { areaM2: 1, filmUm: 20, filmDensityGPerCm3: 1.4, coulombicYieldMgPerC: 30 };
    expect(() => ecoatEstimate({ ...base, ...patch })).toThrow(
      expect.objectContaining({ name: "DomainError", field }),
    );
  });

  it("scales linearly with film build and never yields NaN (fast-check)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-3, max: 1e6, noNaN: true }),
        fc.double({ min: 1, max: 5000, noNaN: true }),
        fc.double({ min: 0.5, max: 20, noNaN: true }),
        fc.double({ min: 1, max: 1000, noNaN: true }),
        fc.double({ min: 1, max: 1e6, noNaN: true }),
        (areaM2, filmUm, rho, ce, partsPerHour) => {
          const one = ecoatEstimate({ areaM2, filmUm, filmDensityGPerCm3: rho, coulombicYieldMgPerC: ce, partsPerHour });
          const two = ecoatEstimate({ areaM2, filmUm: filmUm * 2, filmDensityGPerCm3: rho, coulombicYieldMgPerC: ce });
          expect(Math.abs(two.chargeC / one.chargeC - 2)).toBeLessThan(1e-12);
          for (const v of Object.values(one)) expect(Number.isFinite(v)).toBe(true);
        },
      ),
      propertyRuns,
    );
  });
});

describe("ecoatPaintUse", () => {
  // source: Products Finishing, "Estimating the Electrocoat Usage of a Part":
  // US gal/ft² = 144 · DFT(in) / (231 · VS) — 144 in² per ft², 231 in³ per US gallon
  const productsFinishingGalPerFt2 = (filmUm: number, vs: number) => (144 * (filmUm / 25_400)) / (231 * vs);

  it.each([
    [25.4, 1],
    [20, 1],
    [25, 0.5],
    [18, 0.2],
    [35, 0.15],
  ])("%d µm at volume solids %d matches the trade formula", (filmUm, vs) => {
    const r = ecoatPaintUse({ areaM2: 1, filmUm, volumeSolidsFraction: vs });
    expectRelClose(r.paintUsGalPerFt2, productsFinishingGalPerFt2(filmUm, vs), 1e-12);
  });

  it("1 mil of solids over 1 ft² is 144/231 thousandths of a gallon", () => {
    // source: Products Finishing (as above): 144 × 0.001 / 231 = 0.00062338 gal/ft²
    const r = ecoatPaintUse({ areaM2: 1, filmUm: 25.4, volumeSolidsFraction: 1 });
    expectRelClose(r.paintUsGalPerFt2, 0.144 / 231, 1e-12);
  });

  it("gives litres: 20 µm over 10 m² at 50 % volume solids is 0.4 L", () => {
    // hand: 20 µm × 10 m² = 200 cm³ of film = 0.2 L of solids; / 0.5 = 0.4 L of paint
    const r = ecoatPaintUse({ areaM2: 10, filmUm: 20, volumeSolidsFraction: 0.5 });
    expectRelClose(r.paintL, 0.4, 1e-12);
    expectRelClose(r.paintLPerM2, 0.04, 1e-12);
  });

  it("stays below a plant's measured use, which includes losses", () => {
    // source: Products Finishing (as above) reports a plant average of 0.00155 gal/ft²; a
    // low-film e-coat of 20 µm (Products Finishing, "Film Thickness Options") needs less in theory
    const r = ecoatPaintUse({ areaM2: 1, filmUm: 20, volumeSolidsFraction: 1 });
    expect(r.paintUsGalPerFt2).toBeLessThan(0.00155);
  });

  it("rejects volume solids outside (0, 1]", () => {
    expect(() => ecoatPaintUse({ areaM2: 1, filmUm: 20, volumeSolidsFraction: 0 })).toThrow(DomainError);
    expect(() => ecoatPaintUse({ areaM2: 1, filmUm: 20, volumeSolidsFraction: 1.2 })).toThrow(
      /greater than 0 and at most 1/,
    );
  });
});

describe("anodeRatioCheck", () => {
  it.each([
    // source: Products Finishing Q&A, June 2014 — part (cathode) to anode area at most 4 : 1
    [40, 10, 4, true, 10],
    [40, 8, 5, false, 10],
    [30, 10, 3, true, 7.5],
    [12, 2.5, 4.8, false, 3],
    // 4 : 1 built in floating point still counts as inside the limit
    [0.4 * 3, 0.3, 4, true, 0.3],
  ])("cathode %d m², anode %d m² → %d : 1 ok=%s", (cathode, anode, ratio, ok, minAnode) => {
    const r = anodeRatioCheck(cathode, anode);
    expectRelClose(r.ratio, ratio, 1e-12);
    expect(r.ok).toBe(ok);
    expectRelClose(r.minAnodeAreaM2, minAnode, 1e-12);
    expect(r.message).toMatch(ok ? /within the 4 : 1 limit/ : /exceeds 4 : 1/);
  });

  it("rejects zero anode area", () => {
    expect(() => anodeRatioCheck(10, 0)).toThrow(expect.objectContaining({ field: "anodeAreaM2" }));
  });
});
