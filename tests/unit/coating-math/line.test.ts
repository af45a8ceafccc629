import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { lineSpeedForDemand, lineThroughput, stageDwellMin, stageLengthForDwellM } from "@/lib/coating-math/line";
import { ftPerMinToMPerMin, ftToM, inToMm } from "@/lib/coating-math/units";
import { expectRelClose, propertyRuns } from "./expect-close";

// NIST SP 811 exact: 1 ft = 0.3048 m, 1 in = 0.0254 m.
const FT = 0.3048;
const IN = 0.0254;

describe("lineThroughput", () => {
  it.each([
    // source: REFERENCES.md worked example (derived): 10 ft/min at 24 in pitch → 300 carriers/h;
    // 200 ft of oven path → 20 min
    [10 * FT, 24 * IN, 1, 200 * FT, 300, 300, 20],
    // hand: 4 m/min, 0.5 m pitch → 480 carriers/h; 3 parts each → 1440 parts/h; 80 m / 4 = 20 min
    [4, 0.5, 3, 80, 480, 1440, 20],
    // hand: 2.5 m/min, 1.2 m pitch → 125 carriers/h; 8 parts → 1000 parts/h; 45 m / 2.5 = 18 min
    [2.5, 1.2, 8, 45, 125, 1000, 18],
  ])("%d m/min, %d m pitch, %d per carrier, %d m oven", (speed, pitch, perCarrier, oven, cph, pph, dwell) => {
    const r = lineThroughput({
      lineSpeedMPerMin: speed,
      carrierPitchM: pitch,
      partsPerCarrier: perCarrier,
      ovenPathLengthM: oven,
    });
    expectRelClose(r.carriersPerHour, cph, 1e-12);
    expectRelClose(r.partsPerHour, pph, 1e-12);
    expectRelClose(r.ovenDwellMin, dwell, 1e-12);
    expect(r.dwellMarginMin).toBeUndefined();
    expect(r.maxLineSpeedForDwellMPerMin).toBeUndefined();
  });

  it("agrees when the worked example is entered through the unit conversions", () => {
    // source: REFERENCES.md worked example, converted with mathjs
    const r = lineThroughput({
      lineSpeedMPerMin: ftPerMinToMPerMin(10),
      carrierPitchM: inToMm(24) / 1000,
      partsPerCarrier: 2,
      ovenPathLengthM: ftToM(200),
    });
    expect(Math.abs(r.carriersPerHour - 300) / 300).toBeLessThan(0.001);
    expect(Math.abs(r.ovenDwellMin - 20) / 20).toBeLessThan(0.001);
  });

  it("scales parts, not carriers, by the loaded fraction and reports the dwell margin", () => {
    // hand: 300 carriers/h × 4 parts × 0.9 = 1080 parts/h; required 25 min in a 200 ft oven →
    // max speed 200 ft / 25 min = 8 ft/min = 2.4384 m/min; margin 20 − 25 = −5 min
    const r = lineThroughput({
      lineSpeedMPerMin: 10 * FT,
      carrierPitchM: 24 * IN,
      partsPerCarrier: 4,
      ovenPathLengthM: 200 * FT,
      requiredDwellMin: 25,
      loadedFraction: 0.9,
    });
    expectRelClose(r.carriersPerHour, 300, 1e-12);
    expectRelClose(r.partsPerHour, 1080, 1e-12);
    expectRelClose(r.maxLineSpeedForDwellMPerMin ?? Number.NaN, 8 * FT, 1e-12);
    expectRelClose(r.dwellMarginMin ?? Number.NaN, -5, 1e-12);
  });

  it.each([
    ["lineSpeedMPerMin", { lineSpeedMPerMin: 0 }],
    ["carrierPitchM", { carrierPitchM: -1 }],
    ["partsPerCarrier", { partsPerCarrier: 0 }],
    ["ovenPathLengthM", { ovenPathLengthM: Number.NaN }],
    ["requiredDwellMin", { requiredDwellMin: 0 }],
    ["loadedFraction", { loadedFraction: 1.1 }],
    ["loadedFraction", { loadedFraction: 0 }],
    ["carrierPitchM", { carrierPitchM: 1e-320, lineSpeedMPerMin: 1000 }],
  ])("rejects a bad %s", (field, patch) => {
    const base = { lineSpeedMPerMin: 3, carrierPitchM: 0.6, partsPerCarrier: 2, ovenPathLengthM: 60 };
    expect(() => lineThroughput({ ...base, ...patch })).toThrow(expect.objectContaining({ name: "DomainError", field }));
  });
});

describe("stage dwell and line speed for demand", () => {
  it.each([
    // source: Metal Finishing Organic Finishing Guidebook 2012: dry-off 3–5 min at 4 ft/min
    // needs 12–20 ft of oven
    [3, 12],
    [5, 20],
  ])("%d min of dry-off at 4 ft/min needs %d ft", (dwellMin, ft) => {
    expectRelClose(stageLengthForDwellM(dwellMin, 4 * FT), ft * FT, 1e-12);
    expectRelClose(stageDwellMin(ft * FT, 4 * FT), dwellMin, 1e-12);
  });

  it.each([
    // inverse of the worked example: 1080 parts/h at 4 per carrier, 90 % loaded, 24 in pitch → 10 ft/min
    [1080, 24 * IN, 4, 0.9, 10 * FT],
    // hand: 1440 parts/h, 3 per carrier → 480 carriers/h × 0.5 m = 240 m/h = 4 m/min
    [1440, 0.5, 3, 1, 4],
  ])("%d parts/h → line speed", (pph, pitch, perCarrier, loaded, speed) => {
    expectRelClose(
      lineSpeedForDemand({ partsPerHour: pph, carrierPitchM: pitch, partsPerCarrier: perCarrier, loadedFraction: loaded }),
      speed,
      1e-12,
    );
  });

  it("lineSpeedForDemand inverts lineThroughput (fast-check)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: 1000, noNaN: true }),
        fc.double({ min: 0.01, max: 1000, noNaN: true }),
        fc.double({ min: 0.01, max: 1e5, noNaN: true }),
        fc.double({ min: 0.01, max: 1, noNaN: true }),
        (speed, pitch, perCarrier, loaded) => {
          const r = lineThroughput({
            lineSpeedMPerMin: speed,
            carrierPitchM: pitch,
            partsPerCarrier: perCarrier,
            ovenPathLengthM: 50,
            requiredDwellMin: 20,
            loadedFraction: loaded,
          });
          const back = lineSpeedForDemand({
            partsPerHour: r.partsPerHour,
            carrierPitchM: pitch,
            partsPerCarrier: perCarrier,
            loadedFraction: loaded,
          });
          expect(Math.abs(back - speed) / speed).toBeLessThan(1e-9);
          for (const v of Object.values(r)) expect(Number.isFinite(v)).toBe(true);
          // a faster line always leaves less time in the oven
          expect(lineThroughput({ lineSpeedMPerMin: speed * 1.01, carrierPitchM: pitch, partsPerCarrier: perCarrier, ovenPathLengthM: 50 }).ovenDwellMin).toBeLessThan(r.ovenDwellMin);
        },
      ),
      propertyRuns,
    );
  });
});
