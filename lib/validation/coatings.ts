/**
 * Coatings library input: a coating (powder or e-coat) with its cure schedule, and a received
 * stock lot. Metric values with the unit in every name; messages name the allowed range.
 */
import { z } from "zod";
import { describeRange, type NumericRange } from "@/lib/coating-math/errors";
import { COATING_KINDS } from "@/lib/lines/stages";
import { CHEMISTRIES, ECOAT_CHEMISTRIES, POWDER_CHEMISTRIES } from "@/lib/coatings/chemistries";

/** A finite number in `range`; one message naming the whole range for every way it can be wrong. */
export function rangeNumber(range: NumericRange, unit = "") {
  const message = `must be ${describeRange(range)}${unit ? ` ${unit}` : ""}`;
  let schema = z.number({ error: (issue) => (issue.input === undefined || issue.input === null ? "is required" : message) });
  if (range.integer) schema = schema.int(message);
  if (range.gt !== undefined) schema = schema.gt(range.gt, message);
  if (range.gte !== undefined) schema = schema.gte(range.gte, message);
  if (range.lt !== undefined) schema = schema.lt(range.lt, message);
  if (range.lte !== undefined) schema = schema.lte(range.lte, message);
  return schema;
}

/** Names unknown fields instead of zod's generic text. */
export const objectParams = {
  error: (issue: { code?: string; keys?: string[] }) =>
    issue.code === "unrecognized_keys" && issue.keys
      ? `Unknown field${issue.keys.length === 1 ? "" : "s"}: ${issue.keys.join(", ")}`
      : undefined,
};

export function text(what: string, max: number) {
  return z
    .string({ error: `Enter ${what}.` })
    .trim()
    .min(1, `Enter ${what}.`)
    .max(max, `At most ${max} characters.`);
}

export const TEMP_RANGE_C: NumericRange = { gte: -50, lte: 1000 };

export const curePointSchema = z
  .object(
    {
      metalTempC: rangeNumber({ gt: 0, lte: 600 }, "°C"),
      holdMin: rangeNumber({ gte: 0, lte: 1440 }, "min"),
    },
    objectParams,
  )
  .strict();

const optionalNumber = (range: NumericRange, unit = "") => rangeNumber(range, unit).nullable().optional();

export const coatingInputSchema = z
  .object(
    {
      code: z
        .string({ error: "Enter a code." })
        .trim()
        .min(1, "Enter a code.")
        .max(40, "At most 40 characters.")
        .regex(/^[A-Za-z0-9][A-Za-z0-9._\-/ ]*$/, "Use letters, digits, spaces and . _ - / only."),
      name: text("a name", 120),
      kind: z.enum(COATING_KINDS, { error: 'Choose "powder" or "e-coat".' }),
      chemistry: z.enum(CHEMISTRIES, { error: `Choose one of ${CHEMISTRIES.join(", ")}.` }),
      colourName: text("a colour name", 80),
      swatchHex: z.string({ error: "Enter a swatch colour." }).regex(/^#[0-9a-fA-F]{6}$/, "Use a colour like #3d6b4f."),
      specificGravity: optionalNumber({ gt: 0, lte: 20 }),
      volumeSolidsFraction: optionalNumber({ gt: 0, lte: 1 }),
      weightSolidsFraction: optionalNumber({ gt: 0, lte: 1 }),
      filmDensityGPerCm3: optionalNumber({ gt: 0, lte: 20 }, "g/cm³"),
      filmMinUm: rangeNumber({ gt: 0, lte: 5000 }, "µm"),
      filmMaxUm: rangeNumber({ gt: 0, lte: 5000 }, "µm"),
      cureSchedule: z
        .array(curePointSchema, { error: (i) => (i.input === undefined ? "is required" : "must be a list of { metalTempC, holdMin }") })
        .min(1, "Enter at least one cure point (metal temperature and hold time).")
        .max(20, "At most 20 cure points."),
      pricePerKg: rangeNumber({ gte: 0, lte: 1_000_000 }),
      containerKind: z.enum(["box", "drum"], { error: 'Choose "box" or "drum".' }),
      containerKg: rangeNumber({ gt: 0, lte: 5000 }, "kg"),
      supplierName: text("the supplier's name", 120),
      supplierEmail: z
        .string({ error: "Enter the supplier's contact e-mail." })
        .trim()
        .max(254, "At most 254 characters.")
        .email("Enter a valid e-mail address."),
      leadTimeDays: rangeNumber({ integer: true, gte: 0, lte: 365 }, "days"),
      shelfLifeMonths: rangeNumber({ integer: true, gte: 1, lte: 120 }, "months"),
      reorderPointKg: rangeNumber({ gte: 0, lte: 1_000_000 }, "kg").default(0),
      archived: z.boolean({ error: "Must be true or false." }).optional(),
    },
    objectParams,
  )
  .strict()
  .superRefine((v, ctx) => {
    const need = (field: keyof typeof v, message: string) => ctx.addIssue({ code: "custom", path: [field], message });
    if (v.kind === "powder") {
      if (v.specificGravity == null) need("specificGravity", "A powder needs its specific gravity (ASTM D5965), e.g. 1.5.");
      for (const f of ["volumeSolidsFraction", "weightSolidsFraction", "filmDensityGPerCm3"] as const) {
        if (v[f] != null) need(f, "Only for e-coat paints; leave it empty for a powder.");
      }
      if (!(POWDER_CHEMISTRIES as readonly string[]).includes(v.chemistry)) need("chemistry", `A powder is one of ${POWDER_CHEMISTRIES.join(", ")}.`);
    } else {
      if (v.volumeSolidsFraction == null) need("volumeSolidsFraction", "An e-coat paint needs its volume solids as supplied (0–1).");
      if (v.weightSolidsFraction == null) need("weightSolidsFraction", "An e-coat paint needs its weight solids as supplied (0–1).");
      if (v.filmDensityGPerCm3 == null) need("filmDensityGPerCm3", "An e-coat needs the density of its deposited film, e.g. 1.4 g/cm³.");
      if (v.specificGravity != null) need("specificGravity", "Only for powders; an e-coat uses volume and weight solids.");
      if (!(ECOAT_CHEMISTRIES as readonly string[]).includes(v.chemistry)) need("chemistry", `An e-coat is one of ${ECOAT_CHEMISTRIES.join(", ")}.`);
    }
    if (v.filmMinUm > v.filmMaxUm) need("filmMinUm", "must be at most filmMaxUm");
    const seen = new Map<number, number>();
    v.cureSchedule.forEach((p, i) => {
      const first = seen.get(p.metalTempC);
      if (first !== undefined) {
        ctx.addIssue({
          code: "custom",
          path: ["cureSchedule", i, "metalTempC"],
          message: `${p.metalTempC} °C is listed twice (points ${first + 1} and ${i + 1}); each metal temperature may appear once.`,
        });
      } else seen.set(p.metalTempC, i);
    });
  });

export type CoatingInput = z.infer<typeof coatingInputSchema>;
export type CoatingInputRaw = z.input<typeof coatingInputSchema>;

/** "YYYY-MM-DD", a real calendar day. */
export const isoDate = z
  .string({ error: "Enter a date as YYYY-MM-DD." })
  .regex(/^\d{4}-\d{2}-\d{2}$/, "Enter a date as YYYY-MM-DD.")
  .refine((s) => {
    const d = new Date(`${s}T00:00:00Z`);
    return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === s;
  }, "That day does not exist.");

export const lotInputSchema = z
  .object(
    {
      lotNumber: z
        .string({ error: "Enter the lot number." })
        .trim()
        .min(1, "Enter the lot number.")
        .max(60, "At most 60 characters."),
      receivedDate: isoDate,
      kgOnHand: rangeNumber({ gt: 0, lte: 1_000_000 }, "kg"),
      /** defaults to the received date plus the coating's shelf life */
      expiryDate: isoDate.optional(),
    },
    objectParams,
  )
  .strict()
  .refine((v) => v.expiryDate === undefined || v.expiryDate > v.receivedDate, {
    path: ["expiryDate"],
    message: "must be after the received date",
  });

export type LotInput = z.infer<typeof lotInputSchema>;
