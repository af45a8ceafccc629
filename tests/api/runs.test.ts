import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { insertRun } from "@/db/queries/runs";
import { ROLES } from "@/lib/server/access";
import { epochToDate, nowSeconds } from "@/lib/server/coatings";
import type { BoardView, RunDetail, RunListItem } from "@/lib/server/runs";
import { params, request, useSignedInDemo } from "./helpers";
import { GET as listGet, POST as listPost } from "@/app/api/runs/route";
import { DELETE as oneDelete, GET as oneGet, PUT as onePut } from "@/app/api/runs/[id]/route";
import { POST as statusPost } from "@/app/api/runs/[id]/status/route";
import { GET as boardGet, PUT as boardPut } from "@/app/api/runs/board/route";
import { GET as proposeGet } from "@/app/api/runs/board/propose/route";
import { POST as previewPost } from "@/app/api/runs/preview/route";
import { DELETE as coatingDelete } from "@/app/api/coatings/[id]/route";
import { DELETE as lineDelete } from "@/app/api/lines/[id]/route";
import type { Role } from "@/db/schema";

const cookies = useSignedInDemo();

const LINE1 = "Line 1 — E-coat and powder";
const LINE2 = "Line 2 — Powder only";
const DAY = 86_400;
const today = () => epochToDate(nowSeconds());
const tomorrow = () => epochToDate(nowSeconds() + DAY);
const inDays = (n: number) => epochToDate(nowSeconds() + n * DAY);

async function lineId(name: string) {
  return (await (await getDb()).selectFrom("lines").select("id").where("name", "=", name).executeTakeFirstOrThrow()).id;
}
async function coatingId(code: string) {
  return (await (await getDb()).selectFrom("coatings").select("id").where("code", "=", code).executeTakeFirstOrThrow()).id;
}
async function partId(number: string) {
  return (await (await getDb()).selectFrom("parts").select("id").where("number", "=", number).executeTakeFirstOrThrow()).id;
}
async function runCount() {
  return Number((await (await getDb()).selectFrom("runs").select((eb) => eb.fn.countAll().as("n")).executeTakeFirstOrThrow()).n);
}

/** A two-coat run of trailer fenders (e-coat then red powder) on Line 1, ten days out (an empty board). */
async function fenderRun(over: Record<string, unknown> = {}) {
  return {
    partId: await partId("BC-2210"),
    quantity: 120,
    lineId: await lineId(LINE1),
    date: inDays(10),
    shift: 1,
    clearanceMm: 50,
    orientations: "any",
    coats: [
      { coatingId: await coatingId("EC-200"), filmUm: 20 },
      { coatingId: await coatingId("PP-430"), filmUm: 70, firstPassEfficiency: 0.55, reclaimEfficiency: 0 },
    ],
    masking: "Caps on the stud bosses\nTape the earth tab",
    notes: "",
    ...over,
  };
}

const post = (role: Role | null, body: unknown) => listPost(request("/api/runs", { method: "POST", body, cookie: role ? cookies[role] : null }));
const getOne = (role: Role, id: number | string) => oneGet(request(`/api/runs/${id}`, { cookie: cookies[role] }), params({ id: String(id) }));
const put = (role: Role, id: number, body: unknown) => onePut(request(`/api/runs/${id}`, { method: "PUT", body, cookie: cookies[role] }), params({ id: String(id) }));
const del = (role: Role, id: number) => oneDelete(request(`/api/runs/${id}`, { method: "DELETE", cookie: cookies[role] }), params({ id: String(id) }));
const move = (role: Role, id: number, status: string) =>
  statusPost(request(`/api/runs/${id}/status`, { method: "POST", body: { status }, cookie: cookies[role] }), params({ id: String(id) }));
const board = async (role: Role, lid: number, date: string) => boardGet(request(`/api/runs/board?lineId=${lid}&date=${date}`, { cookie: cookies[role] }));

describe("GET /api/runs", () => {
  it("answers 401 without a session", async () => {
    expect((await listGet(request("/api/runs"))).status).toBe(401);
  });

  it.each(ROLES)("the %s reads today's demo runs with their computed numbers", async (role) => {
    const res = await listGet(request(`/api/runs?date=${today()}`, { cookie: cookies[role] }));
    expect(res.status).toBe(200);
    const runs: RunListItem[] = (await res.json()).runs;
    expect(runs.map((r) => r.part?.number).sort()).toEqual(["BC-1043", "BC-2210", "BC-3300", "BC-4105", "BC-5020"]);
    expect(runs.every((r) => r.date === today() && r.summary !== null && r.planError === null)).toBe(true);
  });

  it("filters by line; a bad date is a 400 naming it", async () => {
    const lid = await lineId(LINE1);
    const runs: RunListItem[] = (await (await listGet(request(`/api/runs?date=${tomorrow()}&lineId=${lid}`, { cookie: cookies.operator }))).json()).runs;
    expect(runs.map((r) => r.line.name)).toEqual([LINE1, LINE1]);
    const bad = await listGet(request("/api/runs?date=2026-02-30", { cookie: cookies.operator }));
    expect(bad.status).toBe(400);
    expect((await bad.json()).error.fields.date).toMatch(/real calendar date/);
  });
});

describe("POST /api/runs", () => {
  it("the supervisor plans a two-coat run: 201 with carriers, line time, material; the rows read back", async () => {
    const body = await fenderRun();
    const res = await post("supervisor", body);
    expect(res.status).toBe(201);
    const { run, warnings }: { run: RunDetail; warnings: string[] } = await res.json();
    expect(warnings).toEqual([]);
    expect(run).toMatchObject({ status: "draft", quantity: 120, date: body.date, shift: 1, line: { name: LINE1 }, part: { number: "BC-2210" } });
    const plan = run.plan!;
    // The rolled fender (760 × 320 × 340 mm) fits the 500 × 1500 × 600 mm window one per carrier
    // with 50 mm clearance; 120 carriers × 0.6 m = 72 m; (72 + 224) m / 3 m/min = 98.667 min (cost.ts, hand).
    expect(plan.racking.partsPerCarrier).toBe(1);
    expect(plan.carriers).toBe(120);
    expect(plan.lineTimeMin).toBeCloseTo(296 / 3, 9);
    expect(plan.coats.map((c) => [c.code, c.kind, c.pass])).toEqual([["EC-200", "e-coat", 1], ["PP-430", "powder", 1]]);
    expect(plan.materialKg).toBeCloseTo(plan.coats[0].materialKg + plan.coats[1].materialKg, 12);
    expect(plan.cures).toBe(true);

    const db = await getDb();
    const row = await db.selectFrom("runs").selectAll().where("id", "=", run.id).executeTakeFirstOrThrow();
    expect(row).toMatchObject({ quantity: 120, shift: 1, status: "draft", clearance_mm: 50, orientations: "any", masking: body.masking, sequence: 0 });
    expect(epochToDate(row.run_date)).toBe(body.date);
    const coats = await db.selectFrom("run_coats").selectAll().where("run_id", "=", run.id).orderBy("position").execute();
    expect(coats.map((c) => [c.position, c.coating_id, c.film_um, c.first_pass_efficiency, c.reclaim_efficiency])).toEqual([
      [0, body.coats[0].coatingId, 20, null, null],
      [1, body.coats[1].coatingId, 70, 0.55, 0],
    ]);
  });

  it.each(["manager", "engineer", "purchaser", "operator"] as Role[])("refuses the %s role", async (role) => {
    expect((await post(role, await fenderRun())).status).toBe(403);
  });

  it.each([
    ["a quantity of 0", { quantity: 0 }, "quantity", /at least 1/],
    ["a date that does not exist", { date: "2026-13-01" }, "date", /date/],
    ["shift 4", { shift: 4 }, "shift", /shift 1, 2 or 3/],
    ["no coats", { coats: [] }, "coats", /at least one coat/],
    ["an unknown field", { colour: "red" }, "colour", /Unknown/],
  ])("refuses %s with 400 naming %s, and stores nothing", async (_what, over, field, message) => {
    const before = await runCount();
    const res = await post("supervisor", await fenderRun(over));
    expect(res.status).toBe(400);
    expect((await res.json()).error.fields[field as string]).toMatch(message as RegExp);
    expect(await runCount()).toBe(before);
  });

  it("refuses a part the line's window cannot hold: 400 on lineId saying why", async () => {
    const before = await runCount();
    // the bike-rack hoop's bounding box (≈ 648 × 48 × 974 mm) fits no way round in 500 × 1500 × 600 mm
    const res = await post("supervisor", await fenderRun({ partId: await partId("BC-5020") }));
    expect(res.status).toBe(400);
    const { error } = await res.json();
    expect(error.fields.lineId).toMatch(/^Part BC-5020 does not fit on Line 1 — E-coat and powder's carrier: The part .* is larger than the 500 × 1500 × 600 mm window in every orientation\.$/);
    expect(await runCount()).toBe(before);
  });

  it("refuses an archived coating, an unknown part and e-coat on the powder-only line", async () => {
    const db = await getDb();
    await db.updateTable("coatings").set({ archived_at: nowSeconds() }).where("code", "=", "PP-430").execute();
    let res = await post("supervisor", await fenderRun());
    expect(res.status).toBe(400);
    expect((await res.json()).error.fields["coats.1.coatingId"]).toBe("PP-430 is archived; choose a current coating.");

    res = await post("supervisor", await fenderRun({ partId: "no-such-part", coats: [{ coatingId: await coatingId("EC-200"), filmUm: 20 }] }));
    expect((await res.json()).error.fields.partId).toBe("No such part.");

    res = await post("supervisor", await fenderRun({ lineId: await lineId(LINE2), coats: [{ coatingId: await coatingId("EC-200"), filmUm: 20 }] }));
    expect(res.status).toBe(400);
    expect((await res.json()).error.fields["coats.0.coatingId"]).toMatch(/has no e-coat tank stage/);
  });

  it("a powder coat without its first-pass efficiency is a 400 on that coat", async () => {
    const res = await post("supervisor", await fenderRun({ coats: [{ coatingId: await coatingId("PP-430"), filmUm: 70 }] }));
    expect(res.status).toBe(400);
    expect(Object.keys((await res.json()).error.fields)).toEqual(["coats.0.firstPassEfficiency"]);
  });

  it("saves a run that overflows the shift, with a warning", async () => {
    // Tomorrow's Line 1 already runs past its 8 h shift; one more run ends later still.
    const res = await post("supervisor", await fenderRun({ date: tomorrow(), quantity: 60 }));
    expect(res.status).toBe(201);
    const { run, warnings } = await res.json();
    expect(warnings).toHaveLength(1);
    expect(warnings[0]).toMatch(new RegExp(`^With the 2 other runs on ${LINE1} on ${tomorrow()}, shift 1, this run ends [\\d.]+ min after the 8 h shift`));
    expect(run.sequence).toBe(2);
  });

  it("nothing is saved half-way: a coat that breaks a constraint rolls back its run", async () => {
    const db = await getDb();
    const before = await runCount();
    const t = nowSeconds();
    await expect(
      insertRun(
        db,
        { part_id: await partId("BC-2210"), quantity: 5, line_id: await lineId(LINE1), run_date: t - (t % DAY), shift: 1, line_speed_m_per_min: null, clearance_mm: 0, orientations: "any", orientation_json: null, parts_per_carrier_override: null, masking: "", notes: "", status: "draft", created_by: null, created_at: t, updated_at: t },
        [{ coating_id: await coatingId("EC-200"), film_um: 0, first_pass_efficiency: null, reclaim_efficiency: null }],
      ),
    ).rejects.toThrow(/CHECK constraint/);
    expect(await runCount()).toBe(before);
  });
});

describe("POST /api/runs/preview", () => {
  it("plans the body as POST would, with the shift warning, and stores nothing", async () => {
    const before = await runCount();
    const res = await previewPost(request("/api/runs/preview", { method: "POST", body: await fenderRun({ date: tomorrow(), quantity: 60 }), cookie: cookies.operator }));
    expect(res.status).toBe(200);
    const { plan, warnings } = await res.json();
    expect(plan.carriers).toBe(60);
    expect(warnings).toHaveLength(1);
    expect(warnings[0]).toMatch(/this run would end [\d.]+ min after the 8 h shift\.$/);
    expect(await runCount()).toBe(before);
    const bad = await previewPost(request("/api/runs/preview", { method: "POST", body: await fenderRun({ partId: await partId("BC-5020") }), cookie: cookies.operator }));
    expect(bad.status).toBe(400);
    expect(Object.keys((await bad.json()).error.fields)).toEqual(["lineId"]);
  });
});

describe("GET, PUT, DELETE /api/runs/[id] and status changes", () => {
  async function created() {
    const res = await post("supervisor", await fenderRun());
    return (await res.json()).run as RunDetail;
  }

  it("reads a run with its plan; an unknown run is 404", async () => {
    const run = await created();
    const res = await getOne("operator", run.id);
    expect(res.status).toBe(200);
    const one: RunDetail = (await res.json()).run;
    expect(one.plan!.coats[1].filmCheck.areaCount).toBeGreaterThan(0);
    expect(one.nextStatuses).toEqual(["planned", "cancelled"]);
    for (const bad of ["99999", "abc"]) expect((await getOne("operator", bad)).status).toBe(404);
  });

  it("PUT replaces the run and its coats; the rows read back", async () => {
    const run = await created();
    const body = await fenderRun({ quantity: 200, coats: [{ coatingId: await coatingId("EC-200"), filmUm: 22 }] });
    const res = await put("supervisor", run.id, body);
    expect(res.status).toBe(200);
    expect((await res.json()).run.plan.carriers).toBe(200);
    const coats = await (await getDb()).selectFrom("run_coats").selectAll().where("run_id", "=", run.id).execute();
    expect(coats.map((c) => [c.position, c.film_um])).toEqual([[0, 22]]);
  });

  it("moves draft → planned → in progress → done and refuses other moves with 409", async () => {
    const run = await created();
    expect((await move("supervisor", run.id, "done")).status).toBe(409);
    expect((await move("supervisor", run.id, "planned")).status).toBe(200);
    expect((await move("operator", run.id, "in-progress")).status).toBe(403);
    expect((await move("supervisor", run.id, "in-progress")).status).toBe(200);
    // started: no more edits, no delete
    expect((await put("supervisor", run.id, await fenderRun())).status).toBe(409);
    expect((await del("supervisor", run.id)).status).toBe(409);
    const done = await move("admin", run.id, "done");
    expect(done.status).toBe(200);
    expect((await done.json()).run.nextStatuses).toEqual([]);
    const refused = await move("supervisor", run.id, "cancelled");
    expect(refused.status).toBe(409);
    expect((await refused.json()).error.message).toBe("A run that is done cannot become cancelled; it is final.");
    const row = await (await getDb()).selectFrom("runs").select("status").where("id", "=", run.id).executeTakeFirstOrThrow();
    expect(row.status).toBe("done");
  });

  it("an unknown status is 400", async () => {
    const run = await created();
    const res = await move("supervisor", run.id, "finished");
    expect(res.status).toBe(400);
    expect((await res.json()).error.fields.status).toMatch(/draft, planned/);
  });

  it("DELETE removes a draft with its coats; a planned run is 409", async () => {
    const run = await created();
    expect((await del("supervisor", run.id)).status).toBe(200);
    const db = await getDb();
    expect(await db.selectFrom("runs").select("id").where("id", "=", run.id).executeTakeFirst()).toBeUndefined();
    expect(await db.selectFrom("run_coats").select("id").where("run_id", "=", run.id).executeTakeFirst()).toBeUndefined();
    const other = await created();
    await move("supervisor", other.id, "planned");
    const res = await del("supervisor", other.id);
    expect(res.status).toBe(409);
    expect((await res.json()).error.message).toMatch(/Only a draft run can be deleted/);
  });

  it("a coating or line used by a run cannot be deleted", async () => {
    const cid = await coatingId("PP-430");
    const res = await coatingDelete(request(`/api/coatings/${cid}`, { method: "DELETE", cookie: cookies.purchaser }), params({ id: String(cid) }));
    expect(res.status).toBe(409);
    const usedBy = (await res.json()).error.usedBy;
    expect(usedBy[0]).toMatchObject({ kind: "run" });
    expect(usedBy[0].label).toMatch(/^Run \d+: 600 × BC-2210 on /);
    const lid = await lineId(LINE2);
    const lres = await lineDelete(request(`/api/lines/${lid}`, { method: "DELETE", cookie: cookies.manager }), params({ id: String(lid) }));
    expect(lres.status).toBe(409);
    const row = await (await getDb()).selectFrom("coatings").select("archived_at").where("id", "=", cid).executeTakeFirstOrThrow();
    expect(row.archived_at).toBeNull();
  });
});

describe("the day board", () => {
  it("shows today's Line 1 runs in order with the colour change and the shift's fill", async () => {
    const lid = await lineId(LINE1);
    const res = await board("manager", lid, today());
    expect(res.status).toBe(200);
    const b: BoardView = (await res.json()).board;
    expect(b).toMatchObject({ lineName: LINE1, shiftHours: 8, colourChangeMin: 20 });
    const shift = b.shifts[0];
    expect(shift.runs.map((r) => r.part.number)).toEqual(["BC-2210", "BC-4105", "BC-1043"]);
    // red (PP-430) then grey (PP-420): one booth colour change of 20 min; the e-coat-only run leaves the booth alone
    expect(shift.colourChanges).toHaveLength(1);
    expect(shift.runs[1].slot.colourChangeBeforeMin).toBe(20);
    // first run: 600 carriers × 0.6 m / 3 m/min = 120 min of loading; the second starts after it and the change
    expect(shift.runs[1].slot.startMin).toBeCloseTo(140, 9);
    expect(shift.shiftMin).toBe(480);
    expect(shift.leftMin).toBeCloseTo(480 - shift.filledMin, 9);
    expect(shift.fits).toBe(true);
  });

  it("flags tomorrow's Line 1 runs past the shift", async () => {
    const b: BoardView = (await (await board("supervisor", await lineId(LINE1), tomorrow())).json()).board;
    expect(b.shifts[0].runs.map((r) => r.slot.fits)).toEqual([true, false]);
    expect(b.shifts[0].fits).toBe(false);
    expect(b.shifts[0].leftMin).toBeLessThan(0);
  });

  it("proposes grouping by cure schedule, light to dark; the supervisor saves the order", async () => {
    const lid = await lineId(LINE1);
    const current: BoardView = (await (await board("supervisor", lid, today())).json()).board;
    const [red, grey, brackets] = current.shifts[0].runs.map((r) => r.id);
    const pres = await proposeGet(request(`/api/runs/board/propose?lineId=${lid}&date=${today()}`, { cookie: cookies.supervisor }));
    expect(pres.status).toBe(200);
    const proposal = (await pres.json()).proposal;
    // grey (0.209) before red (0.095), same schedule; the e-coat-only run is its own group, darkest (0.019)
    expect(proposal.shifts[0].runIds).toEqual([grey, red, brackets]);

    const save = (role: Role, runIds: number[]) =>
      boardPut(request("/api/runs/board", { method: "PUT", body: { lineId: lid, date: today(), shift: 1, runIds }, cookie: cookies[role] }));
    expect((await save("manager", [grey, red, brackets])).status).toBe(403);
    const res = await save("supervisor", [grey, red, brackets]);
    expect(res.status).toBe(200);
    expect((await res.json()).board.shifts[0].runs.map((r: { id: number }) => r.id)).toEqual([grey, red, brackets]);
    const rows = await (await getDb()).selectFrom("runs").select(["id", "sequence"]).where("id", "in", [red, grey, brackets]).execute();
    expect(Object.fromEntries(rows.map((r) => [r.id, r.sequence]))).toEqual({ [grey]: 0, [red]: 1, [brackets]: 2 });

    // a list that is not exactly the shift's runs: 409, nothing changes
    const stale = await save("supervisor", [red, grey]);
    expect(stale.status).toBe(409);
    expect((await stale.json()).error.fields.runIds).toBe("Send exactly the 3 runs of shift 1.");
  });

  it("needs a line and a date", async () => {
    const res = await boardGet(request("/api/runs/board", { cookie: cookies.supervisor }));
    expect(res.status).toBe(400);
    expect(Object.keys((await res.json()).error.fields).sort()).toEqual(["date", "lineId"]);
    expect((await board("supervisor", 99999, today())).status).toBe(404);
  });
});
