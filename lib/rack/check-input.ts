import { orientationProblem } from "./orientations";
import { RackInputError } from "./rack-error";
import type { RackPlanInput } from "./types";

/** Largest size accepted on any axis (100 m): beyond it the numbers are a unit mistake. */
export const MAX_SIZE_MM = 100_000;

function positiveFinite(value: unknown, field: string, maxValue: number): void {
  if (typeof value !== "number" || !Number.isFinite(value) || value <= 0) {
    throw new RackInputError(field, `${field} must be a positive number.`);
  }
  if (value > maxValue) {
    throw new RackInputError(field, `${field} must be at most ${maxValue}.`);
  }
}

/** Throws a RackInputError naming the first impossible value; the route's zod schema mirrors it. */
export function checkRackInput(input: RackPlanInput): void {
  const { part, carrier, clearanceMm, orientations, orientation } = input;
  positiveFinite(part?.lengthMm, "part.lengthMm", MAX_SIZE_MM);
  positiveFinite(part.widthMm, "part.widthMm", MAX_SIZE_MM);
  positiveFinite(part.heightMm, "part.heightMm", MAX_SIZE_MM);
  positiveFinite(part.massKg, "part.massKg", Number.MAX_VALUE);
  positiveFinite(carrier?.widthMm, "carrier.widthMm", MAX_SIZE_MM);
  positiveFinite(carrier.heightMm, "carrier.heightMm", MAX_SIZE_MM);
  positiveFinite(carrier.depthMm, "carrier.depthMm", MAX_SIZE_MM);
  positiveFinite(carrier.maxLoadKg, "carrier.maxLoadKg", Number.MAX_VALUE);
  if (typeof clearanceMm !== "number" || !Number.isFinite(clearanceMm) || clearanceMm < 0) {
    throw new RackInputError("clearanceMm", "clearanceMm must be zero or a positive number.");
  }
  if (clearanceMm > Math.max(carrier.widthMm, carrier.heightMm, carrier.depthMm)) {
    throw new RackInputError(
      "clearanceMm",
      "clearanceMm is larger than every dimension of the carrier window.",
    );
  }
  if (orientations !== "any" && orientations !== "upright") {
    throw new RackInputError("orientations", 'orientations must be "any" or "upright".');
  }
  if (orientation !== undefined) {
    positiveFinite(orientation.alongWidthMm, "orientation.alongWidthMm", MAX_SIZE_MM);
    positiveFinite(orientation.alongHeightMm, "orientation.alongHeightMm", MAX_SIZE_MM);
    positiveFinite(orientation.alongDepthMm, "orientation.alongDepthMm", MAX_SIZE_MM);
    const problem = orientationProblem(part, orientations, orientation);
    if (problem) throw new RackInputError("orientation", problem);
  }
}
