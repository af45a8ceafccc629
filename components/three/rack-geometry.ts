// Geometry for the 3D rack view, kept apart from React so it can be checked on its own. Frame as
// in the racking plan: x along the window's width (travel), y up, z across (depth), millimetres,
// origin at the window's lower front corner; three.js's right-handed frame is used as is.

import * as THREE from "three";

export type Vec3Mm = [number, number, number];

export interface PlacementMm {
  minMm: Vec3Mm;
  sizeMm: Vec3Mm;
}

export interface WindowSizeMm {
  widthMm: number;
  heightMm: number;
  depthMm: number;
}

/** Parts × mesh triangles above this are drawn as boxes: software WebGL and laptops stall. */
export const MESH_TRIANGLE_BUDGET = 2_000_000;

/** Sizes that differ by less than this (mm) are the same orientation. */
const SAME_SIZE_MM = 1e-3;

export function triangleCount(mesh: THREE.BufferGeometry | Float32Array): number {
  if (mesh instanceof Float32Array) return Math.floor(mesh.length / 9);
  if (mesh.index) return Math.floor(mesh.index.count / 3);
  const position = mesh.getAttribute("position");
  return position ? Math.floor(position.count / 3) : 0;
}

/** A non-indexed Float32Array (x, y, z per vertex, three vertices per triangle) → geometry. */
export function toGeometry(mesh: THREE.BufferGeometry | Float32Array): THREE.BufferGeometry {
  if (!(mesh instanceof Float32Array)) return mesh;
  const g = new THREE.BufferGeometry();
  g.setAttribute("position", new THREE.BufferAttribute(mesh, 3));
  g.computeVertexNormals();
  return g;
}

export interface PlacementGroup {
  sizeMm: Vec3Mm;
  /** Indices into the plan's placements, in plan order (instanceId → placement index). */
  indices: number[];
}

/** Placements grouped by size, i.e. by orientation: one instanced draw per group. */
export function groupBySize(placements: readonly PlacementMm[]): PlacementGroup[] {
  const groups: PlacementGroup[] = [];
  placements.forEach((p, i) => {
    const g = groups.find((x) => x.sizeMm.every((v, a) => Math.abs(v - p.sizeMm[a]) <= SAME_SIZE_MM));
    if (g) g.indices.push(i);
    else groups.push({ sizeMm: [p.sizeMm[0], p.sizeMm[1], p.sizeMm[2]], indices: [i] });
  });
  return groups;
}

const PERMUTATIONS: Vec3Mm[] = [
  [0, 1, 2],
  [0, 2, 1],
  [1, 0, 2],
  [1, 2, 0],
  [2, 0, 1],
  [2, 1, 0],
];

/** +1 for an even permutation, −1 for an odd one (a plain axis swap would mirror the part). */
function parity(p: Vec3Mm): number {
  let inversions = 0;
  for (let i = 0; i < 3; i++) for (let j = i + 1; j < 3; j++) if (p[i] > p[j]) inversions++;
  return inversions % 2 === 0 ? 1 : -1;
}

/**
 * The rotation (a signed axis permutation with determinant +1, so the part is turned, never
 * mirrored) that lays a part whose box is `partDimsMm` (its own x, y, z) into `sizeMm` (window
 * x, y, z). Where the part has two equal sides either match is right; the first is taken.
 */
export function orientationMatrix(partDimsMm: Vec3Mm, sizeMm: Vec3Mm): THREE.Matrix4 {
  let best = PERMUTATIONS[0];
  let bestError = Infinity;
  for (const p of PERMUTATIONS) {
    const error = Math.abs(partDimsMm[p[0]] - sizeMm[0]) + Math.abs(partDimsMm[p[1]] - sizeMm[1]) + Math.abs(partDimsMm[p[2]] - sizeMm[2]);
    if (error < bestError - 1e-9) {
      best = p;
      bestError = error;
    }
  }
  // Row i takes the part's axis best[i]; an odd permutation gets its depth row negated, which
  // turns the part half-way round instead of reflecting it. As drawn upright, CAD (x, y, z) →
  // window (x, z, −y): height up, CAD y pointing towards the front.
  const sign: Vec3Mm = [1, 1, parity(best)];
  const e = [0, 0, 0, 0, 0, 0, 0, 0, 0];
  for (let row = 0; row < 3; row++) e[row * 3 + best[row]] = sign[row];
  return new THREE.Matrix4().set(e[0], e[1], e[2], 0, e[3], e[4], e[5], 0, e[6], e[7], e[8], 0, 0, 0, 0, 1);
}

/**
 * The part's mesh turned into one placement size, with its box's lower corner at the origin, so
 * each instance only needs a translation to its placement's minMm. A mesh whose box differs a
 * little from the planned box (rounded sizes) is stretched to fit it exactly.
 */
export function orientedGeometry(source: THREE.BufferGeometry, sizeMm: Vec3Mm): THREE.BufferGeometry {
  const g = source.clone();
  g.computeBoundingBox();
  const box = g.boundingBox!;
  g.translate(-box.min.x, -box.min.y, -box.min.z);
  const dims: Vec3Mm = [box.max.x - box.min.x, box.max.y - box.min.y, box.max.z - box.min.z];
  g.applyMatrix4(orientationMatrix(dims, sizeMm));
  g.computeBoundingBox();
  const turned = g.boundingBox!;
  g.translate(-turned.min.x, -turned.min.y, -turned.min.z);
  const extent = [turned.max.x - turned.min.x, turned.max.y - turned.min.y, turned.max.z - turned.min.z];
  const fit = extent.map((v, a) => (v > 0 ? sizeMm[a] / v : 1));
  if (fit.some((f) => Math.abs(f - 1) > 1e-9)) g.scale(fit[0], fit[1], fit[2]);
  if (!g.getAttribute("normal")) g.computeVertexNormals();
  g.computeBoundingBox();
  g.computeBoundingSphere();
  return g;
}

/** A box spanning [0, 1]³: scaled per instance to a placement's size. */
export function unitBoxGeometry(): THREE.BufferGeometry {
  const g = new THREE.BoxGeometry(1, 1, 1);
  g.translate(0.5, 0.5, 0.5);
  return g;
}

/** Column-major instance matrices, 16 floats each: translate to minMm (and scale when boxes). */
export function instanceMatrices(
  placements: readonly PlacementMm[],
  indices: readonly number[],
  opts: { scaleToSize: boolean; growMm?: number },
): Float32Array {
  const out = new Float32Array(indices.length * 16);
  const grow = opts.growMm ?? 0;
  indices.forEach((index, k) => {
    const { minMm, sizeMm } = placements[index];
    const sx = opts.scaleToSize ? sizeMm[0] + 2 * grow : 1;
    const sy = opts.scaleToSize ? sizeMm[1] + 2 * grow : 1;
    const sz = opts.scaleToSize ? sizeMm[2] + 2 * grow : 1;
    out.set([sx, 0, 0, 0, 0, sy, 0, 0, 0, 0, sz, 0, minMm[0] - grow, minMm[1] - grow, minMm[2] - grow, 1], k * 16);
  });
  return out;
}

/**
 * The carrier drawn as lines: the window's twelve edges, the hanger from the top bar to the
 * conveyor, and an arrow under the window in the direction of travel (+x).
 */
export function frameLineGeometry(w: WindowSizeMm): THREE.BufferGeometry {
  const { widthMm: W, heightMm: H, depthMm: D } = w;
  const corners: Vec3Mm[] = [
    [0, 0, 0], [W, 0, 0], [W, H, 0], [0, H, 0],
    [0, 0, D], [W, 0, D], [W, H, D], [0, H, D],
  ];
  const edges = [
    [0, 1], [1, 2], [2, 3], [3, 0],
    [4, 5], [5, 6], [6, 7], [7, 4],
    [0, 4], [1, 5], [2, 6], [3, 7],
  ];
  const v: number[] = [];
  for (const [a, b] of edges) v.push(...corners[a], ...corners[b]);
  const hang = Math.max(W, H, D) * 0.12;
  v.push(W / 2, H, D / 2, W / 2, H + hang, D / 2);
  v.push(W * 0.25, H + hang, D / 2, W * 0.75, H + hang, D / 2);
  const y = -Math.max(W, H, D) * 0.06;
  const head = Math.min(W * 0.05, Math.max(W, H, D) * 0.03);
  v.push(0, y, 0, W, y, 0, W, y, 0, W - head, y + head * 0.6, 0, W, y, 0, W - head, y - head * 0.6, 0);
  const g = new THREE.BufferGeometry();
  g.setAttribute("position", new THREE.Float32BufferAttribute(v, 3));
  return g;
}

export interface FillSummary {
  count: number;
  totalKg: number;
  /** Sum of the placed part boxes over the window's volume, in %. */
  fillPercent: number;
}

export function fillSummary(placements: readonly PlacementMm[], partMassKg: number, w: WindowSizeMm): FillSummary {
  let volumeMm3 = 0;
  for (const p of placements) volumeMm3 += p.sizeMm[0] * p.sizeMm[1] * p.sizeMm[2];
  const windowMm3 = w.widthMm * w.heightMm * w.depthMm;
  return {
    count: placements.length,
    totalKg: placements.length * partMassKg,
    fillPercent: windowMm3 > 0 ? (volumeMm3 / windowMm3) * 100 : 0,
  };
}

/** The camera for a preset view, looking at the window's centre from far enough to see it all. */
export type ViewName = "front" | "side" | "top" | "iso";

export function viewCamera(w: WindowSizeMm, view: ViewName, fovDeg: number): { position: Vec3Mm; target: Vec3Mm } {
  const c: Vec3Mm = [w.widthMm / 2, w.heightMm / 2, w.depthMm / 2];
  const radius = 0.5 * Math.hypot(w.widthMm, w.heightMm * 1.25, w.depthMm);
  const distance = (radius / Math.sin(((fovDeg / 2) * Math.PI) / 180)) * 1.05;
  // The front is the z = 0 face (the origin is the window's lower front corner).
  const direction: Vec3Mm =
    view === "front" ? [0, 0, -1] : view === "side" ? [1, 0, 0] : view === "top" ? [0, 1, -1e-3] : [-0.55, 0.45, -0.7];
  const n = Math.hypot(...direction);
  return {
    position: [c[0] + (direction[0] / n) * distance, c[1] + (direction[1] / n) * distance, c[2] + (direction[2] / n) * distance],
    target: c,
  };
}
