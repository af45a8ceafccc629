import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { measuredFilmUm, type FilmCheckView, type RunFilmChecks } from "@/lib/server/film-checks";
import { params, request, useSignedInDemo } from "./helpers";
import { GET as runGet, POST as runPost } from "@/app/api/runs/[id]/film-checks/route";
import { DELETE as oneDelete, GET as oneGet, PUT as onePut } from "@/app/api/film-checks/[id]/route";
import { GET as testsGet, POST as testsPost } from "@/app/api/runs/[id]/tests/route";
import { GET as gaugesGet, POST as gaugesPost } from "@/app/api/gauges/route";
import { GET as trendGet } from "@/app/api/quality/trend/route";
import type { Role } from "@/db/schema";

const cookies = useSignedInDemo();

/** Today's in-progress fender run: coat 0 EC-200 (18–25 µm), coat 1 PP-430 (60–90 µm). */
async function fenderRunId(): Promise<number> {
  const db = await getDb();
  const r = await db
    .selectFrom("runs")
    .innerJoin("parts", "parts.id", "runs.part_id")
    .select("runs.id")
    .where("parts.number", "=", "BC-2210")
    .where("runs.status", "=", "in-progress")
    .executeTakeFirstOrThrow();
  return r.id;
}

async function post(runId: number, body: unknown, role: Role = "operator") {
  return runPost(request(`/api/runs/${runId}/film-checks`, { method: "POST", body, cookie: cookies[role] }), params({ id: String(runId) }));
}

const spot = (v: number) => [v, v, v];

describe("film checks of a run", () => {
  it("lists the seeded e-coat check judged as a pass against the coating's 18–25 µm", async () => {
    const runId = await fenderRunId();
    const res = await runGet(request(`/api/runs/${runId}/film-checks`, { cookie: cookies.engineer }), params({ id: String(runId) }));
    expect(res.status).toBe(200);
    const body = (await res.json()) as RunFilmChecks;
    expect(body.coats.map((c) => [c.coatingCode, c.specMinUm, c.specMaxUm])).toEqual([
      ["EC-200", 18, 25],
      ["PP-430", 60, 90],
    ]);
    expect(body.checks).toHaveLength(1);
    expect(body.checks[0]).toMatchObject({ coatIndex: 0, rule: "sspc-pa2", pass: true, reasons: [], readingCount: 30 });
    // hand sum of the 30 seeded readings: 313 + 316 = 629
    expect(body.checks[0].meanUm).toBeCloseTo(629 / 30, 9);
  });

  it.each([
    // source: SSPC-PA 2 default restriction: a spot may not be below 80 % of the minimum (0.8 × 60 = 48 µm)
    { name: "spot 4 at 45 µm fails", spots: [70, 70, 70, 45, 70], pass: false, reasons: ["Area 1, spot 4 at 45 µm is below 80 % of the 60 µm minimum (48 µm)."] },
    // source: SSPC-PA 2 — the limit is inclusive: a spot of exactly 48 µm is acceptable; area mean (4×70+48)/5 = 65.6 ≥ 60
    { name: "spot at exactly 80 % passes", spots: [70, 70, 70, 48, 70], pass: true, reasons: [] },
    // source: SSPC-PA 2 — spot above 120 % of the 90 µm maximum (108 µm); area mean (4×70+110)/5 = 78
    { name: "spot above 120 % of max fails", spots: [70, 70, 110, 70, 70], pass: false, reasons: ["Area 1, spot 3 at 110 µm is above 120 % of the 90 µm maximum (108 µm)."] },
    // source: SSPC-PA 2 — area mean (5×55)/5 = 55 < 60 though every spot ≥ 48
    { name: "area mean below minimum fails", spots: [55, 55, 55, 55, 55], pass: false, reasons: ["Area 1 averages 55 µm, below the 60 µm minimum."] },
  ])("SSPC-PA 2 on PP-430 (60–90 µm): $name", async ({ spots, pass, reasons }) => {
    const runId = await fenderRunId();
    const res = await post(runId, { rule: "sspc-pa2", coatIndex: 1, areas: [spots.map(spot)] });
    expect(res.status).toBe(201);
    const { check } = (await res.json()) as { check: FilmCheckView };
    expect(check.pass).toBe(pass);
    expect(check.reasons).toEqual(reasons);
    const row = await (await getDb()).selectFrom("film_checks").selectAll().where("id", "=", check.id).executeTakeFirstOrThrow();
    expect(JSON.parse(row.readings_json)).toEqual([spots.map(spot)]);
    expect(row.coat_position).toBe(1);
  });

  it.each([
    // source: ISO 19840 — nominal 60 µm; 2 of 10 readings (58, 59) between 80 % and nominal = 20 %, allowed; mean 628/10 = 62.8
    { readings: [60, 62, 65, 70, 58, 61, 63, 66, 64, 59], pass: true, reasons: [] as string[] },
    // source: ISO 19840 — 3 of 10 (58, 59, 55) below nominal = 30 % > 20 %; mean 613/10 = 61.3 ≥ 60
    {
      readings: [60, 62, 65, 55, 58, 61, 63, 66, 64, 59],
      pass: false,
      reasons: ["3 of 10 readings (30 %) lie between 80 % and 100 % of nominal; at most 20 % may."],
    },
    // source: ISO 19840 — 47 µm < 0.8 × 60 = 48 µm; the low band 47 is not counted in the 20 %; mean 635/10 = 63.5
    {
      readings: [60, 62, 65, 70, 47, 61, 63, 66, 70, 71],
      pass: false,
      reasons: ["1 of 10 readings is below 80 % of nominal (48 µm)."],
    },
  ])("ISO 19840 on PP-430 (nominal = 60 µm minimum) %#", async ({ readings, pass, reasons }) => {
    const runId = await fenderRunId();
    const res = await post(runId, { rule: "iso19840", coatIndex: 1, readingsUm: readings });
    expect(res.status).toBe(201);
    const { check } = (await res.json()) as { check: FilmCheckView };
    expect(check.pass).toBe(pass);
    expect(check.reasons).toEqual(reasons);
  });

  it("uses a spec overridden on the check", async () => {
    const runId = await fenderRunId();
    // source: SSPC-PA 2 — with a 50–70 µm override 80 % of the minimum is 40 µm, so a 45 µm spot passes; mean (4×60+45)/5 = 57
    const res = await post(runId, { rule: "sspc-pa2", coatIndex: 1, specMinUm: 50, specMaxUm: 70, areas: [[60, 60, 60, 45, 60].map(spot)] });
    const { check } = (await res.json()) as { check: FilmCheckView };
    expect(check).toMatchObject({ pass: true, specMinUm: 50, specMaxUm: 70, specMinOverrideUm: 50 });
  });

  it("shows reasons in mil for a US-customary user", async () => {
    const runId = await fenderRunId();
    const res = await post(runId, { rule: "sspc-pa2", coatIndex: 1, areas: [[70, 70, 70, 45, 70].map(spot)] });
    const { check } = (await res.json()) as { check: FilmCheckView };
    // the demo manager works in US units; source: NIST SP 811, 1 mil = 25.4 µm: 45 → 1.77, 60 → 2.36, 48 → 1.89
    const got = await oneGet(request(`/api/film-checks/${check.id}`, { cookie: cookies.manager }), params({ id: String(check.id) }));
    const { check: seen } = (await got.json()) as { check: FilmCheckView };
    expect(seen.reasons).toEqual(["Area 1, spot 4 at 1.77 mil is below 80 % of the 2.36 mil minimum (1.89 mil)."]);
  });

  it.each([
    { body: { rule: "sspc-pa2", coatIndex: 1, areas: [[[70, 70, 70], [70, 70, -5]]] }, field: "areas.0.1.2" },
    { body: { rule: "sspc-pa2", coatIndex: 1, areas: [[[70, 70, 70], [70, 6000, 70]]] }, field: "areas.0.1.1" },
    { body: { rule: "iso19840", coatIndex: 1, readingsUm: [60, "6O", 61] }, field: "readingsUm.1" },
    // a spot of two readings: SSPC-PA 2 needs at least 3
    { body: { rule: "sspc-pa2", coatIndex: 1, areas: [[[70, 70, 70], [70, 70]]] }, field: "areas.0.1" },
    { body: { rule: "sspc-pa2", coatIndex: 5, areas: [[[70, 70, 70]]] }, field: "coatIndex" },
  ])("refuses bad readings naming $field and saves nothing", async ({ body, field }) => {
    const runId = await fenderRunId();
    const res = await post(runId, body);
    expect(res.status).toBe(400);
    const err = (await res.json()) as { error: { code: string; fields: Record<string, string> } };
    expect(err.error.code).toBe("invalid_input");
    expect(Object.keys(err.error.fields)).toContain(field);
    const n = await (await getDb()).selectFrom("film_checks").select((eb) => eb.fn.countAll().as("n")).executeTakeFirstOrThrow();
    expect(Number(n.n)).toBe(1);
  });

  it("keeps records of a done run: 409 for the operator, allowed for admin, every change logged", async () => {
    const runId = await fenderRunId();
    const created = (await (await post(runId, { rule: "sspc-pa2", coatIndex: 1, areas: [[70, 70, 70, 70, 70].map(spot)] })).json()) as { check: FilmCheckView };
    const id = created.check.id;
    const db = await getDb();
    await db.updateTable("runs").set({ status: "done" }).where("id", "=", runId).execute();
    const body = { rule: "sspc-pa2", coatIndex: 1, areas: [[72, 70, 70, 70, 70].map(spot)] };
    const put = (role: Role) => onePut(request(`/api/film-checks/${id}`, { method: "PUT", body, cookie: cookies[role] }), params({ id: String(id) }));
    expect((await put("operator")).status).toBe(409);
    expect((await put("supervisor")).status).toBe(409);
    expect((await post(runId, body)).status).toBe(409);
    const testRes = await testsPost(
      request(`/api/runs/${runId}/tests`, { method: "POST", body: { kind: "coverage", result: "pass" }, cookie: cookies.operator }),
      params({ id: String(runId) }),
    );
    expect(testRes.status).toBe(409);
    expect((await put("admin")).status).toBe(200);
    const del = await oneDelete(request(`/api/film-checks/${id}`, { method: "DELETE", cookie: cookies.admin }), params({ id: String(id) }));
    expect(del.status).toBe(200);
    const log = await db.selectFrom("film_check_log").selectAll().where("entity_id", "=", id).where("entity", "=", "film_check").orderBy("id").execute();
    expect(log.map((l) => l.action)).toEqual(["create", "update", "delete"]);
    expect(JSON.parse(JSON.parse(log[1].old_json!).readings_json)[0][0]).toEqual([70, 70, 70]);
    expect(JSON.parse(log[1].new_json!).readings_json).toContain("72");
    expect(log[2].new_json).toBeNull();
  });
});

describe("readings only on coated parts", () => {
  // common practice, no source: DFT is read on cured parts (SSPC-PA 2 measures the applied
  // coating), so a run that has not started or was cancelled has nothing to read
  it.each([
    ["planned", "Film readings are taken on coated parts: this run has not started yet."],
    ["draft", "Film readings are taken on coated parts: this run has not started yet."],
    ["cancelled", "This run was cancelled: no parts were coated on it."],
  ] as const)("a %s run refuses readings and other tests with 409 saying why; its page says so too", async (status, message) => {
    const runId = await fenderRunId();
    const db = await getDb();
    await db.updateTable("runs").set({ status }).where("id", "=", runId).execute();
    const before = Number((await db.selectFrom("film_checks").select((eb) => eb.fn.countAll().as("n")).executeTakeFirstOrThrow()).n);
    const res = await post(runId, { rule: "sspc-pa2", coatIndex: 1, areas: [[70, 70, 70, 70, 70].map(spot)] });
    expect(res.status).toBe(409);
    expect((await res.json()).error.message).toBe(message);
    const testRes = await testsPost(
      request(`/api/runs/${runId}/tests`, { method: "POST", body: { kind: "coverage", result: "pass" }, cookie: cookies.operator }),
      params({ id: String(runId) }),
    );
    expect(testRes.status).toBe(409);
    expect(Number((await db.selectFrom("film_checks").select((eb) => eb.fn.countAll().as("n")).executeTakeFirstOrThrow()).n)).toBe(before);
    const view = (await (await runGet(request(`/api/runs/${runId}/film-checks`, { cookie: cookies.operator }), params({ id: String(runId) }))).json()) as {
      run: { locked: boolean; lockReason: string | null };
    };
    expect(view.run).toMatchObject({ locked: true, lockReason: message });
  });
});

describe("other tests", () => {
  it.each([
    { body: { kind: "cure", solvent: "MEK", rubCount: 50, result: "pass" }, summary: "Solvent rub (ASTM D5402): 50 double rubs with MEK — pass" },
    { body: { kind: "adhesion", method: "B", rating: 4 }, summary: "Adhesion (ASTM D3359 method B): class 4B — small flakes, under 5 % affected" },
    { body: { kind: "appearance", gloss60Gu: 88, colourNote: "Matches the master panel" }, summary: "Appearance: gloss 88 GU at 60°; Matches the master panel" },
    { body: { kind: "coverage", result: "touch-up" }, summary: "Coverage after e-coat: touch-up needed" },
  ])("records $body.kind with who and when", async ({ body, summary }) => {
    const runId = await fenderRunId();
    const res = await testsPost(request(`/api/runs/${runId}/tests`, { method: "POST", body, cookie: cookies.supervisor }), params({ id: String(runId) }));
    expect(res.status).toBe(201);
    const list = await testsGet(request(`/api/runs/${runId}/tests`, { cookie: cookies.operator }), params({ id: String(runId) }));
    const { tests } = (await list.json()) as { tests: { summary: string; recordedBy: string; recordedAt: number }[] };
    const last = tests[tests.length - 1];
    expect(last.summary).toBe(summary);
    expect(last.recordedBy).toBe("Tobias Wrenfield");
    expect(last.recordedAt).toBeGreaterThan(0);
  });

  it("refuses an adhesion class outside 0–5", async () => {
    const runId = await fenderRunId();
    const res = await testsPost(
      request(`/api/runs/${runId}/tests`, { method: "POST", body: { kind: "adhesion", method: "B", rating: 6 }, cookie: cookies.operator }),
      params({ id: String(runId) }),
    );
    expect(res.status).toBe(400);
    expect(((await res.json()) as { error: { fields: Record<string, string> } }).error.fields).toHaveProperty("rating");
  });
});

describe("gauges, trend and measured film", () => {
  it("adds a gauge and remembers its CSV mapping when saved again by name", async () => {
    const first = await gaugesPost(request("/api/gauges", { method: "POST", body: { name: "Pull-off 2", gaugeType: "type1", serial: "PO-2" }, cookie: cookies.operator }));
    expect(first.status).toBe(201);
    const again = await gaugesPost(
      request("/api/gauges", { method: "POST", body: { name: "Pull-off 2", gaugeType: "type1", mapping: { readingColumn: "DFT", unit: "mil" } }, cookie: cookies.operator }),
    );
    expect(again.status).toBe(200);
    const { gauges } = (await (await gaugesGet(request("/api/gauges", { cookie: cookies.engineer }))).json()) as { gauges: { name: string; serial: string; mapping: unknown }[] };
    expect(gauges.find((g) => g.name === "Pull-off 2")).toMatchObject({ serial: "PO-2", mapping: { readingColumn: "DFT", unit: "mil" } });
  });

  it("gives the trend of a coating on a line and the measured mean film per run coat", async () => {
    const runId = await fenderRunId();
    const db = await getDb();
    const ec = await db.selectFrom("coatings").select("id").where("code", "=", "EC-200").executeTakeFirstOrThrow();
    const run = await db.selectFrom("runs").select("line_id").where("id", "=", runId).executeTakeFirstOrThrow();
    const res = await trendGet(request(`/api/quality/trend?coatingId=${ec.id}&lineId=${run.line_id}`, { cookie: cookies.supervisor }));
    expect(res.status).toBe(200);
    const body = (await res.json()) as { points: { meanUm: number; fractionInSpec: number; readingCount: number }[] };
    expect(body.points).toHaveLength(1);
    // every seeded reading lies in 19–23 µm, inside 18–25 µm
    expect(body.points[0]).toMatchObject({ fractionInSpec: 1, readingCount: 30 });
    expect(body.points[0].meanUm).toBeCloseTo(629 / 30, 9);
    expect(await measuredFilmUm(db, String(runId), 0)).toBeCloseTo(629 / 30, 9);
    expect(await measuredFilmUm(db, String(runId), 1)).toBeNull();
    const bad = await trendGet(request(`/api/quality/trend?coatingId=x&lineId=1`, { cookie: cookies.manager }));
    expect(bad.status).toBe(400);
  });
});
