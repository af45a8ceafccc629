import fc from "fast-check";
import * as THREE from "three";
import { describe, expect, it } from "vitest";
import {
  fillSummary,
  groupBySize,
  instanceMatrices,
  orientationMatrix,
  orientedGeometry,
  triangleCount,
  unitBoxGeometry,
  type Vec3Mm,
} from "@/components/three/rack-geometry";

const apply = (m: THREE.Matrix4, v: Vec3Mm) => new THREE.Vector3(...v).applyMatrix4(m).toArray().map((x) => x + 0);

/** Signed volume of a closed triangle mesh: Σ v0 · (v1 × v2) / 6 (divergence theorem; positive
 *  when the triangles wind counter-clockwise seen from outside). A reflection flips its sign. */
function signedVolume(g: THREE.BufferGeometry): number {
  const p = g.getAttribute("position");
  let sum = 0;
  for (let i = 0; i < p.count; i += 3) {
    const a = new THREE.Vector3().fromBufferAttribute(p, i);
    const b = new THREE.Vector3().fromBufferAttribute(p, i + 1);
    const c = new THREE.Vector3().fromBufferAttribute(p, i + 2);
    sum += a.dot(b.clone().cross(c));
  }
  return sum / 6;
}

/** A right-angled tetrahedron with legs 30 (x), 20 (y), 10 (z), faces wound outwards:
 *  volume = 30·20·10 / 6 = 1000 mm³ (hand working). Asymmetric, so a mirror image differs. */
function tetra(): THREE.BufferGeometry {
  const o = [0, 0, 0], x = [30, 0, 0], y = [0, 20, 0], z = [0, 0, 10];
  const tris = [o, y, x, o, x, z, o, z, y, x, y, z].flat();
  const g = new THREE.BufferGeometry();
  g.setAttribute("position", new THREE.Float32BufferAttribute(tris, 3));
  return g;
}

describe("turning a part's mesh into a placement", () => {
  it("as drawn upright: CAD x along travel, CAD z up, CAD y towards the front", () => {
    // Hand working, right-hand rule: the turn about x that brings +z up to +y takes +y to −z.
    const m = orientationMatrix([300, 200, 100], [300, 100, 200]);
    expect(apply(m, [1, 0, 0])).toEqual([1, 0, 0]);
    expect(apply(m, [0, 0, 1])).toEqual([0, 1, 0]);
    expect(apply(m, [0, 1, 0])).toEqual([0, 0, -1]);
  });

  it("every orientation is a turn (determinant +1) that lays the part's sides along the sizes", () => {
    const side = fc.integer({ min: 1, max: 5000 });
    fc.assert(
      fc.property(fc.tuple(side, side, side), fc.constantFrom([0, 1, 2], [0, 2, 1], [1, 0, 2], [1, 2, 0], [2, 0, 1], [2, 1, 0]), (dims, p) => {
        const size: Vec3Mm = [dims[p[0]], dims[p[1]], dims[p[2]]];
        const m = orientationMatrix(dims, size);
        expect(m.determinant()).toBe(1);
        const laid = apply(m, dims).map(Math.abs);
        expect(laid).toEqual(size);
      }),
    );
  });

  it.each([
    [[30, 20, 10], "as drawn"],
    [[20, 10, 30], "length across"],
    [[10, 30, 20], "lying"],
    [[30, 10, 20], "upright, odd axis swap"],
  ] as [Vec3Mm, string][])("a tetrahedron laid %j (%s) fills its box and keeps its handedness", (size) => {
    const g = orientedGeometry(tetra(), size);
    const box = g.boundingBox!;
    expect(box.min.toArray()).toEqual([0, 0, 0]);
    expect(box.max.toArray().map((v) => Math.round(v * 1e6) / 1e6)).toEqual(size);
    // 1000 mm³ before and after: a mirror image would measure −1000.
    expect(signedVolume(g)).toBeCloseTo(1000, 6);
  });
});

describe("instancing", () => {
  it("groups placements by size (one draw per orientation) in plan order", () => {
    const groups = groupBySize([
      { minMm: [0, 0, 0], sizeMm: [200, 300, 100] },
      { minMm: [0, 300, 0], sizeMm: [300, 200, 100] },
      { minMm: [200, 0, 0], sizeMm: [200, 300, 100] },
    ]);
    expect(groups).toEqual([
      { sizeMm: [200, 300, 100], indices: [0, 2] },
      { sizeMm: [300, 200, 100], indices: [1] },
    ]);
  });

  it("writes column-major matrices: scale on the diagonal, translation in elements 12–14", () => {
    // three.js Matrix4.elements are column-major (three.js docs, Matrix4).
    const placements = [{ minMm: [250, 350, 0] as Vec3Mm, sizeMm: [200, 300, 100] as Vec3Mm }];
    const boxes = instanceMatrices(placements, [0], { scaleToSize: true });
    expect(Array.from(boxes)).toEqual([200, 0, 0, 0, 0, 300, 0, 0, 0, 0, 100, 0, 250, 350, 0, 1]);
    // The clearance envelope: grown by 25 mm (half a 50 mm clearance) on every side.
    const grown = instanceMatrices(placements, [0], { scaleToSize: true, growMm: 25 });
    expect(Array.from(grown)).toEqual([250, 0, 0, 0, 0, 350, 0, 0, 0, 0, 150, 0, 225, 325, -25, 1]);
    const mesh = instanceMatrices(placements, [0], { scaleToSize: false });
    expect(Array.from(mesh.subarray(12))).toEqual([250, 350, 0, 1]);
    expect(new THREE.Matrix4().fromArray(boxes).determinant()).toBe(200 * 300 * 100);
  });

  it("counts triangles: a box has 12; raw positions have 9 floats per triangle", () => {
    expect(triangleCount(unitBoxGeometry())).toBe(12);
    expect(triangleCount(new Float32Array(9 * 5))).toBe(5);
  });
});

describe("summary", () => {
  it("15 parts of 200 × 300 × 100 mm and 1.5 kg in a 1000 × 1000 × 100 mm window", () => {
    // Hand working: 15 × 6,000,000 mm³ / 100,000,000 mm³ = 90 %; 15 × 1.5 kg = 22.5 kg.
    const placements = Array.from({ length: 15 }, (_, i) => ({
      minMm: [(i % 5) * 200, Math.floor(i / 5) * 300, 0] as Vec3Mm,
      sizeMm: [200, 300, 100] as Vec3Mm,
    }));
    const s = fillSummary(placements, 1.5, { widthMm: 1000, heightMm: 1000, depthMm: 100 });
    expect(s.count).toBe(15);
    expect(s.totalKg).toBeCloseTo(22.5, 12);
    expect(s.fillPercent).toBeCloseTo(90, 12);
  });
});
