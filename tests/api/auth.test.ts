import { afterAll, beforeEach, describe, expect, it } from "vitest";
import { getDb, migrate } from "@/db/index";
import { request, resetDatabase, signIn, signInAs, teardown, useTempDatabase, cookieFrom } from "./helpers";
import { POST as signInPost } from "@/app/api/auth/sign-in/route";
import { POST as signOutPost } from "@/app/api/auth/sign-out/route";
import { POST as acceptInvite } from "@/app/api/auth/accept-invite/route";
import { POST as requestReset } from "@/app/api/auth/request-reset/route";
import { POST as resetPassword } from "@/app/api/auth/reset-password/route";
import { GET as meGet, PATCH as mePatch } from "@/app/api/me/route";
import { GET as usersGet, POST as usersPost } from "@/app/api/admin/users/route";
import { PATCH as userPatch } from "@/app/api/admin/users/[id]/route";
import { GET as health } from "@/app/api/health/route";

useTempDatabase();
beforeEach(resetDatabase);
afterAll(teardown);

async function lastMailTo(to: string) {
  const db = await getDb();
  return db.selectFrom("mail_outbox").selectAll().where("to_addresses", "like", `%${to}%`).orderBy("id", "desc").executeTakeFirst();
}

function linkToken(text: string, kind: "invite" | "reset-password"): string {
  const m = text.match(new RegExp(`/${kind}/([A-Za-z0-9_-]+)`));
  if (!m) throw new Error(`no ${kind} link in mail: ${text}`);
  return m[1];
}

describe("sign-in", () => {
  it("answers 200 and a session cookie for the right password, then /api/me knows the user", async () => {
    const res = await signInPost(request("/api/auth/sign-in", { method: "POST", body: { email: "Supervisor@Bramblecote.test", password: "coatwright-demo" } }));
    expect(res.status).toBe(200);
    const set = res.headers.get("set-cookie")!;
    expect(set).toMatch(/^coatwright_session=\w+/);
    expect(set).toContain("HttpOnly");
    expect(set).toContain("SameSite=Lax");
    const me = await meGet(request("/api/me", { cookie: cookieFrom(res) }));
    expect(me.status).toBe(200);
    expect((await me.json()).user).toMatchObject({ email: "supervisor@bramblecote.test", role: "supervisor" });
  });

  it("marks the cookie Secure when the request came over https", async () => {
    const res = await signInPost(
      request("/api/auth/sign-in", { method: "POST", body: { email: "operator@bramblecote.test", password: "coatwright-demo" }, headers: { "x-forwarded-proto": "https" } }),
    );
    expect(res.headers.get("set-cookie")).toContain("Secure");
  });

  it("gives the same 401 message for an unknown user and a wrong password", async () => {
    const a = await signInPost(request("/api/auth/sign-in", { method: "POST", body: { email: "nobody@bramblecote.test", password: "x" } }));
    const b = await signInPost(request("/api/auth/sign-in", { method: "POST", body: { email: "admin@bramblecote.test", password: "wrong-password" } }));
    expect(a.status).toBe(401);
    expect(b.status).toBe(401);
    expect((await a.json()).error.message).toBe((await b.json()).error.message);
  });

  it.each([
    ["malformed JSON", "{email:", "body"],
    ["missing password", JSON.stringify({ email: "a@b.test" }), "password"],
    ["bad e-mail", JSON.stringify({ email: "not-an-address", password: "x" }), "email"],
    ["unknown field", JSON.stringify({ email: "a@b.test", password: "x", admin: true }), "admin"],
    ["wrong type", JSON.stringify({ email: 42, password: "x" }), "email"],
    ["over-long string", JSON.stringify({ email: `${"a".repeat(300)}@b.test`, password: "x" }), "email"],
  ])("answers 400 naming the field for %s", async (_name, raw, field) => {
    const res = await signInPost(request("/api/auth/sign-in", { method: "POST", raw, headers: { "content-type": "application/json" } }));
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(body.error.code).toBe("invalid_input");
    expect(Object.keys(body.error.fields)).toContain(field);
  });

  it("throttles an account after 10 failures in 15 minutes with a 429", async () => {
    for (let i = 0; i < 10; i++) {
      const r = await signInPost(request("/api/auth/sign-in", { method: "POST", body: { email: "engineer@bramblecote.test", password: `wrong-${i}` } }));
      expect(r.status).toBe(401);
    }
    const blocked = await signInPost(request("/api/auth/sign-in", { method: "POST", body: { email: "engineer@bramblecote.test", password: "coatwright-demo" } }));
    expect(blocked.status).toBe(429);
    expect((await blocked.json()).error.code).toBe("rate_limited");
    const rows = await (await getDb()).selectFrom("sign_in_failures").selectAll().where("key", "=", "account:engineer@bramblecote.test").execute();
    expect(rows.length).toBe(10);
  });

  it("refuses a POST whose Origin is another site", async () => {
    const res = await signInPost(
      request("/api/auth/sign-in", { method: "POST", body: { email: "admin@bramblecote.test", password: "coatwright-demo" }, headers: { origin: "https://evil.test", host: "127.0.0.1:3999" } }),
    );
    expect(res.status).toBe(403);
  });

  it("sign-out ends the session", async () => {
    const cookie = await signInAs("manager");
    expect((await meGet(request("/api/me", { cookie }))).status).toBe(200);
    expect((await signOutPost(request("/api/auth/sign-out", { method: "POST", cookie }))).status).toBe(200);
    expect((await meGet(request("/api/me", { cookie }))).status).toBe(401);
  });
});

describe("invitations and password resets through the local SMTP capture", () => {
  it("an invite e-mail is captured, its link sets a password once, and the new user signs in", async () => {
    const admin = await signInAs("admin");
    const res = await usersPost(request("/api/admin/users", { method: "POST", cookie: admin, body: { email: "new.coater@bramblecote.test", name: "Nell Ashby", role: "operator" } }));
    expect(res.status).toBe(201);
    const mail = await lastMailTo("new.coater@bramblecote.test");
    expect(mail?.subject).toContain("Coatwright");
    const token = linkToken(mail!.text_body, "invite");
    const row = await (await getDb()).selectFrom("users").selectAll().where("email", "=", "new.coater@bramblecote.test").executeTakeFirstOrThrow();
    expect(row.password_hash).toBeNull();

    const ok = await acceptInvite(request("/api/auth/accept-invite", { method: "POST", body: { token, password: "bluepowder-2026" } }));
    expect(ok.status).toBe(200);
    const again = await acceptInvite(request("/api/auth/accept-invite", { method: "POST", body: { token, password: "other-password-1" } }));
    expect(again.status).toBe(400);
    expect((await again.json()).error.message).toMatch(/already been used/);
    const cookie = await signIn("new.coater@bramblecote.test", "bluepowder-2026");
    expect((await (await meGet(request("/api/me", { cookie }))).json()).user.role).toBe("operator");
  });

  it("an expired invite changes nothing", async () => {
    const admin = await signInAs("admin");
    await usersPost(request("/api/admin/users", { method: "POST", cookie: admin, body: { email: "late@bramblecote.test", name: "Late Comer", role: "engineer" } }));
    const token = linkToken((await lastMailTo("late@bramblecote.test"))!.text_body, "invite");
    const db = await getDb();
    await db.updateTable("auth_tokens").set({ expires_at: 1 }).execute();
    const res = await acceptInvite(request("/api/auth/accept-invite", { method: "POST", body: { token, password: "bluepowder-2026" } }));
    expect(res.status).toBe(400);
    expect((await res.json()).error.message).toMatch(/expired/);
    const row = await db.selectFrom("users").select("password_hash").where("email", "=", "late@bramblecote.test").executeTakeFirstOrThrow();
    expect(row.password_hash).toBeNull();
  });

  it("a duplicate e-mail is a 409", async () => {
    const admin = await signInAs("admin");
    const res = await usersPost(request("/api/admin/users", { method: "POST", cookie: admin, body: { email: "operator@bramblecote.test", name: "Twin", role: "operator" } }));
    expect(res.status).toBe(409);
    expect((await res.json()).error.fields.email).toBeTruthy();
  });

  it("a reset link works once and only once, and ends the old sessions", async () => {
    const old = await signInAs("purchaser");
    const res = await requestReset(request("/api/auth/request-reset", { method: "POST", body: { email: "purchaser@bramblecote.test" } }));
    expect(res.status).toBe(200);
    const token = linkToken((await lastMailTo("purchaser@bramblecote.test"))!.text_body, "reset-password");
    const first = await resetPassword(request("/api/auth/reset-password", { method: "POST", body: { token, password: "new-secret-powder" } }));
    expect(first.status).toBe(200);
    const second = await resetPassword(request("/api/auth/reset-password", { method: "POST", body: { token, password: "another-secret-1" } }));
    expect(second.status).toBe(400);
    expect((await meGet(request("/api/me", { cookie: old }))).status).toBe(401);
    await expect(signIn("purchaser@bramblecote.test", "new-secret-powder")).resolves.toMatch(/coatwright_session/);
    await expect(signIn("purchaser@bramblecote.test", "another-secret-1")).rejects.toThrow(/401/);
  });

  it("asking a reset for an unknown address answers the same and sends nothing", async () => {
    const res = await requestReset(request("/api/auth/request-reset", { method: "POST", body: { email: "ghost@bramblecote.test" } }));
    expect(res.status).toBe(200);
    expect(await lastMailTo("ghost@bramblecote.test")).toBeUndefined();
  });
});

describe("admin user management", () => {
  it("lists users, changes a role, and deactivation ends the user's sessions at once", async () => {
    const admin = await signInAs("admin");
    const list = await (await usersGet(request("/api/admin/users", { cookie: admin }))).json();
    expect(list.users).toHaveLength(6);
    const op = list.users.find((u: { email: string }) => u.email === "operator@bramblecote.test");
    const opCookie = await signInAs("operator");

    const r1 = await userPatch(request(`/api/admin/users/${op.id}`, { method: "PATCH", cookie: admin, body: { role: "supervisor" } }), { params: Promise.resolve({ id: op.id }) });
    expect(r1.status).toBe(200);
    const r2 = await userPatch(request(`/api/admin/users/${op.id}`, { method: "PATCH", cookie: admin, body: { active: false } }), { params: Promise.resolve({ id: op.id }) });
    expect(r2.status).toBe(200);
    const row = await (await getDb()).selectFrom("users").selectAll().where("id", "=", op.id).executeTakeFirstOrThrow();
    expect(row).toMatchObject({ role: "supervisor", active: 0 });
    expect((await meGet(request("/api/me", { cookie: opCookie }))).status).toBe(401);
    await expect(signIn("operator@bramblecote.test")).rejects.toThrow(/401/);
  });

  it("an unknown user id is a 404 and a bad role a 400", async () => {
    const admin = await signInAs("admin");
    const r = await userPatch(request("/api/admin/users/nope", { method: "PATCH", cookie: admin, body: { role: "manager" } }), { params: Promise.resolve({ id: "nope" }) });
    expect(r.status).toBe(404);
    const b = await userPatch(request("/api/admin/users/nope", { method: "PATCH", cookie: admin, body: { role: "wizard" } }), { params: Promise.resolve({ id: "nope" }) });
    expect(b.status).toBe(400);
    expect((await b.json()).error.fields.role).toBeTruthy();
  });

  it("stores each user's display units", async () => {
    const cookie = await signInAs("engineer");
    const r = await mePatch(request("/api/me", { method: "PATCH", cookie, body: { unitSystem: "us" } }));
    expect(r.status).toBe(200);
    const row = await (await getDb()).selectFrom("users").select("unit_system").where("email", "=", "engineer@bramblecote.test").executeTakeFirstOrThrow();
    expect(row.unit_system).toBe("us");
    const bad = await mePatch(request("/api/me", { method: "PATCH", cookie, body: { unitSystem: "imperial" } }));
    expect(bad.status).toBe(400);
  });
});

describe("database", () => {
  it("health answers ok", async () => {
    const r = await health(request("/api/health"));
    expect(await r.json()).toEqual({ ok: true });
  });

  it("a second start on an existing database migrates nothing and loses nothing", async () => {
    const db = await getDb();
    const before = await db.selectFrom("users").selectAll().execute();
    expect(await migrate(db)).toEqual([]);
    expect(await db.selectFrom("users").selectAll().execute()).toEqual(before);
  });
});
