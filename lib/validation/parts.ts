/**
 * Parts catalogue input. Metric values with the unit in every name; what a part's area comes
 * from (areaOrigin) decides which of the other fields are required. Messages say what to enter.
 */
import { z } from "zod";
import { AREA_ORIGINS, DIMENSION_NAME, MASS_ORIGINS, MATERIALS, PART_LIMITS } from "@/lib/parts/part-fields";
import type { AreaOrigin, MassOrigin, PartMaterial } from "@/lib/parts/part-fields";

const num = (message: string) =>
  z.number({ error: (issue) => (issue.input === undefined || issue.input === null ? "Required." : message) }).refine(Number.isFinite, message);

function positive(what: string, unit: string, max: number) {
  const message = `Enter ${what} as a number above 0 and at most ${max.toLocaleString("en-US")} ${unit}.`;
  return num(message).refine((v) => v > 0 && v <= max, message);
}

function nonNegative(what: string, unit: string, max: number) {
  const message = `Enter ${what} as a number from 0 to ${max.toLocaleString("en-US")} ${unit}.`;
  return num(message).refine((v) => v >= 0 && v <= max, message);
}

const objectParams = {
  error: (issue: { code?: string; keys?: string[] }) =>
    issue.code === "unrecognized_keys" && issue.keys ? `Unknown field${issue.keys.length === 1 ? "" : "s"}: ${issue.keys.join(", ")}.` : undefined,
};

const dimensionsSchema = z
  .record(
    z.string().regex(DIMENSION_NAME, "A dimension name starts with a letter and has only letters, digits and _ (at most 32)."),
    num("Each dimension is a number of millimetres."),
    { error: "Give the dimensions as an object of names and millimetres, e.g. { \"lengthMm\": 1200 }." },
  )
  .refine((d) => Object.keys(d).length <= PART_LIMITS.dimensions, `At most ${PART_LIMITS.dimensions} dimensions.`);

/** Everything that decides a part's geometry and mass (the preview takes only this). */
const geometryShape = {
  material: z.enum(MATERIALS, { error: "Choose steel, stainless, aluminium or other." }),
  densityKgPerM3: positive("the density", "kg/m³", PART_LIMITS.densityKgPerM3).nullable().optional(),
  thicknessMm: positive("the section thickness", "mm", PART_LIMITS.thicknessMm),
  massKg: positive("the mass", "kg", PART_LIMITS.massKg).nullable().optional(),
  areaOrigin: z.enum(AREA_ORIGINS, { error: "Choose where the area comes from: mesh, template, formula or manual." }),
  templateId: z.string().trim().max(60).nullable().optional(),
  dimensionsMm: dimensionsSchema.nullable().optional(),
  formula: z.string().trim().max(PART_LIMITS.formulaChars, `At most ${PART_LIMITS.formulaChars} characters.`).nullable().optional(),
  areaM2: positive("the outside area", "m²", PART_LIMITS.areaM2).nullable().optional(),
  insideAreaM2: nonNegative("the inside area", "m²", PART_LIMITS.areaM2).nullable().optional(),
  maskedAreaM2: nonNegative("the masked area", "m²", PART_LIMITS.areaM2).nullable().optional(),
  lengthMm: positive("the length", "mm", PART_LIMITS.sizeMm).nullable().optional(),
  widthMm: positive("the width", "mm", PART_LIMITS.sizeMm).nullable().optional(),
  heightMm: positive("the height", "mm", PART_LIMITS.sizeMm).nullable().optional(),
  meshId: z.uuid({ error: "The mesh id is the id an upload answered with." }).nullable().optional(),
};

const text = (what: string, max: number) =>
  z.string({ error: `Enter ${what}.` }).trim().min(1, `Enter ${what}.`).max(max, `At most ${max} characters.`);

const identityShape = {
  number: z
    .string({ error: "Enter a part number." })
    .trim()
    .min(1, "Enter a part number.")
    .max(40, "At most 40 characters.")
    .regex(/^[A-Za-z0-9][A-Za-z0-9._\-/ ]*$/, "Use letters, digits, spaces and . _ - / only, starting with a letter or digit."),
  name: text("a name", 120),
  customer: z.string({ error: "The customer is text." }).trim().max(120, "At most 120 characters.").default(""),
  notes: z.string({ error: "Notes are text." }).max(2000, "At most 2,000 characters.").default(""),
  archived: z.boolean({ error: "archived is true or false." }).optional(),
};

type Geometry = {
  areaOrigin: AreaOrigin;
  material: PartMaterial;
  densityKgPerM3?: number | null;
  templateId?: string | null;
  dimensionsMm?: Record<string, number> | null;
  formula?: string | null;
  areaM2?: number | null;
  lengthMm?: number | null;
  widthMm?: number | null;
  heightMm?: number | null;
  meshId?: string | null;
};

/** The fields each way of finding the area needs. */
function requireByOrigin(v: Geometry, ctx: z.RefinementCtx): void {
  const need = (field: keyof Geometry, message: string) => {
    const value = v[field];
    if (value === undefined || value === null || value === "") ctx.addIssue({ code: "custom", path: [field], message });
  };
  if (v.material === "other") need("densityKgPerM3", "Enter the density of this material (kg/m³).");
  switch (v.areaOrigin) {
    case "mesh":
      need("meshId", "Upload an STL file first: the area comes from its mesh.");
      break;
    case "template":
      need("templateId", "Choose a shape template.");
      need("dimensionsMm", "Enter the template's dimensions.");
      break;
    case "formula":
      need("formula", "Enter the area formula.");
      break;
    case "manual":
      need("areaM2", "Enter the outside area.");
      break;
  }
  // A template or a mesh gives the bounding box; a formula or a typed area does not.
  if (v.areaOrigin === "formula" || v.areaOrigin === "manual") {
    need("lengthMm", "Enter the length of the part's bounding box.");
    need("widthMm", "Enter the width of the part's bounding box.");
    need("heightMm", "Enter the height of the part's bounding box.");
  }
}

/** POST /api/parts, PUT /api/parts/[id], and each imported row. */
export const partInputSchema = z
  .object({ ...identityShape, ...geometryShape }, objectParams)
  .strict()
  .superRefine(requireByOrigin);
export type PartInput = z.infer<typeof partInputSchema>;

/** POST /api/parts/measure: the numbers a part would get, before it has a number and a name. */
export const partMeasureSchema = z.object(geometryShape, objectParams).strict().superRefine(requireByOrigin);
export type PartMeasureInput = z.infer<typeof partMeasureSchema>;

/** PATCH /api/meshes/[id]: the unit the file was drawn in, chosen again. */
export const meshUnitSchema = z
  .object({ unit: z.enum(["mm", "in"], { error: 'The unit is "mm" or "in".' }) }, objectParams)
  .strict();

export const IMPORT_MODES = ["preview", "all", "valid-only"] as const;
export type ImportMode = (typeof IMPORT_MODES)[number];
export const IMPORT_MAX_ROWS = 2000;
/** What a row whose part number is already in the catalogue does: refused, or updates that part. */
export const IMPORT_EXISTING = ["refuse", "update"] as const;
export type ImportExisting = (typeof IMPORT_EXISTING)[number];

/** POST /api/parts/import as JSON: rows as a CSV reader gives them (strings) or typed values. */
export const partImportSchema = z
  .object(
    {
      rows: z
        .array(z.record(z.string(), z.unknown(), { error: "Each row is an object of column names and values." }), {
          error: "rows is a list of row objects.",
        })
        .max(IMPORT_MAX_ROWS, `At most ${IMPORT_MAX_ROWS} rows at a time.`),
      mode: z.enum(IMPORT_MODES, { error: 'mode is "preview", "all" or "valid-only".' }).default("preview"),
      existing: z.enum(IMPORT_EXISTING, { error: 'existing is "refuse" or "update".' }).default("refuse"),
    },
    objectParams,
  )
  .strict();
