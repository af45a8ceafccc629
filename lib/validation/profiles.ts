/**
 * Oven profile requests: the logger CSV (as text) with its column mapping, the oven and coating
 * it is judged against; storing a fitted heat-transfer coefficient; a logger's saved mapping.
 * Metric values with the unit in every name.
 */
import { z } from "zod";
import { TEMPERATURE_UNITS, TIME_FORMATS } from "@/lib/profiles/mapping";
import { objectParams, rangeNumber, text } from "./coatings";

/** A logger file sent as text; the JSON body limit (1 MB) bounds it too. */
export const MAX_CSV_CHARS = 990_000;

const columnName = z.string({ error: "Enter a column name." }).max(200, "At most 200 characters.");

export const probeMappingSchema = z
  .object(
    {
      column: columnName,
      label: z.string({ error: "Enter what the probe sat on." }).trim().max(60, "At most 60 characters.").default(""),
      thicknessMm: rangeNumber({ gt: 0, lte: 200 }, "mm").nullable(),
    },
    objectParams,
  )
  .strict();

export const columnMappingSchema = z
  .object(
    {
      timeColumn: columnName.nullable(),
      timeFormat: z.enum(TIME_FORMATS, { error: 'Choose "seconds", "minutes" or "clock".' }),
      temperatureUnit: z.enum(TEMPERATURE_UNITS, { error: 'Choose "C" or "F".' }),
      airColumn: columnName.nullable(),
      probes: z.array(probeMappingSchema, { error: "must be a list of probes" }).max(32, "At most 32 part probes."),
    },
    objectParams,
  )
  .strict();

const csvText = z
  .string({ error: "Send the logger file's text as csv." })
  .min(1, "The file is empty.")
  .max(MAX_CSV_CHARS, `The file is larger than ${MAX_CSV_CHARS / 1000} kB; log less often or split the run.`);

export const profilePreviewSchema = z
  .object(
    {
      csv: csvText,
      /** omitted: the server suggests one (or the named logger's remembered mapping) */
      mapping: columnMappingSchema.optional(),
      loggerName: z.string().trim().max(80, "At most 80 characters.").optional(),
    },
    objectParams,
  )
  .strict();

export const profileCreateSchema = z
  .object(
    {
      name: text("a name for the profile", 120),
      lineId: rangeNumber({ integer: true, gte: 1 }),
      /** the oven stage's position on a conveyor line; null for a batch oven */
      stagePosition: rangeNumber({ integer: true, gte: 0, lte: 200 }).nullable(),
      coatingId: rangeNumber({ integer: true, gte: 1 }),
      runId: z.string({ error: "Enter the run's id as text." }).trim().max(80, "At most 80 characters.").nullable().optional(),
      loggerName: z.string({ error: "Enter the logger's name or serial." }).trim().max(80, "At most 80 characters.").optional(),
      fileName: z.string().trim().max(200, "At most 200 characters.").default(""),
      measuredOn: z.string().regex(/^\d{4}-\d{2}-\d{2}$/, "Use a date like 2026-12-02.").nullable().optional(),
      notes: z.string({ error: "Notes must be text." }).trim().max(2000, "At most 2000 characters.").default(""),
      overbakeMarginK: rangeNumber({ gte: 0, lte: 200 }, "K").default(20),
      csv: csvText,
      mapping: columnMappingSchema,
    },
    objectParams,
  )
  .strict();

export const applyFitSchema = z
  .object({ probeIndex: rangeNumber({ integer: true, gte: 0, lte: 31 }) }, objectParams)
  .strict();

export const loggerSchema = z
  .object({ name: text("the logger's name or serial", 80), mapping: columnMappingSchema }, objectParams)
  .strict();

export type ColumnMappingBody = z.infer<typeof columnMappingSchema>;
export type ProfilePreviewBody = z.infer<typeof profilePreviewSchema>;
export type ProfileCreateBody = z.infer<typeof profileCreateSchema>;
export type ApplyFitBody = z.infer<typeof applyFitSchema>;
export type LoggerBody = z.infer<typeof loggerSchema>;
