import { z } from "zod";
import { MAX_SIZE_MM } from "@/lib/rack/check-input";
import { orientationProblem } from "@/lib/rack/orientations";

// Upper bounds catch unit mistakes (inches typed as metres) rather than describe real lines.
const MAX_MASS_KG = 100_000;
const MAX_LOAD_KG = 1_000_000;

const sizeMm = z.number().positive().max(MAX_SIZE_MM);

export const rackPartSchema = z
  .object({
    lengthMm: sizeMm,
    widthMm: sizeMm,
    heightMm: sizeMm,
    massKg: z.number().positive().max(MAX_MASS_KG),
  })
  .strict();

export const rackCarrierSchema = z
  .object({
    widthMm: sizeMm,
    heightMm: sizeMm,
    depthMm: sizeMm,
    maxLoadKg: z.number().positive().max(MAX_LOAD_KG),
  })
  .strict();

export const rackOrientationSchema = z
  .object({
    alongWidthMm: sizeMm,
    alongHeightMm: sizeMm,
    alongDepthMm: sizeMm,
  })
  .strict();

export const orientationModeSchema = z.enum(["any", "upright"]);

export const rackPlanInputSchema = z
  .object({
    part: rackPartSchema,
    carrier: rackCarrierSchema,
    clearanceMm: z.number().min(0).max(MAX_SIZE_MM),
    orientations: orientationModeSchema,
    orientation: rackOrientationSchema.optional(),
  })
  .strict()
  .superRefine((value, ctx) => {
    const { carrier, clearanceMm, part, orientations, orientation } = value;
    if (clearanceMm > Math.max(carrier.widthMm, carrier.heightMm, carrier.depthMm)) {
      ctx.addIssue({
        code: "custom",
        path: ["clearanceMm"],
        message: "clearanceMm is larger than every dimension of the carrier window.",
      });
    }
    // Same rule the planner enforces, so the route answers 400 with a field before planning.
    if (orientation) {
      const problem = orientationProblem(part, orientations, orientation);
      if (problem) ctx.addIssue({ code: "custom", path: ["orientation"], message: problem });
    }
  });

export type RackPlanRequest = z.infer<typeof rackPlanInputSchema>;
export type RackPartInput = z.infer<typeof rackPartSchema>;
export type RackCarrierInput = z.infer<typeof rackCarrierSchema>;
export type RackOrientationInput = z.infer<typeof rackOrientationSchema>;
