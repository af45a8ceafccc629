import Papa from "papaparse";
import { afterAll, beforeEach, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { binaryStl } from "@/db/seed/parts";
import type { PartView } from "@/lib/server/parts";
import { BASE, params, request, resetDatabase, signInAs, teardown, useTempDatabase } from "./helpers";
import { GET as listGet, POST as listPost } from "@/app/api/parts/route";
import { DELETE as oneDelete, GET as oneGet, PUT as onePut } from "@/app/api/parts/[id]/route";
import { GET as csvGet } from "@/app/api/parts/export.csv/route";
import { POST as importPost } from "@/app/api/parts/import/route";
import { POST as measurePost } from "@/app/api/parts/measure/route";
import { POST as meshPost } from "@/app/api/meshes/route";

useTempDatabase();
let engineer = "";
let operator = "";
let admin = "";
beforeEach(async () => {
  await resetDatabase();
  engineer = await signInAs("engineer");
  operator = await signInAs("operator");
  admin = await signInAs("admin");
}, 60_000);
afterAll(teardown);

type ErrorBody = { error: { code: string; message: string; fields?: Record<string, string>; rows?: ImportRow[]; problems?: string[] } };
type ImportRow = { row: number; number: string; valid: boolean; errors: Record<string, string>; areaM2: number | null };
type ImportBody = { imported: boolean; importedCount: number; validCount: number; invalidCount: number; problems: string[]; rows: ImportRow[] };

async function json<T>(res: Response): Promise<T> {
  return (await res.json()) as T;
}

const post = (body: unknown, cookie = engineer) => listPost(request("/api/parts", { method: "POST", body, cookie }));
const put = (id: string, body: unknown, cookie = engineer) => onePut(request(`/api/parts/${id}`, { method: "PUT", body, cookie }), params({ id }));

async function partRows() {
  return (await getDb()).selectFrom("parts").selectAll().orderBy("number").execute();
}

async function countParts(): Promise<number> {
  return (await partRows()).length;
}

const base = { name: "Test part", customer: "Test customer", material: "steel", thicknessMm: 2 };

// Hand working for a round tube 1000 mm long, 48.3 mm outside diameter, 3.2 mm wall:
// bore d = 48.3 − 2·3.2 = 41.9 mm; section (π/4)(D² − d²); outside πDL plus both cut ends.
const D = 48.3;
const d = 41.9;
const L = 1000;
const SECTION_MM2 = (Math.PI / 4) * (D * D - d * d);
const TUBE = {
  outsideM2: (Math.PI * D * L + 2 * SECTION_MM2) / 1e6,
  insideM2: (Math.PI * d * L) / 1e6,
  // steel 7850 kg/m³ (handbook value, from memory)
  massKg: ((SECTION_MM2 * L) / 1e9) * 7850,
};

describe("the demo catalogue", () => {
  it("lists the seeded parts to any role, archived ones only on request", async () => {
    const res = await listGet(request("/api/parts", { cookie: operator }));
    expect(res.status).toBe(200);
    const { parts } = await json<{ parts: PartView[] }>(res);
    expect(parts.map((p) => p.number)).toEqual(["BC-1042", "BC-1043", "BC-2210", "BC-3300", "BC-4105", "BC-5020"]);
    const all = await json<{ parts: PartView[] }>(await listGet(request("/api/parts?archived=1", { cookie: operator })));
    expect(all.parts.find((p) => p.number === "BC-2199")?.archived).toBe(true);
    const found = await json<{ parts: PartView[] }>(await listGet(request("/api/parts?q=fender&archived=1", { cookie: operator })));
    expect(found.parts.map((p) => p.number)).toEqual(["BC-2199", "BC-2210"]);
    const byCustomer = await json<{ parts: PartView[] }>(await listGet(request("/api/parts?q=ashgrove", { cookie: operator })));
    expect(byCustomer.parts.map((p) => p.number)).toEqual(["BC-1042", "BC-1043"]);
  });

  it("seeds the planter box from the open-box template (hand working)", async () => {
    const { parts } = await json<{ parts: PartView[] }>(await listGet(request("/api/parts", { cookie: operator })));
    const box = parts.find((p) => p.number === "BC-4105")!;
    // 800 × 400 × 450 mm, 2 mm walls: inside 796 × 396, 448 deep.
    // outside = bottom 320 000 + walls 2(800 + 400)·450 = 1 080 000 + rim (320 000 − 315 216) = 1 404 784 mm²
    expect(box.areaM2).toBeCloseTo(1.404784, 9);
    // inside = 315 216 + 2(796 + 396)·448 = 1 383 248 mm²
    expect(box.insideAreaM2).toBeCloseTo(1.383248, 9);
    // metal = 800·400·450 − 796·396·448 = 2 783 232 mm³ × 7850 kg/m³
    expect(box.massKg).toBeCloseTo(2.783232e-3 * 7850, 9);
    expect(box).toMatchObject({ areaOrigin: "template", templateId: "open-box", massOrigin: "volume", lengthMm: 800, widthMm: 400, heightMm: 450 });
    const bench = parts.find((p) => p.number === "BC-1042")!;
    // 2(50 + 30) mm × 6 400 mm of tube = 1 024 000 mm²; masked 0.004 m²
    expect(bench.areaM2).toBeCloseTo(1.024, 9);
    expect(bench.coatedAreaM2).toBeCloseTo(1.02, 9);
    expect(bench.areaOrigin).toBe("formula");
  });

  it("seeds the bike-rack hoop with its generated mesh: closed, bore kept apart, box x/y/z → L/W/H", async () => {
    const { parts } = await json<{ parts: PartView[] }>(await listGet(request("/api/parts", { cookie: operator })));
    const hoop = parts.find((p) => p.number === "BC-5020")!;
    expect(hoop.areaOrigin).toBe("mesh");
    const mesh = await (await getDb()).selectFrom("meshes").selectAll().where("id", "=", hoop.meshId!).executeTakeFirstOrThrow();
    expect(mesh.closed).toBe(1);
    expect(hoop.areaM2 + hoop.insideAreaM2).toBeCloseTo(mesh.area_m2, 12);
    // Two 650 mm legs and a half circle of radius 300 on the centreline: 648.3 wide, 974.15 high.
    expect(hoop.lengthMm).toBeCloseTo(648.3, 3);
    expect(hoop.widthMm).toBeCloseTo(48.3, 3);
    expect(hoop.heightMm).toBeCloseTo(974.15, 3);
    // Pappus: metal = section × centreline (1300 + 300π mm); the 32-sided mesh is within 1 % of it.
    const pappusKg = ((SECTION_MM2 * (1300 + 300 * Math.PI)) / 1e9) * 7850;
    expect(Math.abs(hoop.massKg / pappusKg - 1)).toBeLessThan(0.01);
  });
});

describe("POST /api/parts", () => {
  it("a round tube from its template: area, bore, mass from metal volume; row read back", async () => {
    const res = await post({
      ...base,
      number: "T-100",
      thicknessMm: 3.2,
      areaOrigin: "template",
      templateId: "round-tube",
      dimensionsMm: { lengthMm: L, outsideDiameterMm: D, wallMm: 3.2 },
      maskedAreaM2: 0.002,
    });
    expect(res.status).toBe(201);
    const { part } = await json<{ part: PartView }>(res);
    expect(part.areaM2).toBeCloseTo(TUBE.outsideM2, 12);
    expect(part.insideAreaM2).toBeCloseTo(TUBE.insideM2, 12);
    expect(part.coatedAreaM2).toBeCloseTo(TUBE.outsideM2 - 0.002, 12);
    expect(part.massKg).toBeCloseTo(TUBE.massKg, 9);
    expect(part).toMatchObject({ massOrigin: "volume", densityKgPerM3: 7850, lengthMm: L, widthMm: D, heightMm: D, archived: false });
    const row = (await partRows()).find((r) => r.number === "T-100")!;
    expect(row).toMatchObject({ area_origin: "template", template_id: "round-tube", mass_origin: "volume", masked_area_m2: 0.002 });
    expect(JSON.parse(row.dimensions_json!)).toEqual({ lengthMm: L, outsideDiameterMm: D, wallMm: 3.2 });
  });

  it("a typed area gets a thin-wall mass: 1 m² of 2 mm steel plate weighs 15.7 kg", async () => {
    const res = await post({ ...base, number: "T-101", areaOrigin: "manual", areaM2: 2, lengthMm: 1000, widthMm: 500, heightMm: 10 });
    expect(res.status).toBe(201);
    const { part } = await json<{ part: PartView }>(res);
    // source: service-centre plate tables, steel ≈ 40.8 lb/ft² per inch of thickness:
    // 2 mm = 0.07874 in → 3.2126 lb/ft² = 15.685 kg/m²; coated area counts both faces → 1 m² of plate
    expect(part.massKg).toBeCloseTo(15.685, 1);
    expect(part.massOrigin).toBe("sheet");
  });

  it("an entered mass is kept; another material's density is used as given", async () => {
    const res = await post({ ...base, number: "T-102", material: "other", densityKgPerM3: 8900, massKg: 3.3, areaOrigin: "manual", areaM2: 0.5, lengthMm: 100, widthMm: 100, heightMm: 100 });
    expect(res.status).toBe(201);
    expect((await json<{ part: PartView }>(res)).part).toMatchObject({ massKg: 3.3, massOrigin: "entered", densityKgPerM3: 8900, material: "other" });
  });

  it("a formula over named dimensions; its errors are in plain words on the formula field", async () => {
    const ok = await post({ ...base, number: "T-103", areaOrigin: "formula", formula: "2*(L*W + L*H + W*H)", dimensionsMm: { L: 100, W: 50, H: 20 }, lengthMm: 100, widthMm: 50, heightMm: 20 });
    expect(ok.status).toBe(201);
    // hand working: 2(5000 + 2000 + 1000) = 16 000 mm²
    expect((await json<{ part: PartView }>(ok)).part.areaM2).toBeCloseTo(0.016, 12);
    const bad = await post({ ...base, number: "T-104", areaOrigin: "formula", formula: "2*(L*W + Q)", dimensionsMm: { L: 100, W: 50 }, lengthMm: 1, widthMm: 1, heightMm: 1 });
    expect(bad.status).toBe(400);
    const e = (await json<ErrorBody>(bad)).error;
    expect(e.fields?.formula).toMatch(/Unknown name "Q".*L, W/);
    const syntax = await post({ ...base, number: "T-105", areaOrigin: "formula", formula: "2*(L*W", dimensionsMm: { L: 100, W: 50 }, lengthMm: 1, widthMm: 1, heightMm: 1 });
    expect((await json<ErrorBody>(syntax)).error.fields?.formula).toMatch(/syntax error/);
    // seven seeded parts (one archived) and T-103
    expect(await countParts()).toBe(8);
  });

  it("a part from an uploaded mesh: area, box and mass from the mesh", async () => {
    // 100 × 50 × 20 mm closed box
    const tri: number[] = [];
    const p = (i: number, j: number, k: number) => [i * 100, j * 50, k * 20];
    const quad = (a: number[], b: number[], c: number[], q: number[]) => tri.push(...a, ...b, ...c, ...a, ...c, ...q);
    quad(p(0, 0, 0), p(0, 1, 0), p(1, 1, 0), p(1, 0, 0));
    quad(p(0, 0, 1), p(1, 0, 1), p(1, 1, 1), p(0, 1, 1));
    quad(p(0, 0, 0), p(1, 0, 0), p(1, 0, 1), p(0, 0, 1));
    quad(p(0, 1, 0), p(0, 1, 1), p(1, 1, 1), p(1, 1, 0));
    quad(p(0, 0, 0), p(0, 0, 1), p(0, 1, 1), p(0, 1, 0));
    quad(p(1, 0, 0), p(1, 1, 0), p(1, 1, 1), p(1, 0, 1));
    const form = new FormData();
    form.append("unit", "mm");
    form.append("file", new File([binaryStl(tri) as BlobPart], "block.stl"));
    const up = await meshPost(new Request(`${BASE}/api/meshes`, { method: "POST", body: form, headers: { cookie: engineer } }));
    const mesh = await json<{ id: string }>(up);
    const res = await post({ ...base, number: "T-106", areaOrigin: "mesh", meshId: mesh.id, insideAreaM2: 0.001 });
    expect(res.status).toBe(201);
    const { part } = await json<{ part: PartView }>(res);
    // 16 000 mm² in all, 1 000 mm² of it marked inside; 100 000 mm³ × 7850 kg/m³ = 0.785 kg
    expect(part.areaM2).toBeCloseTo(0.015, 12);
    expect(part.insideAreaM2).toBeCloseTo(0.001, 12);
    expect(part.massKg).toBeCloseTo(0.785, 9);
    expect(part).toMatchObject({ lengthMm: 100, widthMm: 50, heightMm: 20, meshId: mesh.id, massOrigin: "volume" });
    const got = await json<{ part: PartView; mesh: { id: string } }>(await oneGet(request(`/api/parts/${part.id}`, { cookie: operator }), params({ id: part.id })));
    expect(got.mesh.id).toBe(mesh.id);
    const tooMuch = await post({ ...base, number: "T-107", areaOrigin: "mesh", meshId: mesh.id, insideAreaM2: 0.02 });
    expect((await json<ErrorBody>(tooMuch)).error.fields?.insideAreaM2).toMatch(/less than the mesh/);
    const noMesh = await post({ ...base, number: "T-108", areaOrigin: "mesh", meshId: "00000000-0000-4000-8000-000000000000" });
    expect((await json<ErrorBody>(noMesh)).error.fields?.meshId).toMatch(/no uploaded mesh/);
  });

  it.each([
    ["masked area above the area", { areaOrigin: "manual", areaM2: 1, maskedAreaM2: 1.5, lengthMm: 1, widthMm: 1, heightMm: 1 }, "maskedAreaM2", /larger than the part's area/],
    ["no mesh for a mesh part", { areaOrigin: "mesh" }, "meshId", /Upload an STL/],
    ["no template", { areaOrigin: "template", dimensionsMm: { lengthMm: 1 } }, "templateId", /Choose a shape template/],
    ["an unknown template", { areaOrigin: "template", templateId: "star", dimensionsMm: { lengthMm: 1 } }, "templateId", /no shape template "star"/],
    ["a dimension the template lacks", { areaOrigin: "template", templateId: "flat-plate", dimensionsMm: { lengthMm: 100, widthMm: 50, thicknessMm: 2, radiusMm: 5 } }, "dimensionsMm.radiusMm", /no dimension "radiusMm"/],
    ["a missing template dimension", { areaOrigin: "template", templateId: "flat-plate", dimensionsMm: { lengthMm: 100, thicknessMm: 2 } }, "dimensionsMm.widthMm", /Width must be a positive number/],
    ["a wall too thick", { areaOrigin: "template", templateId: "round-tube", dimensionsMm: { lengthMm: 100, outsideDiameterMm: 20, wallMm: 10 } }, "dimensionsMm.wallMm", /less than half/],
    ["no box for a typed area", { areaOrigin: "manual", areaM2: 1 }, "lengthMm", /bounding box/],
    ["another material without density", { areaOrigin: "manual", material: "other", areaM2: 1, lengthMm: 1, widthMm: 1, heightMm: 1 }, "densityKgPerM3", /density/],
    ["a negative thickness", { areaOrigin: "manual", areaM2: 1, thicknessMm: -1, lengthMm: 1, widthMm: 1, heightMm: 1 }, "thicknessMm", /above 0/],
    ["an unknown field", { areaOrigin: "manual", areaM2: 1, lengthMm: 1, widthMm: 1, heightMm: 1, colour: "red" }, "colour", /Unknown field/],
  ])("refuses %s with a 400 naming the field; nothing written", async (_label, extra, field, message) => {
    const before = await countParts();
    const res = await post({ ...base, number: "T-200", ...extra });
    expect(res.status).toBe(400);
    const e = (await json<ErrorBody>(res)).error;
    expect(e.code).toBe("invalid_input");
    expect(e.fields?.[field]).toMatch(message);
    expect(await countParts()).toBe(before);
  });

  it("a duplicate part number is a 409 (case does not matter)", async () => {
    for (const number of ["BC-1042", "bc-1042"]) {
      const res = await post({ ...base, number, areaOrigin: "manual", areaM2: 1, lengthMm: 1, widthMm: 1, heightMm: 1 });
      expect(res.status).toBe(409);
      expect((await json<ErrorBody>(res)).error.fields?.number).toMatch(/already in the catalogue/);
    }
  });

  it("only engineers and admins write", async () => {
    const body = { ...base, number: "T-300", areaOrigin: "manual", areaM2: 1, lengthMm: 1, widthMm: 1, heightMm: 1 };
    expect((await post(body, operator)).status).toBe(403);
    expect((await post(body, admin)).status).toBe(201);
  });
});

describe("PUT and DELETE /api/parts/{id}", () => {
  async function seeded(number: string): Promise<PartView> {
    const { parts } = await json<{ parts: PartView[] }>(await listGet(request("/api/parts?archived=1", { cookie: operator })));
    return parts.find((p) => p.number === number)!;
  }

  it("PUT replaces the part and recomputes; renaming onto another number is a 409", async () => {
    const p = await seeded("BC-1043");
    const res = await put(p.id, {
      number: "BC-1043",
      name: "Bench seat bracket, 8 mm",
      customer: p.customer,
      material: "steel",
      thicknessMm: 8,
      areaOrigin: "template",
      templateId: "flat-plate",
      dimensionsMm: { lengthMm: 150, widthMm: 80, thicknessMm: 8 },
    });
    expect(res.status).toBe(200);
    const { part } = await json<{ part: PartView }>(res);
    // flat plate: 2·150·80 + 2(150 + 80)·8 = 24 000 + 3 680 = 27 680 mm²; 150·80·8 mm³ × 7850
    expect(part.areaM2).toBeCloseTo(0.02768, 12);
    expect(part.massKg).toBeCloseTo(96_000e-9 * 7850, 12);
    const row = (await partRows()).find((r) => r.id === p.id)!;
    expect(row.name).toBe("Bench seat bracket, 8 mm");
    expect(row.updated_at).toBeGreaterThanOrEqual(row.created_at);
    const clash = await put(p.id, { ...base, number: "BC-1042", areaOrigin: "manual", areaM2: 1, lengthMm: 1, widthMm: 1, heightMm: 1 });
    expect(clash.status).toBe(409);
    expect((await put(p.id, { ...base, number: "X" }, operator)).status).toBe(403);
  });

  it("DELETE archives (the row stays); ?hard=1 is refused; PUT archived: false restores", async () => {
    const p = await seeded("BC-3300");
    const res = await oneDelete(request(`/api/parts/${p.id}`, { method: "DELETE", cookie: engineer }), params({ id: p.id }));
    expect(res.status).toBe(200);
    expect((await json<{ part: PartView }>(res)).part.archived).toBe(true);
    expect((await partRows()).find((r) => r.id === p.id)?.archived).toBe(1);
    const hard = await oneDelete(request(`/api/parts/${p.id}?hard=1`, { method: "DELETE", cookie: admin }), params({ id: p.id }));
    expect(hard.status).toBe(400);
    expect((await json<ErrorBody>(hard)).error.message).toMatch(/never deleted/);
    expect((await partRows()).some((r) => r.id === p.id)).toBe(true);
    const restored = await put(p.id, {
      number: p.number,
      name: p.name,
      material: p.material,
      thicknessMm: p.thicknessMm,
      massKg: p.massKg,
      areaOrigin: "manual",
      areaM2: p.areaM2,
      lengthMm: p.lengthMm,
      widthMm: p.widthMm,
      heightMm: p.heightMm,
      archived: false,
    });
    expect((await json<{ part: PartView }>(restored)).part.archived).toBe(false);
  });

  it("404 for an unknown part", async () => {
    for (const id of ["00000000-0000-4000-8000-000000000000", "nope"]) {
      expect((await oneGet(request(`/api/parts/${id}`, { cookie: operator }), params({ id }))).status).toBe(404);
    }
  });
});

describe("POST /api/parts/measure", () => {
  it("works out the numbers without writing anything", async () => {
    const before = await countParts();
    const res = await measurePost(
      request("/api/parts/measure", {
        method: "POST",
        cookie: engineer,
        body: { material: "aluminium", thicknessMm: 3, areaOrigin: "template", templateId: "flat-plate", dimensionsMm: { lengthMm: 1000, widthMm: 500, thicknessMm: 3 } },
      }),
    );
    expect(res.status).toBe(200);
    const m = await json<{ areaM2: number; massKg: number; volumeM3: number; edgeAreaM2: number; densityKgPerM3: number }>(res);
    // 2·1000·500 + 2(1500)·3 = 1 009 000 mm²; 1 500 000 mm³ × 2700 kg/m³ (aluminium, from memory) = 4.05 kg
    expect(m.areaM2).toBeCloseTo(1.009, 12);
    expect(m.edgeAreaM2).toBeCloseTo(0.009, 12);
    expect(m.massKg).toBeCloseTo(4.05, 9);
    expect(m.densityKgPerM3).toBe(2700);
    expect(await countParts()).toBe(before);
  });

  it("gives the solid block of the box beside the mass, so an impossible entered area shows", async () => {
    const res = await measurePost(
      request("/api/parts/measure", {
        method: "POST",
        cookie: engineer,
        body: { material: "steel", thicknessMm: 2, areaOrigin: "manual", areaM2: 2, lengthMm: 100, widthMm: 100, heightMm: 100 },
      }),
    );
    expect(res.status).toBe(200);
    const m = await json<{ massKg: number; solidBoxMassKg: number; massOrigin: string }>(res);
    // hand working, steel 7850 kg/m³ (from memory): thin wall ½ × 2 m² × 0.002 m × 7850 = 15.7 kg;
    // a solid 100 mm cube 0.001 m³ × 7850 = 7.85 kg, so this area cannot be right for this box
    expect(m).toMatchObject({ massOrigin: "sheet" });
    expect(m.massKg).toBeCloseTo(15.7, 9);
    expect(m.solidBoxMassKg).toBeCloseTo(7.85, 9);
  });
});

describe("CSV export and import", () => {
  const csvRow = (over: Record<string, string>) => ({
    number: "",
    name: "Imported part",
    customer: "Importer",
    material: "steel",
    thicknessMm: "2",
    areaOrigin: "manual",
    areaM2: "1.5",
    lengthMm: "1000",
    widthMm: "500",
    heightMm: "20",
    ...over,
  });
  const importJson = (rows: unknown[], mode: string) => importPost(request("/api/parts/import", { method: "POST", cookie: engineer, body: { rows, mode } }));
  const importCsv = (csv: string, mode?: string) => {
    const form = new FormData();
    form.append("file", new File([csv], "parts.csv", { type: "text/csv" }));
    if (mode) form.append("mode", mode);
    return importPost(new Request(`${BASE}/api/parts/import`, { method: "POST", body: form, headers: { cookie: engineer } }));
  };

  it("exports the catalogue as CSV with the import's columns; archived parts on request", async () => {
    const res = await csvGet(request("/api/parts/export.csv", { cookie: operator }));
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toMatch(/^text\/csv/);
    expect(res.headers.get("content-disposition")).toMatch(/attachment; filename="parts-\d{4}-\d{2}-\d{2}\.csv"/);
    const parsed = Papa.parse<Record<string, string>>((await res.text()).trim(), { header: true });
    expect(parsed.meta.fields?.slice(0, 4)).toEqual(["number", "name", "customer", "material"]);
    expect(parsed.data.map((r) => r.number)).toEqual(["BC-1042", "BC-1043", "BC-2210", "BC-3300", "BC-4105", "BC-5020"]);
    const box = parsed.data.find((r) => r.number === "BC-4105")!;
    expect(Number(box.areaM2)).toBeCloseTo(1.404784, 9);
    expect(box.dimensionsMm).toBe("lengthMm=800;widthMm=400;heightMm=450;wallMm=2");
    expect(box.archived).toBe("no");
    const all = Papa.parse<Record<string, string>>((await (await csvGet(request("/api/parts/export.csv?archived=1", { cookie: operator }))).text()).trim(), { header: true });
    expect(all.data.some((r) => r.number === "BC-2199" && r.archived === "yes")).toBe(true);
  });

  it("guards spreadsheet formulas in exported text", async () => {
    await post({ ...base, number: "T-400", name: "=HYPERLINK(\"x\")", areaOrigin: "manual", areaM2: 1, lengthMm: 1, widthMm: 1, heightMm: 1 });
    const text = await (await csvGet(request("/api/parts/export.csv", { cookie: operator }))).text();
    expect(text).toContain(`"'=HYPERLINK(""x"")"`);
  });

  it("mode all refuses the whole file when one row is bad: nothing written, the row's number and reason given", async () => {
    const before = await countParts();
    const rows = [csvRow({ number: "IM-1" }), csvRow({ number: "IM-2", areaM2: "-3" }), csvRow({ number: "IM-3" })];
    const res = await importJson(rows, "all");
    expect(res.status).toBe(400);
    const e = (await json<ErrorBody>(res)).error;
    // rows are counted as in the file: the header is row 1, so the second data row is row 3
    expect(e.message).toMatch(/1 of 3 rows.*Row 3: areaM2/);
    expect(e.fields?.["rows.3.areaM2"]).toMatch(/above 0/);
    expect(e.rows?.map((r) => [r.row, r.valid])).toEqual([[2, true], [3, false], [4, true]]);
    expect(await countParts()).toBe(before);
  });

  it("mode valid-only writes the valid rows in one go and reports the rest", async () => {
    const before = await countParts();
    const rows = [csvRow({ number: "IM-1" }), csvRow({ number: "IM-2", areaM2: "-3" }), csvRow({ number: "IM-3", maskedAreaM2: "0.5" })];
    const res = await importJson(rows, "valid-only");
    expect(res.status).toBe(200);
    const body = await json<ImportBody>(res);
    expect(body).toMatchObject({ imported: true, importedCount: 2, validCount: 2, invalidCount: 1 });
    expect(await countParts()).toBe(before + 2);
    const im3 = (await partRows()).find((r) => r.number === "IM-3")!;
    expect(im3).toMatchObject({ area_m2: 1.5, masked_area_m2: 0.5, area_origin: "manual", mass_origin: "sheet" });
  });

  it("preview (the default) checks every row and writes nothing", async () => {
    const before = await countParts();
    const res = await importJson([csvRow({ number: "IM-9" })], "preview");
    expect(res.status).toBe(200);
    expect(await json<ImportBody>(res)).toMatchObject({ imported: false, validCount: 1, invalidCount: 0 });
    expect(await countParts()).toBe(before);
  });

  it("a CSV upload: duplicates in the file and in the catalogue, bad cells, template dimensions", async () => {
    const csv = [
      "number,name,customer,material,thicknessMm,areaOrigin,areaM2,templateId,dimensionsMm,lengthMm,widthMm,heightMm",
      "CS-1,Tube rail,Acme,steel,3.2,template,,round-tube,lengthMm=1000;outsideDiameterMm=48.3;wallMm=3.2,,,",
      "CS-2,Plate,Acme,Steel,2,manual,0.8,,,400,300,2",
      "CS-1,Second tube,Acme,steel,2,manual,0.8,,,1,1,1",
      "BC-1042,Clash,Acme,steel,2,manual,0.8,,,1,1,1",
      "CS-3,Bad dims,Acme,steel,2,template,,flat-plate,length 100,,,",
      "CS-4,Bad number,Acme,steel,two,manual,0.8,,,1,1,1",
    ].join("\r\n");
    const before = await countParts();
    const preview = await importCsv(csv);
    expect(preview.status).toBe(200);
    const body = await json<ImportBody>(preview);
    expect(body.rows.map((r) => [r.row, r.number, r.valid])).toEqual([
      [2, "CS-1", true],
      [3, "CS-2", true],
      [4, "CS-1", false],
      [5, "BC-1042", false],
      [6, "CS-3", false],
      [7, "CS-4", false],
    ]);
    expect(body.rows[0].areaM2).toBeCloseTo(TUBE.outsideM2, 12);
    expect(body.rows[2].errors.number).toBe("Part number CS-1 is also on row 2.");
    expect(body.rows[3].errors.number).toMatch(/already in the catalogue/);
    expect(body.rows[4].errors.dimensionsMm).toMatch(/name=millimetres/);
    expect(body.rows[5].errors.thicknessMm).toMatch(/number/);
    expect(await countParts()).toBe(before);

    const all = await importCsv(csv, "all");
    expect(all.status).toBe(400);
    expect(await countParts()).toBe(before);
    const some = await importCsv(csv, "valid-only");
    expect(some.status).toBe(200);
    expect((await json<ImportBody>(some)).importedCount).toBe(2);
    const rows = await partRows();
    expect(rows.find((r) => r.number === "CS-2")?.material).toBe("steel");
    expect(rows.find((r) => r.number === "CS-1")?.inside_area_m2).toBeCloseTo(TUBE.insideM2, 12);
  });

  it("an unknown column or an unreadable line blocks the import", async () => {
    const unknown = await importCsv("number,name,colour\nX-1,Thing,red\n", "valid-only");
    expect(unknown.status).toBe(400);
    expect((await json<ErrorBody>(unknown)).error.problems?.[0]).toMatch(/Unknown column "colour"/);
    const ragged = await json<ImportBody>(await importCsv("number,name,material,thicknessMm,areaOrigin,areaM2,lengthMm,widthMm,heightMm\nX-2,Thing,steel,2,manual,1,1,1,1,extra\n"));
    expect(ragged.rows[0].errors.row).toMatch(/more cells/);
    const empty = await importCsv("number,name\n", "all");
    expect((await json<ErrorBody>(empty)).error.message).toMatch(/no rows/);
    const form = new FormData();
    form.append("mode", "all");
    const noFile = await importPost(new Request(`${BASE}/api/parts/import`, { method: "POST", body: form, headers: { cookie: engineer } }));
    expect((await json<ErrorBody>(noFile)).error.fields?.file).toMatch(/missing/);
  });

  it("export → import round trip (under new numbers) keeps every figure", async () => {
    const csv = await (await csvGet(request("/api/parts/export.csv", { cookie: operator }))).text();
    const before = (await partRows()).filter((r) => !r.archived);
    // Other records refer to the parts, so they stay; the copies come in as RT-<number>.
    const parsed = Papa.parse<Record<string, string>>(csv.trim(), { header: true });
    const renumbered = Papa.unparse(parsed.data.map((r) => ({ ...r, number: `RT-${r.number}` })));
    const res = await importCsv(renumbered, "all");
    expect(res.status).toBe(200);
    const after = (await partRows()).filter((r) => r.number.startsWith("RT-"));
    expect(after.map((r) => r.number)).toEqual(before.map((r) => `RT-${r.number}`));
    for (const r of after) {
      const was = before.find((b) => `RT-${b.number}` === r.number)!;
      for (const k of ["area_m2", "inside_area_m2", "masked_area_m2", "mass_kg", "length_mm", "width_mm", "height_mm"] as const) {
        expect(r[k], `${r.number} ${k}`).toBeCloseTo(was[k], 9);
      }
      expect(r.mass_origin).toBe(was.mass_origin);
      expect(r.mesh_id).toBe(was.mesh_id);
      expect(r.notes).toBe(was.notes);
    }
  });

  it("with existing \"update\", a row whose number is in the catalogue updates that part in place; new numbers are created", async () => {
    const db = await getDb();
    const target = await db.selectFrom("parts").selectAll().where("number", "=", "BC-1042").executeTakeFirstOrThrow();
    const rows = [
      // lower case on purpose: numbers match without regard to case
      csvRow({ number: "bc-1042", name: "Renamed bracket", areaM2: "0.75" }),
      csvRow({ number: "UP-1", name: "Brand new" }),
    ];
    // refused by default, with the way out named
    const refused = await json<ImportBody>(await importJson(rows, "preview"));
    expect(refused.rows[0].errors.number).toMatch(/already in the catalogue; choose to update existing parts/);

    const update = (mode: string, body: unknown[] = rows) =>
      importPost(request("/api/parts/import", { method: "POST", cookie: engineer, body: { rows: body, mode, existing: "update" } }));
    const preview = await json<Omit<ImportBody, "rows"> & { createCount: number; updateCount: number; rows: (ImportRow & { action: string })[] }>(await update("preview"));
    expect(preview).toMatchObject({ validCount: 2, invalidCount: 0, createCount: 1, updateCount: 1 });
    expect(preview.rows.map((r) => r.action)).toEqual(["update", "create"]);
    const before = await countParts();
    const res = await update("all");
    expect(res.status).toBe(200);
    expect(await json<ImportBody>(res)).toMatchObject({ imported: true, importedCount: 2 });
    expect(await countParts()).toBe(before + 1);
    const after = await db.selectFrom("parts").selectAll().where("id", "=", target.id).executeTakeFirstOrThrow();
    expect(after).toMatchObject({ number: "bc-1042", name: "Renamed bracket", area_m2: 0.75, created_at: target.created_at });
    expect(after.updated_at).toBeGreaterThanOrEqual(target.updated_at);

    // all or nothing still: one bad row and neither the update nor the new part is written
    const again = await update("all", [csvRow({ number: "BC-1042", name: "Should not land" }), csvRow({ number: "UP-2", thicknessMm: "thick" })]);
    expect(again.status).toBe(400);
    expect((await db.selectFrom("parts").select("name").where("id", "=", target.id).executeTakeFirstOrThrow()).name).toBe("Renamed bracket");
    expect(await countParts()).toBe(before + 1);
  });

  it("a bad \"existing\" value is a 400 naming the field, as JSON and as a form", async () => {
    const asJson = await importPost(request("/api/parts/import", { method: "POST", cookie: engineer, body: { rows: [], mode: "preview", existing: "merge" } }));
    expect(asJson.status).toBe(400);
    expect((await json<ErrorBody>(asJson)).error.fields?.existing).toMatch(/"refuse" or "update"/);
    const form = new FormData();
    form.append("file", new File(["number,name\nX-1,Thing\n"], "parts.csv", { type: "text/csv" }));
    form.append("existing", "merge");
    const asForm = await importPost(new Request(`${BASE}/api/parts/import`, { method: "POST", body: form, headers: { cookie: engineer } }));
    expect(asForm.status).toBe(400);
    expect((await json<ErrorBody>(asForm)).error.fields?.existing).toMatch(/"refuse" or "update"/);
  });

  it("operators may export but not import", async () => {
    const res = await importPost(request("/api/parts/import", { method: "POST", cookie: operator, body: { rows: [], mode: "all" } }));
    expect(res.status).toBe(403);
  });
});
