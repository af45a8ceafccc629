/**
 * A conveyor line's timeline at one line speed: when a carrier enters and leaves each stage,
 * the total time from load to unload, and carriers per hour.
 */
import { lineThroughput, stageDwellMin } from "../coating-math/line";
import { checkLineSpeed, checkStages, type SpeedRange, type StageInput, type StageKind } from "./stages";

export interface TimelineStage {
  position: number;
  name: string;
  kind: StageKind;
  lengthM: number;
  dwellMin: number;
  startMin: number;
  endMin: number;
}

export interface LineTimeline {
  lineSpeedMPerMin: number;
  stages: TimelineStage[];
  totalLengthM: number;
  /** load to unload: the sum of the stage dwells */
  totalMin: number;
  /** when the carrier pitch is known */
  carriersPerHour: number | null;
}

export interface LineTimelineInput {
  stages: readonly StageInput[];
  lineSpeedMPerMin: number;
  carrierPitchM?: number;
  /** refuse a speed outside the line's range */
  speedRange?: SpeedRange;
}

/**
 * Dwell of each stage = its conveyor length / line speed; carriers per hour = speed × 60 / pitch
 * (REFERENCES.md, conveyor lines). Stages follow one another: each starts where the last ended.
 */
export function lineTimeline(input: LineTimelineInput): LineTimeline {
  const { stages, lineSpeedMPerMin, carrierPitchM, speedRange } = input;
  checkStages(stages);
  if (speedRange) checkLineSpeed(lineSpeedMPerMin, speedRange);
  let clockMin = 0;
  let totalLengthM = 0;
  const out = stages.map((s, position) => {
    const dwellMin = stageDwellMin(s.lengthM, lineSpeedMPerMin);
    const stage = { position, name: s.name, kind: s.kind, lengthM: s.lengthM, dwellMin, startMin: clockMin, endMin: clockMin + dwellMin };
    clockMin += dwellMin;
    totalLengthM += s.lengthM;
    return stage;
  });
  const carriersPerHour =
    carrierPitchM === undefined
      ? null
      : lineThroughput({ lineSpeedMPerMin, carrierPitchM, partsPerCarrier: 1, ovenPathLengthM: totalLengthM }).carriersPerHour;
  // Summing lengths first keeps the total to one division (no accumulated rounding).
  return { lineSpeedMPerMin, stages: out, totalLengthM, totalMin: stageDwellMin(totalLengthM, lineSpeedMPerMin), carriersPerHour };
}
