import { afterEach, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { ROLES } from "@/lib/server/access";
import { coatingUsageChecks, type CoatingView } from "@/lib/server/coatings";
import { params, request, useSignedInDemo } from "./helpers";
import { GET as listGet, POST as listPost } from "@/app/api/coatings/route";
import { DELETE as oneDelete, GET as oneGet, PUT as onePut } from "@/app/api/coatings/[id]/route";
import { POST as lotPost } from "@/app/api/coatings/[id]/lots/route";
import type { Role } from "@/db/schema";

const cookies = useSignedInDemo();
afterEach(() => {
  coatingUsageChecks.length = 0;
});

const editors: Role[] = ["admin", "purchaser"];
const readers: Role[] = ["manager", "supervisor", "engineer", "operator"];

const newPowder = {
  code: "PP-999",
  name: "Test polyester",
  kind: "powder",
  chemistry: "polyester",
  colourName: "Lichen Grey",
  swatchHex: "#8A9284",
  specificGravity: 1.6,
  filmMinUm: 60,
  filmMaxUm: 80,
  cureSchedule: [
    { metalTempC: 200, holdMin: 10 },
    { metalTempC: 190, holdMin: 12 },
  ],
  pricePerKg: 9.9,
  containerKind: "box",
  containerKg: 25,
  supplierName: "Wendle Powders",
  supplierEmail: "Wendle.Orders@supplier.test",
  leadTimeDays: 12,
  shelfLifeMonths: 12,
  reorderPointKg: 50,
};

const newEcoat = {
  ...newPowder,
  code: "EC-999",
  kind: "e-coat",
  chemistry: "cathodic-epoxy",
  specificGravity: null,
  volumeSolidsFraction: 0.38,
  weightSolidsFraction: 0.48,
  filmDensityGPerCm3: 1.35,
  filmMinUm: 15,
  filmMaxUm: 22,
  containerKind: "drum",
  containerKg: 200,
};

async function list(role: Role, query = ""): Promise<CoatingView[]> {
  const res = await listGet(request(`/api/coatings${query}`, { cookie: cookies[role] }));
  expect(res.status).toBe(200);
  return (await res.json()).coatings;
}

async function idOf(code: string): Promise<number> {
  const row = await (await getDb()).selectFrom("coatings").select("id").where("code", "=", code).executeTakeFirstOrThrow();
  return row.id;
}

const post = (role: Role | null, body: unknown) =>
  listPost(request("/api/coatings", { method: "POST", body, cookie: role ? cookies[role] : null }));
const put = (role: Role, id: number | string, body: unknown) =>
  onePut(request(`/api/coatings/${id}`, { method: "PUT", body, cookie: cookies[role] }), params({ id: String(id) }));
const receive = (role: Role, id: number | string, body: unknown) =>
  lotPost(request(`/api/coatings/${id}/lots`, { method: "POST", body, cookie: cookies[role] }), params({ id: String(id) }));

const isoDay = (offsetDays: number) => new Date(Date.now() + offsetDays * 86_400_000).toISOString().slice(0, 10);

describe("GET /api/coatings", () => {
  it("answers 401 without a session", async () => {
    expect((await listGet(request("/api/coatings"))).status).toBe(401);
  });

  it.each(ROLES)("lists the seeded library for the %s role with stock marks", async (role) => {
    const coatings = await list(role);
    expect(coatings.map((c) => c.code)).toEqual(["EC-200", "PH-510", "PP-410", "PP-420", "PP-430", "PZ-610"]);
    const by = Object.fromEntries(coatings.map((c) => [c.code, c]));
    // Quarry Grey: 40 kg against a 120 kg reorder point
    expect(by["PP-420"]).toMatchObject({ usableStockKg: 40, lowStock: true, nearExpiry: false });
    // Rosehip Red: a lot received 330 days ago with a 12-month shelf life
    expect(by["PP-430"].nearExpiry).toBe(true);
    expect(by["PP-430"].lots.map((l) => l.status)).toEqual(["near-expiry", "ok"]);
    // zinc primer: a lot received 300 days ago with a 9-month shelf life has expired
    expect(by["PZ-610"]).toMatchObject({ hasExpiredStock: true, expiredStockKg: 15, usableStockKg: 80 });
    expect(by["PP-410"]).toMatchObject({ lowStock: false, usableStockKg: 425, specificGravity: 1.55, volumeSolidsFraction: null });
    expect(by["PP-410"].cureSchedule).toEqual([
      { metalTempC: 190, holdMin: 12 },
      { metalTempC: 200, holdMin: 10 },
      { metalTempC: 210, holdMin: 8 },
    ]);
    expect(by["EC-200"]).toMatchObject({ kind: "e-coat", specificGravity: null, volumeSolidsFraction: 0.4, weightSolidsFraction: 0.5, filmDensityGPerCm3: 1.4 });
    expect(by["EC-200"].supplierEmail).toMatch(/@supplier\.test$/);
  });

  it("filters by kind and searches code, name, colour and supplier", async () => {
    expect((await list("operator", "?kind=e-coat")).map((c) => c.code)).toEqual(["EC-200"]);
    expect((await list("operator", "?q=grey")).map((c) => c.code)).toEqual(["PP-420", "PZ-610"]);
    expect((await list("operator", "?q=ouseburn&kind=powder")).map((c) => c.code)).toEqual(["PH-510", "PZ-610"]);
    const bad = await listGet(request("/api/coatings?kind=paint", { cookie: cookies.operator }));
    expect(bad.status).toBe(400);
    expect((await bad.json()).error.fields).toHaveProperty("kind");
  });
});

describe("POST /api/coatings", () => {
  it.each(editors)("the %s creates a powder; the rows read back", async (role) => {
    const res = await post(role, newPowder);
    expect(res.status).toBe(201);
    const { coating } = await res.json();
    expect(coating).toMatchObject({ code: "PP-999", kind: "powder", swatchHex: "#8a9284", supplierEmail: "wendle.orders@supplier.test", lots: [], usableStockKg: 0, lowStock: true });
    expect(coating.cureSchedule).toEqual([{ metalTempC: 190, holdMin: 12 }, { metalTempC: 200, holdMin: 10 }]);
    const db = await getDb();
    const row = await db.selectFrom("coatings").selectAll().where("id", "=", coating.id).executeTakeFirstOrThrow();
    expect(row).toMatchObject({ code: "PP-999", specific_gravity: 1.6, volume_solids_fraction: null, price_per_kg: 9.9, container_kind: "box", reorder_point_kg: 50, archived_at: null });
    const points = await db.selectFrom("coating_cure_points").select(["metal_temp_c", "hold_min"]).where("coating_id", "=", coating.id).orderBy("metal_temp_c").execute();
    expect(points).toEqual([{ metal_temp_c: 190, hold_min: 12 }, { metal_temp_c: 200, hold_min: 10 }]);
  });

  it("creates an e-coat with volume solids, weight solids and film density", async () => {
    const res = await post("purchaser", newEcoat);
    expect(res.status).toBe(201);
    const row = await (await getDb()).selectFrom("coatings").selectAll().where("code", "=", "EC-999").executeTakeFirstOrThrow();
    expect(row).toMatchObject({ kind: "e-coat", specific_gravity: null, volume_solids_fraction: 0.38, weight_solids_fraction: 0.48, film_density_g_per_cm3: 1.35 });
  });

  it.each(readers)("refuses the %s role with 403 and stores nothing", async (role) => {
    expect((await post(role, newPowder)).status).toBe(403);
    expect(await (await getDb()).selectFrom("coatings").select("id").where("code", "=", "PP-999").executeTakeFirst()).toBeUndefined();
  });

  it("answers 401 without a session", async () => {
    expect((await post(null, newPowder)).status).toBe(401);
  });

  it.each([
    ["duplicate cure temperatures", { cureSchedule: [{ metalTempC: 190, holdMin: 12 }, { metalTempC: 190, holdMin: 10 }] }, "cureSchedule.1.metalTempC"],
    ["an empty cure schedule", { cureSchedule: [] }, "cureSchedule"],
    ["a negative hold", { cureSchedule: [{ metalTempC: 190, holdMin: -1 }] }, "cureSchedule.0.holdMin"],
    ["a powder without specific gravity", { specificGravity: null }, "specificGravity"],
    ["a powder with volume solids", { volumeSolidsFraction: 0.4 }, "volumeSolidsFraction"],
    ["an e-coat chemistry on a powder", { chemistry: "cathodic-epoxy" }, "chemistry"],
    ["film min above max", { filmMinUm: 100 }, "filmMinUm"],
    ["a bad swatch", { swatchHex: "green" }, "swatchHex"],
    ["a bad e-mail", { supplierEmail: "not-an-address" }, "supplierEmail"],
    ["a negative price", { pricePerKg: -1 }, "pricePerKg"],
    ["a fractional shelf life", { shelfLifeMonths: 1.5 }, "shelfLifeMonths"],
    ["a negative reorder point", { reorderPointKg: -5 }, "reorderPointKg"],
    ["an unknown kind", { kind: "paint" }, "kind"],
    ["an unknown field", { colour: "red" }, "colour"],
    ["a missing code", { code: undefined }, "code"],
  ])("refuses %s with 400 naming the field", async (_n, patch, field) => {
    const res = await post("purchaser", { ...newPowder, ...patch });
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(body.error.code).toBe("invalid_input");
    expect(Object.keys(body.error.fields)).toContain(field);
    expect(await (await getDb()).selectFrom("coatings").select("id").where("code", "=", "PP-999").executeTakeFirst()).toBeUndefined();
  });

  it("refuses an e-coat without its solids and density", async () => {
    const res = await post("purchaser", { ...newEcoat, volumeSolidsFraction: undefined, filmDensityGPerCm3: undefined, specificGravity: 1.5 });
    expect(res.status).toBe(400);
    expect(Object.keys((await res.json()).error.fields).sort()).toEqual(["filmDensityGPerCm3", "specificGravity", "volumeSolidsFraction"]);
  });

  it("answers 409 for a code already in the library", async () => {
    const res = await post("purchaser", { ...newPowder, code: "PP-410" });
    expect(res.status).toBe(409);
    expect((await res.json()).error.fields).toHaveProperty("code");
  });
});

describe("GET, PUT and DELETE /api/coatings/[id]", () => {
  it.each(ROLES)("the %s reads one coating; an unknown id is 404", async (role) => {
    const id = await idOf("PP-420");
    const res = await oneGet(request(`/api/coatings/${id}`, { cookie: cookies[role] }), params({ id: String(id) }));
    expect(res.status).toBe(200);
    expect((await res.json()).coating).toMatchObject({ code: "PP-420", colourName: "Quarry Grey", lowStock: true });
    for (const bad of ["99999", "abc", "0", "-1"]) {
      const r = await oneGet(request(`/api/coatings/${bad}`, { cookie: cookies[role] }), params({ id: bad }));
      expect(r.status).toBe(404);
    }
  });

  it("the purchaser replaces a coating and its schedule; the rows read back", async () => {
    const id = await idOf("PP-420");
    const res = await put("purchaser", id, { ...newPowder, code: "PP-420", name: "Satin polyester", cureSchedule: [{ metalTempC: 180, holdMin: 20 }] });
    expect(res.status).toBe(200);
    expect((await res.json()).coating).toMatchObject({ name: "Satin polyester", cureSchedule: [{ metalTempC: 180, holdMin: 20 }], usableStockKg: 40 });
    const db = await getDb();
    expect((await db.selectFrom("coatings").select("name").where("id", "=", id).executeTakeFirstOrThrow()).name).toBe("Satin polyester");
    expect(await db.selectFrom("coating_cure_points").select(["metal_temp_c", "hold_min"]).where("coating_id", "=", id).execute()).toEqual([{ metal_temp_c: 180, hold_min: 20 }]);
    // the lots are untouched by an edit
    expect(await db.selectFrom("coating_lots").select("lot_number").where("coating_id", "=", id).execute()).toEqual([{ lot_number: "FPW-7655" }]);
  });

  it.each(readers)("refuses PUT and DELETE for the %s role", async (role) => {
    const id = await idOf("PP-420");
    expect((await put(role, id, { ...newPowder, code: "PP-420" })).status).toBe(403);
    expect((await oneDelete(request(`/api/coatings/${id}`, { method: "DELETE", cookie: cookies[role] }), params({ id: String(id) }))).status).toBe(403);
  });

  it("PUT refuses duplicate cure temperatures and another coating's code", async () => {
    const id = await idOf("PP-420");
    const dup = await put("purchaser", id, { ...newPowder, code: "PP-420", cureSchedule: [{ metalTempC: 200, holdMin: 10 }, { metalTempC: 200, holdMin: 9 }] });
    expect(dup.status).toBe(400);
    expect((await dup.json()).error.fields).toHaveProperty(["cureSchedule.1.metalTempC"]);
    expect((await put("purchaser", id, { ...newPowder, code: "PP-410" })).status).toBe(409);
    expect((await put("purchaser", 99999, newPowder)).status).toBe(404);
  });

  it("DELETE archives an unused coating: gone from the list, kept with ?archived=1", async () => {
    const id = await idOf("PH-510");
    const res = await oneDelete(request(`/api/coatings/${id}`, { method: "DELETE", cookie: cookies.purchaser }), params({ id: String(id) }));
    expect(res.status).toBe(200);
    expect((await res.json()).coating.archived).toBe(true);
    const row = await (await getDb()).selectFrom("coatings").select("archived_at").where("id", "=", id).executeTakeFirstOrThrow();
    expect(row.archived_at).toBeGreaterThan(0);
    expect((await list("operator")).map((c) => c.code)).not.toContain("PH-510");
    expect((await list("operator", "?archived=1")).map((c) => c.code)).toContain("PH-510");
    // PUT with archived: false restores it
    const restored = await put("admin", id, { ...newPowder, code: "PH-510", chemistry: "hybrid", archived: false });
    expect((await restored.json()).coating.archived).toBe(false);
  });

  it("DELETE is refused with the list of what uses the coating, and nothing changes", async () => {
    const id = await idOf("PP-410");
    coatingUsageChecks.push(async (_db, coatingId) => (coatingId === id ? [{ kind: "run", id: "R-104", label: "Run R-104, park bench frames" }] : []));
    const res = await oneDelete(request(`/api/coatings/${id}`, { method: "DELETE", cookie: cookies.purchaser }), params({ id: String(id) }));
    expect(res.status).toBe(409);
    const body = await res.json();
    expect(body.error.code).toBe("conflict");
    expect(body.error.message).toMatch(/archive it instead/);
    expect(body.error.usedBy).toEqual([{ kind: "run", id: "R-104", label: "Run R-104, park bench frames" }]);
    const row = await (await getDb()).selectFrom("coatings").select("archived_at").where("id", "=", id).executeTakeFirstOrThrow();
    expect(row.archived_at).toBeNull();
  });

  it("DELETE of an unknown coating is 404", async () => {
    expect((await oneDelete(request("/api/coatings/424242", { method: "DELETE", cookie: cookies.admin }), params({ id: "424242" }))).status).toBe(404);
  });
});

describe("POST /api/coatings/[id]/lots", () => {
  it.each(editors)("the %s receives a lot; stock rises and the row reads back", async (role) => {
    const id = await idOf("PP-420");
    const res = await receive(role, id, { lotNumber: "FPW-8001", receivedDate: isoDay(-1), kgOnHand: 100 });
    expect(res.status).toBe(201);
    const { coating } = await res.json();
    expect(coating.usableStockKg).toBe(140);
    expect(coating.lowStock).toBe(false);
    const lot = await (await getDb()).selectFrom("coating_lots").selectAll().where("lot_number", "=", "FPW-8001").executeTakeFirstOrThrow();
    expect(lot).toMatchObject({ coating_id: id, kg_on_hand: 100 });
  });

  it.each([
    // the same day 12 (or 9) months later; a day past the month's end falls back to its last day
    ["PP-410", "2026-01-31", "2027-01-31"],
    ["PZ-610", "2026-05-31", "2027-02-28"],
    ["EC-200", "2026-03-15", "2026-09-15"],
  ])("the expiry of %s received %s defaults to %s (received + shelf life)", async (code, received, expiry) => {
    const id = await idOf(code);
    const res = await receive("purchaser", id, { lotNumber: "X-1", receivedDate: received, kgOnHand: 25 });
    expect(res.status).toBe(201);
    const lot = (await res.json()).coating.lots.find((l: { lotNumber: string }) => l.lotNumber === "X-1");
    expect(lot).toMatchObject({ receivedDate: received, expiryDate: expiry });
  });

  it("marks a lot expiring within 60 days as near expiry", async () => {
    const id = await idOf("PH-510");
    const res = await receive("purchaser", id, { lotNumber: "OF-SHORT", receivedDate: isoDay(-2), expiryDate: isoDay(10), kgOnHand: 20 });
    const { coating } = await res.json();
    expect(coating.nearExpiry).toBe(true);
    expect(coating.lots.find((l: { lotNumber: string }) => l.lotNumber === "OF-SHORT").status).toBe("near-expiry");
  });

  it.each([
    ["negative stock", { kgOnHand: -5 }, "kgOnHand"],
    ["zero stock", { kgOnHand: 0 }, "kgOnHand"],
    ["a day that does not exist", { receivedDate: "2026-02-30" }, "receivedDate"],
    ["a date in another format", { receivedDate: "02/11/2026" }, "receivedDate"],
    ["an expiry before receipt", { receivedDate: "2026-06-01", expiryDate: "2026-05-01" }, "expiryDate"],
    ["a receipt in the future", { receivedDate: isoDay(30) }, "receivedDate"],
    ["an empty lot number", { lotNumber: " " }, "lotNumber"],
    ["an unknown field", { supplier: "x" }, "supplier"],
  ])("refuses %s with 400 naming the field and stores nothing", async (_n, patch, field) => {
    const id = await idOf("PP-420");
    const res = await receive("purchaser", id, { lotNumber: "FPW-9000", receivedDate: "2026-06-01", kgOnHand: 50, ...patch });
    expect(res.status).toBe(400);
    expect(Object.keys((await res.json()).error.fields)).toContain(field);
    const lots = await (await getDb()).selectFrom("coating_lots").select("id").where("coating_id", "=", id).execute();
    expect(lots).toHaveLength(1);
  });

  it("answers 409 for a lot number already received, 404 for an unknown coating", async () => {
    const id = await idOf("PP-420");
    expect((await receive("purchaser", id, { lotNumber: "FPW-7655", receivedDate: "2026-06-01", kgOnHand: 5 })).status).toBe(409);
    expect((await receive("purchaser", 99999, { lotNumber: "A", receivedDate: "2026-06-01", kgOnHand: 5 })).status).toBe(404);
  });

  it.each(readers)("refuses the %s role", async (role) => {
    const id = await idOf("PP-420");
    expect((await receive(role, id, { lotNumber: "FPW-8002", receivedDate: "2026-06-01", kgOnHand: 5 })).status).toBe(403);
  });
});
