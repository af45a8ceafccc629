import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  flattenReadings,
  fractionInSpec,
  groupReadings,
  histogram,
  implausibleReadings,
  localizeFilmText,
  parseCells,
} from "@/lib/film-checks/readings";
import { readMappedCsv } from "@/lib/film-checks/csv-mapping";
import { pa2SamplingPlan } from "@/lib/coating-math/film";
import { ft2ToM2 } from "@/lib/coating-math/units";

describe("parseCells (a pasted spreadsheet column)", () => {
  it.each([
    // common practice, no source: one reading a line, decimal comma accepted
    { text: "62\n58,5\r\n71\t70\n", system: "metric" as const, values: [62, 58.5, 71, 70], bad: [] as number[] },
    { text: "62\nabc\n-3\n6000\n", system: "metric" as const, values: [62], bad: [1, 2, 3] },
    // source: NIST SP 811 — 1 mil = 25.4 µm exactly
    { text: "2\n3.5", system: "us" as const, values: [50.8, 88.9], bad: [] },
  ])("%# $text", ({ text, system, values, bad }) => {
    const r = parseCells(text, system);
    r.valuesUm.forEach((v, i) => expect(v).toBeCloseTo(values[i], 9));
    expect(r.valuesUm).toHaveLength(values.length);
    expect(r.errors.map((e) => e.index)).toEqual(bad);
  });
});

describe("groupReadings (SSPC-PA 2: 3 readings a spot, 5 spots an area)", () => {
  it("makes two areas of 5 spots from 30 readings", () => {
    const areas = groupReadings(Array.from({ length: 30 }, (_, i) => i), 3, 5);
    expect(areas).toHaveLength(2);
    expect(areas[0]).toHaveLength(5);
    expect(areas[1][4]).toEqual([27, 28, 29]);
  });
  it("keeps order and count (invariant)", () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 5000, noNaN: true }), { maxLength: 100 }), fc.integer({ min: 1, max: 6 }), fc.integer({ min: 1, max: 6 }), (v, r, s) => {
        expect(flattenReadings(groupReadings(v, r, s))).toEqual(v);
      }),
    );
  });
});

describe("sampling plan — SSPC-PA 2 number of areas", () => {
  it.each([
    // source: SSPC-PA 2 (as quoted in REFERENCES.md): 12,500 ft² → 3 + 12 = 15 areas, 75 spots, 225 readings
    { ft2: 12_500, areas: 15, spots: 75, readings: 225 },
    // source: SSPC-PA 2: 300–1000 ft² → 3 areas
    { ft2: 800, areas: 3, spots: 15, readings: 45 },
    // source: SSPC-PA 2: under 300 ft², one area per 100 ft² or part → 250 ft² gives 3
    { ft2: 250, areas: 3, spots: 15, readings: 45 },
  ])("$ft2 ft² → $areas areas", ({ ft2, areas, spots, readings }) => {
    const plan = pa2SamplingPlan(ft2ToM2(ft2));
    expect(plan.areaCount).toBe(areas);
    expect(plan.spotCount).toBe(spots);
    expect(plan.minReadingCount).toBe(readings);
  });
});

describe("plausibility, units, CSV", () => {
  it("names implausible readings by path", () => {
    expect(implausibleReadings({ areas: [[[70, 70, 70], [70, 70, -5]]], readingsUm: [1, 5001] })).toEqual({
      "areas.0.1.2": "A thickness cannot be negative.",
      "readingsUm.1": "Above 5000 µm (5 mm): not a plausible film reading.",
    });
  });
  it("rewrites µm to mil (source: NIST SP 811, 1 mil = 25.4 µm: 45 µm = 1.77 mil, 48 µm = 1.89 mil)", () => {
    expect(localizeFilmText("spot at 45 µm below (48 µm)", "us")).toBe("spot at 1.77 mil below (1.89 mil)");
    expect(localizeFilmText("45 µm", "metric")).toBe("45 µm");
  });
  it("reads the mapped column and lists bad rows; a missing column is reported", () => {
    const rows = [["Time", "Reading"], ["10:00", "61"], ["10:01", "x"], ["", ""], ["10:02", "2,5e"]];
    const r = readMappedCsv(rows, { readingColumn: "Reading", unit: "um" });
    expect(r.valuesUm).toEqual([61]);
    expect(r.errors.map((e) => e.index)).toEqual([1, 3]);
    expect(readMappedCsv(rows, { readingColumn: "DFT", unit: "um" }).columnError).toMatch(/no column "DFT"/);
  });
  it("bins every reading once and counts in-spec inclusively (common practice, no source)", () => {
    const v = [48, 60, 75, 90, 110];
    expect(histogram(v, 60, 90).reduce((a, b) => a + b.count, 0)).toBe(5);
    expect(fractionInSpec(v, 60, 90)).toBe(3 / 5);
    expect(fractionInSpec([], 60, 90)).toBeNull();
  });
});
