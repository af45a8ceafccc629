/**
 * Gauge readings as people paste them from a spreadsheet or a gauge's export: one spot per line
 * (cells split by tab, comma, semicolon or spaces), a blank line between areas, an optional
 * header row. Every cell that is not a reading is reported with its line and position.
 */
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { formatSignificant } from "@/lib/coating-math/display-units";
import { parseDecimal, shownToApi, apiToShown } from "./display-units";

export interface SpotReadings {
  /** 1-based line of the pasted text */
  line: number;
  readingsUm: number[];
}

export interface BadCell {
  line: number;
  /** 1-based position in the line */
  cell: number;
  text: string;
  why: string;
}

export interface ParsedReadings {
  /** spots grouped by blank lines (one group when there are none) */
  groups: SpotReadings[][];
  bad: BadCell[];
  headerLine: number | null;
  spotCount: number;
}

/** The separator a line uses: tab (spreadsheet copy), then comma/semicolon (CSV), then spaces. */
function cellsOf(line: string): string[] {
  const parts = line.includes("\t") ? line.split("\t") : /[,;]/.test(line) ? line.split(/[,;]/) : line.trim().split(/\s+/);
  return parts.map((c) => c.trim());
}

/** Readings typed in `system`'s film unit (µm or mil) → µm. */
export function parseReadings(text: string, system: UnitSystem): ParsedReadings {
  const lines = text.split(/\r?\n/);
  const groups: SpotReadings[][] = [[]];
  const bad: BadCell[] = [];
  let headerLine: number | null = null;
  let seenData = false;
  let spotCount = 0;
  lines.forEach((raw, i) => {
    const line = i + 1;
    if (raw.trim() === "") {
      if (groups[groups.length - 1].length > 0) groups.push([]);
      return;
    }
    const cells = cellsOf(raw);
    // A first row without a single number is a header ("Spot, Reading 1, Reading 2").
    if (!seenData && cells.every((c) => c === "" || parseDecimal(c) === null)) {
      headerLine = line;
      seenData = true;
      return;
    }
    seenData = true;
    const readingsUm: number[] = [];
    cells.forEach((c, k) => {
      if (c === "") return; // a trailing tab or comma from the spreadsheet
      const n = parseDecimal(c);
      if (n === null) bad.push({ line, cell: k + 1, text: c, why: "is not a number" });
      else if (n < 0) bad.push({ line, cell: k + 1, text: c, why: "is negative" });
      else readingsUm.push(shownToApi("filmUm", n, system));
    });
    if (readingsUm.length > 0) {
      groups[groups.length - 1].push({ line, readingsUm });
      spotCount += 1;
    }
  });
  if (groups.length > 1 && groups[groups.length - 1].length === 0) groups.pop();
  return { groups: groups[0].length === 0 && groups.length === 1 ? [] : groups, bad, headerLine, spotCount };
}

/**
 * SSPC-PA 2 areas: the blank-line groups when there are several, otherwise every 5 spots in
 * order (PA 2 takes 5 spot measurements per area).
 */
export function toAreas(parsed: ParsedReadings, spotsPerArea: number): SpotReadings[][] {
  if (parsed.groups.length !== 1) return parsed.groups;
  const spots = parsed.groups[0];
  const areas: SpotReadings[][] = [];
  for (let i = 0; i < spots.length; i += spotsPerArea) areas.push(spots.slice(i, i + spotsPerArea));
  return areas;
}

const NUMBER_CELL = /(^|[\t,; ])([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)(?=$|[\t,; ])/g;

/** The same readings re-typed in the other film unit; separators, blank lines and bad cells stay. */
export function convertReadingsText(text: string, from: UnitSystem, to: UnitSystem): string {
  if (from === to) return text;
  const header = parseReadings(text, from).headerLine;
  return text
    .split(/(\r?\n)/)
    .map((part, i) => {
      if (i % 2 === 1 || (header !== null && i / 2 + 1 === header)) return part;
      return part.replace(NUMBER_CELL, (_m, sep: string, num: string) => {
        const um = shownToApi("filmUm", Number(num), from);
        return `${sep}${formatSignificant(apiToShown("filmUm", um, to), 6)}`;
      });
    })
    .join("");
}

/** Rows from a CSV file → text in the paste format (tab between cells). */
export function rowsToText(rows: unknown[][]): string {
  return rows.map((r) => r.map((c) => String(c ?? "").trim()).join("\t").replace(/\t+$/, "")).join("\n");
}
