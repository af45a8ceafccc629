import { describe, expect, it } from "vitest";
import { measuredUtilisation, runningEstimate } from "@/lib/forecast/utilisation";

describe("measuredUtilisation", () => {
  // source: Products Finishing coverage, metric m²/kg = 1000 / (SG × µm), and transfer efficiency
  // by weight ("What Impacts Transfer Efficiency?"). 50 parts × 2 m² = 100 m² at 60 µm, SG 1.5:
  // coverage 1000 / 90 = 11.11 m²/kg → 9 kg deposited. Used 15 kg → 9 / 15 = 0.60.
  // SG 1.2, 80 µm, 25 m²: 1000 / 96 = 10.417 m²/kg → 2.4 kg deposited; used 4 kg → 0.60.
  it.each([
    [100, 60, 1.5, 15, 0.6],
    [25, 80, 1.2, 4, 0.6],
    [10, 50, 1.6, 1, 0.8],
  ])("%f m² at %f µm, SG %f, %f kg used → %f", (areaM2, filmUm, specificGravity, usedKg, expected) => {
    expect(measuredUtilisation({ areaM2, filmUm, specificGravity, usedKg })).toBeCloseTo(expected, 9);
  });
  it("0 kg used is refused naming usedKg", () => {
    expect(() => measuredUtilisation({ areaM2: 1, filmUm: 60, specificGravity: 1.5, usedKg: 0 })).toThrow(/greater than 0/);
  });
});

describe("runningEstimate", () => {
  // by hand: 0.6, 0.7, 0.8 → mean 0.7; sample s.d. √((0.01 + 0 + 0.01) / 2) = 0.1. The excluded 0.1 is ignored.
  it("ignores an excluded run", () => {
    const e = runningEstimate([
      { utilisation: 0.6, excluded: false },
      { utilisation: 0.1, excluded: true },
      { utilisation: 0.7, excluded: false },
      { utilisation: 0.8, excluded: false },
    ]);
    expect(e.runs).toBe(3);
    expect(e.measured).toBeCloseTo(0.7, 9);
    expect(e.spread).toBeCloseTo(0.1, 9);
  });
  it("has no measured figure below three runs", () => {
    const e = runningEstimate([
      { utilisation: 0.6, excluded: false },
      { utilisation: 0.8, excluded: false },
      { utilisation: 0.7, excluded: true },
    ]);
    expect(e).toMatchObject({ runs: 2, measured: null });
    expect(e.mean).toBeCloseTo(0.7, 9);
  });
});
