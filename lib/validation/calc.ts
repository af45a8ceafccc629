/**
 * Input schemas of the calculator routes (`POST /api/calc/*`), shared by route handlers and
 * forms. Field names and units follow PRODUCT.md; every message names the allowed range.
 * Upper bounds keep results finite and catch unit mistakes; they are not limits of real plants.
 */
import { z } from "zod";
import { DomainError, describeRange, type NumericRange } from "@/lib/coating-math/errors";

const MAX_AREA_M2 = 1_000_000;
const MAX_FILM_UM = 5_000;
const MAX_PARTS = 10_000_000;
const MAX_PRICE_PER_KG = 1_000_000;
const MAX_READINGS = 10_000;
const MAX_TEMP_C = 1_000;
const MIN_TEMP_C = -50;
const MAX_MINUTES = 10_000;

/** A finite number in `range`; every check carries the same message naming the whole range. */
function rangeNumber(range: NumericRange) {
  const message = `must be ${describeRange(range)}`;
  let schema = z.number({ error: (issue) => (issue.input === undefined ? "is required" : message) });
  if (range.integer) schema = schema.int(message);
  if (range.gt !== undefined) schema = schema.gt(range.gt, message);
  if (range.gte !== undefined) schema = schema.gte(range.gte, message);
  if (range.lt !== undefined) schema = schema.lt(range.lt, message);
  if (range.lte !== undefined) schema = schema.lte(range.lte, message);
  return schema;
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
  return (issue: { input?: unknown }) => (issue.input === undefined ? "is required" : message);
}

const areaM2 = rangeNumber({ gt: 0, lte: MAX_AREA_M2 });
const filmUm = rangeNumber({ gt: 0, lte: MAX_FILM_UM });
const parts = rangeNumber({ integer: true, gte: 1, lte: MAX_PARTS }).default(1);
const fraction = rangeNumber({ gt: 0, lte: 1 });
const temperatureC = rangeNumber({ gte: MIN_TEMP_C, lte: MAX_TEMP_C });
const readingUm = rangeNumber({ gte: 0, lte: 50_000 });

export const powderInputSchema = z
  .object(
    {
      areaM2,
      filmUm,
      specificGravity: rangeNumber({ gt: 0, lte: 20 }),
      firstPassEfficiency: fraction,
      reclaimEfficiency: rangeNumber({ gte: 0, lte: 1 }).default(0),
      parts,
      pricePerKg: rangeNumber({ gte: 0, lte: MAX_PRICE_PER_KG }).optional(),
    },
    objectParams,
  )
  .strict();

export const ecoatInputSchema = z
  .object(
    {
      areaM2,
      filmUm,
      filmDensityGPerCm3: rangeNumber({ gt: 0, lte: 20 }),
      coulombicYieldMgPerC: rangeNumber({ gt: 0, lte: 1_000 }),
      parts,
      partsPerHour: rangeNumber({ gt: 0, lte: 1_000_000 }).optional(),
    },
    objectParams,
  )
  .strict();

export const lineInputSchema = z
  .object(
    {
      lineSpeedMPerMin: rangeNumber({ gt: 0, lte: 1_000 }),
      carrierPitchM: rangeNumber({ gt: 0, lte: 1_000 }),
      partsPerCarrier: rangeNumber({ gt: 0, lte: 100_000 }),
      ovenPathLengthM: rangeNumber({ gt: 0, lte: 100_000 }),
      requiredDwellMin: rangeNumber({ gt: 0, lte: MAX_MINUTES }).optional(),
      loadedFraction: fraction.default(1),
    },
    objectParams,
  )
  .strict();

export const cureInputSchema = z
  .object(
    {
      thicknessMm: rangeNumber({ gt: 0, lte: 1_000 }),
      airTempC: temperatureC,
      startTempC: temperatureC,
      targetMetalTempC: temperatureC,
      holdMin: rangeNumber({ gte: 0, lte: MAX_MINUTES }),
      heatTransferCoefficientWPerM2K: rangeNumber({ gt: 0, lte: 10_000 }),
      densityKgPerM3: rangeNumber({ gt: 0, lte: 25_000 }).default(7850),
      specificHeatJPerKgK: rangeNumber({ gt: 0, lte: 10_000 }).default(490),
      thermalConductivityWPerMK: rangeNumber({ gt: 0, lte: 1_000 }).default(50),
      ovenDwellMin: rangeNumber({ gte: 0, lte: MAX_MINUTES }).optional(),
    },
    objectParams,
  )
  .strict()
  .refine((v) => v.targetMetalTempC < v.airTempC, {
    path: ["targetMetalTempC"],
    message: "must be below the oven air temperature (airTempC): metal never reaches the air temperature",
  });

const specFields = {
  specMinUm: rangeNumber({ gt: 0, lte: MAX_FILM_UM }),
  specMaxUm: rangeNumber({ gt: 0, lte: MAX_FILM_UM }),
};

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
                .min(3, "a spot needs at least 3 gauge readings")
                .max(100, "a spot takes at most 100 gauge readings"),
              { error: "must be a list of spots" },
            )
            .min(1, "an area needs at least 1 spot")
            .max(100, "an area takes at most 100 spots"),
          { error: listError("must be a list of areas, each a list of spots, each a list of readings") },
        )
        .min(1, "at least 1 area is required")
        .max(Math.floor(MAX_READINGS / 3), `at most ${Math.floor(MAX_READINGS / 3)} areas`),
    },
    objectParams,
  )
  .strict()
  .superRefine((v, ctx) => {
    let count = 0;
    for (const area of v.areas) for (const spot of area) count += spot.length;
    if (count > MAX_READINGS) {
      ctx.addIssue({ code: "custom", path: ["areas"], message: `at most ${MAX_READINGS} gauge readings in all` });
    }
  });

const isoFilmSchema = z
  .object(
    {
      rule: z.literal("iso19840"),
      ...specFields,
      nominalUm: rangeNumber({ gt: 0, lte: MAX_FILM_UM }),
      readingsUm: z
        .array(readingUm, { error: listError("must be a list of gauge readings in µm") })
        .min(1, "at least 1 gauge reading is required")
        .max(MAX_READINGS, `at most ${MAX_READINGS} gauge readings`),
    },
    objectParams,
  )
  .strict()
  .refine((v) => v.nominalUm <= v.specMaxUm, {
    path: ["nominalUm"],
    message: "must be at most specMaxUm",
  });

export const filmInputSchema = z
  .discriminatedUnion("rule", [pa2FilmSchema, isoFilmSchema], {
    error: (issue) =>
      issue.code === "invalid_union" ? 'must be "sspc-pa2" or "iso19840"' : undefined,
  })
  .refine((v) => v.specMinUm <= v.specMaxUm, {
    path: ["specMinUm"],
    message: "must be at most specMaxUm",
  });

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

/** For each output field, the input most likely at fault when it cannot be computed. */
export const resultBlame = {
  powder: {
    theoreticalCoverageM2PerKg: "specificGravity",
    materialUtilization: "firstPassEfficiency",
    practicalCoverageM2PerKg: "specificGravity",
    powderKg: "firstPassEfficiency",
    powderKgPerPart: "firstPassEfficiency",
    costTotal: "pricePerKg",
  },
  ecoat: {
    depositedSolidsKg: "areaM2",
    depositedSolidsKgPerPart: "areaM2",
    chargeC: "coulombicYieldMgPerC",
    chargeCPerPart: "coulombicYieldMgPerC",
    chargePerAreaCPerM2: "coulombicYieldMgPerC",
    averageCurrentA: "partsPerHour",
    solidsKgPerHour: "partsPerHour",
  },
  line: {
    carriersPerHour: "carrierPitchM",
    partsPerHour: "carrierPitchM",
    ovenDwellMin: "lineSpeedMPerMin",
    maxLineSpeedForDwellMPerMin: "requiredDwellMin",
    dwellMarginMin: "requiredDwellMin",
  },
  cure: {
    timeConstantMin: "heatTransferCoefficientWPerM2K",
    heatUpMin: "targetMetalTempC",
    totalMin: "holdMin",
    biotNumber: "thermalConductivityWPerMK",
    dwellMarginMin: "ovenDwellMin",
  },
  film: { spotsUm: "areas", areasUm: "areas", meanUm: "readingsUm", fractionBelowNominal: "readingsUm" },
} as const satisfies Record<string, Record<string, string>>;

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
  const output = String(parsed.error.issues[0]?.path[0] ?? "result");
  const field = blame[output] ?? output;
  throw new DomainError(
    field,
    `${field} is too extreme: the ${output} cannot be computed as a finite number from these inputs.`,
  );
}
