import { getDb, type Db } from "@/db/index";
import { findCoatingRow } from "@/db/queries/coatings";
import { findLineRow, stagesOf } from "@/db/queries/lines";
import {
  findPartFigures,
  findScenarioRow,
  insertScenario,
  listScenarioRows,
  liveScenarioNames,
  updateScenario,
  type ScenarioListRow,
} from "@/db/queries/scenarios";
import { DomainError } from "@/lib/coating-math/errors";
import { applyOverrides, type CompareLine, type ScenarioOverrides } from "@/lib/lines/throughput-compare";
import { overridesSchema, type PartRef, type ScenarioInput } from "@/lib/validation/scenarios";
import { nowSeconds } from "./coatings";
import { ApiError, isUniqueViolation } from "./http";
import { toLineView, type LineView } from "./lines";
import type { SessionUser } from "./session";

export interface ScenarioView {
  id: number;
  name: string;
  lineId: number;
  lineName: string;
  overrides: ScenarioOverrides;
  /** the part it was made for: a catalogue part or figures entered by hand */
  part: PartRef | null;
  coatingId: number | null;
  createdBy: string | null;
  createdByName: string | null;
  createdAt: number;
  updatedAt: number;
  archived: boolean;
}

/** The line as the pure throughput module takes it. */
export function toCompareLine(line: LineView): CompareLine {
  const common = { name: line.name, hourlyCost: line.hourlyCost, windowMm: line.windowMm, maxLoadKg: line.maxLoadKg };
  if (line.kind === "batch") {
    return {
      ...common,
      kind: "batch",
      racksPerLoad: line.racksPerLoad,
      airTempC: line.airTempC,
      heatTransferCoefficientWPerM2K: line.heatTransferCoefficientWPerM2K,
      loadMin: line.loadMin,
      unloadMin: line.unloadMin,
    };
  }
  return {
    ...common,
    kind: "conveyor",
    lineSpeedMinMPerMin: line.lineSpeedMinMPerMin,
    lineSpeedMaxMPerMin: line.lineSpeedMaxMPerMin,
    lineSpeedNominalMPerMin: line.lineSpeedNominalMPerMin,
    carrierPitchM: line.carrierPitchM,
    stages: line.stages.map(({ position: _p, ...s }) => s),
  };
}

/** Stored overrides are written only after validation; anything unreadable counts as none. */
export function parseOverrides(json: string): ScenarioOverrides {
  try {
    const parsed = overridesSchema.safeParse(JSON.parse(json));
    return parsed.success ? parsed.data : {};
  } catch {
    return {};
  }
}

function partOf(r: ScenarioListRow): PartRef | null {
  if (r.part_id) return { partId: r.part_id };
  if (r.part_area_m2 === null || r.part_mass_kg === null || r.part_thickness_mm === null) return null;
  return {
    areaM2: r.part_area_m2,
    insideAreaM2: r.part_inside_area_m2 ?? 0,
    massKg: r.part_mass_kg,
    thicknessMm: r.part_thickness_mm,
    lengthMm: r.part_length_mm ?? 0,
    widthMm: r.part_width_mm ?? 0,
    heightMm: r.part_height_mm ?? 0,
  };
}

export function toScenarioView(r: ScenarioListRow): ScenarioView {
  return {
    id: r.id,
    name: r.name,
    lineId: r.line_id,
    lineName: r.line_name,
    overrides: parseOverrides(r.overrides_json),
    part: partOf(r),
    coatingId: r.coating_id,
    createdBy: r.created_by,
    createdByName: r.creator_name,
    createdAt: r.created_at,
    updatedAt: r.updated_at,
    archived: r.archived === 1,
  };
}

export async function listScenarios(opts: { includeArchived?: boolean } = {}): Promise<ScenarioView[]> {
  return (await listScenarioRows(await getDb(), opts)).map(toScenarioView);
}

export async function getScenario(id: number): Promise<ScenarioView> {
  const row = await findScenarioRow(await getDb(), id);
  if (!row) throw new ApiError(404, "not_found", "No such scenario.");
  return toScenarioView(row);
}

const bad = (field: string, message: string) => new ApiError(400, "invalid_input", `${field}: ${message}`, { [field]: message });

/** The line, with its stages, or a 400 naming `field`. */
export async function lineForCompare(db: Db, lineId: number, field: string): Promise<LineView> {
  const row = await findLineRow(db, lineId);
  if (!row) throw bad(field, "No such line.");
  if (row.archived_at !== null) throw bad(field, `${row.name} is archived; restore it first.`);
  return toLineView(row, await stagesOf(db, [lineId]));
}

/** Everything a scenario refers to must exist and suit its line; a 400 names what does not. */
async function checkScenario(db: Db, input: ScenarioInput): Promise<void> {
  const line = await lineForCompare(db, input.lineId, "lineId");
  try {
    applyOverrides(toCompareLine(line), input.overrides);
  } catch (e) {
    if (e instanceof DomainError) throw bad(e.field, e.message);
    throw e;
  }
  if (input.part && "partId" in input.part && !(await findPartFigures(db, input.part.partId))) throw bad("part.partId", "No such part.");
  if (input.coatingId !== null) {
    const coating = await findCoatingRow(db, input.coatingId);
    if (!coating) throw bad("coatingId", "No such coating.");
    if (coating.kind !== "powder") throw bad("coatingId", `${coating.code} is an e-coat paint; choose a powder.`);
  }
}

function columns(input: ScenarioInput) {
  const p = input.part;
  const manual = p && !("partId" in p) ? p : null;
  return {
    name: input.name,
    line_id: input.lineId,
    overrides_json: JSON.stringify(input.overrides),
    part_id: p && "partId" in p ? p.partId : null,
    part_area_m2: manual?.areaM2 ?? null,
    part_inside_area_m2: manual?.insideAreaM2 ?? null,
    part_mass_kg: manual?.massKg ?? null,
    part_thickness_mm: manual?.thicknessMm ?? null,
    part_length_mm: manual?.lengthMm ?? null,
    part_width_mm: manual?.widthMm ?? null,
    part_height_mm: manual?.heightMm ?? null,
    coating_id: input.coatingId,
  };
}

function nameTaken(e: unknown, name: string): never {
  if (isUniqueViolation(e)) throw new ApiError(409, "conflict", `A scenario named ${name} already exists.`, { name: "Choose another name." });
  throw e;
}

export async function createScenario(input: ScenarioInput, user: SessionUser): Promise<ScenarioView> {
  const db = await getDb();
  await checkScenario(db, input);
  const t = nowSeconds();
  let id: number;
  try {
    id = await insertScenario(db, { ...columns(input), created_by: user.id, created_at: t, updated_at: t, archived: input.archived ? 1 : 0 });
  } catch (e) {
    nameTaken(e, input.name);
  }
  return getScenario(id);
}

export async function replaceScenario(id: number, input: ScenarioInput): Promise<ScenarioView> {
  const db = await getDb();
  const existing = await findScenarioRow(db, id);
  if (!existing) throw new ApiError(404, "not_found", "No such scenario.");
  await checkScenario(db, input);
  const archived = input.archived === undefined ? existing.archived : input.archived ? 1 : 0;
  try {
    await updateScenario(db, id, { ...columns(input), archived, updated_at: nowSeconds() });
  } catch (e) {
    nameTaken(e, input.name);
  }
  return getScenario(id);
}

/** DELETE: the scenario leaves the list (archived, so its name is free again); its row stays. */
export async function deleteScenario(id: number): Promise<ScenarioView> {
  const db = await getDb();
  const existing = await findScenarioRow(db, id);
  if (!existing) throw new ApiError(404, "not_found", "No such scenario.");
  if (existing.archived === 0) await updateScenario(db, id, { archived: 1, updated_at: nowSeconds() });
  return getScenario(id);
}

const MAX_NAME = 120;

/** "Line 1 fast" → "Line 1 fast (copy)", then "(copy 2)", … — the first name no live scenario has. */
export function copyName(name: string, taken: Set<string>): string {
  const base = name.replace(/ \(copy(?: \d+)?\)$/, "");
  for (let n = 1; ; n += 1) {
    const suffix = n === 1 ? " (copy)" : ` (copy ${n})`;
    const candidate = base.slice(0, MAX_NAME - suffix.length).trimEnd() + suffix;
    if (!taken.has(candidate.toLowerCase())) return candidate;
  }
}

/** A new live scenario with the same line, overrides, part and powder, owned by `user`. */
export async function duplicateScenario(id: number, user: SessionUser): Promise<ScenarioView> {
  const db = await getDb();
  const source = await findScenarioRow(db, id);
  if (!source) throw new ApiError(404, "not_found", "No such scenario.");
  await lineForCompare(db, source.line_id, "lineId");
  const t = nowSeconds();
  const { id: _id, line_name: _l, creator_name: _c, ...row } = source;
  let newId: number;
  try {
    newId = await insertScenario(db, { ...row, name: copyName(source.name, await liveScenarioNames(db)), created_by: user.id, created_at: t, updated_at: t, archived: 0 });
  } catch (e) {
    nameTaken(e, source.name);
  }
  return getScenario(newId);
}
