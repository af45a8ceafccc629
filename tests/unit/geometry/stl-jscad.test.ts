/**
 * Independent reference: @jscad/modeling measures area and volume of its own solids
 * (measurements.measureArea / measureVolume; its tests: a 10 x 20 x 40 cuboid measures 2800).
 * The same solids go through STL (float32) and our measurer.
 */
import jscad from "@jscad/modeling";
import { describe, expect, it } from "vitest";
import { measureStlBuffer } from "@/lib/geometry/stl-measure";
import { type Mesh, toAsciiStl, toBinaryStl } from "./stl-fixtures";

const { primitives, measurements, geometries } = jscad;
type Geom3 = ReturnType<typeof primitives.cuboid>;

/** Fan-triangulates jscad's convex polygons. */
function toMesh(geometry: Geom3): Mesh {
  const mesh: Mesh = [];
  for (const polygon of geometries.geom3.toPolygons(geometry)) {
    const v = polygon.vertices;
    for (let i = 1; i + 1 < v.length; i++) mesh.push(...v[0], ...v[i], ...v[i + 1]);
  }
  return mesh;
}

describe("agrees with @jscad/modeling measurements", () => {
  it("cuboid 10 x 20 x 40 measures 2800 mm² in jscad's own test, and here", () => {
    const cuboid = primitives.cuboid({ size: [10, 20, 40] });
    // source: @jscad/modeling measureArea.test.js, 'measureArea (multiple objects)'
    expect(measurements.measureArea(cuboid)).toBe(2800);
    const r = measureStlBuffer(toBinaryStl(toMesh(cuboid)), "mm");
    expect(r.areaM2 * 1e6).toBeCloseTo(2800, 9);
    expect(r.volumeM3 * 1e9).toBeCloseTo(measurements.measureVolume(cuboid) as number, 9);
    expect(r.closed).toBe(true);
  });

  it.each([
    ["cylinder r 5 h 10, 32 segments", () => primitives.cylinder({ radius: 5, height: 10, segments: 32 })],
    ["elliptic cylinder", () => primitives.cylinderElliptic({ height: 30, startRadius: [10, 6], endRadius: [4, 8], segments: 40 })],
    ["sphere r 8, 24 segments", () => primitives.sphere({ radius: 8, segments: 24 })],
    ["geodesic sphere r 12", () => primitives.geodesicSphere({ radius: 12, frequency: 12 })],
    ["torus", () => primitives.torus({ innerRadius: 4, outerRadius: 20, innerSegments: 24, outerSegments: 48 })],
    ["rounded cuboid", () => primitives.roundedCuboid({ size: [30, 20, 10], roundRadius: 2, segments: 16 })],
    ["ellipsoid off the origin", () => primitives.ellipsoid({ radius: [15, 9, 5], center: [200, -100, 50], segments: 32 })],
  ])("%s", (_name, make) => {
    const solid = make() as Geom3;
    const expectedArea = measurements.measureArea(solid) as number;
    const expectedVolume = measurements.measureVolume(solid) as number;
    const mesh = toMesh(solid);
    for (const bytes of [toBinaryStl(mesh), toAsciiStl(mesh)]) {
      const r = measureStlBuffer(bytes, "mm");
      // STL stores float32: ~6e-8 relative per coordinate
      expect(Math.abs(r.areaM2 * 1e6 - expectedArea)).toBeLessThan(2e-6 * expectedArea);
      expect(Math.abs(r.volumeM3 * 1e9 - expectedVolume)).toBeLessThan(2e-6 * expectedVolume);
      expect(r.triangleCount).toBe(mesh.length / 9);
    }
  });

  it("bounding box matches jscad's measureBoundingBox", () => {
    const solid = primitives.ellipsoid({ radius: [15, 9, 5], center: [200, -100, 50], segments: 32 });
    const [min, max] = measurements.measureBoundingBox(solid) as [number[], number[]];
    const r = measureStlBuffer(toBinaryStl(toMesh(solid)), "mm");
    expect(r.bboxMm.x).toBeCloseTo(max[0] - min[0], 4);
    expect(r.bboxMm.y).toBeCloseTo(max[1] - min[1], 4);
    expect(r.bboxMm.z).toBeCloseTo(max[2] - min[2], 4);
  });
});
