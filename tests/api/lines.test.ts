import { afterEach, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { ROLES } from "@/lib/server/access";
import { lineUsageChecks, type ConveyorLineView, type LineView } from "@/lib/server/lines";
import { params, request, useSignedInDemo } from "./helpers";
import { GET as listGet, POST as listPost } from "@/app/api/lines/route";
import { DELETE as oneDelete, GET as oneGet, PUT as onePut } from "@/app/api/lines/[id]/route";
import { GET as timelineGet } from "@/app/api/lines/[id]/timeline/route";
import { POST as cureCheckPost } from "@/app/api/lines/[id]/cure-check/route";
import { POST as coatingPost } from "@/app/api/coatings/route";
import type { Role } from "@/db/schema";

const cookies = useSignedInDemo();
afterEach(() => {
  lineUsageChecks.length = 0;
});

const editors: Role[] = ["admin", "manager"];
const readers: Role[] = ["supervisor", "engineer", "purchaser", "operator"];

const conveyor = {
  kind: "conveyor",
  name: "Line 3 — Test",
  hourlyCost: 300,
  windowMm: { widthMm: 600, heightMm: 1200, depthMm: 500 },
  maxLoadKg: 40,
  lineSpeedMinMPerMin: 1,
  lineSpeedMaxMPerMin: 5,
  lineSpeedNominalMPerMin: 3,
  carrierPitchM: 0.75,
  stages: [
    { name: "Wash", kind: "conversion", lengthM: 8, tempC: 50 },
    { name: "Rinse", kind: "rinse", lengthM: 3 },
    { name: "Dry-off", kind: "dry-off", lengthM: 12, tempC: 150, heatTransferCoefficientWPerM2K: 25 },
    { name: "Booth", kind: "powder-booth", lengthM: 6, colourChangeMin: 12 },
    { name: "Cure", kind: "cure-oven", lengthM: 60, tempC: 210, heatTransferCoefficientWPerM2K: 30 },
    { name: "Cool", kind: "cool", lengthM: 10 },
  ],
};

const batch = {
  kind: "batch",
  name: "Batch oven C",
  hourlyCost: 50,
  windowMm: { widthMm: 900, heightMm: 1800, depthMm: 2000 },
  maxLoadKg: 200,
  interiorMm: { widthMm: 2000, heightMm: 2200, depthMm: 4500 },
  racksPerLoad: 2,
  airTempC: 200,
  heatTransferCoefficientWPerM2K: 22,
  loadMin: 10,
  unloadMin: 10,
};

async function lineId(name: string): Promise<number> {
  return (await (await getDb()).selectFrom("lines").select("id").where("name", "=", name).executeTakeFirstOrThrow()).id;
}
async function coatingId(code: string): Promise<number> {
  return (await (await getDb()).selectFrom("coatings").select("id").where("code", "=", code).executeTakeFirstOrThrow()).id;
}
const LINE1 = "Line 1 — E-coat and powder";
const LINE2 = "Line 2 — Powder only";
const OVEN = "Batch oven B — gas";

const post = (role: Role | null, body: unknown) => listPost(request("/api/lines", { method: "POST", body, cookie: role ? cookies[role] : null }));
const put = (role: Role, id: number | string, body: unknown) =>
  onePut(request(`/api/lines/${id}`, { method: "PUT", body, cookie: cookies[role] }), params({ id: String(id) }));
const del = (role: Role, id: number | string) => oneDelete(request(`/api/lines/${id}`, { method: "DELETE", cookie: cookies[role] }), params({ id: String(id) }));
const timeline = (role: Role, id: number | string, query = "") =>
  timelineGet(request(`/api/lines/${id}/timeline${query}`, { cookie: cookies[role] }), params({ id: String(id) }));
const check = (role: Role | null, id: number | string, body: unknown) =>
  cureCheckPost(request(`/api/lines/${id}/cure-check`, { method: "POST", body, cookie: role ? cookies[role] : null }), params({ id: String(id) }));

describe("GET /api/lines and /api/lines/[id]", () => {
  it("answers 401 without a session", async () => {
    expect((await listGet(request("/api/lines"))).status).toBe(401);
  });

  it.each(ROLES)("the %s sees Bramblecote's three lines with their stages in order", async (role) => {
    const res = await listGet(request("/api/lines", { cookie: cookies[role] }));
    expect(res.status).toBe(200);
    const lines: LineView[] = (await res.json()).lines;
    expect(lines.map((l) => [l.name, l.kind])).toEqual([
      [OVEN, "batch"],
      [LINE1, "conveyor"],
      [LINE2, "conveyor"],
    ]);
    const l1 = lines[1] as ConveyorLineView;
    expect(l1.stages.map((s) => s.kind)).toEqual([
      "clean", "rinse", "rinse", "rinse", "conversion", "rinse", "rinse", "e-coat", "rinse", "rinse", "cure-oven", "cool", "powder-booth", "cure-oven", "cool",
    ]);
    expect(l1.stages.map((s) => s.position)).toEqual([...Array(15).keys()]);
    // the e-coat bake and the powder cure are separate ovens with their own coefficients
    expect(l1.stages.filter((s) => s.kind === "cure-oven").map((s) => [s.name, s.tempC, s.heatTransferCoefficientWPerM2K])).toEqual([
      ["E-coat bake oven", 215, 35],
      ["Powder cure oven", 210, 30],
    ]);
    expect(lines[0]).toMatchObject({ interiorMm: { widthMm: 2400, heightMm: 2400, depthMm: 6000 }, racksPerLoad: 4, airTempC: 200, loadMin: 12, unloadMin: 10 });
    expect(lines[0]).not.toHaveProperty("stages");
  });

  it("reads one line; unknown ids are 404", async () => {
    const id = await lineId(LINE2);
    const res = await oneGet(request(`/api/lines/${id}`, { cookie: cookies.operator }), params({ id: String(id) }));
    expect(res.status).toBe(200);
    expect((await res.json()).line).toMatchObject({ name: LINE2, carrierPitchM: 0.9, lineSpeedNominalMPerMin: 2.4, windowMm: { widthMm: 800, heightMm: 1800, depthMm: 700 } });
    for (const bad of ["99999", "x"]) expect((await oneGet(request(`/api/lines/${bad}`, { cookie: cookies.operator }), params({ id: bad }))).status).toBe(404);
  });
});

describe("POST /api/lines", () => {
  it.each(editors)("the %s creates a conveyor line; line and stage rows read back", async (role) => {
    const res = await post(role, conveyor);
    expect(res.status).toBe(201);
    const { line } = await res.json();
    expect(line).toMatchObject({ name: "Line 3 — Test", kind: "conveyor", lineSpeedMaxMPerMin: 5, carrierPitchM: 0.75, archived: false });
    const db = await getDb();
    const row = await db.selectFrom("lines").selectAll().where("id", "=", line.id).executeTakeFirstOrThrow();
    expect(row).toMatchObject({ kind: "conveyor", window_width_mm: 600, max_load_kg: 40, line_speed_nominal_m_per_min: 3, racks_per_load: null });
    const stages = await db.selectFrom("line_stages").select(["position", "name", "kind", "length_m", "temp_c", "heat_transfer_coefficient_w_per_m2k", "colour_change_min"]).where("line_id", "=", line.id).orderBy("position").execute();
    expect(stages.map((s) => [s.position, s.name, s.length_m])).toEqual([[0, "Wash", 8], [1, "Rinse", 3], [2, "Dry-off", 12], [3, "Booth", 6], [4, "Cure", 60], [5, "Cool", 10]]);
    expect(stages[4]).toMatchObject({ temp_c: 210, heat_transfer_coefficient_w_per_m2k: 30, colour_change_min: null });
    expect(stages[3]).toMatchObject({ colour_change_min: 12, temp_c: null });
  });

  it("creates a batch oven with its rack window and cycle times", async () => {
    const res = await post("manager", batch);
    expect(res.status).toBe(201);
    const row = await (await getDb()).selectFrom("lines").selectAll().where("name", "=", "Batch oven C").executeTakeFirstOrThrow();
    expect(row).toMatchObject({ kind: "batch", interior_depth_mm: 4500, racks_per_load: 2, air_temp_c: 200, heat_transfer_coefficient_w_per_m2k: 22, load_min: 10, line_speed_max_m_per_min: null });
  });

  it.each(readers)("refuses the %s role with 403", async (role) => {
    expect((await post(role, conveyor)).status).toBe(403);
  });

  it("answers 401 without a session", async () => {
    expect((await post(null, conveyor)).status).toBe(401);
  });

  const stagesWith = (i: number, patch: object) => conveyor.stages.map((s, j) => (j === i ? { ...s, ...patch } : s));
  it.each([
    ["an empty stage list", { stages: [] }, "stages"],
    ["a stage of zero length", { stages: stagesWith(1, { lengthM: 0 }) }, "stages.1.lengthM"],
    ["a stage of negative length", { stages: stagesWith(2, { lengthM: -3 }) }, "stages.2.lengthM"],
    ["a cure oven without air temperature", { stages: stagesWith(4, { tempC: null }) }, "stages.4.tempC"],
    ["a cure oven without heat-transfer coefficient", { stages: stagesWith(4, { heatTransferCoefficientWPerM2K: undefined }) }, "stages.4.heatTransferCoefficientWPerM2K"],
    ["a coefficient on a rinse", { stages: stagesWith(1, { heatTransferCoefficientWPerM2K: 20 }) }, "stages.1.heatTransferCoefficientWPerM2K"],
    ["a colour change on an oven", { stages: stagesWith(4, { colourChangeMin: 5 }) }, "stages.4.colourChangeMin"],
    ["an unknown stage kind", { stages: stagesWith(0, { kind: "pickle" }) }, "stages.0.kind"],
    ["a minimum speed above the maximum", { lineSpeedMinMPerMin: 6 }, "lineSpeedMinMPerMin"],
    ["a nominal speed outside the range", { lineSpeedNominalMPerMin: 7 }, "lineSpeedNominalMPerMin"],
    ["a zero carrier pitch", { carrierPitchM: 0 }, "carrierPitchM"],
    ["a window without depth", { windowMm: { widthMm: 600, heightMm: 1200 } }, "windowMm.depthMm"],
    ["an unknown line kind", { kind: "monorail" }, "kind"],
    ["batch fields on a conveyor", { racksPerLoad: 2 }, "racksPerLoad"],
  ])("refuses %s with 400 naming the field and stores nothing", async (_n, patch, field) => {
    const res = await post("manager", { ...conveyor, ...patch });
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(body.error.code).toBe("invalid_input");
    expect(Object.keys(body.error.fields)).toContain(field);
    expect(await (await getDb()).selectFrom("lines").select("id").where("name", "=", "Line 3 — Test").executeTakeFirst()).toBeUndefined();
  });

  it.each([
    ["a rack window larger than the interior", { windowMm: { widthMm: 900, heightMm: 2500, depthMm: 2000 } }, "windowMm.heightMm"],
    ["no racks", { racksPerLoad: 0 }, "racksPerLoad"],
    ["a negative load time", { loadMin: -1 }, "loadMin"],
    ["stages on a batch oven", { stages: conveyor.stages }, "stages"],
  ])("refuses a batch oven with %s", async (_n, patch, field) => {
    const res = await post("manager", { ...batch, ...patch });
    expect(res.status).toBe(400);
    expect(Object.keys((await res.json()).error.fields)).toContain(field);
  });

  it("answers 409 for a name already in use", async () => {
    const res = await post("manager", { ...conveyor, name: LINE2 });
    expect(res.status).toBe(409);
    expect((await res.json()).error.fields).toHaveProperty("name");
  });
});

describe("PUT and DELETE /api/lines/[id]", () => {
  it("the manager replaces the stage list; the new rows read back", async () => {
    const id = await lineId(LINE2);
    const res = await put("manager", id, { ...conveyor, name: LINE2, stages: conveyor.stages.slice(3) });
    expect(res.status).toBe(200);
    expect((await res.json()).line.stages.map((s: { name: string }) => s.name)).toEqual(["Booth", "Cure", "Cool"]);
    const rows = await (await getDb()).selectFrom("line_stages").select(["position", "name"]).where("line_id", "=", id).orderBy("position").execute();
    expect(rows).toEqual([{ position: 0, name: "Booth" }, { position: 1, name: "Cure" }, { position: 2, name: "Cool" }]);
  });

  it("turning a conveyor into a batch oven clears its stages and conveyor columns", async () => {
    const id = await lineId(LINE2);
    const res = await put("admin", id, { ...batch, name: LINE2 });
    expect(res.status).toBe(200);
    const db = await getDb();
    expect(await db.selectFrom("line_stages").select("id").where("line_id", "=", id).execute()).toEqual([]);
    expect(await db.selectFrom("lines").select(["kind", "carrier_pitch_m", "racks_per_load"]).where("id", "=", id).executeTakeFirstOrThrow()).toEqual({ kind: "batch", carrier_pitch_m: null, racks_per_load: 2 });
  });

  it("PUT refuses an empty stage list and keeps the old stages", async () => {
    const id = await lineId(LINE2);
    const res = await put("manager", id, { ...conveyor, name: LINE2, stages: [] });
    expect(res.status).toBe(400);
    expect((await res.json()).error.fields).toHaveProperty("stages");
    expect(await (await getDb()).selectFrom("line_stages").select("id").where("line_id", "=", id).execute()).toHaveLength(8);
  });

  it.each(readers)("refuses PUT and DELETE for the %s role", async (role) => {
    const id = await lineId(LINE2);
    expect((await put(role, id, { ...conveyor, name: LINE2 })).status).toBe(403);
    expect((await del(role, id)).status).toBe(403);
  });

  it("DELETE archives an unused line; ?archived=1 still lists it", async () => {
    const id = await lineId(OVEN);
    const res = await del("manager", id);
    expect(res.status).toBe(200);
    expect((await res.json()).line.archived).toBe(true);
    expect((await (await getDb()).selectFrom("lines").select("archived_at").where("id", "=", id).executeTakeFirstOrThrow()).archived_at).toBeGreaterThan(0);
    const names = async (q: string) => ((await (await listGet(request(`/api/lines${q}`, { cookie: cookies.operator }))).json()).lines as LineView[]).map((l) => l.name);
    expect(await names("")).not.toContain(OVEN);
    expect(await names("?archived=1")).toContain(OVEN);
  });

  it("DELETE is refused with the list of what uses the line", async () => {
    const id = await lineId(LINE1);
    lineUsageChecks.push(async (_db, lid) => (lid === id ? [{ kind: "run", id: 7, label: "Run 7, trailer fenders" }] : []));
    const res = await del("manager", id);
    expect(res.status).toBe(409);
    const body = await res.json();
    expect(body.error.usedBy).toEqual([{ kind: "run", id: 7, label: "Run 7, trailer fenders" }]);
    expect((await (await getDb()).selectFrom("lines").select("archived_at").where("id", "=", id).executeTakeFirstOrThrow()).archived_at).toBeNull();
  });

  it("unknown ids are 404", async () => {
    expect((await put("manager", 99999, conveyor)).status).toBe(404);
    expect((await del("manager", 99999)).status).toBe(404);
  });
});

describe("GET /api/lines/[id]/timeline", () => {
  it.each(ROLES)("the %s gets each stage's dwell at the nominal speed", async (role) => {
    // hand: Line 1 at 3 m/min: 224 m of stages → 74.667 min; the 60 m powder oven → 20 min;
    // carriers/h = 3 × 60 / 0.6 = 300 (REFERENCES.md, conveyor lines)
    const res = await timeline(role, await lineId(LINE1));
    expect(res.status).toBe(200);
    const t = (await res.json()).timeline;
    expect(t.lineSpeedMPerMin).toBe(3);
    expect(t.totalLengthM).toBe(224);
    expect(t.totalMin).toBeCloseTo(224 / 3, 10);
    expect(t.carriersPerHour).toBeCloseTo(300, 10);
    const oven = t.stages.find((s: { name: string }) => s.name === "Powder cure oven");
    expect(oven.dwellMin).toBeCloseTo(20, 10);
    expect(t.stages[0]).toMatchObject({ startMin: 0, dwellMin: 3 });
  });

  it("takes a speed; a dry-off of 10 m at 2.4 m/min gives 4.17 min (inside the 3–5 min guide)", async () => {
    // source: Metal Finishing Organic Finishing Guidebook 2012: dry-off needs 3–5 min; 10 / 2.4 = 4.1667
    const res = await timeline("operator", await lineId(LINE2), "?lineSpeedMPerMin=2.4");
    const t = (await res.json()).timeline;
    expect(t.stages.find((s: { kind: string }) => s.kind === "dry-off").dwellMin).toBeCloseTo(4.1667, 4);
  });

  it.each([
    ["a speed above the range", "?lineSpeedMPerMin=9"],
    ["a speed below the range", "?lineSpeedMPerMin=0.5"],
    ["a speed that is not a number", "?lineSpeedMPerMin=fast"],
  ])("refuses %s with 400 naming lineSpeedMPerMin", async (_n, q) => {
    const res = await timeline("operator", await lineId(LINE2), q);
    expect(res.status).toBe(400);
    expect((await res.json()).error.fields).toHaveProperty("lineSpeedMPerMin");
  });

  it("refuses a batch oven (no conveyor) and answers 404 for an unknown line", async () => {
    expect((await timeline("operator", await lineId(OVEN))).status).toBe(400);
    expect((await timeline("operator", 99999)).status).toBe(404);
  });
});

describe("POST /api/lines/[id]/cure-check", () => {
  async function singlePointCoating(): Promise<number> {
    const res = await coatingPost(
      request("/api/coatings", {
        method: "POST",
        cookie: cookies.purchaser,
        body: {
          code: "PT-190", name: "One-point test powder", kind: "powder", chemistry: "polyester", colourName: "Test", swatchHex: "#777777",
          specificGravity: 1.5, filmMinUm: 60, filmMaxUm: 80, cureSchedule: [{ metalTempC: 190, holdMin: 12 }], pricePerKg: 9,
          containerKind: "box", containerKg: 25, supplierName: "Test", supplierEmail: "test@supplier.test", leadTimeDays: 7, shelfLifeMonths: 12,
        },
      }),
    );
    expect(res.status).toBe(201);
    return (await res.json()).coating.id;
  }

  it.each([
    // source: lumped heat-up (Çengel, Heat Transfer, ch. 4), worked by hand: h 30 W/m²K, air 210 °C,
    // start 20 °C, target 190 °C, hold 12 min, 60 m oven at 3 m/min (20 min), c 490 J/kgK, ρ 7850 kg/m³:
    // 1.5 mm heats up in 3.61 min and passes with +4.39 min; 6 mm needs 14.43 min and fails by 6.43 min
    [1.5, 3.61, 4.39, true],
    [6, 14.43, -6.43, false],
  ])("Line 1's powder oven: %d mm steel heats up in %d min, margin %d min", async (thicknessMm, heatUp, margin, pass) => {
    const id = await lineId(LINE1);
    const res = await check("supervisor", id, { coatingId: await singlePointCoating(), thicknessMm, lineSpeedMPerMin: 3, startTempC: 20 });
    expect(res.status).toBe(200);
    const r = (await res.json()).cureCheck;
    expect(r.ovenStage.name).toBe("Powder cure oven");
    expect(r.dwellMin).toBeCloseTo(20, 10);
    expect(r.heatUpMin).toBeCloseTo(heatUp, 2);
    expect(r.holdMin).toBe(12);
    expect(r.marginMin).toBeCloseTo(margin, 2);
    expect(r.pass).toBe(pass);
    // the fastest speed that still cures: 60 m / (heat-up + hold)
    expect(r.fastestCuringSpeedMPerMin).toBeCloseTo(60 / (heatUp + 12), 2);
  });

  it("speaks the user's units: a US-unit user reads ft/min and °F in the reason", async () => {
    const db = await getDb();
    await db.updateTable("users").set({ unit_system: "us" }).where("email", "=", "supervisor@bramblecote.test").execute();
    const coatingId = await singlePointCoating();
    const res = await check("supervisor", await lineId(LINE1), { coatingId, thicknessMm: 6, lineSpeedMPerMin: 3, startTempC: 20 });
    const r = (await res.json()).cureCheck;
    // 1 ft = 0.3048 m exactly (NIST SP 811): 3 m/min = 9.84 ft/min; the fastest curing speed
    // 60 m / 26.43 min = 2.27 m/min = 7.45 ft/min; 190 °C = 190 × 9/5 + 32 = 374 °F
    expect(r.reason).toContain("at 9.84 ft/min");
    expect(r.reason).toContain("Run at 7.45 ft/min or slower");
    expect(r.reason).not.toMatch(/m\/min|°C/);
    // the numbers themselves stay metric, as the API contract says
    expect(r.lineSpeedMPerMin).toBe(3);
    const thin = await check("supervisor", await lineId(LINE1), { coatingId, thicknessMm: 1.5, lineSpeedMPerMin: 3, startTempC: 20 });
    const t = (await thin.json()).cureCheck;
    expect(t.reason).toContain("heat-up 3.61 to 374 °F");
    expect(t.reason).not.toMatch(/m\/min|°C/);
  });

  it.each(ROLES)("any signed-in role (%s) may run it; the line's nominal speed is the default", async (role) => {
    const res = await check(role, await lineId(LINE1), { coatingId: await coatingId("PP-410"), thicknessMm: 2 });
    expect(res.status).toBe(200);
    const r = (await res.json()).cureCheck;
    expect(r).toMatchObject({ lineSpeedMPerMin: 3, startTempC: 20, lineName: LINE1, coating: { code: "PP-410" } });
  });

  it("answers 401 without a session", async () => {
    expect((await check(null, await lineId(LINE1), { coatingId: 1, thicknessMm: 2 })).status).toBe(401);
  });

  it("cures an e-coat in the e-coat bake oven, not the powder oven", async () => {
    const r = (await (await check("operator", await lineId(LINE1), { coatingId: await coatingId("EC-200"), thicknessMm: 2 })).json()).cureCheck;
    expect(r.ovenStage.name).toBe("E-coat bake oven");
    expect(r.airTempC).toBe(215);
    expect(r.dwellMin).toBeCloseTo(25, 10);
  });

  it("gives a batch oven's cycle: load + heat-up + hold + unload", async () => {
    // source: lumped model (Çengel ch. 4), hand working: air 200 °C, h 22, 3 mm steel: τ = 7850 × 490 ×
    // 0.0015 / 22 = 262.26 s = 4.371 min; PP-410's only point below 200 °C is 190 °C / 12 min:
    // 4.371 × ln(180/10) = 12.634 min; cycle 12 + 12.634 + 12 + 10 = 46.634 min
    const res = await check("engineer", await lineId(OVEN), { coatingId: await coatingId("PP-410"), thicknessMm: 3 });
    expect(res.status).toBe(200);
    const r = (await res.json()).cureCheck;
    expect(r.lineKind).toBe("batch");
    expect(r.curePoint).toEqual({ metalTempC: 190, holdMin: 12 });
    expect(r.heatUpMin).toBeCloseTo(12.634, 3);
    expect(r.cycleMin).toBeCloseTo(46.634, 3);
  });

  it.each([
    ["a speed above the line's range", LINE1, "PP-410", { lineSpeedMPerMin: 6 }, "lineSpeedMPerMin"],
    ["a speed below the line's range", LINE1, "PP-410", { lineSpeedMPerMin: 1 }, "lineSpeedMPerMin"],
    ["a speed on a batch oven", OVEN, "PP-410", { lineSpeedMPerMin: 2 }, "lineSpeedMPerMin"],
    ["an e-coat on a powder-only line", LINE2, "EC-200", {}, "coatingId"],
    ["a zero thickness", LINE1, "PP-410", { thicknessMm: 0 }, "thicknessMm"],
    ["a missing thickness", LINE1, "PP-410", { thicknessMm: undefined }, "thicknessMm"],
    ["an unknown field", LINE1, "PP-410", { airTempC: 200 }, "airTempC"],
  ])("refuses %s with 400 naming the field", async (_n, line, code, patch, field) => {
    const res = await check("operator", await lineId(line), { coatingId: await coatingId(code), thicknessMm: 2, ...patch });
    expect(res.status).toBe(400);
    expect(Object.keys((await res.json()).error.fields)).toContain(field);
  });

  it("refuses an unknown coating (400) and an unknown line (404)", async () => {
    const bad = await check("operator", await lineId(LINE1), { coatingId: 99999, thicknessMm: 2 });
    expect(bad.status).toBe(400);
    expect((await bad.json()).error.fields).toHaveProperty("coatingId");
    expect((await check("operator", 99999, { coatingId: 1, thicknessMm: 2 })).status).toBe(404);
  });
});
