import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { ROLES } from "@/lib/server/access";
import type { Role } from "@/db/schema";
import type { ThroughputComparison } from "@/lib/server/throughput";
import { request, resetDatabase, signInAll, teardown, useTempDatabase } from "./helpers";
import { POST as comparePost } from "@/app/api/throughput/compare/route";

useTempDatabase();
const cookies: Partial<Record<Role, string>> = {};
// The comparison writes nothing: one seeded database serves every read; tests that change it reset.
beforeAll(async () => {
  await resetDatabase();
  await signInAll(cookies);
}, 60_000);
afterAll(teardown);

const LINE1 = "Line 1 — E-coat and powder";
const LINE2 = "Line 2 — Powder only";
const OVEN = "Batch oven B — gas";

const id = async (table: "lines" | "scenarios", name: string) =>
  (await (await getDb()).selectFrom(table).select("id").where("name", "=", name).executeTakeFirstOrThrow()).id;
const coatingId = async (code: string) => (await (await getDb()).selectFrom("coatings").select("id").where("code", "=", code).executeTakeFirstOrThrow()).id;

/*
 * Hand working for the demo lines and the reference bench end frame (0.8 m², 6.5 kg, 2 mm steel,
 * 450 × 60 × 700 mm) in PP-410 (SG 1.55, film range 60–90 µm → 75 µm, 9.40 a kg):
 * Powder (REFERENCES.md "Powder", Products Finishing metric form): coverage 1000 / (1.55 × 75) =
 *   8.6022 m²/kg; utilisation at FPE 0.5 = 0.5; 0.8 / (8.6022 × 0.5) = 0.1860 kg a part; 1.7484 material.
 * Cure (REFERENCES.md "Cure and heat-up", lumped model, Çengel ch. 4; ρ 7850, c 490; polyester
 *   schedule 190/12, 200/10, 210/8 from Process Heating):
 *   Line 1 powder oven 60 m, 210 °C, h 30: τ = 7850 × 490 × 0.001 / 30 s = 2.13694 min;
 *     to 200 °C 2.13694 × ln(190/10) = 6.2921 + 10 = 16.2921 (to 190: 16.8109) → fastest 60 / 16.2921 = 3.68277 m/min.
 *   Line 2 oven 54 m, 205 °C, h 28: τ = 2.28958 min; to 190 °C 2.28958 × ln(185/15) = 5.7521 + 12 =
 *     17.7521 (to 200: 18.2677) → fastest 54 / 17.7521 = 3.04189 m/min.
 * Racking (hung upright, 50 mm clearance): Line 1 window 500 × 1500 × 600, 2 tiers of ≥ 5 → ≥ 10
 *   fit, 45 kg / 6.5 kg = 6 → 6 (load). Line 2 window 800 × 1800 × 700, 2 tiers of ≥ 7 → ≥ 14 fit,
 *   80 / 6.5 = 12 → 12 (load).
 * Conveyor (REFERENCES.md "Conveyor lines and ovens"): carriers/h = speed × 60 / pitch.
 *   Line 1: 3.68277 × 60 / 0.6 = 368.277/h × 6 = 2209.66 parts/h; cost 1.7484 + 410 / 2209.66 = 1.93395.
 *   Line 2: 3.04189 × 60 / 0.9 = 202.793/h × 12 = 2433.51 parts/h; cost 1.7484 + 260 / 2433.51 = 1.85524.
 */
const referencePart = { areaM2: 0.8, massKg: 6.5, thicknessMm: 2, lengthMm: 450, widthMm: 60, heightMm: 700 };
const compare = (role: Role | null, body: unknown) =>
  comparePost(request("/api/throughput/compare", { method: "POST", body, cookie: role ? cookies[role] : null }));

async function ok(role: Role, body: unknown): Promise<ThroughputComparison> {
  const res = await compare(role, body);
  expect(res.status, await res.clone().text()).toBe(200);
  return (await res.json()).comparison;
}

async function refused(body: unknown): Promise<{ code: string; message: string; fields: Record<string, string> }> {
  const res = await compare("manager", body);
  expect(res.status).toBe(400);
  return (await res.json()).error;
}

describe("POST /api/throughput/compare", () => {
  it("answers 401 without a session", async () => {
    expect((await compare(null, {})).status).toBe(401);
  });

  it("compares Line 1 and Line 2 for the reference part: figures, limits and the best column", async () => {
    const c = await ok("supervisor", { items: [{ lineId: await id("lines", LINE1) }, { lineId: await id("lines", LINE2) }], part: referencePart, coatingId: await coatingId("PP-410") });
    expect(c.coating).toMatchObject({ code: "PP-410", filmUm: 75, specificGravity: 1.55, pricePerKg: 9.4, firstPassEfficiency: 0.5, reclaimEfficiency: 0 });
    expect(c.part).toMatchObject({ partId: null, label: "Part entered by hand", insideAreaM2: 0 });
    const [l1, l2] = c.columns;
    expect([l1.label, l2.label]).toEqual([LINE1, LINE2]);
    // source: hand working above
    expect(l1.figures.lineSpeedMPerMin!).toBeCloseTo(3.68277, 4);
    expect(l1.figures.partsPerCarrier).toBe(6);
    expect(l1.figures.rackPlan.limitedBy).toBe("load");
    expect(l1.figures.carriersPerHour).toBeCloseTo(368.277, 2);
    expect(l1.figures.partsPerHour).toBeCloseTo(2209.66, 1);
    expect(l1.figures.powderKgPerPart).toBeCloseTo(0.186, 6);
    expect(l1.figures.costPerPart!).toBeCloseTo(1.93395, 4);
    // Line 1 also has an e-coat tank: e-coated area = (0.8 + 0) × 2209.66
    expect(l1.figures.eCoatAreaM2PerHour!).toBeCloseTo(1767.73, 1);
    expect(l1.figures.limit.sentence).toBe(
      "Cure dwell in Powder cure oven limits speed to 3.68 m/min (60 m of oven, 16.3 min needed: heat-up 6.29 min to 200 °C, hold 10 min).",
    );
    expect(l2.figures.partsPerCarrier).toBe(12);
    expect(l2.figures.carriersPerHour).toBeCloseTo(202.793, 2);
    expect(l2.figures.partsPerHour).toBeCloseTo(2433.51, 1);
    expect(l2.figures.costPerPart!).toBeCloseTo(1.85524, 4);
    expect(l2.figures.cureMarginMin).toBe(0);
    expect(l2.figures.limit.sentence).toBe(
      "Cure dwell in Cure oven limits speed to 3.04 m/min (54 m of oven, 17.8 min needed: heat-up 5.75 min to 190 °C, hold 12 min).",
    );
    expect(c.best.partsPerHour).toEqual([1]);
    expect(c.best.costPerPart).toEqual([1]);
    expect(c.best.powderKgPerPart).toEqual([0, 1]);
    expect(c.shiftHours).toBe(8);
    expect(c.currency).toBe("USD");
  });

  it("writes the limit in the user's units (the demo manager reads US customary)", async () => {
    const c = await ok("manager", { items: [{ lineId: await id("lines", LINE1) }], part: referencePart, coatingId: await coatingId("PP-410") });
    // source: NIST SP 811, 1 ft = 0.3048 m: 3.68277 m/min = 12.08 ft/min; 60 m = 196.9 ft; 200 °C = 392 °F
    expect(c.columns[0].figures.limit.sentence).toBe(
      "Cure dwell in Powder cure oven limits speed to 12.1 ft/min (197 ft of oven, 16.3 min needed: heat-up 6.29 min to 392 °F, hold 10 min).",
    );
  });

  it("takes saved scenarios as columns with their overrides", async () => {
    const c = await ok("operator", {
      items: [{ scenarioId: await id("scenarios", "Line 1 at 3.5 m/min") }, { scenarioId: await id("scenarios", "Line 2 with longer oven") }],
      part: referencePart,
      coatingId: await coatingId("PP-410"),
    });
    const [fast, long] = c.columns;
    expect(fast).toMatchObject({ label: "Line 1 at 3.5 m/min", source: "scenario", lineName: LINE1, overrides: { lineSpeedMPerMin: 3.5 } });
    // source: hand working: 3.5 m/min → dwell 60 / 3.5 = 17.1429, need 16.2921, margin 0.8508;
    // carriers/h 3.5 × 60 / 0.6 = 350 × 6 = 2100; cost 1.7484 + 410 / 2100 = 1.94364.
    expect(fast.figures.speedSource).toBe("scenario");
    expect(fast.figures.cures).toBe(true);
    expect(fast.figures.cureMarginMin!).toBeCloseTo(0.8508, 4);
    expect(fast.figures.partsPerHour).toBeCloseTo(2100, 6);
    expect(fast.figures.costPerPart!).toBeCloseTo(1.94364, 4);
    // 66 m: fastest curing 66 / 17.7521 = 3.7179 m/min > the 3.6 top speed → 3.6 m/min;
    // carriers/h 3.6 × 60 / 0.9 = 240 × 12 = 2880; dwell 66 / 3.6 = 18.3333, margin 0.5812.
    expect(long.figures.lineSpeedMPerMin).toBe(3.6);
    expect(long.figures.partsPerHour).toBeCloseTo(2880, 6);
    expect(long.figures.cureMarginMin!).toBeCloseTo(0.5812, 4);
    expect(long.figures.limit.kind).toBe("line-speed");
    expect(long.figures.limit.sentence).toBe("The conveyor's top speed limits speed to 3.6 m/min; Cure oven would cure at up to 3.72 m/min.");
    expect(c.best.partsPerHour).toEqual([1]);
    expect(c.best.cureMarginMin).toEqual([0]);
  });

  it("names the batch cycle for the batch oven", async () => {
    // source: hand working (lumped model; lib/rack batch cycle, common practice): h 22, air 200 °C,
    // only 190 °C is below the air: τ = 2.91383 min × ln(180/10) = 8.4226 + 12 = 20.4226;
    // cycle 12 + 20.4226 + 10 = 42.4226 min; 250 kg / 6.5 = 38 a rack; 4 × 38 × 60 / 42.4226 = 214.98 parts/h.
    const c = await ok("engineer", { items: [{ lineId: await id("lines", OVEN) }], part: referencePart, coatingId: await coatingId("PP-410") });
    const f = c.columns[0].figures;
    expect(f.batchCycleMin!).toBeCloseTo(42.4226, 3);
    expect(f.partsPerCarrier).toBe(38);
    expect(f.partsPerHour).toBeCloseTo(214.98, 2);
    expect(f.limit.kind).toBe("batch-cycle");
    expect(f.limit.sentence).toMatch(/^The batch cycle limits output: 42\.4 min a load/);
  });

  it("parts per carrier by hand: per column, then for all columns, else from the plan", async () => {
    const l1 = await id("lines", LINE1);
    const l2 = await id("lines", LINE2);
    const c = await ok("purchaser", { items: [{ lineId: l1, partsPerCarrier: 4 }, { lineId: l2 }], part: referencePart, coatingId: await coatingId("PP-410"), partsPerCarrier: 9 });
    expect(c.columns.map((x) => [x.figures.partsPerCarrier, x.figures.partsPerCarrierSource])).toEqual([[4, "hand"], [9, "hand"]]);
    // 368.277 carriers/h × 4 = 1473.1
    expect(c.columns[0].figures.partsPerHour).toBeCloseTo(1473.1, 1);
  });

  it("reads a catalogue part: coated area is the outside area less the masked area", async () => {
    const db = await getDb();
    const t = Math.floor(Date.now() / 1000);
    await db
      .insertInto("parts")
      .values({
        id: "test-frame",
        number: "TST-0001",
        name: "Test frame",
        customer: "",
        material: "steel",
        density_kg_per_m3: 7850,
        thickness_mm: 2,
        mass_kg: 6.5,
        area_m2: 1,
        inside_area_m2: 0,
        masked_area_m2: 0.2,
        area_origin: "manual",
        template_id: null,
        dimensions_json: null,
        formula: null,
        length_mm: 450,
        width_mm: 60,
        height_mm: 700,
        mesh_id: null,
        notes: "",
        archived: 0,
        created_at: t,
        updated_at: t,
      })
      .execute();
    const c = await ok("manager", { items: [{ lineId: await id("lines", LINE2) }], part: { partId: "test-frame" }, coatingId: await coatingId("PP-410") });
    // 1.0 − 0.2 = 0.8 m²: the same figures as the reference part
    expect(c.part).toMatchObject({ partId: "test-frame", label: "TST-0001 — Test frame", areaM2: 0.8 });
    expect(c.columns[0].figures.costPerPart!).toBeCloseTo(1.85524, 4);
    await db.deleteFrom("parts").where("id", "=", "test-frame").execute();
  });

  it.each(ROLES)("the %s may compare", async (role) => {
    const c = await ok(role, { items: [{ lineId: await id("lines", LINE2) }], part: referencePart, coatingId: await coatingId("PP-410") });
    expect(c.columns).toHaveLength(1);
  });
});

describe("POST /api/throughput/compare refuses bad input with 400 naming the field", () => {
  const base = async (patch: object = {}) => ({ items: [{ lineId: await id("lines", LINE1) }], part: referencePart, coatingId: await coatingId("PP-410"), ...patch });

  it.each([
    ["no items", { items: [] }, "items", /at least one/],
    ["items that are not a list", { items: "Line 1" }, "items", /list/],
    ["an unknown line", { items: [{ lineId: 99999 }] }, "items.0.lineId", /No such line/],
    ["an unknown scenario", { items: [{ scenarioId: 99999 }] }, "items.0.scenarioId", /No such scenario/],
    ["an item with both ids", { items: [{ lineId: 1, scenarioId: 1 }] }, "items.0", /either lineId or scenarioId/],
    ["an item with neither", { items: [{}] }, "items.0", /either lineId or scenarioId/],
    ["an unknown coating", { coatingId: 99999 }, "coatingId", /No such coating/],
    ["a part without mass", { part: { ...referencePart, massKg: undefined } }, "part.massKg", /required/],
    ["a negative area", { part: { ...referencePart, areaM2: -1 } }, "part.areaM2", /greater than 0/],
    ["an unknown catalogue part", { part: { partId: "nope" } }, "part.partId", /No such part/],
    ["a first-pass efficiency above 1", { firstPassEfficiency: 1.2 }, "firstPassEfficiency", /at most 1/],
    ["zero parts per carrier", { partsPerCarrier: 0 }, "partsPerCarrier", /at least 1/],
    ["an unknown field", { colour: "green" }, "colour", /Unknown field/],
  ])("%s", async (_n, patch, field, message) => {
    const err = await refused(await base(patch));
    expect(err.code).toBe("invalid_input");
    expect(Object.keys(err.fields)).toContain(field);
    expect(err.fields[field]).toMatch(message);
  });

  it("an e-coat paint", async () => {
    const err = await refused(await base({ coatingId: await coatingId("EC-200") }));
    expect(err.fields.coatingId).toMatch(/e-coat paint; choose a powder/);
  });

  it("a part larger than a carrier window by a unit mistake (inches typed as mm)", async () => {
    // MAX_PARTS_PER_CARRIER: 1 mm parts packed without clearance would put 10,000+ on a carrier
    const err = await refused(await base({ clearanceMm: 0, part: { ...referencePart, lengthMm: 1, widthMm: 1, heightMm: 1, massKg: 0.0001 } }));
    expect(err.message).toMatch(/^Line 1 — E-coat and powder: More than 10000 parts/);
    expect(Object.keys(err.fields)).toEqual(["part"]);
  });
});

describe("a saved scenario whose speed left its line's range", () => {
  beforeEach(async () => {
    await resetDatabase();
    await signInAll(cookies);
  }, 60_000);

  it("is refused with 400 naming the item's override, not compared at a speed the line cannot run", async () => {
    // Line 1's top speed lowered to 3.2 m/min after "Line 1 at 3.5 m/min" was saved
    const db = await getDb();
    await db.updateTable("lines").set({ line_speed_max_m_per_min: 3.2 }).where("name", "=", LINE1).execute();
    const err = await refused({ items: [{ lineId: await id("lines", LINE2) }, { scenarioId: await id("scenarios", "Line 1 at 3.5 m/min") }], part: referencePart, coatingId: await coatingId("PP-410") });
    expect(err.fields["items.1.overrides.lineSpeedMPerMin"]).toMatch(/within the line's speed range 1\.5–3\.2 m\/min/);
    expect(err.message).toMatch(/^Line 1 at 3\.5 m\/min: /);
  });

  it("an archived scenario is no longer a column", async () => {
    const sid = await id("scenarios", "Line 2 with longer oven");
    await (await getDb()).updateTable("scenarios").set({ archived: 1 }).where("id", "=", sid).execute();
    const err = await refused({ items: [{ scenarioId: sid }], part: referencePart, coatingId: await coatingId("PP-410") });
    expect(err.fields["items.0.scenarioId"]).toBe("No such scenario.");
  });
});
