/**
 * Saved racking plans, one per part × line: stored choices (clearance, orientation mode, an
 * orientation set by hand) planned with the pure lib/rack planner from the part and line as they
 * are. The count, space count and limit are stored at each save so lists need not plan again;
 * a single plan is always planned afresh. Runs of a part on a line with a saved plan use it
 * (lib/server/runs.ts).
 */
import { getDb, type Db } from "@/db/index";
import { findLineRow, type LineRow } from "@/db/queries/lines";
import { findPartRow, type PartRow } from "@/db/queries/parts";
import {
  deleteRackPlan,
  findRackPlanFor,
  findRackPlanRow,
  insertRackPlan,
  listRackPlanRows,
  updateRackPlan,
  type RackPlanFilter,
  type RackPlanListRow,
  type RackPlanRow,
} from "@/db/queries/rack-plans";
import { orientationFromCode, type OrientationCode } from "@/lib/rack/orientation-code";
import { planRack } from "@/lib/rack/plan";
import { RackInputError } from "@/lib/rack/rack-error";
import type { OrientationMode, PartBoxMm, RackOrientation, RackPlan } from "@/lib/rack/types";
import type { RackPlanSaveInput } from "@/lib/validation/rack-plans";
import { nowSeconds } from "./coatings";
import { ApiError, isUniqueViolation } from "./http";
import type { SessionUser } from "./session";

export interface SavedRackPlanSummary {
  id: number;
  partId: string;
  part: { number: string; name: string; lengthMm: number; widthMm: number; heightMm: number; massKg: number; archived: boolean };
  lineId: number;
  line: { name: string; kind: "conveyor" | "batch"; archived: boolean };
  clearanceMm: number;
  orientations: OrientationMode;
  /** null: the planner's best orientation; else what lies along travel, up and across */
  orientationOverride: OrientationCode | null;
  note: string;
  /** as last saved */
  partsPerCarrier: number;
  spaceCount: number;
  limitedBy: "space" | "load";
  /** the part or line was edited after the plan was saved, so the stored count may be out of date */
  maybeStale: boolean;
  createdBy: string | null;
  createdByName: string | null;
  updatedBy: string | null;
  updatedByName: string | null;
  createdAt: number;
  updatedAt: number;
}

export interface SavedRackPlan extends SavedRackPlanSummary {
  window: { widthMm: number; heightMm: number; depthMm: number; maxLoadKg: number };
  /** the orientation set by hand, in millimetres for this part; null for the planner's best */
  orientation: RackOrientation | null;
  /** planned now from the part and line as they are: the same shape POST /api/rack/plan answers */
  result: RackPlan;
  /** the plan now differs from the stored count (the part or line changed since the save) */
  changedSinceSave: boolean;
}

export type RackPlansList = { plans: SavedRackPlanSummary[] };

const bad = (field: string, message: string) => new ApiError(400, "invalid_input", `${field}: ${message}`, { [field]: message });

const boxOf = (p: Pick<PartRow, "length_mm" | "width_mm" | "height_mm">): PartBoxMm => ({
  lengthMm: p.length_mm,
  widthMm: p.width_mm,
  heightMm: p.height_mm,
});

function toSummary(r: RackPlanListRow): SavedRackPlanSummary {
  return {
    id: r.id,
    partId: r.part_id,
    part: {
      number: r.part_number,
      name: r.part_name,
      lengthMm: r.part_length_mm,
      widthMm: r.part_width_mm,
      heightMm: r.part_height_mm,
      massKg: r.part_mass_kg,
      archived: r.part_archived === 1,
    },
    lineId: r.line_id,
    line: { name: r.line_name, kind: r.line_kind, archived: r.line_archived_at !== null },
    clearanceMm: r.clearance_mm,
    orientations: r.orientations,
    orientationOverride: r.orientation_override,
    note: r.note,
    partsPerCarrier: r.parts_per_carrier,
    spaceCount: r.space_count,
    limitedBy: r.limited_by,
    maybeStale: r.part_updated_at > r.updated_at || r.line_updated_at > r.updated_at,
    createdBy: r.created_by,
    createdByName: r.creator_name,
    updatedBy: r.updated_by,
    updatedByName: r.updater_name,
    createdAt: r.created_at,
    updatedAt: r.updated_at,
  };
}

interface Settings {
  clearanceMm: number;
  orientations: OrientationMode;
  orientationOverride: OrientationCode | null;
}

/** A racking error's field → the saved plan's field that caused it. */
function planField(field: string): string {
  if (field.startsWith("part")) return "partId";
  if (field.startsWith("carrier")) return "lineId";
  if (field.startsWith("orientation")) return "orientationOverride";
  return field;
}

/** Plans the settings for the part and line as stored; an impossible combination is a 400 naming the field. */
function planFor(part: PartRow, line: LineRow, s: Settings): RackPlan {
  const box = boxOf(part);
  try {
    return planRack({
      part: { ...box, massKg: part.mass_kg },
      carrier: { widthMm: line.window_width_mm, heightMm: line.window_height_mm, depthMm: line.window_depth_mm, maxLoadKg: line.max_load_kg },
      clearanceMm: s.clearanceMm,
      orientations: s.orientations,
      ...(s.orientationOverride ? { orientation: orientationFromCode(box, s.orientationOverride) } : {}),
    });
  } catch (e) {
    if (e instanceof RackInputError) throw bad(planField(e.field), e.message);
    throw e;
  }
}

export async function listRackPlans(filter: RackPlanFilter = {}): Promise<SavedRackPlanSummary[]> {
  return (await listRackPlanRows(await getDb(), filter)).map(toSummary);
}

export async function getRackPlan(id: number): Promise<SavedRackPlan> {
  const db = await getDb();
  const row = await findRackPlanRow(db, id);
  if (!row) throw new ApiError(404, "not_found", "No such racking plan.");
  const [part, line] = await Promise.all([findPartRow(db, row.part_id), findLineRow(db, row.line_id)]);
  // Foreign keys keep both; a missing one means the row was changed outside the app.
  if (!part || !line) throw new ApiError(404, "not_found", "The plan's part or line no longer exists.");
  const settings: Settings = { clearanceMm: row.clearance_mm, orientations: row.orientations, orientationOverride: row.orientation_override };
  let result: RackPlan;
  try {
    result = planFor(part, line, settings);
  } catch (e) {
    // The line or part changed so that the stored choices no longer plan (e.g. the window shrank
    // below the clearance): show that as a plan of none with the reason, not as an error page.
    if (!(e instanceof ApiError)) throw e;
    result = { count: 0, spaceCount: 0, limitedBy: "space", reason: e.message.replace(/^\w+: /, ""), blocks: [], placements: [] };
  }
  return {
    ...toSummary(row),
    window: { widthMm: line.window_width_mm, heightMm: line.window_height_mm, depthMm: line.window_depth_mm, maxLoadKg: line.max_load_kg },
    orientation: row.orientation_override ? orientationFromCode(boxOf(part), row.orientation_override) : null,
    result,
    changedSinceSave: result.count !== row.parts_per_carrier || result.limitedBy !== row.limited_by,
  };
}

/** The part and line a plan names must exist; a new choice of either must be current. */
async function references(db: Db, input: RackPlanSaveInput, existing: RackPlanRow | null): Promise<{ part: PartRow; line: LineRow }> {
  const [part, line] = await Promise.all([findPartRow(db, input.partId), findLineRow(db, input.lineId)]);
  const fields: Record<string, string> = {};
  if (!part) fields.partId = "No such part.";
  else if (part.archived === 1 && existing?.part_id !== part.id) fields.partId = `Part ${part.number} is archived; choose a current part.`;
  if (!line) fields.lineId = "No such line.";
  else if (line.archived_at !== null && existing?.line_id !== line.id) fields.lineId = `${line.name} is archived; choose a line in use.`;
  const first = Object.entries(fields)[0];
  if (first) throw new ApiError(400, "invalid_input", `${first[0]}: ${first[1]}`, fields);
  return { part: part!, line: line! };
}

function conflict(part: PartRow, line: LineRow, otherId: number): ApiError {
  const message = `Part ${part.number} already has a saved racking plan on ${line.name} (plan ${otherId}); update that one instead.`;
  return new ApiError(409, "conflict", message, { lineId: message });
}

/** A plan that hangs nothing would stop every run of the part on the line: refused, with the reason. */
function refuseEmpty(plan: RackPlan, input: RackPlanSaveInput): void {
  if (plan.count > 0) return;
  throw bad(input.orientationOverride ? "orientationOverride" : "lineId", `Nothing can be hung this way: ${plan.reason}`);
}

function columns(input: RackPlanSaveInput, plan: RackPlan) {
  return {
    part_id: input.partId,
    line_id: input.lineId,
    clearance_mm: input.clearanceMm,
    orientations: input.orientations,
    orientation_override: input.orientationOverride,
    note: input.note,
    parts_per_carrier: plan.count,
    space_count: plan.spaceCount,
    limited_by: plan.limitedBy,
  };
}

export async function createRackPlan(input: RackPlanSaveInput, user: SessionUser): Promise<SavedRackPlan> {
  const db = await getDb();
  const id = await db.transaction().execute(async (trx) => {
    const { part, line } = await references(trx, input, null);
    const other = await findRackPlanFor(trx, input.partId, input.lineId);
    if (other) throw conflict(part, line, other.id);
    const plan = planFor(part, line, input);
    refuseEmpty(plan, input);
    const t = nowSeconds();
    try {
      return await insertRackPlan(trx, { ...columns(input, plan), created_by: user.id, updated_by: user.id, created_at: t, updated_at: t });
    } catch (e) {
      // A save racing this one for the same part × line.
      if (isUniqueViolation(e)) throw conflict(part, line, (await findRackPlanFor(trx, input.partId, input.lineId))?.id ?? 0);
      throw e;
    }
  });
  return getRackPlan(id);
}

export async function replaceRackPlan(id: number, input: RackPlanSaveInput, user: SessionUser): Promise<SavedRackPlan> {
  const db = await getDb();
  await db.transaction().execute(async (trx) => {
    const existing = await findRackPlanRow(trx, id);
    if (!existing) throw new ApiError(404, "not_found", "No such racking plan.");
    const { part, line } = await references(trx, input, existing);
    const other = await findRackPlanFor(trx, input.partId, input.lineId);
    if (other && other.id !== id) throw conflict(part, line, other.id);
    const plan = planFor(part, line, input);
    refuseEmpty(plan, input);
    await updateRackPlan(trx, id, { ...columns(input, plan), updated_by: user.id, updated_at: nowSeconds() });
  });
  return getRackPlan(id);
}

export async function removeRackPlan(id: number): Promise<void> {
  const db = await getDb();
  await db.transaction().execute(async (trx) => {
    if (!(await deleteRackPlan(trx, id))) throw new ApiError(404, "not_found", "No such racking plan.");
  });
}

// ---------------------------------------------------------------------------------------------
// Runs

/** What a run's racking takes from a saved plan: its choices, planned for the run's part. */
export interface SavedRacking {
  savedPlanId: number;
  clearanceMm: number;
  orientations: OrientationMode;
  orientation: RackOrientation | null;
}

export function savedRackingOf(row: RackPlanRow, part: PartBoxMm): SavedRacking {
  return {
    savedPlanId: row.id,
    clearanceMm: row.clearance_mm,
    orientations: row.orientations,
    orientation: row.orientation_override ? orientationFromCode(part, row.orientation_override) : null,
  };
}

export const savedPlanKey = (partId: string, lineId: number) => `${partId}|${lineId}`;
