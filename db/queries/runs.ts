import type { Insertable, Selectable, Updateable } from "kysely";
import type { Db } from "../index";
import type { PartsTable, RunCoatsTable, RunsTable } from "../schema";

export type RunRow = Selectable<RunsTable>;
export type RunCoatRow = Selectable<RunCoatsTable>;
export type NewRunRow = Omit<Insertable<RunsTable>, "sequence">;
export type RunCoatValues = Omit<Insertable<RunCoatsTable>, "id" | "run_id" | "position">;

/** A run with its part's number and name and its line's name, for lists. */
export type RunListRow = RunRow & { part_number: string; part_name: string; line_name: string; line_kind: "conveyor" | "batch" };

/** The columns of a part a run plan needs (read here so runs do not depend on the parts module). */
export type RunPartRow = Pick<
  Selectable<PartsTable>,
  | "id"
  | "number"
  | "name"
  | "customer"
  | "material"
  | "thickness_mm"
  | "mass_kg"
  | "area_m2"
  | "inside_area_m2"
  | "masked_area_m2"
  | "length_mm"
  | "width_mm"
  | "height_mm"
  | "mesh_id"
  | "archived"
>;

const PART_COLUMNS = [
  "id",
  "number",
  "name",
  "customer",
  "material",
  "thickness_mm",
  "mass_kg",
  "area_m2",
  "inside_area_m2",
  "masked_area_m2",
  "length_mm",
  "width_mm",
  "height_mm",
  "mesh_id",
  "archived",
] as const;

export function findPartForRun(db: Db, id: string): Promise<RunPartRow | undefined> {
  return db.selectFrom("parts").select(PART_COLUMNS).where("id", "=", id).executeTakeFirst();
}

export function partsForRuns(db: Db, ids: string[]): Promise<RunPartRow[]> {
  if (!ids.length) return Promise.resolve([]);
  return db.selectFrom("parts").select(PART_COLUMNS).where("id", "in", ids).execute();
}

/** Parts a new run may use: not archived, by number. */
export function listPartsForRuns(db: Db): Promise<RunPartRow[]> {
  return db.selectFrom("parts").select(PART_COLUMNS).where("archived", "=", 0).orderBy("number").execute();
}

export function findPartByNumber(db: Db, number: string): Promise<RunPartRow | undefined> {
  return db.selectFrom("parts").select(PART_COLUMNS).where("number", "=", number).executeTakeFirst();
}

function listQuery(db: Db) {
  return db
    .selectFrom("runs")
    .innerJoin("parts", "parts.id", "runs.part_id")
    .innerJoin("lines", "lines.id", "runs.line_id")
    .selectAll("runs")
    .select(["parts.number as part_number", "parts.name as part_name", "lines.name as line_name", "lines.kind as line_kind"]);
}

export interface RunFilter {
  /** epoch seconds at 00:00 UTC */
  fromDay?: number;
  toDay?: number;
  lineId?: number;
  shift?: number;
  statuses?: RunRow["status"][];
}

/** Runs by day, line, shift and board order. */
export function listRunRows(db: Db, f: RunFilter = {}): Promise<RunListRow[]> {
  let q = listQuery(db);
  if (f.fromDay !== undefined) q = q.where("runs.run_date", ">=", f.fromDay);
  if (f.toDay !== undefined) q = q.where("runs.run_date", "<=", f.toDay);
  if (f.lineId !== undefined) q = q.where("runs.line_id", "=", f.lineId);
  if (f.shift !== undefined) q = q.where("runs.shift", "=", f.shift);
  if (f.statuses?.length) q = q.where("runs.status", "in", f.statuses);
  return q.orderBy("runs.run_date").orderBy("lines.name").orderBy("runs.shift").orderBy("runs.sequence").orderBy("runs.id").execute();
}

export function findRunRow(db: Db, id: number): Promise<RunListRow | undefined> {
  return listQuery(db).where("runs.id", "=", id).executeTakeFirst();
}

/** Coats of the given runs in order. */
export function coatsOf(db: Db, runIds: number[]): Promise<RunCoatRow[]> {
  if (!runIds.length) return Promise.resolve([]);
  return db.selectFrom("run_coats").selectAll().where("run_id", "in", runIds).orderBy("run_id").orderBy("position").execute();
}

/** The next board position on a line's day and shift. */
async function nextSequence(db: Db, lineId: number, day: number, shift: number, exceptId?: number): Promise<number> {
  let q = db
    .selectFrom("runs")
    .select((eb) => eb.fn.max("sequence").as("top"))
    .where("line_id", "=", lineId)
    .where("run_date", "=", day)
    .where("shift", "=", shift);
  if (exceptId !== undefined) q = q.where("id", "!=", exceptId);
  const row = await q.executeTakeFirst();
  return row?.top === null || row?.top === undefined ? 0 : Number(row.top) + 1;
}

async function writeCoats(db: Db, runId: number, coats: RunCoatValues[]): Promise<void> {
  await db.deleteFrom("run_coats").where("run_id", "=", runId).execute();
  if (coats.length) await db.insertInto("run_coats").values(coats.map((c, position) => ({ ...c, run_id: runId, position }))).execute();
}

/** Inserts a run at the end of its line's day board and its coats, in one transaction. */
export async function insertRun(db: Db, row: NewRunRow, coats: RunCoatValues[]): Promise<number> {
  return db.transaction().execute(async (trx) => {
    const sequence = await nextSequence(trx, row.line_id, row.run_date, row.shift);
    const { id } = await trx.insertInto("runs").values({ ...row, sequence }).returning("id").executeTakeFirstOrThrow();
    await writeCoats(trx, id, coats);
    return id;
  });
}

/** Updates a run and replaces its coats in one transaction; moved to another board, it goes last there. */
export async function updateRun(db: Db, id: number, patch: Updateable<RunsTable>, coats: RunCoatValues[]): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const before = await trx.selectFrom("runs").select(["line_id", "run_date", "shift"]).where("id", "=", id).executeTakeFirstOrThrow();
    const moved =
      (patch.line_id !== undefined && patch.line_id !== before.line_id) ||
      (patch.run_date !== undefined && patch.run_date !== before.run_date) ||
      (patch.shift !== undefined && patch.shift !== before.shift);
    const sequence = moved
      ? await nextSequence(trx, (patch.line_id as number) ?? before.line_id, (patch.run_date as number) ?? before.run_date, (patch.shift as number) ?? before.shift, id)
      : undefined;
    await trx
      .updateTable("runs")
      .set({ ...patch, ...(sequence === undefined ? {} : { sequence }) })
      .where("id", "=", id)
      .execute();
    await writeCoats(trx, id, coats);
  });
}

export async function setRunStatus(db: Db, id: number, from: RunRow["status"], to: RunRow["status"], t: number): Promise<boolean> {
  // Guarded by the status read before, so two clicks at once cannot both move the run.
  const r = await db.updateTable("runs").set({ status: to, updated_at: t }).where("id", "=", id).where("status", "=", from).executeTakeFirst();
  return Number(r.numUpdatedRows) === 1;
}

/** Deletes a draft run (its coats go with it); false when it is no longer a draft. */
export async function deleteDraftRun(db: Db, id: number): Promise<boolean> {
  const r = await db.deleteFrom("runs").where("id", "=", id).where("status", "=", "draft").executeTakeFirst();
  return Number(r.numDeletedRows) === 1;
}

/** Board order: sequence = index in `ids`, in one transaction. */
export async function setSequences(db: Db, ids: number[], t: number): Promise<void> {
  await db.transaction().execute(async (trx) => {
    for (const [sequence, id] of ids.entries()) {
      await trx.updateTable("runs").set({ sequence, updated_at: t }).where("id", "=", id).execute();
    }
  });
}

function usageLabel(r: { id: number; run_date: number; part_number: string; quantity: number; status: string }): string {
  const day = new Date(r.run_date * 1000).toISOString().slice(0, 10);
  return `Run ${r.id}: ${r.quantity} × ${r.part_number} on ${day} (${r.status})`;
}

/** Runs with a coat of this coating, as usage references (a coating in use cannot be deleted). */
export async function runsUsingCoating(db: Db, coatingId: number): Promise<{ kind: string; id: number; label: string }[]> {
  const rows = await db
    .selectFrom("run_coats")
    .innerJoin("runs", "runs.id", "run_coats.run_id")
    .innerJoin("parts", "parts.id", "runs.part_id")
    .select(["runs.id", "runs.run_date", "runs.quantity", "runs.status", "parts.number as part_number"])
    .where("run_coats.coating_id", "=", coatingId)
    .distinct()
    .orderBy("runs.run_date")
    .execute();
  return rows.map((r) => ({ kind: "run", id: r.id, label: usageLabel(r) }));
}

/** Runs on this line, as usage references (a line in use cannot be deleted). */
export async function runsUsingLine(db: Db, lineId: number): Promise<{ kind: string; id: number; label: string }[]> {
  const rows = await db
    .selectFrom("runs")
    .innerJoin("parts", "parts.id", "runs.part_id")
    .select(["runs.id", "runs.run_date", "runs.quantity", "runs.status", "parts.number as part_number"])
    .where("runs.line_id", "=", lineId)
    .orderBy("runs.run_date")
    .execute();
  return rows.map((r) => ({ kind: "run", id: r.id, label: usageLabel(r) }));
}

/** Stores the plan a run keeps from now on; false when it already has one. */
export async function freezeRunPlan(db: Db, id: number, planJson: string, t: number): Promise<boolean> {
  const r = await db.updateTable("runs").set({ plan_json: planJson, plan_frozen_at: t }).where("id", "=", id).where("plan_json", "is", null).executeTakeFirst();
  return Number(r.numUpdatedRows) === 1;
}

/** Runs past planning (started, done, cancelled) that have no frozen plan yet. */
export function unfrozenRunRows(db: Db): Promise<RunListRow[]> {
  return listQuery(db).where("runs.status", "in", ["in-progress", "done", "cancelled"]).where("runs.plan_json", "is", null).orderBy("runs.id").execute();
}
