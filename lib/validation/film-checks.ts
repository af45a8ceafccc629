/**
 * Film check input: DFT readings of one coat (µm), the other tests of a run, gauges.
 * Readings outside 0 … 5000 µm are refused with their path (areas.0.1.2, readingsUm.4).
 */
import { z } from "zod";
import { MAX_PLAUSIBLE_UM } from "@/lib/film-checks/readings";

const readingUm = z
  .number({ error: "Enter the reading as a number of µm." })
  .min(0, "A thickness cannot be negative.")
  .max(MAX_PLAUSIBLE_UM, `Above ${MAX_PLAUSIBLE_UM} µm (5 mm): not a plausible film reading.`);

const specUm = z
  .number({ error: "Enter a film thickness in µm." })
  .positive("Enter a film thickness above 0 µm.")
  .max(MAX_PLAUSIBLE_UM, `Enter at most ${MAX_PLAUSIBLE_UM} µm.`)
  .nullable()
  .optional();

const common = {
  coatIndex: z.number({ error: "Choose the coat." }).int("Choose the coat.").min(0, "Choose the coat."),
  specMinUm: specUm,
  specMaxUm: specUm,
  gaugeId: z.number().int().positive("Choose a gauge.").nullable().optional(),
  notes: z.string().max(2000, "Keep notes under 2000 characters.").optional(),
};

export const filmCheckInputSchema = z.discriminatedUnion(
  "rule",
  [
    z
      .object({
        rule: z.literal("sspc-pa2"),
        ...common,
        areas: z
          .array(
            z.array(z.array(readingUm).min(1, "A spot needs readings."), { error: "Enter spots of readings." }).min(1, "An area needs spots."),
            { error: "Enter areas of spots of readings." },
          )
          .min(1, "Enter at least one area.")
          .max(200, "At most 200 areas."),
      })
      .strict(),
    z
      .object({
        rule: z.literal("iso19840"),
        ...common,
        nominalUm: specUm,
        readingsUm: z.array(readingUm, { error: "Enter a list of readings." }).min(1, "Enter at least one reading.").max(5000, "At most 5000 readings."),
      })
      .strict(),
  ],
  { error: 'Choose the rule: "sspc-pa2" or "iso19840".' },
);
export type FilmCheckInput = z.infer<typeof filmCheckInputSchema>;

const by = { notes: z.string().max(2000, "Keep notes under 2000 characters.").optional() };

export const filmTestInputSchema = z.discriminatedUnion(
  "kind",
  [
    // ASTM D5402 solvent rub: solvent, double rubs, pass/fail
    z
      .object({
        kind: z.literal("cure"),
        solvent: z.string().trim().min(1, "Name the solvent (e.g. MEK).").max(100),
        rubCount: z.number({ error: "Enter the number of double rubs." }).int("Enter a whole number of rubs.").min(1, "Enter at least 1 rub.").max(1000, "Enter at most 1000 rubs."),
        result: z.enum(["pass", "fail"], { error: "Choose pass or fail." }),
        ...by,
      })
      .strict(),
    // ASTM D3359: method A (X-cut, 0A–5A) or B (cross-cut, 0B–5B)
    z
      .object({
        kind: z.literal("adhesion"),
        method: z.enum(["A", "B"], { error: "Choose method A or B." }),
        rating: z.number({ error: "Choose the class 0–5." }).int("Choose the class 0–5.").min(0, "Choose the class 0–5.").max(5, "Choose the class 0–5."),
        ...by,
      })
      .strict(),
    z
      .object({
        kind: z.literal("appearance"),
        gloss60Gu: z.number({ error: "Enter gloss in GU." }).min(0, "Gloss cannot be negative.").max(200, "Enter at most 200 GU.").nullable().optional(),
        colourNote: z.string().max(1000, "Keep the note under 1000 characters."),
        ...by,
      })
      .strict(),
    z
      .object({
        kind: z.literal("coverage"),
        result: z.enum(["pass", "touch-up", "strip"], { error: "Choose pass, touch-up or strip." }),
        ...by,
      })
      .strict(),
  ],
  { error: "Choose the test: cure, adhesion, appearance or coverage." },
);
export type FilmTestInput = z.infer<typeof filmTestInputSchema>;

export const csvMappingSchema = z
  .object({
    readingColumn: z.string().trim().min(1, "Choose the reading column."),
    unit: z.enum(["um", "mil"], { error: "Choose µm or mil." }),
  })
  .strict();

const gaugeFields = {
  name: z.string({ error: "Name the gauge." }).trim().min(1, "Name the gauge.").max(100, "Keep the name under 100 characters."),
  gaugeType: z.enum(["type1", "type2"], { error: "Choose type 1 (magnetic pull-off) or type 2 (electronic)." }),
  serial: z.string({ error: "Enter the serial number as text." }).trim().max(100, "Keep the serial under 100 characters.").optional(),
  verifiedOn: z.string({ error: "Enter a date like 2026-12-03." }).regex(/^\d{4}-\d{2}-\d{2}$/, "Enter a date like 2026-12-03.").nullable().optional(),
  // The plant's choice: how often its procedure has each gauge verified.
  verifyIntervalMonths: z
    .number({ error: "Enter the interval as a whole number of months." })
    .int("Enter a whole number of months.")
    .min(1, "Enter at least 1 month.")
    .max(120, "Enter at most 120 months (10 years)."),
  mapping: csvMappingSchema.nullable().optional(),
};

export const gaugeInputSchema = z
  .object({ ...gaugeFields, verifyIntervalMonths: gaugeFields.verifyIntervalMonths.optional() })
  .strict();
export type GaugeInput = z.infer<typeof gaugeInputSchema>;

/** PUT /api/gauges/[id]: the fields sent change, the rest stay; `mapping: null` forgets the CSV mapping. */
export const gaugeUpdateSchema = z
  .object({
    name: gaugeFields.name.optional(),
    gaugeType: gaugeFields.gaugeType.optional(),
    serial: gaugeFields.serial,
    verifiedOn: gaugeFields.verifiedOn,
    verifyIntervalMonths: gaugeFields.verifyIntervalMonths.optional(),
    mapping: gaugeFields.mapping,
    retired: z.boolean({ error: "Send true to retire the gauge, false to bring it back." }).optional(),
  })
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: "Send at least one field to change.", path: ["body"] });
export type GaugeUpdate = z.infer<typeof gaugeUpdateSchema>;

export const trendQuerySchema = z.object({
  coatingId: z.coerce.number().int().positive("Choose a coating."),
  lineId: z.coerce.number().int().positive("Choose a line."),
});
