import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { ROLES } from "@/lib/server/access";
import type { ScenarioView } from "@/lib/server/scenarios";
import type { Role } from "@/db/schema";
import { params, request, useSignedInDemo } from "./helpers";
import { GET as listGet, POST as listPost } from "@/app/api/scenarios/route";
import { DELETE as oneDelete, GET as oneGet, PUT as onePut } from "@/app/api/scenarios/[id]/route";
import { POST as duplicatePost } from "@/app/api/scenarios/[id]/duplicate/route";
import { DELETE as lineDelete } from "@/app/api/lines/[id]/route";

const cookies = useSignedInDemo();

const LINE1 = "Line 1 — E-coat and powder";
const LINE2 = "Line 2 — Powder only";
const OVEN = "Batch oven B — gas";
const editors: Role[] = ["admin", "manager"];
const readers: Role[] = ["supervisor", "engineer", "purchaser", "operator"];

async function lineId(name: string): Promise<number> {
  return (await (await getDb()).selectFrom("lines").select("id").where("name", "=", name).executeTakeFirstOrThrow()).id;
}
async function coatingId(code: string): Promise<number> {
  return (await (await getDb()).selectFrom("coatings").select("id").where("code", "=", code).executeTakeFirstOrThrow()).id;
}
async function scenarioId(name: string): Promise<number> {
  return (await (await getDb()).selectFrom("scenarios").select("id").where("name", "=", name).executeTakeFirstOrThrow()).id;
}
const row = async (id: number) => (await getDb()).selectFrom("scenarios").selectAll().where("id", "=", id).executeTakeFirstOrThrow();

const manualPart = { areaM2: 0.8, massKg: 6.5, thicknessMm: 2, lengthMm: 450, widthMm: 60, heightMm: 700 };
const body = async (patch: object = {}) => ({
  name: "Line 2 at top speed",
  lineId: await lineId(LINE2),
  overrides: { lineSpeedMPerMin: 3.6, partsPerCarrier: 10 },
  part: manualPart,
  coatingId: await coatingId("PP-420"),
  ...patch,
});

const cookie = (role: Role | null) => (role ? cookies[role] : null);
const list = (role: Role | null, q = "") => listGet(request(`/api/scenarios${q}`, { cookie: cookie(role) }));
const post = (role: Role | null, b: unknown) => listPost(request("/api/scenarios", { method: "POST", body: b, cookie: cookie(role) }));
const get = (role: Role, id: number | string) => oneGet(request(`/api/scenarios/${id}`, { cookie: cookies[role] }), params({ id: String(id) }));
const put = (role: Role, id: number | string, b: unknown) =>
  onePut(request(`/api/scenarios/${id}`, { method: "PUT", body: b, cookie: cookies[role] }), params({ id: String(id) }));
const del = (role: Role, id: number | string) => oneDelete(request(`/api/scenarios/${id}`, { method: "DELETE", cookie: cookies[role] }), params({ id: String(id) }));
const dup = (role: Role, id: number | string) => duplicatePost(request(`/api/scenarios/${id}/duplicate`, { method: "POST", cookie: cookies[role] }), params({ id: String(id) }));

describe("GET /api/scenarios", () => {
  it("answers 401 without a session", async () => {
    expect((await list(null)).status).toBe(401);
  });

  it.each(ROLES)("the %s reads the two demo scenarios with their lines and overrides", async (role) => {
    const res = await list(role);
    expect(res.status).toBe(200);
    const scenarios: ScenarioView[] = (await res.json()).scenarios;
    expect(scenarios.map((s) => [s.name, s.lineName, s.overrides])).toEqual([
      ["Line 1 at 3.5 m/min", LINE1, { lineSpeedMPerMin: 3.5 }],
      ["Line 2 with longer oven", LINE2, { ovenLengthM: 66 }],
    ]);
    expect(scenarios[0]).toMatchObject({ createdByName: "Marguerite Oakhill", archived: false, part: { areaM2: 0.8, massKg: 6.5, thicknessMm: 2 } });
  });
});

describe("POST /api/scenarios", () => {
  it.each(editors)("the %s saves a scenario; the row reads back", async (role) => {
    const res = await post(role, await body());
    expect(res.status).toBe(201);
    const { scenario } = await res.json();
    expect(scenario).toMatchObject({ name: "Line 2 at top speed", lineName: LINE2, overrides: { lineSpeedMPerMin: 3.6, partsPerCarrier: 10 } });
    const r = await row(scenario.id);
    expect(JSON.parse(r.overrides_json)).toEqual({ lineSpeedMPerMin: 3.6, partsPerCarrier: 10 });
    expect(r).toMatchObject({ line_id: await lineId(LINE2), part_id: null, part_area_m2: 0.8, part_inside_area_m2: 0, part_height_mm: 700, coating_id: await coatingId("PP-420"), archived: 0 });
    const creator = await (await getDb()).selectFrom("users").select("role").where("id", "=", r.created_by!).executeTakeFirstOrThrow();
    expect(creator.role).toBe(role);
    expect(r.created_at).toBeGreaterThan(0);
  });

  it("a scenario needs no part or powder", async () => {
    const res = await post("manager", { name: "Oven B hotter", lineId: await lineId(OVEN), overrides: { airTempC: 210 } });
    expect(res.status).toBe(201);
    const r = await row((await res.json()).scenario.id);
    expect(r).toMatchObject({ part_id: null, part_area_m2: null, coating_id: null });
  });

  it.each(readers)("refuses the %s role with 403 and stores nothing", async (role) => {
    expect((await post(role, await body())).status).toBe(403);
    expect(await (await getDb()).selectFrom("scenarios").select("id").where("name", "=", "Line 2 at top speed").executeTakeFirst()).toBeUndefined();
  });

  it("answers 401 without a session", async () => {
    expect((await post(null, await body())).status).toBe(401);
  });

  it.each([
    // Line 2 runs 1.2–3.6 m/min (demo seed); the range is inclusive
    ["a speed above the line's range", { overrides: { lineSpeedMPerMin: 3.7 } }, "overrides.lineSpeedMPerMin", /1\.2–3\.6 m\/min/],
    ["a speed below the line's range", { overrides: { lineSpeedMPerMin: 1 } }, "overrides.lineSpeedMPerMin", /1\.2–3\.6 m\/min/],
    ["a zero speed", { overrides: { lineSpeedMPerMin: 0 } }, "overrides.lineSpeedMPerMin", /greater than 0/],
    ["a fractional parts per carrier", { overrides: { partsPerCarrier: 2.5 } }, "overrides.partsPerCarrier", /whole number/],
    ["an unknown override", { overrides: { conveyorColour: "red" } }, "overrides.conveyorColour", /Unknown field/],
    ["an unknown line", { lineId: 99999 }, "lineId", /No such line/],
    ["an e-coat paint", { coatingId: "EC-200" }, "coatingId", /e-coat paint/],
    ["an unknown coating", { coatingId: 99999 }, "coatingId", /No such coating/],
    ["an unknown catalogue part", { part: { partId: "no-such-part" } }, "part.partId", /No such part/],
    ["a part id and figures together", { part: { partId: "x", areaM2: 1 } }, "part.areaM2", /not both/],
    ["a hand-entered part without mass", { part: { ...manualPart, massKg: undefined } }, "part.massKg", /required/],
    ["no name", { name: "  " }, "name", /Enter the scenario's name/],
  ])("refuses %s with 400 naming the field", async (_n, patch, field, message) => {
    const p = patch as Record<string, unknown>;
    if (p.coatingId === "EC-200") p.coatingId = await coatingId("EC-200");
    const res = await post("manager", await body(p));
    expect(res.status).toBe(400);
    const err = (await res.json()).error;
    expect(err.code).toBe("invalid_input");
    expect(Object.keys(err.fields)).toContain(field);
    expect(err.fields[field]).toMatch(message);
    expect(await (await getDb()).selectFrom("scenarios").select("id").where("name", "=", "Line 2 at top speed").executeTakeFirst()).toBeUndefined();
  });

  it.each([
    ["an oven length", { ovenLengthM: 30 }, "overrides.ovenLengthM"],
    ["a line speed", { lineSpeedMPerMin: 2 }, "overrides.lineSpeedMPerMin"],
    ["a carrier pitch", { carrierPitchM: 1 }, "overrides.carrierPitchM"],
  ])("refuses %s on a batch oven", async (_n, overrides, field) => {
    const res = await post("manager", await body({ lineId: await lineId(OVEN), overrides }));
    expect(res.status).toBe(400);
    const err = (await res.json()).error;
    expect(err.fields[field]).toMatch(/batch oven/);
  });

  it("refuses an archived line", async () => {
    const id = await lineId(OVEN);
    await (await getDb()).updateTable("lines").set({ archived_at: 1 }).where("id", "=", id).execute();
    const res = await post("manager", await body({ lineId: id, overrides: {} }));
    expect(res.status).toBe(400);
    expect((await res.json()).error.fields.lineId).toMatch(/archived/);
  });

  it("answers 409 for a live name already in use, whatever its case", async () => {
    const res = await post("manager", await body({ name: "line 1 AT 3.5 m/min" }));
    expect(res.status).toBe(409);
    expect((await res.json()).error.fields).toHaveProperty("name");
  });
});

describe("GET, PUT and DELETE /api/scenarios/[id]", () => {
  it("reads one scenario; unknown and malformed ids are 404", async () => {
    const id = await scenarioId("Line 2 with longer oven");
    const res = await get("operator", id);
    expect(res.status).toBe(200);
    expect((await res.json()).scenario).toMatchObject({ id, name: "Line 2 with longer oven", overrides: { ovenLengthM: 66 } });
    for (const bad of ["99999", "x", "-1"]) expect((await get("operator", bad)).status).toBe(404);
  });

  it("the manager renames it and changes its overrides; the row reads back", async () => {
    const id = await scenarioId("Line 2 with longer oven");
    const res = await put("manager", id, await body({ name: "Line 2, 70 m oven", overrides: { ovenLengthM: 70, airTempC: 210 } }));
    expect(res.status).toBe(200);
    const r = await row(id);
    expect(r.name).toBe("Line 2, 70 m oven");
    expect(JSON.parse(r.overrides_json)).toEqual({ ovenLengthM: 70, airTempC: 210 });
    expect(r.updated_at).toBeGreaterThanOrEqual(r.created_at);
  });

  it("PUT checks the speed against the line too, and refuses other roles", async () => {
    const id = await scenarioId("Line 1 at 3.5 m/min");
    const res = await put("manager", id, await body({ name: "Line 1 at 5 m/min", lineId: await lineId(LINE1), overrides: { lineSpeedMPerMin: 5 } }));
    expect(res.status).toBe(400);
    // Line 1 runs 1.5–4.5 m/min (demo seed)
    expect((await res.json()).error.fields["overrides.lineSpeedMPerMin"]).toMatch(/1\.5–4\.5 m\/min/);
    expect(JSON.parse((await row(id)).overrides_json)).toEqual({ lineSpeedMPerMin: 3.5 });
    for (const role of readers) expect((await put(role, id, await body())).status).toBe(403);
    expect((await put("manager", 99999, await body())).status).toBe(404);
  });

  it("DELETE takes it off the list, frees its name and lets its line be archived", async () => {
    const id = await scenarioId("Line 2 with longer oven");
    const l2 = await lineId(LINE2);
    // a line used by a live scenario cannot be archived: the scenario is named
    const refused = await lineDelete(request(`/api/lines/${l2}`, { method: "DELETE", cookie: cookies.manager }), params({ id: String(l2) }));
    expect(refused.status).toBe(409);
    expect((await refused.json()).error.usedBy).toContainEqual({ kind: "scenario", id, label: "Scenario: Line 2 with longer oven" });

    for (const role of readers) expect((await del(role, id)).status).toBe(403);
    const res = await del("manager", id);
    expect(res.status).toBe(200);
    expect((await res.json()).scenario.archived).toBe(true);
    expect((await row(id)).archived).toBe(1);
    const names = async (q: string) => ((await (await list("operator", q)).json()).scenarios as ScenarioView[]).map((s) => s.name);
    expect(await names("")).toEqual(["Line 1 at 3.5 m/min"]);
    expect(await names("?archived=1")).toContain("Line 2 with longer oven");
    expect((await post("manager", await body({ name: "Line 2 with longer oven" }))).status).toBe(201);

    // the new scenario is on Line 2 as well; once it goes too, no scenario holds the line
    await del("manager", await (await getDb()).selectFrom("scenarios").select("id").where("archived", "=", 0).where("line_id", "=", l2).executeTakeFirstOrThrow().then((r) => r.id));
    const again = await lineDelete(request(`/api/lines/${l2}`, { method: "DELETE", cookie: cookies.manager }), params({ id: String(l2) }));
    if (again.status === 409) {
      // other records (runs) may still hold it; scenarios no longer do
      expect(((await again.json()).error.usedBy as { kind: string }[]).filter((u) => u.kind === "scenario")).toEqual([]);
    } else {
      expect(again.status).toBe(200);
    }
    expect((await del("manager", 99999)).status).toBe(404);
  });
});

describe("POST /api/scenarios/[id]/duplicate", () => {
  it("copies line, overrides, part and powder under a free name, owned by the caller", async () => {
    const id = await scenarioId("Line 1 at 3.5 m/min");
    const first = await dup("admin", id);
    expect(first.status).toBe(201);
    const copy = (await first.json()).scenario as ScenarioView;
    expect(copy).toMatchObject({ name: "Line 1 at 3.5 m/min (copy)", lineName: LINE1, overrides: { lineSpeedMPerMin: 3.5 }, part: { areaM2: 0.8 } });
    const source = await row(id);
    const r = await row(copy.id);
    expect(r).toMatchObject({ line_id: source.line_id, overrides_json: source.overrides_json, part_mass_kg: source.part_mass_kg, coating_id: source.coating_id, archived: 0 });
    const admin = await (await getDb()).selectFrom("users").select("id").where("role", "=", "admin").executeTakeFirstOrThrow();
    expect(r.created_by).toBe(admin.id);

    // a copy of the copy, or a second copy, takes the next free number
    expect((await (await dup("manager", copy.id)).json()).scenario.name).toBe("Line 1 at 3.5 m/min (copy 2)");
    expect((await (await dup("manager", id)).json()).scenario.name).toBe("Line 1 at 3.5 m/min (copy 3)");
  });

  it("refuses other roles and unknown ids", async () => {
    const id = await scenarioId("Line 1 at 3.5 m/min");
    for (const role of readers) expect((await dup(role, id)).status).toBe(403);
    expect((await dup("manager", 99999)).status).toBe(404);
    expect(await (await getDb()).selectFrom("scenarios").select("id").execute()).toHaveLength(2);
  });
});
