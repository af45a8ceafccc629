import { describe, expect, it } from "vitest";
import { costPerPart, runLineTimeMin } from "@/lib/coating-math/cost";
import { expectRelClose } from "./expect-close";

describe("costPerPart", () => {
  it.each([
    // common practice, no source; hand: line 240/h × 1.5 h = 360 over 600 parts = 0.60;
    // set-up 60 / 600 = 0.10; total 1.20 + 0.60 + 0.10 = 1.90; run 1140
    [{ materialCostPerPart: 1.2, lineTimeMin: 90, partsInRun: 600, lineRatePerHour: 240, setupCost: 60 }, 0.6, 0.1, 1.9, 1140],
    // hand: 180/h × 20 min = 60 over 1 part; no set-up → 0.35 + 60 = 60.35
    [{ materialCostPerPart: 0.35, lineTimeMin: 20, partsInRun: 1, lineRatePerHour: 180 }, 60, 0, 60.35, 60.35],
  ])("%o", (input, line, setup, total, run) => {
    const r = costPerPart(input);
    expectRelClose(r.lineCostPerPart, line, 1e-12);
    expect(Math.abs(r.setupCostPerPart - setup)).toBeLessThan(1e-12);
    expectRelClose(r.totalPerPart, total, 1e-12);
    expectRelClose(r.runTotal, run, 1e-12);
  });

  it.each([
    ["partsInRun", { partsInRun: 0 }],
    ["partsInRun", { partsInRun: 2.5 }],
    ["lineTimeMin", { lineTimeMin: -1 }],
    ["materialCostPerPart", { materialCostPerPart: Number.NaN }],
  ])("rejects a bad %s", (field, patch) => {
    const base = { materialCostPerPart: 1, lineTimeMin: 60, partsInRun: 10, lineRatePerHour: 100 };
    expect(() => costPerPart({ ...base, ...patch })).toThrow(expect.objectContaining({ field }));
  });
});

describe("runLineTimeMin", () => {
  it.each([
    // REFERENCES.md worked example (derived): 300 carriers at 24 in pitch and 10 ft/min pass in
    // 60 min; the last one then needs 200 ft / 10 ft/min = 20 min more; plus a 15 min colour change
    [300, 0.6096, 3.048, 60.96, 15, 95],
    [300, 0.6096, 3.048, 0, 0, 60],
    [0, 0.6096, 3.048, 60.96, 0, 20],
  ])("%d carriers → %d min", (carriers, pitch, speed, lineLengthM, colourChangeMin, minutes) => {
    expectRelClose(
      runLineTimeMin({ carriers, carrierPitchM: pitch, lineSpeedMPerMin: speed, lineLengthM, colourChangeMin }),
      minutes,
      1e-12,
    );
  });
});
