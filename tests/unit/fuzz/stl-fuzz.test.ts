import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { createStlMeasurer, measureStlBuffer } from "@/lib/geometry/stl-measure";
import { GeometryError } from "@/lib/geometry/errors";

/*
 * Hostile input: 10,000 generated and mutated STL files. The measurer either returns finite
 * numbers or throws a GeometryError with a sentence for the user — never anything else.
 * (Invariant checked here: common practice, no source.)
 */

function binaryStl(tris: number[][], countOverride?: number, header = "fuzz"): Uint8Array {
  const buf = new Uint8Array(84 + 50 * tris.length);
  const dv = new DataView(buf.buffer);
  buf.set(new TextEncoder().encode(header.slice(0, 80)));
  dv.setUint32(80, countOverride ?? tris.length, true);
  tris.forEach((t, i) => {
    for (let k = 0; k < 9; k++) dv.setFloat32(84 + i * 50 + 12 + k * 4, t[k] ?? 0, true);
  });
  return buf;
}

function asciiStl(tris: number[][]): Uint8Array {
  const f = (t: number[]) =>
    `facet normal 0 0 0\n outer loop\n  vertex ${t[0]} ${t[1]} ${t[2]}\n  vertex ${t[3]} ${t[4]} ${t[5]}\n  vertex ${t[6]} ${t[7]} ${t[8]}\n endloop\nendfacet\n`;
  return new TextEncoder().encode(`solid fuzz\n${tris.map(f).join("")}endsolid fuzz\n`);
}

const coord = fc.oneof(
  { weight: 8, arbitrary: fc.double({ min: -1e4, max: 1e4, noNaN: true }) },
  { weight: 1, arbitrary: fc.constantFrom(NaN, Infinity, -Infinity, 0, -0, 3.4e38, -3.4e38, 1e-45) },
);
const tri = fc.array(coord, { minLength: 9, maxLength: 9 });
const mesh = fc.array(tri, { minLength: 0, maxLength: 12 });

type Mutation = { kind: "flip"; at: number; bit: number } | { kind: "cut"; at: number } | { kind: "count"; value: number } | { kind: "byte"; at: number; value: number };
const mutation: fc.Arbitrary<Mutation> = fc.oneof(
  fc.record({ kind: fc.constant("flip" as const), at: fc.nat(), bit: fc.integer({ min: 0, max: 7 }) }),
  fc.record({ kind: fc.constant("cut" as const), at: fc.nat() }),
  fc.record({ kind: fc.constant("count" as const), value: fc.oneof(fc.nat(), fc.constant(0xffffffff), fc.constant(2 ** 31)) }),
  fc.record({ kind: fc.constant("byte" as const), at: fc.nat(), value: fc.integer({ min: 0, max: 255 }) }),
);

function mutate(bytes: Uint8Array, ms: Mutation[]): Uint8Array {
  let b = bytes.slice();
  for (const m of ms) {
    if (b.length === 0) break;
    if (m.kind === "flip") b[m.at % b.length] ^= 1 << m.bit;
    else if (m.kind === "byte") b[m.at % b.length] = m.value;
    else if (m.kind === "cut") b = b.slice(0, m.at % (b.length + 1));
    else if (b.length >= 84) new DataView(b.buffer, b.byteOffset).setUint32(80, m.value, true);
  }
  return b;
}

function checkOutcome(run: () => ReturnType<typeof measureStlBuffer>): void {
  try {
    const r = run();
    expect(Number.isFinite(r.areaM2) && r.areaM2 > 0).toBe(true);
    expect(Number.isFinite(r.volumeM3) && r.volumeM3 >= 0).toBe(true);
    for (const v of [r.bboxMm.x, r.bboxMm.y, r.bboxMm.z]) expect(Number.isFinite(v) && v >= 0).toBe(true);
    expect(Number.isInteger(r.triangleCount) && r.triangleCount > 0).toBe(true);
  } catch (e) {
    if (!(e instanceof GeometryError)) throw e;
    expect(e.message.length).toBeGreaterThan(10);
  }
}

describe("STL measurement under hostile input", () => {
  it("binary files, generated then mutated (4,000 cases)", () => {
    fc.assert(
      fc.property(mesh, fc.array(mutation, { maxLength: 4 }), fc.constantFrom("fuzz", "solid looks like text"), (m, ms, header) => {
        checkOutcome(() => measureStlBuffer(mutate(binaryStl(m, undefined, header), ms), "mm"));
      }),
      { numRuns: 4000, seed: 20261201 },
    );
  });

  it("ASCII files, generated then mutated (3,000 cases)", () => {
    fc.assert(
      fc.property(mesh, fc.array(mutation.filter((m) => m.kind !== "count"), { maxLength: 4 }), (m, ms) => {
        checkOutcome(() => measureStlBuffer(mutate(asciiStl(m), ms), "in"));
      }),
      { numRuns: 3000, seed: 20261202 },
    );
  });

  it("random bytes fed in random chunk sizes (3,000 cases)", () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 600 }), fc.array(fc.integer({ min: 1, max: 97 }), { minLength: 1, maxLength: 8 }), (bytes, sizes) => {
        checkOutcome(() => {
          const m = createStlMeasurer({ unit: "mm" });
          let at = 0;
          for (let i = 0; at < bytes.length; i++) {
            const n = sizes[i % sizes.length];
            m.push(bytes.subarray(at, at + n));
            at += n;
          }
          return m.finish();
        });
      }),
      { numRuns: 3000, seed: 20261203 },
    );
  });

  it("a header that claims four billion triangles is refused without allocating for them", () => {
    const b = binaryStl([[0, 0, 0, 1, 0, 0, 0, 1, 0]], 0xffffffff);
    expect(() => measureStlBuffer(b, "mm")).toThrow(GeometryError);
  });
});
