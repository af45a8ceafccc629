import { randomUUID } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import type { Insertable } from "kysely";
import { databasePath, type Db } from "../index";
import type { MeshesTable, PartsTable } from "../schema";
// Pure geometry (no server code): the demo's areas and masses are worked out, not typed.
import { evaluateAreaFormula } from "../../lib/geometry/area-formula";
import { DENSITY_KG_PER_M3, massFromVolumeKg, plateMassKg } from "../../lib/geometry/mass";
import { measureStlBuffer } from "../../lib/geometry/stl-measure";
import { measureTemplate } from "../../lib/geometry/templates";

/*
 * Bramblecote's parts catalogue. Every part number, customer and figure is invented. The bike-rack
 * hoop also gets a mesh: a binary STL generated below and written to the data folder.
 */

type Vec3 = [number, number, number];

/**
 * A bent round tube (an inverted U: two straight legs joined by a half circle), hollow, with
 * flat annular ends. Drawn Z-up in mm, outward-facing triangles; every ring is computed once so
 * neighbouring triangles share identical vertices and the mesh is closed.
 */
export function hoopTriangles(opts: {
  outsideDiameterMm: number;
  wallMm: number;
  legMm: number;
  bendRadiusMm: number;
  arcSegments: number;
  sides: number;
}): { all: number[]; inner: number[] } {
  const { outsideDiameterMm, wallMm, legMm, bendRadiusMm: R, arcSegments, sides } = opts;
  const ro = outsideDiameterMm / 2;
  const ri = ro - wallMm;
  // Centreline points and tangents, all in the XZ plane (Y is constant across it).
  const centre: Vec3[] = [];
  const tangent: Vec3[] = [];
  centre.push([-R, 0, 0]);
  tangent.push([0, 0, 1]);
  for (let i = 0; i <= arcSegments; i++) {
    const a = Math.PI - (Math.PI * i) / arcSegments; // from the left leg over the top to the right
    centre.push([R * Math.cos(a), 0, legMm + R * Math.sin(a)]);
    tangent.push([Math.sin(a), 0, -Math.cos(a)]);
  }
  centre.push([R, 0, 0]);
  tangent.push([0, 0, -1]);

  const ring = (k: number, r: number): Vec3[] => {
    const [cx, cy, cz] = centre[k];
    const [tx, , tz] = tangent[k];
    // normal in the plane of the bend (tangent × y), and y itself
    const nx = -tz;
    const nz = tx;
    const out: Vec3[] = [];
    for (let j = 0; j < sides; j++) {
      const t = (2 * Math.PI * j) / sides;
      out.push([cx + r * Math.cos(t) * nx, cy + r * Math.sin(t), cz + r * Math.cos(t) * nz]);
    }
    return out;
  };
  const outer = centre.map((_, k) => ring(k, ro));
  const bore = centre.map((_, k) => ring(k, ri));
  const all: number[] = [];
  const inner: number[] = [];
  const tri = (out: number[], a: Vec3, b: Vec3, c: Vec3) => out.push(...a, ...b, ...c);
  for (let k = 0; k + 1 < centre.length; k++) {
    for (let j = 0; j < sides; j++) {
      const j2 = (j + 1) % sides;
      // outside skin faces away from the centreline
      tri(all, outer[k][j], outer[k + 1][j], outer[k + 1][j2]);
      tri(all, outer[k][j], outer[k + 1][j2], outer[k][j2]);
      // the bore faces the centreline (away from the metal): opposite winding
      const a = bore[k][j];
      const b = bore[k + 1][j];
      const c = bore[k + 1][j2];
      const d = bore[k][j2];
      tri(all, a, c, b);
      tri(all, a, d, c);
      tri(inner, a, c, b);
      tri(inner, a, d, c);
    }
  }
  const last = centre.length - 1;
  for (let j = 0; j < sides; j++) {
    const j2 = (j + 1) % sides;
    // start end faces back along the tube, the far end forward
    tri(all, outer[0][j], outer[0][j2], bore[0][j2]);
    tri(all, outer[0][j], bore[0][j2], bore[0][j]);
    tri(all, outer[last][j], bore[last][j2], outer[last][j2]);
    tri(all, outer[last][j], bore[last][j], bore[last][j2]);
  }
  return { all, inner };
}

/** Flat list of triangles (nine coordinates each) → binary STL bytes. */
export function binaryStl(triangles: number[], header = "Coatwright demo mesh"): Uint8Array {
  const count = triangles.length / 9;
  const bytes = new Uint8Array(84 + 50 * count);
  const view = new DataView(bytes.buffer);
  bytes.set(new TextEncoder().encode(header.slice(0, 80)));
  view.setUint32(80, count, true);
  for (let t = 0; t < count; t++) {
    const o = 84 + 50 * t;
    // The normal is left zero: readers recompute it from the winding.
    for (let k = 0; k < 9; k++) view.setFloat32(o + 12 + 4 * k, triangles[9 * t + k], true);
  }
  return bytes;
}

const STEEL = DENSITY_KG_PER_M3.steel;

type PartSeed = Omit<Insertable<PartsTable>, "id" | "created_at" | "updated_at" | "archived"> & { archived?: number };

function templatePart(base: Omit<PartSeed, "area_m2" | "inside_area_m2" | "length_mm" | "width_mm" | "height_mm" | "mass_kg" | "area_origin" | "density_kg_per_m3">, templateId: string, dims: Record<string, number>, box?: Vec3): PartSeed {
  const m = measureTemplate(templateId, dims);
  return {
    ...base,
    density_kg_per_m3: STEEL,
    area_origin: "template",
    template_id: templateId,
    dimensions_json: JSON.stringify(dims),
    area_m2: m.outsideAreaM2,
    inside_area_m2: m.insideAreaM2,
    mass_kg: massFromVolumeKg(m.volumeM3, "steel"),
    mass_origin: "volume",
    length_mm: box?.[0] ?? m.bboxMm.x,
    width_mm: box?.[1] ?? m.bboxMm.y,
    height_mm: box?.[2] ?? m.bboxMm.z,
  };
}

function benchFrame(): PartSeed {
  // Two welded end frames and two rails of 50 × 30 × 2 mm tube, 6.4 m of tube in all.
  const dims = { Ltube: 6400, W: 50, H: 30, t: 2 };
  const formula = "2*(W + H)*Ltube";
  const areaM2 = evaluateAreaFormula(formula, dims);
  const insideAreaM2 = evaluateAreaFormula("2*(W - 2*t + H - 2*t)*Ltube", dims);
  return {
    number: "BC-1042",
    name: "Park bench frame, 1.8 m",
    customer: "Ashgrove Parks Department",
    material: "steel",
    density_kg_per_m3: STEEL,
    thickness_mm: 2,
    // thin-walled tube: half the whole surface × wall × density
    mass_kg: plateMassKg((areaM2 + insideAreaM2) / 2, 2, "steel"),
    mass_origin: "sheet",
    area_m2: areaM2,
    inside_area_m2: insideAreaM2,
    masked_area_m2: 0.004,
    area_origin: "formula",
    formula,
    dimensions_json: JSON.stringify(dims),
    length_mm: 1800,
    width_mm: 620,
    height_mm: 780,
    notes: "Mask the four M10 foot-plate holes (plugs). Hang from the top rail, seat side down.",
  };
}

/** Writes the hoop's STL to the data folder and returns its mesh row, or null when it cannot. */
function hoopMesh(nowS: number): { mesh: Insertable<MeshesTable>; insideAreaM2: number } | null {
  const { all, inner } = hoopTriangles({ outsideDiameterMm: 48.3, wallMm: 3.2, legMm: 650, bendRadiusMm: 300, arcSegments: 36, sides: 32 });
  const bytes = binaryStl(all, "Bramblecote BC-5020 bike-rack hoop (demo)");
  const m = measureStlBuffer(bytes, "mm");
  const boreM2 = measureStlBuffer(binaryStl(inner), "mm").areaM2;
  const id = randomUUID();
  const storedName = `${id}.stl`;
  try {
    const dir = path.join(path.dirname(databasePath()), "meshes");
    fs.mkdirSync(dir, { recursive: true });
    fs.writeFileSync(path.join(dir, storedName), bytes);
  } catch {
    return null; // a read-only data folder: the hoop falls back to its template
  }
  return {
    mesh: {
      id,
      file_name: "bc-5020-hoop.stl",
      stored_name: storedName,
      unit: "mm",
      size_bytes: bytes.length,
      format: m.format,
      triangle_count: m.triangleCount,
      area_m2: m.areaM2,
      volume_m3: m.volumeM3,
      bbox_x_mm: m.bboxMm.x,
      bbox_y_mm: m.bboxMm.y,
      bbox_z_mm: m.bboxMm.z,
      closed: m.closed ? 1 : 0,
      created_by: null,
      created_at: nowS,
    },
    insideAreaM2: boreM2,
  };
}

export async function seedParts(db: Db, nowS = Math.floor(Date.now() / 1000)): Promise<void> {
  const hoopBase = {
    number: "BC-5020",
    name: "Bike-rack hoop, 48.3 mm tube",
    customer: "Cyclewise Streetscape",
    material: "steel" as const,
    thickness_mm: 3.2,
    masked_area_m2: 0,
    notes: "Vent holes drilled at both feet so e-coat drains from the bore. Hang two per hook by the bend.",
  };
  const hoop = hoopMesh(nowS);
  let hoopPart: PartSeed;
  if (hoop) {
    await db.insertInto("meshes").values(hoop.mesh).execute();
    hoopPart = {
      ...hoopBase,
      density_kg_per_m3: STEEL,
      mass_kg: massFromVolumeKg(hoop.mesh.volume_m3, "steel"),
      mass_origin: "volume",
      area_m2: hoop.mesh.area_m2 - hoop.insideAreaM2,
      inside_area_m2: hoop.insideAreaM2,
      area_origin: "mesh",
      length_mm: hoop.mesh.bbox_x_mm,
      width_mm: hoop.mesh.bbox_y_mm,
      height_mm: hoop.mesh.bbox_z_mm,
      mesh_id: hoop.mesh.id,
    };
  } else {
    // centreline: two 650 mm legs and a half circle of radius 300 mm
    hoopPart = templatePart(hoopBase, "round-tube", { lengthMm: 1300 + Math.PI * 300, outsideDiameterMm: 48.3, wallMm: 3.2 }, [648.3, 48.3, 974.15]);
  }

  const parts: PartSeed[] = [
    benchFrame(),
    templatePart(
      {
        number: "BC-1043",
        name: "Bench seat bracket",
        customer: "Ashgrove Parks Department",
        material: "steel",
        thickness_mm: 6,
        masked_area_m2: 0,
        notes: "Laser-cut 6 mm plate. Hang through the 14 mm hole.",
      },
      "flat-plate",
      { lengthMm: 150, widthMm: 80, thicknessMm: 6 },
    ),
    templatePart(
      {
        number: "BC-2210",
        name: "Trailer fender, 13 in wheel",
        customer: "Tollbridge Trailers",
        material: "steel",
        thickness_mm: 2,
        masked_area_m2: 0.0015,
        notes: "Developed blank 1100 × 320 mm, rolled to a 380 mm radius; the box is the rolled shape. Mask the two stud bosses.",
      },
      "flat-plate",
      { lengthMm: 1100, widthMm: 320, thicknessMm: 2 },
      [760, 320, 340],
    ),
    {
      number: "BC-3300",
      name: "Fence panel, 2.0 × 1.2 m",
      customer: "Hedgerow Fencing Co.",
      material: "steel",
      density_kg_per_m3: STEEL,
      thickness_mm: 2,
      mass_kg: 34.2,
      mass_origin: "entered",
      // from the customer's drawing: 40 × 40 × 2 frame and 19 pickets of 12 mm bar
      area_m2: 1.85,
      inside_area_m2: 0,
      masked_area_m2: 0,
      area_origin: "manual",
      length_mm: 2000,
      width_mm: 40,
      height_mm: 1200,
      notes: "Area from the customer's drawing; mass weighed on the first article.",
    },
    templatePart(
      {
        number: "BC-4105",
        name: "Planter box, 800 mm",
        customer: "Millbrook Garden Supply",
        material: "steel",
        thickness_mm: 2,
        masked_area_m2: 0,
        notes: "Powder on the outside and rim only; the inside takes e-coat alone (soil side).",
      },
      "open-box",
      { lengthMm: 800, widthMm: 400, heightMm: 450, wallMm: 2 },
    ),
    hoopPart,
    {
      ...templatePart(
        {
          number: "BC-2199",
          name: "Trailer fender, 12 in wheel (superseded)",
          customer: "Tollbridge Trailers",
          material: "steel",
          thickness_mm: 2,
          masked_area_m2: 0,
          notes: "Replaced by BC-2210.",
        },
        "flat-plate",
        { lengthMm: 1000, widthMm: 300, thicknessMm: 2 },
        [700, 300, 300],
      ),
      archived: 1,
    },
  ];
  await db
    .insertInto("parts")
    .values(parts.map((p) => ({ ...p, archived: p.archived ?? 0, id: randomUUID(), created_at: nowS, updated_at: nowS })))
    .execute();
}
