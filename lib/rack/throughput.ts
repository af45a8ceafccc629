// Per-line output from a racking plan: parts per conveyor hour, parts per batch-oven cycle/shift.

import { wholeTimes } from "./grid";
import { RackInputError } from "./rack-error";

function requirePositive(value: number, field: string): void {
  if (!Number.isFinite(value) || value <= 0) {
    throw new RackInputError(field, `${field} must be a positive number.`);
  }
}

function requireNonNegative(value: number, field: string): void {
  if (!Number.isFinite(value) || value < 0) {
    throw new RackInputError(field, `${field} must be zero or a positive number.`);
  }
}

export interface ConveyorRackingInput {
  lineSpeedMPerMin: number;
  carrierPitchM: number;
  partsPerCarrier: number;
  /** Share of carriers that carry parts (0..1]; scales parts/h, not carriers/h. */
  loadedFraction?: number;
}

export interface ConveyorRackingResult {
  carriersPerHour: number;
  partsPerHour: number;
}

export function conveyorRackingThroughput(input: ConveyorRackingInput): ConveyorRackingResult {
  const { lineSpeedMPerMin, carrierPitchM, partsPerCarrier, loadedFraction = 1 } = input;
  requireNonNegative(lineSpeedMPerMin, "lineSpeedMPerMin");
  requirePositive(carrierPitchM, "carrierPitchM");
  requireNonNegative(partsPerCarrier, "partsPerCarrier");
  if (!Number.isFinite(loadedFraction) || loadedFraction <= 0 || loadedFraction > 1) {
    throw new RackInputError("loadedFraction", "loadedFraction must be above 0 and at most 1.");
  }
  // Carriers per hour = line speed × 60 / carrier pitch (REFERENCES: conveyor lines).
  const carriersPerHour = (lineSpeedMPerMin * 60) / carrierPitchM;
  return { carriersPerHour, partsPerHour: carriersPerHour * partsPerCarrier * loadedFraction };
}

export interface BatchOvenRackingInput {
  racksPerLoad: number;
  partsPerRack: number;
  loadMin: number;
  heatUpMin: number;
  holdMin: number;
  unloadMin: number;
  shiftLengthH: number;
}

export interface BatchOvenRackingResult {
  partsPerLoad: number;
  cycleMin: number;
  /** Average rate over back-to-back cycles. */
  partsPerHour: number;
  /** Whole cycles that finish inside the shift: a cycle cut short cures nothing. */
  loadsPerShift: number;
  partsPerShift: number;
}

export function batchOvenRackingThroughput(input: BatchOvenRackingInput): BatchOvenRackingResult {
  const { racksPerLoad, partsPerRack, loadMin, heatUpMin, holdMin, unloadMin, shiftLengthH } =
    input;
  requireNonNegative(racksPerLoad, "racksPerLoad");
  requireNonNegative(partsPerRack, "partsPerRack");
  requireNonNegative(loadMin, "loadMin");
  requireNonNegative(heatUpMin, "heatUpMin");
  requireNonNegative(holdMin, "holdMin");
  requireNonNegative(unloadMin, "unloadMin");
  requireNonNegative(shiftLengthH, "shiftLengthH");
  // common practice, no source: one batch cycle = load + heat-up + hold at cure + unload.
  const cycleMin = loadMin + heatUpMin + holdMin + unloadMin;
  if (cycleMin <= 0) {
    throw new RackInputError("holdMin", "A batch cycle must take some time: hold or heat-up above 0.");
  }
  const partsPerLoad = racksPerLoad * partsPerRack;
  const loadsPerShift = wholeTimes(shiftLengthH * 60, cycleMin);
  return {
    partsPerLoad,
    cycleMin,
    partsPerHour: (partsPerLoad * 60) / cycleMin,
    loadsPerShift,
    partsPerShift: loadsPerShift * partsPerLoad,
  };
}
