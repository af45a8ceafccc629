/**
 * Streaming parser for ASCII STL. Each chunk is parsed in place up to its last newline; the
 * partial line after it is carried to the next chunk. Numbers are read straight from the bytes,
 * without building a string per line or running a regular expression.
 *
 *   solid name
 *     facet normal ni nj nk
 *       outer loop
 *         vertex x y z   (three times)
 *       endloop
 *     endfacet
 *   endsolid name
 */
import { GeometryError } from "./errors";
import type { ClosedMeshChecker } from "./mesh-topology";
import type { TriangleSums } from "./triangle-sums";

/** A line longer than this is not STL (real "solid" names are short). */
export const MAX_ASCII_LINE_BYTES = 64 * 1024;

// What the next non-blank line must be.
const State = {
  Solid: 0,
  FacetOrEnd: 1,
  OuterLoop: 2,
  Vertex: 3,
  EndLoop: 4,
  EndFacet: 5,
  AfterEnd: 6,
} as const;
type State = (typeof State)[keyof typeof State];

function word(text: string): Uint8Array {
  return Uint8Array.from(text, (ch) => ch.charCodeAt(0));
}
const W_SOLID = word("solid");
const W_ENDSOLID = word("endsolid");
const W_FACET = word("facet");
const W_NORMAL = word("normal");
const W_OUTER = word("outer");
const W_LOOP = word("loop");
const W_VERTEX = word("vertex");
const W_ENDLOOP = word("endloop");
const W_ENDFACET = word("endfacet");

const NEWLINE = 10;
// Exact powers of ten: 10^22 is the largest that a double holds exactly.
const POW10 = new Float64Array(Array.from({ length: 23 }, (_, i) => Number(`1e${i}`)));
// Up to 15 digits the integer mantissa stays below 2^53, so it is exact.
const MAX_FAST_DIGITS = 15;

/** 1 for the bytes a decimal number is written with: 0-9 + - . e E */
const NUMBER_CHAR = new Uint8Array(256);
for (const ch of "0123456789+-.eE") NUMBER_CHAR[ch.charCodeAt(0)] = 1;

const NOT_A_NUMBER = -1;
const NON_FINITE_WORD = -2;

/** space, \t, \r, \v, \f (a newline ends the line instead) */
function isSpace(c: number): boolean {
  return c === 32 || c === 9 || c === 13 || c === 11 || c === 12;
}

/** Printable excerpt of the line starting at `start`, for an error message. */
function excerpt(buf: Uint8Array, start: number, limit: number): string {
  let end = start;
  while (end < limit && buf[end] !== NEWLINE) end++;
  let text = "";
  const stop = Math.min(end, start + 60);
  for (let i = start; i < stop; i++) {
    const c = buf[i];
    text += c >= 32 && c < 127 ? String.fromCharCode(c) : "?";
  }
  return (end > stop ? `${text}…` : text).trim();
}

export class AsciiStlParser {
  /** True once a whole facet (or an "endsolid") has been read: the file really is ASCII STL. */
  committed = false;
  /** Set once bytes that cannot be text were seen. */
  sawBinaryData = false;
  private state: State = State.Solid;
  private lineNo = 0;
  private carry = new Uint8Array(256);
  private carryLen = 0;
  private readonly sums: TriangleSums;
  private readonly checker: ClosedMeshChecker | null;
  /** the facet's three vertices */
  private readonly values = new Float64Array(9);
  private readonly keyF64 = new Float64Array(9);
  private readonly keyU32 = new Uint32Array(this.keyF64.buffer);
  private vertexIndex = 0;

  constructor(sums: TriangleSums, checker: ClosedMeshChecker | null) {
    this.sums = sums;
    this.checker = checker;
  }

  push(chunk: Uint8Array, offset: number): void {
    let start = offset;
    const len = chunk.length;
    if (start >= len) return;
    if (this.carryLen > 0) {
      const nl = chunk.indexOf(NEWLINE, start);
      if (nl === -1) {
        this.appendCarry(chunk, start, len);
        return;
      }
      this.appendCarry(chunk, start, nl + 1);
      this.lines(this.carry, 0, this.carryLen);
      this.carryLen = 0;
      start = nl + 1;
    }
    const lastNl = chunk.lastIndexOf(NEWLINE);
    if (lastNl < start) {
      if (start < len) this.appendCarry(chunk, start, len);
      return;
    }
    this.lines(chunk, start, lastNl + 1);
    if (lastNl + 1 < len) this.appendCarry(chunk, lastNl + 1, len);
  }

  finish(): void {
    if (this.carryLen > 0) {
      this.lines(this.carry, 0, this.carryLen);
      this.carryLen = 0;
    }
    if (this.state === State.AfterEnd) return;
    if (this.state === State.FacetOrEnd) {
      throw new GeometryError(
        "ascii_syntax",
        `The text STL file ends after line ${this.lineNo} without its closing "endsolid" line, so it may be cut short.`,
      );
    }
    if (this.state === State.Solid) {
      throw new GeometryError("not_stl", 'The file has no "solid" line, so it is not an STL file.');
    }
    throw new GeometryError(
      "ascii_syntax",
      `The text STL file ends in the middle of a facet after line ${this.lineNo}, so it is cut short.`,
    );
  }

  binaryData(): GeometryError {
    this.sawBinaryData = true;
    const where = this.lineNo <= 1 ? "on its first line" : `after line ${this.lineNo - 1}`;
    return new GeometryError(
      "not_stl",
      `The file starts with "solid" like a text STL, but it contains binary data ${where}.`,
    );
  }

  private appendCarry(buf: Uint8Array, start: number, end: number): void {
    const need = this.carryLen + (end - start);
    if (need > MAX_ASCII_LINE_BYTES) {
      throw new GeometryError(
        "ascii_syntax",
        `Line ${this.lineNo + 1} is longer than ${MAX_ASCII_LINE_BYTES.toLocaleString("en-US")} characters, which no STL line is.`,
      );
    }
    if (need > this.carry.length) {
      const grown = new Uint8Array(Math.min(MAX_ASCII_LINE_BYTES, Math.max(need, this.carry.length * 2)));
      grown.set(this.carry.subarray(0, this.carryLen));
      this.carry = grown;
    }
    this.carry.set(buf.subarray(start, end), this.carryLen);
    this.carryLen = need;
  }

  /** Parses the whole lines in buf[p, end). */
  private lines(buf: Uint8Array, p: number, end: number): void {
    while (p < end) p = this.line(buf, p, end);
  }

  private syntax(buf: Uint8Array, lineStart: number, end: number, expected: string): GeometryError {
    return new GeometryError(
      "ascii_syntax",
      `Line ${this.lineNo} should be ${expected}, but it reads "${excerpt(buf, lineStart, end)}".`,
    );
  }

  /** The rest of the line must be blank; returns the start of the next line. */
  private endLine(buf: Uint8Array, p: number, end: number, lineStart: number, expected: string): number {
    while (p < end && isSpace(buf[p])) p++;
    if (p === end) return end;
    if (buf[p] === NEWLINE) return p + 1;
    throw this.syntax(buf, lineStart, end, expected);
  }

  /** Parses the line starting at p; returns the start of the next line. */
  private line(buf: Uint8Array, p: number, end: number): number {
    this.lineNo++;
    // UTF-8 byte-order mark some editors put at the start of a text file
    if (this.lineNo === 1 && buf[p] === 0xef && buf[p + 1] === 0xbb && buf[p + 2] === 0xbf) p += 3;
    while (p < end && isSpace(buf[p])) p++;
    if (p === end) return end;
    if (buf[p] === NEWLINE) return p + 1; // blank line
    const lineStart = p;
    // Three lines in seven are vertex lines: they take the short way.
    if (this.state === State.Vertex) return this.vertexLine(buf, p, end);

    switch (this.state) {
      case State.FacetOrEnd: {
        const afterFacet = this.keyword(buf, p, end, W_FACET);
        if (afterFacet >= 0) {
          this.state = State.OuterLoop;
          return this.facetLine(buf, lineStart, afterFacet, end);
        }
        if (this.keyword(buf, p, end, W_ENDSOLID) >= 0) {
          this.state = State.AfterEnd;
          this.committed = true;
          return this.nameLine(buf, p, end);
        }
        throw this.syntax(buf, lineStart, end, 'the start of a facet ("facet normal …") or the end of the solid ("endsolid")');
      }
      case State.OuterLoop: {
        p = this.keyword(buf, p, end, W_OUTER);
        if (p >= 0) {
          while (p < end && isSpace(buf[p])) p++;
          p = this.keyword(buf, p, end, W_LOOP);
        }
        if (p < 0) throw this.syntax(buf, lineStart, end, '"outer loop"');
        this.vertexIndex = 0;
        this.state = State.Vertex;
        return this.endLine(buf, p, end, lineStart, '"outer loop"');
      }
      case State.EndLoop: {
        p = this.keyword(buf, p, end, W_ENDLOOP);
        if (p < 0) throw this.syntax(buf, lineStart, end, '"endloop" (a facet has exactly three vertices)');
        this.state = State.EndFacet;
        return this.endLine(buf, p, end, lineStart, '"endloop"');
      }
      case State.EndFacet: {
        p = this.keyword(buf, p, end, W_ENDFACET);
        if (p < 0) throw this.syntax(buf, lineStart, end, '"endfacet"');
        p = this.endLine(buf, p, end, lineStart, '"endfacet"');
        this.triangle();
        this.state = State.FacetOrEnd;
        this.committed = true;
        return p;
      }
      default: {
        // State.Solid or State.AfterEnd
        const after = this.keyword(buf, p, end, W_SOLID);
        if (after < 0) {
          if (this.state === State.Solid) {
            throw new GeometryError(
              "not_stl",
              'The file does not start with "solid" or with a binary STL header, so it is not an STL file.',
            );
          }
          throw this.syntax(buf, lineStart, end, 'the end of the file or another "solid" after "endsolid"');
        }
        this.state = State.FacetOrEnd;
        return this.nameLine(buf, after, end);
      }
    }
  }

  /** "vertex x y z", starting at p (past any indentation). */
  private vertexLine(buf: Uint8Array, p: number, end: number): number {
    const lineStart = p;
    const expected = 'a vertex line with three numbers ("vertex x y z")';
    p = this.keyword(buf, p, end, W_VERTEX);
    if (p < 0) throw this.syntax(buf, lineStart, end, 'a vertex line ("vertex x y z")');
    const base = this.vertexIndex;
    for (let k = 0; k < 3; k++) {
      while (p < end && isSpace(buf[p])) p++;
      const next = this.parseNumber(buf, p, end, base + k);
      if (next < 0) {
        if (next === NON_FINITE_WORD) {
          throw new GeometryError(
            "non_finite",
            `Line ${this.lineNo} has a coordinate that is not a finite number (NaN or infinity): "${excerpt(buf, lineStart, end)}".`,
          );
        }
        throw this.syntax(buf, lineStart, end, expected);
      }
      p = next;
    }
    this.vertexIndex = base + 3;
    if (base === 6) this.state = State.EndLoop;
    return this.endLine(buf, p, end, lineStart, expected);
  }

  /** The free-text rest of a "solid"/"endsolid" line: anything printable. */
  private nameLine(buf: Uint8Array, p: number, end: number): number {
    for (; p < end; p++) {
      const c = buf[p];
      if (c === NEWLINE) return p + 1;
      if ((c < 32 && !isSpace(c)) || c === 127) throw this.binaryData();
    }
    return end;
  }

  private facetLine(buf: Uint8Array, lineStart: number, p: number, end: number): number {
    const expected = 'a facet line ("facet normal ni nj nk")';
    while (p < end && isSpace(buf[p])) p++;
    p = this.keyword(buf, p, end, W_NORMAL);
    if (p < 0) throw this.syntax(buf, lineStart, end, expected);
    // The normal is not used (it is recomputed from the vertices), so a NaN normal that some
    // exporters write for a sliver triangle is accepted; its shape is still checked.
    for (let k = 0; k < 3; k++) {
      while (p < end && isSpace(buf[p])) p++;
      p = this.skipNumber(buf, p, end);
      if (p < 0) throw this.syntax(buf, lineStart, end, expected);
    }
    return this.endLine(buf, p, end, lineStart, expected);
  }

  /**
   * Steps over a token made only of number characters (or nan/inf); -1 if there is none.
   * Cheaper than parsing it, for the normal that is never used.
   */
  private skipNumber(buf: Uint8Array, p: number, end: number): number {
    const start = p;
    let numeric = true;
    for (; p < end; p++) {
      const c = buf[p];
      // every byte up to 32 is white space, a newline or a control byte: all end the token
      if (c <= 32) break;
      if (NUMBER_CHAR[c] === 0) numeric = false;
    }
    if (p === start) return -1;
    if (numeric) return p;
    return this.nonFiniteWord(buf, start, end) === NON_FINITE_WORD ? p : -1;
  }

  private triangle(): void {
    const v = this.values;
    this.sums.add(v);
    const checker = this.checker;
    if (checker !== null) {
      const key = this.keyF64;
      // + 0 turns -0 into +0: the same point, so it must weld.
      for (let i = 0; i < 9; i++) key[i] = v[i] + 0;
      checker.addTriangle(this.keyU32);
    }
  }

  /** Position after `w` (any letter case) when it stands at p as a whole word, else -1. */
  private keyword(buf: Uint8Array, p: number, end: number, w: Uint8Array): number {
    const n = w.length;
    if (end - p < n || (buf[p] | 0x20) !== w[0]) return -1;
    for (let i = 1; i < n; i++) {
      if ((buf[p + i] | 0x20) !== w[i]) return -1;
    }
    p += n;
    if (p === end) return p;
    const c = buf[p];
    return isSpace(c) || c === NEWLINE ? p : -1;
  }

  /**
   * Reads a decimal number at p into values[slot]; returns the position after it,
   * NOT_A_NUMBER when the text is not a number, NON_FINITE_WORD for nan/inf/infinity or a
   * value too large for a double.
   * Up to 15 significant digits with a decimal exponent within ±22 take one correctly
   * rounded multiply or divide (Clinger's fast path); anything else goes through Number().
   */
  private parseNumber(buf: Uint8Array, p: number, end: number, slot: number): number {
    const tokenStart = p;
    let negative = false;
    let c = buf[p];
    if (c === 45 || c === 43) {
      negative = c === 45;
      p++;
    }
    let mantissa = 0;
    let digits = 0;
    const intStart = p;
    while (p < end) {
      const d = buf[p] - 48;
      if (d < 0 || d > 9) break;
      mantissa = mantissa * 10 + d;
      p++;
    }
    digits = p - intStart;
    let fraction = 0;
    if (p < end && buf[p] === 46) {
      p++;
      const fracStart = p;
      while (p < end) {
        const d = buf[p] - 48;
        if (d < 0 || d > 9) break;
        mantissa = mantissa * 10 + d;
        p++;
      }
      fraction = p - fracStart;
      digits += fraction;
    }
    if (digits === 0) return this.nonFiniteWord(buf, tokenStart, end);
    let exp10 = -fraction;
    if (p < end && (buf[p] | 0x20) === 101) {
      p++;
      let expNegative = false;
      c = buf[p];
      if (p < end && (c === 45 || c === 43)) {
        expNegative = c === 45;
        p++;
      }
      const expStart = p;
      let e = 0;
      while (p < end) {
        const d = buf[p] - 48;
        if (d < 0 || d > 9) break;
        if (e < 100000) e = e * 10 + d;
        p++;
      }
      if (p === expStart) return NOT_A_NUMBER;
      exp10 += expNegative ? -e : e;
    }
    if (p < end) {
      c = buf[p];
      if (!isSpace(c) && c !== NEWLINE) return NOT_A_NUMBER;
    }

    let value: number;
    if (digits <= MAX_FAST_DIGITS && exp10 >= -22 && exp10 <= 22) {
      value = exp10 < 0 ? mantissa / POW10[-exp10] : mantissa * POW10[exp10];
      if (negative) value = -value;
    } else {
      let text = "";
      for (let i = tokenStart; i < p; i++) text += String.fromCharCode(buf[i]);
      value = Number(text);
      // Only this path can overflow (1e999); the fast path stays below 1e38.
      if (!Number.isFinite(value)) return NON_FINITE_WORD;
    }
    this.values[slot] = value;
    return p;
  }

  private nonFiniteWord(buf: Uint8Array, p: number, end: number): number {
    let text = "";
    for (let i = p; i < end && !isSpace(buf[i]) && buf[i] !== NEWLINE && text.length < 12; i++) {
      text += String.fromCharCode(buf[i] | 0x20);
    }
    const bare = text.replace(/^[+-]/, "");
    return bare === "nan" || bare === "inf" || bare === "infinity" ? NON_FINITE_WORD : NOT_A_NUMBER;
  }
}
