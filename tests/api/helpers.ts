import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, beforeEach } from "vitest";
import { closeDatabase, getDb } from "@/db/index";
import { seedDemo, demoEmail, DEMO_PASSWORD } from "@/db/seed/demo";
import { ROLES } from "@/lib/server/access";
import { stopMailFake } from "@/lib/server/mail-fake";
import type { Role } from "@/db/schema";

export const BASE = "http://127.0.0.1:3999";

/** A fresh temporary SQLite file for this test file, migrated on first use. */
export function useTempDatabase(): string {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), "coatwright-api-"));
  const file = path.join(dir, "test.db");
  closeDatabase();
  process.env.DATABASE_PATH = file;
  delete process.env.SMTP_URL;
  delete process.env.APP_URL;
  return file;
}

export async function resetDatabase(): Promise<void> {
  closeDatabase();
  const file = process.env.DATABASE_PATH!;
  for (const f of [file, `${file}-wal`, `${file}-shm`]) fs.rmSync(f, { force: true });
  await seedDemo(await getDb());
}

export async function teardown(): Promise<void> {
  await stopMailFake();
  closeDatabase();
}

interface Init {
  method?: string;
  body?: unknown;
  cookie?: string | null;
  headers?: Record<string, string>;
  raw?: string;
}

export function request(pathname: string, init: Init = {}): Request {
  const headers: Record<string, string> = { ...(init.headers ?? {}) };
  if (init.cookie) headers.cookie = init.cookie;
  let body: string | undefined = init.raw;
  if (init.body !== undefined) {
    body = JSON.stringify(init.body);
    headers["content-type"] = "application/json";
  }
  return new Request(`${BASE}${pathname}`, { method: init.method ?? "GET", headers, body });
}

/** The context Next passes to a dynamic route handler. */
export function params<P extends Record<string, string>>(p: P) {
  return { params: Promise.resolve(p) };
}

export function cookieFrom(res: Response): string {
  const set = res.headers.get("set-cookie") ?? "";
  return set.split(";")[0];
}

export async function signIn(email: string, password = DEMO_PASSWORD): Promise<string> {
  const { POST } = await import("@/app/api/auth/sign-in/route");
  const res = await POST(request("/api/auth/sign-in", { method: "POST", body: { email, password } }));
  if (res.status !== 200) throw new Error(`sign-in ${email}: ${res.status} ${await res.text()}`);
  return cookieFrom(res);
}

export const signInAs = (role: Role) => signIn(demoEmail(role));

/** Signs in as every demo role, one cookie per role (the set-up most API test files share). */
export async function signInAll(cookies: Partial<Record<Role, string>>): Promise<void> {
  for (const r of ROLES) cookies[r] = await signInAs(r);
}

/**
 * The set-up most API test files share: their own database with the demo data, reset before
 * each test ("each") or once for the file ("once"), and one session cookie per role.
 */
export function useSignedInDemo(reset: "each" | "once" = "each"): Partial<Record<Role, string>> {
  useTempDatabase();
  const cookies: Partial<Record<Role, string>> = {};
  (reset === "each" ? beforeEach : beforeAll)(async () => {
    await resetDatabase();
    await signInAll(cookies);
  }, 60_000);
  afterAll(teardown);
  return cookies;
}
