/** Conveyor line throughput and stage dwell. */
import { requireFiniteResult, requireInRange, requirePositive } from "./errors";
import { convert } from "./display-units";

const MIN_PER_H = convert(1, "h", "min");

export interface LineThroughputInput {
  lineSpeedMPerMin: number;
  /** centre-to-centre distance of carriers */
  carrierPitchM: number;
  partsPerCarrier: number;
  /** conveyor path length inside the cure oven */
  ovenPathLengthM: number;
  /** cure time the parts need inside the oven (heat-up + hold) */
  requiredDwellMin?: number;
  /** share of carriers that carry parts; scales parts/h, not carriers/h */
  loadedFraction?: number;
}

export interface LineThroughput {
  carriersPerHour: number;
  partsPerHour: number;
  ovenDwellMin: number;
  maxLineSpeedForDwellMPerMin?: number;
  /** oven dwell minus the required dwell; negative when the line runs too fast */
  dwellMarginMin?: number;
}

/**
 * Carriers per hour = line speed × 60 / pitch; oven dwell = oven path / line speed
 * (derived; REFERENCES.md worked example).
 */
export function lineThroughput(input: LineThroughputInput): LineThroughput {
  const { lineSpeedMPerMin, carrierPitchM, partsPerCarrier, ovenPathLengthM, requiredDwellMin } = input;
  const loadedFraction = input.loadedFraction ?? 1;
  requirePositive("lineSpeedMPerMin", lineSpeedMPerMin);
  requirePositive("carrierPitchM", carrierPitchM);
  requirePositive("partsPerCarrier", partsPerCarrier);
  requirePositive("ovenPathLengthM", ovenPathLengthM);
  requireInRange("loadedFraction", loadedFraction, { gt: 0, lte: 1 });
  if (requiredDwellMin !== undefined) requirePositive("requiredDwellMin", requiredDwellMin);

  const carriersPerHour = (lineSpeedMPerMin * MIN_PER_H) / carrierPitchM;
  requireFiniteResult("carrierPitchM", carriersPerHour * partsPerCarrier, "parts per hour");
  const ovenDwellMin = stageDwellMin(ovenPathLengthM, lineSpeedMPerMin);
  const result: LineThroughput = {
    carriersPerHour,
    partsPerHour: carriersPerHour * partsPerCarrier * loadedFraction,
    ovenDwellMin,
  };
  if (requiredDwellMin !== undefined) {
    result.maxLineSpeedForDwellMPerMin = requireFiniteResult(
      "requiredDwellMin",
      ovenPathLengthM / requiredDwellMin,
      "largest line speed for the dwell",
    );
    result.dwellMarginMin = ovenDwellMin - requiredDwellMin;
  }
  return result;
}

export interface LineSpeedForDemandInput {
  partsPerHour: number;
  carrierPitchM: number;
  partsPerCarrier: number;
  loadedFraction?: number;
}

/** Line speed that yields `partsPerHour`: the throughput formula solved for speed. */
export function lineSpeedForDemand(input: LineSpeedForDemandInput): number {
  const { partsPerHour, carrierPitchM, partsPerCarrier } = input;
  const loadedFraction = input.loadedFraction ?? 1;
  requirePositive("partsPerHour", partsPerHour);
  requirePositive("carrierPitchM", carrierPitchM);
  requirePositive("partsPerCarrier", partsPerCarrier);
  requireInRange("loadedFraction", loadedFraction, { gt: 0, lte: 1 });
  const carriersPerHour = partsPerHour / (partsPerCarrier * loadedFraction);
  return requireFiniteResult("partsPerCarrier", (carriersPerHour * carrierPitchM) / MIN_PER_H, "line speed");
}

/** Time a carrier spends in a stage of conveyor length `lengthM`. */
export function stageDwellMin(lengthM: number, lineSpeedMPerMin: number): number {
  requirePositive("lengthM", lengthM);
  requirePositive("lineSpeedMPerMin", lineSpeedMPerMin);
  return requireFiniteResult("lineSpeedMPerMin", lengthM / lineSpeedMPerMin, "dwell time");
}

/** Conveyor length a stage needs to give `dwellMin` at `lineSpeedMPerMin`. */
export function stageLengthForDwellM(dwellMin: number, lineSpeedMPerMin: number): number {
  requirePositive("dwellMin", dwellMin);
  requirePositive("lineSpeedMPerMin", lineSpeedMPerMin);
  return requireFiniteResult("dwellMin", dwellMin * lineSpeedMPerMin, "stage length");
}
