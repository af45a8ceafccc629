import { Lucia, TimeSpan } from "lucia";
import { BetterSqlite3Adapter } from "@lucia-auth/adapter-sqlite";
import { getSqlite } from "@/db/index";
import type { Role, UnitSystem } from "@/db/schema";

/*
 * The only module that knows lucia. Everything else calls the functions below, so the session
 * library can be swapped without touching routes or pages.
 */

export interface SessionUser {
  id: string;
  email: string;
  name: string;
  role: Role;
  unitSystem: UnitSystem;
}

interface DatabaseUserAttributes {
  email: string;
  name: string;
  role: Role;
  active: number;
  unit_system: UnitSystem;
}

function buildLucia(sqlite: Awaited<ReturnType<typeof getSqlite>>) {
  return new Lucia(new BetterSqlite3Adapter(sqlite, { user: "users", session: "sessions" }), {
    sessionExpiresIn: new TimeSpan(12, "h"),
    sessionCookie: {
      name: "coatwright_session",
      expires: false,
      attributes: { sameSite: "lax", secure: false },
    },
    getUserAttributes: (a) => ({
      email: a.email,
      name: a.name,
      role: a.role,
      active: a.active,
      unitSystem: a.unit_system,
    }),
  });
}

declare module "lucia" {
  interface Register {
    Lucia: ReturnType<typeof buildLucia>;
    DatabaseUserAttributes: DatabaseUserAttributes;
  }
}

const luciaKey = Symbol.for("coatwright.lucia");
type G = typeof globalThis & { [luciaKey]?: { sqlite: object; lucia: ReturnType<typeof buildLucia> } };

async function lucia() {
  const sqlite = await getSqlite();
  const g = globalThis as G;
  const cached = g[luciaKey];
  if (cached && cached.sqlite === sqlite) return cached.lucia;
  const l = buildLucia(sqlite);
  g[luciaKey] = { sqlite, lucia: l };
  return l;
}

export const SESSION_COOKIE = "coatwright_session";

interface CookieOut {
  name: string;
  value: string;
  attributes: { maxAge?: number };
}

// NOTE: Secure is set whenever the request came over https (directly or via a proxy header) or
// COATWRIGHT_SECURE_COOKIES=1; plain http on a developer's loopback would otherwise lose the cookie.
function isSecure(h: Headers, url?: string): boolean {
  if (process.env.COATWRIGHT_SECURE_COOKIES === "1") return true;
  return h.get("x-forwarded-proto") === "https" || (url ?? "").startsWith("https:");
}

function serialize(c: CookieOut, secure: boolean): string {
  const parts = [`${c.name}=${c.value}`, "Path=/", "HttpOnly", "SameSite=Lax"];
  const maxAge = c.attributes.maxAge;
  if (typeof maxAge === "number") parts.push(`Max-Age=${maxAge}`);
  if (secure) parts.push("Secure");
  return parts.join("; ");
}

function readCookie(cookieHeader: string | null): string | null {
  if (!cookieHeader) return null;
  for (const part of cookieHeader.split(";")) {
    const [k, ...v] = part.trim().split("=");
    if (k === SESSION_COOKIE) return v.join("=") || null;
  }
  return null;
}

async function validate(id: string | null): Promise<{ user: SessionUser; refresh: CookieOut | null } | null> {
  if (!id) return null;
  const l = await lucia();
  const { user, session } = await l.validateSession(id);
  if (!user || !session || !user.active) return null;
  return {
    user: { id: user.id, email: user.email, name: user.name, role: user.role, unitSystem: user.unitSystem },
    refresh: session.fresh ? l.createSessionCookie(session.id) : null,
  };
}

/** Route handlers: the signed-in user of this request and a Set-Cookie value to send back, if any. */
export async function sessionFromRequest(
  request: Request,
): Promise<{ user: SessionUser; setCookie: string | null } | null> {
  const v = await validate(readCookie(request.headers.get("cookie")));
  if (!v) return null;
  return { user: v.user, setCookie: v.refresh ? serialize(v.refresh, isSecure(request.headers, request.url)) : null };
}

/** Starts a session; returns the Set-Cookie header value for the response. */
export async function startSession(userId: string, request: Request): Promise<string> {
  const l = await lucia();
  const session = await l.createSession(userId, {});
  return serialize(l.createSessionCookie(session.id), isSecure(request.headers, request.url));
}

/** Ends the request's session (if any); returns the Set-Cookie value that clears the cookie. */
export async function endSession(request: Request): Promise<string> {
  const l = await lucia();
  const id = readCookie(request.headers.get("cookie"));
  if (id) await l.invalidateSession(id);
  return serialize(l.createBlankSessionCookie(), isSecure(request.headers, request.url));
}

export async function endAllSessionsOf(userId: string): Promise<void> {
  await (await lucia()).invalidateUserSessions(userId);
}

/** Pages and server actions: the signed-in, active user, or null. */
export async function currentUser(): Promise<SessionUser | null> {
  const { cookies } = await import("next/headers");
  const v = await validate((await cookies()).get(SESSION_COOKIE)?.value ?? null);
  return v?.user ?? null;
}
