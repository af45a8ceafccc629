/**
 * Input schemas of the calculator routes (`POST /api/calc/*`), shared by route handlers and
 * forms. Field names and units follow PRODUCT.md; every message names the allowed range.
 * Upper bounds keep results finite and catch unit mistakes; they are not limits of real plants.
 */
import { z } from "zod";
import { describeRange, type NumericRange } from "@/lib/coating-math/errors";

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
