/**
 * Stage kinds of a conveyor finishing line and the coating kinds they apply. Pure: shared by
 * validation, services, the cure check and the screens.
 */
import { DomainError, requirePositive } from "../coating-math/errors";
import { isAtLeast, isAtMost } from "../coating-math/compare";
import { formatSignificant } from "../coating-math/display-units";

export const STAGE_KINDS = [
  "clean",
  "rinse",
  "conversion",
  "e-coat",
  "dry-off",
  "powder-booth",
  "cure-oven",
  "cool",
] as const;
export type StageKind = (typeof STAGE_KINDS)[number];

export const STAGE_KIND_LABELS: Readonly<Record<StageKind, string>> = {
  clean: "Clean",
  rinse: "Rinse",
  conversion: "Conversion coat",
  "e-coat": "E-coat tank",
  "dry-off": "Dry-off oven",
  "powder-booth": "Powder booth",
  "cure-oven": "Cure oven",
  cool: "Cool-down",
};

/** Stages that may carry an air or bath temperature (ovens and heated tanks). */
export const HEATED_STAGE_KINDS: readonly StageKind[] = ["clean", "rinse", "conversion", "e-coat", "dry-off", "cure-oven"];
/** Ovens: each has its own heat-transfer coefficient (an e-coat bake and a powder cure differ). */
export const OVEN_STAGE_KINDS: readonly StageKind[] = ["dry-off", "cure-oven"];

export const COATING_KINDS = ["powder", "e-coat"] as const;
export type CoatingKind = (typeof COATING_KINDS)[number];

/** The stage where each coating kind goes on the part. */
export const APPLYING_STAGE: Readonly<Record<CoatingKind, StageKind>> = {
  powder: "powder-booth",
  "e-coat": "e-coat",
};

export interface StageInput {
  name: string;
  kind: StageKind;
  lengthM: number;
  tempC?: number | null;
  heatTransferCoefficientWPerM2K?: number | null;
  colourChangeMin?: number | null;
}

export interface SpeedRange {
  lineSpeedMinMPerMin: number;
  lineSpeedMaxMPerMin: number;
}

/** The speed, when inside the line's range (inclusive, with float tolerance); otherwise a DomainError. */
export function checkLineSpeed(lineSpeedMPerMin: number, range: SpeedRange): number {
  requirePositive("lineSpeedMPerMin", lineSpeedMPerMin);
  const { lineSpeedMinMPerMin: lo, lineSpeedMaxMPerMin: hi } = range;
  if (!isAtLeast(lineSpeedMPerMin, lo) || !isAtMost(lineSpeedMPerMin, hi)) {
    throw new DomainError(
      "lineSpeedMPerMin",
      `lineSpeedMPerMin must be within the line's speed range ${formatSignificant(lo, 4)}–${formatSignificant(hi, 4)} m/min (got ${lineSpeedMPerMin}).`,
    );
  }
  return lineSpeedMPerMin;
}

/** A conveyor stage list must have stages, each with a length above zero. */
export function checkStages(stages: readonly StageInput[]): void {
  if (!Array.isArray(stages) || stages.length === 0) {
    throw new DomainError("stages", "A conveyor line needs at least one stage.");
  }
  stages.forEach((s, i) => requirePositive(`stages.${i}.lengthM`, s.lengthM));
}
