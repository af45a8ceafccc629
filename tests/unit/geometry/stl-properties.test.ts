/** Invariants of the STL measurer, checked with fast-check. */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { createStlMeasurer, measureStlBuffer, type StlMeasurement } from "@/lib/geometry/stl-measure";
import {
  boxMesh,
  cylinderMesh,
  icosahedronMesh,
  mapVertices,
  type Mesh,
  toAsciiStl,
  toBinaryStl,
  toFloat32Mesh,
  torusMesh,
} from "./stl-fixtures";

// Closed test solids, stored as float32 so that the reference coordinates are the stored ones.
const SOLIDS: Array<[string, Mesh]> = [
  ["box", boxMesh(10, 20, 40)],
  ["cylinder", cylinderMesh(15, 30, 24)],
  ["icosahedron", icosahedronMesh(8)],
  ["torus", torusMesh(30, 8, 24, 12)],
].map(([name, mesh]) => [name as string, toFloat32Mesh(mesh as Mesh)]);

const solid = fc.constantFrom(...SOLIDS);
const format = fc.constantFrom("binary", "ascii");

function measure(mesh: Mesh, kind: string): StlMeasurement {
  return measureStlBuffer(kind === "binary" ? toBinaryStl(mesh) : toAsciiStl(mesh), "mm");
}

function relClose(actual: number, expected: number, rel: number): boolean {
  return Math.abs(actual - expected) <= rel * Math.abs(expected);
}

/** Rotation by a unit quaternion (w, x, y, z). */
function rotate([w, x, y, z]: number[]): (p: [number, number, number]) => [number, number, number] {
  return ([px, py, pz]) => {
    // source: standard quaternion rotation matrix (from memory)
    return [
      (1 - 2 * (y * y + z * z)) * px + 2 * (x * y - w * z) * py + 2 * (x * z + w * y) * pz,
      2 * (x * y + w * z) * px + (1 - 2 * (x * x + z * z)) * py + 2 * (y * z - w * x) * pz,
      2 * (x * z - w * y) * px + 2 * (y * z + w * x) * py + (1 - 2 * (x * x + y * y)) * pz,
    ];
  };
}

const unitQuaternion = fc
  .tuple(fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }))
  .filter((q) => Math.hypot(...q) > 0.1)
  .map((q) => {
    const n = Math.hypot(...q);
    return q.map((c) => c / n);
  });

const offset = fc.double({ min: -500, max: 500, noNaN: true });

describe("rigid motions change neither area nor volume", () => {
  it("rotation + translation", () => {
    fc.assert(
      fc.property(solid, format, unitQuaternion, offset, offset, offset, ([, mesh], kind, q, tx, ty, tz) => {
        const before = measure(mesh, kind);
        const turn = rotate(q);
        const moved = mapVertices(mesh, (p) => {
          const [x, y, z] = turn(p);
          return [x + tx, y + ty, z + tz];
        });
        const after = measure(moved, kind);
        // the moved mesh is rounded to float32 again: relative error ~1e-7 x (offset / size)
        expect(relClose(after.areaM2, before.areaM2, 2e-5)).toBe(true);
        expect(relClose(after.volumeM3, before.volumeM3, 2e-5)).toBe(true);
        expect(after.triangleCount).toBe(before.triangleCount);
      }),
      { numRuns: 60 },
    );
  });

  it("pure translation keeps the bounding box", () => {
    fc.assert(
      fc.property(solid, offset, offset, offset, ([, mesh], tx, ty, tz) => {
        const before = measure(mesh, "binary");
        const after = measure(mapVertices(mesh, ([x, y, z]) => [x + tx, y + ty, z + tz]), "binary");
        expect(Math.abs(after.bboxMm.x - before.bboxMm.x)).toBeLessThan(1e-3);
        expect(Math.abs(after.bboxMm.y - before.bboxMm.y)).toBeLessThan(1e-3);
        expect(Math.abs(after.bboxMm.z - before.bboxMm.z)).toBeLessThan(1e-3);
      }),
      { numRuns: 40 },
    );
  });
});

describe("scaling by k multiplies area by k² and volume by k³", () => {
  it("uniform scale", () => {
    fc.assert(
      fc.property(solid, format, fc.double({ min: 0.05, max: 20, noNaN: true }), ([, mesh], kind, k) => {
        const before = measure(mesh, kind);
        const after = measure(mapVertices(mesh, ([x, y, z]) => [k * x, k * y, k * z]), kind);
        expect(relClose(after.areaM2, k * k * before.areaM2, 1e-6)).toBe(true);
        expect(relClose(after.volumeM3, k * k * k * before.volumeM3, 1e-6)).toBe(true);
        expect(relClose(after.bboxMm.x, k * before.bboxMm.x, 1e-6)).toBe(true);
      }),
      { numRuns: 60 },
    );
  });

  it("reading a file as inches instead of mm scales area by 25.4² and volume by 25.4³", () => {
    // source: 1 in = 25.4 mm exactly (NIST SP 811)
    fc.assert(
      fc.property(solid, format, ([, mesh], kind) => {
        const bytes = kind === "binary" ? toBinaryStl(mesh) : toAsciiStl(mesh);
        const mm = measureStlBuffer(bytes, "mm");
        const inch = measureStlBuffer(bytes, "in");
        expect(relClose(inch.areaM2, 25.4 ** 2 * mm.areaM2, 1e-12)).toBe(true);
        expect(relClose(inch.volumeM3, 25.4 ** 3 * mm.volumeM3, 1e-12)).toBe(true);
        expect(relClose(inch.bboxMm.z, 25.4 * mm.bboxMm.z, 1e-12)).toBe(true);
      }),
    );
  });
});

describe("chunk boundaries do not matter", () => {
  const files: Array<[string, Uint8Array]> = [
    ["binary", toBinaryStl(SOLIDS[3][1])],
    ["binary with a 'solid' header", toBinaryStl(SOLIDS[1][1], { header: "solid from a CAD export" })],
    ["ascii", toAsciiStl(SOLIDS[2][1])],
    ["ascii with CRLF and %e numbers", toAsciiStl(SOLIDS[0][1], { eol: "\r\n", number: (v) => v.toExponential(8) })],
  ];

  it.each(files)("%s: random chunk sizes give identical results", (_name, bytes) => {
    const whole = measureStlBuffer(bytes, "mm");
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 1, max: 400 }), { minLength: 1, maxLength: 50 }), fc.boolean(), (sizes, tellLength) => {
        const m = createStlMeasurer({ unit: "mm", totalBytes: tellLength ? bytes.length : undefined });
        let at = 0;
        for (let i = 0; at < bytes.length; i++) {
          const size = sizes[i % sizes.length];
          m.push(bytes.subarray(at, at + size));
          at += size;
        }
        expect(m.finish()).toEqual(whole);
      }),
      { numRuns: 40 },
    );
  });

  it("one byte at a time", () => {
    for (const [, bytes] of files) {
      const m = createStlMeasurer({ unit: "mm" });
      for (let i = 0; i < bytes.length; i++) m.push(bytes.subarray(i, i + 1));
      expect(m.finish()).toEqual(measureStlBuffer(bytes, "mm"));
    }
  });

  it("the caller may reuse its buffer between pushes", () => {
    const bytes = files[2][1];
    const m = createStlMeasurer({ unit: "mm" });
    const scratch = new Uint8Array(97);
    for (let at = 0; at < bytes.length; at += scratch.length) {
      const piece = bytes.subarray(at, at + scratch.length);
      scratch.set(piece);
      m.push(scratch.subarray(0, piece.length));
      scratch.fill(0x41);
    }
    expect(m.finish()).toEqual(measureStlBuffer(bytes, "mm"));
  });
});
