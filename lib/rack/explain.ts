// The racking plan's reason in one sentence, for any unit system: the caller passes how lengths
// and masses are written (metric by default, as the API words it). Small and free of the planner
// itself so client screens can word a plan in the reader's units.
import { formatQuantity, type UnitSystem } from "@/lib/coating-math/display-units";
import type { OrientationMode, RackOrientation } from "./types";

export interface RackReasonFacts {
  part: { lengthMm: number; widthMm: number; heightMm: number; massKg: number };
  /** the window as the planner sees it: width × height × depth */
  windowMm: [number, number, number];
  maxLoadKg: number;
  clearanceMm: number;
  orientations: OrientationMode;
  orientation?: RackOrientation | null;
  count: number;
  spaceCount: number;
  limitedBy: "space" | "load";
  blocks: { grid: [number, number, number] }[];
}

export interface RackReasonUnits {
  /** a list of lengths, e.g. "1200 × 50 × 3 mm" */
  lengths(valuesMm: number[]): string;
  length(mm: number): string;
  mass(kg: number): string;
}

const metricNumber = (value: number) => String(Number(value.toFixed(2)));

export const METRIC_REASON_UNITS: RackReasonUnits = {
  lengths: (values) => `${values.map(metricNumber).join(" × ")} mm`,
  length: (mm) => `${metricNumber(mm)} mm`,
  mass: (kg) => `${metricNumber(kg)} kg`,
};

/** Lengths and masses in the reader's units, 4 significant figures (metric: the API's own wording). */
export function rackReasonUnits(system: UnitSystem): RackReasonUnits {
  if (system === "metric") return METRIC_REASON_UNITS;
  const length = (mm: number) => formatQuantity("lengthMm", mm, system, 4);
  return { lengths: (values) => values.map(length).join(" × "), length, mass: (kg) => formatQuantity("massKg", kg, system, 4) };
}

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

export function rackReason(f: RackReasonFacts, units: RackReasonUnits = METRIC_REASON_UNITS): string {
  if (f.spaceCount === 0) {
    const which = f.orientation ? "in the chosen orientation" : f.orientations === "upright" ? "in every upright orientation" : "in every orientation";
    return `The part (${units.lengths([f.part.lengthMm, f.part.widthMm, f.part.heightMm])}) is larger than the ${units.lengths(f.windowMm)} window ${which}.`;
  }
  if (f.limitedBy === "load") {
    if (f.count === 0) {
      return `The ${units.mass(f.maxLoadKg)} load limit is below one part's mass (${units.mass(f.part.massKg)}), so the carrier can take none of the ${f.spaceCount} parts that fit.`;
    }
    return `The ${units.mass(f.maxLoadKg)} load limit allows ${f.count} of the ${f.spaceCount} parts that fit.`;
  }
  const [main, ...rest] = f.blocks;
  const grid = `${main.grid[0]} along travel × ${plural(main.grid[1], "tier", "tiers")} × ${main.grid[2]} across`;
  const clearance = f.clearanceMm > 0 ? `${units.length(f.clearanceMm)} clearance` : "no clearance";
  const head = `Space limits the carrier to ${plural(f.spaceCount, "part", "parts")}`;
  if (rest.length === 0) return `${head}: ${grid}, ${clearance}.`;
  const mainCount = main.grid[0] * main.grid[1] * main.grid[2];
  return `${head}: a main grid of ${grid} (${mainCount}) and ${f.spaceCount - mainCount} more in ${plural(rest.length, "further block", "further blocks")} filling the space left, ${clearance}.`;
}
