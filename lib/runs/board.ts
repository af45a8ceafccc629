/**
 * The day board of one line: runs back to back in their order, colour changes in the booth
 * between them, how much of the shift they fill, and a proposed order (grouped by cure schedule,
 * light colours before dark).
 */
import { requireInRange } from "../coating-math/errors";
import { isAtMost } from "../coating-math/compare";
import type { CurePoint } from "../coating-math/cure";
import { relativeLuminance, sameColour } from "./colour";

export interface BoardRunInput {
  id: number;
  /** the line's entrance is busy this long (the next run may start loading after it) */
  loadingMin: number;
  /** first carrier loaded to last unloaded */
  lineTimeMin: number;
  /** swatch of each powder coat, in coat order (empty for a run with no powder) */
  boothColours: readonly string[];
}

export interface BoardSlot {
  id: number;
  /** colour change in the booth just before this run's first powder coat */
  colourChangeBeforeMin: number;
  /** first carrier of this run loaded, minutes into the shift */
  startMin: number;
  /** last carrier unloaded */
  endMin: number;
  fits: boolean;
  /** minutes past the end of the shift (0 when it fits) */
  overflowMin: number;
}

export interface ColourChange {
  afterRunId: number;
  beforeRunId: number;
  fromHex: string;
  toHex: string;
  minutes: number;
}

export interface BoardSchedule {
  slots: BoardSlot[];
  colourChanges: ColourChange[];
  colourChangeMin: number;
  shiftMin: number;
  /** when the last carrier of the day is unloaded */
  filledMin: number;
  /** shift minutes not used (negative: past the shift) */
  leftMin: number;
  fits: boolean;
}

/**
 * Runs in order: each starts loading when the previous one's last carrier is loaded, plus a
 * colour change when the booth's last powder colour differs from this run's first (the
 * booth's colour-change time, common practice, no source); a run without powder leaves the
 * booth colour as it was. A run fits when its last carrier is off by the end of the shift.
 */
export function scheduleBoard(runs: readonly BoardRunInput[], opts: { colourChangeMin: number; shiftMin: number }): BoardSchedule {
  const { colourChangeMin, shiftMin } = opts;
  requireInRange("colourChangeMin", colourChangeMin, { gte: 0 });
  requireInRange("shiftMin", shiftMin, { gt: 0 });
  const slots: BoardSlot[] = [];
  const colourChanges: ColourChange[] = [];
  let clockMin = 0;
  let booth: { hex: string; runId: number } | null = null;
  let filledMin = 0;
  for (const r of runs) {
    requireInRange(`runs.${r.id}.loadingMin`, r.loadingMin, { gte: 0 });
    requireInRange(`runs.${r.id}.lineTimeMin`, r.lineTimeMin, { gte: r.loadingMin });
    let before = 0;
    const first = r.boothColours[0];
    if (first !== undefined && booth !== null && !sameColour(booth.hex, first)) {
      before = colourChangeMin;
      colourChanges.push({ afterRunId: booth.runId, beforeRunId: r.id, fromHex: booth.hex, toHex: first, minutes: colourChangeMin });
    }
    const startMin = clockMin + before;
    const endMin = startMin + r.lineTimeMin;
    const fits = isAtMost(endMin, shiftMin);
    slots.push({ id: r.id, colourChangeBeforeMin: before, startMin, endMin, fits, overflowMin: fits ? 0 : endMin - shiftMin });
    clockMin = startMin + r.loadingMin;
    filledMin = Math.max(filledMin, endMin);
    const last = r.boothColours[r.boothColours.length - 1];
    if (last !== undefined) booth = { hex: last, runId: r.id };
  }
  return {
    slots,
    colourChanges,
    colourChangeMin,
    shiftMin,
    filledMin,
    leftMin: shiftMin - filledMin,
    fits: slots.every((s) => s.fits),
  };
}

export interface ProposeRunInput {
  id: number;
  /** the cure schedule that sets the oven for this run (see cureKey) */
  cureKey: string;
  /** the booth colour that orders it: relative luminance of its swatch */
  swatchHex: string;
}

/** One text per cure schedule: its points by temperature, e.g. "190 °C 12 min · 200 °C 10 min". */
export function cureKey(schedule: readonly CurePoint[]): string {
  return [...schedule]
    .sort((a, b) => a.metalTempC - b.metalTempC)
    .map((p) => `${p.metalTempC} °C ${p.holdMin} min`)
    .join(" · ");
}

/**
 * Proposed order: runs with the same cure schedule together (the oven keeps its setting), each
 * group light to dark by WCAG relative luminance (colour.ts), the group holding the lightest
 * colour first. Ties keep the current order.
 */
export function proposeOrder(runs: readonly ProposeRunInput[]): number[] {
  const lum = new Map(runs.map((r) => [r.id, relativeLuminance(r.swatchHex)]));
  const index = new Map(runs.map((r, i) => [r.id, i]));
  const groups = new Map<string, ProposeRunInput[]>();
  for (const r of runs) {
    const g = groups.get(r.cureKey);
    if (g) g.push(r);
    else groups.set(r.cureKey, [r]);
  }
  const lighter = (a: ProposeRunInput, b: ProposeRunInput) => lum.get(b.id)! - lum.get(a.id)! || index.get(a.id)! - index.get(b.id)!;
  const ordered = [...groups.values()].map((g) => [...g].sort(lighter));
  ordered.sort((a, b) => lighter(a[0], b[0]));
  return ordered.flat().map((r) => r.id);
}
