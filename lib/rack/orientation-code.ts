// An orientation chosen by hand, stored in a plain form that survives a change to the part's
// sizes: which of the part's own dimensions lies along travel, up, and across, in that order
// ("length-height-width": length along travel, height up, width across).
//
// Forcing one orientation: planRack({ ..., orientation }) plans with that orientation alone. The
// guillotine search then has a single orientation to place, so it cannot beat the single grid
// (each axis already holds as many rows as fit); the result is that one grid, and every part in
// it lies the chosen way. Mixed blocks stay off by construction rather than by a switch.

import type { OrientationMode, PartBoxMm, RackOrientation } from "./types";

type Dimension = "length" | "width" | "height";

/** The six axis-aligned orientations, in the planner's order of preference (orientations.ts). */
export const ORIENTATION_CODES = [
  "length-height-width",
  "width-height-length",
  "length-width-height",
  "width-length-height",
  "height-width-length",
  "height-length-width",
] as const;

export type OrientationCode = (typeof ORIENTATION_CODES)[number];

/** The codes a mode allows: "upright" keeps the part's height vertical (as hung from a hook). */
export function codesForMode(mode: OrientationMode): OrientationCode[] {
  return ORIENTATION_CODES.filter((c) => mode === "any" || c.split("-")[1] === "height");
}

export function isOrientationCode(value: unknown): value is OrientationCode {
  return typeof value === "string" && (ORIENTATION_CODES as readonly string[]).includes(value);
}

function sizeOf(part: PartBoxMm, d: Dimension): number {
  return d === "length" ? part.lengthMm : d === "width" ? part.widthMm : part.heightMm;
}

/** The orientation in millimetres for this part: what the planner's `orientation` input takes. */
export function orientationFromCode(part: PartBoxMm, code: OrientationCode): RackOrientation {
  const [x, y, z] = code.split("-") as [Dimension, Dimension, Dimension];
  return { alongWidthMm: sizeOf(part, x), alongHeightMm: sizeOf(part, y), alongDepthMm: sizeOf(part, z) };
}

const SAME = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));

/**
 * The first code (in preference order) that gives this orientation for this part, or null when it
 * is not the part's own dimensions. Parts with two equal sides have several codes per
 * orientation; the first one stands for them all.
 */
export function codeOfOrientation(part: PartBoxMm, o: RackOrientation): OrientationCode | null {
  for (const code of ORIENTATION_CODES) {
    const m = orientationFromCode(part, code);
    if (SAME(m.alongWidthMm, o.alongWidthMm) && SAME(m.alongHeightMm, o.alongHeightMm) && SAME(m.alongDepthMm, o.alongDepthMm)) {
      return code;
    }
  }
  return null;
}

/** The distinct orientations a mode allows for this part, each under its first code. */
export function distinctCodes(part: PartBoxMm, mode: OrientationMode): OrientationCode[] {
  return codesForMode(mode).filter((code) => codeOfOrientation(part, orientationFromCode(part, code)) === code);
}

/** Why a code does not suit the mode, or null. */
export function codeProblem(mode: OrientationMode, code: OrientationCode): string | null {
  return codesForMode(mode).includes(code)
    ? null
    : "Upright racking keeps the part's height vertical: choose an orientation with the height up, or allow any orientation.";
}

/** "length along travel, height up, width across". */
export function codeWords(code: OrientationCode): string {
  const [x, y, z] = code.split("-");
  return `${x} along travel, ${y} up, ${z} across`;
}
