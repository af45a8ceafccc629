/**
 * A saved racking plan: the part and line it is for, the clearance, the orientation mode and,
 * when set by hand, one orientation (what lies along travel, up, across). Metric values.
 */
import { z } from "zod";
import { MAX_SIZE_MM } from "@/lib/rack/check-input";
import { codeProblem, ORIENTATION_CODES } from "@/lib/rack/orientation-code";
import { objectParams, rangeNumber } from "./coatings";

export const MAX_NOTE_CHARS = 1000;

export const rackPlanSaveSchema = z
  .object(
    {
      partId: z.string({ error: "Choose a part." }).trim().min(1, "Choose a part.").max(100, "Choose a part."),
      lineId: z.number({ error: "Choose a line." }).int("Choose a line.").positive("Choose a line."),
      clearanceMm: rangeNumber({ gte: 0, lte: MAX_SIZE_MM }, "mm"),
      orientations: z.enum(["any", "upright"], { error: 'Choose "any" or "upright".' }),
      orientationOverride: z
        .enum(ORIENTATION_CODES, { error: `Choose one of ${ORIENTATION_CODES.join(", ")}, or null for the planner's best.` })
        .nullable()
        .default(null),
      note: z.string({ error: "Must be text." }).trim().max(MAX_NOTE_CHARS, `At most ${MAX_NOTE_CHARS} characters.`).default(""),
    },
    objectParams,
  )
  .strict()
  .superRefine((v, ctx) => {
    const problem = v.orientationOverride ? codeProblem(v.orientations, v.orientationOverride) : null;
    if (problem) ctx.addIssue({ code: "custom", path: ["orientationOverride"], message: problem });
  });

export type RackPlanSaveInput = z.infer<typeof rackPlanSaveSchema>;
export type RackPlanSaveRaw = z.input<typeof rackPlanSaveSchema>;

/** GET /api/rack/plans filters. */
export const rackPlanQuerySchema = z
  .object({
    partId: z.string().trim().min(1, "Give a part id.").max(100, "Give a part id.").optional(),
    lineId: z.coerce.number({ error: "Give a line id (a whole number)." }).int("Give a line id (a whole number).").positive("Give a line id (a whole number).").optional(),
  })
  .strict();
