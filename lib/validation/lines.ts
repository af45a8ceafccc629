/**
 * Finishing line input: a conveyor line with its ordered stages, or a batch oven; and the cure
 * check request. Metric values with the unit in every name.
 */
import { z } from "zod";
import { HEATED_STAGE_KINDS, OVEN_STAGE_KINDS, STAGE_KINDS } from "@/lib/lines/stages";
import { objectParams, rangeNumber, text, TEMP_RANGE_C } from "./coatings";

const MAX_DIM_MM = 50_000;
const dimMm = rangeNumber({ gt: 0, lte: MAX_DIM_MM }, "mm");
const speed = rangeNumber({ gt: 0, lte: 100 }, "m/min");
const minutes = rangeNumber({ gte: 0, lte: 1440 }, "min");
const heatTransfer = rangeNumber({ gt: 0, lte: 1000 }, "W/m²K");

export const windowSchema = z
  .object({ widthMm: dimMm, heightMm: dimMm, depthMm: dimMm }, objectParams)
  .strict();

export const stageSchema = z
  .object(
    {
      name: text("the stage's name", 80),
      kind: z.enum(STAGE_KINDS, { error: `Choose one of ${STAGE_KINDS.join(", ")}.` }),
      lengthM: rangeNumber({ gt: 0, lte: 5000 }, "m"),
      tempC: rangeNumber(TEMP_RANGE_C, "°C").nullable().optional(),
      heatTransferCoefficientWPerM2K: heatTransfer.nullable().optional(),
      colourChangeMin: minutes.nullable().optional(),
    },
    objectParams,
  )
  .strict()
  .superRefine((s, ctx) => {
    const issue = (path: string, message: string) => ctx.addIssue({ code: "custom", path: [path], message });
    if (s.kind === "cure-oven") {
      if (s.tempC == null) issue("tempC", "A cure oven needs its air temperature.");
      if (s.heatTransferCoefficientWPerM2K == null) issue("heatTransferCoefficientWPerM2K", "A cure oven needs its heat-transfer coefficient (cure ovens are ~20–60 W/m²K).");
    }
    if (s.tempC != null && !HEATED_STAGE_KINDS.includes(s.kind)) issue("tempC", "Only ovens and heated tanks have an air or bath temperature.");
    if (s.heatTransferCoefficientWPerM2K != null && !OVEN_STAGE_KINDS.includes(s.kind)) issue("heatTransferCoefficientWPerM2K", "Only oven stages have a heat-transfer coefficient.");
    if (s.colourChangeMin != null && s.kind !== "powder-booth") issue("colourChangeMin", "Only powder booths have a colour-change time.");
  });

const common = {
  name: text("the line's name", 80),
  notes: z.string({ error: "Notes must be text." }).trim().max(2000, "At most 2000 characters.").default(""),
  hourlyCost: rangeNumber({ gte: 0, lte: 1_000_000 }),
  /** a carrier's usable window (conveyor) or each rack's (batch oven) */
  windowMm: windowSchema,
  maxLoadKg: rangeNumber({ gt: 0, lte: 100_000 }, "kg"),
  archived: z.boolean({ error: "Must be true or false." }).optional(),
};

export const conveyorLineSchema = z
  .object(
    {
      kind: z.literal("conveyor"),
      ...common,
      lineSpeedMinMPerMin: speed,
      lineSpeedMaxMPerMin: speed,
      lineSpeedNominalMPerMin: speed,
      carrierPitchM: rangeNumber({ gt: 0, lte: 100 }, "m"),
      stages: z
        .array(stageSchema, { error: (i) => (i.input === undefined ? "is required" : "must be a list of stages") })
        .min(1, "A conveyor line needs at least one stage.")
        .max(80, "At most 80 stages."),
    },
    objectParams,
  )
  .strict()
  .superRefine((v, ctx) => {
    if (v.lineSpeedMinMPerMin > v.lineSpeedMaxMPerMin) {
      ctx.addIssue({ code: "custom", path: ["lineSpeedMinMPerMin"], message: "must be at most lineSpeedMaxMPerMin" });
    } else if (v.lineSpeedNominalMPerMin < v.lineSpeedMinMPerMin || v.lineSpeedNominalMPerMin > v.lineSpeedMaxMPerMin) {
      ctx.addIssue({ code: "custom", path: ["lineSpeedNominalMPerMin"], message: `must be within the speed range ${v.lineSpeedMinMPerMin}–${v.lineSpeedMaxMPerMin} m/min` });
    }
  });

export const batchOvenSchema = z
  .object(
    {
      kind: z.literal("batch"),
      ...common,
      interiorMm: windowSchema,
      racksPerLoad: rangeNumber({ integer: true, gte: 1, lte: 100 }),
      airTempC: rangeNumber({ gt: 0, lte: 600 }, "°C"),
      heatTransferCoefficientWPerM2K: heatTransfer,
      loadMin: minutes,
      unloadMin: minutes,
    },
    objectParams,
  )
  .strict()
  .superRefine((v, ctx) => {
    for (const d of ["widthMm", "heightMm", "depthMm"] as const) {
      if (v.windowMm[d] > v.interiorMm[d]) {
        ctx.addIssue({ code: "custom", path: ["windowMm", d], message: `A rack's window cannot be larger than the oven's interior (${v.interiorMm[d]} mm).` });
      }
    }
  });

export const lineInputSchema = z.discriminatedUnion("kind", [conveyorLineSchema, batchOvenSchema], {
  error: (issue) => (issue.code === "invalid_union" ? 'must be "conveyor" or "batch"' : undefined),
});

export type LineInput = z.infer<typeof lineInputSchema>;
export type ConveyorLineInput = z.infer<typeof conveyorLineSchema>;
export type BatchOvenInput = z.infer<typeof batchOvenSchema>;
export type StageInputBody = z.infer<typeof stageSchema>;

export const cureCheckInputSchema = z
  .object(
    {
      coatingId: rangeNumber({ integer: true, gte: 1 }),
      thicknessMm: rangeNumber({ gt: 0, lte: 500 }, "mm"),
      lineSpeedMPerMin: speed.optional(),
      startTempC: rangeNumber(TEMP_RANGE_C, "°C").default(20),
    },
    objectParams,
  )
  .strict();

export type CureCheckBody = z.infer<typeof cureCheckInputSchema>;
