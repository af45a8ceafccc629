import { unit } from "mathjs";
import { GeometryError } from "./errors";

/** The length unit an STL file was drawn in; the file itself does not say. */
export type StlUnit = "mm" | "in";

export interface UnitFactors {
  /** millimetres per file unit */
  mmPerUnit: number;
  /** square metres per square file unit */
  m2PerUnit2: number;
  /** cubic metres per cubic file unit */
  m3PerUnit3: number;
}

// Conversions come from mathjs's unit table (1 in = 25.4 mm exactly, NIST SP 811), never typed here.
const FACTORS: Record<StlUnit, UnitFactors> = {
  mm: {
    mmPerUnit: 1,
    m2PerUnit2: unit(1, "mm^2").toNumber("m^2"),
    m3PerUnit3: unit(1, "mm^3").toNumber("m^3"),
  },
  in: {
    mmPerUnit: unit(1, "inch").toNumber("mm"),
    m2PerUnit2: unit(1, "inch^2").toNumber("m^2"),
    m3PerUnit3: unit(1, "inch^3").toNumber("m^3"),
  },
};

export const M2_PER_MM2 = FACTORS.mm.m2PerUnit2;
export const M3_PER_MM3 = FACTORS.mm.m3PerUnit3;
export const MM_PER_INCH = FACTORS.in.mmPerUnit;
export const MM_PER_M = unit(1, "m").toNumber("mm");

export function unitFactors(stlUnit: StlUnit): UnitFactors {
  const factors = FACTORS[stlUnit];
  if (!factors) {
    throw new GeometryError("invalid_value", `The unit must be "mm" or "in", not "${String(stlUnit)}".`, "unit");
  }
  return factors;
}
