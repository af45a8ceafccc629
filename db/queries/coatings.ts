import type { Insertable, Selectable, Updateable } from "kysely";
import type { Db } from "../index";
import type { CoatingCurePointsTable, CoatingLotsTable, CoatingsTable } from "../schema";

export type CoatingRow = Selectable<CoatingsTable>;
export type CurePointRow = Selectable<CoatingCurePointsTable>;
export type LotRow = Selectable<CoatingLotsTable>;
export type NewCoatingRow = Insertable<CoatingsTable>;
export type CurePointValues = { metal_temp_c: number; hold_min: number };

export function listCoatingRows(db: Db, opts: { includeArchived?: boolean } = {}): Promise<CoatingRow[]> {
  let q = db.selectFrom("coatings").selectAll();
  if (!opts.includeArchived) q = q.where("archived_at", "is", null);
  return q.orderBy("code").execute();
}

export function findCoatingRow(db: Db, id: number): Promise<CoatingRow | undefined> {
  return db.selectFrom("coatings").selectAll().where("id", "=", id).executeTakeFirst();
}

/** Cure points of the given coatings, lowest temperature first. */
export function curePointsOf(db: Db, coatingIds: number[]): Promise<CurePointRow[]> {
  if (!coatingIds.length) return Promise.resolve([]);
  return db.selectFrom("coating_cure_points").selectAll().where("coating_id", "in", coatingIds).orderBy("coating_id").orderBy("metal_temp_c").execute();
}

/** Lots of the given coatings, soonest expiry first. */
export function lotsOf(db: Db, coatingIds: number[]): Promise<LotRow[]> {
  if (!coatingIds.length) return Promise.resolve([]);
  return db.selectFrom("coating_lots").selectAll().where("coating_id", "in", coatingIds).orderBy("coating_id").orderBy("expires_at").orderBy("id").execute();
}

/** Inserts a coating and its cure points in one transaction; returns the new id. */
export async function insertCoating(db: Db, row: NewCoatingRow, points: CurePointValues[]): Promise<number> {
  return db.transaction().execute(async (trx) => {
    const { id } = await trx.insertInto("coatings").values(row).returning("id").executeTakeFirstOrThrow();
    await trx.insertInto("coating_cure_points").values(points.map((p) => ({ ...p, coating_id: id }))).execute();
    return id;
  });
}

/** Updates a coating and replaces its cure points in one transaction. */
export async function updateCoating(db: Db, id: number, patch: Updateable<CoatingsTable>, points: CurePointValues[]): Promise<void> {
  await db.transaction().execute(async (trx) => {
    await trx.updateTable("coatings").set(patch).where("id", "=", id).execute();
    await trx.deleteFrom("coating_cure_points").where("coating_id", "=", id).execute();
    await trx.insertInto("coating_cure_points").values(points.map((p) => ({ ...p, coating_id: id }))).execute();
  });
}

export async function setCoatingArchived(db: Db, id: number, archivedAt: number | null, updatedAt: number): Promise<void> {
  await db.updateTable("coatings").set({ archived_at: archivedAt, updated_at: updatedAt }).where("id", "=", id).execute();
}

export async function insertLot(db: Db, lot: Insertable<CoatingLotsTable>): Promise<number> {
  const { id } = await db.insertInto("coating_lots").values(lot).returning("id").executeTakeFirstOrThrow();
  return id;
}
