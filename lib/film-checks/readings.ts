/**
 * Gauge readings as typed, pasted or exported: parsing cells, grouping a flat list into SSPC-PA 2
 * spots and areas, checking plausibility, and showing acceptance reasons in the user's units.
 * Pure: no next, react, db or environment.
 */
import { convert, type UnitSystem } from "../coating-math/display-units";

/** Beyond a coating gauge's plausible range: thicker than 5 mm is not a paint film. */
export const MAX_PLAUSIBLE_UM = 5000;

export interface CellError {
  /** position in the list of non-empty cells, 0 first */
  index: number;
  text: string;
  message: string;
}

export interface ParsedCells {
  valuesUm: number[];
  errors: CellError[];
}

/** Why a reading (µm) is implausible, or null when it is fine. */
export function readingProblem(valueUm: number): string | null {
  if (!Number.isFinite(valueUm)) return "Enter a number.";
  if (valueUm < 0) return "A thickness cannot be negative.";
  if (valueUm > MAX_PLAUSIBLE_UM) return `Above ${MAX_PLAUSIBLE_UM} µm (5 mm): not a plausible film reading.`;
  return null;
}

/** One cell typed in `system`'s film unit (µm or mil) → µm, or an error message. */
export function parseCell(text: string, system: UnitSystem): { valueUm: number } | { message: string } {
  // Spreadsheets in many locales write a decimal comma; a single comma is taken as one.
  const t = text.trim().replace(/^(-?\d+),(\d+)$/, "$1.$2");
  if (!/^-?(\d+(\.\d*)?|\.\d+)$/.test(t)) return { message: `"${text.trim()}" is not a number.` };
  const shown = Number(t);
  const valueUm = system === "us" ? convert(shown, "mil", "um") : shown;
  const problem = readingProblem(valueUm);
  return problem ? { message: problem } : { valueUm };
}

/** A pasted column (one reading a line; tabs also split) → readings in µm and the bad cells. */
export function parseCells(text: string, system: UnitSystem): ParsedCells {
  const cells = text
    .split(/[\r\n\t]+/)
    .map((c) => c.trim())
    .filter((c) => c !== "");
  const valuesUm: number[] = [];
  const errors: CellError[] = [];
  cells.forEach((cell, index) => {
    const r = parseCell(cell, system);
    if ("valueUm" in r) valuesUm.push(r.valueUm);
    else errors.push({ index, text: cell, message: r.message });
  });
  return { valuesUm, errors };
}

/**
 * A flat list → areas of spots of `readingsPerSpot` readings, `spotsPerArea` spots an area
 * (SSPC-PA 2: 3 readings a spot at least, 5 spots an area). A short last spot is kept as is so
 * the acceptance names it.
 */
export function groupReadings(valuesUm: readonly number[], readingsPerSpot: number, spotsPerArea: number): number[][][] {
  const spots: number[][] = [];
  for (let i = 0; i < valuesUm.length; i += readingsPerSpot) spots.push(valuesUm.slice(i, i + readingsPerSpot));
  const areas: number[][][] = [];
  for (let i = 0; i < spots.length; i += spotsPerArea) areas.push(spots.slice(i, i + spotsPerArea));
  return areas;
}

/** Readings of either shape, flattened. */
export function flattenReadings(readings: number[] | number[][][]): number[] {
  const out: number[] = [];
  for (const a of readings) {
    if (Array.isArray(a)) for (const s of a) for (const r of s) out.push(r);
    else out.push(a);
  }
  return out;
}

/** Implausible readings by path ("areas.0.1.2" or "readingsUm.4") → message. */
export function implausibleReadings(readings: { areas?: number[][][]; readingsUm?: number[] }): Record<string, string> {
  const fields: Record<string, string> = {};
  readings.areas?.forEach((spots, i) =>
    spots.forEach((rs, j) =>
      rs.forEach((r, k) => {
        const p = readingProblem(r);
        if (p) fields[`areas.${i}.${j}.${k}`] = p;
      }),
    ),
  );
  readings.readingsUm?.forEach((r, k) => {
    const p = readingProblem(r);
    if (p) fields[`readingsUm.${k}`] = p;
  });
  return fields;
}

/** Rewrites "45 µm" in an acceptance sentence to the user's film unit (mil for US customary). */
export function localizeFilmText(text: string, system: UnitSystem): string {
  if (system === "metric") return text;
  return text.replace(/(\d+(?:\.\d+)?) µm/g, (_m, n: string) => {
    const mil = convert(Number(n), "um", "mil");
    return `${Number(mil.toFixed(2))} mil`;
  });
}

export interface HistogramBin {
  fromUm: number;
  toUm: number;
  count: number;
}

/** Equal-width bins of `widthUm` covering the readings and the spec band. */
export function histogram(valuesUm: readonly number[], specMinUm: number, specMaxUm: number, binCount = 12): HistogramBin[] {
  if (valuesUm.length === 0) return [];
  const lo = Math.min(specMinUm * 0.8, ...valuesUm);
  const hi = Math.max(specMaxUm * 1.2, ...valuesUm);
  const widthUm = (hi - lo) / binCount || 1;
  const bins: HistogramBin[] = Array.from({ length: binCount }, (_, i) => ({
    fromUm: lo + i * widthUm,
    toUm: lo + (i + 1) * widthUm,
    count: 0,
  }));
  for (const v of valuesUm) bins[Math.min(binCount - 1, Math.floor((v - lo) / widthUm))].count += 1;
  return bins;
}

/** Share of readings inside [minUm, maxUm] (inclusive), or null with no readings. */
export function fractionInSpec(valuesUm: readonly number[], minUm: number, maxUm: number): number | null {
  if (!valuesUm.length) return null;
  return valuesUm.filter((v) => v >= minUm && v <= maxUm).length / valuesUm.length;
}
