import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { DomainError } from "../../../lib/coating-math/errors";
import { planRun, type PlanCoatInput, type PlanRunInput } from "../../../lib/runs/plan-run";
import { utilisationText } from "../../../components/runs/plan-summary";
import { benchEnd, ecoat, greenPowder, line1 } from "./fixtures";

// 100 parts of 1 m² outside each (1.1 m² less 0.1 m² masked): 100 m² of powder surface.
const part = { ...benchEnd, areaM2: 1.1, maskedAreaM2: 0.1 };
const powder = { ...greenPowder, specificGravity: 1.5 };

const run = (coat: Partial<PlanCoatInput> = {}): PlanRunInput => ({
  part,
  quantity: 100,
  line: line1,
  racking: { clearanceMm: 0, orientations: "upright" },
  coats: [{ coating: powder, filmUm: 60, firstPassEfficiency: 0.5, reclaimEfficiency: 0.8, ...coat }],
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

// Hand working. Coverage: 1000 / (SG 1.5 × 60 µm) = 11.11 m²/kg (Products Finishing, "Coverage of
// Powder", metric form; REFERENCES.md's own example), so 100 m² carries 100 / 11.11 = 9 kg deposited.
const DEPOSITED_KG = 9;
// Nominal: U = η / (1 − r(1 − η)) = 0.5 / (1 − 0.8 × 0.5) = 5/6 (derived, REFERENCES.md powder);
// powder sprayed = 9 kg ÷ 5/6 = 10.8 kg.
const NOMINAL_U = 5 / 6;
const NOMINAL_KG = 10.8;

describe("powder coat planned with the measured utilisation", () => {
  it.each([
    // measured utilisation, kg sprayed = deposited ÷ utilisation (transfer efficiency by weight,
    // Products Finishing, "What Impacts Transfer Efficiency?"), worked by hand
    [0.6, 15],
    [0.75, 12],
    [0.9, 10],
    [1, 9],
  ])("at %f measured, 9 kg deposited needs %f kg sprayed", (u, kg) => {
    const c = planRun(run({ measuredUtilization: u, measuredRuns: 3 })).coats[0];
    expect(c.materialKg).toBeCloseTo(kg, 9);
    expect(c.materialKgPerPart).toBeCloseTo(kg / 100, 11);
    expect(c).toMatchObject({ utilizationUsed: "measured", measuredUtilization: u, measuredRuns: 3, materialUtilization: u });
    expect(c.nominalUtilization).toBeCloseTo(NOMINAL_U, 12);
    // price 9.4 per kg from the fixture
    expect(c.materialCost).toBeCloseTo(kg * 9.4, 9);
  });

  it("15 kg at 0.6 measured fills one 25 kg box; the run's material is that coat's", () => {
    const plan = planRun(run({ measuredUtilization: 0.6, measuredRuns: 4 }));
    expect(plan.coats[0].containers).toBe(1);
    expect(plan.materialKg).toBeCloseTo(15, 9);
    expect(plan.coats[0].measuredRuns).toBe(4);
  });

  it.each([[undefined], [null]])("with no measured figure (%s) it keeps the nominal 10.8 kg", (m) => {
    const c = planRun(run({ measuredUtilization: m })).coats[0];
    expect(c.materialKg).toBeCloseTo(NOMINAL_KG, 9);
    expect(c.materialUtilization).toBeCloseTo(NOMINAL_U, 12);
    expect(c.nominalUtilization).toBeCloseTo(NOMINAL_U, 12);
    expect(c).toMatchObject({ utilizationUsed: "nominal", measuredUtilization: null, measuredRuns: null });
  });

  it.each([[0], [-0.1], [1.2], [Number.NaN]])("refuses a measured utilisation of %f, naming the coat's field", (u) => {
    expect(fieldOf(() => planRun(run({ measuredUtilization: u })))).toBe("coats.0.measuredUtilization");
  });

  it("still needs the first-pass efficiency, for the nominal figure shown beside it", () => {
    expect(fieldOf(() => planRun(run({ firstPassEfficiency: null, measuredUtilization: 0.6 })))).toBe("coats.0.firstPassEfficiency");
  });

  it("leaves an e-coat coat on its theoretical use", () => {
    const input = run();
    const plan = planRun({ ...input, coats: [{ coating: ecoat, filmUm: 20, measuredUtilization: 0.6 }, ...input.coats] });
    expect(plan.coats[0]).toMatchObject({ utilizationUsed: "nominal", nominalUtilization: null, measuredUtilization: null, materialUtilization: null });
  });

  it("sprayed × measured utilisation is always the 9 kg deposited", () => {
    // definition of utilisation (deposited ÷ sprayed, by weight), for any measured figure in (0, 1]
    fc.assert(
      fc.property(fc.double({ min: 0.05, max: 1, noNaN: true }), (u) => {
        const c = planRun(run({ measuredUtilization: u })).coats[0];
        expect(c.materialKg * u).toBeCloseTo(DEPOSITED_KG, 9);
      }),
    );
  });
});

describe("utilisation beside the powder material", () => {
  // wording of the run screen (issue 9); percentages by hand
  it.each([
    [{ measuredUtilization: 0.65, measuredRuns: 3, firstPassEfficiency: 0.55, reclaimEfficiency: 0 }, "utilisation: measured 65 % (3 runs) · nominal 55 %"],
    [{ firstPassEfficiency: 0.55, reclaimEfficiency: 0 }, "utilisation: nominal 55 %"],
  ])("%o → %s", (coat, text) => {
    expect(utilisationText(planRun(run(coat)).coats[0])).toBe(text);
  });
});
