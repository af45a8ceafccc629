import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { z } from "zod";
import { cureHeatUp } from "@/lib/coating-math/cure";
import { ecoatEstimate } from "@/lib/coating-math/ecoat";
import { evaluateFilm } from "@/lib/coating-math/film";
import { lineThroughput } from "@/lib/coating-math/line";
import { powderEstimate } from "@/lib/coating-math/powder";
import {
  cureInputSchema,
  ecoatInputSchema,
  filmInputSchema,
  lineInputSchema,
  powderInputSchema,
} from "@/lib/validation/calc";
import { propertyRuns } from "./expect-close";

// Field names and ranges: PRODUCT.md, "Calculation API".
const powder = { areaM2: 2, filmUm: 60, specificGravity: 1.5, firstPassEfficiency: 0.6 };
const ecoat = { areaM2: 1, filmUm: 20, filmDensityGPerCm3: 1.4, coulombicYieldMgPerC: 30 };
const line = { lineSpeedMPerMin: 3, carrierPitchM: 0.6, partsPerCarrier: 2, ovenPathLengthM: 60 };
const cure = {
  thicknessMm: 3,
  airTempC: 210,
  startTempC: 20,
  targetMetalTempC: 190,
  holdMin: 10,
  heatTransferCoefficientWPerM2K: 30,
};
const pa2 = { rule: "sspc-pa2", specMinUm: 60, specMaxUm: 100, areas: [[[70, 72, 74]]] };
const iso = { rule: "iso19840", specMinUm: 80, specMaxUm: 300, nominalUm: 100, readingsUm: [100, 110] };

function issuesOf(schema: z.ZodType, body: unknown) {
  const result = schema.safeParse(body);
  expect(result.success).toBe(false);
  return result.error?.issues ?? [];
}

describe("calculator input schemas accept good bodies and fill defaults", () => {
  it("powder: reclaim 0 and one part by default", () => {
    expect(powderInputSchema.parse(powder)).toEqual({ ...powder, reclaimEfficiency: 0, parts: 1 });
  });

  it("cure: steel properties by default (ρ 7850, c 490, k 50)", () => {
    expect(cureInputSchema.parse(cure)).toMatchObject({
      densityKgPerM3: 7850,
      specificHeatJPerKgK: 490,
      thermalConductivityWPerMK: 50,
    });
  });

  it("line: fully loaded by default; ecoat: one part", () => {
    expect(lineInputSchema.parse(line).loadedFraction).toBe(1);
    expect(ecoatInputSchema.parse(ecoat).parts).toBe(1);
  });

  it("parsed bodies go straight into the calculations", () => {
    expect(powderEstimate(powderInputSchema.parse(powder)).powderKg).toBeGreaterThan(0);
    expect(ecoatEstimate(ecoatInputSchema.parse(ecoat)).chargeC).toBeGreaterThan(0);
    expect(lineThroughput(lineInputSchema.parse(line)).ovenDwellMin).toBe(20);
    expect(cureHeatUp(cureInputSchema.parse(cure)).heatUpMin).toBeGreaterThan(0);
    expect(evaluateFilm(filmInputSchema.parse(pa2)).pass).toBe(true);
    expect(evaluateFilm(filmInputSchema.parse(iso)).pass).toBe(true);
  });
});

describe("bad bodies yield an issue whose path names the field", () => {
  it.each([
    { name: "powder", path: "firstPassEfficiency", schema: powderInputSchema, body: { ...powder, firstPassEfficiency: 1.2 }, text: "must be greater than 0 and at most 1" },
    { name: "powder", path: "firstPassEfficiency", schema: powderInputSchema, body: { ...powder, firstPassEfficiency: 0 }, text: "must be greater than 0 and at most 1" },
    { name: "powder", path: "reclaimEfficiency", schema: powderInputSchema, body: { ...powder, reclaimEfficiency: -0.1 }, text: "must be at least 0 and at most 1" },
    { name: "powder", path: "parts", schema: powderInputSchema, body: { ...powder, parts: 1.5 }, text: "must be a whole number at least 1" },
    { name: "powder", path: "areaM2", schema: powderInputSchema, body: { ...powder, areaM2: 2e6 }, text: "at most 1000000" },
    { name: "powder", path: "filmUm", schema: powderInputSchema, body: { ...powder, filmUm: "60" }, text: "must be greater than 0 and at most 5000" },
    { name: "powder", path: "specificGravity", schema: powderInputSchema, body: { ...powder, specificGravity: Number.NaN }, text: "greater than 0" },
    { name: "powder", path: "pricePerKg", schema: powderInputSchema, body: { ...powder, pricePerKg: -1 }, text: "at least 0" },
    { name: "powder", path: "areaM2", schema: powderInputSchema, body: { filmUm: 60, specificGravity: 1.5, firstPassEfficiency: 0.6 }, text: "is required" },
    { name: "ecoat", path: "coulombicYieldMgPerC", schema: ecoatInputSchema, body: { ...ecoat, coulombicYieldMgPerC: 0 }, text: "greater than 0" },
    { name: "ecoat", path: "partsPerHour", schema: ecoatInputSchema, body: { ...ecoat, partsPerHour: -5 }, text: "greater than 0" },
    { name: "line", path: "loadedFraction", schema: lineInputSchema, body: { ...line, loadedFraction: 1.5 }, text: "must be greater than 0 and at most 1" },
    { name: "line", path: "lineSpeedMPerMin", schema: lineInputSchema, body: { ...line, lineSpeedMPerMin: 0 }, text: "greater than 0" },
    { name: "line", path: "requiredDwellMin", schema: lineInputSchema, body: { ...line, requiredDwellMin: 0 }, text: "greater than 0" },
    { name: "cure", path: "targetMetalTempC", schema: cureInputSchema, body: { ...cure, targetMetalTempC: 210 }, text: "below the oven air temperature" },
    { name: "cure", path: "targetMetalTempC", schema: cureInputSchema, body: { ...cure, targetMetalTempC: 230 }, text: "below the oven air temperature" },
    { name: "cure", path: "thicknessMm", schema: cureInputSchema, body: { ...cure, thicknessMm: 0 }, text: "greater than 0" },
    { name: "cure", path: "airTempC", schema: cureInputSchema, body: { ...cure, airTempC: 2000 }, text: "at most 1000" },
    { name: "film", path: "areas.0.1", schema: filmInputSchema, body: { ...pa2, areas: [[[70, 72, 74], [70, 71]]] }, text: "at least 3 gauge readings" },
    { name: "film", path: "areas", schema: filmInputSchema, body: { ...pa2, areas: [] }, text: "at least 1 area" },
    { name: "film", path: "areas.0.0.1", schema: filmInputSchema, body: { ...pa2, areas: [[[70, -1, 72]]] }, text: "at least 0" },
    { name: "film", path: "specMinUm", schema: filmInputSchema, body: { ...pa2, specMinUm: 120 }, text: "at most specMaxUm" },
    { name: "film", path: "readingsUm", schema: filmInputSchema, body: { rule: "iso19840", specMinUm: 80, specMaxUm: 300, nominalUm: 100 }, text: "is required" },
    { name: "film", path: "readingsUm", schema: filmInputSchema, body: { ...iso, readingsUm: "100 110" }, text: "must be a list of gauge readings" },
    { name: "film", path: "nominalUm", schema: filmInputSchema, body: { ...iso, nominalUm: 400 }, text: "at most specMaxUm" },
    { name: "film", path: "readingsUm", schema: filmInputSchema, body: { ...iso, readingsUm: new Array(10_001).fill(100) }, text: "at most 10000" },
    { name: "film", path: "rule", schema: filmInputSchema, body: { ...pa2, rule: "astm-d7091" }, text: "sspc-pa2" },
    { name: "film", path: "rule", schema: filmInputSchema, body: { specMinUm: 60, specMaxUm: 100, areas: [[[70, 72, 74]]] }, text: "" },
  ])("$name: issue at $path says \"$text\"", ({ schema, body, path, text }) => {
    const issues = issuesOf(schema, body);
    const hit = issues.find((i) => i.path.join(".") === path);
    expect(hit, JSON.stringify(issues)).toBeDefined();
    expect(hit?.message).toContain(text);
  });

  it.each([
    { name: "powder", key: "colour", schema: powderInputSchema, body: { ...powder, colour: "black" } },
    { name: "line", key: "speed", schema: lineInputSchema, body: { ...line, speed: 3 } },
    { name: "film/iso", key: "areas", schema: filmInputSchema, body: { ...iso, areas: [] } },
    { name: "cure", key: "dwell", schema: cureInputSchema, body: { ...cure, dwell: 20 } },
    { name: "ecoat", key: "voltage", schema: ecoatInputSchema, body: { ...ecoat, voltage: 250 } },
  ])("$name rejects the unknown field $key and names it", ({ schema, body, key }) => {
    const issues = issuesOf(schema, body);
    const hit = issues.find((i) => i.code === "unrecognized_keys");
    expect(hit?.message).toContain(key);
  });

  it("caps the total gauge readings of an SSPC-PA 2 body at 10,000", () => {
    const spot = [70, 70, 70, 70, 70, 70, 70, 70, 70, 70];
    const area = new Array(50).fill(spot); // 500 readings per area
    const issues = issuesOf(filmInputSchema, { ...pa2, areas: new Array(21).fill(area) }); // 10,500
    expect(issues.map((i) => i.path.join("."))).toContain("areas");
  });
});

describe("schema-valid bodies always compute (fast-check)", () => {
  it("powder and line bodies in realistic ranges yield finite numbers", () => {
    fc.assert(
      fc.property(
        fc.record({
          areaM2: fc.double({ min: 1e-3, max: 1e6, noNaN: true }),
          filmUm: fc.double({ min: 1, max: 5000, noNaN: true }),
          specificGravity: fc.double({ min: 0.5, max: 20, noNaN: true }),
          firstPassEfficiency: fc.double({ min: 1e-3, max: 1, noNaN: true }),
          reclaimEfficiency: fc.double({ min: 0, max: 1, noNaN: true }),
          parts: fc.integer({ min: 1, max: 10_000_000 }),
        }),
        (body) => {
          const parsed = powderInputSchema.parse(body);
          for (const v of Object.values(powderEstimate(parsed))) expect(Number.isFinite(v)).toBe(true);
        },
      ),
      propertyRuns,
    );
  });
});
