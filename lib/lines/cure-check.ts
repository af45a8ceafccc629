/**
 * Cure check where a part meets a line: the part's metal heat-up (lumped model) plus the
 * coating's hold, against the time the line gives it in its oven — the oven dwell at the chosen
 * speed on a conveyor, or the whole cycle of a batch oven.
 */
import { bestCurePoint, cureHeatUp, type CurePoint } from "../coating-math/cure";
import { DomainError, requireInRange, requirePositive } from "../coating-math/errors";
import { stageDwellMin } from "../coating-math/line";
import { isAtLeast } from "../coating-math/compare";
import { formatSignificant } from "../coating-math/display-units";
import {
  APPLYING_STAGE,
  STAGE_KIND_LABELS,
  checkLineSpeed,
  checkStages,
  type CoatingKind,
  type StageInput,
} from "./stages";

export type CureCheckLine =
  | { kind: "conveyor"; lineSpeedMinMPerMin: number; lineSpeedMaxMPerMin: number; stages: readonly StageInput[] }
  | { kind: "batch"; airTempC: number; heatTransferCoefficientWPerM2K: number; loadMin: number; unloadMin: number };

export interface CureCheckInput {
  line: CureCheckLine;
  coating: { kind: CoatingKind; cureSchedule: readonly CurePoint[] };
  /** equivalent thickness 2·V/A of the part's heaviest section */
  thicknessMm: number;
  /** conveyor lines only */
  lineSpeedMPerMin?: number;
  startTempC?: number;
  /** how speeds and temperatures read in the sentences (the server passes the user's units) */
  words?: CureWords;
}

export interface CureWords {
  speed: (mPerMin: number) => string;
  temperature: (c: number) => string;
}

/** One schedule point as seen by this oven: null heat-up when the air never brings the metal there. */
export interface CurePointOption extends CurePoint {
  heatUpMin: number | null;
  totalMin: number | null;
}

interface CureCheckCommon {
  thicknessMm: number;
  startTempC: number;
  airTempC: number;
  heatTransferCoefficientWPerM2K: number;
  /** the schedule point with the shortest heat-up + hold below the air temperature */
  curePoint: CurePoint | null;
  heatUpMin: number | null;
  holdMin: number | null;
  /** heat-up + hold */
  requiredMin: number | null;
  biotNumber: number | null;
  points: CurePointOption[];
  pass: boolean;
  reason: string;
  warnings: string[];
}

export interface ConveyorCureCheck extends CureCheckCommon {
  lineKind: "conveyor";
  ovenStage: { position: number; name: string; lengthM: number };
  lineSpeedMPerMin: number;
  dwellMin: number;
  /** dwell − required; negative when the oven is too short at this speed */
  marginMin: number | null;
  /** oven length / required time; null when nothing cures or no time is needed */
  fastestCuringSpeedMPerMin: number | null;
  /** the fastest curing speed the line can actually run; null when even its slowest is too fast */
  fastestCuringSpeedInRangeMPerMin: number | null;
}

export interface BatchCureCheck extends CureCheckCommon {
  lineKind: "batch";
  loadMin: number;
  unloadMin: number;
  /** load + heat-up + hold + unload */
  cycleMin: number | null;
}

export type CureCheck = ConveyorCureCheck | BatchCureCheck;

const fmt = (v: number) => formatSignificant(v, 3);
export const METRIC_CURE_WORDS: CureWords = {
  speed: (v) => `${fmt(v)} m/min`,
  temperature: (v) => `${fmt(v)} °C`,
};

/** Position of the cure oven that follows the stage applying this coating kind. */
export function cureOvenPosition(stages: readonly StageInput[], coatingKind: CoatingKind): number {
  const applying = APPLYING_STAGE[coatingKind];
  const at = stages.findIndex((s) => s.kind === applying);
  if (at < 0) {
    throw new DomainError(
      "coating.kind",
      `This line has no ${STAGE_KIND_LABELS[applying].toLowerCase()} stage, so a ${coatingKind} coating cannot go on here.`,
    );
  }
  const oven = stages.findIndex((s, i) => i > at && s.kind === "cure-oven");
  if (oven < 0) {
    throw new DomainError("line.stages", `No cure oven follows the ${stages[at].name} stage of this line.`);
  }
  return oven;
}

function evaluatePoints(
  schedule: readonly CurePoint[],
  oven: { airTempC: number; heatTransferCoefficientWPerM2K: number },
  thicknessMm: number,
  startTempC: number,
) {
  const heatUpTo = (metalTempC: number) =>
    cureHeatUp({ thicknessMm, airTempC: oven.airTempC, startTempC, targetMetalTempC: metalTempC, holdMin: 0, heatTransferCoefficientWPerM2K: oven.heatTransferCoefficientWPerM2K });
  // Among the points below the air temperature, the shortest heat-up + hold (cure.ts).
  const best = bestCurePoint(schedule, oven.airTempC, (t) => heatUpTo(t).heatUpMin);
  const points: CurePointOption[] = [...schedule]
    .sort((a, b) => a.metalTempC - b.metalTempC)
    .map((p) => {
      if (p.metalTempC >= oven.airTempC) return { ...p, heatUpMin: null, totalMin: null };
      const up = heatUpTo(p.metalTempC).heatUpMin;
      return { ...p, heatUpMin: up, totalMin: up + p.holdMin };
    });
  const detail = best ? cureHeatUp({ thicknessMm, airTempC: oven.airTempC, startTempC, targetMetalTempC: best.metalTempC, holdMin: best.holdMin, heatTransferCoefficientWPerM2K: oven.heatTransferCoefficientWPerM2K }) : null;
  return { best, points, detail };
}

/** The cure check; throws a DomainError (with the field) on input that describes nothing real. */
export function cureCheck(input: CureCheckInput): CureCheck {
  const { line, coating, thicknessMm } = input;
  const startTempC = input.startTempC ?? 20;
  const w = input.words ?? METRIC_CURE_WORDS;
  requirePositive("thicknessMm", thicknessMm);
  requireInRange("startTempC", startTempC, { gte: -50, lte: 1000 });
  if (!coating.cureSchedule.length) {
    throw new DomainError("coating.cureSchedule", "The coating has no cure schedule points.");
  }

  if (line.kind === "batch") {
    if (input.lineSpeedMPerMin !== undefined) {
      throw new DomainError("lineSpeedMPerMin", "A batch oven has no line speed; leave lineSpeedMPerMin out.");
    }
    requireInRange("line.loadMin", line.loadMin, { gte: 0 });
    requireInRange("line.unloadMin", line.unloadMin, { gte: 0 });
    const { best, points, detail } = evaluatePoints(coating.cureSchedule, line, thicknessMm, startTempC);
    const cycleMin = best ? line.loadMin + best.totalMin + line.unloadMin : null;
    return {
      lineKind: "batch",
      thicknessMm,
      startTempC,
      airTempC: line.airTempC,
      heatTransferCoefficientWPerM2K: line.heatTransferCoefficientWPerM2K,
      curePoint: best ? { metalTempC: best.metalTempC, holdMin: best.holdMin } : null,
      heatUpMin: best?.heatUpMin ?? null,
      holdMin: best?.holdMin ?? null,
      requiredMin: best?.totalMin ?? null,
      biotNumber: detail?.biotNumber ?? null,
      points,
      pass: best !== null,
      reason: best
        ? `Cures in a ${fmt(cycleMin!)} min cycle: load ${fmt(line.loadMin)}, heat-up ${fmt(best.heatUpMin)} to ${w.temperature(best.metalTempC)}, hold ${fmt(best.holdMin)}, unload ${fmt(line.unloadMin)} min.`
        : noPointReason(line.airTempC, coating.cureSchedule, w),
      warnings: detail?.warnings ?? [],
      loadMin: line.loadMin,
      unloadMin: line.unloadMin,
      cycleMin,
    };
  }

  checkStages(line.stages);
  if (input.lineSpeedMPerMin === undefined) {
    throw new DomainError("lineSpeedMPerMin", "lineSpeedMPerMin is required for a conveyor line.");
  }
  const lineSpeedMPerMin = checkLineSpeed(input.lineSpeedMPerMin, line);
  const position = cureOvenPosition(line.stages, coating.kind);
  const stage = line.stages[position];
  if (stage.tempC == null) throw new DomainError(`line.stages.${position}.tempC`, `The ${stage.name} stage has no air temperature.`);
  if (stage.heatTransferCoefficientWPerM2K == null) {
    throw new DomainError(`line.stages.${position}.heatTransferCoefficientWPerM2K`, `The ${stage.name} stage has no heat-transfer coefficient.`);
  }
  const oven = { airTempC: stage.tempC, heatTransferCoefficientWPerM2K: stage.heatTransferCoefficientWPerM2K };
  const { best, points, detail } = evaluatePoints(coating.cureSchedule, oven, thicknessMm, startTempC);
  // REFERENCES.md, conveyor lines: oven dwell = oven conveyor path / line speed
  const dwellMin = stageDwellMin(stage.lengthM, lineSpeedMPerMin);
  const requiredMin = best?.totalMin ?? null;
  const marginMin = requiredMin === null ? null : dwellMin - requiredMin;
  // the same relation solved for speed: the fastest speed whose dwell still covers the need
  const fastest = requiredMin !== null && requiredMin > 0 ? stage.lengthM / requiredMin : null;
  const inRange =
    fastest === null
      ? requiredMin === null ? null : line.lineSpeedMaxMPerMin
      : fastest >= line.lineSpeedMinMPerMin ? Math.min(fastest, line.lineSpeedMaxMPerMin) : null;
  // "at least the required time": a dwell equal to the need passes, within float tolerance
  const pass = requiredMin !== null && isAtLeast(dwellMin, requiredMin);

  let reason: string;
  if (!best) reason = noPointReason(oven.airTempC, coating.cureSchedule, w);
  else if (pass) {
    reason = `Cures with ${fmt(marginMin!)} min to spare: ${fmt(dwellMin)} min in ${stage.name} at ${w.speed(lineSpeedMPerMin)} against ${fmt(requiredMin!)} min needed (heat-up ${fmt(best.heatUpMin)} to ${w.temperature(best.metalTempC)}, hold ${fmt(best.holdMin)}).`;
  } else {
    reason =
      `Does not cure: ${fmt(dwellMin)} min in ${stage.name} at ${w.speed(lineSpeedMPerMin)}, ${fmt(requiredMin!)} min needed ` +
      `(short by ${fmt(-marginMin!)} min). ` +
      (inRange !== null
        ? `Run at ${w.speed(inRange)} or slower.`
        : `Even the line's slowest speed (${w.speed(line.lineSpeedMinMPerMin)}) is too fast; use the batch oven or a thinner section.`);
  }

  return {
    lineKind: "conveyor",
    thicknessMm,
    startTempC,
    airTempC: oven.airTempC,
    heatTransferCoefficientWPerM2K: oven.heatTransferCoefficientWPerM2K,
    curePoint: best ? { metalTempC: best.metalTempC, holdMin: best.holdMin } : null,
    heatUpMin: best?.heatUpMin ?? null,
    holdMin: best?.holdMin ?? null,
    requiredMin,
    biotNumber: detail?.biotNumber ?? null,
    points,
    pass,
    reason,
    warnings: detail?.warnings ?? [],
    ovenStage: { position, name: stage.name, lengthM: stage.lengthM },
    lineSpeedMPerMin,
    dwellMin,
    marginMin,
    fastestCuringSpeedMPerMin: fastest,
    fastestCuringSpeedInRangeMPerMin: inRange,
  };
}

function noPointReason(airTempC: number, schedule: readonly CurePoint[], w: CureWords): string {
  const lowest = Math.min(...schedule.map((p) => p.metalTempC));
  return `Does not cure: the oven air (${w.temperature(airTempC)}) is not above any point of the cure schedule (lowest ${w.temperature(lowest)}); metal never reaches the air temperature.`;
}
