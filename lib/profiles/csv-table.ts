/**
 * A data logger's CSV as a table of text cells: the header row found (loggers often write a few
 * lines about themselves first), unique column names, and every data row with its line number.
 * Numbers and times are read later, once the user has said what each column holds.
 */
import Papa from "papaparse";
import { DomainError } from "../coating-math/errors";

export const MAX_PROFILE_ROWS = 50_000;
export const MAX_PROFILE_COLUMNS = 40;

export interface CsvRow {
  /** 1-based line in the file (a quoted cell spanning lines would shift it; loggers write none) */
  line: number;
  cells: string[];
}

export interface CsvTable {
  header: string[];
  /** 1-based line of the header; 0 when the file has none and the columns were named "Column 1" … */
  headerLine: number;
  /** lines before the header (the logger's own notes), skipped */
  skippedLines: number;
  delimiter: string;
  /** "12,5" reads as 12.5: the file separates cells with ";" or tabs */
  decimalComma: boolean;
  rows: CsvRow[];
}

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const NUMBER_COMMA = /^[+-]?\d+,\d+$/;
const CLOCK = /^(?:(\d{4})-(\d{2})-(\d{2})[T ])?(\d{1,2}):(\d{2})(?::(\d{2}(?:[.,]\d+)?))?$/;

/** A cell as a number, or NaN. With `decimalComma`, "12,5" is 12.5. */
export function readNumberCell(text: string, decimalComma = false): number {
  const t = text.trim();
  if (NUMBER.test(t)) return Number(t);
  if (decimalComma && NUMBER_COMMA.test(t)) return Number(t.replace(",", "."));
  return Number.NaN;
}

/**
 * A clock time "hh:mm", "hh:mm:ss", "hh:mm:ss.s", optionally after an ISO date
 * ("2026-12-02 08:15:30"): seconds since midnight, or since 1970 when dated. NaN otherwise.
 */
export function readClockCell(text: string): number {
  const m = CLOCK.exec(text.trim());
  if (!m) return Number.NaN;
  const [, y, mo, d, hh, mm, ss] = m;
  const h = Number(hh);
  const min = Number(mm);
  const s = ss === undefined ? 0 : Number(ss.replace(",", "."));
  if (h > 23 || min > 59 || s >= 60) return Number.NaN;
  const daySeconds = h * 3600 + min * 60 + s;
  if (y === undefined) return daySeconds;
  const dayStart = Date.UTC(Number(y), Number(mo) - 1, Number(d)) / 1000;
  return Number.isFinite(dayStart) ? dayStart + daySeconds : Number.NaN;
}

function looksLikeValue(cell: string, decimalComma: boolean): boolean {
  return Number.isFinite(readNumberCell(cell, decimalComma)) || Number.isFinite(readClockCell(cell));
}

/** A row of readings: at least two cells hold numbers or times, and they are most of its cells. */
function isDataRow(cells: string[], decimalComma: boolean): boolean {
  const filled = cells.filter((c) => c.trim() !== "");
  const values = filled.filter((c) => looksLikeValue(c, decimalComma)).length;
  return values >= 2 && values * 2 >= filled.length;
}

function uniqueNames(raw: string[], width: number): string[] {
  const seen = new Map<string, number>();
  return Array.from({ length: width }, (_, i) => {
    const base = (raw[i] ?? "").trim() || `Column ${i + 1}`;
    const n = (seen.get(base) ?? 0) + 1;
    seen.set(base, n);
    return n === 1 ? base : `${base} (${n})`;
  });
}

/** Reads the CSV text; throws a DomainError (field `csv`) when there is nothing to read. */
export function readCsvTable(text: string): CsvTable {
  const source = text.replace(/^\uFEFF/, "");
  if (source.trim() === "") throw new DomainError("csv", "The file is empty.");
  const parsed = Papa.parse<string[]>(source, { skipEmptyLines: false, delimitersToGuess: [",", ";", "\t", "|"] });
  const delimiter = parsed.meta.delimiter || ",";
  const decimalComma = delimiter !== ",";
  const all = parsed.data.map((cells, i) => ({ line: i + 1, cells: cells.map((c) => String(c ?? "")) }));
  const nonEmpty = all.filter((r) => r.cells.some((c) => c.trim() !== ""));
  if (nonEmpty.length === 0) throw new DomainError("csv", "The file is empty.");

  const firstData = nonEmpty.findIndex((r) => isDataRow(r.cells, decimalComma));
  if (firstData < 0) {
    throw new DomainError("csv", "No row of the file holds readings: expected a time and temperatures on each line, separated by commas or semicolons.");
  }
  // The header is the last row with two or more filled cells above the first row of readings.
  let headerAt = -1;
  for (let i = firstData - 1; i >= 0; i -= 1) {
    if (nonEmpty[i].cells.filter((c) => c.trim() !== "").length >= 2) {
      headerAt = i;
      break;
    }
  }
  const dataRows = nonEmpty.slice(firstData);
  if (dataRows.length > MAX_PROFILE_ROWS) {
    throw new DomainError("csv", `The file has ${dataRows.length} rows of readings; at most ${MAX_PROFILE_ROWS} are accepted (log less often, or split the file).`);
  }
  const width = Math.max(headerAt >= 0 ? nonEmpty[headerAt].cells.length : 0, ...dataRows.map((r) => r.cells.length));
  if (width > MAX_PROFILE_COLUMNS) {
    throw new DomainError("csv", `The file has ${width} columns; at most ${MAX_PROFILE_COLUMNS} are accepted.`);
  }
  const header = uniqueNames(headerAt >= 0 ? nonEmpty[headerAt].cells : [], width);
  // trailing empty cells (a trailing delimiter) are padded so every row has the header's width
  const rows = dataRows.map((r) => ({ line: r.line, cells: Array.from({ length: width }, (_, i) => r.cells[i] ?? "") }));
  const headerLine = headerAt >= 0 ? nonEmpty[headerAt].line : 0;
  const skippedLines = headerAt >= 0 ? nonEmpty.filter((r) => r.line < headerLine).length : nonEmpty.slice(0, firstData).length;
  return { header, headerLine, skippedLines, delimiter, decimalComma, rows };
}
