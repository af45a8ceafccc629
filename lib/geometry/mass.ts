/** Part mass from metal volume, and coated area net of masking. */
import { GeometryError } from "./errors";
import { MM_PER_M } from "./length-units";

export type Material = "steel" | "stainless" | "aluminium";

/**
 * Densities in kg/m³: common handbook values, from memory (carbon steel 7850, austenitic
 * stainless ~8000, aluminium alloys ~2700). A plant with a measured figure should use its own.
 */
export const DENSITY_KG_PER_M3: Readonly<Record<Material, number>> = {
  steel: 7850,
  stainless: 8000,
  aluminium: 2700,
};

export function densityKgPerM3(material: Material): number {
  const density = DENSITY_KG_PER_M3[material];
  if (density === undefined) {
    throw new GeometryError(
      "invalid_value",
      `Unknown material "${String(material)}"; choose steel, stainless or aluminium.`,
      "material",
    );
  }
  return density;
}

function requireNonNegative(value: number, field: string, what: string): void {
  if (typeof value !== "number" || !Number.isFinite(value) || value < 0) {
    throw new GeometryError("invalid_value", `${what} must be a number of zero or more.`, field);
  }
}

/** Mass of a part from its metal volume (a closed mesh's volume, or a template's volumeM3). */
export function massFromVolumeKg(volumeM3: number, material: Material): number {
  requireNonNegative(volumeM3, "volumeM3", "The volume");
  return volumeM3 * densityKgPerM3(material);
}

/**
 * Mass of a flat part from ONE face's area and its thickness. Not the coated area: that
 * counts both faces (and the edges), which would double the mass.
 */
export function plateMassKg(faceAreaM2: number, thicknessMm: number, material: Material): number {
  requireNonNegative(faceAreaM2, "faceAreaM2", "The face area");
  requireNonNegative(thicknessMm, "thicknessMm", "The thickness");
  return faceAreaM2 * (thicknessMm / MM_PER_M) * densityKgPerM3(material);
}

/**
 * Coated area after masking (threads, bores, contact points). Masking more than the whole area
 * is an input mistake, not a zero: it is refused. Rounding noise never makes the result negative.
 */
export function netCoatedAreaM2(areaM2: number, maskedAreaM2: number): number {
  requireNonNegative(areaM2, "areaM2", "The area");
  requireNonNegative(maskedAreaM2, "maskedAreaM2", "The masked area");
  // 1e-9 relative: masking "all of it" typed as the same decimal must not fail on rounding.
  if (maskedAreaM2 > areaM2 * (1 + 1e-9)) {
    throw new GeometryError(
      "masked_exceeds_area",
      `The masked area (${Number(maskedAreaM2.toPrecision(6))} m²) is larger than the part's area (${Number(areaM2.toPrecision(6))} m²).`,
      "maskedAreaM2",
    );
  }
  return Math.max(0, areaM2 - maskedAreaM2);
}

/**
 * Mass of a solid block of metal filling the part's bounding box: no part of that box can weigh
 * more, so a thin-wall estimate or an entered mass above it points at a wrong area, thickness,
 * mass or box.
 */
export function solidBoxMassKg(lengthMm: number, widthMm: number, heightMm: number, densityKgPerM3: number): number {
  requireNonNegative(lengthMm, "lengthMm", "The length");
  requireNonNegative(widthMm, "widthMm", "The width");
  requireNonNegative(heightMm, "heightMm", "The height");
  requireNonNegative(densityKgPerM3, "densityKgPerM3", "The density");
  return (lengthMm / MM_PER_M) * (widthMm / MM_PER_M) * (heightMm / MM_PER_M) * densityKgPerM3;
}
