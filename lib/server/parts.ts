/**
 * The parts catalogue: a part's coated area from its mesh, a dimension template, a formula or a
 * typed figure; masking subtracted; mass from the metal volume (or a thin-wall estimate) and the
 * density; CSV export and an all-or-nothing CSV import. Geometry comes from lib/geometry.
 */
import { randomUUID } from "node:crypto";
import Papa from "papaparse";
import { getDb, type Db } from "@/db/index";
import {
  partIdsByNumber,
  writeParts,
  findPartByNumber,
  findPartRow,
  insertPart,
  listPartRows,
  updatePart,
  type NewPartRow,
  type PartRow,
} from "@/db/queries/parts";
import { convert } from "@/lib/coating-math/units";
import { evaluateAreaFormula } from "@/lib/geometry/area-formula";
import { GeometryError } from "@/lib/geometry/errors";
import { MM_PER_M } from "@/lib/geometry/length-units";
import { DENSITY_KG_PER_M3, massFromVolumeKg, netCoatedAreaM2, plateMassKg, solidBoxMassKg, type Material } from "@/lib/geometry/mass";
import { DIMENSION_TEMPLATES, findTemplate } from "@/lib/geometry/templates";
import { MASS_ORIGINS, type AreaOrigin, type MassOrigin, type PartMaterial } from "@/lib/parts/part-fields";
import { IMPORT_MAX_ROWS, partInputSchema, type ImportExisting, type ImportMode, type PartInput, type PartMeasureInput } from "@/lib/validation/parts";
import { ApiError, isUniqueViolation, zodFields } from "./http";
import { findMesh, type MeshView } from "./meshes";

export interface PartView {
  id: string;
  number: string;
  name: string;
  customer: string;
  material: PartMaterial;
  densityKgPerM3: number;
  thicknessMm: number;
  massKg: number;
  massOrigin: MassOrigin;
  /** outside area, before masking */
  areaM2: number;
  /** inside of tubes and boxes: e-coat reaches it, powder mostly does not */
  insideAreaM2: number;
  maskedAreaM2: number;
  /** areaM2 − maskedAreaM2 */
  coatedAreaM2: number;
  areaOrigin: AreaOrigin;
  templateId: string | null;
  dimensionsMm: Record<string, number> | null;
  formula: string | null;
  lengthMm: number;
  widthMm: number;
  heightMm: number;
  meshId: string | null;
  notes: string;
  archived: boolean;
  createdAt: number;
  updatedAt: number;
}

/** What a part's inputs work out to (POST /api/parts/measure, and before every save). */
export interface PartMeasure {
  areaM2: number;
  insideAreaM2: number;
  maskedAreaM2: number;
  coatedAreaM2: number;
  /** cut ends, plate edges or a rim inside areaM2 (templates only) */
  edgeAreaM2: number | null;
  /** metal volume when known: a closed mesh or a template */
  volumeM3: number | null;
  densityKgPerM3: number;
  massKg: number;
  massOrigin: MassOrigin;
  lengthMm: number;
  widthMm: number;
  heightMm: number;
  templateId: string | null;
  dimensionsMm: Record<string, number> | null;
  formula: string | null;
  meshId: string | null;
  /** a sentence on how the mass was found */
  massBasis: string;
  /** a solid block of this metal filling the box: a mass above it cannot be right */
  solidBoxMassKg: number;
}

export interface TemplateInfo {
  id: string;
  name: string;
  description: string;
  dimensions: { name: string; label: string }[];
}

/** The shape templates as plain data for forms (the measuring stays on the server). */
export function templateCatalogue(): TemplateInfo[] {
  return DIMENSION_TEMPLATES.map((t) => ({
    id: t.id,
    name: t.name,
    description: t.description,
    dimensions: t.dimensions.map((d) => ({ name: d.name, label: d.label })),
  }));
}

const nowSeconds = () => Math.floor(Date.now() / 1000);

function invalid(field: string, message: string): ApiError {
  return new ApiError(400, "invalid_input", message, { [field]: message });
}

/** A GeometryError's field, as the path of the API input it is about. */
function geometryFailure(e: GeometryError, origin: AreaOrigin, dimensionNames: readonly string[]): ApiError {
  const isDimension = e.code === "invalid_dimension" || dimensionNames.includes(e.field);
  const field = (origin === "template" || origin === "formula") && isDimension ? `dimensionsMm.${e.field}` : e.field;
  return invalid(field, e.message);
}

function defaultDensity(material: PartMaterial): number | null {
  return material === "other" ? null : DENSITY_KG_PER_M3[material];
}

/** ρ·V: through lib/geometry/mass.ts for a handbook density, directly for a plant's own figure. */
function massFromVolume(volumeM3: number, material: PartMaterial, densityKgPerM3: number): number {
  if (material !== "other" && densityKgPerM3 === DENSITY_KG_PER_M3[material]) return massFromVolumeKg(volumeM3, material as Material);
  return volumeM3 * densityKgPerM3;
}

/**
 * A thin-walled part with no known volume: metal ≈ half its whole surface (outside + inside)
 * × the section thickness (common practice, no source; edges and bends are ignored).
 */
function sheetMass(totalAreaM2: number, thicknessMm: number, material: PartMaterial, densityKgPerM3: number): number {
  const faceAreaM2 = totalAreaM2 / 2;
  if (material !== "other" && densityKgPerM3 === DENSITY_KG_PER_M3[material]) return plateMassKg(faceAreaM2, thicknessMm, material as Material);
  return faceAreaM2 * (thicknessMm / MM_PER_M) * densityKgPerM3;
}

const fmt = (v: number) => Number(v.toPrecision(4)).toLocaleString("en-US");

/** Works out a part's area, bounding box and mass from its inputs; throws 400s naming the field. */
export async function measurePart(input: PartMeasureInput): Promise<PartMeasure> {
  const origin = input.areaOrigin;
  const densityKgPerM3 = input.densityKgPerM3 ?? defaultDensity(input.material);
  if (densityKgPerM3 === null) throw invalid("densityKgPerM3", "Enter the density of this material (kg/m³).");
  let mesh: MeshView | null = null;
  if (input.meshId) {
    mesh = await findMesh(input.meshId);
    if (!mesh) throw invalid("meshId", "There is no uploaded mesh with this id; upload the STL file again.");
  }

  let areaM2: number;
  let insideAreaM2 = input.insideAreaM2 ?? 0;
  let edgeAreaM2: number | null = null;
  let volumeM3: number | null = null;
  let box = { lengthMm: input.lengthMm ?? 0, widthMm: input.widthMm ?? 0, heightMm: input.heightMm ?? 0 };
  let templateId: string | null = null;
  let dimensionsMm: Record<string, number> | null = null;
  let formula: string | null = null;
  let dimensionNames: string[] = Object.keys(input.dimensionsMm ?? {});

  try {
    switch (origin) {
      case "mesh": {
        if (!mesh) throw invalid("meshId", "Upload an STL file first: the area comes from its mesh.");
        // The mesh measures every face; what the engineer marks as inside is kept apart.
        if (insideAreaM2 >= mesh.areaM2) {
          throw invalid("insideAreaM2", `The inside area must be less than the mesh's whole surface (${fmt(mesh.areaM2)} m²).`);
        }
        areaM2 = mesh.areaM2 - insideAreaM2;
        volumeM3 = mesh.closed ? mesh.volumeM3 : null;
        // PRODUCT.md: a mesh's bounding box maps x → length, y → width, z → height (CAD is Z-up).
        box = { lengthMm: mesh.bboxMm.x, widthMm: mesh.bboxMm.y, heightMm: mesh.bboxMm.z };
        break;
      }
      case "template": {
        const template = findTemplate(input.templateId ?? "");
        dimensionNames = template.dimensions.map((d) => d.name);
        const given = input.dimensionsMm ?? {};
        const extra = Object.keys(given).filter((k) => !dimensionNames.includes(k));
        if (extra.length) {
          throw invalid(
            `dimensionsMm.${extra[0]}`,
            `The ${template.name.toLowerCase()} template has no dimension "${extra[0]}"; it takes ${dimensionNames.join(", ")}.`,
          );
        }
        const measured = template.measure(given);
        areaM2 = measured.outsideAreaM2;
        insideAreaM2 = measured.insideAreaM2;
        edgeAreaM2 = measured.edgeAreaM2;
        volumeM3 = measured.volumeM3;
        // A formed part measured flat (a rolled fender's blank) hangs as its formed shape: a box
        // given in full wins over the template's.
        if (!(input.lengthMm && input.widthMm && input.heightMm)) {
          box = { lengthMm: measured.bboxMm.x, widthMm: measured.bboxMm.y, heightMm: measured.bboxMm.z };
        }
        templateId = template.id;
        dimensionsMm = Object.fromEntries(dimensionNames.map((n) => [n, given[n]]));
        break;
      }
      case "formula": {
        formula = (input.formula ?? "").trim();
        dimensionsMm = { ...(input.dimensionsMm ?? {}) };
        areaM2 = evaluateAreaFormula(formula, dimensionsMm);
        break;
      }
      case "manual":
        areaM2 = input.areaM2 ?? 0;
        break;
    }
  } catch (e) {
    if (e instanceof GeometryError) throw geometryFailure(e, origin, dimensionNames);
    throw e;
  }

  let coatedAreaM2: number;
  const maskedAreaM2 = input.maskedAreaM2 ?? 0;
  try {
    coatedAreaM2 = netCoatedAreaM2(areaM2, maskedAreaM2);
  } catch (e) {
    if (e instanceof GeometryError) throw invalid("maskedAreaM2", e.message);
    throw e;
  }

  let massKg: number;
  let massOrigin: MassOrigin;
  let massBasis: string;
  const density = `${fmt(densityKgPerM3)} kg/m³`;
  if (input.massKg != null) {
    massKg = input.massKg;
    massOrigin = "entered";
    massBasis = "Entered (weighed or from the drawing).";
  } else if (volumeM3 !== null) {
    massKg = massFromVolume(volumeM3, input.material, densityKgPerM3);
    massOrigin = "volume";
    massBasis = `Metal volume ${fmt(convert(volumeM3, "m^3", "L"))} L × ${density}${origin === "mesh" ? " (the mesh is closed)" : ""}.`;
  } else {
    massKg = sheetMass(areaM2 + insideAreaM2, input.thicknessMm, input.material, densityKgPerM3);
    massOrigin = "sheet";
    massBasis =
      origin === "mesh"
        ? `The mesh is not closed, so it has no volume: estimated as half its surface × ${fmt(input.thicknessMm)} mm × ${density}.`
        : `Estimated for a thin-walled part: half the surface × ${fmt(input.thicknessMm)} mm × ${density}.`;
  }

  return {
    areaM2,
    insideAreaM2,
    maskedAreaM2,
    coatedAreaM2,
    edgeAreaM2,
    volumeM3,
    densityKgPerM3,
    massKg,
    massOrigin,
    ...box,
    templateId,
    dimensionsMm,
    formula,
    meshId: input.meshId ?? null,
    massBasis,
    solidBoxMassKg: solidBoxMassKg(box.lengthMm, box.widthMm, box.heightMm, densityKgPerM3),
  };
}

export function toPartView(r: PartRow): PartView {
  return {
    id: r.id,
    number: r.number,
    name: r.name,
    customer: r.customer,
    material: r.material,
    densityKgPerM3: r.density_kg_per_m3,
    thicknessMm: r.thickness_mm,
    massKg: r.mass_kg,
    massOrigin: r.mass_origin,
    areaM2: r.area_m2,
    insideAreaM2: r.inside_area_m2,
    maskedAreaM2: r.masked_area_m2,
    coatedAreaM2: Math.max(0, r.area_m2 - r.masked_area_m2),
    areaOrigin: r.area_origin,
    templateId: r.template_id,
    dimensionsMm: r.dimensions_json ? (JSON.parse(r.dimensions_json) as Record<string, number>) : null,
    formula: r.formula,
    lengthMm: r.length_mm,
    widthMm: r.width_mm,
    heightMm: r.height_mm,
    meshId: r.mesh_id,
    notes: r.notes,
    archived: r.archived === 1,
    createdAt: r.created_at,
    updatedAt: r.updated_at,
  };
}

function rowValues(input: PartInput, m: PartMeasure) {
  return {
    number: input.number,
    name: input.name,
    customer: input.customer,
    material: input.material,
    density_kg_per_m3: m.densityKgPerM3,
    thickness_mm: input.thicknessMm,
    mass_kg: m.massKg,
    mass_origin: m.massOrigin,
    area_m2: m.areaM2,
    inside_area_m2: m.insideAreaM2,
    masked_area_m2: m.maskedAreaM2,
    area_origin: input.areaOrigin,
    template_id: m.templateId,
    dimensions_json: m.dimensionsMm ? JSON.stringify(m.dimensionsMm) : null,
    formula: m.formula,
    length_mm: m.lengthMm,
    width_mm: m.widthMm,
    height_mm: m.heightMm,
    mesh_id: m.meshId,
    notes: input.notes,
  };
}

function numberTaken(number: string): ApiError {
  return new ApiError(409, "conflict", `A part numbered ${number} is already in the catalogue.`, {
    number: "This part number is already in the catalogue (archived parts count too).",
  });
}

export interface PartFilter {
  q?: string;
  includeArchived?: boolean;
}

export async function listParts(filter: PartFilter = {}): Promise<PartView[]> {
  const rows = await listPartRows(await getDb(), { includeArchived: filter.includeArchived });
  const q = filter.q?.trim().toLowerCase();
  const views = rows.map(toPartView);
  if (!q) return views;
  return views.filter((p) => [p.number, p.name, p.customer].some((s) => s.toLowerCase().includes(q)));
}

async function partRow(db: Db, id: string): Promise<PartRow> {
  const row = /^[0-9a-f-]{36}$/i.test(id) ? await findPartRow(db, id.toLowerCase()) : undefined;
  if (!row) throw new ApiError(404, "not_found", "No such part.");
  return row;
}

export async function getPart(id: string): Promise<{ part: PartView; mesh: MeshView | null }> {
  const part = toPartView(await partRow(await getDb(), id));
  return { part, mesh: part.meshId ? await findMesh(part.meshId) : null };
}

export async function createPart(input: PartInput): Promise<PartView> {
  const db = await getDb();
  if (await findPartByNumber(db, input.number)) throw numberTaken(input.number);
  const m = await measurePart(input);
  const id = randomUUID();
  const t = nowSeconds();
  try {
    await insertPart(db, { id, ...rowValues(input, m), archived: input.archived ? 1 : 0, created_at: t, updated_at: t });
  } catch (e) {
    if (isUniqueViolation(e)) throw numberTaken(input.number);
    throw e;
  }
  return toPartView(await partRow(db, id));
}

export async function replacePart(id: string, input: PartInput): Promise<PartView> {
  const db = await getDb();
  const existing = await partRow(db, id);
  const other = await findPartByNumber(db, input.number);
  if (other && other.id !== existing.id) throw numberTaken(input.number);
  const m = await measurePart(input);
  try {
    await updatePart(db, existing.id, {
      ...rowValues(input, m),
      ...(input.archived === undefined ? {} : { archived: input.archived ? 1 : 0 }),
      updated_at: nowSeconds(),
    });
  } catch (e) {
    if (isUniqueViolation(e)) throw numberTaken(input.number);
    throw e;
  }
  return toPartView(await partRow(db, existing.id));
}

/** DELETE: parts are archived, never removed (plans and runs may refer to them). */
export async function archivePart(id: string): Promise<PartView> {
  const db = await getDb();
  const row = await partRow(db, id);
  await updatePart(db, row.id, { archived: 1, updated_at: nowSeconds() });
  return toPartView(await partRow(db, row.id));
}

// ---------------------------------------------------------------------------------------------
// CSV

/** Export columns, in order; an import reads the same names (computed ones are skipped). */
export const CSV_COLUMNS = [
  "number",
  "name",
  "customer",
  "material",
  "densityKgPerM3",
  "thicknessMm",
  "massKg",
  "massOrigin",
  "areaM2",
  "insideAreaM2",
  "maskedAreaM2",
  "coatedAreaM2",
  "areaOrigin",
  "templateId",
  "dimensionsMm",
  "formula",
  "lengthMm",
  "widthMm",
  "heightMm",
  "meshId",
  "notes",
  "archived",
] as const;
type CsvColumn = (typeof CSV_COLUMNS)[number];

/** Columns an export writes that an import works out again rather than reads. */
const COMPUTED_COLUMNS = new Set(["coatedaream2", "id", "createdat", "updatedat"]);
const NUMBER_COLUMNS = new Set<CsvColumn>([
  "densityKgPerM3",
  "thicknessMm",
  "massKg",
  "areaM2",
  "insideAreaM2",
  "maskedAreaM2",
  "lengthMm",
  "widthMm",
  "heightMm",
]);
const LOWER_CASE_COLUMNS = new Set<CsvColumn>(["material", "areaOrigin", "templateId", "massOrigin"]);
const COLUMN_BY_KEY = new Map(CSV_COLUMNS.map((c) => [c.toLowerCase(), c]));

/** "lengthMm=1200;widthMm=50" — one cell, readable in a spreadsheet. */
function dimensionsText(d: Record<string, number> | null): string {
  return d ? Object.entries(d).map(([k, v]) => `${k}=${v}`).join(";") : "";
}

function csvCell(p: PartView, c: CsvColumn): string | number {
  switch (c) {
    case "dimensionsMm":
      return dimensionsText(p.dimensionsMm);
    case "archived":
      return p.archived ? "yes" : "no";
    default: {
      const v = p[c];
      return v === null || v === undefined ? "" : (v as string | number);
    }
  }
}

export async function exportPartsCsv(includeArchived: boolean): Promise<string> {
  const parts = await listParts({ includeArchived });
  // escapeFormulae: a cell starting with = + - @ is not run as a formula by a spreadsheet.
  return Papa.unparse(
    { fields: [...CSV_COLUMNS], data: parts.map((p) => CSV_COLUMNS.map((c) => csvCell(p, c))) },
    { escapeFormulae: true, newline: "\r\n" },
  );
}

export interface ImportRowReport {
  /** the row in the file, counting the header line as row 1 */
  row: number;
  number: string;
  name: string;
  valid: boolean;
  /** field → what is wrong */
  errors: Record<string, string>;
  /** a new part, or an update of the part with this number (existing: "update") */
  action: "create" | "update";
  areaM2: number | null;
  coatedAreaM2: number | null;
  massKg: number | null;
}

export interface ImportResult {
  mode: ImportMode;
  existing: ImportExisting;
  /** true when the rows were written */
  imported: boolean;
  importedCount: number;
  /** of the valid rows: new parts and updated ones */
  createCount: number;
  updateCount: number;
  validCount: number;
  invalidCount: number;
  /** problems with the file as a whole (unknown columns, unreadable CSV); they block any import */
  problems: string[];
  rows: ImportRowReport[];
}

const NUMBER_TEXT = /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i;

function parseDimensionsText(text: string): Record<string, number> | null {
  const t = text.trim();
  if (t.startsWith("{")) {
    try {
      const o = JSON.parse(t) as unknown;
      return o && typeof o === "object" && !Array.isArray(o) ? (o as Record<string, number>) : null;
    } catch {
      return null;
    }
  }
  const out: Record<string, number> = {};
  for (const pair of t.split(/[;\n]/)) {
    if (!pair.trim()) continue;
    const m = /^\s*([^=:\s]+)\s*[=:]\s*(\S+)\s*$/.exec(pair);
    if (!m || !NUMBER_TEXT.test(m[2])) return null;
    out[m[1]] = Number(m[2]);
  }
  return out;
}

/** One row as a CSV reader gives it (all text) or as typed JSON → the part input and early errors. */
function coerceRow(raw: Record<string, unknown>): { value: Record<string, unknown>; errors: Record<string, string> } {
  const value: Record<string, unknown> = {};
  const errors: Record<string, string> = {};
  let massOrigin: unknown;
  for (const [key, cell] of Object.entries(raw)) {
    const lower = key.trim().toLowerCase();
    const column = COLUMN_BY_KEY.get(lower);
    // Unknown columns are reported once for the whole file; computed ones are worked out again.
    if (!column || COMPUTED_COLUMNS.has(lower)) continue;
    let v: unknown = cell;
    if (typeof v === "string") {
      v = v.trim();
      // Undo the export's spreadsheet-formula guard.
      if (/^'[=+\-@\t\r]/.test(v as string)) v = (v as string).slice(1);
      if (v === "") continue;
      if (NUMBER_COLUMNS.has(column) && NUMBER_TEXT.test(v as string)) v = Number(v);
      else if (LOWER_CASE_COLUMNS.has(column)) v = (v as string).toLowerCase();
    }
    if (column === "massOrigin") {
      massOrigin = v;
      continue;
    }
    if (column === "archived" && typeof v === "string") {
      const yes = ["yes", "true", "1", "y"].includes(v.toLowerCase());
      const no = ["no", "false", "0", "n"].includes(v.toLowerCase());
      if (!yes && !no) errors.archived = 'Write "yes" or "no".';
      v = yes;
    }
    if (column === "dimensionsMm" && typeof v === "string") {
      const d = parseDimensionsText(v);
      if (!d) {
        errors.dimensionsMm = 'Write the dimensions as name=millimetres pairs separated by ";", e.g. lengthMm=1200;widthMm=50.';
        continue;
      }
      v = d;
    }
    value[column] = v;
  }
  if (massOrigin !== undefined && massOrigin !== null) {
    if (!MASS_ORIGINS.includes(massOrigin as MassOrigin)) errors.massOrigin = `Write one of ${MASS_ORIGINS.join(", ")}.`;
    // A worked-out mass is worked out again; only an entered one is kept.
    else if (massOrigin !== "entered") delete value.massKg;
  }
  return { value, errors };
}

/** Columns no import reads, named once for the whole file. */
function unknownColumns(rows: Record<string, unknown>[]): string[] {
  const seen = new Set<string>();
  for (const r of rows) for (const k of Object.keys(r)) seen.add(k.trim());
  return [...seen].filter((k) => k !== "" && !COLUMN_BY_KEY.has(k.toLowerCase()) && !COMPUTED_COLUMNS.has(k.toLowerCase()));
}

interface CheckedRow {
  report: ImportRowReport;
  insert: NewPartRow | null;
  update: { id: string; patch: Omit<NewPartRow, "id" | "created_at"> } | null;
}

async function checkRows(db: Db, rows: Record<string, unknown>[], rowErrors: Map<number, string>, onExisting: ImportExisting): Promise<CheckedRow[]> {
  const existing = await partIdsByNumber(db);
  const firstRowOf = new Map<string, number>();
  const t = nowSeconds();
  const out: CheckedRow[] = [];
  for (let i = 0; i < rows.length; i++) {
    const rowNo = i + 2;
    const { value, errors } = coerceRow(rows[i]);
    const csvProblem = rowErrors.get(i);
    if (csvProblem) errors.row = csvProblem;
    const number = typeof value.number === "string" ? value.number : "";
    const name = typeof value.name === "string" ? value.name : "";
    const existingId = number ? existing.get(number.toLowerCase()) : undefined;
    if (number) {
      const key = number.toLowerCase();
      if (existingId !== undefined && onExisting === "refuse") {
        errors.number ??= `A part numbered ${number} is already in the catalogue; choose to update existing parts to change it.`;
      }
      const first = firstRowOf.get(key);
      if (first !== undefined) errors.number ??= `Part number ${number} is also on row ${first}.`;
      else firstRowOf.set(key, rowNo);
    }
    let measure: PartMeasure | null = null;
    let input: PartInput | null = null;
    const parsed = partInputSchema.safeParse(value);
    if (!parsed.success) {
      for (const [f, message] of Object.entries(zodFields(parsed.error))) errors[f] ??= message;
    } else if (Object.keys(errors).length === 0) {
      input = parsed.data;
      try {
        measure = await measurePart(input);
      } catch (e) {
        if (!(e instanceof ApiError) || e.status !== 400) throw e;
        for (const [f, message] of Object.entries(e.fields ?? { row: e.message })) errors[f] ??= message;
      }
    }
    const valid = Object.keys(errors).length === 0 && input !== null && measure !== null;
    const action = existingId !== undefined ? "update" : "create";
    out.push({
      report: {
        row: rowNo,
        number,
        name,
        valid,
        errors,
        action,
        areaM2: measure?.areaM2 ?? null,
        coatedAreaM2: measure?.coatedAreaM2 ?? null,
        massKg: measure?.massKg ?? null,
      },
      insert:
        valid && input && measure && action === "create"
          ? { id: randomUUID(), ...rowValues(input, measure), archived: input.archived ? 1 : 0, created_at: t, updated_at: t }
          : null,
      update:
        valid && input && measure && existingId !== undefined
          ? { id: existingId, patch: { ...rowValues(input, measure), archived: input.archived ? 1 : 0, updated_at: t } }
          : null,
    });
  }
  return out;
}

/**
 * Checks every row; writes nothing in "preview", everything only when every row is valid in
 * "all", and the valid rows only in "valid-only" (an explicit choice). One transaction. A row
 * whose number is already in the catalogue is refused, or with `existing: "update"` replaces
 * that part's values (its id stays, so runs and racking plans keep pointing at it; runs that
 * have started keep their own frozen figures).
 */
export async function importParts(
  rows: Record<string, unknown>[],
  mode: ImportMode,
  fileProblems: string[] = [],
  rowErrors = new Map<number, string>(),
  existing: ImportExisting = "refuse",
): Promise<ImportResult> {
  const db = await getDb();
  const problems = [...fileProblems];
  const unknown = unknownColumns(rows);
  if (unknown.length) {
    problems.push(
      `Unknown column${unknown.length === 1 ? "" : "s"} ${unknown.map((c) => `"${c}"`).join(", ")}. The columns are: ${CSV_COLUMNS.join(", ")}.`,
    );
  }
  if (rows.length === 0) problems.push("The file has no rows under its header line.");
  if (rows.length > IMPORT_MAX_ROWS) problems.push(`At most ${IMPORT_MAX_ROWS} rows at a time; the file has ${rows.length}.`);
  const checked = rows.length > IMPORT_MAX_ROWS ? [] : await checkRows(db, rows, rowErrors, existing);
  const validRows = checked.filter((c) => c.insert !== null || c.update !== null);
  const result: ImportResult = {
    mode,
    existing,
    imported: false,
    importedCount: 0,
    createCount: validRows.filter((c) => c.insert !== null).length,
    updateCount: validRows.filter((c) => c.update !== null).length,
    validCount: validRows.length,
    invalidCount: checked.length - validRows.length,
    problems,
    rows: checked.map((c) => c.report),
  };
  if (mode === "preview") return result;
  const blocked = problems.length > 0 || (mode === "all" ? result.invalidCount > 0 : validRows.length === 0);
  if (blocked) throw new ImportRefused(result);
  try {
    await writeParts(
      db,
      validRows.flatMap((c) => (c.insert ? [c.insert] : [])),
      validRows.flatMap((c) => (c.update ? [c.update] : [])),
    );
  } catch (e) {
    if (isUniqueViolation(e)) throw new ApiError(409, "conflict", "Another part with one of these numbers was saved meanwhile; nothing was imported. Check the file again.");
    throw e;
  }
  return { ...result, imported: true, importedCount: validRows.length };
}

/** Thrown when an import may not be written; the route answers 400 with the row report. */
export class ImportRefused extends Error {
  constructor(public result: ImportResult) {
    const bad = result.rows.filter((r) => !r.valid);
    const first = bad[0];
    const firstText = first ? ` Row ${first.row}: ${Object.entries(first.errors).map(([f, m]) => `${f} — ${m}`).join("; ")}` : "";
    super(
      result.problems.length
        ? `Nothing was imported: ${result.problems.join(" ")}`
        : result.mode === "all"
          ? `Nothing was imported: ${bad.length} of ${result.rows.length} rows have problems.${firstText}`
          : "Nothing was imported: no row is valid.",
    );
  }

  /** The one error shape, with `fields` as rows.<row>.<field> and the full row report. */
  toResponse(): Response {
    const fields: Record<string, string> = {};
    for (const r of this.result.rows) for (const [f, m] of Object.entries(r.errors)) fields[`rows.${r.row}.${f}`] = m;
    return Response.json(
      { error: { code: "invalid_input", message: this.message, fields, problems: this.result.problems, rows: this.result.rows } },
      { status: 400 },
    );
  }
}

const CSV_ROW_PROBLEMS: Record<string, string> = {
  TooManyFields: "The line has more cells than the header line has columns.",
  TooFewFields: "The line has fewer cells than the header line has columns.",
  MissingQuotes: "A quoted cell is not closed on this line.",
  InvalidQuotes: "A quote mark inside a cell is not doubled.",
};

/** Reads a CSV file's text into rows (header line first); CSV-level problems per row. */
export function parsePartsCsv(text: string): { rows: Record<string, string>[]; problems: string[]; rowErrors: Map<number, string> } {
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ""), {
    header: true,
    skipEmptyLines: "greedy",
    transformHeader: (h) => h.trim(),
  });
  const problems: string[] = [];
  const rowErrors = new Map<number, string>();
  for (const e of parsed.errors) {
    if (e.code === "UndetectableDelimiter") continue; // one column: not an error in itself
    if (typeof e.row === "number") rowErrors.set(e.row, CSV_ROW_PROBLEMS[e.code] ?? `The line cannot be read: ${e.message}.`);
    else problems.push(`The file is not readable as CSV: ${e.message}.`);
  }
  const fields = parsed.meta.fields ?? [];
  if (!fields.some((f) => f.toLowerCase() === "number")) {
    problems.push(`The first line must name the columns (at least "number"); the columns are: ${CSV_COLUMNS.join(", ")}.`);
  }
  // Papaparse files surplus cells under "__parsed_extra"; they are reported as a row problem.
  const rows = parsed.data.map((r, i) => {
    if ("__parsed_extra" in r) {
      rowErrors.set(i, rowErrors.get(i) ?? CSV_ROW_PROBLEMS.TooManyFields);
      const { __parsed_extra: _extra, ...rest } = r as Record<string, string> & { __parsed_extra?: unknown };
      return rest;
    }
    return r;
  });
  return { rows, problems, rowErrors };
}


const CSV_MAX_BYTES = 2 * 1024 * 1024;

/** Reads a multipart body of at most 2 MB: the CSV `file` and the optional `mode`. */
export async function readCsvUpload(request: Request): Promise<{ text: string; mode: ImportMode; existing: ImportExisting }> {
  const tooLarge = () => new ApiError(413, "too_large", "The CSV file is larger than 2 MB; split it into smaller files.", { file: "At most 2 MB." });
  if (Number(request.headers.get("content-length")) > CSV_MAX_BYTES + 64 * 1024) {
    await request.body?.cancel().catch(() => undefined);
    throw tooLarge();
  }
  const chunks: Uint8Array[] = [];
  let total = 0;
  if (request.body) {
    const reader = request.body.getReader();
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      total += value.length;
      if (total > CSV_MAX_BYTES + 64 * 1024) {
        await reader.cancel().catch(() => undefined);
        throw tooLarge();
      }
      chunks.push(value);
    }
  }
  let form: FormData;
  try {
    form = await new Response(new Blob(chunks as BlobPart[]), { headers: { "content-type": request.headers.get("content-type") ?? "" } }).formData();
  } catch {
    throw invalid("file", 'Send the CSV as a multipart form with the field "file".');
  }
  const file = form.get("file");
  if (!file || typeof file === "string") throw invalid("file", 'The CSV file is missing: send it in the form field "file".');
  const modeText = form.get("mode");
  const mode = modeText === null || modeText === "" ? "preview" : String(modeText);
  if (mode !== "preview" && mode !== "all" && mode !== "valid-only") throw invalid("mode", 'mode is "preview", "all" or "valid-only".');
  const existingText = form.get("existing");
  const existing = existingText === null || existingText === "" ? "refuse" : String(existingText);
  if (existing !== "refuse" && existing !== "update") throw invalid("existing", 'existing is "refuse" or "update".');
  const bytes = new Uint8Array(await file.arrayBuffer());
  if (bytes.includes(0)) throw invalid("file", "The file is not a CSV text file.");
  return { text: new TextDecoder("utf-8").decode(bytes), mode, existing };
}
