/**
 * A run's plan: one part × quantity × coats in order, on one line. Racking (parts per carrier),
 * carriers, line time, oven dwell and cure margin per coat, coated area, material and whole
 * containers per coat, and cost per part. Pure: the service feeds it rows, the form feeds it the
 * same shapes in the browser for a live summary.
 */
import { DomainError, requireInRange } from "../coating-math/errors";
import { isAbove, isAtMost, isBelow, tolerantCeil } from "../coating-math/compare";
import { costPerPart, runLineTimeMin, type CostPerPart } from "../coating-math/cost";
import type { CurePoint } from "../coating-math/cure";
import { ecoatEstimate, ecoatPaintUse } from "../coating-math/ecoat";
import { pa2SamplingPlan, type Pa2SamplingPlan } from "../coating-math/film";
import { stageDwellMin } from "../coating-math/line";
import { powderEstimate } from "../coating-math/powder";
import { formatSignificant } from "../coating-math/units";
import { cureCheck, type CureCheck } from "../lines/cure-check";
import { APPLYING_STAGE, STAGE_KIND_LABELS, checkLineSpeed, type CoatingKind, type StageInput } from "../lines/stages";
import { planRack } from "../rack/plan";
import { RackInputError } from "../rack/rack-error";
import type { OrientationMode, RackOrientation, RackPlan } from "../rack/types";

/**
 * Cathodic e-coat coulombic yield used for the charge figure only (the paint mass does not
 * depend on it): ~30 mg/C, from memory (REFERENCES.md, electrocoat).
 */
export const DEFAULT_COULOMBIC_YIELD_MG_PER_C = 30;
/** Parts enter the line at shop temperature (common practice, no source). */
export const DEFAULT_START_TEMP_C = 20;

export interface PlanPart {
  number: string;
  name: string;
  lengthMm: number;
  widthMm: number;
  heightMm: number;
  massKg: number;
  /** outside surface, before masking */
  areaM2: number;
  /** inside surface only immersion (e-coat) reaches */
  insideAreaM2: number;
  maskedAreaM2: number;
  /** section thickness that sets heat-up */
  thicknessMm: number;
}

interface PlanLineCommon {
  name: string;
  windowMm: { widthMm: number; heightMm: number; depthMm: number };
  maxLoadKg: number;
  hourlyCost: number;
}

export interface PlanConveyorLine extends PlanLineCommon {
  kind: "conveyor";
  lineSpeedMinMPerMin: number;
  lineSpeedMaxMPerMin: number;
  lineSpeedNominalMPerMin: number;
  carrierPitchM: number;
  stages: readonly StageInput[];
}

export interface PlanBatchLine extends PlanLineCommon {
  kind: "batch";
  racksPerLoad: number;
  airTempC: number;
  heatTransferCoefficientWPerM2K: number;
  loadMin: number;
  unloadMin: number;
}

export type PlanLine = PlanConveyorLine | PlanBatchLine;

export interface PlanCoating {
  id: number;
  code: string;
  name: string;
  kind: CoatingKind;
  colourName: string;
  swatchHex: string;
  specificGravity: number | null;
  volumeSolidsFraction: number | null;
  weightSolidsFraction: number | null;
  filmDensityGPerCm3: number | null;
  filmMinUm: number;
  filmMaxUm: number;
  cureSchedule: readonly CurePoint[];
  pricePerKg: number;
  containerKind: "box" | "drum";
  containerKg: number;
}

export interface PlanCoatInput {
  coating: PlanCoating;
  filmUm: number;
  /** powder only, (0, 1] */
  firstPassEfficiency?: number | null;
  /** powder only, [0, 1]; 0 when left out */
  reclaimEfficiency?: number | null;
  /**
   * powder only, (0, 1]: utilisation measured from actual use on this line × coating; when
   * given it replaces the first-pass/reclaim figure for the powder sprayed
   */
  measuredUtilization?: number | null;
  /** how many recorded runs the measured figure rests on (shown beside it) */
  measuredRuns?: number | null;
}

export interface PlanRacking {
  clearanceMm: number;
  orientations: OrientationMode;
  orientation?: RackOrientation | null;
  /** parts per carrier set by hand instead of the planner's count */
  partsPerCarrierOverride?: number | null;
  /** the clearance and orientation above come from this saved racking plan (part × line) */
  savedPlanId?: number | null;
}

export interface PlanRunInput {
  part: PlanPart;
  quantity: number;
  line: PlanLine;
  /** conveyor lines; the line's nominal speed when left out */
  lineSpeedMPerMin?: number | null;
  racking: PlanRacking;
  coats: readonly PlanCoatInput[];
  startTempC?: number;
}

export interface CoatCure {
  ovenName: string;
  /** stage position on a conveyor line */
  ovenPosition: number | null;
  airTempC: number;
  /** time in the oven: conveyor dwell at the run's speed; batch: heat-up + hold to set */
  dwellMin: number | null;
  /** heat-up + hold */
  requiredMin: number | null;
  heatUpMin: number | null;
  holdMin: number | null;
  curePoint: CurePoint | null;
  /** dwell − required (conveyor) */
  marginMin: number | null;
  /** load + heat-up + hold + unload (batch) */
  cycleMin: number | null;
  pass: boolean;
  reason: string;
  warnings: string[];
}

export interface CoatPlan {
  position: number;
  coatingId: number;
  code: string;
  name: string;
  kind: CoatingKind;
  colourName: string;
  swatchHex: string;
  filmUm: number;
  filmMinUm: number;
  filmMaxUm: number;
  firstPassEfficiency: number | null;
  reclaimEfficiency: number | null;
  /** 1 for the first trip through the line; a later coat that needs the same booth again is pass 2 */
  pass: number;
  /** where the coat goes on (conveyor lines) */
  applyStage: { position: number; name: string } | null;
  areaPerPartM2: number;
  /** all parts of the run */
  areaM2: number;
  /** the utilisation the material figures use (the measured one when given) */
  materialUtilization: number | null;
  /** powder: steady-state utilisation from first-pass and reclaim efficiency */
  nominalUtilization: number | null;
  /** powder: the measured utilisation given with the coat, else null */
  measuredUtilization: number | null;
  measuredRuns: number | null;
  /** which figure the material uses; e-coat is always "nominal" (theoretical use) */
  utilizationUsed: "measured" | "nominal";
  materialKgPerPart: number;
  materialKg: number;
  materialCost: number;
  /** e-coat: theoretical paint volume, no drag-out */
  paintL: number | null;
  /** e-coat: charge to deposit the film */
  chargeC: number | null;
  containerKind: "box" | "drum";
  containerKg: number;
  containers: number;
  cure: CoatCure;
  filmCheck: Pa2SamplingPlan;
}

export interface RunRacking {
  /** what the run uses: the override, else the planner's count */
  partsPerCarrier: number;
  plannedPerCarrier: number;
  spaceCount: number;
  limitedBy: "space" | "load";
  reason: string;
  overridden: boolean;
  /** the saved racking plan the count comes from, or null for the live planner / a hand count */
  savedPlanId: number | null;
  loadKg: number;
  maxLoadKg: number;
  windowMm: { widthMm: number; heightMm: number; depthMm: number };
  clearanceMm: number;
  orientations: OrientationMode;
  plan: RackPlan;
}

export interface RunPlan {
  lineKind: "conveyor" | "batch";
  quantity: number;
  racking: RunRacking;
  /** conveyor carriers, or batch-oven racks */
  carriers: number;
  /** batch ovens: oven loads per coat */
  loads: number | null;
  /** trips through a conveyor line (a coat needing a stage already passed starts another) */
  passes: number;
  lineSpeedMPerMin: number | null;
  carrierPitchM: number | null;
  /** conveyor length from load to unload */
  lineLengthM: number | null;
  /** colour changes inside the run (between passes through one booth) */
  colourChangeMin: number;
  /** one carrier's trip through all stages (0 for a batch oven) */
  transitMin: number;
  /** the line's entrance is busy this long: the next run can start loading after it */
  loadingMin: number;
  /** first carrier loaded to last unloaded */
  lineTimeMin: number;
  coats: CoatPlan[];
  materialKg: number;
  materialCost: number;
  cost: CostPerPart;
  /** every coat cures */
  cures: boolean;
  warnings: string[];
}

const fmt = (v: number, sig = 3) => formatSignificant(v, sig);

/** Whole containers to cover `kg`: ceil, ignoring float noise (75.00000000000001 kg of 25 kg boxes is 3). */
export function wholeContainers(kg: number, containerKg: number): number {
  requireInRange("kg", kg, { gte: 0 });
  requireInRange("containerKg", containerKg, { gt: 0 });
  return tolerantCeil(kg / containerKg);
}

/**
 * Coated area of one part for a coat: powder reaches the outside only, e-coat also the inside
 * (immersion); masked area is subtracted either way (PRODUCT.md, parts).
 */
export function coatAreaPerPartM2(part: Pick<PlanPart, "areaM2" | "insideAreaM2" | "maskedAreaM2">, kind: CoatingKind): number {
  return (kind === "e-coat" ? part.areaM2 + part.insideAreaM2 : part.areaM2) - part.maskedAreaM2;
}

/** Runs `fn`, re-throwing a domain error with the run's own field name (`mapField(e.field)`). */
function mapped<T>(mapField: (field: string) => string, fn: () => T): T {
  try {
    return fn();
  } catch (e) {
    if (e instanceof DomainError || e instanceof RackInputError) throw new DomainError(mapField(e.field), e.message);
    throw e;
  }
}

function rackField(field: string): string {
  if (field.startsWith("part")) return "partId";
  if (field.startsWith("carrier")) return "lineId";
  return field;
}

function planRacking(input: PlanRunInput, warnings: string[]): RunRacking {
  const { part, line, racking } = input;
  const word = line.kind === "conveyor" ? "carrier" : "rack";
  const plan = mapped(rackField, () =>
    planRack({
      part: { lengthMm: part.lengthMm, widthMm: part.widthMm, heightMm: part.heightMm, massKg: part.massKg },
      carrier: { ...line.windowMm, maxLoadKg: line.maxLoadKg },
      clearanceMm: racking.clearanceMm,
      orientations: racking.orientations,
      ...(racking.orientation ? { orientation: racking.orientation } : {}),
    }),
  );
  const saved = racking.savedPlanId ? ` (with saved racking plan ${racking.savedPlanId})` : "";
  if (plan.spaceCount === 0) {
    // the way out, when there is one: upright only, but it would fit laid over
    let hint = "";
    if (racking.orientations === "upright" && !racking.orientation) {
      const laid = planRack({
        part: { lengthMm: part.lengthMm, widthMm: part.widthMm, heightMm: part.heightMm, massKg: part.massKg },
        carrier: { ...line.windowMm, maxLoadKg: line.maxLoadKg },
        clearanceMm: racking.clearanceMm,
        orientations: "any",
      });
      if (laid.spaceCount > 0) hint = ` Allowing any orientation fits ${laid.spaceCount} per ${word}.`;
    }
    throw new DomainError("lineId", `Part ${part.number} does not fit on ${line.name}'s ${word}${saved}: ${plan.reason}${hint}`);
  }
  const override = racking.partsPerCarrierOverride ?? null;
  if (override === null && plan.count === 0) {
    throw new DomainError("lineId", `${line.name} cannot carry part ${part.number}${saved}: ${plan.reason}`);
  }
  let partsPerCarrier = plan.count;
  if (override !== null) {
    requireInRange("partsPerCarrierOverride", override, { gte: 1, integer: true });
    if (!isAtMost(override * part.massKg, line.maxLoadKg)) {
      throw new DomainError(
        "partsPerCarrierOverride",
        `${override} parts weigh ${fmt(override * part.massKg)} kg, above the ${word}'s ${fmt(line.maxLoadKg)} kg load limit.`,
      );
    }
    if (override > plan.spaceCount) {
      warnings.push(`${override} parts per ${word} is more than the ${plan.spaceCount} the racking planner fits in the window with this clearance: check on the ${word}.`);
    }
    partsPerCarrier = override;
  }
  const savedPlanId = racking.savedPlanId ?? null;
  return {
    partsPerCarrier,
    plannedPerCarrier: plan.count,
    spaceCount: plan.spaceCount,
    limitedBy: plan.limitedBy,
    reason: savedPlanId !== null ? `From saved racking plan ${savedPlanId}. ${plan.reason}` : plan.reason,
    overridden: override !== null,
    savedPlanId,
    loadKg: partsPerCarrier * part.massKg,
    maxLoadKg: line.maxLoadKg,
    windowMm: { ...line.windowMm },
    clearanceMm: racking.clearanceMm,
    orientations: racking.orientations,
    plan,
  };
}

interface Placement {
  pass: number;
  /** index into line.stages of the applying stage, and the first stage this coat's search may use */
  applyIndex: number;
  searchFrom: number;
}

/**
 * Walks the coats along the conveyor's stages: each coat needs its applying stage after the
 * previous coat's cure oven; when none is left, the carrier goes round again (another pass).
 */
function placeCoats(line: PlanConveyorLine, coats: readonly PlanCoatInput[]): Placement[] {
  const stages = line.stages;
  const out: Placement[] = [];
  let pass = 1;
  let cursor = 0;
  coats.forEach((c, i) => {
    const kind = APPLYING_STAGE[c.coating.kind];
    const find = (from: number) => stages.findIndex((s, k) => k >= from && s.kind === kind);
    let at = find(cursor);
    let searchFrom = cursor;
    if (at < 0) {
      at = find(0);
      if (at < 0) {
        throw new DomainError(
          `coats.${i}.coatingId`,
          `${line.name} has no ${STAGE_KIND_LABELS[kind].toLowerCase()} stage, so ${c.coating.code} (${c.coating.kind}) cannot go on here.`,
        );
      }
      pass += 1;
      searchFrom = 0;
    }
    const oven = stages.findIndex((s, k) => k > at && s.kind === "cure-oven");
    if (oven < 0) throw new DomainError("lineId", `No cure oven follows the ${stages[at].name} stage of ${line.name}.`);
    out.push({ pass, applyIndex: at, searchFrom });
    cursor = oven + 1;
  });
  return out;
}

function cureField(i: number) {
  return (field: string) => {
    if (field.startsWith("coating")) return `coats.${i}.coatingId`;
    if (field.startsWith("line")) return field === "lineSpeedMPerMin" ? "lineSpeedMPerMin" : "lineId";
    if (field === "thicknessMm") return "partId";
    return field;
  };
}

function coatCure(check: CureCheck, positionOffset: number): CoatCure {
  if (check.lineKind === "conveyor") {
    return {
      ovenName: check.ovenStage.name,
      ovenPosition: check.ovenStage.position + positionOffset,
      airTempC: check.airTempC,
      dwellMin: check.dwellMin,
      requiredMin: check.requiredMin,
      heatUpMin: check.heatUpMin,
      holdMin: check.holdMin,
      curePoint: check.curePoint,
      marginMin: check.marginMin,
      cycleMin: null,
      pass: check.pass,
      reason: check.reason,
      warnings: check.warnings,
    };
  }
  return {
    ovenName: "Batch oven",
    ovenPosition: null,
    airTempC: check.airTempC,
    dwellMin: check.requiredMin,
    requiredMin: check.requiredMin,
    heatUpMin: check.heatUpMin,
    holdMin: check.holdMin,
    curePoint: check.curePoint,
    marginMin: null,
    cycleMin: check.cycleMin,
    pass: check.pass,
    reason: check.reason,
    warnings: check.warnings,
  };
}

interface CoatMaterial {
  materialUtilization: number | null;
  nominalUtilization: number | null;
  measuredUtilization: number | null;
  measuredRuns: number | null;
  utilizationUsed: "measured" | "nominal";
  materialKgPerPart: number;
  materialKg: number;
  paintL: number | null;
  chargeC: number | null;
}

function coatMaterial(c: PlanCoatInput, i: number, areaPerPartM2: number, quantity: number): CoatMaterial {
  const field = (f: string) => (f === "areaM2" ? "partId" : f === "parts" ? "quantity" : `coats.${i}.${f}`);
  const { coating } = c;
  if (coating.kind === "powder") {
    if (coating.specificGravity === null) {
      throw new DomainError(`coats.${i}.coatingId`, `${coating.code} has no specific gravity in the coatings library; add it there first.`);
    }
    if (c.firstPassEfficiency === undefined || c.firstPassEfficiency === null) {
      throw new DomainError(`coats.${i}.firstPassEfficiency`, `Enter the first-pass transfer efficiency of the ${coating.code} coat (above 0, at most 1).`);
    }
    // Products Finishing (coverage) and the reclaim utilisation, through the powder calculator.
    const p = mapped(field, () =>
      powderEstimate({
        areaM2: areaPerPartM2,
        filmUm: c.filmUm,
        specificGravity: coating.specificGravity!,
        firstPassEfficiency: c.firstPassEfficiency!,
        reclaimEfficiency: c.reclaimEfficiency ?? 0,
        parts: quantity,
      }),
    );
    const nominal = { nominalUtilization: p.materialUtilization, paintL: null, chargeC: null };
    const measured = c.measuredUtilization ?? null;
    if (measured === null) {
      return { ...nominal, materialUtilization: p.materialUtilization, measuredUtilization: null, measuredRuns: null, utilizationUsed: "nominal", materialKgPerPart: p.powderKgPerPart, materialKg: p.powderKg };
    }
    requireInRange(`coats.${i}.measuredUtilization`, measured, { gt: 0, lte: 1 });
    // Same coverage (Products Finishing, metric form), at the utilisation measured from actual use:
    // kg sprayed = area / (coverage m²/kg × utilisation).
    const kgPerPart = areaPerPartM2 / (p.theoreticalCoverageM2PerKg * measured);
    return {
      ...nominal,
      materialUtilization: measured,
      measuredUtilization: measured,
      measuredRuns: c.measuredRuns ?? null,
      utilizationUsed: "measured",
      materialKgPerPart: kgPerPart,
      materialKg: kgPerPart * quantity,
    };
  }
  if (coating.filmDensityGPerCm3 === null || coating.weightSolidsFraction === null) {
    throw new DomainError(`coats.${i}.coatingId`, `${coating.code} lacks its film density or weight solids in the coatings library; add them there first.`);
  }
  const e = mapped(field, () =>
    ecoatEstimate({
      areaM2: areaPerPartM2,
      filmUm: c.filmUm,
      filmDensityGPerCm3: coating.filmDensityGPerCm3!,
      coulombicYieldMgPerC: DEFAULT_COULOMBIC_YIELD_MG_PER_C,
      parts: quantity,
    }),
  );
  // Paint as supplied carries the deposited solids at its weight-solids fraction (derived).
  const ws = coating.weightSolidsFraction;
  const paintL =
    coating.volumeSolidsFraction === null
      ? null
      : mapped(field, () => ecoatPaintUse({ areaM2: areaPerPartM2 * quantity, filmUm: c.filmUm, volumeSolidsFraction: coating.volumeSolidsFraction! }).paintL);
  return {
    materialUtilization: null,
    nominalUtilization: null,
    measuredUtilization: null,
    measuredRuns: null,
    utilizationUsed: "nominal",
    materialKgPerPart: e.depositedSolidsKgPerPart / ws,
    materialKg: e.depositedSolidsKg / ws,
    paintL,
    chargeC: e.chargeC,
  };
}

/** The plan; throws a DomainError naming the run's field (`quantity`, `lineId`, `coats.1.filmUm` …). */
export function planRun(input: PlanRunInput): RunPlan {
  const { part, quantity, line, coats } = input;
  const startTempC = input.startTempC ?? DEFAULT_START_TEMP_C;
  requireInRange("quantity", quantity, { gte: 1, integer: true });
  if (!coats.length) throw new DomainError("coats", "Add at least one coat.");
  const warnings: string[] = [];

  const racking = planRacking(input, warnings);
  // whole carriers: a part-filled last carrier still takes its place on the chain
  const carriers = Math.ceil(quantity / racking.partsPerCarrier);

  let lineSpeedMPerMin: number | null = null;
  let placements: Placement[] | null = null;
  if (line.kind === "conveyor") {
    lineSpeedMPerMin = input.lineSpeedMPerMin ?? line.lineSpeedNominalMPerMin;
    mapped((f) => f, () => checkLineSpeed(lineSpeedMPerMin!, line));
    placements = placeCoats(line, coats);
  } else {
    if (input.lineSpeedMPerMin !== undefined && input.lineSpeedMPerMin !== null) {
      throw new DomainError("lineSpeedMPerMin", "A batch oven has no line speed; leave it empty.");
    }
    coats.forEach((c, i) => {
      if (c.coating.kind === "e-coat") {
        throw new DomainError(`coats.${i}.coatingId`, `${line.name} is a batch oven with no e-coat tank: e-coat needs a conveyor line with an e-coat stage.`);
      }
    });
  }

  const coatPlans: CoatPlan[] = coats.map((c, i) => {
    const { coating } = c;
    requireInRange(`coats.${i}.filmUm`, c.filmUm, { gt: 0 });
    const areaPerPartM2 = coatAreaPerPartM2(part, coating.kind);
    if (!(areaPerPartM2 > 0)) {
      throw new DomainError(
        "partId",
        `Part ${part.number} has no area left for ${coating.kind} after masking (${fmt(part.areaM2)} m² outside${coating.kind === "e-coat" ? ` + ${fmt(part.insideAreaM2)} m² inside` : ""} − ${fmt(part.maskedAreaM2)} m² masked).`,
      );
    }
    if (isBelow(c.filmUm, coating.filmMinUm) || isAbove(c.filmUm, coating.filmMaxUm)) {
      warnings.push(`Coat ${i + 1} (${coating.code}): ${fmt(c.filmUm)} µm is outside the coating's ${fmt(coating.filmMinUm)}–${fmt(coating.filmMaxUm)} µm film build.`);
    }
    const material = coatMaterial(c, i, areaPerPartM2, quantity);

    let cure: CoatCure;
    let applyStage: CoatPlan["applyStage"] = null;
    let pass = 1;
    if (line.kind === "conveyor") {
      const place = placements![i];
      pass = place.pass;
      applyStage = { position: place.applyIndex, name: line.stages[place.applyIndex].name };
      // The check looks for the first applying stage of the kind: start it at this coat's part of the line.
      const stages = line.stages.slice(place.searchFrom);
      const check = mapped(cureField(i), () =>
        cureCheck({
          line: { kind: "conveyor", lineSpeedMinMPerMin: line.lineSpeedMinMPerMin, lineSpeedMaxMPerMin: line.lineSpeedMaxMPerMin, stages },
          coating: { kind: coating.kind, cureSchedule: coating.cureSchedule },
          thicknessMm: part.thicknessMm,
          lineSpeedMPerMin: lineSpeedMPerMin!,
          startTempC,
        }),
      );
      cure = coatCure(check, place.searchFrom);
    } else {
      const check = mapped(cureField(i), () =>
        cureCheck({
          line: { kind: "batch", airTempC: line.airTempC, heatTransferCoefficientWPerM2K: line.heatTransferCoefficientWPerM2K, loadMin: line.loadMin, unloadMin: line.unloadMin },
          coating: { kind: coating.kind, cureSchedule: coating.cureSchedule },
          thicknessMm: part.thicknessMm,
          startTempC,
        }),
      );
      cure = coatCure(check, 0);
    }
    if (!cure.pass) warnings.push(`Coat ${i + 1} (${coating.code}) does not cure: ${cure.reason}`);

    return {
      position: i,
      coatingId: coating.id,
      code: coating.code,
      name: coating.name,
      kind: coating.kind,
      colourName: coating.colourName,
      swatchHex: coating.swatchHex,
      filmUm: c.filmUm,
      filmMinUm: coating.filmMinUm,
      filmMaxUm: coating.filmMaxUm,
      firstPassEfficiency: coating.kind === "powder" ? (c.firstPassEfficiency ?? null) : null,
      reclaimEfficiency: coating.kind === "powder" ? (c.reclaimEfficiency ?? 0) : null,
      pass,
      applyStage,
      areaPerPartM2,
      areaM2: areaPerPartM2 * quantity,
      ...material,
      materialCost: material.materialKg * coating.pricePerKg,
      containerKind: coating.containerKind,
      containerKg: coating.containerKg,
      containers: wholeContainers(material.materialKg, coating.containerKg),
      cure,
      // SSPC-PA 2 sampling for the surface this coat covers over the whole run
      filmCheck: pa2SamplingPlan(areaPerPartM2 * quantity),
    };
  });

  let transitMin = 0;
  let loadingMin: number;
  let lineTimeMin: number;
  let colourChangeMin = 0;
  let loads: number | null = null;
  let lineLengthM: number | null = null;
  let passes = 1;
  if (line.kind === "conveyor") {
    passes = Math.max(...coatPlans.map((c) => c.pass));
    lineLengthM = line.stages.reduce((a, s) => a + s.lengthM, 0);
    // One booth sprayed twice in different colours (passes 1 and 2) needs a colour change between.
    const powder = coatPlans.filter((c) => c.kind === "powder");
    for (let k = 1; k < powder.length; k++) {
      if (powder[k].pass !== powder[k - 1].pass && powder[k].swatchHex.toLowerCase() !== powder[k - 1].swatchHex.toLowerCase()) {
        colourChangeMin += line.stages[powder[k].applyStage!.position].colourChangeMin ?? 0;
      }
    }
    // cost.ts runLineTimeMin: (carriers × pitch + line length) / speed, once per pass.
    const perPass = runLineTimeMin({ carriers, carrierPitchM: line.carrierPitchM, lineSpeedMPerMin: lineSpeedMPerMin!, lineLengthM });
    transitMin = stageDwellMin(lineLengthM, lineSpeedMPerMin!);
    lineTimeMin = passes * perPass + colourChangeMin;
    loadingMin = lineTimeMin - transitMin;
  } else {
    requireInRange("line.racksPerLoad", line.racksPerLoad, { gte: 1, integer: true });
    loads = Math.ceil(carriers / line.racksPerLoad);
    // each coat is sprayed off-line and cured in its own oven cycles (common practice, no source)
    lineTimeMin = coatPlans.reduce((a, c) => a + loads! * (c.cure.cycleMin ?? 0), 0);
    loadingMin = lineTimeMin;
  }

  const materialKg = coatPlans.reduce((a, c) => a + c.materialKg, 0);
  const materialCost = coatPlans.reduce((a, c) => a + c.materialCost, 0);
  const cost = costPerPart({
    materialCostPerPart: materialCost / quantity,
    lineTimeMin,
    partsInRun: quantity,
    lineRatePerHour: line.hourlyCost,
  });

  return {
    lineKind: line.kind,
    quantity,
    racking,
    carriers,
    loads,
    passes,
    lineSpeedMPerMin,
    carrierPitchM: line.kind === "conveyor" ? line.carrierPitchM : null,
    lineLengthM,
    colourChangeMin,
    transitMin,
    loadingMin,
    lineTimeMin,
    coats: coatPlans,
    materialKg,
    materialCost,
    cost,
    cures: coatPlans.every((c) => c.cure.pass),
    warnings,
  };
}
