import fc from "fast-check";
import { describe, expect, it } from "vitest";
import type { z } from "zod";
import {
  CURE_INPUT,
  cureInputIssues,
  ECOAT_INPUT,
  filmInputIssues,
  finiteResult,
  LINE_INPUT,
  numberIssues,
  POWDER_INPUT,
  resultBlame,
  withDefaults,
  type FilmReadingsInput,
  type InputIssue,
  type NumberRules,
} from "@/lib/coating-math/calc-inputs";
import { DomainError } from "@/lib/coating-math/errors";
import { cureInputSchema, ecoatInputSchema, filmInputSchema, lineInputSchema, powderInputSchema } from "@/lib/validation/calc";
import { fieldMessages, rangeText } from "@/components/calculators/use-unit-fields";
import { propertyRuns } from "./expect-close";

/*
 * The calculators page checks its inputs with the plain rules of lib/coating-math/calc-inputs.ts
 * (no zod in the browser); the API checks the same bodies with the zod schemas built from those
 * rules. Both must find the same problems, at the same paths, with the same messages.
 * Field names and ranges: PRODUCT.md, "Calculation API" (reference: the API's own zod schemas).
 */

type Body = Record<string, unknown>;

function zodIssues(schema: z.ZodType, body: unknown): [string, string][] {
  const r = schema.safeParse(body);
  return r.success ? [] : r.error.issues.map((i) => [i.path.join("."), i.message]);
}

const plain = (issues: InputIssue[]): [string, string][] => issues.map((i) => [i.path.join("."), i.message]);

// Valid bodies from the worked examples used elsewhere (REFERENCES.md): SG 1.5 at 60 µm,
// 10 ft/min ≈ 3 m/min at 0.6 m pitch, a 3 mm plate in a 210 °C oven.
const powder: Body = { areaM2: 2, filmUm: 60, specificGravity: 1.5, firstPassEfficiency: 0.6 };
const ecoat: Body = { areaM2: 1, filmUm: 20, filmDensityGPerCm3: 1.4, coulombicYieldMgPerC: 30 };
const line: Body = { lineSpeedMPerMin: 3, carrierPitchM: 0.6, partsPerCarrier: 2, ovenPathLengthM: 60 };
const cure: Body = { thicknessMm: 3, airTempC: 210, startTempC: 20, targetMetalTempC: 190, holdMin: 10, heatTransferCoefficientWPerM2K: 30 };

describe("browser checks and API schemas agree on single bad fields", () => {
  it.each([
    { name: "powder FPE above 1", rules: POWDER_INPUT, schema: powderInputSchema, body: { ...powder, firstPassEfficiency: 1.2 } },
    { name: "powder FPE 0", rules: POWDER_INPUT, schema: powderInputSchema, body: { ...powder, firstPassEfficiency: 0 } },
    { name: "powder parts 1.5", rules: POWDER_INPUT, schema: powderInputSchema, body: { ...powder, parts: 1.5 } },
    { name: "powder area missing", rules: POWDER_INPUT, schema: powderInputSchema, body: { ...powder, areaM2: undefined } },
    { name: "powder film as text", rules: POWDER_INPUT, schema: powderInputSchema, body: { ...powder, filmUm: "60" } },
    { name: "powder SG NaN", rules: POWDER_INPUT, schema: powderInputSchema, body: { ...powder, specificGravity: Number.NaN } },
    { name: "powder price Infinity", rules: POWDER_INPUT, schema: powderInputSchema, body: { ...powder, pricePerKg: Number.POSITIVE_INFINITY } },
    { name: "ecoat yield 0", rules: ECOAT_INPUT, schema: ecoatInputSchema, body: { ...ecoat, coulombicYieldMgPerC: 0 } },
    { name: "line loaded 150 %", rules: LINE_INPUT, schema: lineInputSchema, body: { ...line, loadedFraction: 1.5 } },
    { name: "cure air 2000 °C", rules: CURE_INPUT, schema: cureInputSchema, body: { ...cure, airTempC: 2000 } },
  ])("$name", ({ rules, schema, body }) => {
    const hand = schema === cureInputSchema ? cureInputIssues(body) : numberIssues(rules as NumberRules, body);
    expect(plain(hand)).toEqual(zodIssues(schema, body));
    expect(hand).toHaveLength(1);
  });

  it.each([
    // target at the air temperature: metal never reaches it (Çengel, Heat Transfer, ch. 4 — lumped model)
    { name: "target = air", body: { ...cure, targetMetalTempC: 210 }, paths: ["targetMetalTempC"] },
    { name: "target above air, hold out of range", body: { ...cure, targetMetalTempC: 230, holdMin: -1 }, paths: ["holdMin", "targetMetalTempC"] },
    // a missing value stops the rule between fields, as zod's refinements stop
    { name: "target above air, hold missing", body: { ...cure, targetMetalTempC: 230, holdMin: undefined }, paths: ["holdMin"] },
  ])("cure: $name", ({ body, paths }) => {
    const hand = cureInputIssues(body);
    expect(plain(hand)).toEqual(zodIssues(cureInputSchema, body));
    expect(hand.map((i) => i.path.join("."))).toEqual(paths);
  });
});

/** A number field's value: blank, in or out of range, not whole, not finite, or text. */
const fieldValue = fc.oneof(
  fc.constant(undefined),
  fc.double({ min: -1e7, max: 1e7, noNaN: true }),
  fc.integer({ min: -5, max: 2e7 }),
  fc.constantFrom(0, 1, 0.5, 1.5, 20, 1000, 1001, 5000, 5001, -50, -51, 1e6, 1e6 + 1, Number.NaN, Number.POSITIVE_INFINITY),
  fc.constantFrom("", "abc", "60"),
);

function bodyOf(rules: NumberRules) {
  return fc.record(Object.fromEntries(Object.keys(rules).map((k) => [k, fieldValue])) as Record<string, typeof fieldValue>);
}

describe("browser checks and API schemas agree on any body (fast-check)", () => {
  it.each([
    { name: "powder", rules: POWDER_INPUT, schema: powderInputSchema, check: (b: Body) => numberIssues(POWDER_INPUT, b) },
    { name: "ecoat", rules: ECOAT_INPUT, schema: ecoatInputSchema, check: (b: Body) => numberIssues(ECOAT_INPUT, b) },
    { name: "line", rules: LINE_INPUT, schema: lineInputSchema, check: (b: Body) => numberIssues(LINE_INPUT, b) },
    { name: "cure", rules: CURE_INPUT, schema: cureInputSchema, check: cureInputIssues },
  ])("$name: same paths and messages", ({ rules, schema, check }) => {
    fc.assert(
      fc.property(bodyOf(rules), (raw) => {
        // the page sends blank fields as absent keys
        const body = Object.fromEntries(Object.entries(raw).filter(([, v]) => v !== undefined));
        expect(plain(check(body))).toEqual(zodIssues(schema, body));
      }),
      propertyRuns,
    );
  });

  it("valid bodies: the defaults filled in are the schema's", () => {
    fc.assert(
      fc.property(bodyOf(CURE_INPUT), (raw) => {
        const body = Object.fromEntries(Object.entries(raw).filter(([, v]) => v !== undefined));
        const parsed = cureInputSchema.safeParse(body);
        if (!parsed.success) return;
        expect(withDefaults(CURE_INPUT, body)).toEqual(parsed.data);
      }),
      propertyRuns,
    );
    expect(withDefaults(POWDER_INPUT, powder)).toEqual(powderInputSchema.parse(powder));
    expect(withDefaults(LINE_INPUT, line)).toEqual(lineInputSchema.parse(line));
  });

  const reading = fc.oneof(fc.double({ min: 0, max: 200, noNaN: true }), fc.constantFrom(-1, 50_000, 50_001));
  const spec = fc.oneof(fc.constant(undefined), fc.double({ min: -10, max: 6000, noNaN: true }), fc.constantFrom(60, 90, "x"));

  it("film, SSPC-PA 2: same paths and messages for spots, areas and the spec", () => {
    fc.assert(
      fc.property(
        spec,
        spec,
        fc.array(fc.array(fc.array(reading, { maxLength: 5 }), { maxLength: 3 }), { maxLength: 3 }),
        (specMinUm, specMaxUm, areas) => {
          const body = { rule: "sspc-pa2", specMinUm, specMaxUm, areas } as FilmReadingsInput;
          expect(plain(filmInputIssues(body))).toEqual(zodIssues(filmInputSchema, JSON.parse(JSON.stringify(body))));
        },
      ),
      propertyRuns,
    );
  });

  it("film, ISO 19840: same paths and messages for readings, nominal and the spec", () => {
    fc.assert(
      fc.property(spec, spec, spec, fc.array(reading, { maxLength: 6 }), (specMinUm, specMaxUm, nominalUm, readingsUm) => {
        const body = { rule: "iso19840", specMinUm, specMaxUm, nominalUm, readingsUm } as FilmReadingsInput;
        expect(plain(filmInputIssues(body))).toEqual(zodIssues(filmInputSchema, JSON.parse(JSON.stringify(body))));
      }),
      propertyRuns,
    );
  });

  it("film: more than 10,000 readings in all is refused at areas (PRODUCT.md limit)", () => {
    const spot = new Array(10).fill(70);
    const body: FilmReadingsInput = { rule: "sspc-pa2", specMinUm: 60, specMaxUm: 100, areas: new Array(21).fill(new Array(50).fill(spot)) };
    expect(plain(filmInputIssues(body))).toEqual(zodIssues(filmInputSchema, body));
    expect(plain(filmInputIssues(body))).toContainEqual(["areas", "at most 10000 gauge readings in all"]);
  });
});

describe("results that are not finite name the input at fault", () => {
  it.each([
    { output: "powderKg", blame: resultBlame.powder, field: "firstPassEfficiency", result: { powderKg: Number.POSITIVE_INFINITY } },
    { output: "carriersPerHour", blame: resultBlame.line, field: "carrierPitchM", result: { carriersPerHour: Number.NaN } },
    { output: "spotsUm", blame: resultBlame.film, field: "areas", result: { pass: true, spotsUm: [[70, Number.NaN]] } },
  ])("$output → $field", ({ blame, field, result, output }) => {
    // common practice, no source: an overflow is reported on the input, never shown as NaN
    let thrown: unknown;
    try {
      finiteResult(result, blame);
    } catch (e) {
      thrown = e;
    }
    expect(thrown).toBeInstanceOf(DomainError);
    expect((thrown as DomainError).field).toBe(field);
    expect((thrown as DomainError).message).toContain(`the ${output} cannot be computed as a finite number`);
  });

  it("finite results pass through unchanged", () => {
    const r = { powderKg: 1.5, warnings: ["x"], spotsUm: [[70, 72]] };
    expect(finiteResult(r, resultBlame.powder)).toBe(r);
  });
});

describe("field messages in the units on screen", () => {
  it.each([
    // 100 % is a fraction of 1 shown × 100
    { range: POWDER_INPUT.firstPassEfficiency.range, kind: "percent", system: "metric", text: "a number greater than 0 and at most 100 %" },
    // source: 16 CFR 500.19, 1 mil = 25.4 µm: 5000 µm = 196.85 mil
    { range: POWDER_INPUT.filmUm.range, kind: "filmUm", system: "us", text: "a number greater than 0 and at most 196.85 mil" },
    // source: NIST SP 811, °F = °C × 9/5 + 32: −50 °C = −58 °F, 1000 °C = 1832 °F
    { range: CURE_INPUT.airTempC.range, kind: "temperatureC", system: "us", text: "a number at least -58 and at most 1832 °F" },
    { range: POWDER_INPUT.parts.range, kind: "count", system: "metric", text: "a whole number at least 1 and at most 10000000" },
  ] as const)("$kind in $system: $text", ({ range, kind, system, text }) => {
    expect(rangeText(range, kind, system)).toBe(text);
  });

  it("blank, text and out-of-range values get the three messages; a rule between fields its own text", () => {
    const specs = { firstPassEfficiency: { kind: "percent" }, areaM2: { kind: "areaM2" }, filmUm: { kind: "filmUm" } } as const;
    const values = { firstPassEfficiency: 1.5, areaM2: undefined, filmUm: "abc" };
    const issues = numberIssues({ firstPassEfficiency: POWDER_INPUT.firstPassEfficiency, areaM2: POWDER_INPUT.areaM2, filmUm: POWDER_INPUT.filmUm }, values);
    const out = fieldMessages<keyof typeof specs>(issues, { rules: POWDER_INPUT, specs, system: "metric", values });
    expect(out).toEqual({
      firstPassEfficiency: "Enter a number greater than 0 and at most 100 %.",
      areaM2: "Required: enter a number greater than 0 and at most 1000000 m².",
      filmUm: "“abc” is not a number: enter a number greater than 0 and at most 5000 µm.",
    });
    const cureIssues = cureInputIssues({ ...cure, targetMetalTempC: 210 });
    const custom = { targetMetalTempC: "Enter a target below the oven air temperature." };
    const cureSpecs = { targetMetalTempC: { kind: "temperatureC" } } as const;
    expect(fieldMessages<"targetMetalTempC">(cureIssues, { rules: CURE_INPUT, specs: cureSpecs, system: "metric", values: { targetMetalTempC: 210 }, custom })).toEqual(custom);
  });
});
