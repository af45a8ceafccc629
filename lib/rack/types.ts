// Shapes shared by the racking planner. Frame: x along the carrier window's width (direction of
// conveyor travel), y up, z across (depth); origin at the window's lower front corner.

export type OrientationMode = "any" | "upright";

/** A part's bounding box: lengthMm ↔ CAD x, widthMm ↔ CAD y, heightMm ↔ CAD z (Z-up). */
export interface PartBoxMm {
  lengthMm: number;
  widthMm: number;
  heightMm: number;
}

export interface RackPart extends PartBoxMm {
  massKg: number;
}

/** The carrier's usable window (already net of hooks and bars) and its load limit. */
export interface RackCarrier {
  widthMm: number;
  heightMm: number;
  depthMm: number;
  maxLoadKg: number;
}

/** Which part dimension lies along each window axis. */
export interface RackOrientation {
  alongWidthMm: number;
  alongHeightMm: number;
  alongDepthMm: number;
}

export interface RackPlanInput {
  part: RackPart;
  carrier: RackCarrier;
  clearanceMm: number;
  orientations: OrientationMode;
  orientation?: RackOrientation;
}

export type Vec3Mm = [number, number, number];

export interface RackBlock {
  orientation: RackOrientation;
  grid: [number, number, number];
  /** Parts counted in this block (below nx·ny·nz only when the load limit cut the plan). */
  count: number;
  /** Lower front corner of the block's first part. */
  originMm: Vec3Mm;
}

export interface RackPlacement {
  minMm: Vec3Mm;
  sizeMm: Vec3Mm;
}

export type RackLimit = "space" | "load";

export interface RackPlan {
  count: number;
  /** Parts that fit by space alone, before the load limit. */
  spaceCount: number;
  limitedBy: RackLimit;
  reason: string;
  blocks: RackBlock[];
  placements: RackPlacement[];
}
