import type { Db } from "../index";
import type { NewUser, Role, UnitSystem, User } from "../schema";

export function findUserByEmail(db: Db, email: string): Promise<User | undefined> {
  return db.selectFrom("users").selectAll().where("email", "=", email.toLowerCase()).executeTakeFirst();
}

export function findUserById(db: Db, id: string): Promise<User | undefined> {
  return db.selectFrom("users").selectAll().where("id", "=", id).executeTakeFirst();
}

export function listUsers(db: Db): Promise<User[]> {
  return db.selectFrom("users").selectAll().orderBy("email").execute();
}

export async function insertUser(db: Db, user: NewUser): Promise<void> {
  await db.insertInto("users").values({ ...user, email: user.email.toLowerCase() }).execute();
}

export async function updateUser(
  db: Db,
  id: string,
  patch: Partial<{ role: Role; active: number; password_hash: string; unit_system: UnitSystem; name: string }>,
): Promise<number> {
  const r = await db.updateTable("users").set(patch).where("id", "=", id).executeTakeFirst();
  return Number(r.numUpdatedRows);
}

export async function countUsers(db: Db): Promise<number> {
  const r = await db.selectFrom("users").select((eb) => eb.fn.countAll<number>().as("n")).executeTakeFirstOrThrow();
  return Number(r.n);
}

export async function deleteSessionsOfUser(db: Db, userId: string): Promise<void> {
  await db.deleteFrom("sessions").where("user_id", "=", userId).execute();
}
