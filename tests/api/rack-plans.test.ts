import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { ROLES } from "@/lib/server/access";
import { epochToDate, nowSeconds } from "@/lib/server/coatings";
import type { RunDetail } from "@/lib/server/runs";
import type { RackPlansList, SavedRackPlan } from "@/app/api/rack/plans/route";
import { GET as listGet, POST as listPost } from "@/app/api/rack/plans/route";
import { DELETE as oneDelete, GET as oneGet, PUT as onePut } from "@/app/api/rack/plans/[id]/route";
import { GET as runGet } from "@/app/api/runs/[id]/route";
import { POST as runPost } from "@/app/api/runs/route";
import { POST as statusPost } from "@/app/api/runs/[id]/status/route";
import { placementProblems } from "../unit/rack/check-placements";
import { params, request, useSignedInDemo } from "./helpers";
import type { Role } from "@/db/schema";

const cookies = useSignedInDemo();

const LINE1 = "Line 1 — E-coat and powder";
const LINE2 = "Line 2 — Powder only";
const OVEN = "Batch oven B — gas";
const WRITERS: Role[] = ["engineer", "supervisor", "admin"];
const READERS_ONLY: Role[] = ["manager", "purchaser", "operator"];

async function lineId(name: string) {
  return (await (await getDb()).selectFrom("lines").select("id").where("name", "=", name).executeTakeFirstOrThrow()).id;
}
async function partId(number: string) {
  return (await (await getDb()).selectFrom("parts").select("id").where("number", "=", number).executeTakeFirstOrThrow()).id;
}
async function coatingId(code: string) {
  return (await (await getDb()).selectFrom("coatings").select("id").where("code", "=", code).executeTakeFirstOrThrow()).id;
}
async function planRow(id: number) {
  return (await getDb()).selectFrom("rack_plans").selectAll().where("id", "=", id).executeTakeFirst();
}
async function userId(role: Role) {
  return (await (await getDb()).selectFrom("users").select("id").where("role", "=", role).executeTakeFirstOrThrow()).id;
}

const list = (role: Role | null, query = "") => listGet(request(`/api/rack/plans${query}`, { cookie: role ? cookies[role] : null }));
const post = (role: Role | null, body: unknown) => listPost(request("/api/rack/plans", { method: "POST", body, cookie: role ? cookies[role] : null }));
const getOne = (role: Role, id: number | string) => oneGet(request(`/api/rack/plans/${id}`, { cookie: cookies[role] }), params({ id: String(id) }));
const put = (role: Role, id: number | string, body: unknown) =>
  onePut(request(`/api/rack/plans/${id}`, { method: "PUT", body, cookie: cookies[role] }), params({ id: String(id) }));
const del = (role: Role, id: number | string) => oneDelete(request(`/api/rack/plans/${id}`, { method: "DELETE", cookie: cookies[role] }), params({ id: String(id) }));

/*
 * The trailer fender BC-2210 (box 760 long × 320 wide × 340 high mm, 5.53 kg) on Line 2's carrier
 * window (800 along travel × 1800 high × 700 across, 80 kg), 50 mm clearance. Hand-worked, common
 * practice, no source: n parts with gap c fit in W when n = floor((W + c)/(s + c)); the window
 * plus clearance is 850 × 1850 × 750.
 *   upright, length along travel (760, 340, 320): pitches 810, 390, 370 → 1 × 4 × 2 = 8 (44.2 kg).
 *     No upright layout does better: every tier is at most floor(1850/390) = 4 high, and a tier's
 *     850 × 750 footprint takes the 810 × 370 pitch twice, the 370 × 810 one not at all (810 > 750).
 *   by hand "length-width-height" (760, 320, 340): pitches 810, 370, 390 → 1 × 5 × 1 = 5.
 */
async function fenderPlan(over: Record<string, unknown> = {}) {
  return {
    partId: await partId("BC-2210"),
    lineId: await lineId(LINE2),
    clearanceMm: 50,
    orientations: "any",
    orientationOverride: "length-width-height",
    note: "Flat on the bars, flange down.",
    ...over,
  };
}

async function created(role: Role, body: unknown): Promise<SavedRackPlan> {
  const res = await post(role, body);
  expect(res.status).toBe(201);
  return ((await res.json()) as { plan: SavedRackPlan }).plan;
}

describe("GET /api/rack/plans", () => {
  it("answers 401 without a session", async () => {
    expect((await list(null)).status).toBe(401);
  });

  it.each(ROLES)("the %s reads the demo's two saved plans with their stored counts", async (role) => {
    const res = await list(role);
    expect(res.status).toBe(200);
    const { plans } = (await res.json()) as RackPlansList;
    // Ordered by part number: BC-2210 before BC-5020.
    expect(plans.map((p) => [p.part.number, p.line.name])).toEqual([
      ["BC-2210", OVEN],
      ["BC-5020", LINE2],
    ]);
    // BC-2210 in the batch oven's 1000 × 2000 × 2800 mm rack window, 50 mm clearance, on edge by
    // hand (320 along, 340 up, 760 across): pitches 370, 390, 810 in 1050, 2050, 2850 →
    // 2 × 5 × 3 = 30 (166 kg ≤ 250 kg). Hand-worked, common practice, no source.
    expect(plans[0]).toMatchObject({
      orientationOverride: "width-height-length",
      orientations: "upright",
      clearanceMm: 50,
      partsPerCarrier: 30,
      spaceCount: 30,
      limitedBy: "space",
      maybeStale: false,
      updatedByName: "Tobias Wrenfield",
    });
    expect(plans[1]).toMatchObject({ orientationOverride: null, clearanceMm: 60, updatedByName: "Priya Castellane" });
  });

  it("filters by part and by line", async () => {
    const fender = await partId("BC-2210");
    const byPart = (await (await list("operator", `?partId=${fender}`)).json()) as RackPlansList;
    expect(byPart.plans.map((p) => p.part.number)).toEqual(["BC-2210"]);
    const byLine = (await (await list("operator", `?lineId=${await lineId(LINE2)}`)).json()) as RackPlansList;
    expect(byLine.plans.map((p) => p.part.number)).toEqual(["BC-5020"]);
    const both = (await (await list("operator", `?partId=${fender}&lineId=${await lineId(LINE2)}`)).json()) as RackPlansList;
    expect(both.plans).toEqual([]);
  });

  it.each([
    { query: "?lineId=abc", field: "lineId" },
    { query: "?lineId=0", field: "lineId" },
    { query: "?colour=red", field: "colour" },
  ])("a bad filter $query is a 400 naming $field", async ({ query, field }) => {
    const res = await list("engineer", query);
    expect(res.status).toBe(400);
    const { error } = await res.json();
    expect(error.code).toBe("invalid_input");
    expect(Object.keys(error.fields)).toEqual([field]);
  });
});

describe("POST /api/rack/plans", () => {
  it.each(WRITERS)("the %s saves a plan: 201, planned afresh, the row read back", async (role) => {
    const body = await fenderPlan();
    const plan = await created(role, body);
    expect(plan).toMatchObject({
      partId: body.partId,
      lineId: body.lineId,
      part: { number: "BC-2210" },
      line: { name: LINE2, kind: "conveyor" },
      clearanceMm: 50,
      orientations: "any",
      orientationOverride: "length-width-height",
      orientation: { alongWidthMm: 760, alongHeightMm: 320, alongDepthMm: 340 },
      note: "Flat on the bars, flange down.",
      partsPerCarrier: 5,
      limitedBy: "space",
      window: { widthMm: 800, heightMm: 1800, depthMm: 700, maxLoadKg: 80 },
      changedSinceSave: false,
    });
    // The same shape as POST /api/rack/plan: one grid of 1 × 5 × 1, every part lying the chosen way.
    expect(plan.result).toMatchObject({ count: 5, spaceCount: 5, limitedBy: "space" });
    expect(plan.result.blocks.map((b) => b.grid)).toEqual([[1, 5, 1]]);
    expect(plan.result.placements.map((p) => p.minMm[1])).toEqual([0, 370, 740, 1110, 1480]);
    expect(plan.result.reason).toBe("Space limits the carrier to 5 parts: 1 along travel × 5 tiers × 1 across, 50 mm clearance.");
    const part = { lengthMm: 760, widthMm: 320, heightMm: 340, massKg: plan.part.massKg };
    const input = { part, carrier: plan.window, clearanceMm: 50, orientations: "any" as const, orientation: plan.orientation! };
    expect(placementProblems(input, plan.result)).toEqual([]);

    const row = await planRow(plan.id);
    expect(row).toMatchObject({
      part_id: body.partId,
      line_id: body.lineId,
      clearance_mm: 50,
      orientations: "any",
      orientation_override: "length-width-height",
      note: "Flat on the bars, flange down.",
      parts_per_carrier: 5,
      space_count: 5,
      limited_by: "space",
      created_by: await userId(role),
      updated_by: await userId(role),
    });
    expect(Math.abs(row!.created_at - nowSeconds())).toBeLessThanOrEqual(5);
    expect(row!.updated_at).toBe(row!.created_at);
  });

  it("without an orientation by hand the planner's best is saved: 8 upright", async () => {
    const plan = await created("engineer", await fenderPlan({ orientations: "upright", orientationOverride: null, note: undefined }));
    expect(plan).toMatchObject({ orientationOverride: null, orientation: null, partsPerCarrier: 8, note: "" });
    expect(plan.result.blocks.map((b) => [b.grid, b.orientation])).toEqual([[[1, 4, 2], { alongWidthMm: 760, alongHeightMm: 340, alongDepthMm: 320 }]]);
  });

  it.each(READERS_ONLY)("the %s may not save a plan (403), and nothing is written", async (role) => {
    const res = await post(role, await fenderPlan());
    expect(res.status).toBe(403);
    expect((await res.json()).error.code).toBe("forbidden");
    expect(await (await getDb()).selectFrom("rack_plans").select("id").execute()).toHaveLength(2);
  });

  it("answers 401 without a session", async () => {
    expect((await post(null, await fenderPlan())).status).toBe(401);
  });

  it("a second plan for the same part × line is a 409 naming lineId", async () => {
    const first = await created("engineer", await fenderPlan());
    const res = await post("supervisor", await fenderPlan({ clearanceMm: 20 }));
    expect(res.status).toBe(409);
    const { error } = await res.json();
    expect(error.code).toBe("conflict");
    expect(error.fields.lineId).toBe(`Part BC-2210 already has a saved racking plan on ${LINE2} (plan ${first.id}); update that one instead.`);
    expect((await planRow(first.id))!.clearance_mm).toBe(50);
  });

  it.each([
    { name: "no part", over: { partId: undefined }, field: "partId" },
    { name: "an unknown part", over: { partId: "no-such-part" }, field: "partId" },
    { name: "an unknown line", over: { lineId: 999 }, field: "lineId" },
    { name: "a line id that is not a number", over: { lineId: "2" }, field: "lineId" },
    { name: "a negative clearance", over: { clearanceMm: -1 }, field: "clearanceMm" },
    // larger than 800, 1800 and 700 alike (the planner's rule)
    { name: "a clearance wider than the window", over: { clearanceMm: 1900 }, field: "clearanceMm" },
    { name: "an unknown orientation", over: { orientationOverride: "sideways" }, field: "orientationOverride" },
    { name: "a lying orientation with upright racking", over: { orientations: "upright" }, field: "orientationOverride" },
    { name: "an unknown field", over: { colour: "red" }, field: "colour" },
    // hand-worked: "height-width-length" is 340 along, 320 up, 760 across — 760 > 700: none fit
    { name: "an orientation that hangs nothing", over: { orientationOverride: "height-width-length" }, field: "orientationOverride" },
  ])("$name is a 400 naming $field", async ({ over, field }) => {
    const res = await post("engineer", await fenderPlan(over));
    expect(res.status).toBe(400);
    const { error } = await res.json();
    expect(error.code).toBe("invalid_input");
    expect(Object.keys(error.fields)).toContain(field);
    expect(await (await getDb()).selectFrom("rack_plans").select("id").execute()).toHaveLength(2);
  });

  it("a part that fits nowhere on the line is refused on lineId with the reason", async () => {
    // The hoop BC-5020 is 974 mm high at least one way and 648 mm long: no turn of it fits Line 1's
    // 500 × 1500 × 600 window (PRODUCT.md example; see tests/api/runs.test.ts).
    const res = await post("engineer", { partId: await partId("BC-5020"), lineId: await lineId(LINE1), clearanceMm: 0, orientations: "any" });
    expect(res.status).toBe(400);
    const { error } = await res.json();
    expect(error.fields.lineId).toMatch(/^Nothing can be hung this way: The part .* is larger than the 500 × 1500 × 600 mm window in every orientation\.$/);
  });
});

describe("GET, PUT and DELETE /api/rack/plans/[id]", () => {
  it.each(ROLES)("the %s reads one plan, planned afresh", async (role) => {
    const id = (await created("supervisor", await fenderPlan())).id;
    const res = await getOne(role, id);
    expect(res.status).toBe(200);
    const { plan } = (await res.json()) as { plan: SavedRackPlan };
    expect(plan).toMatchObject({ id, partsPerCarrier: 5, result: { count: 5 }, updatedByName: "Tobias Wrenfield" });
    expect(plan.result.placements).toHaveLength(5);
  });

  it.each(["999", "abc", "0"])("an unknown id %s is a 404", async (id) => {
    for (const res of [await getOne("engineer", id), await put("engineer", id, await fenderPlan()), await del("engineer", id)]) {
      expect(res.status).toBe(404);
      expect((await res.json()).error.code).toBe("not_found");
    }
  });

  it("PUT changes the choices, plans again and records who", async () => {
    const id = (await created("engineer", await fenderPlan())).id;
    const res = await put("supervisor", id, await fenderPlan({ orientations: "upright", orientationOverride: null, note: "Back to hooks." }));
    expect(res.status).toBe(200);
    const { plan } = (await res.json()) as { plan: SavedRackPlan };
    expect(plan).toMatchObject({ id, orientationOverride: null, partsPerCarrier: 8, result: { count: 8 }, note: "Back to hooks.", createdByName: "Priya Castellane", updatedByName: "Tobias Wrenfield" });
    expect(await planRow(id)).toMatchObject({
      orientation_override: null,
      orientations: "upright",
      parts_per_carrier: 8,
      note: "Back to hooks.",
      created_by: await userId("engineer"),
      updated_by: await userId("supervisor"),
    });
  });

  it("PUT onto a part × line that has its own plan is a 409; a bad body a 400 naming the field", async () => {
    const id = (await created("engineer", await fenderPlan())).id;
    const res = await put("engineer", id, await fenderPlan({ lineId: await lineId(OVEN), orientations: "upright", orientationOverride: null }));
    expect(res.status).toBe(409);
    expect((await res.json()).error.fields.lineId).toMatch(/already has a saved racking plan on Batch oven B/);
    const bad = await put("engineer", id, await fenderPlan({ clearanceMm: "50" }));
    expect(bad.status).toBe(400);
    expect(Object.keys((await bad.json()).error.fields)).toEqual(["clearanceMm"]);
    expect((await planRow(id))!.line_id).toBe(await lineId(LINE2));
  });

  it.each(READERS_ONLY)("the %s may not change or delete a plan", async (role) => {
    const id = (await created("engineer", await fenderPlan())).id;
    expect((await put(role, id, await fenderPlan({ note: "x" }))).status).toBe(403);
    expect((await del(role, id)).status).toBe(403);
    expect((await planRow(id))!.note).toBe("Flat on the bars, flange down.");
  });

  it("DELETE removes the row; a second DELETE is a 404", async () => {
    const id = (await created("engineer", await fenderPlan())).id;
    const res = await del("supervisor", id);
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ deleted: { id } });
    expect(await planRow(id)).toBeUndefined();
    expect((await del("supervisor", id)).status).toBe(404);
  });

  it("a part changed after the save: the list flags it, the plan shows the new count", async () => {
    const id = (await created("engineer", await fenderPlan())).id;
    const db = await getDb();
    // 900 mm long no longer fits along Line 2's 800 mm window in the chosen orientation.
    await db.updateTable("parts").set({ length_mm: 900, updated_at: nowSeconds() + 10 }).where("number", "=", "BC-2210").execute();
    const { plans } = (await (await list("operator", `?lineId=${await lineId(LINE2)}&partId=${await partId("BC-2210")}`)).json()) as RackPlansList;
    expect(plans[0]).toMatchObject({ id, partsPerCarrier: 5, maybeStale: true });
    const { plan } = (await (await getOne("operator", id)).json()) as { plan: SavedRackPlan };
    expect(plan).toMatchObject({ partsPerCarrier: 5, changedSinceSave: true, result: { count: 0 } });
    expect(plan.result.reason).toMatch(/larger than the 800 × 1800 × 700 mm window in the chosen orientation/);
  });
});

describe("runs use the saved plan of their part × line", () => {
  const DAY = 86_400;
  async function run(over: Record<string, unknown> = {}) {
    return {
      partId: await partId("BC-2210"),
      quantity: 120,
      lineId: await lineId(LINE2),
      date: epochToDate(nowSeconds() + 10 * DAY),
      shift: 1,
      clearanceMm: 50,
      orientations: "upright",
      coats: [{ coatingId: await coatingId("PP-410"), filmUm: 80, firstPassEfficiency: 0.5, reclaimEfficiency: 0.8 }],
      masking: "",
      notes: "",
      ...over,
    };
  }
  const planRun = async (body: unknown) => {
    const res = await runPost(request("/api/runs", { method: "POST", body, cookie: cookies.supervisor }));
    expect(res.status).toBe(201);
    return ((await res.json()) as { run: RunDetail }).run;
  };
  const readRun = async (id: number) =>
    ((await (await runGet(request(`/api/runs/${id}`, { cookie: cookies.operator }), params({ id: String(id) }))).json()) as { run: RunDetail }).run;

  it("the saved plan's count replaces the live best; a hand count still wins; deleting the plan restores the best", async () => {
    // Live, upright with 50 mm clearance: 8 per carrier (hand-worked above) → ceil(120/8) = 15 carriers.
    const before = await planRun(await run());
    expect(before.plan!.racking).toMatchObject({ partsPerCarrier: 8, savedPlanId: null, overridden: false });
    expect(before.plan!.carriers).toBe(15);

    // A saved plan lying the fender flat: 5 per carrier → ceil(120/5) = 24 carriers.
    const saved = await created("supervisor", await fenderPlan());
    const after = await planRun(await run());
    expect(after.plan!.racking).toMatchObject({ partsPerCarrier: 5, savedPlanId: saved.id, clearanceMm: 50, orientations: "any" });
    expect(after.plan!.racking.reason).toBe(`From saved racking plan ${saved.id}. Space limits the carrier to 5 parts: 1 along travel × 5 tiers × 1 across, 50 mm clearance.`);
    expect(after.plan!.carriers).toBe(24);
    // Runs are planned when read: the run saved before the plan now uses it too.
    expect((await readRun(before.id)).plan!.racking).toMatchObject({ partsPerCarrier: 5, savedPlanId: saved.id });

    // A count set by hand on the run wins over the saved plan: 3 per carrier → 40 carriers.
    const byHand = await planRun(await run({ partsPerCarrierOverride: 3 }));
    expect(byHand.plan!.racking).toMatchObject({ partsPerCarrier: 3, overridden: true, savedPlanId: null });
    expect(byHand.plan!.carriers).toBe(40);

    expect((await del("supervisor", saved.id)).status).toBe(200);
    expect((await readRun(after.id)).plan!.racking).toMatchObject({ partsPerCarrier: 8, savedPlanId: null });
  });

  it("a run that has started keeps the plan it was started with when the saved plan changes or goes", async () => {
    // hand-worked above: the saved flat plan gives 5 per carrier, the live upright best 8
    const saved = await created("supervisor", await fenderPlan());
    const r = await planRun(await run());
    const move = async (status: string) =>
      (await statusPost(request(`/api/runs/${r.id}/status`, { method: "POST", body: { status }, cookie: cookies.supervisor }), params({ id: String(r.id) }))).status;
    expect(await move("planned")).toBe(200);
    expect((await readRun(r.id)).plan!.racking).toMatchObject({ partsPerCarrier: 5, savedPlanId: saved.id });
    expect(await move("in-progress")).toBe(200);
    // the plan's racking was copied into the run as it started
    const started = await readRun(r.id);
    expect(started).toMatchObject({ clearanceMm: 50, orientations: "any" });
    expect(started.plan!.racking.partsPerCarrier).toBe(5);
    expect((await del("supervisor", saved.id)).status).toBe(200);
    const after = await readRun(r.id);
    // the run keeps the plan it started with, including where its racking came from
    expect(after.plan!.racking).toMatchObject({ partsPerCarrier: 5, savedPlanId: saved.id });
    expect(after.planFrozenAt).not.toBeNull();
    expect(after.plan!.carriers).toBe(24);
  });

  it("today's hoop run on Line 2 reads its count from the demo's saved plan, unchanged", async () => {
    const { plans } = (await (await list("operator", `?partId=${await partId("BC-5020")}`)).json()) as RackPlansList;
    const db = await getDb();
    const row = await db.selectFrom("runs").select("id").where("part_id", "=", await partId("BC-5020")).where("line_id", "=", await lineId(LINE2)).executeTakeFirstOrThrow();
    const r = await readRun(row.id);
    expect(r.plan!.racking).toMatchObject({ savedPlanId: plans[0].id, partsPerCarrier: plans[0].partsPerCarrier });
    expect(r.plan!.racking.reason).toMatch(new RegExp(`^From saved racking plan ${plans[0].id}\\. `));
  });
});
