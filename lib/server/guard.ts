import { notFound, redirect } from "next/navigation";
import type { Role } from "@/db/schema";
import { actionAccess, allows, type Access } from "./access";
import { ApiError } from "./http";
import { currentUser, type SessionUser } from "./session";

/** Pages: the signed-in user, or a redirect to sign-in; a role without the right sees a 403 page. */
export async function requirePageUser(access: Access = "signed-in"): Promise<SessionUser> {
  const user = await currentUser();
  if (!user) redirect("/sign-in");
  if (!allows(access, user.role)) redirect("/forbidden");
  return user;
}

export class ActionDenied extends Error {}

/** Server actions: looks the action up in the access table (missing = denied) and checks the role. */
export async function requireActionUser(key: string): Promise<SessionUser> {
  const access = actionAccess[key];
  if (!access) throw new ActionDenied(`No access row for action ${key}`);
  const user = await currentUser();
  if (!user) throw new ActionDenied("Sign in first.");
  if (!allows(access, user.role)) throw new ActionDenied(`The ${user.role} role may not do this.`);
  return user;
}

export function hasRole(user: SessionUser, roles: readonly Role[]): boolean {
  return user.role === "admin" || roles.includes(user.role);
}

/** A page's record by id: the not-found page for an id that is not a number or names nothing. */
export async function recordOrNotFound<T>(id: string, load: (id: number) => Promise<T>): Promise<T> {
  if (!/^\d{1,12}$/.test(id) || Number(id) < 1) notFound();
  return load(Number(id)).catch((e: unknown) => {
    if (e instanceof ApiError && e.status === 404) notFound();
    throw e;
  });
}
