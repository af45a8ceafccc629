/**
 * Run input (plan a run), status changes and the day board's order. Metric values with the unit
 * in every name; a day is "YYYY-MM-DD".
 */
import { z } from "zod";
import { RUN_STATUSES } from "@/lib/runs/status";
import { objectParams, rangeNumber } from "./coatings";

/** Upper bounds catch unit mistakes rather than describe real runs. */
export const MAX_QUANTITY = 1_000_000;
export const MAX_COATS = 4;
export const SHIFTS = [1, 2, 3] as const;

export const daySchema = z
  .string({ error: "Enter a date like 2026-12-03." })
  .regex(/^\d{4}-\d{2}-\d{2}$/, "Enter a date like 2026-12-03.")
  .refine((d) => {
    const t = Date.parse(`${d}T00:00:00Z`);
    return Number.isFinite(t) && new Date(t).toISOString().slice(0, 10) === d;
  }, "Enter a real calendar date like 2026-12-03.");

const idNumber = (what: string) =>
  z.number({ error: `Choose ${what}.` }).int(`Choose ${what}.`).positive(`Choose ${what}.`);

const sizeMm = rangeNumber({ gt: 0, lte: 100_000 }, "mm");

export const runCoatSchema = z
  .object(
    {
      coatingId: idNumber("a coating"),
      filmUm: rangeNumber({ gt: 0, lte: 5000 }, "µm"),
      firstPassEfficiency: rangeNumber({ gt: 0, lte: 1 }).nullable().optional(),
      reclaimEfficiency: rangeNumber({ gte: 0, lte: 1 }).nullable().optional(),
    },
    objectParams,
  )
  .strict();

export const runInputSchema = z
  .object(
    {
      partId: z.string({ error: "Choose a part." }).trim().min(1, "Choose a part.").max(100, "Choose a part."),
      quantity: rangeNumber({ integer: true, gte: 1, lte: MAX_QUANTITY }, "parts"),
      lineId: idNumber("a line"),
      date: daySchema,
      shift: z.union(SHIFTS.map((s) => z.literal(s)), { error: "Choose shift 1, 2 or 3." }),
      lineSpeedMPerMin: rangeNumber({ gt: 0, lte: 100 }, "m/min").nullable().optional(),
      clearanceMm: rangeNumber({ gte: 0, lte: 10_000 }, "mm"),
      orientations: z.enum(["any", "upright"], { error: 'Choose "any" or "upright".' }),
      orientation: z
        .object({ alongWidthMm: sizeMm, alongHeightMm: sizeMm, alongDepthMm: sizeMm }, objectParams)
        .strict()
        .nullable()
        .optional(),
      partsPerCarrierOverride: rangeNumber({ integer: true, gte: 1, lte: 10_000 }, "parts").nullable().optional(),
      coats: z
        .array(runCoatSchema, { error: "Add at least one coat." })
        .min(1, "Add at least one coat.")
        .max(MAX_COATS, `At most ${MAX_COATS} coats.`),
      masking: z.string({ error: "Must be text." }).max(4000, "At most 4000 characters.").default(""),
      notes: z.string({ error: "Must be text." }).max(4000, "At most 4000 characters.").default(""),
    },
    objectParams,
  )
  .strict();

export type RunInput = z.infer<typeof runInputSchema>;
export type RunInputRaw = z.input<typeof runInputSchema>;

export const runStatusSchema = z
  .object({ status: z.enum(RUN_STATUSES, { error: `Choose one of ${RUN_STATUSES.join(", ")}.` }) }, objectParams)
  .strict();

export const boardOrderSchema = z
  .object(
    {
      lineId: idNumber("a line"),
      date: daySchema,
      shift: z.union(SHIFTS.map((s) => z.literal(s)), { error: "Choose shift 1, 2 or 3." }),
      runIds: z
        .array(idNumber("a run"), { error: "Send the runs in their new order." })
        .max(500, "At most 500 runs.")
        .refine((ids) => new Set(ids).size === ids.length, "Each run may appear once."),
    },
    objectParams,
  )
  .strict();

export type BoardOrder = z.infer<typeof boardOrderSchema>;

const queryId = (what: string) =>
  z
    .string({ error: `Choose ${what}.` })
    .regex(/^\d{1,12}$/, `Choose ${what}.`)
    .transform(Number);

/** GET /api/runs: ?date= (one day) or ?from=&to=, optional ?lineId= and ?shift=. */
export const runQuerySchema = z
  .object(
    {
      date: daySchema.optional(),
      from: daySchema.optional(),
      to: daySchema.optional(),
      lineId: queryId("a line").optional(),
      shift: z.enum(["1", "2", "3"], { error: "Choose shift 1, 2 or 3." }).transform(Number).optional(),
    },
    objectParams,
  )
  .strict();

/** GET /api/runs/board and /api/runs/board/propose: ?lineId=&date=. */
export const boardQuerySchema = z.object({ lineId: queryId("a line"), date: daySchema }, objectParams).strict();

/** URLSearchParams → a plain object (the last value of a repeated key wins). */
export function queryObject(url: string): Record<string, string> {
  return Object.fromEntries(new URL(url).searchParams.entries());
}
