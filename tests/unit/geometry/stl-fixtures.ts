/**
 * Test meshes and STL writers. A mesh is a flat list of triangles, nine coordinates each
 * (ax ay az bx by bz cx cy cz), counter-clockwise seen from outside.
 */
export type Mesh = number[];

type Vec3 = [number, number, number];

function quad(out: Mesh, a: Vec3, b: Vec3, c: Vec3, d: Vec3): void {
  out.push(...a, ...b, ...c, ...a, ...c, ...d);
}

/** Axis-aligned box from the origin to (x, y, z): 12 triangles, welded corners. */
export function boxMesh(x: number, y: number, z: number): Mesh {
  const p = (i: number, j: number, k: number): Vec3 => [i * x, j * y, k * z];
  const m: Mesh = [];
  quad(m, p(0, 0, 0), p(0, 1, 0), p(1, 1, 0), p(1, 0, 0)); // bottom, normal -z
  quad(m, p(0, 0, 1), p(1, 0, 1), p(1, 1, 1), p(0, 1, 1)); // top, +z
  quad(m, p(0, 0, 0), p(1, 0, 0), p(1, 0, 1), p(0, 0, 1)); // front, -y
  quad(m, p(0, 1, 0), p(0, 1, 1), p(1, 1, 1), p(1, 1, 0)); // back, +y
  quad(m, p(0, 0, 0), p(0, 0, 1), p(0, 1, 1), p(0, 1, 0)); // left, -x
  quad(m, p(1, 0, 0), p(1, 1, 0), p(1, 1, 1), p(1, 0, 1)); // right, +x
  return m;
}

/** Closed prism over a regular n-gon of circumradius r, axis z from 0 to h: 4n triangles. */
export function cylinderMesh(r: number, h: number, n: number): Mesh {
  const m: Mesh = [];
  const ring = (i: number, z: number): Vec3 => {
    const t = (2 * Math.PI * (i % n)) / n;
    return [r * Math.cos(t), r * Math.sin(t), z];
  };
  for (let i = 0; i < n; i++) {
    quad(m, ring(i, 0), ring(i + 1, 0), ring(i + 1, h), ring(i, h));
    m.push(0, 0, 0, ...ring(i + 1, 0), ...ring(i, 0)); // bottom cap, normal -z
    m.push(0, 0, h, ...ring(i, h), ...ring(i + 1, h)); // top cap, normal +z
  }
  return m;
}

/** UV sphere inscribed in radius r: every vertex lies on the sphere. */
export function uvSphereMesh(r: number, stacks: number, slices: number): Mesh {
  const m: Mesh = [];
  const pt = (i: number, j: number): Vec3 => {
    const phi = (Math.PI * i) / stacks;
    const theta = (2 * Math.PI * (j % slices)) / slices;
    if (i === 0) return [0, 0, r];
    if (i === stacks) return [0, 0, -r];
    return [r * Math.sin(phi) * Math.cos(theta), r * Math.sin(phi) * Math.sin(theta), r * Math.cos(phi)];
  };
  for (let i = 0; i < stacks; i++) {
    for (let j = 0; j < slices; j++) {
      if (i === 0) m.push(...pt(0, 0), ...pt(1, j), ...pt(1, j + 1));
      else if (i === stacks - 1) m.push(...pt(i, j), ...pt(stacks, 0), ...pt(i, j + 1));
      else quad(m, pt(i, j), pt(i + 1, j), pt(i + 1, j + 1), pt(i, j + 1));
    }
  }
  return m;
}

/** Regular icosahedron of edge length 2a (vertices (0, ±a, ±aφ) and cyclic). */
export function icosahedronMesh(a: number): Mesh {
  const f = ((1 + Math.sqrt(5)) / 2) * a;
  const v: Vec3[] = [
    [-a, f, 0], [a, f, 0], [-a, -f, 0], [a, -f, 0],
    [0, -a, f], [0, a, f], [0, -a, -f], [0, a, -f],
    [f, 0, -a], [f, 0, a], [-f, 0, -a], [-f, 0, a],
  ];
  const faces = [
    [0, 11, 5], [0, 5, 1], [0, 1, 7], [0, 7, 10], [0, 10, 11],
    [1, 5, 9], [5, 11, 4], [11, 10, 2], [10, 7, 6], [7, 1, 8],
    [3, 9, 4], [3, 4, 2], [3, 2, 6], [3, 6, 8], [3, 8, 9],
    [4, 9, 5], [2, 4, 11], [6, 2, 10], [8, 6, 7], [9, 8, 1],
  ];
  return faces.flatMap(([i, j, k]) => [...v[i], ...v[j], ...v[k]]);
}

/** Torus around z: major radius R, tube radius r, n x m quads, 2nm triangles, no poles. */
export function torusMesh(R: number, r: number, n: number, m: number): Mesh {
  const out: Mesh = [];
  const pt = (i: number, j: number): Vec3 => {
    const u = (2 * Math.PI * (i % n)) / n;
    const v = (2 * Math.PI * (j % m)) / m;
    const w = R + r * Math.cos(v);
    return [w * Math.cos(u), w * Math.sin(u), r * Math.sin(v)];
  };
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < m; j++) quad(out, pt(i, j), pt(i + 1, j), pt(i + 1, j + 1), pt(i, j + 1));
  }
  return out;
}

export function mapVertices(mesh: Mesh, f: (p: Vec3) => Vec3): Mesh {
  const out: Mesh = [];
  for (let i = 0; i < mesh.length; i += 3) out.push(...f([mesh[i], mesh[i + 1], mesh[i + 2]]));
  return out;
}

/** Reverses every triangle's winding. */
export function flipMesh(mesh: Mesh): Mesh {
  const out: Mesh = [];
  for (let t = 0; t < mesh.length; t += 9) out.push(...mesh.slice(t, t + 3), ...mesh.slice(t + 6, t + 9), ...mesh.slice(t + 3, t + 6));
  return out;
}

export function concatMeshes(...meshes: Mesh[]): Mesh {
  return meshes.flat();
}

/** The coordinates a binary STL actually stores (float32). */
export function toFloat32Mesh(mesh: Mesh): Mesh {
  return mesh.map((v) => Math.fround(v));
}

function normalOf(mesh: Mesh, t: number): Vec3 {
  const [ax, ay, az, bx, by, bz, cx, cy, cz] = mesh.slice(t, t + 9);
  const ux = bx - ax, uy = by - ay, uz = bz - az, vx = cx - ax, vy = cy - ay, vz = cz - az;
  const n: Vec3 = [uy * vz - uz * vy, uz * vx - ux * vz, ux * vy - uy * vx];
  const len = Math.hypot(...n) || 1;
  return [n[0] / len, n[1] / len, n[2] / len];
}

/** Binary STL: 80-byte header, uint32 count, 50-byte records (little-endian float32). */
export function toBinaryStl(
  mesh: Mesh,
  options: { header?: string; count?: number; extraBytes?: number } = {},
): Uint8Array {
  const triangles = mesh.length / 9;
  const bytes = new Uint8Array(84 + 50 * triangles + (options.extraBytes ?? 0));
  const view = new DataView(bytes.buffer);
  const header = options.header ?? "binary test mesh";
  for (let i = 0; i < Math.min(80, header.length); i++) bytes[i] = header.charCodeAt(i);
  view.setUint32(80, options.count ?? triangles, true);
  for (let t = 0; t < triangles; t++) {
    const o = 84 + 50 * t;
    const n = normalOf(mesh, t * 9);
    for (let k = 0; k < 3; k++) view.setFloat32(o + 4 * k, n[k], true);
    for (let k = 0; k < 9; k++) view.setFloat32(o + 12 + 4 * k, mesh[t * 9 + k], true);
  }
  return bytes;
}

/**
 * ASCII STL. Coordinates are written as the float32 value's exact shortest decimal, so the
 * text and binary files of one mesh hold the same numbers.
 */
export function toAsciiStl(
  mesh: Mesh,
  options: { name?: string; number?: (v: number) => string; eol?: string; indent?: string } = {},
): Uint8Array {
  const num = options.number ?? ((v: number) => String(Math.fround(v)));
  const eol = options.eol ?? "\n";
  const ind = options.indent ?? "  ";
  const name = options.name ?? "test";
  const lines: string[] = [`solid ${name}`];
  for (let t = 0; t < mesh.length; t += 9) {
    const n = normalOf(mesh, t);
    lines.push(`${ind}facet normal ${n.map((v) => num(v)).join(" ")}`);
    lines.push(`${ind}${ind}outer loop`);
    for (let k = 0; k < 9; k += 3) {
      lines.push(`${ind}${ind}${ind}vertex ${num(mesh[t + k])} ${num(mesh[t + k + 1])} ${num(mesh[t + k + 2])}`);
    }
    lines.push(`${ind}${ind}endloop`);
    lines.push(`${ind}endfacet`);
  }
  lines.push(`endsolid ${name}`);
  return new TextEncoder().encode(lines.join(eol) + eol);
}

export function textBytes(text: string): Uint8Array {
  return new TextEncoder().encode(text);
}
