/**
 * Running sums over a stream of triangles, in the file's own unit: area, enclosed volume,
 * bounding box. Constant memory whatever the number of triangles.
 *
 * The state lives in one Float64Array rather than in object fields: fields that start as small
 * integers and later hold fractions change the object's hidden class in V8, which sent the hot
 * loop below back to the interpreter on almost every chunk (seen with --trace-deopt).
 */
const COUNT = 0;
const ZERO_AREA = 1;
/** sum of |(b - a) x (c - a)| = twice the area */
const DOUBLE_AREA = 2;
/** sum of (a - o) . ((b - a) x (c - a)) = six times the signed volume */
const SIX_VOLUME = 3;
const MIN_X = 4, MIN_Y = 5, MIN_Z = 6;
const MAX_X = 7, MAX_Y = 8, MAX_Z = 9;
// Reference point o for the volume: the first vertex, so that a mesh far from the origin does
// not lose digits to cancellation. For a closed mesh the sum is the same for any o.
const O_X = 10, O_Y = 11, O_Z = 12;

export class TriangleSums {
  private readonly s = new Float64Array(13);

  constructor() {
    this.s.fill(Infinity, MIN_X, MIN_Z + 1);
    this.s.fill(-Infinity, MAX_X, MAX_Z + 1);
  }

  get count(): number {
    return this.s[COUNT];
  }
  get zeroAreaCount(): number {
    return this.s[ZERO_AREA];
  }
  get doubleAreaSum(): number {
    return this.s[DOUBLE_AREA];
  }
  get sixVolumeSum(): number {
    return this.s[SIX_VOLUME];
  }
  /** bounding box size along x, y, z (0 before the first triangle) */
  get extent(): { x: number; y: number; z: number } {
    const s = this.s;
    if (s[COUNT] === 0) return { x: 0, y: 0, z: 0 };
    return { x: s[MAX_X] - s[MIN_X], y: s[MAX_Y] - s[MIN_Y], z: s[MAX_Z] - s[MIN_Z] };
  }

  /** Adds the triangle v[0..9) = a, b, c (used for ASCII, one facet at a time). */
  add(v: Float64Array): void {
    const s = this.s;
    const ax = v[0], ay = v[1], az = v[2];
    const bx = v[3], by = v[4], bz = v[5];
    const cx = v[6], cy = v[7], cz = v[8];
    if (s[COUNT] === 0) {
      s[O_X] = ax;
      s[O_Y] = ay;
      s[O_Z] = az;
    }
    s[COUNT]++;
    // the same comparisons as addBinaryRecords, so both give bit-identical results
    for (let k = 0; k < 9; k++) {
      const axis = k % 3;
      const c = v[k];
      if (c < s[MIN_X + axis]) s[MIN_X + axis] = c;
      if (c > s[MAX_X + axis]) s[MAX_X + axis] = c;
    }
    const ux = bx - ax, uy = by - ay, uz = bz - az;
    const vx = cx - ax, vy = cy - ay, vz = cz - az;
    // n = u x v: |n| is twice the triangle's area (vector cross product, any geometry text)
    const nx = uy * vz - uz * vy;
    const ny = uz * vx - ux * vz;
    const nz = ux * vy - uy * vx;
    const n2 = nx * nx + ny * ny + nz * nz;
    if (n2 === 0) s[ZERO_AREA]++;
    else s[DOUBLE_AREA] += Math.sqrt(n2);
    // source: divergence theorem as a sum of signed tetrahedra (o, a, b, c), as in C. Zhang and
    // T. Chen, "Efficient feature extraction for 2D/3D objects in mesh representation", ICIP 2001:
    // 6V = (a - o) . ((b - o) x (c - o)) = (a - o) . ((b - a) x (c - a))
    s[SIX_VOLUME] += (ax - s[O_X]) * nx + (ay - s[O_Y]) * ny + (az - s[O_Z]) * nz;
  }

  /**
   * Adds n binary STL records (50 bytes: normal, three float32 vertices, attribute) starting at
   * `offset`. The same arithmetic as add(), with the running sums held in locals: this loop is
   * what a large binary upload spends its time in. Returns -1, or the index of the first record
   * with a coordinate that is NaN or infinite (the records before it are added).
   */
  addBinaryRecords(view: DataView, offset: number, n: number): number {
    const s = this.s;
    let count = s[COUNT];
    let zeroAreaCount = s[ZERO_AREA];
    let doubleAreaSum = s[DOUBLE_AREA];
    let sixVolumeSum = s[SIX_VOLUME];
    let minX = s[MIN_X], minY = s[MIN_Y], minZ = s[MIN_Z];
    let maxX = s[MAX_X], maxY = s[MAX_Y], maxZ = s[MAX_Z];
    let ox = s[O_X], oy = s[O_Y], oz = s[O_Z];
    if (count === 0 && n > 0) {
      ox = view.getFloat32(offset + 12, true);
      oy = view.getFloat32(offset + 16, true);
      oz = view.getFloat32(offset + 20, true);
    }
    let bad = -1;
    for (let r = 0; r < n; r++) {
      const o = offset + r * 50 + 12;
      const ax = view.getFloat32(o, true);
      const ay = view.getFloat32(o + 4, true);
      const az = view.getFloat32(o + 8, true);
      const bx = view.getFloat32(o + 12, true);
      const by = view.getFloat32(o + 16, true);
      const bz = view.getFloat32(o + 20, true);
      const cx = view.getFloat32(o + 24, true);
      const cy = view.getFloat32(o + 28, true);
      const cz = view.getFloat32(o + 32, true);
      // NaN or ±Infinity anywhere makes the sum's difference with itself NaN.
      const sum = ax + ay + az + bx + by + bz + cx + cy + cz;
      if (sum - sum !== 0) {
        bad = r;
        break;
      }
      count++;
      if (ax < minX) minX = ax;
      if (ax > maxX) maxX = ax;
      if (bx < minX) minX = bx;
      if (bx > maxX) maxX = bx;
      if (cx < minX) minX = cx;
      if (cx > maxX) maxX = cx;
      if (ay < minY) minY = ay;
      if (ay > maxY) maxY = ay;
      if (by < minY) minY = by;
      if (by > maxY) maxY = by;
      if (cy < minY) minY = cy;
      if (cy > maxY) maxY = cy;
      if (az < minZ) minZ = az;
      if (az > maxZ) maxZ = az;
      if (bz < minZ) minZ = bz;
      if (bz > maxZ) maxZ = bz;
      if (cz < minZ) minZ = cz;
      if (cz > maxZ) maxZ = cz;
      const ux = bx - ax, uy = by - ay, uz = bz - az;
      const vx = cx - ax, vy = cy - ay, vz = cz - az;
      const nx = uy * vz - uz * vy;
      const ny = uz * vx - ux * vz;
      const nz = ux * vy - uy * vx;
      const n2 = nx * nx + ny * ny + nz * nz;
      if (n2 === 0) zeroAreaCount++;
      else doubleAreaSum += Math.sqrt(n2);
      sixVolumeSum += (ax - ox) * nx + (ay - oy) * ny + (az - oz) * nz;
    }
    s[COUNT] = count;
    s[ZERO_AREA] = zeroAreaCount;
    s[DOUBLE_AREA] = doubleAreaSum;
    s[SIX_VOLUME] = sixVolumeSum;
    s[MIN_X] = minX;
    s[MIN_Y] = minY;
    s[MIN_Z] = minZ;
    s[MAX_X] = maxX;
    s[MAX_Y] = maxY;
    s[MAX_Z] = maxZ;
    s[O_X] = ox;
    s[O_Y] = oy;
    s[O_Z] = oz;
    return bad;
  }
}

// Run the batch loop a few times on one blank record at load time. V8 records type feedback
// only once a function has run several times; without feedback for the stores after the loop,
// the on-stack-replaced loop deoptimised at its exit on every call (about a thousand times per
// file, doubling the time; seen with --trace-deopt).
const warmUp = new TriangleSums();
const blankRecord = new DataView(new ArrayBuffer(62));
for (let i = 0; i < 32; i++) warmUp.addBinaryRecords(blankRecord, 0, 1);
