/**
 * Writes large closed test meshes for the STL benchmark: a torus of 2 x n x m triangles
 * (no poles, so every vertex is shared by six triangles, like a typical CAD tessellation).
 */
import { open } from "node:fs/promises";

const MAJOR_RADIUS_MM = 120;
const TUBE_RADIUS_MM = 35;

function torusPoint(i: number, j: number, n: number, m: number, out: Float64Array, at: number): void {
  const u = (2 * Math.PI * (i % n)) / n;
  const v = (2 * Math.PI * (j % m)) / m;
  const w = MAJOR_RADIUS_MM + TUBE_RADIUS_MM * Math.cos(v);
  out[at] = w * Math.cos(u);
  out[at + 1] = w * Math.sin(u);
  out[at + 2] = TUBE_RADIUS_MM * Math.sin(v);
}

/** Calls emit(9 coordinates) for each triangle of the torus, in a fixed order. */
function forEachTorusTriangle(n: number, m: number, emit: (t: Float64Array) => void): void {
  const q = new Float64Array(12);
  const t = new Float64Array(9);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < m; j++) {
      torusPoint(i, j, n, m, q, 0);
      torusPoint(i + 1, j, n, m, q, 3);
      torusPoint(i + 1, j + 1, n, m, q, 6);
      torusPoint(i, j + 1, n, m, q, 9);
      t.set(q.subarray(0, 9));
      emit(t);
      t.set(q.subarray(0, 3), 0);
      t.set(q.subarray(6, 12), 3);
      emit(t);
    }
  }
}

export async function writeBinaryTorusStl(path: string, n: number, m: number): Promise<number> {
  const count = 2 * n * m;
  const bytes = new Uint8Array(84 + 50 * count);
  const view = new DataView(bytes.buffer);
  bytes.set(new TextEncoder().encode("benchmark torus"), 0);
  view.setUint32(80, count, true);
  let o = 84;
  forEachTorusTriangle(n, m, (t) => {
    for (let k = 0; k < 9; k++) view.setFloat32(o + 12 + 4 * k, t[k], true);
    o += 50;
  });
  const handle = await open(path, "w");
  try {
    await handle.write(bytes);
  } finally {
    await handle.close();
  }
  return count;
}

export async function writeAsciiTorusStl(path: string, n: number, m: number): Promise<number> {
  const handle = await open(path, "w");
  let pending: string[] = ["solid benchmark torus\n"];
  const flushes: string[][] = [];
  // "%e"-style numbers with 7 significant digits, as many CAD exporters write them.
  const f = (v: number): string => v.toExponential(6);
  forEachTorusTriangle(n, m, (t) => {
    pending.push(
      "  facet normal 0.000000e+00 0.000000e+00 0.000000e+00\n    outer loop\n" +
        `      vertex ${f(t[0])} ${f(t[1])} ${f(t[2])}\n` +
        `      vertex ${f(t[3])} ${f(t[4])} ${f(t[5])}\n` +
        `      vertex ${f(t[6])} ${f(t[7])} ${f(t[8])}\n` +
        "    endloop\n  endfacet\n",
    );
    if (pending.length >= 4096) {
      flushes.push(pending);
      pending = [];
    }
  });
  pending.push("endsolid benchmark torus\n");
  flushes.push(pending);
  try {
    for (const part of flushes) await handle.write(part.join(""));
  } finally {
    await handle.close();
  }
  return 2 * n * m;
}
