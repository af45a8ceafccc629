/**
 * Input schemas of the calculator routes (`POST /api/calc/*`), built from the limits and messages
 * in lib/coating-math/calc-inputs.ts (zod-free, so the calculators page checks the same rules in
 * the browser without zod). Field names and units follow PRODUCT.md; every message names the
 * allowed range.
 */
import { z } from "zod";
import type { NumericRange } from "@/lib/coating-math/errors";
import {
  CURE_INPUT,
  ECOAT_INPUT,
  FILM_LISTS,
  FILM_NOMINAL_INPUT,
  FILM_SPEC_INPUT,
  LINE_INPUT,
  MAX_READINGS,
  MESSAGES,
  nonFiniteResultError,
  POWDER_INPUT,
  READING_RANGE,
  rangeMessage,
  type NumberRule,
  type NumberRules,
} from "@/lib/coating-math/calc-inputs";

// The routes and the OpenAPI document use the same blame table as the calculators page.
export { resultBlame } from "@/lib/coating-math/calc-inputs";

/** A finite number in `range`; every check carries the same message naming the whole range. */
function rangeNumber(range: NumericRange) {
  const message = rangeMessage(range);
  let schema = z.number({ error: (issue) => (issue.input === undefined ? MESSAGES.required : message) });
  if (range.integer) schema = schema.int(message);
  if (range.gt !== undefined) schema = schema.gt(range.gt, message);
  if (range.gte !== undefined) schema = schema.gte(range.gte, message);
  if (range.lt !== undefined) schema = schema.lt(range.lt, message);
  if (range.lte !== undefined) schema = schema.lte(range.lte, message);
  return schema;
}

type NumberSchema<R extends NumberRule> = R extends { default: number }
  ? z.ZodDefault<z.ZodNumber>
  : R extends { optional: true }
    ? z.ZodOptional<z.ZodNumber>
    : z.ZodNumber;

/** One zod number per rule: its range, then its default or `.optional()`. */
function numberShape<T extends NumberRules>(rules: T): { [K in keyof T]: NumberSchema<T[K]> } {
  const shape: Record<string, z.ZodType> = {};
  for (const [name, rule] of Object.entries(rules)) {
    const n = rangeNumber(rule.range);
    shape[name] = rule.default !== undefined ? n.default(rule.default) : rule.optional ? n.optional() : n;
  }
  return shape as { [K in keyof T]: NumberSchema<T[K]> };
}

/** Names unknown fields instead of zod's generic text. */
const objectParams = {
  error: (issue: { code?: string; keys?: string[] }) =>
    issue.code === "unrecognized_keys" && issue.keys
      ? `Unknown field${issue.keys.length === 1 ? "" : "s"}: ${issue.keys.join(", ")}`
      : undefined,
};

/** "is required" for a missing list, `message` for anything else that is not a list. */
function listError(message: string) {
  return (issue: { input?: unknown }) => (issue.input === undefined ? MESSAGES.required : message);
}

const readingUm = rangeNumber(READING_RANGE);

export const powderInputSchema = z.object(numberShape(POWDER_INPUT), objectParams).strict();

export const ecoatInputSchema = z.object(numberShape(ECOAT_INPUT), objectParams).strict();

export const lineInputSchema = z.object(numberShape(LINE_INPUT), objectParams).strict();

export const cureInputSchema = z
  .object(numberShape(CURE_INPUT), objectParams)
  .strict()
  .refine((v) => v.targetMetalTempC < v.airTempC, { path: ["targetMetalTempC"], message: MESSAGES.cureTarget });

const specFields = numberShape(FILM_SPEC_INPUT);

const pa2FilmSchema = z
  .object(
    {
      rule: z.literal("sspc-pa2"),
      ...specFields,
      areas: z
        .array(
          z
            .array(
              z
                .array(readingUm, { error: "must be a list of gauge readings in µm" })
                .min(FILM_LISTS.spotMin, MESSAGES.spotMin)
                .max(FILM_LISTS.spotMax, MESSAGES.spotMax),
              { error: "must be a list of spots" },
            )
            .min(FILM_LISTS.areaMin, MESSAGES.areaMin)
            .max(FILM_LISTS.areaMax, MESSAGES.areaMax),
          { error: listError("must be a list of areas, each a list of spots, each a list of readings") },
        )
        .min(FILM_LISTS.areasMin, MESSAGES.areasMin)
        .max(FILM_LISTS.areasMax, MESSAGES.areasMax),
    },
    objectParams,
  )
  .strict()
  .superRefine((v, ctx) => {
    let count = 0;
    for (const area of v.areas) for (const spot of area) count += spot.length;
    if (count > MAX_READINGS) ctx.addIssue({ code: "custom", path: ["areas"], message: MESSAGES.totalMax });
  });

const isoFilmSchema = z
  .object(
    {
      rule: z.literal("iso19840"),
      ...specFields,
      ...numberShape(FILM_NOMINAL_INPUT),
      readingsUm: z
        .array(readingUm, { error: listError("must be a list of gauge readings in µm") })
        .min(FILM_LISTS.readingsMin, MESSAGES.readingsMin)
        .max(FILM_LISTS.readingsMax, MESSAGES.readingsMax),
    },
    objectParams,
  )
  .strict()
  .refine((v) => v.nominalUm <= v.specMaxUm, { path: ["nominalUm"], message: MESSAGES.atMostSpecMax });

export const filmInputSchema = z
  .discriminatedUnion("rule", [pa2FilmSchema, isoFilmSchema], {
    error: (issue) =>
      issue.code === "invalid_union" ? 'must be "sspc-pa2" or "iso19840"' : undefined,
  })
  .refine((v) => v.specMinUm <= v.specMaxUm, { path: ["specMinUm"], message: MESSAGES.atMostSpecMax });

export type PowderInput = z.infer<typeof powderInputSchema>;
export type EcoatInput = z.infer<typeof ecoatInputSchema>;
export type LineInput = z.infer<typeof lineInputSchema>;
export type CureInput = z.infer<typeof cureInputSchema>;
export type FilmInput = z.infer<typeof filmInputSchema>;
/** What a form may send (defaults not yet applied). */
export type PowderInputRaw = z.input<typeof powderInputSchema>;
export type EcoatInputRaw = z.input<typeof ecoatInputSchema>;
export type LineInputRaw = z.input<typeof lineInputSchema>;
export type CureInputRaw = z.input<typeof cureInputSchema>;
export type FilmInputRaw = z.input<typeof filmInputSchema>;

// ---------------------------------------------------------------------------------------------
// Output schemas of the calculator routes. They document the responses (GET /api/openapi.json)
// and guard them: zod numbers reject NaN and ±Infinity, so a result that overflowed becomes a
// 400 naming the input at fault (see `checkedResult`) instead of a `null` in the JSON.

const num = (description: string) => z.number().describe(description);
const sentences = (description: string) => z.array(z.string()).describe(description);

export const powderResultSchema = z.object({
  theoreticalCoverageM2PerKg: num("m² covered by 1 kg of powder at the film build, 1000 / (SG × filmUm)"),
  materialUtilization: num("share of sprayed powder that ends on the parts, with reclaim resprayed: FPE / (1 − r(1 − FPE))"),
  practicalCoverageM2PerKg: num("theoretical coverage × material utilisation"),
  powderKg: num("powder needed for all parts"),
  powderKgPerPart: num("powder needed for one part"),
  costTotal: num("powderKg × pricePerKg, when a price is given").optional(),
});

export const ecoatResultSchema = z.object({
  depositedSolidsKg: num("cured film mass on all parts, ρ × DFT × area × parts"),
  depositedSolidsKgPerPart: num("cured film mass on one part"),
  chargeC: num("charge to deposit the film on all parts, mass / coulombic yield"),
  chargeCPerPart: num("charge for one part"),
  chargePerAreaCPerM2: num("charge per coated area"),
  averageCurrentA: num("average rectifier current at partsPerHour").optional(),
  solidsKgPerHour: num("solids deposited per hour at partsPerHour").optional(),
});

export const lineResultSchema = z.object({
  carriersPerHour: num("line speed × 60 / carrier pitch"),
  partsPerHour: num("carriers/h × parts per carrier × loaded fraction"),
  ovenDwellMin: num("oven path length / line speed"),
  maxLineSpeedForDwellMPerMin: num("fastest line speed that still gives requiredDwellMin").optional(),
  dwellMarginMin: num("ovenDwellMin − requiredDwellMin; negative when the line runs too fast").optional(),
});

export const cureResultSchema = z.object({
  timeConstantMin: num("ρ c (thickness/2) / h"),
  heatUpMin: num("time for the metal to reach the target temperature, τ ln((Tair − T0)/(Tair − Ttarget))"),
  totalMin: num("heat-up + hold"),
  biotNumber: num("h (thickness/2) / k; the lumped model holds below 0.1"),
  dwellMarginMin: num("ovenDwellMin − totalMin, when ovenDwellMin is given").optional(),
  warnings: sentences("limits of the model met by these inputs"),
});

const filmCommon = {
  pass: z.boolean().describe("true when every acceptance rule is met"),
  reasons: sentences("why the film fails, one sentence each; empty when it passes"),
  warnings: sentences("departures from the procedure that do not fail the film by themselves"),
};

export const filmResultSchema = z.discriminatedUnion("rule", [
  z.object({
    rule: z.literal("sspc-pa2"),
    ...filmCommon,
    spotsUm: z.array(z.array(z.number())).describe("spot measurements (mean of the gauge readings), per area"),
    areasUm: z.array(z.number()).describe("area measurements (mean of the spots)"),
  }),
  z.object({
    rule: z.literal("iso19840"),
    ...filmCommon,
    meanUm: num("mean of all readings"),
    fractionBelowNominal: num("share of readings below the nominal thickness"),
    readingCount: z.number().int().describe("number of readings"),
  }),
]);

export type PowderResultBody = z.infer<typeof powderResultSchema>;
export type EcoatResultBody = z.infer<typeof ecoatResultSchema>;
export type LineResultBody = z.infer<typeof lineResultSchema>;
export type CureResultBody = z.infer<typeof cureResultSchema>;
export type FilmResultBody = z.infer<typeof filmResultSchema>;

/**
 * Parses a calculation's result with its output schema. A non-finite number (an overflow from
 * inputs that are each in range) throws a DomainError naming the input most likely at fault,
 * which the route wrapper answers with a 400; the form shows it on that field.
 */
export function checkedResult<S extends z.ZodType>(
  schema: S,
  result: unknown,
  blame: Readonly<Record<string, string>>,
): z.output<S> {
  const parsed = schema.safeParse(result);
  if (parsed.success) return parsed.data;
  throw nonFiniteResultError(String(parsed.error.issues[0]?.path[0] ?? "result"), blame);
}
