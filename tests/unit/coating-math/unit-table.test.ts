import fs from "node:fs";
import path from "node:path";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { convert as tableConvert, formatQuantity, fromDisplay } from "@/lib/coating-math/display-units";
import { convert as mathConvert } from "@/lib/coating-math/units";
import { UNIT_TABLE } from "@/lib/coating-math/unit-table.generated";
import { renderUnitTable, TABLE_UNITS } from "@/lib/coating-math/unit-table-source";

const close = (a: number, b: number) => expect(Math.abs(a - b)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(b)));

describe("the client unit table is mathjs's, and current", () => {
  it("the committed file equals what the generator writes from mathjs now", () => {
    const file = fs.readFileSync(path.resolve("lib/coating-math/unit-table.generated.ts"), "utf8");
    expect(file).toBe(renderUnitTable());
    expect(Object.keys(UNIT_TABLE)).toEqual([...TABLE_UNITS]);
  });

  // source: mathjs itself (a general-purpose reference library) — every pair of like units
  it("converts every pair of like units as mathjs does", () => {
    const pairs = TABLE_UNITS.flatMap((a) => TABLE_UNITS.filter((b) => UNIT_TABLE[a].dimension === UNIT_TABLE[b].dimension).map((b) => [a, b] as const));
    expect(pairs.length).toBeGreaterThan(60);
    fc.assert(
      fc.property(fc.constantFrom(...pairs), fc.double({ min: -1e6, max: 1e6, noNaN: true }), ([a, b], v) => {
        close(tableConvert(v, a, b), mathConvert(v, a, b));
      }),
      { numRuns: 2000, seed: 42 },
    );
  });

  it.each([
    // source: 16 CFR 500.19 and NIST SP 811 (exact factors)
    [1, "mil", "um", 25.4],
    [1, "ft^2", "m^2", 0.09290304],
    [1, "lbm", "kg", 0.45359237],
    [1, "gallon", "L", 3.785411784],
    [1, "ft", "m", 0.3048],
    [212, "degF", "degC", 100],
    [-40, "degC", "degF", -40],
    // source: NIST SP 811, 1 Btu_IT/h = 0.29307107 W (to the 8 figures printed)
    [1, "BTU/h", "W", 0.29307107],
  ])("%s %s = %s %s", (v, from, to, expected) => {
    expect(tableConvert(v as number, from as string, to as string)).toBeCloseTo(expected as number, 8);
  });

  it("refuses units it does not know and unlike units, by name", () => {
    expect(() => tableConvert(1, "furlong", "m")).toThrow(/furlong/);
    expect(() => tableConvert(1, "kg", "m")).toThrow(/kg to m/);
  });

  it("the display helpers use it: 2 mil typed by a US user is stored as 50.8 µm", () => {
    // source: 16 CFR 500.19 (1 mil = 25.4 µm)
    expect(fromDisplay("filmUm", 2, "us")).toBeCloseTo(50.8, 10);
    expect(formatQuantity("temperatureC", 200, "us")).toBe("392 °F");
  });
});
