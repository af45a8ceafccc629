/**
 * STL measurement in one streaming pass: triangle count, surface area, enclosed volume,
 * bounding box and (optionally) whether the mesh is closed. Platform-free: bytes in, numbers out.
 *
 * Format detection follows the one reliable rule: a file whose length is exactly
 * 84 + 50 x (the triangle count in bytes 80-83) is binary, even when its 80-byte header begins
 * with "solid" (many CAD exporters write that). A file that does not begin with "solid" can only
 * be binary. When the total length is not known yet (bytes arriving from an upload), a file that
 * begins with "solid" is read as text while its first bytes are kept; if the text reading fails
 * before the first whole facet, those bytes are replayed as binary.
 */
import { GeometryError } from "./errors";
import { type StlUnit, unitFactors } from "./length-units";
import { ClosedMeshChecker } from "./mesh-topology";
import { AsciiStlParser } from "./stl-ascii";
import { TriangleSums } from "./triangle-sums";

export type StlFormat = "binary" | "ascii";

export interface StlMeasurement {
  format: StlFormat;
  triangleCount: number;
  /** total surface area */
  areaM2: number;
  /** enclosed volume (absolute value; meaningful for a closed mesh) */
  volumeM3: number;
  /** axis-aligned bounding box size */
  bboxMm: { x: number; y: number; z: number };
  /** every edge shared by exactly two triangles; null when the check was switched off */
  closed: boolean | null;
}

export interface StlMeasurerOptions {
  /** the unit the file was drawn in: STL itself carries none */
  unit: StlUnit;
  /** weld vertices and count edges (memory grows with vertex count); default true */
  closedCheck?: boolean;
  /**
   * the file's exact length in bytes, when known (not a multipart body's length): decides
   * binary vs text at once; without it a "solid" file is read as text on probation
   */
  totalBytes?: number;
}

export interface StlMeasurer {
  /** Feed the next bytes. The chunk is not kept, so the caller may reuse its buffer. */
  push(chunk: Uint8Array): void;
  /** All bytes fed: check the file is complete and return the measurement. */
  finish(): StlMeasurement;
}

const HEADER_BYTES = 84;
const RECORD_BYTES = 50;
/** Largest presizing trusted from a header count that no file length confirms. */
const UNVERIFIED_HINT_TRIANGLES = 1 << 18;
/** Bytes kept while it is unclear whether a "solid" file is text or binary. */
const PROBE_LIMIT_BYTES = 1 << 20;

const fmt = (n: number): string => n.toLocaleString("en-US");

function binaryLength(count: number): number {
  return HEADER_BYTES + RECORD_BYTES * count;
}

/** True when the bytes begin (after a byte-order mark and white space) with "solid". */
function beginsWithSolid(bytes: Uint8Array, length: number): boolean {
  let p = 0;
  if (bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf) p = 3;
  while (p < length && (bytes[p] === 32 || (bytes[p] >= 9 && bytes[p] <= 13))) p++;
  const solid = "solid";
  if (length - p < solid.length) return false;
  for (let i = 0; i < solid.length; i++) {
    if ((bytes[p + i] | 0x20) !== solid.charCodeAt(i)) return false;
  }
  return true;
}

function looksLikeText(bytes: Uint8Array, length: number): boolean {
  for (let i = 0; i < length; i++) {
    const c = bytes[i];
    if ((c < 32 && c !== 9 && c !== 10 && c !== 13) || c === 127) return false;
  }
  return true;
}

type Phase = "header" | "probe" | "ascii" | "binary" | "done";

class StreamingStlMeasurer implements StlMeasurer {
  private readonly unit: StlUnit;
  private readonly closedCheck: boolean;
  private readonly totalBytes: number | undefined;
  private readonly sums = new TriangleSums();
  private checker: ClosedMeshChecker | null = null;
  private phase: Phase = "header";
  private failure: GeometryError | null = null;
  private bytesSeen = 0;

  private readonly header = new Uint8Array(HEADER_BYTES);
  private headerLen = 0;
  private solidHeader = false;
  private declaredCount = 0;

  private ascii: AsciiStlParser | null = null;
  private probe: Uint8Array | null = null;
  private probeLen = 0;

  private records = 0;
  private readonly carry = new Uint8Array(RECORD_BYTES);
  private readonly carryView = new DataView(this.carry.buffer);
  private carryLen = 0;
  private readonly bits = new Uint32Array(9);

  constructor(options: StlMeasurerOptions) {
    unitFactors(options.unit); // validates the unit up front
    this.unit = options.unit;
    this.closedCheck = options.closedCheck ?? true;
    this.totalBytes = options.totalBytes;
  }

  push(chunk: Uint8Array): void {
    if (this.failure) throw this.failure;
    if (this.phase === "done") throw new Error("push() after finish()");
    if (chunk.length === 0) return;
    this.bytesSeen += chunk.length;
    try {
      this.route(chunk);
    } catch (error) {
      if (error instanceof GeometryError) this.failure = error;
      throw error;
    }
  }

  finish(): StlMeasurement {
    if (this.failure) throw this.failure;
    if (this.phase === "done") throw new Error("finish() called twice");
    try {
      const format = this.complete();
      this.phase = "done";
      return this.result(format);
    } catch (error) {
      if (error instanceof GeometryError) this.failure = error;
      throw error;
    }
  }

  private route(chunk: Uint8Array): void {
    let offset = 0;
    if (this.phase === "header") {
      const take = Math.min(HEADER_BYTES - this.headerLen, chunk.length);
      this.header.set(chunk.subarray(0, take), this.headerLen);
      this.headerLen += take;
      offset = take;
      if (this.headerLen < HEADER_BYTES) return;
      this.decide();
    }
    if (offset >= chunk.length) return;
    switch (this.phase) {
      case "binary":
        this.pushBinary(chunk, offset);
        return;
      case "ascii":
        this.pushAscii(chunk, offset);
        return;
      case "probe":
        this.pushProbe(chunk, offset);
        return;
    }
  }

  /** Called once the 84 header bytes are in. */
  private decide(): void {
    this.solidHeader = beginsWithSolid(this.header, HEADER_BYTES);
    this.declaredCount = new DataView(this.header.buffer).getUint32(80, true);
    const total = this.totalBytes;
    if (!this.solidHeader || (total !== undefined && total === binaryLength(this.declaredCount))) {
      this.startBinary();
      return;
    }
    this.startAscii();
    if (total !== undefined) {
      this.phase = "ascii";
      this.pushAscii(this.header, 0);
      return;
    }
    this.phase = "probe";
    this.probe = new Uint8Array(64 * 1024);
    this.probe.set(this.header);
    this.probeLen = HEADER_BYTES;
    this.feedProbe(this.header, 0);
  }

  private startAscii(): void {
    this.checker = this.closedCheck ? new ClosedMeshChecker(6) : null;
    this.ascii = new AsciiStlParser(this.sums, this.checker);
  }

  private startBinary(): void {
    this.phase = "binary";
    // Size the closed check from the triangle count, unless the count may be a lie (a damaged
    // header) with no file length to check it against: then start small and grow.
    const hint =
      this.totalBytes !== undefined
        ? Math.min(this.declaredCount, Math.floor((this.totalBytes - HEADER_BYTES) / RECORD_BYTES))
        : Math.min(this.declaredCount, UNVERIFIED_HINT_TRIANGLES);
    this.checker = this.closedCheck ? new ClosedMeshChecker(3, hint) : null;
  }

  private pushAscii(chunk: Uint8Array, offset: number): void {
    const parser = this.ascii!;
    // While probing, a NUL byte (never in a text STL, almost always in a binary one) settles it.
    if (this.phase === "probe" && chunk.indexOf(0, offset) !== -1) throw parser.binaryData();
    try {
      parser.push(chunk, offset);
    } catch (error) {
      throw parser.sawBinaryData ? this.binaryInText(error as GeometryError) : error;
    }
  }

  private binaryInText(error: GeometryError): GeometryError {
    const total = this.totalBytes;
    if (total === undefined) return error;
    const expected = binaryLength(this.declaredCount);
    return new GeometryError(
      total < expected ? "truncated" : "not_stl",
      `${error.message} As a binary STL its header says ${fmt(this.declaredCount)} triangles, which take ${fmt(expected)} bytes, but the file has ${fmt(total)} bytes: it may be cut short or damaged.`,
    );
  }

  private pushProbe(chunk: Uint8Array, offset: number): void {
    const need = this.probeLen + chunk.length - offset;
    if (need > this.probe!.length) {
      const grown = new Uint8Array(Math.max(need, this.probe!.length * 2));
      grown.set(this.probe!.subarray(0, this.probeLen));
      this.probe = grown;
    }
    this.probe!.set(chunk.subarray(offset), this.probeLen);
    this.probeLen = need;
    this.feedProbe(chunk, offset);
  }

  private feedProbe(chunk: Uint8Array, offset: number): void {
    const parser = this.ascii!;
    try {
      this.pushAscii(chunk, offset);
    } catch (error) {
      // Fall back to binary only when the bytes are not text: a text file with a typo is
      // reported as such (a binary count field of four printable bytes would mean > 500 M triangles).
      if (!(error instanceof GeometryError) || parser.committed) throw error;
      if (!parser.sawBinaryData && looksLikeText(this.header, HEADER_BYTES)) throw error;
      this.fallBackToBinary();
      return;
    }
    if (this.ascii!.committed || this.probeLen > PROBE_LIMIT_BYTES) {
      this.phase = "ascii";
      this.probe = null;
    }
  }

  /** The "solid" file was not text after all: read the kept bytes again as binary. */
  private fallBackToBinary(): void {
    const kept = this.probe!.subarray(0, this.probeLen);
    this.probe = null;
    // The text reader had not finished a facet, so nothing was measured yet.
    this.ascii = null;
    this.startBinary();
    if (kept.length > HEADER_BYTES) this.pushBinary(kept, HEADER_BYTES);
  }

  private pushBinary(chunk: Uint8Array, offset: number): void {
    let pos = offset;
    const len = chunk.length;
    const expected = this.declaredCount;
    if (this.records >= expected) return; // trailing bytes: counted in bytesSeen, judged in finish()
    if (this.carryLen > 0) {
      const take = Math.min(RECORD_BYTES - this.carryLen, len - pos);
      this.carry.set(chunk.subarray(pos, pos + take), this.carryLen);
      this.carryLen += take;
      pos += take;
      if (this.carryLen < RECORD_BYTES) return;
      this.carryLen = 0;
      this.records += this.binaryRecords(this.carryView, 0, 1);
      if (this.records >= expected) return;
    }
    const whole = Math.min(Math.floor((len - pos) / RECORD_BYTES), expected - this.records);
    if (whole > 0) {
      const view = new DataView(chunk.buffer, chunk.byteOffset, chunk.byteLength);
      this.records += this.binaryRecords(view, pos, whole);
      pos += whole * RECORD_BYTES;
    }
    if (this.records < expected && pos < len) {
      this.carry.set(chunk.subarray(pos, len));
      this.carryLen = len - pos;
    }
  }

  /** Measures n 50-byte records starting at `offset`; returns n. */
  private binaryRecords(view: DataView, offset: number, n: number): number {
    const bad = this.sums.addBinaryRecords(view, offset, n);
    if (bad !== -1) {
      throw new GeometryError(
        "non_finite",
        `Triangle ${fmt(this.records + bad + 1)} has a coordinate that is not a finite number (NaN or infinity).`,
      );
    }
    const checker = this.checker;
    if (checker !== null) {
      const bits = this.bits;
      for (let r = 0; r < n; r++) {
        const o = offset + r * RECORD_BYTES + 12;
        for (let k = 0; k < 9; k++) {
          const b = view.getUint32(o + 4 * k, true);
          // -0 and +0 are the same coordinate and must weld.
          bits[k] = b === 0x80000000 ? 0 : b;
        }
        checker.addTriangle(bits);
      }
    }
    return n;
  }

  /** Checks the file is whole; returns its format. */
  private complete(): StlFormat {
    if (this.phase === "header") {
      if (this.bytesSeen === 0) throw new GeometryError("empty_file", "The file is empty.");
      if (beginsWithSolid(this.header, this.headerLen)) {
        this.startAscii();
        this.phase = "ascii";
        this.pushAscii(this.header.subarray(0, this.headerLen), 0);
      } else {
        throw new GeometryError(
          "not_stl",
          `The file has only ${fmt(this.bytesSeen)} bytes and does not start with "solid", so it is not an STL file (a binary STL has at least 84 bytes).`,
        );
      }
    }
    if (this.phase === "probe" || this.phase === "ascii") {
      this.phase = "ascii";
      this.probe = null;
      const parser = this.ascii!;
      try {
        parser.finish();
      } catch (error) {
        throw parser.sawBinaryData ? this.binaryInText(error as GeometryError) : error;
      }
      return "ascii";
    }
    const expected = binaryLength(this.declaredCount);
    const got = this.bytesSeen;
    if (got !== expected) {
      if (!this.solidHeader && looksLikeText(this.header, HEADER_BYTES)) {
        throw new GeometryError(
          "not_stl",
          'The file is text but does not start with "solid", so it is not an STL file.',
        );
      }
      if (got < expected) {
        throw new GeometryError(
          "truncated",
          `The binary STL file is incomplete: its header says ${fmt(this.declaredCount)} triangles, which take ${fmt(expected)} bytes, but the file has only ${fmt(got)} bytes. It may be cut short, or not an STL file at all.`,
        );
      }
      throw new GeometryError(
        "not_stl",
        `The file is not a valid binary STL: its header says ${fmt(this.declaredCount)} triangles, which take ${fmt(expected)} bytes, but the file has ${fmt(got)} bytes.`,
      );
    }
    return "binary";
  }

  private result(format: StlFormat): StlMeasurement {
    const sums = this.sums;
    if (sums.count === 0) throw new GeometryError("no_triangles", "The file contains no triangles.");
    if (sums.zeroAreaCount === sums.count) {
      throw new GeometryError(
        "zero_area",
        `All ${fmt(sums.count)} triangles in the file have zero area, so there is no surface to measure.`,
      );
    }
    const factors = unitFactors(this.unit);
    const extent = sums.extent;
    return {
      format,
      triangleCount: sums.count,
      areaM2: (sums.doubleAreaSum / 2) * factors.m2PerUnit2,
      volumeM3: (Math.abs(sums.sixVolumeSum) / 6) * factors.m3PerUnit3,
      bboxMm: {
        x: extent.x * factors.mmPerUnit,
        y: extent.y * factors.mmPerUnit,
        z: extent.z * factors.mmPerUnit,
      },
      closed: this.checker === null ? null : this.checker.isClosed(),
    };
  }
}

/** An incremental measurer: push the file's bytes in any chunk sizes, then finish(). */
export function createStlMeasurer(options: StlMeasurerOptions): StlMeasurer {
  return new StreamingStlMeasurer(options);
}

/** Measures a whole STL file held in memory. */
export function measureStlBuffer(
  bytes: Uint8Array,
  unit: StlUnit,
  options: { closedCheck?: boolean } = {},
): StlMeasurement {
  const measurer = createStlMeasurer({ unit, closedCheck: options.closedCheck, totalBytes: bytes.length });
  measurer.push(bytes);
  return measurer.finish();
}
