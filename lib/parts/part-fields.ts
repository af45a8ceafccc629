/**
 * The parts catalogue's fixed lists and limits. Plain constants without zod, so client forms and
 * tables can use them without pulling the validation library into the browser;
 * lib/validation/parts builds its schemas from the same values.
 */
export const MATERIALS = ["steel", "stainless", "aluminium", "other"] as const;
export type PartMaterial = (typeof MATERIALS)[number];

export const AREA_ORIGINS = ["mesh", "template", "formula", "manual"] as const;
export type AreaOrigin = (typeof AREA_ORIGINS)[number];

export const MASS_ORIGINS = ["volume", "sheet", "entered"] as const;
export type MassOrigin = (typeof MASS_ORIGINS)[number];

/** Upper bounds: far above any part a conveyor carries, low enough to catch a slipped decimal. */
export const PART_LIMITS = {
  densityKgPerM3: 25_000,
  thicknessMm: 500,
  massKg: 100_000,
  areaM2: 10_000,
  sizeMm: 100_000,
  dimensions: 12,
  formulaChars: 500,
} as const;

/** A formula's dimension names: what mathjs reads as one symbol. */
export const DIMENSION_NAME = /^[A-Za-z_][A-Za-z0-9_]{0,31}$/;
