/** Cost per part and run line time. Money is in the plant's one currency (no unit suffix). */
import { requireFiniteResult, requireInRange, requirePositive } from "./errors";
import { convert } from "./display-units";

const MIN_PER_H = convert(1, "h", "min");

export interface CostPerPartInput {
  /** coating material for one part (all coats) */
  materialCostPerPart: number;
  /** line time the run occupies, start of loading to last carrier off */
  lineTimeMin: number;
  partsInRun: number;
  /** labour, energy and overhead of running the line for one hour */
  lineRatePerHour: number;
  /** one-off cost of the run: colour change, masking set-up */
  setupCost?: number;
}

export interface CostPerPart {
  materialCostPerPart: number;
  lineCostPerPart: number;
  setupCostPerPart: number;
  totalPerPart: number;
  runTotal: number;
}

/** Cost per part = material + (line rate × line hours + set-up) / parts (common practice, no source). */
export function costPerPart(input: CostPerPartInput): CostPerPart {
  const { materialCostPerPart, lineTimeMin, partsInRun, lineRatePerHour } = input;
  const setupCost = input.setupCost ?? 0;
  requireInRange("materialCostPerPart", materialCostPerPart, { gte: 0 });
  requireInRange("lineTimeMin", lineTimeMin, { gte: 0 });
  requireInRange("partsInRun", partsInRun, { gte: 1, integer: true });
  requireInRange("lineRatePerHour", lineRatePerHour, { gte: 0 });
  requireInRange("setupCost", setupCost, { gte: 0 });

  const lineCost = (lineRatePerHour * lineTimeMin) / MIN_PER_H;
  const lineCostPerPart = lineCost / partsInRun;
  const setupCostPerPart = setupCost / partsInRun;
  const totalPerPart = materialCostPerPart + lineCostPerPart + setupCostPerPart;
  return {
    materialCostPerPart,
    lineCostPerPart,
    setupCostPerPart,
    totalPerPart,
    runTotal: totalPerPart * partsInRun,
  };
}

export interface RunLineTimeInput {
  carriers: number;
  carrierPitchM: number;
  lineSpeedMPerMin: number;
  /** conveyor length from load to unload, passed by the last carrier after the first is loaded */
  lineLengthM?: number;
  /** gap in the line for a colour change before this run */
  colourChangeMin?: number;
}

/**
 * Line time of a run: the loaded stretch (carriers × pitch) plus the line length, at line
 * speed, plus any colour change (common practice, no source).
 */
export function runLineTimeMin(input: RunLineTimeInput): number {
  const { carriers, carrierPitchM, lineSpeedMPerMin } = input;
  const lineLengthM = input.lineLengthM ?? 0;
  const colourChangeMin = input.colourChangeMin ?? 0;
  requireInRange("carriers", carriers, { gte: 0, integer: true });
  requirePositive("carrierPitchM", carrierPitchM);
  requirePositive("lineSpeedMPerMin", lineSpeedMPerMin);
  requireInRange("lineLengthM", lineLengthM, { gte: 0 });
  requireInRange("colourChangeMin", colourChangeMin, { gte: 0 });
  return requireFiniteResult(
    "lineSpeedMPerMin",
    (carriers * carrierPitchM + lineLengthM) / lineSpeedMPerMin + colourChangeMin,
    "line time",
  );
}
