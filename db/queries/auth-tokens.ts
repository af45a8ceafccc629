import type { Db } from "../index";
import type { Selectable } from "kysely";
import type { AuthTokensTable } from "../schema";

export type AuthToken = Selectable<AuthTokensTable>;

export async function insertAuthToken(db: Db, token: AuthToken): Promise<void> {
  await db.insertInto("auth_tokens").values(token).execute();
}

export function findAuthToken(db: Db, id: string): Promise<AuthToken | undefined> {
  return db.selectFrom("auth_tokens").selectAll().where("id", "=", id).executeTakeFirst();
}

/** Marks a token used only if it still is unused; returns whether this call used it. */
export async function useAuthToken(db: Db, id: string, now: number): Promise<boolean> {
  const r = await db
    .updateTable("auth_tokens")
    .set({ used_at: now })
    .where("id", "=", id)
    .where("used_at", "is", null)
    .where("expires_at", ">", now)
    .executeTakeFirst();
  return Number(r.numUpdatedRows) === 1;
}
