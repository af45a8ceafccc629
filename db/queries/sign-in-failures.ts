import type { Db } from "../index";

export async function recordFailure(db: Db, keys: string[], at: number): Promise<void> {
  if (keys.length === 0) return;
  await db.insertInto("sign_in_failures").values(keys.map((key) => ({ key, at }))).execute();
}

export async function countFailuresSince(db: Db, key: string, since: number): Promise<number> {
  const r = await db
    .selectFrom("sign_in_failures")
    .select((eb) => eb.fn.countAll<number>().as("n"))
    .where("key", "=", key)
    .where("at", ">=", since)
    .executeTakeFirstOrThrow();
  return Number(r.n);
}

export async function clearFailures(db: Db, key: string): Promise<void> {
  await db.deleteFrom("sign_in_failures").where("key", "=", key).execute();
}

export async function pruneFailures(db: Db, before: number): Promise<void> {
  await db.deleteFrom("sign_in_failures").where("at", "<", before).execute();
}
