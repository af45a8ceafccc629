/**
 * A gauge's CSV export, already split into rows (papaparse in the browser), read through a
 * column mapping saved per gauge. Pure.
 */
import type { UnitSystem } from "../coating-math/display-units";
import { parseCell, type CellError } from "./readings";

export interface CsvMapping {
  /** header name of the column holding the readings */
  readingColumn: string;
  /** unit the gauge writes */
  unit: "um" | "mil";
}

export interface MappedCsv {
  valuesUm: number[];
  /** index = data row (0 first, header excluded) */
  errors: CellError[];
  /** set when the mapping's column is not in the file */
  columnError: string | null;
}

/** Rows with a header row first → readings in µm via the mapping; bad cells are listed. */
export function readMappedCsv(rows: string[][], mapping: CsvMapping): MappedCsv {
  const [header, ...data] = rows;
  const col = (header ?? []).map((h) => h.trim()).indexOf(mapping.readingColumn.trim());
  if (col < 0) {
    const names = (header ?? []).map((h) => `"${h.trim()}"`).join(", ") || "no columns";
    return {
      valuesUm: [],
      errors: [],
      columnError: `The file has no column "${mapping.readingColumn}" (it has ${names}). Choose the reading column again.`,
    };
  }
  const system: UnitSystem = mapping.unit === "mil" ? "us" : "metric";
  const valuesUm: number[] = [];
  const errors: CellError[] = [];
  data.forEach((row, index) => {
    if (row.every((c) => c.trim() === "")) return;
    const cell = row[col] ?? "";
    const r = parseCell(cell, system);
    if ("valueUm" in r) valuesUm.push(r.valueUm);
    else errors.push({ index, text: cell, message: `Row ${index + 2}: ${r.message}` });
  });
  return { valuesUm, errors, columnError: null };
}
