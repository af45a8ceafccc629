import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import type { GaugeView } from "@/lib/server/film-checks";
import { params, request, useSignedInDemo } from "./helpers";
import { GET as listGet, POST as listPost } from "@/app/api/gauges/route";
import { DELETE as oneDelete, GET as oneGet, PUT as onePut } from "@/app/api/gauges/[id]/route";
import { POST as checkPost } from "@/app/api/runs/[id]/film-checks/route";
import type { Role } from "@/db/schema";

const cookies = useSignedInDemo();

const DAY_S = 86_400;
const isoDay = (s: number) => new Date(s * 1000).toISOString().slice(0, 10);
const todayS = () => Math.floor(Date.now() / 1000);

async function gaugeId(name: string): Promise<number> {
  return (await (await getDb()).selectFrom("gauges").select("id").where("name", "=", name).executeTakeFirstOrThrow()).id;
}

function put(id: number | string, body: unknown, role: Role = "supervisor") {
  return onePut(request(`/api/gauges/${id}`, { method: "PUT", body, cookie: cookies[role] }), params({ id: String(id) }));
}

function del(id: number, role: Role = "supervisor") {
  return oneDelete(request(`/api/gauges/${id}`, { method: "DELETE", cookie: cookies[role] }), params({ id: String(id) }));
}

async function list(role: Role = "engineer"): Promise<GaugeView[]> {
  const res = await listGet(request("/api/gauges", { cookie: cookies[role] }));
  expect(res.status).toBe(200);
  return ((await res.json()) as { gauges: GaugeView[] }).gauges;
}

describe("gauge list", () => {
  it("marks the seeded pull-off gauge overdue and the electronic one current, with how many checks name each", async () => {
    const gauges = await list();
    // seeded: Gauge 1 verified 30 days ago, Gauge 2 425 days ago; both on the default 12-month interval
    expect(gauges.map((g) => [g.name, g.gaugeType, g.verifyIntervalMonths, g.verification, g.checkCount, g.retiredOn])).toEqual([
      ["Gauge 1 — electronic", "type2", 12, "current", 1, null],
      ["Gauge 2 — pull-off", "type1", 12, "overdue", 0, null],
    ]);
    expect(gauges[0].mapping).toEqual({ readingColumn: "Reading", unit: "um" });
  });

  it("counts a gauge never verified as such, not as current", async () => {
    const res = await listPost(request("/api/gauges", { method: "POST", body: { name: "Spare", gaugeType: "type2" }, cookie: cookies.operator }));
    expect(res.status).toBe(201);
    const { gauge } = (await res.json()) as { gauge: GaugeView };
    expect(gauge).toMatchObject({ verifiedOn: null, verificationDueOn: null, verification: "never", verifyIntervalMonths: 12 });
  });
});

describe("PUT /api/gauges/[id]", () => {
  it("changes the verification date and interval; the due date is that day plus the interval", async () => {
    const id = await gaugeId("Gauge 2 — pull-off");
    const res = await put(id, { verifiedOn: "2026-01-31", verifyIntervalMonths: 1 });
    expect(res.status).toBe(200);
    const { gauge } = (await res.json()) as { gauge: GaugeView };
    // a month after 31 January is the last day of February (2026 is not a leap year)
    expect(gauge).toMatchObject({ verifiedOn: "2026-01-31", verifyIntervalMonths: 1, verificationDueOn: "2026-02-28" });
    const row = await (await getDb()).selectFrom("gauges").selectAll().where("id", "=", id).executeTakeFirstOrThrow();
    expect(row.verified_at).toBe(Date.UTC(2026, 0, 31) / 1000);
    expect(row.verify_interval_months).toBe(1);
    // the other fields are untouched
    expect(row).toMatchObject({ name: "Gauge 2 — pull-off", gauge_type: "type1", serial: "PO-1183" });
  });

  it("verified today on the 12-month interval is current and due a year from today", async () => {
    const id = await gaugeId("Gauge 2 — pull-off");
    const today = isoDay(todayS());
    const res = await put(id, { verifiedOn: today }, "operator");
    expect(res.status).toBe(200);
    const { gauge } = (await res.json()) as { gauge: GaugeView };
    expect(gauge.verification).toBe("current");
    expect(gauge.verificationDueOn).toBe(`${Number(today.slice(0, 4)) + 1}${today.slice(4)}`.replace(/-02-29$/, "-02-28"));
  });

  it("renames, changes type and serial, and clears the remembered CSV mapping", async () => {
    const id = await gaugeId("Gauge 1 — electronic");
    const res = await put(id, { name: "Gauge 1 — electronic (booth 2)", gaugeType: "type2", serial: "G1-0427-B", mapping: null });
    expect(res.status).toBe(200);
    const row = await (await getDb()).selectFrom("gauges").selectAll().where("id", "=", id).executeTakeFirstOrThrow();
    expect(row).toMatchObject({ name: "Gauge 1 — electronic (booth 2)", serial: "G1-0427-B", mapping_json: null });
    const got = await oneGet(request(`/api/gauges/${id}`, { cookie: cookies.purchaser }), params({ id: String(id) }));
    expect(((await got.json()) as { gauge: GaugeView }).gauge.mapping).toBeNull();
  });

  it.each([
    { body: { verifiedOn: "2026-02-30" }, field: "verifiedOn" },
    { body: { verifiedOn: "3.12.2026" }, field: "verifiedOn" },
    { body: { verifiedOn: isoDay(todayS() + 3 * DAY_S) }, field: "verifiedOn" },
    { body: { verifyIntervalMonths: 0 }, field: "verifyIntervalMonths" },
    { body: { verifyIntervalMonths: 1.5 }, field: "verifyIntervalMonths" },
    { body: { gaugeType: "type3" }, field: "gaugeType" },
    { body: { name: "  " }, field: "name" },
    { body: { colour: "red" }, field: "colour" },
    { body: {}, field: "body" },
  ])("refuses $body naming $field and changes nothing", async ({ body, field }) => {
    const id = await gaugeId("Gauge 2 — pull-off");
    const before = await (await getDb()).selectFrom("gauges").selectAll().where("id", "=", id).executeTakeFirstOrThrow();
    const res = await put(id, body);
    expect(res.status).toBe(400);
    const err = (await res.json()) as { error: { code: string; fields: Record<string, string> } };
    expect(err.error.code).toBe("invalid_input");
    expect(Object.keys(err.error.fields)).toContain(field);
    const after = await (await getDb()).selectFrom("gauges").selectAll().where("id", "=", id).executeTakeFirstOrThrow();
    expect(after).toEqual(before);
  });

  it("answers 409 naming the field when the new name is taken, 404 for an unknown gauge", async () => {
    const id = await gaugeId("Gauge 2 — pull-off");
    const res = await put(id, { name: "Gauge 1 — electronic" });
    expect(res.status).toBe(409);
    const err = (await res.json()) as { error: { code: string; fields: Record<string, string> } };
    expect(err.error.code).toBe("conflict");
    expect(err.error.fields).toHaveProperty("name");
    expect((await put(999_999, { serial: "x" })).status).toBe(404);
    expect((await put("abc", { serial: "x" })).status).toBe(404);
  });

  it.each([
    { role: "operator" as Role, status: 200 },
    { role: "supervisor" as Role, status: 200 },
    { role: "admin" as Role, status: 200 },
    { role: "engineer" as Role, status: 403 },
    { role: "manager" as Role, status: 403 },
    { role: "purchaser" as Role, status: 403 },
  ])("lets $role change a gauge: $status", async ({ role, status }) => {
    const id = await gaugeId("Gauge 2 — pull-off");
    const res = await put(id, { serial: `PO-${role}` }, role);
    expect(res.status).toBe(status);
    const row = await (await getDb()).selectFrom("gauges").select("serial").where("id", "=", id).executeTakeFirstOrThrow();
    expect(row.serial).toBe(status === 200 ? `PO-${role}` : "PO-1183");
  });
});

describe("retiring and deleting gauges", () => {
  it("keeps a gauge that film checks name: DELETE is 409, retiring archives it and its checks keep it", async () => {
    const id = await gaugeId("Gauge 1 — electronic");
    const refused = await del(id);
    expect(refused.status).toBe(409);
    expect(((await refused.json()) as { error: { message: string } }).error.message).toBe(
      "1 film check names Gauge 1 — electronic: retire it instead, so those records keep their gauge.",
    );
    const res = await put(id, { retired: true });
    expect(res.status).toBe(200);
    const { gauge } = (await res.json()) as { gauge: GaugeView };
    expect(gauge.retiredOn).toBe(isoDay(todayS()));
    const db = await getDb();
    expect((await db.selectFrom("gauges").select("retired_at").where("id", "=", id).executeTakeFirstOrThrow()).retired_at).not.toBeNull();
    expect((await db.selectFrom("film_checks").select("gauge_id").executeTakeFirstOrThrow()).gauge_id).toBe(id);

    // a retired gauge cannot be named by new readings…
    const run = await db.selectFrom("film_checks").select("run_id").executeTakeFirstOrThrow();
    const body = { rule: "sspc-pa2", coatIndex: 1, gaugeId: id, areas: [[[70, 70, 70], [70, 70, 70], [70, 70, 70], [70, 70, 70], [70, 70, 70]]] };
    const post = await checkPost(request(`/api/runs/${run.run_id}/film-checks`, { method: "POST", body, cookie: cookies.operator }), params({ id: String(run.run_id) }));
    expect(post.status).toBe(400);
    expect(((await post.json()) as { error: { fields: Record<string, string> } }).error.fields).toHaveProperty("gaugeId");

    // …and comes back when restored
    const back = await put(id, { retired: false });
    expect(((await back.json()) as { gauge: GaugeView }).gauge.retiredOn).toBeNull();
  });

  it("deletes a gauge no film check names", async () => {
    const id = await gaugeId("Gauge 2 — pull-off");
    const res = await del(id, "operator");
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ deleted: true });
    expect(await (await getDb()).selectFrom("gauges").select("id").where("id", "=", id).executeTakeFirst()).toBeUndefined();
    expect((await del(id)).status).toBe(404);
  });

  it("refuses roles that do not record readings", async () => {
    const id = await gaugeId("Gauge 2 — pull-off");
    for (const role of ["engineer", "manager", "purchaser"] as Role[]) expect((await del(id, role)).status).toBe(403);
    expect(await (await getDb()).selectFrom("gauges").select("id").where("id", "=", id).executeTakeFirst()).toBeDefined();
  });
});
