import fs from "node:fs";
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { binaryStl } from "@/db/seed/parts";
import { meshDirectory, sweepMeshFolder } from "@/lib/server/meshes";
import { BASE, params, request, resetDatabase, signInAs, teardown, useTempDatabase } from "./helpers";
import { POST as meshPost } from "@/app/api/meshes/route";
import { GET as meshGet, PATCH as meshPatch } from "@/app/api/meshes/[id]/route";
import { GET as fileGet } from "@/app/api/meshes/[id]/file/route";
import { POST as partPost } from "@/app/api/parts/route";

useTempDatabase();
let engineer = "";
let operator = "";
beforeAll(async () => {
  await resetDatabase();
});
beforeEach(async () => {
  await resetDatabase();
  engineer = await signInAs("engineer");
  operator = await signInAs("operator");
}, 60_000);
afterEach(() => {
  delete process.env.MESH_MAX_BYTES;
});
afterAll(teardown);

type V = [number, number, number];

/** Axis-aligned box (0,0,0)–(x,y,z): 12 outward-facing triangles, nine coordinates each. */
function boxTriangles(x: number, y: number, z: number): number[] {
  const p = (i: number, j: number, k: number): V => [i * x, j * y, k * z];
  const out: number[] = [];
  const quad = (a: V, b: V, c: V, d: V) => out.push(...a, ...b, ...c, ...a, ...c, ...d);
  quad(p(0, 0, 0), p(0, 1, 0), p(1, 1, 0), p(1, 0, 0));
  quad(p(0, 0, 1), p(1, 0, 1), p(1, 1, 1), p(0, 1, 1));
  quad(p(0, 0, 0), p(1, 0, 0), p(1, 0, 1), p(0, 0, 1));
  quad(p(0, 1, 0), p(0, 1, 1), p(1, 1, 1), p(1, 1, 0));
  quad(p(0, 0, 0), p(0, 0, 1), p(0, 1, 1), p(0, 1, 0));
  quad(p(1, 0, 0), p(1, 1, 0), p(1, 1, 1), p(1, 0, 1));
  return out;
}

function asciiStl(triangles: number[]): string {
  const lines = ["solid box"];
  for (let t = 0; t < triangles.length; t += 9) {
    lines.push("  facet normal 0 0 0", "    outer loop");
    for (let v = 0; v < 3; v++) lines.push(`      vertex ${triangles[t + 3 * v]} ${triangles[t + 3 * v + 1]} ${triangles[t + 3 * v + 2]}`);
    lines.push("    endloop", "  endfacet");
  }
  lines.push("endsolid box");
  return lines.join("\n") + "\n";
}

const enc = (s: string) => new TextEncoder().encode(s);

interface UploadOpts {
  unit?: string | null;
  unitAfter?: boolean;
  name?: string;
  cookie?: string;
}

function uploadRequest(bytes: Uint8Array, opts: UploadOpts = {}): Request {
  const form = new FormData();
  const unit = opts.unit === undefined ? "mm" : opts.unit;
  if (unit !== null && !opts.unitAfter) form.append("unit", unit);
  form.append("file", new File([bytes as BlobPart], opts.name ?? "part.stl", { type: "model/stl" }));
  if (unit !== null && opts.unitAfter) form.append("unit", unit);
  return new Request(`${BASE}/api/meshes`, { method: "POST", body: form, headers: { cookie: opts.cookie ?? engineer } });
}

async function upload(bytes: Uint8Array, opts: UploadOpts = {}) {
  const res = await meshPost(uploadRequest(bytes, opts));
  return { status: res.status, body: (await res.json()) as Record<string, unknown> & { error?: { message: string; fields?: Record<string, string> } } };
}

/** Files in the mesh folder and rows in the table: a refused upload must change neither. */
async function stored(): Promise<{ files: string[]; rows: number }> {
  const dir = meshDirectory();
  const files = fs.existsSync(dir) ? fs.readdirSync(dir).sort() : [];
  const { n } = await (await getDb()).selectFrom("meshes").select((eb) => eb.fn.countAll<number>().as("n")).executeTakeFirstOrThrow();
  return { files, rows: Number(n) };
}

// 1 in = 25.4 mm exactly (NIST SP 811), so 1 in² = 645.16 mm² and 1 in³ = 16 387.064 mm³.
const IN_MM = 25.4;

describe("POST /api/meshes measures and stores an STL", () => {
  it("a binary 100 × 50 × 20 mm box: area, volume, box and closed, file and row kept", async () => {
    const before = await stored();
    const bytes = binaryStl(boxTriangles(100, 50, 20));
    const { status, body } = await upload(bytes, { name: "bracket.stl" });
    expect(status).toBe(201);
    // hand working: box surface 2(ab + ac + bc) = 2(5000 + 2000 + 1000) = 16 000 mm²; volume 100 000 mm³
    expect(body).toMatchObject({ triangleCount: 12, format: "binary", closed: true, unit: "mm", fileName: "bracket.stl", unitHint: null });
    expect(body.areaM2).toBeCloseTo(0.016, 12);
    expect(body.volumeM3).toBeCloseTo(1e-4, 14);
    expect(body.bboxMm).toEqual({ x: 100, y: 50, z: 20 });
    const after = await stored();
    expect(after.rows).toBe(before.rows + 1);
    expect(after.files).toEqual([...before.files, `${body.id}.stl`].sort());
    expect(new Uint8Array(fs.readFileSync(`${meshDirectory()}/${body.id}.stl`))).toEqual(bytes);
    const row = await (await getDb()).selectFrom("meshes").selectAll().where("id", "=", body.id as string).executeTakeFirstOrThrow();
    expect(row).toMatchObject({ unit: "mm", size_bytes: bytes.length, triangle_count: 12, closed: 1, bbox_x_mm: 100, file_name: "bracket.stl" });
  });

  it.each([
    ["before the file", false],
    ["after the file", true],
  ])("unit in, sent %s: 4 × 2 × 1 in box scaled exactly", async (_label, unitAfter) => {
    const { status, body } = await upload(binaryStl(boxTriangles(4, 2, 1)), { unit: "in", unitAfter });
    expect(status).toBe(201);
    // 2(8 + 4 + 2) = 28 in² = 18 064.48 mm²; 8 in³ = 131 096.512 mm³
    expect(body.areaM2 as number).toBeCloseTo((28 * IN_MM * IN_MM) / 1e6, 12);
    expect(body.volumeM3 as number).toBeCloseTo((8 * IN_MM ** 3) / 1e9, 15);
    const box = body.bboxMm as { x: number; y: number; z: number };
    expect(box.x).toBeCloseTo(4 * IN_MM, 9);
    expect(box.y).toBeCloseTo(2 * IN_MM, 9);
    expect(box.z).toBeCloseTo(1 * IN_MM, 9);
    expect(body.unit).toBe("in");
    expect(body.unitHint).toBeNull();
  });

  it("a part drawn in inches but sent as mm gets a hint to check the unit", async () => {
    const { status, body } = await upload(binaryStl(boxTriangles(4, 2, 1)), { unit: "mm" });
    expect(status).toBe(201);
    expect(body.unitHint).toMatch(/inch/i);
  });

  it("an ASCII STL measures the same as the binary one", async () => {
    const { status, body } = await upload(enc(asciiStl(boxTriangles(100, 50, 20))));
    expect(status).toBe(201);
    expect(body).toMatchObject({ format: "ascii", triangleCount: 12, closed: true });
    expect(body.areaM2).toBeCloseTo(0.016, 12);
  });

  it('a binary file whose header starts with "solid" is still read as binary', async () => {
    const { status, body } = await upload(binaryStl(boxTriangles(100, 50, 20), "solid exported by a CAD program"));
    expect(status).toBe(201);
    expect(body).toMatchObject({ format: "binary", triangleCount: 12 });
  });

  it("streams: a body arriving in 7-byte pieces measures like a whole one", async () => {
    const tri = boxTriangles(100, 50, 20);
    // 600 boxes side by side: 7 200 triangles, 360 084 bytes, many chunk boundaries mid-record
    const many: number[] = [];
    for (let i = 0; i < 600; i++) for (let k = 0; k < tri.length; k++) many.push(k % 3 === 0 ? tri[k] + i * 200 : tri[k]);
    const bytes = binaryStl(many);
    const boundary = "----coatwright-test-boundary";
    const head = enc(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="many.stl"\r\nContent-Type: model/stl\r\n\r\n`);
    const tail = enc(`\r\n--${boundary}\r\nContent-Disposition: form-data; name="unit"\r\n\r\nmm\r\n--${boundary}--\r\n`);
    const whole = new Uint8Array(head.length + bytes.length + tail.length);
    whole.set(head);
    whole.set(bytes, head.length);
    whole.set(tail, head.length + bytes.length);
    let at = 0;
    const body = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (at >= whole.length) return controller.close();
        controller.enqueue(whole.slice(at, at + 7));
        at += 7;
      },
    });
    const req = new Request(`${BASE}/api/meshes`, {
      method: "POST",
      body,
      headers: { cookie: engineer, "content-type": `multipart/form-data; boundary=${boundary}` },
      duplex: "half",
    } as RequestInit);
    const res = await meshPost(req);
    expect(res.status).toBe(201);
    const json = (await res.json()) as { triangleCount: number; areaM2: number; volumeM3: number; bboxMm: { x: number } };
    expect(json.triangleCount).toBe(7200);
    // 600 separate boxes: 600 × 16 000 mm², 600 × 100 000 mm³; x from 0 to 599·200 + 100
    expect(json.areaM2).toBeCloseTo(9.6, 9);
    expect(json.volumeM3).toBeCloseTo(0.06, 12);
    expect(json.bboxMm.x).toBe(119_900);
  });
});

describe("POST /api/meshes refuses bad files with a 400 that says what is wrong, storing nothing", () => {
  const box = () => binaryStl(boxTriangles(10, 10, 10));
  const truncated = () => box().slice(0, 84 + 50 * 5 + 17);
  const withCoordinate = (value: number) => {
    const b = box();
    new DataView(b.buffer).setFloat32(84 + 50 * 3 + 12 + 4, value, true); // triangle 4, first vertex y
    return b;
  };
  const zeroArea = () => binaryStl([0, 0, 0, 1, 1, 1, 2, 2, 2, 5, 5, 5, 5, 5, 5, 5, 5, 5]);
  const noTriangles = () => binaryStl([]);
  const brokenVertex = () => {
    const lines = asciiStl(boxTriangles(10, 10, 10)).split("\n");
    lines[9] = "      vertex 1 2"; // line 10: a vertex with two coordinates
    return enc(lines.join("\n"));
  };
  const brokenFacet = () => {
    const lines = asciiStl(boxTriangles(10, 10, 10)).split("\n");
    lines[8] = "  facet normal 0 0 0 extra words"; // line 9
    lines[7] = "  facet"; // line 8 replaces "endfacet"
    return enc(lines.join("\n"));
  };
  const png = () => new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, ...new Array(200).fill(7)]);

  it.each([
    ["an empty file", () => new Uint8Array(0), /empty/i],
    ["a truncated binary file", truncated, /incomplete|cut short/i],
    ["a NaN coordinate", () => withCoordinate(NaN), /triangle 4.*not a finite number/i],
    ["an infinite coordinate", () => withCoordinate(Infinity), /not a finite number/i],
    ["only zero-area triangles", zeroArea, /zero area/i],
    ["a binary file with 0 triangles", noTriangles, /no triangles/i],
    ["an ASCII vertex line with two numbers", brokenVertex, /line 10/i],
    ["an ASCII facet out of place", brokenFacet, /line \d+/i],
    ["a PNG image", png, /not (a valid binary )?(an )?STL/i],
    ["a text file", () => enc("hello, this is not a mesh\n".repeat(10)), /not an STL/i],
  ])("%s", async (_label, make, message) => {
    const before = await stored();
    const { status, body } = await upload(make());
    expect(status).toBe(400);
    expect(body.error?.message).toMatch(message);
    expect(body.error?.fields?.file).toBeTruthy();
    expect(await stored()).toEqual(before);
  });

  it.each([
    ["missing", null, /unit is missing/i],
    ["not mm or in", "cm", /"mm" or "in"/],
  ])("the unit %s: 400 naming unit", async (_label, unit, message) => {
    const before = await stored();
    const { status, body } = await upload(binaryStl(boxTriangles(10, 10, 10)), { unit });
    expect(status).toBe(400);
    expect(body.error?.fields?.unit).toMatch(message);
    expect(await stored()).toEqual(before);
  });

  it("no file field: 400 naming file", async () => {
    const form = new FormData();
    form.append("unit", "mm");
    const res = await meshPost(new Request(`${BASE}/api/meshes`, { method: "POST", body: form, headers: { cookie: engineer } }));
    expect(res.status).toBe(400);
    expect(((await res.json()) as { error: { fields: Record<string, string> } }).error.fields.file).toMatch(/missing/);
  });

  it("a JSON body: 400 asking for a multipart form", async () => {
    const res = await meshPost(request("/api/meshes", { method: "POST", body: { unit: "mm" }, cookie: engineer }));
    expect(res.status).toBe(400);
    expect(((await res.json()) as { error: { message: string } }).error.message).toMatch(/multipart/);
  });

  it("a file over MESH_MAX_BYTES: 413, the partial file deleted, no row", async () => {
    process.env.MESH_MAX_BYTES = "2000";
    const before = await stored();
    const { status, body } = await upload(binaryStl(boxTriangles(10, 10, 10).concat(boxTriangles(10, 10, 10), boxTriangles(10, 10, 10), boxTriangles(10, 10, 10))));
    expect(status).toBe(413);
    expect(body.error?.message).toMatch(/larger than/);
    expect(await stored()).toEqual(before);
    // …and the next upload within the limit is served
    expect((await upload(binaryStl(boxTriangles(10, 10, 10)))).status).toBe(201);
  });

  it("keeps serving after every refusal", async () => {
    for (const bad of [new Uint8Array(0), enc("solid x\nfacet\n"), new Uint8Array(90)]) expect((await upload(bad)).status).toBe(400);
    expect((await upload(binaryStl(boxTriangles(10, 10, 10)))).status).toBe(201);
  });

  it("an operator may not upload (403) and nothing is stored", async () => {
    const before = await stored();
    const res = await meshPost(uploadRequest(binaryStl(boxTriangles(10, 10, 10)), { cookie: operator }));
    expect(res.status).toBe(403);
    expect(await stored()).toEqual(before);
  });
});

describe("GET /api/meshes/{id} and /file, PATCH unit", () => {
  it("returns the same JSON and the stored bytes as model/stl to any signed-in role", async () => {
    const bytes = binaryStl(boxTriangles(100, 50, 20));
    const { body: posted } = await upload(bytes);
    const id = posted.id as string;
    const got = await meshGet(request(`/api/meshes/${id}`, { cookie: operator }), params({ id }));
    expect(got.status).toBe(200);
    expect(await got.json()).toEqual(posted);
    const file = await fileGet(request(`/api/meshes/${id}/file`, { cookie: operator }), params({ id }));
    expect(file.status).toBe(200);
    expect(file.headers.get("content-type")).toBe("model/stl");
    expect(new Uint8Array(await file.arrayBuffer())).toEqual(bytes);
    const anon = await fileGet(request(`/api/meshes/${id}/file`), params({ id }));
    expect(anon.status).toBe(401);
  });

  it("404 for an unknown or malformed id", async () => {
    for (const id of ["00000000-0000-4000-8000-000000000000", "../../etc/passwd"]) {
      expect((await meshGet(request(`/api/meshes/x`, { cookie: operator }), params({ id }))).status).toBe(404);
      expect((await fileGet(request(`/api/meshes/x/file`, { cookie: operator }), params({ id }))).status).toBe(404);
    }
  });

  it("PATCH unit rescales exactly; refused once a part uses the mesh", async () => {
    const { body } = await upload(binaryStl(boxTriangles(4, 2, 1)), { unit: "mm" });
    const id = body.id as string;
    const res = await meshPatch(request(`/api/meshes/${id}`, { method: "PATCH", body: { unit: "in" }, cookie: engineer }), params({ id }));
    expect(res.status).toBe(200);
    const m = (await res.json()) as { unit: string; areaM2: number; volumeM3: number; bboxMm: { x: number }; unitHint: string | null };
    expect(m.unit).toBe("in");
    expect(m.areaM2).toBeCloseTo((28 * IN_MM * IN_MM) / 1e6, 12);
    expect(m.volumeM3).toBeCloseTo((8 * IN_MM ** 3) / 1e9, 15);
    expect(m.bboxMm.x).toBeCloseTo(101.6, 9);
    expect(m.unitHint).toBeNull();
    const part = await partPost(
      request("/api/parts", {
        method: "POST",
        cookie: engineer,
        body: { number: "T-1", name: "Test block", material: "steel", thicknessMm: 25.4, areaOrigin: "mesh", meshId: id },
      }),
    );
    expect(part.status).toBe(201);
    const again = await meshPatch(request(`/api/meshes/${id}`, { method: "PATCH", body: { unit: "mm" }, cookie: engineer }), params({ id }));
    expect(again.status).toBe(409);
    expect(((await again.json()) as { error: { message: string } }).error.message).toMatch(/T-1/);
  });
});

describe("the start-up sweep of the mesh folder", () => {
  // Retention rules are the product's own choice (common practice, no source): unfinished
  // uploads and files without a record go after an hour; meshes no part uses after 7 days.
  const DAY_S = 86_400;
  const ageFile = (file: string, seconds: number) => {
    const t = Date.now() / 1000 - seconds;
    fs.utimesSync(file, t, t);
  };

  it("deletes old partial uploads, stray files and unused meshes, keeps what a part uses and anything recent", async () => {
    const used = await upload(binaryStl(boxTriangles(10, 10, 10)), { name: "used.stl" });
    const unused = await upload(binaryStl(boxTriangles(20, 10, 10)), { name: "unused.stl" });
    const recent = await upload(binaryStl(boxTriangles(30, 10, 10)), { name: "recent.stl" });
    expect([used.status, unused.status, recent.status]).toEqual([201, 201, 201]);
    const part = await partPost(
      request("/api/parts", {
        method: "POST",
        cookie: engineer,
        body: { number: "S-1", name: "Swept block", material: "steel", thicknessMm: 10, areaOrigin: "mesh", meshId: used.body.id },
      }),
    );
    expect(part.status).toBe(201);
    const db = await getDb();
    const eightDaysAgo = Math.floor(Date.now() / 1000) - 8 * DAY_S;
    await db.updateTable("meshes").set({ created_at: eightDaysAgo }).where("id", "in", [used.body.id as string, unused.body.id as string]).execute();
    const dir = meshDirectory();
    const oldPartial = `${dir}/11111111-1111-4111-8111-111111111111.stl.part`;
    const newPartial = `${dir}/22222222-2222-4222-8222-222222222222.stl.part`;
    const stray = `${dir}/33333333-3333-4333-8333-333333333333.stl`;
    const other = `${dir}/notes.txt`;
    for (const f of [oldPartial, newPartial, stray, other]) fs.writeFileSync(f, "x");
    for (const f of [oldPartial, stray, other]) ageFile(f, 2 * 3600);

    const report = await sweepMeshFolder();
    expect(report).toEqual({ partialFiles: 1, strayFiles: 1, unattachedMeshes: 1 });
    // (earlier tests' young files without rows stay too: younger than an hour)
    const files = new Set(fs.readdirSync(dir));
    for (const kept of [`${used.body.id}.stl`, `${recent.body.id}.stl`, "22222222-2222-4222-8222-222222222222.stl.part", "notes.txt"]) {
      expect(files.has(kept), kept).toBe(true);
    }
    for (const gone of [`${unused.body.id}.stl`, "11111111-1111-4111-8111-111111111111.stl.part", "33333333-3333-4333-8333-333333333333.stl"]) {
      expect(files.has(gone), gone).toBe(false);
    }
    const ids = (await db.selectFrom("meshes").select("id").execute()).map((r) => r.id);
    expect(ids).toContain(used.body.id);
    expect(ids).toContain(recent.body.id);
    expect(ids).not.toContain(unused.body.id);
    // a second sweep finds nothing more
    expect(await sweepMeshFolder()).toEqual({ partialFiles: 0, strayFiles: 0, unattachedMeshes: 0 });
  });
});
