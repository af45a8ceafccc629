/**
 * Closed-mesh check: weld vertices by exact coordinates, then count how many triangles use each
 * undirected edge. A mesh is closed when every edge is used by exactly two triangles.
 *
 * Welding uses an open-addressing hash table in a typed array (a Map keyed by strings costs
 * ~10x the memory and time for a million triangles), with a small direct-mapped cache in front:
 * a vertex is used by about six triangles that sit close together in the file, so most look-ups
 * hit the cache instead of a random place in a table of megabytes.
 * Edges are counted once at the end from the welded triangles, vertex by vertex (a compressed
 * adjacency list sorted per vertex), which reads memory in order instead of hashing every edge.
 */

const MIN_CAPACITY = 1 << 10;
const CACHE_BITS = 14;
const CACHE_SIZE = 1 << CACHE_BITS;
/** Per-vertex lists at most this long are sorted by insertion; longer ones natively. */
const INSERTION_SORT_MAX = 32;

function capacityFor(entries: number): number {
  let capacity = MIN_CAPACITY;
  // Load factor at most 1/2 keeps linear-probing chains short.
  while (capacity < entries * 2 && capacity < 1 << 30) capacity *= 2;
  return capacity;
}

// murmur3 word mix and finaliser: float bit patterns of round numbers differ only in their high
// bits while the table index takes the low bits, so every key word is avalanched.
function mixWord(h: number, k: number): number {
  k = Math.imul(k, 0xcc9e2d51);
  k = (k << 15) | (k >>> 17);
  h ^= Math.imul(k, 0x1b873593);
  h = (h << 13) | (h >>> 19);
  return (Math.imul(h, 5) + 0xe6546b64) | 0;
}

function fmix(h: number): number {
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  return h ^ (h >>> 16);
}

/**
 * Gives each distinct key (`words` uint32 words) a dense id 0, 1, 2 ... in order of first use.
 * The keys themselves sit in `keys`, id after id, in the order they were first seen; the hash
 * table holds only id + 1 (0 = empty), 4 bytes a slot. Comparing against `keys` mostly touches
 * recently written memory, so the random access is into a table a quarter the size.
 */
class VertexWelder {
  count = 0;
  private readonly words: number;
  private keys: Uint32Array;
  private table: Int32Array;
  private mask: number;
  private limit: number;
  /** direct-mapped cache of recent ids, indexed by hash */
  private readonly cache = new Int32Array(CACHE_SIZE);

  constructor(words: number, expectedVertices: number) {
    this.words = words;
    const capacity = capacityFor(expectedVertices);
    this.table = new Int32Array(capacity);
    this.mask = capacity - 1;
    this.limit = capacity >>> 1;
    this.keys = new Uint32Array(Math.max(this.limit, 1024) * words);
  }

  /** idOf for 3-word keys (binary STL), unrolled: the hot path of a large upload. */
  idOf3(src: Uint32Array, at: number): number {
    const k0 = src[at], k1 = src[at + 1], k2 = src[at + 2];
    const h = fmix(mixWord(mixWord(mixWord(0x9747b28c, k0), k1), k2));
    let keys = this.keys;
    const c = h & (CACHE_SIZE - 1);
    const cached = this.cache[c];
    if (cached !== 0) {
      const b = (cached - 1) * 3;
      if (keys[b] === k0 && keys[b + 1] === k1 && keys[b + 2] === k2) return cached - 1;
    }
    const table = this.table;
    const mask = this.mask;
    let i = h & mask;
    for (;;) {
      const id1 = table[i];
      if (id1 === 0) break;
      const b = (id1 - 1) * 3;
      if (keys[b] === k0 && keys[b + 1] === k1 && keys[b + 2] === k2) {
        this.cache[c] = id1;
        return id1 - 1;
      }
      i = (i + 1) & mask;
    }
    const id = this.count++;
    const b = id * 3;
    if (b + 3 > keys.length) keys = this.growKeys();
    keys[b] = k0;
    keys[b + 1] = k1;
    keys[b + 2] = k2;
    table[i] = id + 1;
    this.cache[c] = id + 1;
    if (this.count > this.limit) this.growTable();
    return id;
  }

  /** Id of the key src[at, at + words). */
  idOf(src: Uint32Array, at: number): number {
    const words = this.words;
    let h = 0x9747b28c;
    for (let w = 0; w < words; w++) h = mixWord(h, src[at + w]);
    h = fmix(h);
    let keys = this.keys;
    const c = h & (CACHE_SIZE - 1);
    const cached = this.cache[c];
    if (cached !== 0 && sameKey(keys, (cached - 1) * words, src, at, words)) return cached - 1;
    const table = this.table;
    const mask = this.mask;
    let i = h & mask;
    for (;;) {
      const id1 = table[i];
      if (id1 === 0) break;
      if (sameKey(keys, (id1 - 1) * words, src, at, words)) {
        this.cache[c] = id1;
        return id1 - 1;
      }
      i = (i + 1) & mask;
    }
    const id = this.count++;
    const b = id * words;
    if (b + words > keys.length) keys = this.growKeys();
    for (let w = 0; w < words; w++) keys[b + w] = src[at + w];
    table[i] = id + 1;
    this.cache[c] = id + 1;
    if (this.count > this.limit) this.growTable();
    return id;
  }

  /** Frees the memory once no more vertices will come. */
  release(): void {
    this.table = new Int32Array(0);
    this.keys = new Uint32Array(0);
  }

  private growKeys(): Uint32Array {
    const grown = new Uint32Array(this.keys.length * 2);
    grown.set(this.keys);
    this.keys = grown;
    return grown;
  }

  private growTable(): void {
    const words = this.words;
    const keys = this.keys;
    const capacity = (this.mask + 1) * 2;
    const table = new Int32Array(capacity);
    const mask = capacity - 1;
    // Re-insert in id order: reads `keys` front to back.
    for (let id = 0; id < this.count; id++) {
      let h = 0x9747b28c;
      for (let w = 0; w < words; w++) h = mixWord(h, keys[id * words + w]);
      let i = fmix(h) & mask;
      while (table[i] !== 0) i = (i + 1) & mask;
      table[i] = id + 1;
    }
    this.table = table;
    this.mask = mask;
    this.limit = capacity >>> 1;
  }
}

function sameKey(table: Uint32Array, base: number, keys: Uint32Array, at: number, words: number): boolean {
  for (let w = 0; w < words; w++) {
    if (table[base + w] !== keys[at + w]) return false;
  }
  return true;
}

/** Sorts a[s, e) ascending. */
function sortRange(a: Int32Array, s: number, e: number): void {
  if (e - s > INSERTION_SORT_MAX) {
    a.subarray(s, e).sort();
    return;
  }
  for (let i = s + 1; i < e; i++) {
    const v = a[i];
    let j = i - 1;
    while (j >= s && a[j] > v) {
      a[j + 1] = a[j];
      j--;
    }
    a[j + 1] = v;
  }
}

/**
 * Feed it each triangle's three vertex keys; `isClosed()` answers at the end.
 * Memory: ~20 bytes per vertex (binary; ~32 for ASCII) plus 12 bytes per triangle for its vertex ids.
 */
export class ClosedMeshChecker {
  private readonly welder: VertexWelder;
  private readonly words: number;
  private triangles: Int32Array;
  private triangleCount = 0;

  /**
   * @param wordsPerVertex 3 (float32 bits) or 6 (float64 bits)
   * @param expectedTriangles a sizing hint; a closed mesh has about T/2 vertices
   */
  constructor(wordsPerVertex: 3 | 6, expectedTriangles = 0) {
    const hint = Math.min(Math.max(Math.floor(expectedTriangles), 0), 1 << 22);
    this.words = wordsPerVertex;
    this.welder = new VertexWelder(wordsPerVertex, hint / 2);
    this.triangles = new Int32Array(Math.max(3 * hint, 3 * 1024));
  }

  /** keys: the three vertices' words, vertex after vertex. */
  addTriangle(keys: Uint32Array): void {
    const n = this.words;
    let t = this.triangles;
    const at = 3 * this.triangleCount;
    if (at + 3 > t.length) {
      const grown = new Int32Array(t.length * 2);
      grown.set(t);
      this.triangles = t = grown;
    }
    const welder = this.welder;
    if (n === 3) {
      t[at] = welder.idOf3(keys, 0);
      t[at + 1] = welder.idOf3(keys, 3);
      t[at + 2] = welder.idOf3(keys, 6);
    } else {
      t[at] = welder.idOf(keys, 0);
      t[at + 1] = welder.idOf(keys, n);
      t[at + 2] = welder.idOf(keys, 2 * n);
    }
    this.triangleCount++;
  }

  get vertexCount(): number {
    return this.welder.count;
  }

  /** True when every edge is used by exactly two triangles. Call once, at the end. */
  isClosed(): boolean {
    this.welder.release();
    const vertices = this.welder.count;
    const tri = this.triangles;
    const n = 3 * this.triangleCount;
    this.triangles = new Int32Array(0);
    if (n === 0) return false;
    // Each undirected edge (p, q), p < q, is listed under p: a compressed adjacency list.
    const start = new Int32Array(vertices + 1);
    countLowerEnds(tri, n, start);
    const total = prefixSums(start, vertices);
    const other = new Int32Array(total);
    listHigherEnds(tri, n, start.slice(0, vertices), other);
    return total > 0 && everyNeighbourTwice(start, other, vertices);
  }
}

// The passes of isClosed(), each loop in its own function: a long loop is compiled while it runs
// (on-stack replacement), and code after it in the same function, not yet run, then drops back
// to the interpreter at the loop's exit (seen with --trace-deopt).

function countLowerEnds(tri: Int32Array, n: number, start: Int32Array): void {
  for (let i = 0; i < n; i += 3) {
    const a = tri[i], b = tri[i + 1], c = tri[i + 2];
    // A collapsed edge of a zero-area triangle has nothing to pair with; it is skipped.
    if (a !== b) start[a < b ? a : b]++;
    if (b !== c) start[b < c ? b : c]++;
    if (c !== a) start[c < a ? c : a]++;
  }
}

/** Turns counts into start offsets in place; returns the total. */
function prefixSums(start: Int32Array, vertices: number): number {
  let total = 0;
  for (let v = 0; v < vertices; v++) {
    const d = start[v];
    start[v] = total;
    total += d;
  }
  start[vertices] = total;
  return total;
}

function listHigherEnds(tri: Int32Array, n: number, fill: Int32Array, other: Int32Array): void {
  for (let i = 0; i < n; i += 3) {
    const a = tri[i], b = tri[i + 1], c = tri[i + 2];
    if (a < b) other[fill[a]++] = b;
    else if (b < a) other[fill[b]++] = a;
    if (b < c) other[fill[b]++] = c;
    else if (c < b) other[fill[c]++] = b;
    if (c < a) other[fill[c]++] = a;
    else if (a < c) other[fill[a]++] = c;
  }
}

/** Sorted per vertex, every neighbour must appear exactly twice. */
function everyNeighbourTwice(start: Int32Array, other: Int32Array, vertices: number): boolean {
  for (let v = 0; v < vertices; v++) {
    const s = start[v];
    const e = start[v + 1];
    if (e - s > 1) sortRange(other, s, e);
    for (let k = s; k < e; ) {
      let j = k + 1;
      while (j < e && other[j] === other[k]) j++;
      if (j - k !== 2) return false;
      k = j;
    }
  }
  return true;
}
