import type { Insertable, Selectable, Updateable } from "kysely";
import type { Db } from "../index";
import type { PartsTable } from "../schema";

export type PartRow = Selectable<PartsTable>;
export type NewPartRow = Insertable<PartsTable>;

export function listPartRows(db: Db, opts: { includeArchived?: boolean } = {}): Promise<PartRow[]> {
  let q = db.selectFrom("parts").selectAll();
  if (!opts.includeArchived) q = q.where("archived", "=", 0);
  return q.orderBy("number").execute();
}

export function findPartRow(db: Db, id: string): Promise<PartRow | undefined> {
  return db.selectFrom("parts").selectAll().where("id", "=", id).executeTakeFirst();
}

/** Part numbers are unique case-insensitively in practice: "bc-1042" and "BC-1042" are one part. */
export function findPartByNumber(db: Db, number: string): Promise<PartRow | undefined> {
  return db.selectFrom("parts").selectAll().where((eb) => eb(eb.fn("lower", ["number"]), "=", number.toLowerCase())).executeTakeFirst();
}

/** Every part's id by its lower-cased number (archived ones too), for checking a whole import at once. */
export async function partIdsByNumber(db: Db): Promise<Map<string, string>> {
  const rows = await db.selectFrom("parts").select(["id", "number"]).execute();
  return new Map(rows.map((r) => [r.number.toLowerCase(), r.id]));
}

export async function insertPart(db: Db, row: NewPartRow): Promise<void> {
  await db.insertInto("parts").values(row).execute();
}

/** Inserts `rows` and applies `updates` in one transaction: all or none. */
export async function writeParts(db: Db, rows: NewPartRow[], updates: { id: string; patch: Updateable<PartsTable> }[] = []): Promise<void> {
  if (!rows.length && !updates.length) return;
  await db.transaction().execute(async (trx) => {
    for (const row of rows) await trx.insertInto("parts").values(row).execute();
    for (const u of updates) await trx.updateTable("parts").set(u.patch).where("id", "=", u.id).execute();
  });
}

export async function updatePart(db: Db, id: string, patch: Updateable<PartsTable>): Promise<void> {
  await db.updateTable("parts").set(patch).where("id", "=", id).execute();
}
