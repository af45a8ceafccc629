/** A gentle check that an STL's unit was chosen right: CAD files carry no unit. */
import { type StlUnit, MM_PER_INCH, MM_PER_M } from "./length-units";

/** Read as mm, a part under this size at its largest side was probably drawn in inches. */
export const SMALL_AS_MM_LIMIT_MM = 10;
/** Read as inches, a part over this size was probably drawn in millimetres. */
export const LARGE_AS_INCH_LIMIT_MM = 2000;

function show(v: number): string {
  return Number(v.toPrecision(3)).toLocaleString("en-US");
}

/** A sentence suggesting the other unit when the size looks implausible, else null. */
export function suggestUnit(bboxMm: { x: number; y: number; z: number }, unit: StlUnit): string | null {
  const largestMm = Math.max(bboxMm.x, bboxMm.y, bboxMm.z);
  if (!Number.isFinite(largestMm) || largestMm <= 0) return null;
  if (unit === "mm" && largestMm < SMALL_AS_MM_LIMIT_MM) {
    return `Read as millimetres the part is only ${show(largestMm)} mm at its largest. If it was drawn in inches it is ${show(largestMm * MM_PER_INCH)} mm: check the unit.`;
  }
  if (unit === "in" && largestMm > LARGE_AS_INCH_LIMIT_MM) {
    return `Read as inches the part is ${show(largestMm / MM_PER_M)} m at its largest. If it was drawn in millimetres it is ${show(largestMm / MM_PER_INCH)} mm: check the unit.`;
  }
  return null;
}
