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

/** Lower-cased numbers of every part, for checking a whole import at once. */
export async function allPartNumbers(db: Db): Promise<Set<string>> {
  const rows = await db.selectFrom("parts").select("number").execute();
  return new Set(rows.map((r) => r.number.toLowerCase()));
}

export async function insertPart(db: Db, row: NewPartRow): Promise<void> {
  await db.insertInto("parts").values(row).execute();
}

/** Inserts all rows in one transaction: all or none. */
export async function insertParts(db: Db, rows: NewPartRow[]): Promise<void> {
  if (!rows.length) return;
  await db.transaction().execute(async (trx) => {
    for (const row of rows) await trx.insertInto("parts").values(row).execute();
  });
}

export async function updatePart(db: Db, id: string, patch: Updateable<PartsTable>): Promise<void> {
  await db.updateTable("parts").set(patch).where("id", "=", id).execute();
}
