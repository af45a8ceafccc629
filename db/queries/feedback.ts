import type { Insertable, Selectable } from "kysely";
import type { Db } from "../index";
import type { MaterialUsageTable } from "../schema";

export type UsageRow = Selectable<MaterialUsageTable>;

export function usageOfRun(db: Db, runId: number): Promise<UsageRow[]> {
  return db.selectFrom("material_usage").selectAll().where("run_id", "=", runId).orderBy("coat_index").execute();
}

export function usageOf(db: Db, f: { lineId?: number; coatingId?: number } = {}): Promise<UsageRow[]> {
  let q = db.selectFrom("material_usage").selectAll();
  if (f.lineId !== undefined) q = q.where("line_id", "=", f.lineId);
  if (f.coatingId !== undefined) q = q.where("coating_id", "=", f.coatingId);
  return q.orderBy("recorded_at").orderBy("id").execute();
}

export function findUsage(db: Db, id: number): Promise<UsageRow | undefined> {
  return db.selectFrom("material_usage").selectAll().where("id", "=", id).executeTakeFirst();
}

/** Replaces a coat's record (one per run × coat). */
export async function upsertUsage(db: Db, row: Insertable<MaterialUsageTable>): Promise<void> {
  await db.deleteFrom("material_usage").where("run_id", "=", row.run_id).where("coat_index", "=", row.coat_index).execute();
  await db.insertInto("material_usage").values(row).execute();
}

export async function setUsageExcluded(db: Db, id: number, excluded: boolean): Promise<void> {
  await db.updateTable("material_usage").set({ excluded: excluded ? 1 : 0 }).where("id", "=", id).execute();
}

export async function excludeAllUsage(db: Db, lineId: number, coatingId: number): Promise<number> {
  const r = await db.updateTable("material_usage").set({ excluded: 1 }).where("line_id", "=", lineId).where("coating_id", "=", coatingId).executeTakeFirst();
  return Number(r.numUpdatedRows);
}

/** The latest run coat on a line × coating: its efficiencies are the nominal figure. */
export function latestCoatOn(db: Db, lineId: number, coatingId: number) {
  return db
    .selectFrom("run_coats")
    .innerJoin("runs", "runs.id", "run_coats.run_id")
    .select(["run_coats.first_pass_efficiency", "run_coats.reclaim_efficiency"])
    .where("runs.line_id", "=", lineId)
    .where("run_coats.coating_id", "=", coatingId)
    .where("run_coats.first_pass_efficiency", "is not", null)
    .orderBy("runs.run_date", "desc")
    .orderBy("runs.id", "desc")
    .executeTakeFirst();
}
