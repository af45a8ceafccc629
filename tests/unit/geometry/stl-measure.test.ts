import { describe, expect, it } from "vitest";
import { GeometryError } from "@/lib/geometry/errors";
import { createStlMeasurer, measureStlBuffer, type StlMeasurement } from "@/lib/geometry/stl-measure";
import {
  boxMesh,
  concatMeshes,
  cylinderMesh,
  flipMesh,
  icosahedronMesh,
  mapVertices,
  type Mesh,
  textBytes,
  toAsciiStl,
  toBinaryStl,
  uvSphereMesh,
} from "./stl-fixtures";

const MM2 = 1e-6; // m² per mm² (SI prefix)
const MM3 = 1e-9; // m³ per mm³ (SI prefix)

function relClose(actual: number, expected: number, rel: number): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(rel * Math.abs(expected));
}

function thrown(fn: () => unknown): GeometryError {
  try {
    fn();
  } catch (error) {
    expect(error).toBeInstanceOf(GeometryError);
    return error as GeometryError;
  }
  throw new Error("expected a GeometryError");
}

function both(mesh: Mesh, unit: "mm" | "in" = "mm"): [StlMeasurement, StlMeasurement] {
  return [measureStlBuffer(toBinaryStl(mesh), unit), measureStlBuffer(toAsciiStl(mesh), unit)];
}

describe("boxes (exact: coordinates are exact in float32)", () => {
  // source: elementary geometry, box area 2(ab + bc + ca), volume abc; the 10 x 20 x 40 case
  // is also @jscad/modeling's own measureArea test (2800)
  it.each([
    { x: 10, y: 20, z: 40, unit: "mm" as const, areaM2: 2800 * MM2, volumeM3: 8000 * MM3, bbox: [10, 20, 40] },
    { x: 0.5, y: 0.25, z: 0.125, unit: "mm" as const, areaM2: 0.4375 * MM2, volumeM3: 0.015625 * MM3, bbox: [0.5, 0.25, 0.125] },
    // 1 x 2 x 3 in: area 22 in², volume 6 in³; 1 in = 25.4 mm exactly (NIST SP 811):
    // 22 x 0.00064516 m² = 0.01419352 m²; 6 x 1.6387064e-5 m³ = 9.8322384e-5 m³
    { x: 1, y: 2, z: 3, unit: "in" as const, areaM2: 0.01419352, volumeM3: 9.8322384e-5, bbox: [25.4, 50.8, 76.2] },
  ])("$x x $y x $z $unit", ({ x, y, z, unit, areaM2, volumeM3, bbox }) => {
    for (const r of both(boxMesh(x, y, z), unit)) {
      expect(r.triangleCount).toBe(12);
      relClose(r.areaM2, areaM2, 1e-12);
      relClose(r.volumeM3, volumeM3, 1e-12);
      relClose(r.bboxMm.x, bbox[0], 1e-12);
      relClose(r.bboxMm.y, bbox[1], 1e-12);
      relClose(r.bboxMm.z, bbox[2], 1e-12);
      expect(r.closed).toBe(true);
    }
  });

  it("reports the absolute volume when the winding is inside out", () => {
    const [r] = both(flipMesh(boxMesh(10, 20, 40)));
    relClose(r.volumeM3, 8000 * MM3, 1e-12);
  });
});

describe("regular polyhedra (closed-form area and volume)", () => {
  // source: regular octahedron with vertices (±r,0,0),(0,±r,0),(0,0,±r): edge r√2,
  // area 2√3 a² = 4√3 r², volume (√2/3) a³ = 4/3 r³ (standard formulas, from memory)
  it("octahedron r = 10 mm", () => {
    const r = 10;
    const v = [[r, 0, 0], [0, r, 0], [-r, 0, 0], [0, -r, 0]];
    const mesh: Mesh = [];
    for (let i = 0; i < 4; i++) {
      const a = v[i], b = v[(i + 1) % 4];
      mesh.push(...a, ...b, 0, 0, r, ...b, ...a, 0, 0, -r);
    }
    for (const m of both(mesh)) {
      relClose(m.areaM2, 4 * Math.sqrt(3) * r * r * MM2, 1e-12);
      relClose(m.volumeM3, (4 / 3) * r ** 3 * MM3, 1e-12);
      expect(m.closed).toBe(true);
      expect(m.triangleCount).toBe(8);
    }
  });

  // source: regular icosahedron of edge a: area 5√3 a², volume (5/12)(3 + √5) a³
  // (standard formulas, from memory); here a = 2 (vertices (0, ±1, ±φ) and cyclic)
  it("icosahedron edge 2 mm", () => {
    const a = 2;
    for (const m of both(icosahedronMesh(1))) {
      // float32 coordinates of φ carry ~6e-8 relative error
      relClose(m.areaM2, 5 * Math.sqrt(3) * a * a * MM2, 1e-6);
      relClose(m.volumeM3, (5 / 12) * (3 + Math.sqrt(5)) * a ** 3 * MM3, 1e-6);
      expect(m.closed).toBe(true);
      expect(m.triangleCount).toBe(20);
    }
  });
});

describe("cylinders: regular n-gon prisms", () => {
  // hand working: a regular n-gon of circumradius r has area (n/2) r² sin(2π/n) and sides
  // 2 r sin(π/n); the prism of height h adds n · 2 r sin(π/n) · h of side area.
  it.each([
    // n = 4, r = 1, h = 1: square caps of area 2, sides 4 · √2 → 4 + 4√2; volume 2
    { n: 4, r: 1, h: 1, area: 4 + 4 * Math.SQRT2, volume: 2 },
    // n = 6, r = 10, h = 5: caps 2 · 150√3, sides 6 · 10 · 5 = 300; volume 150√3 · 5
    { n: 6, r: 10, h: 5, area: 300 * Math.sqrt(3) + 300, volume: 750 * Math.sqrt(3) },
  ])("n = $n, r = $r, h = $h", ({ n, r, h, area, volume }) => {
    for (const m of both(cylinderMesh(r, h, n))) {
      relClose(m.areaM2, area * MM2, 1e-6);
      relClose(m.volumeM3, volume * MM3, 1e-6);
      expect(m.closed).toBe(true);
      expect(m.triangleCount).toBe(4 * n);
    }
  });

  it("a fine prism approaches the circular cylinder within the tessellation error", () => {
    // source: circle area πr² vs inscribed n-gon (n/2) r² sin(2π/n): relative shortfall
    // 1 - sin(x)/x <= x²/6 with x = 2π/n; side 2πr vs n · 2r sin(π/n): shortfall <= (π/n)²/6
    const n = 360, r = 50, h = 100;
    const m = measureStlBuffer(toBinaryStl(cylinderMesh(r, h, n)), "mm");
    const x = (2 * Math.PI) / n;
    const exactArea = 2 * Math.PI * r * r + 2 * Math.PI * r * h;
    const exactVolume = Math.PI * r * r * h;
    expect(m.areaM2).toBeLessThan(exactArea * MM2);
    expect(m.areaM2).toBeGreaterThan(exactArea * MM2 * (1 - (x * x) / 6) * (1 - 1e-6));
    expect(m.volumeM3).toBeLessThan(exactVolume * MM3);
    expect(m.volumeM3).toBeGreaterThan(exactVolume * MM3 * (1 - (x * x) / 6) * (1 - 1e-6));
    relClose(m.bboxMm.z, h, 1e-7);
  });
});

describe("UV sphere: bounded by the circumscribed and inscribed spheres", () => {
  it("r = 10 mm, 40 stacks x 80 slices", () => {
    const R = 10;
    const mesh = uvSphereMesh(R, 40, 80);
    // Every face plane is at least rIn from the centre, so the convex polyhedron holds the ball
    // of radius rIn and lies in the ball of radius R: 4πrIn² < area < 4πR², same for volume
    // (surface area is monotone under inclusion of convex bodies).
    let rIn = Infinity;
    for (let t = 0; t < mesh.length; t += 9) {
      const [ax, ay, az, bx, by, bz, cx, cy, cz] = mesh.slice(t, t + 9);
      const ux = bx - ax, uy = by - ay, uz = bz - az, vx = cx - ax, vy = cy - ay, vz = cz - az;
      const nx = uy * vz - uz * vy, ny = uz * vx - ux * vz, nz = ux * vy - uy * vx;
      const len = Math.hypot(nx, ny, nz);
      if (len > 0) rIn = Math.min(rIn, Math.abs(nx * ax + ny * ay + nz * az) / len);
    }
    expect(rIn).toBeGreaterThan(9.9);
    for (const m of both(mesh)) {
      const slack = 1 + 1e-6; // float32 rounding of the vertices
      expect(m.areaM2).toBeLessThan(4 * Math.PI * R * R * MM2 * slack);
      expect(m.areaM2).toBeGreaterThan((4 * Math.PI * rIn * rIn * MM2) / slack);
      expect(m.volumeM3).toBeLessThan((4 / 3) * Math.PI * R ** 3 * MM3 * slack);
      expect(m.volumeM3).toBeGreaterThan(((4 / 3) * Math.PI * rIn ** 3 * MM3) / slack);
      expect(m.closed).toBe(true);
    }
  });
});

describe("binary and ASCII of one mesh", () => {
  it.each([
    ["box", boxMesh(3, 7, 11)],
    ["cylinder", cylinderMesh(12.5, 40, 48)],
    ["sphere", uvSphereMesh(33, 12, 24)],
    ["icosahedron moved off the origin", mapVertices(icosahedronMesh(5), ([x, y, z]) => [x + 1000, y - 250, z + 0.5])],
  ])("%s: identical results", (_name, mesh) => {
    const [binary, ascii] = both(mesh);
    expect(binary.format).toBe("binary");
    expect(ascii.format).toBe("ascii");
    expect({ ...ascii, format: "binary" }).toEqual(binary);
  });

  it("ASCII variants: CRLF, tabs, capitals, byte-order mark, %e numbers, two solids", () => {
    const box = boxMesh(10, 20, 40);
    const plain = measureStlBuffer(toAsciiStl(box), "mm");
    const crlf = measureStlBuffer(toAsciiStl(box, { eol: "\r\n", indent: "\t" }), "mm");
    expect(crlf).toEqual(plain);
    const upper = new TextDecoder().decode(toAsciiStl(box)).toUpperCase();
    expect(measureStlBuffer(textBytes(`\uFEFF${upper}`), "mm")).toEqual(plain);
    const exp = measureStlBuffer(toAsciiStl(box, { number: (v) => v.toExponential(6) }), "mm");
    expect(exp).toEqual(plain);
    const two = textBytes(
      new TextDecoder().decode(toAsciiStl(box)) +
        new TextDecoder().decode(toAsciiStl(mapVertices(box, ([x, y, z]) => [x + 100, y, z]))),
    );
    const twoResult = measureStlBuffer(two, "mm");
    expect(twoResult.triangleCount).toBe(24);
    relClose(twoResult.areaM2, 2 * 2800 * MM2, 1e-12);
    relClose(twoResult.volumeM3, 2 * 8000 * MM3, 1e-12);
    expect(twoResult.closed).toBe(true);
  });
});

describe("format detection", () => {
  const mesh = cylinderMesh(10, 30, 16);

  it("a binary file whose header begins with 'solid' is binary (length = 84 + 50 n)", () => {
    const bytes = toBinaryStl(mesh, { header: "solid exported by a CAD tool" });
    const expected = measureStlBuffer(toBinaryStl(mesh), "mm");
    expect(measureStlBuffer(bytes, "mm")).toEqual(expected);
    // streamed without knowing the length, in small pieces
    const m = createStlMeasurer({ unit: "mm" });
    for (let i = 0; i < bytes.length; i += 13) m.push(bytes.subarray(i, i + 13));
    expect(m.finish()).toEqual(expected);
  });

  it("a 'solid' header padded with spaces and a count of printable bytes still reads as binary when streamed", () => {
    // header "solid" + spaces, count bytes all non-zero but the data holds NUL bytes (0.0 coordinates)
    const bytes = toBinaryStl(boxMesh(1, 1, 1), { header: "solid".padEnd(80, " ") });
    const m = createStlMeasurer({ unit: "mm" });
    m.push(bytes);
    expect(m.finish().format).toBe("binary");
  });
});

describe("closed check", () => {
  const box = boxMesh(10, 20, 40);

  it.each([
    ["a box", box, true],
    ["two separate boxes", concatMeshes(box, mapVertices(box, ([x, y, z]) => [x + 50, y, z])), true],
    ["a box with one triangle missing", box.slice(9), false],
    ["a box with one triangle repeated (its edges used three times)", concatMeshes(box, box.slice(0, 9)), false],
    ["two boxes touching along one edge (used four times)", concatMeshes(box, mapVertices(box, ([x, y, z]) => [x + 10, y + 20, z])), false],
    ["a single triangle", [0, 0, 0, 1, 0, 0, 0, 1, 0], false],
  ])("%s → closed = %s", (_name, mesh, closed) => {
    const [binary, ascii] = both(mesh as Mesh);
    expect(binary.closed).toBe(closed);
    expect(ascii.closed).toBe(closed);
  });

  it("-0 and +0 weld: a box whose zero coordinates are written as -0 in some triangles", () => {
    const mixed = box.map((v, i) => (v === 0 && Math.floor(i / 9) % 2 === 0 ? -0 : v));
    const binary = measureStlBuffer(toBinaryStl(mixed), "mm");
    // String(-0) is "0": write the sign explicitly, as C's printf does
    const asciiBytes = toAsciiStl(mixed, { number: (v) => (Object.is(v, -0) ? "-0" : String(Math.fround(v))) });
    expect(new TextDecoder().decode(asciiBytes)).toContain(" -0 ");
    const ascii = measureStlBuffer(asciiBytes, "mm");
    expect(binary.closed).toBe(true);
    expect(ascii.closed).toBe(true);
  });

  it("can be switched off", () => {
    const r = measureStlBuffer(toBinaryStl(box), "mm", { closedCheck: false });
    expect(r.closed).toBeNull();
    relClose(r.areaM2, 2800 * MM2, 1e-12);
  });

  it("a zero-area sliver counts as a triangle, adds no area, and its edges count like any other", () => {
    // corners a, b, b: the collapsed edge (b, b) is skipped; (a, b) is used twice by the sliver
    const away = [100, 0, 0, 110, 0, 0, 110, 0, 0];
    const alone = measureStlBuffer(toBinaryStl(concatMeshes(box, away)), "mm");
    expect(alone.triangleCount).toBe(13);
    relClose(alone.areaM2, 2800 * MM2, 1e-12);
    expect(alone.closed).toBe(true);
    // lying on a box edge, that edge is used four times: not closed
    const onEdge = measureStlBuffer(toBinaryStl(concatMeshes(box, [0, 0, 0, 10, 0, 0, 10, 0, 0])), "mm");
    expect(onEdge.closed).toBe(false);
  });
});

describe("bad input: each gets its own plain error", () => {
  const box = boxMesh(10, 20, 40);
  const boxBinary = toBinaryStl(box);
  const boxText = new TextDecoder().decode(toAsciiStl(box));
  const lines = boxText.split("\n");

  const rows: Array<[string, Uint8Array, string, RegExp]> = [
    ["empty file", new Uint8Array(0), "empty_file", /empty/],
    ["binary cut short", boxBinary.subarray(0, boxBinary.length - 30), "truncated", /12 triangles.*684 bytes.*654 bytes/],
    ["binary with bytes after the last triangle", toBinaryStl(box, { extraBytes: 7 }), "not_stl", /684 bytes.*691 bytes/],
    ["binary that says 0 triangles", toBinaryStl([]), "no_triangles", /no triangles/],
    ["ASCII with no facets", textBytes("solid empty\nendsolid empty\n"), "no_triangles", /no triangles/],
    ["ASCII broken vertex line", textBytes(lines.map((l, i) => (i === 3 ? "      vertex 1 2" : l)).join("\n")), "ascii_syntax", /^Line 4 /],
    ["ASCII broken facet line", textBytes(lines.map((l, i) => (i === 8 ? "  facet normol 0 0 1" : l)).join("\n")), "ascii_syntax", /^Line 9 /],
    ["ASCII with four vertices", textBytes(lines.map((l, i) => (i === 5 ? `${l}\n${l}` : l)).join("\n")), "ascii_syntax", /^Line 7 .*endloop/],
    ["ASCII number with junk", textBytes(lines.map((l, i) => (i === 3 ? "      vertex 1 2 3x" : l)).join("\n")), "ascii_syntax", /^Line 4 /],
    ["ASCII without endsolid", textBytes(lines.slice(0, -2).join("\n")), "ascii_syntax", /endsolid/],
    ["ASCII cut inside a facet", textBytes(lines.slice(0, 5).join("\n")), "ascii_syntax", /middle of a facet/],
    ["ASCII NaN coordinate", textBytes(lines.map((l, i) => (i === 10 ? "      vertex nan 0 0" : l)).join("\n")), "non_finite", /^Line 11 .*not a finite number/],
    ["ASCII infinite coordinate", textBytes(lines.map((l, i) => (i === 4 ? "      vertex 1e999 0 0" : l)).join("\n")), "non_finite", /^Line 5 /],
    ["only zero-area triangles", toBinaryStl([0, 0, 0, 1, 1, 1, 2, 2, 2, 5, 0, 0, 5, 0, 0, 5, 0, 0]), "zero_area", /All 2 triangles.*zero area/],
    ["short junk", textBytes("hello"), "not_stl", /not an STL/],
    ["a longer text that is not STL", textBytes("This is a text file, not a mesh. ".repeat(10)), "not_stl", /not an STL/],
    ["'solid' text that is not STL", textBytes("solid\nsome notes\n"), "ascii_syntax", /^Line 2 /],
  ];
  const cases = rows.map(([name, bytes, code, message]) => ({ name, bytes, code, message }));

  it.each(cases)("$name → $code", ({ bytes, code, message }) => {
    const error = thrown(() => measureStlBuffer(bytes, "mm"));
    expect(error.code).toBe(code);
    expect(error.field).toBe("file");
    expect(error.message).toMatch(message);
    // a plain sentence: starts with a capital, ends with a full stop, no code words
    expect(error.message).toMatch(/^[A-Z].*\.$/s);
    expect(error.message).not.toMatch(/undefined|\[object/);
  });

  it.each(cases)("$name → $code also when streamed in 7-byte pieces", ({ bytes, code }) => {
    const error = thrown(() => {
      const m = createStlMeasurer({ unit: "mm" });
      for (let i = 0; i < bytes.length; i += 7) m.push(bytes.subarray(i, i + 7));
      return m.finish();
    });
    expect(error.code).toBe(code);
  });

  it.each([
    [Number.NaN, "NaN"],
    [Number.POSITIVE_INFINITY, "+Infinity"],
    [Number.NEGATIVE_INFINITY, "-Infinity"],
  ])("binary %s coordinate names the triangle", (value) => {
    const bytes = toBinaryStl(box);
    new DataView(bytes.buffer).setFloat32(84 + 50 * 2 + 12 + 4 * 4, value, true); // triangle 3, vertex b, y
    const error = thrown(() => measureStlBuffer(bytes, "mm"));
    expect(error.code).toBe("non_finite");
    expect(error.message).toMatch(/^Triangle 3 /);
  });

  it("a truncated binary file with a 'solid' header says it is cut short", () => {
    const bytes = toBinaryStl(box, { header: "solid part" }).subarray(0, 500);
    const error = thrown(() => measureStlBuffer(bytes, "mm"));
    expect(error.code).toBe("truncated");
    expect(error.message).toMatch(/684 bytes.*500 bytes/);
    const streamed = thrown(() => {
      const m = createStlMeasurer({ unit: "mm" });
      m.push(bytes);
      return m.finish();
    });
    expect(streamed.code).toBe("truncated");
  });

  it("after an error the measurer keeps failing the same way", () => {
    const m = createStlMeasurer({ unit: "mm" });
    const bad = textBytes(lines.map((l, i) => (i === 9 ? "    outer lop" : l)).join("\n"));
    expect(() => m.push(bad)).toThrow(GeometryError);
    expect(() => m.finish()).toThrow(/^Line 10 /);
  });

  it("refuses an unknown unit", () => {
    const error = thrown(() => createStlMeasurer({ unit: "cm" as "mm" }));
    expect(error.field).toBe("unit");
  });
});
