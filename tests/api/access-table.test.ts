import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { actionAccess, allows, apiAccess, ROLES, type Method } from "@/lib/server/access";
import { request, useSignedInDemo } from "./helpers";

/*
 * Drives the declared access table: every route handler file under app/api and every server
 * action must have a row, and every row is called anonymously and as each role.
 */
const root = path.resolve(__dirname, "../..");
const METHODS: Method[] = ["GET", "POST", "PUT", "PATCH", "DELETE"];

function walk(dir: string, match: (f: string) => boolean): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = path.join(dir, e.name);
    return e.isDirectory() ? walk(p, match) : match(e.name) ? [p] : [];
  });
}

const routeFiles = walk(path.join(root, "app/api"), (f) => f === "route.ts");
const routePath = (file: string) => "/" + path.relative(path.join(root, "app"), path.dirname(file)).split(path.sep).join("/");
const exampleUrl = (p: string) => p.replace(/\[(\w+)\]/g, "no-such-$1");
const exampleParams = (p: string) => Object.fromEntries([...p.matchAll(/\[(\w+)\]/g)].map((m) => [m[1], `no-such-${m[1]}`]));

const cookies = useSignedInDemo("once");

describe("access table covers every route handler and server action", () => {
  it.each(routeFiles.map((f) => [routePath(f), f]))("%s has a row for each exported method", async (p, file) => {
    const mod = (await import(file)) as Record<string, unknown>;
    const exported = METHODS.filter((m) => typeof mod[m] === "function");
    expect(exported.length).toBeGreaterThan(0);
    expect(Object.keys(apiAccess[p] ?? {}).sort()).toEqual(exported.sort());
  });

  it("has no row for a route that does not exist", () => {
    const known = new Set(routeFiles.map(routePath));
    expect(Object.keys(apiAccess).filter((p) => !known.has(p))).toEqual([]);
  });

  const actionFiles = walk(path.join(root, "app"), (f) => f === "actions.ts");
  it.each(actionFiles.map((f) => [path.relative(root, f), f]))("server actions in %s are in the table and check it", (rel, file) => {
    const src = fs.readFileSync(file, "utf8");
    const names = [...src.matchAll(/export\s+async\s+function\s+(\w+)/g)].map((m) => m[1]);
    expect(names.length).toBeGreaterThan(0);
    for (const n of names) {
      const key = `${rel.split(path.sep).join("/")}#${n}`;
      expect(actionAccess[key], key).toBeDefined();
      expect(src).toContain(`requireActionUser("${key}")`);
    }
  });

  it("only the short public list answers without a session", () => {
    const open = Object.entries(apiAccess).flatMap(([p, ms]) => Object.entries(ms).filter(([, a]) => a === "public").map(([m]) => `${m} ${p}`));
    expect(open.sort()).toEqual(
      [
        "GET /api/health",
        "POST /api/auth/accept-invite",
        "POST /api/auth/request-reset",
        "POST /api/auth/reset-password",
        "POST /api/auth/sign-in",
        "POST /api/auth/sign-out",
      ].sort(),
    );
  });
});

describe("every protected route enforces its row", () => {
  const rows = routeFiles.flatMap((file) => {
    const p = routePath(file);
    return Object.entries(apiAccess[p] ?? {})
      .filter(([, a]) => a !== "public")
      .map(([m, a]) => ({ p, file, method: m as Method, access: a! }));
  });

  it.each(rows.map((r) => [`${r.method} ${r.p}`, r]))("%s: 401 anonymous, 403 for roles without the right", async (_n, r) => {
    const mod = (await import(r.file)) as Record<string, (req: Request, ctx: unknown) => Promise<Response>>;
    const ctx = { params: Promise.resolve(exampleParams(r.p)) };
    const body = r.method === "GET" || r.method === "DELETE" ? undefined : {};
    const anon = await mod[r.method](request(exampleUrl(r.p), { method: r.method, body }), ctx);
    expect(anon.status).toBe(401);
    for (const role of ROLES) {
      const res = await mod[r.method](request(exampleUrl(r.p), { method: r.method, body, cookie: cookies[role] }), { params: Promise.resolve(exampleParams(r.p)) });
      if (allows(r.access, role)) expect([401, 403], `${role} should be allowed`).not.toContain(res.status);
      else expect(res.status, `${role} should be refused`).toBe(403);
      expect(res.status).toBeLessThan(500);
    }
  });
});
