/**
 * Dry film thickness acceptance: SSPC-PA 2 (gauge reading → spot → area, default restriction
 * level) and ISO 19840 (the "80–20" rule).
 */
import { DomainError, requireInRange, requirePositive } from "./errors";
import { isAbove, isAtMost, isBelow, tolerantCeil } from "./compare";
import { convert } from "./display-units";

/** SSPC-PA 2: readings per spot, spots per area. */
export const PA2_MIN_READINGS_PER_SPOT = 3;
export const PA2_SPOTS_PER_AREA = 5;
/** SSPC-PA 2 default restriction: spots within 80 % of the minimum … 120 % of the maximum. */
export const PA2_SPOT_LOW_FRACTION = 0.8;
export const PA2_SPOT_HIGH_FRACTION = 1.2;
/** ISO 19840: readings may dip to 80 % of nominal, and at most 20 % of them below nominal. */
export const ISO19840_LOW_FRACTION = 0.8;
export const ISO19840_MAX_SHARE_BELOW_NOMINAL = 0.2;

function fmtUm(valueUm: number): string {
  const rounded = Number(valueUm.toFixed(1));
  return String(rounded === 0 ? 0 : rounded);
}

function mean(values: readonly number[]): number {
  let sum = 0;
  for (const v of values) sum += v;
  return sum / values.length;
}

function pct(fraction: number): string {
  return String(Number((fraction * 100).toFixed(1)));
}

/**
 * SSPC-PA 2 number of areas to measure; the rule is written in ft²: under 300 ft² each 100 ft²
 * (or part thereof); 300–1000 ft² three; above 1000 ft² three for the first 1000 plus one for
 * each further 1000 ft² or part thereof.
 */
export function pa2AreaCount(surfaceAreaM2: number): number {
  requirePositive("surfaceAreaM2", surfaceAreaM2);
  const ft2 = convert(surfaceAreaM2, "m^2", "ft^2");
  if (isBelow(ft2, 300)) return Math.max(1, tolerantCeil(ft2 / 100));
  if (isAtMost(ft2, 1000)) return 3;
  return 3 + tolerantCeil((ft2 - 1000) / 1000);
}

export interface Pa2SamplingPlan {
  surfaceAreaFt2: number;
  areaCount: number;
  spotCount: number;
  minReadingCount: number;
}

/** Areas, spots (5 per area) and minimum gauge readings (3 per spot) for a surface. */
export function pa2SamplingPlan(surfaceAreaM2: number): Pa2SamplingPlan {
  const areaCount = pa2AreaCount(surfaceAreaM2);
  const spotCount = areaCount * PA2_SPOTS_PER_AREA;
  return {
    surfaceAreaFt2: convert(surfaceAreaM2, "m^2", "ft^2"),
    areaCount,
    spotCount,
    minReadingCount: spotCount * PA2_MIN_READINGS_PER_SPOT,
  };
}

export interface Pa2Input {
  specMinUm: number;
  specMaxUm: number;
  /** areas → spots → gauge readings, µm */
  areas: number[][][];
}

export interface Pa2Result {
  pass: boolean;
  /** why it failed, one sentence each (empty when it passes) */
  reasons: string[];
  /** departures from the procedure that do not by themselves fail the film */
  warnings: string[];
  spotsUm: number[][];
  areasUm: number[];
}

function requireSpec(specMinUm: number, specMaxUm: number): void {
  requirePositive("specMinUm", specMinUm);
  requirePositive("specMaxUm", specMaxUm);
  if (specMinUm > specMaxUm) {
    throw new DomainError("specMinUm", `specMinUm (${specMinUm} µm) must not exceed specMaxUm (${specMaxUm} µm).`);
  }
}

function requireReading(field: string, value: number): void {
  requireInRange(field, value, { gte: 0 });
}

/** SSPC-PA 2 acceptance at the default restriction level. */
export function evaluatePa2(input: Pa2Input): Pa2Result {
  const { specMinUm, specMaxUm, areas } = input;
  requireSpec(specMinUm, specMaxUm);
  if (!Array.isArray(areas) || areas.length === 0) {
    throw new DomainError("areas", "areas must hold at least one area of spot measurements.");
  }
  const spotLowUm = PA2_SPOT_LOW_FRACTION * specMinUm;
  const spotHighUm = PA2_SPOT_HIGH_FRACTION * specMaxUm;
  const reasons: string[] = [];
  const warnings: string[] = [];
  const spotsUm: number[][] = [];
  const areasUm: number[] = [];

  areas.forEach((spots, i) => {
    if (!Array.isArray(spots) || spots.length === 0) {
      throw new DomainError(`areas.${i}`, `Area ${i + 1} has no spot measurements.`);
    }
    const spotMeans = spots.map((readings, j) => {
      if (!Array.isArray(readings) || readings.length < PA2_MIN_READINGS_PER_SPOT) {
        throw new DomainError(
          `areas.${i}.${j}`,
          `Area ${i + 1}, spot ${j + 1} needs at least ${PA2_MIN_READINGS_PER_SPOT} gauge readings ` +
            `(got ${Array.isArray(readings) ? readings.length : 0}).`,
        );
      }
      readings.forEach((r, k) => requireReading(`areas.${i}.${j}.${k}`, r));
      return mean(readings);
    });
    spotsUm.push(spotMeans);
    const areaMean = mean(spotMeans);
    areasUm.push(areaMean);

    if (spotMeans.length !== PA2_SPOTS_PER_AREA) {
      warnings.push(
        `Area ${i + 1} has ${spotMeans.length} spot measurements; SSPC-PA 2 calls for ${PA2_SPOTS_PER_AREA}.`,
      );
    }
    spotMeans.forEach((spot, j) => {
      if (isBelow(spot, spotLowUm)) {
        reasons.push(
          `Area ${i + 1}, spot ${j + 1} at ${fmtUm(spot)} µm is below 80 % of the ${fmtUm(specMinUm)} µm ` +
            `minimum (${fmtUm(spotLowUm)} µm).`,
        );
      } else if (isAbove(spot, spotHighUm)) {
        reasons.push(
          `Area ${i + 1}, spot ${j + 1} at ${fmtUm(spot)} µm is above 120 % of the ${fmtUm(specMaxUm)} µm ` +
            `maximum (${fmtUm(spotHighUm)} µm).`,
        );
      }
    });
    if (isBelow(areaMean, specMinUm)) {
      reasons.push(`Area ${i + 1} averages ${fmtUm(areaMean)} µm, below the ${fmtUm(specMinUm)} µm minimum.`);
    } else if (isAbove(areaMean, specMaxUm)) {
      reasons.push(`Area ${i + 1} averages ${fmtUm(areaMean)} µm, above the ${fmtUm(specMaxUm)} µm maximum.`);
    }
  });

  return { pass: reasons.length === 0, reasons, warnings, spotsUm, areasUm };
}

export interface Iso19840Input {
  nominalUm: number;
  specMaxUm: number;
  readingsUm: number[];
}

export interface Iso19840Result {
  pass: boolean;
  reasons: string[];
  warnings: string[];
  meanUm: number;
  /** share of readings below the nominal DFT (all of them, including any under 80 %) */
  fractionBelowNominal: number;
  readingCount: number;
}

/**
 * ISO 19840 acceptance: mean ≥ nominal; every reading ≥ 80 % of nominal; readings from 80 % up
 * to (not including) nominal no more than 20 % of all; every reading ≤ the specified maximum.
 */
export function evaluateIso19840(input: Iso19840Input): Iso19840Result {
  const { nominalUm, specMaxUm, readingsUm } = input;
  requirePositive("nominalUm", nominalUm);
  requirePositive("specMaxUm", specMaxUm);
  if (nominalUm > specMaxUm) {
    throw new DomainError("nominalUm", `nominalUm (${nominalUm} µm) must not exceed specMaxUm (${specMaxUm} µm).`);
  }
  if (!Array.isArray(readingsUm) || readingsUm.length === 0) {
    throw new DomainError("readingsUm", "readingsUm must hold at least one gauge reading.");
  }
  readingsUm.forEach((r, k) => requireReading(`readingsUm.${k}`, r));

  const lowUm = ISO19840_LOW_FRACTION * nominalUm;
  const n = readingsUm.length;
  const meanUm = mean(readingsUm);
  let belowNominal = 0;
  let inLowBand = 0;
  let belowLow = 0;
  let aboveMax = 0;
  for (const r of readingsUm) {
    if (isBelow(r, nominalUm)) {
      belowNominal += 1;
      if (isBelow(r, lowUm)) belowLow += 1;
      else inLowBand += 1;
    }
    if (isAbove(r, specMaxUm)) aboveMax += 1;
  }

  const reasons: string[] = [];
  if (isBelow(meanUm, nominalUm)) {
    reasons.push(`The mean of ${fmtUm(meanUm)} µm is below the ${fmtUm(nominalUm)} µm nominal thickness.`);
  }
  if (belowLow > 0) {
    reasons.push(
      `${belowLow} of ${n} readings ${belowLow === 1 ? "is" : "are"} below 80 % of nominal (${fmtUm(lowUm)} µm).`,
    );
  }
  const lowBandShare = inLowBand / n;
  if (!isAtMost(lowBandShare, ISO19840_MAX_SHARE_BELOW_NOMINAL)) {
    reasons.push(
      `${inLowBand} of ${n} readings (${pct(lowBandShare)} %) lie between 80 % and 100 % of nominal; ` +
        `at most 20 % may.`,
    );
  }
  if (aboveMax > 0) {
    reasons.push(
      `${aboveMax} of ${n} readings ${aboveMax === 1 ? "is" : "are"} above the ${fmtUm(specMaxUm)} µm maximum.`,
    );
  }
  return {
    pass: reasons.length === 0,
    reasons,
    warnings: [],
    meanUm,
    fractionBelowNominal: belowNominal / n,
    readingCount: n,
  };
}

/** Body of the film calculator: one of the two acceptance rules. */
export type FilmEvaluationInput =
  | { rule: "sspc-pa2"; specMinUm: number; specMaxUm: number; areas: number[][][] }
  | {
      rule: "iso19840";
      specMinUm: number;
      specMaxUm: number;
      nominalUm: number;
      readingsUm: number[];
    };

export type FilmEvaluation = ({ rule: "sspc-pa2" } & Pa2Result) | ({ rule: "iso19840" } & Iso19840Result);

/**
 * Dispatches on `rule`. For ISO 19840 the acceptance uses `nominalUm` and `specMaxUm`;
 * `specMinUm` is only checked to be within the range.
 */
export function evaluateFilm(input: FilmEvaluationInput): FilmEvaluation {
  if (input.rule === "sspc-pa2") {
    return { rule: "sspc-pa2", ...evaluatePa2(input) };
  }
  if (input.rule === "iso19840") {
    requireSpec(input.specMinUm, input.specMaxUm);
    return { rule: "iso19840", ...evaluateIso19840(input) };
  }
  const rule: unknown = (input as { rule?: unknown }).rule;
  throw new DomainError("rule", `rule must be "sspc-pa2" or "iso19840" (got ${String(rule)}).`);
}
