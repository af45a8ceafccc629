import { getDb } from "@/db/index";
import { findUserById, listUsers, updateUser } from "@/db/queries/users";
import type { Role, User } from "@/db/schema";
import { ApiError } from "./http";
import { endAllSessionsOf } from "./session";

export interface UserView {
  id: string;
  email: string;
  name: string;
  role: Role;
  active: boolean;
  passwordSet: boolean;
  unitSystem: string;
  createdAt: number;
}

export function toUserView(u: User): UserView {
  return {
    id: u.id,
    email: u.email,
    name: u.name,
    role: u.role,
    active: u.active === 1,
    passwordSet: u.password_hash !== null,
    unitSystem: u.unit_system,
    createdAt: u.created_at,
  };
}

export async function allUsers(): Promise<UserView[]> {
  return (await listUsers(await getDb())).map(toUserView);
}

/** Role change or (de)activation; deactivating ends the user's sessions at once. */
export async function changeUser(actorId: string, id: string, patch: { role?: Role; active?: boolean }): Promise<UserView> {
  const db = await getDb();
  const user = await findUserById(db, id);
  if (!user) throw new ApiError(404, "not_found", "No such user.");
  if (id === actorId && (patch.active === false || (patch.role && patch.role !== "admin"))) {
    throw new ApiError(409, "conflict", "You cannot deactivate yourself or remove your own admin role.", {
      [patch.active === false ? "active" : "role"]: "Ask another admin.",
    });
  }
  await updateUser(db, id, {
    ...(patch.role ? { role: patch.role } : {}),
    ...(patch.active !== undefined ? { active: patch.active ? 1 : 0 } : {}),
  });
  if (patch.active === false) await endAllSessionsOf(id);
  return toUserView((await findUserById(db, id))!);
}
