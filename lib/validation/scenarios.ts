/**
 * Saved what-if scenarios and the throughput comparison request. Metric values with the unit in
 * every name; whether an override suits its line (a speed inside the line's range, no oven length
 * on a batch oven) is checked by the service against the line itself.
 */
import { z } from "zod";
import { MAX_PARTS_PER_CARRIER } from "@/lib/rack/plan";
import { objectParams, rangeNumber, text } from "./coatings";

const id = rangeNumber({ integer: true, gte: 1 });
const partsPerCarrier = rangeNumber({ integer: true, gte: 1, lte: MAX_PARTS_PER_CARRIER });
const sizeMm = rangeNumber({ gt: 0, lte: 100_000 }, "mm");

export const overridesSchema = z
  .object(
    {
      lineSpeedMPerMin: rangeNumber({ gt: 0, lte: 100 }, "m/min").optional(),
      carrierPitchM: rangeNumber({ gt: 0, lte: 100 }, "m").optional(),
      partsPerCarrier: partsPerCarrier.optional(),
      ovenLengthM: rangeNumber({ gt: 0, lte: 5000 }, "m").optional(),
      airTempC: rangeNumber({ gt: 0, lte: 600 }, "°C").optional(),
    },
    objectParams,
  )
  .strict();

export type OverridesInput = z.infer<typeof overridesSchema>;

const MANUAL_REQUIRED = ["areaM2", "massKg", "thicknessMm", "lengthMm", "widthMm", "heightMm"] as const;

/** A part from the catalogue ({ partId }) or its figures entered by hand. */
export const partRefSchema = z
  .object(
    {
      partId: z.string({ error: "Enter a part id." }).trim().min(1, "Enter a part id.").max(100, "At most 100 characters.").optional(),
      areaM2: rangeNumber({ gt: 0, lte: 1000 }, "m²").optional(),
      insideAreaM2: rangeNumber({ gte: 0, lte: 1000 }, "m²").optional(),
      massKg: rangeNumber({ gt: 0, lte: 100_000 }, "kg").optional(),
      thicknessMm: rangeNumber({ gt: 0, lte: 500 }, "mm").optional(),
      lengthMm: sizeMm.optional(),
      widthMm: sizeMm.optional(),
      heightMm: sizeMm.optional(),
    },
    objectParams,
  )
  .strict()
  .superRefine((p, ctx) => {
    const manual = Object.keys(p).filter((k) => k !== "partId");
    if (p.partId !== undefined) {
      if (manual.length) ctx.addIssue({ code: "custom", path: [manual[0]], message: "Give partId or the part's figures, not both." });
      return;
    }
    for (const k of MANUAL_REQUIRED) {
      if (p[k] === undefined) ctx.addIssue({ code: "custom", path: [k], message: "is required (or give partId)" });
    }
  })
  .transform((p): PartRef =>
    p.partId !== undefined
      ? { partId: p.partId }
      : {
          areaM2: p.areaM2!,
          insideAreaM2: p.insideAreaM2 ?? 0,
          massKg: p.massKg!,
          thicknessMm: p.thicknessMm!,
          lengthMm: p.lengthMm!,
          widthMm: p.widthMm!,
          heightMm: p.heightMm!,
        },
  );

export interface ManualPart {
  areaM2: number;
  insideAreaM2: number;
  massKg: number;
  thicknessMm: number;
  lengthMm: number;
  widthMm: number;
  heightMm: number;
}
export type PartRef = { partId: string } | ManualPart;

export const scenarioInputSchema = z
  .object(
    {
      name: text("the scenario's name", 120),
      lineId: id,
      overrides: overridesSchema.default({}),
      part: partRefSchema.nullable().default(null),
      coatingId: id.nullable().default(null),
      archived: z.boolean({ error: "Must be true or false." }).optional(),
    },
    objectParams,
  )
  .strict();

export type ScenarioInput = z.infer<typeof scenarioInputSchema>;

export const compareItemSchema = z
  .object(
    {
      lineId: id.optional(),
      scenarioId: id.optional(),
      /** parts per carrier typed by hand for this column */
      partsPerCarrier: partsPerCarrier.optional(),
    },
    objectParams,
  )
  .strict()
  .superRefine((v, ctx) => {
    if ((v.lineId === undefined) === (v.scenarioId === undefined)) {
      ctx.addIssue({ code: "custom", path: [], message: "Give either lineId or scenarioId." });
    }
  });

export const throughputCompareSchema = z
  .object(
    {
      items: z
        .array(compareItemSchema, { error: (i) => (i.input === undefined ? "is required" : "must be a list of { lineId } or { scenarioId }") })
        .min(1, "Pick at least one line or scenario.")
        .max(12, "At most 12 columns."),
      part: partRefSchema,
      coatingId: id,
      /** default: the middle of the coating's film range */
      filmUm: rangeNumber({ gt: 0, lte: 2000 }, "µm").optional(),
      /** parts per carrier typed by hand for every column without its own */
      partsPerCarrier: partsPerCarrier.optional(),
      // REFERENCES.md "Powder": reported first-pass figures are ~40–60 %; 50 % sits in the middle.
      firstPassEfficiency: rangeNumber({ gt: 0, lte: 1 }).default(0.5),
      reclaimEfficiency: rangeNumber({ gte: 0, lte: 1 }).default(0),
      clearanceMm: rangeNumber({ gte: 0, lte: 10_000 }, "mm").default(50),
      orientations: z.enum(["any", "upright"], { error: 'Choose "any" or "upright".' }).default("upright"),
    },
    objectParams,
  )
  .strict();

export type ThroughputCompareBody = z.infer<typeof throughputCompareSchema>;
