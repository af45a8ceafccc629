/**
 * Throughput of one part on one finishing line (or a what-if scenario of it): carriers, parts
 * and square metres per hour, oven dwell and cure margin, powder per hour, cost per part, and
 * the stage that limits the line, named in words. Pure: every formula comes from
 * lib/coating-math, lib/lines/cure-check and lib/rack; this module only chooses the speed and
 * puts the pieces side by side.
 */
import { costPerPart } from "../coating-math/cost";
import type { CurePoint } from "../coating-math/cure";
import { DomainError, requireInRange, requirePositive } from "../coating-math/errors";
import { isAtLeast, isAtMost } from "../coating-math/compare";
import { lineThroughput } from "../coating-math/line";
import { powderEstimate } from "../coating-math/powder";
import { convert, formatSignificant } from "../coating-math/units";
import { planRack, MAX_PARTS_PER_CARRIER } from "../rack/plan";
import { batchOvenRackingThroughput, conveyorRackingThroughput } from "../rack/throughput";
import type { OrientationMode, RackLimit } from "../rack/types";
import { cureCheck, cureOvenPosition, type BatchCureCheck, type ConveyorCureCheck } from "./cure-check";
import { checkLineSpeed, checkStages, type StageInput } from "./stages";

const MIN_PER_H = convert(1, "h", "min");
/** The racking planner's default gap between parts, as on the racking screen (common practice, no source). */
export const DEFAULT_CLEARANCE_MM = 50;
export const DEFAULT_SHIFT_H = 8;

export interface WindowMm {
  widthMm: number;
  heightMm: number;
  depthMm: number;
}

interface CompareLineCommon {
  name: string;
  /** labour, energy and overhead of running the line (or oven) for one hour */
  hourlyCost: number;
  /** a carrier's usable window (conveyor) or each rack's (batch oven) */
  windowMm: WindowMm;
  maxLoadKg: number;
}

export interface CompareConveyorLine extends CompareLineCommon {
  kind: "conveyor";
  lineSpeedMinMPerMin: number;
  lineSpeedMaxMPerMin: number;
  lineSpeedNominalMPerMin: number;
  carrierPitchM: number;
  stages: readonly StageInput[];
}

export interface CompareBatchOven extends CompareLineCommon {
  kind: "batch";
  racksPerLoad: number;
  airTempC: number;
  heatTransferCoefficientWPerM2K: number;
  loadMin: number;
  unloadMin: number;
}

export type CompareLine = CompareConveyorLine | CompareBatchOven;

/** A what-if: the line with some of its figures changed. Absent fields keep the line's own. */
export interface ScenarioOverrides {
  /** run at this speed instead of the fastest that cures (conveyor only) */
  lineSpeedMPerMin?: number;
  carrierPitchM?: number;
  /** parts per carrier (or per rack) instead of the racking plan's count */
  partsPerCarrier?: number;
  /** conveyor path length of the powder cure oven */
  ovenLengthM?: number;
  /** air temperature of the powder cure oven (or the batch oven) */
  airTempC?: number;
}

export const OVERRIDE_FIELDS = ["lineSpeedMPerMin", "carrierPitchM", "partsPerCarrier", "ovenLengthM", "airTempC"] as const;

export interface ComparePart {
  /** outside area that takes powder (after masking) */
  areaM2: number;
  /** inside of tubes and boxes: e-coat reaches it, powder does not */
  insideAreaM2?: number;
  massKg: number;
  /** equivalent section thickness 2·V/A that sets heat-up */
  thicknessMm: number;
  /** bounding box for racking: x, y, z of a mesh */
  lengthMm: number;
  widthMm: number;
  heightMm: number;
}

export interface ComparePowder {
  specificGravity: number;
  filmUm: number;
  firstPassEfficiency: number;
  reclaimEfficiency?: number;
  pricePerKg: number;
  cureSchedule: readonly CurePoint[];
}

export interface CompareOptions {
  /** parts per carrier typed by hand for this item; wins over the plan, not over a scenario's own */
  partsPerCarrier?: number;
  clearanceMm?: number;
  orientations?: OrientationMode;
  shiftHours?: number;
  startTempC?: number;
}

/** How numbers appear inside the sentences (the server passes the user's unit system). */
export interface FigureWords {
  speed: (mPerMin: number) => string;
  length: (m: number) => string;
  lengthMm: (mm: number) => string;
  mass: (kg: number) => string;
  temperature: (c: number) => string;
}

const fmt = (v: number) => formatSignificant(v, 3);
export const METRIC_WORDS: FigureWords = {
  speed: (v) => `${fmt(v)} m/min`,
  length: (v) => `${fmt(v)} m`,
  lengthMm: (v) => `${formatSignificant(v, 4)} mm`,
  mass: (v) => `${formatSignificant(v, 4)} kg`,
  temperature: (v) => `${fmt(v)} °C`,
};

export interface ThroughputCompareInput {
  line: CompareLine;
  overrides?: ScenarioOverrides;
  part: ComparePart;
  powder: ComparePowder;
  options?: CompareOptions;
  words?: FigureWords;
}

export type LimitKind = "line-speed" | "cure-dwell" | "batch-cycle" | "carrier-space" | "carrier-load" | "no-cure";

export interface ThroughputLimit {
  kind: LimitKind;
  /** e.g. "Cure dwell in Powder cure oven limits speed to 2.1 m/min (…)" */
  sentence: string;
  /** the fastest the line may run for this part (conveyor), when a speed is what limits */
  limitSpeedMPerMin: number | null;
}

export type SpeedSource = "scenario" | "fastest-curing" | "line-max" | "line-min" | "nominal";
export type PartsPerCarrierSource = "scenario" | "hand" | "planned";

export interface RackSummary {
  count: number;
  spaceCount: number;
  limitedBy: RackLimit;
  reason: string;
}

export interface ThroughputFigures {
  lineKind: "conveyor" | "batch";
  /** conveyor only */
  lineSpeedMPerMin: number | null;
  speedSource: SpeedSource | null;
  carrierPitchM: number | null;
  partsPerCarrier: number;
  partsPerCarrierSource: PartsPerCarrierSource;
  /** the racking planner's answer for the line's window (also when a count was typed) */
  rackPlan: RackSummary;
  /** racks per hour for a batch oven */
  carriersPerHour: number;
  partsPerHour: number;
  partsPerShift: number;
  shiftHours: number;
  /** powder-coated area per hour */
  areaM2PerHour: number;
  /** outside + inside area through an e-coat tank per hour; null without one */
  eCoatAreaM2PerHour: number | null;
  ovenName: string;
  /** conveyor path of the powder cure oven; null for a batch oven */
  ovenLengthM: number | null;
  airTempC: number;
  /** conveyor: oven path / speed; batch: heat-up + hold, the time the cycle gives the cure */
  ovenDwellMin: number;
  cureRequiredMin: number | null;
  cureMarginMin: number | null;
  cures: boolean;
  cureReason: string;
  /** oven length / cure time, not bounded by the line's range */
  fastestCuringSpeedMPerMin: number | null;
  batchCycleMin: number | null;
  powderKgPerPart: number;
  powderKgPerHour: number;
  materialCostPerPart: number;
  /** null when nothing comes off the line */
  lineCostPerPart: number | null;
  costPerPart: number | null;
  limit: ThroughputLimit;
  /** further limits and cautions, in words */
  notes: string[];
}

function has<K extends keyof ScenarioOverrides>(o: ScenarioOverrides, k: K): o is ScenarioOverrides & Required<Pick<ScenarioOverrides, K>> {
  return o[k] !== undefined && o[k] !== null;
}

/**
 * The line as the scenario changes it. Throws a DomainError on `overrides.<field>` for a change
 * the line cannot take: a speed outside its range, an oven length on a batch oven…
 */
export function applyOverrides(line: CompareLine, overrides: ScenarioOverrides = {}): CompareLine {
  const o = overrides;
  if (has(o, "partsPerCarrier")) {
    requireInRange("overrides.partsPerCarrier", o.partsPerCarrier, { gte: 1, lte: MAX_PARTS_PER_CARRIER, integer: true });
  }
  if (has(o, "airTempC")) requireInRange("overrides.airTempC", o.airTempC, { gt: 0, lte: 600 });
  if (line.kind === "batch") {
    for (const f of ["lineSpeedMPerMin", "carrierPitchM", "ovenLengthM"] as const) {
      if (has(o, f)) {
        const what = f === "lineSpeedMPerMin" ? "line speed" : f === "carrierPitchM" ? "carrier pitch" : "conveyor oven length";
        throw new DomainError(`overrides.${f}`, `${line.name} is a batch oven: it has no ${what} to change.`);
      }
    }
    return has(o, "airTempC") ? { ...line, airTempC: o.airTempC } : line;
  }
  checkStages(line.stages);
  if (has(o, "lineSpeedMPerMin")) {
    try {
      checkLineSpeed(o.lineSpeedMPerMin, line);
    } catch (e) {
      if (e instanceof DomainError) throw new DomainError("overrides.lineSpeedMPerMin", e.message);
      throw e;
    }
  }
  if (has(o, "carrierPitchM")) requireInRange("overrides.carrierPitchM", o.carrierPitchM, { gt: 0, lte: 100 });
  if (!has(o, "ovenLengthM") && !has(o, "airTempC")) return has(o, "carrierPitchM") ? { ...line, carrierPitchM: o.carrierPitchM } : line;
  if (has(o, "ovenLengthM")) requireInRange("overrides.ovenLengthM", o.ovenLengthM, { gt: 0, lte: 5000 });
  let at: number;
  try {
    at = cureOvenPosition(line.stages, "powder");
  } catch (e) {
    if (e instanceof DomainError) throw new DomainError(has(o, "ovenLengthM") ? "overrides.ovenLengthM" : "overrides.airTempC", e.message);
    throw e;
  }
  const stages = line.stages.map((s, i) =>
    i === at ? { ...s, lengthM: o.ovenLengthM ?? s.lengthM, tempC: o.airTempC ?? s.tempC } : s,
  );
  return { ...line, carrierPitchM: o.carrierPitchM ?? line.carrierPitchM, stages };
}

function rackSummary(line: CompareLine, part: ComparePart, options: CompareOptions): RackSummary {
  const plan = planRack({
    part: { lengthMm: part.lengthMm, widthMm: part.widthMm, heightMm: part.heightMm, massKg: part.massKg },
    carrier: { ...line.windowMm, maxLoadKg: line.maxLoadKg },
    clearanceMm: options.clearanceMm ?? DEFAULT_CLEARANCE_MM,
    orientations: options.orientations ?? "upright",
  });
  return { count: plan.count, spaceCount: plan.spaceCount, limitedBy: plan.limitedBy, reason: plan.reason };
}

/** At the fastest curing speed the margin is zero up to float noise (1e-15 min): show it as zero. */
function snapToZero(value: number, scale: number): number {
  return Math.abs(value) <= 1e-9 * Math.abs(scale) ? 0 : value;
}

function checkPart(part: ComparePart): void {
  requirePositive("part.areaM2", part.areaM2);
  requireInRange("part.insideAreaM2", part.insideAreaM2 ?? 0, { gte: 0 });
  requirePositive("part.massKg", part.massKg);
  requirePositive("part.thicknessMm", part.thicknessMm);
}

/** Powder per part, material cost, and cost per part at `partsPerHour` (0 → no line cost). */
function money(line: CompareLine, part: ComparePart, powder: ComparePowder, partsPerHour: number) {
  const p = powderEstimate({
    areaM2: part.areaM2,
    filmUm: powder.filmUm,
    specificGravity: powder.specificGravity,
    firstPassEfficiency: powder.firstPassEfficiency,
    reclaimEfficiency: powder.reclaimEfficiency ?? 0,
    pricePerKg: powder.pricePerKg,
  });
  const materialCostPerPart = p.costTotal ?? 0;
  if (!(partsPerHour > 0)) {
    return { powderKgPerPart: p.powderKgPerPart, powderKgPerHour: 0, materialCostPerPart, lineCostPerPart: null, costPerPart: null };
  }
  // Steady state: each part takes 60 / (parts per hour) minutes of line time.
  const c = costPerPart({ materialCostPerPart, lineTimeMin: MIN_PER_H / partsPerHour, partsInRun: 1, lineRatePerHour: line.hourlyCost });
  return {
    powderKgPerPart: p.powderKgPerPart,
    powderKgPerHour: p.powderKgPerPart * partsPerHour,
    materialCostPerPart,
    lineCostPerPart: c.lineCostPerPart,
    costPerPart: c.totalPerPart,
  };
}

function partsPerCarrierFor(overrides: ScenarioOverrides, options: CompareOptions, plan: RackSummary) {
  if (overrides.partsPerCarrier != null) return { partsPerCarrier: overrides.partsPerCarrier, source: "scenario" as const };
  if (options.partsPerCarrier != null) {
    requireInRange("partsPerCarrier", options.partsPerCarrier, { gte: 1, lte: MAX_PARTS_PER_CARRIER, integer: true });
    return { partsPerCarrier: options.partsPerCarrier, source: "hand" as const };
  }
  return { partsPerCarrier: plan.count, source: "planned" as const };
}

function carrierLimit(plan: RackSummary): ThroughputLimit {
  return { kind: plan.spaceCount === 0 ? "carrier-space" : "carrier-load", sentence: plan.reason, limitSpeedMPerMin: null };
}

/** Throughput figures of one part on one line or scenario. */
export function throughputFigures(input: ThroughputCompareInput): ThroughputFigures {
  const overrides = input.overrides ?? {};
  const options = input.options ?? {};
  const words = input.words ?? METRIC_WORDS;
  const { part, powder } = input;
  checkPart(part);
  const shiftHours = requireInRange("shiftHours", options.shiftHours ?? DEFAULT_SHIFT_H, { gt: 0, lte: 24 });
  const line = applyOverrides(input.line, overrides);
  const plan = rackSummary(line, part, options);
  const { partsPerCarrier, source } = partsPerCarrierFor(overrides, options, plan);
  const coating = { kind: "powder" as const, cureSchedule: powder.cureSchedule };
  const startTempC = options.startTempC;
  const notes: string[] = [];
  if (source === "planned" && plan.limitedBy === "load" && plan.count > 0) {
    notes.push(`The ${words.mass(line.maxLoadKg)} load limit allows ${plan.count} of the ${plan.spaceCount} parts that fit.`);
  }
  if (source !== "planned") notes.push(`${partsPerCarrier} per ${line.kind === "batch" ? "rack" : "carrier"} ${source === "scenario" ? "set by the scenario" : "entered by hand"}; the racking plan gives ${plan.count}.`);

  if (line.kind === "batch") return batchFigures(line, input, { plan, partsPerCarrier, source, shiftHours, notes, coating, startTempC, words });

  // The speed: the scenario's, else the fastest the line can run and still cure the part.
  const probe = cureCheck({ line, coating, thicknessMm: part.thicknessMm, lineSpeedMPerMin: overrides.lineSpeedMPerMin ?? line.lineSpeedMinMPerMin, startTempC, words }) as ConveyorCureCheck;
  let speed: number;
  let speedSource: SpeedSource;
  if (overrides.lineSpeedMPerMin != null) {
    speed = overrides.lineSpeedMPerMin;
    speedSource = "scenario";
  } else if (probe.requiredMin === null) {
    speed = line.lineSpeedNominalMPerMin;
    speedSource = "nominal";
  } else if (probe.fastestCuringSpeedInRangeMPerMin === null) {
    speed = line.lineSpeedMinMPerMin;
    speedSource = "line-min";
  } else {
    speed = probe.fastestCuringSpeedInRangeMPerMin;
    speedSource = isAtLeast(speed, line.lineSpeedMaxMPerMin) ? "line-max" : "fastest-curing";
  }
  const cure = speed === probe.lineSpeedMPerMin ? probe : (cureCheck({ line, coating, thicknessMm: part.thicknessMm, lineSpeedMPerMin: speed, startTempC, words }) as ConveyorCureCheck);
  notes.push(...cure.warnings);

  // REFERENCES.md, conveyor lines: carriers/h = speed × 60 / pitch; dwell = oven path / speed.
  const flow =
    partsPerCarrier > 0
      ? lineThroughput({ lineSpeedMPerMin: speed, carrierPitchM: line.carrierPitchM, partsPerCarrier, ovenPathLengthM: cure.ovenStage.lengthM })
      : { ...conveyorRackingThroughput({ lineSpeedMPerMin: speed, carrierPitchM: line.carrierPitchM, partsPerCarrier: 0 }), ovenDwellMin: cure.dwellMin };
  if (line.carrierPitchM * 1000 < line.windowMm.widthMm) {
    notes.push(`At ${words.length(line.carrierPitchM)} pitch the carriers are closer than their ${words.lengthMm(line.windowMm.widthMm)} window is wide: parts on neighbouring carriers may touch.`);
  }
  const hasECoat = line.stages.some((s) => s.kind === "e-coat");
  const m = money(line, part, powder, flow.partsPerHour);

  return {
    lineKind: "conveyor",
    lineSpeedMPerMin: speed,
    speedSource,
    carrierPitchM: line.carrierPitchM,
    partsPerCarrier,
    partsPerCarrierSource: source,
    rackPlan: plan,
    carriersPerHour: flow.carriersPerHour,
    partsPerHour: flow.partsPerHour,
    partsPerShift: flow.partsPerHour * shiftHours,
    shiftHours,
    areaM2PerHour: flow.partsPerHour * part.areaM2,
    eCoatAreaM2PerHour: hasECoat ? flow.partsPerHour * (part.areaM2 + (part.insideAreaM2 ?? 0)) : null,
    ovenName: cure.ovenStage.name,
    ovenLengthM: cure.ovenStage.lengthM,
    airTempC: cure.airTempC,
    ovenDwellMin: flow.ovenDwellMin,
    cureRequiredMin: cure.requiredMin,
    cureMarginMin: cure.marginMin === null ? null : snapToZero(cure.marginMin, cure.dwellMin),
    cures: cure.pass,
    cureReason: cure.reason,
    fastestCuringSpeedMPerMin: cure.fastestCuringSpeedMPerMin,
    batchCycleMin: null,
    ...m,
    limit: partsPerCarrier === 0 ? carrierLimit(plan) : conveyorLimit(line, cure, speedSource, words),
    notes,
  };
}

function conveyorLimit(line: CompareConveyorLine, cure: ConveyorCureCheck, speedSource: SpeedSource, w: FigureWords): ThroughputLimit {
  const oven = cure.ovenStage.name;
  const fastest = cure.fastestCuringSpeedMPerMin;
  const max = line.lineSpeedMaxMPerMin;
  if (cure.requiredMin === null) return { kind: "no-cure", sentence: cure.reason, limitSpeedMPerMin: null };
  const need = `${fmt(cure.requiredMin)} min needed: heat-up ${fmt(cure.heatUpMin!)} min to ${w.temperature(cure.curePoint!.metalTempC)}, hold ${fmt(cure.holdMin!)} min`;
  const running = speedSource === "scenario" ? `; the scenario runs at ${w.speed(cure.lineSpeedMPerMin)}` : "";
  if (fastest === null || isAtLeast(fastest, max)) {
    const cureText = fastest === null ? "the cure needs no oven time" : `${oven} would cure at up to ${w.speed(fastest)}`;
    return { kind: "line-speed", sentence: `The conveyor's top speed limits speed to ${w.speed(max)}; ${cureText}${running}.`, limitSpeedMPerMin: max };
  }
  if (!cure.pass && speedSource === "scenario") {
    return {
      kind: "cure-dwell",
      sentence: `Cure dwell in ${oven} limits speed to ${w.speed(fastest)}: at the scenario's ${w.speed(cure.lineSpeedMPerMin)} the part gets ${fmt(cure.dwellMin)} min of the ${need}, so it does not cure.`,
      limitSpeedMPerMin: fastest,
    };
  }
  if (!cure.pass) {
    return {
      kind: "cure-dwell",
      sentence: `Cure dwell in ${oven} limits speed to ${w.speed(fastest)}, below the line's slowest ${w.speed(line.lineSpeedMinMPerMin)}: the part does not cure on this line (${need}).`,
      limitSpeedMPerMin: fastest,
    };
  }
  return {
    kind: "cure-dwell",
    sentence: `Cure dwell in ${oven} limits speed to ${w.speed(fastest)} (${w.length(cure.ovenStage.lengthM)} of oven, ${need})${running}.`,
    limitSpeedMPerMin: fastest,
  };
}

interface BatchContext {
  plan: RackSummary;
  partsPerCarrier: number;
  source: PartsPerCarrierSource;
  shiftHours: number;
  notes: string[];
  coating: { kind: "powder"; cureSchedule: readonly CurePoint[] };
  startTempC: number | undefined;
  words: FigureWords;
}

function batchFigures(line: CompareBatchOven, input: ThroughputCompareInput, ctx: BatchContext): ThroughputFigures {
  const { part, powder } = input;
  const { plan, partsPerCarrier, source, shiftHours, notes, words } = ctx;
  const cure = cureCheck({
    line: { kind: "batch", airTempC: line.airTempC, heatTransferCoefficientWPerM2K: line.heatTransferCoefficientWPerM2K, loadMin: line.loadMin, unloadMin: line.unloadMin },
    coating: ctx.coating,
    thicknessMm: part.thicknessMm,
    startTempC: ctx.startTempC,
    words,
  }) as BatchCureCheck;
  notes.push(...cure.warnings);
  const common = {
    lineKind: "batch" as const,
    lineSpeedMPerMin: null,
    speedSource: null,
    carrierPitchM: null,
    partsPerCarrier,
    partsPerCarrierSource: source,
    rackPlan: plan,
    shiftHours,
    eCoatAreaM2PerHour: null,
    ovenName: line.name,
    ovenLengthM: null,
    airTempC: line.airTempC,
    cureReason: cure.reason,
    fastestCuringSpeedMPerMin: null,
  };
  if (!cure.pass) {
    return {
      ...common,
      carriersPerHour: 0,
      partsPerHour: 0,
      partsPerShift: 0,
      areaM2PerHour: 0,
      ovenDwellMin: 0,
      cureRequiredMin: null,
      cureMarginMin: null,
      cures: false,
      batchCycleMin: null,
      ...money(line, part, powder, 0),
      limit: { kind: "no-cure", sentence: cure.reason, limitSpeedMPerMin: null },
      notes,
    };
  }
  const batchInput = {
    racksPerLoad: line.racksPerLoad,
    loadMin: line.loadMin,
    heatUpMin: cure.heatUpMin!,
    holdMin: cure.holdMin!,
    unloadMin: line.unloadMin,
    shiftLengthH: shiftHours,
  };
  // lib/rack/throughput (common practice, no source): one cycle = load + heat-up + hold + unload.
  const batch = batchOvenRackingThroughput({ ...batchInput, partsPerRack: partsPerCarrier });
  // the same cycle counted in racks: one part per rack gives racks per hour
  const racks = batchOvenRackingThroughput({ ...batchInput, partsPerRack: 1 });
  notes.push("A batch cycle is sized to the cure, so it has no margin; add time as the plant's practice asks.");
  const limit: ThroughputLimit =
    partsPerCarrier === 0
      ? carrierLimit(plan)
      : {
          kind: "batch-cycle",
          sentence:
            `The batch cycle limits output: ${fmt(batch.cycleMin)} min a load (load ${fmt(line.loadMin)} min, heat-up ${fmt(cure.heatUpMin!)} min to ` +
            `${words.temperature(cure.curePoint!.metalTempC)}, hold ${fmt(cure.holdMin!)} min, unload ${fmt(line.unloadMin)} min) for ` +
            `${line.racksPerLoad} racks × ${partsPerCarrier} parts.`,
          limitSpeedMPerMin: null,
        };
  return {
    ...common,
    carriersPerHour: racks.partsPerHour,
    partsPerHour: batch.partsPerHour,
    partsPerShift: batch.partsPerShift,
    areaM2PerHour: batch.partsPerHour * part.areaM2,
    ovenDwellMin: cure.requiredMin!,
    cureRequiredMin: cure.requiredMin,
    cureMarginMin: 0,
    cures: true,
    batchCycleMin: batch.cycleMin,
    ...money(line, part, powder, batch.partsPerHour),
    limit,
    notes,
  };
}

// ---------------------------------------------------------------------------------------------
// Which column is best per measure.

/** Measures compared across columns, and which way is better. */
export const MEASURES = {
  carriersPerHour: "max",
  partsPerHour: "max",
  areaM2PerHour: "max",
  cureMarginMin: "max",
  powderKgPerPart: "min",
  costPerPart: "min",
} as const;
export type Measure = keyof typeof MEASURES;

type Comparable = Pick<ThroughputFigures, Measure | "cures">;

/**
 * For each measure, the indexes of the best columns (ties, within float tolerance, all count).
 * A column whose part does not cure produces scrap: it competes only on cure margin.
 */
export function bestPerMeasure(columns: readonly Comparable[]): Record<Measure, number[]> {
  const out = {} as Record<Measure, number[]>;
  for (const measure of Object.keys(MEASURES) as Measure[]) {
    const better = MEASURES[measure];
    const values = columns.map((c, i) => ({ i, v: c[measure], ok: measure === "cureMarginMin" || c.cures }));
    const eligible = values.filter((x): x is { i: number; v: number; ok: boolean } => x.ok && typeof x.v === "number" && Number.isFinite(x.v));
    if (measure !== "cureMarginMin" && measure !== "powderKgPerPart") {
      // nothing coming off the line is not a best
      const nonZero = eligible.filter((x) => x.v > 0);
      eligible.splice(0, eligible.length, ...nonZero);
    }
    if (!eligible.length) {
      out[measure] = [];
      continue;
    }
    const target = better === "max" ? Math.max(...eligible.map((x) => x.v)) : Math.min(...eligible.map((x) => x.v));
    out[measure] = eligible.filter((x) => (better === "max" ? isAtLeast(x.v, target) : isAtMost(x.v, target))).map((x) => x.i);
  }
  return out;
}
