import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { GeometryError } from "@/lib/geometry/errors";
import { massFromVolumeKg } from "@/lib/geometry/mass";
import { measureStlBuffer } from "@/lib/geometry/stl-measure";
import { DIMENSION_TEMPLATES, findTemplate, measureTemplate } from "@/lib/geometry/templates";
import { boxMesh, cylinderMesh, toBinaryStl } from "./stl-fixtures";

const MM2 = 1e-6; // SI prefixes
const MM3 = 1e-9;
const PI = Math.PI;

// Every expected value below is worked by hand in mm² / mm³ (sharp corners; common practice,
// no source beyond elementary geometry), then scaled by the SI prefix.
interface Example {
  id: string;
  dims: Record<string, number>;
  outside: number;
  inside: number;
  edge: number;
  volume: number;
  bbox: number[];
}

describe("hand-worked examples", () => {
  it.each<Example>([
    {
      id: "flat-plate",
      dims: { lengthMm: 1000, widthMm: 500, thicknessMm: 3 },
      // faces 2 x 500,000; edges 2 x (1000 + 500) x 3 = 9,000
      outside: 1_009_000, inside: 0, edge: 9_000, volume: 1_500_000, bbox: [1000, 500, 3],
    },
    {
      id: "rectangular-tube",
      dims: { lengthMm: 1000, widthMm: 50, heightMm: 30, wallMm: 2 },
      // walls 2 x (50 + 30) x 1000 = 160,000; section 50 x 30 - 46 x 26 = 304; ends 608;
      // inside 2 x (46 + 26) x 1000 = 144,000
      outside: 160_608, inside: 144_000, edge: 608, volume: 304_000, bbox: [1000, 50, 30],
    },
    {
      id: "round-tube",
      dims: { lengthMm: 2000, outsideDiameterMm: 60, wallMm: 3 },
      // π x 60 x 2000 = 120,000π; section π/4 (60² - 54²) = 171π; ends 342π; bore π x 54 x 2000
      outside: 120_342 * PI, inside: 108_000 * PI, edge: 342 * PI, volume: 342_000 * PI, bbox: [2000, 60, 60],
    },
    {
      id: "round-bar",
      dims: { lengthMm: 500, diameterMm: 20 },
      // π x 20 x 500 = 10,000π; ends 2 x 100π
      outside: 10_200 * PI, inside: 0, edge: 200 * PI, volume: 50_000 * PI, bbox: [500, 20, 20],
    },
    {
      id: "angle",
      dims: { lengthMm: 1000, legAMm: 50, legBMm: 50, thicknessMm: 5 },
      // faces 50 + 50 + 45 + 45 + 5 + 5 = 200 around; section 5 x 95 = 475; ends 950
      outside: 200_950, inside: 0, edge: 950, volume: 475_000, bbox: [1000, 50, 50],
    },
    {
      id: "channel",
      dims: { lengthMm: 1000, webHeightMm: 100, flangeWidthMm: 50, thicknessMm: 5 },
      // around: back 100, flange outsides 50 + 50, tips 5 + 5, flange insides 45 + 45, inner web 90 = 390
      // section 100 x 5 + 2 x 45 x 5 = 950; ends 1,900
      outside: 391_900, inside: 0, edge: 1_900, volume: 950_000, bbox: [1000, 50, 100],
    },
    {
      id: "closed-cylinder",
      dims: { diameterMm: 600, heightMm: 900, wallMm: 1 },
      // shell π 600 x 900 = 540,000π, ends 2 x 90,000π; inside π 598 x 898 + 2 x π/4 598² = 715,806π;
      // metal π/4 (600² x 900 - 598² x 898) = π/4 x 2,871,608 = 717,902π
      outside: 720_000 * PI, inside: 715_806 * PI, edge: 0, volume: 717_902 * PI, bbox: [600, 600, 900],
    },
    {
      id: "open-box",
      dims: { lengthMm: 400, widthMm: 300, heightMm: 200, wallMm: 2 },
      // bottom 120,000, walls 2 x 700 x 200 = 280,000, rim 120,000 - 396 x 296 = 2,784;
      // inside 117,216 + 2 x 692 x 198 = 391,248; metal 24,000,000 - 117,216 x 198 = 791,232
      // (check: bottom 240,000 + long walls 316,800 + short walls 234,432 = 791,232)
      outside: 402_784, inside: 391_248, edge: 2_784, volume: 791_232, bbox: [400, 300, 200],
    },
  ])("$id", ({ id, dims, outside, inside, edge, volume, bbox }) => {
    const r = measureTemplate(id, dims);
    expect(r.outsideAreaM2).toBeCloseTo(outside * MM2, 12);
    expect(r.insideAreaM2).toBeCloseTo(inside * MM2, 12);
    expect(r.edgeAreaM2).toBeCloseTo(edge * MM2, 12);
    expect(r.volumeM3).toBeCloseTo(volume * MM3, 14);
    expect([r.bboxMm.x, r.bboxMm.y, r.bboxMm.z]).toEqual(bbox);
  });

  it("a 1000 x 500 x 3 steel plate weighs 11.775 kg", () => {
    // 0.0015 m³ x 7850 kg/m³ (density: common handbook value, from memory)
    const plate = measureTemplate("flat-plate", { lengthMm: 1000, widthMm: 500, thicknessMm: 3 });
    expect(massFromVolumeKg(plate.volumeM3, "steel")).toBeCloseTo(11.775, 9);
  });
});

describe("templates agree with the mesh measurer on the same solid", () => {
  it("flat plate = a box mesh", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 2000 }),
        fc.integer({ min: 1, max: 2000 }),
        fc.integer({ min: 1, max: 50 }),
        (L, W, T) => {
          const plate = measureTemplate("flat-plate", { lengthMm: L, widthMm: W, thicknessMm: T });
          const mesh = measureStlBuffer(toBinaryStl(boxMesh(L, W, T)), "mm");
          expect(plate.outsideAreaM2).toBeCloseTo(mesh.areaM2, 12);
          expect(plate.volumeM3).toBeCloseTo(mesh.volumeM3, 15);
        },
      ),
      { numRuns: 50 },
    );
  });

  it("round bar ≈ a fine prism (inscribed polygon falls short by at most x²/6, x = 2π/n)", () => {
    const n = 720, D = 40, L = 300;
    const bar = measureTemplate("round-bar", { lengthMm: L, diameterMm: D });
    const mesh = measureStlBuffer(toBinaryStl(cylinderMesh(D / 2, L, n)), "mm");
    const x = (2 * PI) / n;
    expect(mesh.areaM2).toBeLessThan(bar.outsideAreaM2);
    expect(mesh.areaM2).toBeGreaterThan(bar.outsideAreaM2 * (1 - (x * x) / 6 - 1e-6));
    expect(mesh.volumeM3).toBeGreaterThan(bar.volumeM3 * (1 - (x * x) / 6 - 1e-6));
  });
});

describe("every template", () => {
  it.each(DIMENSION_TEMPLATES.map((t) => [t.id, t] as const))("%s: named mm dimensions, positive results, grows with length", (_id, template) => {
    expect(template.name).not.toBe("");
    expect(template.description).toMatch(/\.$/);
    for (const d of template.dimensions) {
      expect(d.unit).toBe("mm");
      expect(d.kind).toBe("length");
      expect(d.name).toMatch(/Mm$/);
    }
    // A valid part: first dimension large, the last (a wall or thickness) small.
    const dims = Object.fromEntries(template.dimensions.map((d, i) => [d.name, i === template.dimensions.length - 1 && i > 1 ? 2 : 100 + 50 * i]));
    const r = template.measure(dims);
    expect(r.outsideAreaM2).toBeGreaterThan(0);
    expect(r.volumeM3).toBeGreaterThan(0);
    expect(r.insideAreaM2).toBeGreaterThanOrEqual(0);
    expect(r.edgeAreaM2).toBeLessThan(r.outsideAreaM2);
    const first = template.dimensions[0].name;
    const bigger = template.measure({ ...dims, [first]: dims[first] * 2 });
    expect(bigger.outsideAreaM2).toBeGreaterThan(r.outsideAreaM2);
    expect(bigger.volumeM3).toBeGreaterThan(r.volumeM3);
  });
});

describe("impossible dimensions", () => {
  it.each([
    ["round-tube", { lengthMm: 100, outsideDiameterMm: 20, wallMm: 10 }, "wallMm", /less than half the outside diameter/],
    ["rectangular-tube", { lengthMm: 100, widthMm: 20, heightMm: 40, wallMm: 12 }, "wallMm", /half the smaller outside side/],
    ["angle", { lengthMm: 100, legAMm: 30, legBMm: 5, thicknessMm: 5 }, "thicknessMm", /shorter leg/],
    ["channel", { lengthMm: 100, webHeightMm: 10, flangeWidthMm: 30, thicknessMm: 5 }, "thicknessMm", /half the web height/],
    ["open-box", { lengthMm: 100, widthMm: 100, heightMm: 4, wallMm: 5 }, "wallMm", /less than the height/],
    ["flat-plate", { lengthMm: -1, widthMm: 100, thicknessMm: 2 }, "lengthMm", /Length must be a positive number/],
    ["flat-plate", { lengthMm: 100, widthMm: Number.NaN, thicknessMm: 2 }, "widthMm", /Width must be/],
    ["round-bar", { lengthMm: 100 }, "diameterMm", /Diameter must be/],
  ])("%s %o → error on %s", (id, dims, field, message) => {
    try {
      measureTemplate(id, dims as Record<string, number>);
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(GeometryError);
      expect((error as GeometryError).code).toBe("invalid_dimension");
      expect((error as GeometryError).field).toBe(field);
      expect((error as GeometryError).message).toMatch(message);
    }
  });

  it("unknown template id", () => {
    expect(() => findTemplate("hexagon")).toThrow(/no shape template "hexagon"/);
  });
});
