import type { Insertable, Selectable, Updateable } from "kysely";
import type { Db } from "../index";
import type { LineStagesTable, LinesTable } from "../schema";

export type LineRow = Selectable<LinesTable>;
export type StageRow = Selectable<LineStagesTable>;
export type NewLineRow = Insertable<LinesTable>;
export type StageValues = Omit<Insertable<LineStagesTable>, "id" | "line_id" | "position">;

export function listLineRows(db: Db, opts: { includeArchived?: boolean } = {}): Promise<LineRow[]> {
  let q = db.selectFrom("lines").selectAll();
  if (!opts.includeArchived) q = q.where("archived_at", "is", null);
  return q.orderBy("name").execute();
}

export function findLineRow(db: Db, id: number): Promise<LineRow | undefined> {
  return db.selectFrom("lines").selectAll().where("id", "=", id).executeTakeFirst();
}

/** Stages of the given lines in conveyor order. */
export function stagesOf(db: Db, lineIds: number[]): Promise<StageRow[]> {
  if (!lineIds.length) return Promise.resolve([]);
  return db.selectFrom("line_stages").selectAll().where("line_id", "in", lineIds).orderBy("line_id").orderBy("position").execute();
}

async function writeStages(db: Db, lineId: number, stages: StageValues[]): Promise<void> {
  await db.deleteFrom("line_stages").where("line_id", "=", lineId).execute();
  if (stages.length) {
    await db.insertInto("line_stages").values(stages.map((s, position) => ({ ...s, line_id: lineId, position }))).execute();
  }
}

/** Inserts a line and its stages (position = list order) in one transaction; returns the id. */
export async function insertLine(db: Db, row: NewLineRow, stages: StageValues[]): Promise<number> {
  return db.transaction().execute(async (trx) => {
    const { id } = await trx.insertInto("lines").values(row).returning("id").executeTakeFirstOrThrow();
    await writeStages(trx, id, stages);
    return id;
  });
}

/** Updates a line and replaces its stage list in one transaction. */
export async function updateLine(db: Db, id: number, patch: Updateable<LinesTable>, stages: StageValues[]): Promise<void> {
  await db.transaction().execute(async (trx) => {
    await trx.updateTable("lines").set(patch).where("id", "=", id).execute();
    await writeStages(trx, id, stages);
  });
}

export async function setLineArchived(db: Db, id: number, archivedAt: number | null, updatedAt: number): Promise<void> {
  await db.updateTable("lines").set({ archived_at: archivedAt, updated_at: updatedAt }).where("id", "=", id).execute();
}
