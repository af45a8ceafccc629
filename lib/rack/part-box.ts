import type { PartBoxMm } from "./types";

/**
 * A mesh's axis-aligned bounding box → the part box the planner takes. CAD files are Z-up, so
 * CAD z is the part's height (kept vertical by "upright" racking, as hung from a hook).
 */
export function partBoxFromBboxMm(bbox: { x: number; y: number; z: number }): PartBoxMm {
  return { lengthMm: bbox.x, widthMm: bbox.y, heightMm: bbox.z };
}
