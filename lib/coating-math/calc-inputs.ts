/**
 * What the calculator routes (`POST /api/calc/*`) accept, as plain data and plain checks: each
 * number's allowed range, default and whether it may be left out, the cross-field rules and the
 * film readings' list limits, with their messages. lib/validation/calc.ts builds the routes' zod
 * schemas from these; the calculators page checks its inputs in the browser with the functions
 * below, so zod stays off that page. tests/unit/coating-math/calc-inputs.test.ts checks that both
 * find the same problems with the same messages.
 * Upper bounds keep results finite and catch unit mistakes; they are not limits of real plants.
 */
import { DomainError, describeRange, isInRange, type NumericRange } from "./errors";

export const MAX_AREA_M2 = 1_000_000;
export const MAX_FILM_UM = 5_000;
export const MAX_PARTS = 10_000_000;
export const MAX_PRICE_PER_KG = 1_000_000;
export const MAX_READINGS = 10_000;
export const MAX_TEMP_C = 1_000;
export const MIN_TEMP_C = -50;
export const MAX_MINUTES = 10_000;

/** One numeric input: its range, and either a default or `optional` when it may be left out. */
export interface NumberRule {
  range: NumericRange;
  default?: number;
  optional?: true;
}
export type NumberRules = Readonly<Record<string, NumberRule>>;

const areaM2 = { range: { gt: 0, lte: MAX_AREA_M2 } } as const;
const filmUm = { range: { gt: 0, lte: MAX_FILM_UM } } as const;
const parts = { range: { integer: true, gte: 1, lte: MAX_PARTS }, default: 1 } as const;
const fraction = { gt: 0, lte: 1 } as const;
const temperatureC = { range: { gte: MIN_TEMP_C, lte: MAX_TEMP_C } } as const;

export const POWDER_INPUT = {
  areaM2,
  filmUm,
  specificGravity: { range: { gt: 0, lte: 20 } },
  firstPassEfficiency: { range: fraction },
  reclaimEfficiency: { range: { gte: 0, lte: 1 }, default: 0 },
  parts,
  pricePerKg: { range: { gte: 0, lte: MAX_PRICE_PER_KG }, optional: true },
} as const satisfies NumberRules;

export const ECOAT_INPUT = {
  areaM2,
  filmUm,
  filmDensityGPerCm3: { range: { gt: 0, lte: 20 } },
  coulombicYieldMgPerC: { range: { gt: 0, lte: 1_000 } },
  parts,
  partsPerHour: { range: { gt: 0, lte: 1_000_000 }, optional: true },
} as const satisfies NumberRules;

export const LINE_INPUT = {
  lineSpeedMPerMin: { range: { gt: 0, lte: 1_000 } },
  carrierPitchM: { range: { gt: 0, lte: 1_000 } },
  partsPerCarrier: { range: { gt: 0, lte: 100_000 } },
  ovenPathLengthM: { range: { gt: 0, lte: 100_000 } },
  requiredDwellMin: { range: { gt: 0, lte: MAX_MINUTES }, optional: true },
  loadedFraction: { range: fraction, default: 1 },
} as const satisfies NumberRules;

export const CURE_INPUT = {
  thicknessMm: { range: { gt: 0, lte: 1_000 } },
  airTempC: temperatureC,
  startTempC: temperatureC,
  targetMetalTempC: temperatureC,
  holdMin: { range: { gte: 0, lte: MAX_MINUTES } },
  heatTransferCoefficientWPerM2K: { range: { gt: 0, lte: 10_000 } },
  densityKgPerM3: { range: { gt: 0, lte: 25_000 }, default: 7850 },
  specificHeatJPerKgK: { range: { gt: 0, lte: 10_000 }, default: 490 },
  thermalConductivityWPerMK: { range: { gt: 0, lte: 1_000 }, default: 50 },
  ovenDwellMin: { range: { gte: 0, lte: MAX_MINUTES }, optional: true },
} as const satisfies NumberRules;

export const FILM_SPEC_INPUT = {
  specMinUm: filmUm,
  specMaxUm: filmUm,
} as const satisfies NumberRules;

export const FILM_NOMINAL_INPUT = { nominalUm: filmUm } as const satisfies NumberRules;

export const READING_RANGE: NumericRange = { gte: 0, lte: 50_000 };

/** List limits of the film readings and their messages (SSPC-PA 2: a spot is ≥ 3 readings). */
export const FILM_LISTS = {
  spotMin: 3,
  spotMax: 100,
  areaMin: 1,
  areaMax: 100,
  areasMin: 1,
  areasMax: Math.floor(MAX_READINGS / 3),
  readingsMin: 1,
  readingsMax: MAX_READINGS,
} as const;

export const MESSAGES = {
  required: "is required",
  cureTarget: "must be below the oven air temperature (airTempC): metal never reaches the air temperature",
  atMostSpecMax: "must be at most specMaxUm",
  spotMin: `a spot needs at least ${FILM_LISTS.spotMin} gauge readings`,
  spotMax: `a spot takes at most ${FILM_LISTS.spotMax} gauge readings`,
  areaMin: `an area needs at least ${FILM_LISTS.areaMin} spot`,
  areaMax: `an area takes at most ${FILM_LISTS.areaMax} spots`,
  areasMin: `at least ${FILM_LISTS.areasMin} area is required`,
  areasMax: `at most ${FILM_LISTS.areasMax} areas`,
  totalMax: `at most ${MAX_READINGS} gauge readings in all`,
  readingsMin: `at least ${FILM_LISTS.readingsMin} gauge reading is required`,
  readingsMax: `at most ${FILM_LISTS.readingsMax} gauge readings`,
} as const;

/** "must be greater than 0 and at most 1": the one message for every way a number can be wrong. */
export function rangeMessage(range: NumericRange): string {
  return `must be ${describeRange(range)}`;
}

export interface InputIssue {
  path: (string | number)[];
  /**
   * required: left out; type: not a finite number (or not a whole one); range: outside its range;
   * size: a list too short or too long; rule: a rule between fields. After a required or type
   * problem the rules between fields are not checked (the zod schemas behave the same way).
   */
  code: "required" | "type" | "range" | "size" | "rule";
  message: string;
}

/** The value a number field would have once defaults are applied. */
export type RuleValues<T extends NumberRules> = {
  [K in keyof T]: T[K] extends { default: number } ? number : T[K] extends { optional: true } ? number | undefined : number;
};

function numberIssue(path: (string | number)[], value: unknown, range: NumericRange): InputIssue | null {
  if (isInRange(value, range)) return null;
  const wrongType = typeof value !== "number" || !Number.isFinite(value) || (range.integer === true && !Number.isInteger(value));
  return { path, code: wrongType ? "type" : "range", message: rangeMessage(range) };
}

/** Problems with the numbers in `values` (undefined = left blank), in the order of `rules`. */
export function numberIssues(rules: NumberRules, values: Readonly<Record<string, unknown>>): InputIssue[] {
  const issues: InputIssue[] = [];
  for (const [name, rule] of Object.entries(rules)) {
    const value = values[name];
    if (value === undefined) {
      if (rule.default === undefined && !rule.optional) issues.push({ path: [name], code: "required", message: MESSAGES.required });
      continue;
    }
    const issue = numberIssue([name], value, rule.range);
    if (issue) issues.push(issue);
  }
  return issues;
}

/** The values with defaults filled in and blank optional fields left out; check them first. */
export function withDefaults<T extends NumberRules>(rules: T, values: Readonly<Record<string, unknown>>): RuleValues<T> {
  const out: Record<string, number> = {};
  for (const [name, rule] of Object.entries(rules)) {
    const value = values[name];
    if (typeof value === "number") out[name] = value;
    else if (rule.default !== undefined) out[name] = rule.default;
  }
  return out as RuleValues<T>;
}

const stops = (i: InputIssue) => i.code === "required" || i.code === "type";
const stopped = (issues: InputIssue[]) => issues.some(stops);

/** Cure inputs: the numbers, then the target below the air temperature. */
export function cureInputIssues(values: Readonly<Record<string, unknown>>): InputIssue[] {
  const issues = numberIssues(CURE_INPUT, values);
  const { airTempC, targetMetalTempC } = values;
  if (!stopped(issues) && typeof airTempC === "number" && typeof targetMetalTempC === "number" && !(targetMetalTempC < airTempC)) {
    issues.push({ path: ["targetMetalTempC"], code: "rule", message: MESSAGES.cureTarget });
  }
  return issues;
}

export type FilmReadingsInput =
  | { rule: "sspc-pa2"; specMinUm?: unknown; specMaxUm?: unknown; areas: number[][][] }
  | { rule: "iso19840"; specMinUm?: unknown; specMaxUm?: unknown; nominalUm?: unknown; readingsUm: number[] };

function listIssues(path: (string | number)[], length: number, min: number, max: number, minMessage: string, maxMessage: string): InputIssue[] {
  if (length < min) return [{ path, code: "size", message: minMessage }];
  if (length > max) return [{ path, code: "size", message: maxMessage }];
  return [];
}

/**
 * Film acceptance inputs: spec numbers, every reading, the list sizes, then the rules between
 * fields. Paths are those of the API body (`areas.0.2` is area 1, spot 3).
 */
export function filmInputIssues(input: FilmReadingsInput): InputIssue[] {
  const issues = numberIssues(FILM_SPEC_INPUT, input);
  // A list's own size is not judged when something inside it is not a number at all.
  const stoppedSince = (start: number) => issues.slice(start).some(stops);
  const readingList = (path: (string | number)[], readings: number[], min: number, max: number, minMessage: string, maxMessage: string) => {
    const start = issues.length;
    readings.forEach((r, i) => {
      const issue = numberIssue([...path, i], r, READING_RANGE);
      if (issue) issues.push(issue);
    });
    if (!stoppedSince(start)) issues.push(...listIssues(path, readings.length, min, max, minMessage, maxMessage));
  };
  if (input.rule === "sspc-pa2") {
    const areasStart = issues.length;
    input.areas.forEach((area, a) => {
      const areaStart = issues.length;
      area.forEach((spot, s) => readingList(["areas", a, s], spot, FILM_LISTS.spotMin, FILM_LISTS.spotMax, MESSAGES.spotMin, MESSAGES.spotMax));
      if (!stoppedSince(areaStart)) {
        issues.push(...listIssues(["areas", a], area.length, FILM_LISTS.areaMin, FILM_LISTS.areaMax, MESSAGES.areaMin, MESSAGES.areaMax));
      }
    });
    if (!stoppedSince(areasStart)) {
      issues.push(...listIssues(["areas"], input.areas.length, FILM_LISTS.areasMin, FILM_LISTS.areasMax, MESSAGES.areasMin, MESSAGES.areasMax));
    }
    const count = input.areas.reduce((n, area) => n + area.reduce((m, spot) => m + spot.length, 0), 0);
    if (!stopped(issues) && count > MAX_READINGS) issues.push({ path: ["areas"], code: "size", message: MESSAGES.totalMax });
  } else {
    issues.push(...numberIssues(FILM_NOMINAL_INPUT, input));
    readingList(["readingsUm"], input.readingsUm, FILM_LISTS.readingsMin, FILM_LISTS.readingsMax, MESSAGES.readingsMin, MESSAGES.readingsMax);
    const { nominalUm, specMaxUm } = input;
    if (!stopped(issues) && typeof nominalUm === "number" && typeof specMaxUm === "number" && !(nominalUm <= specMaxUm)) {
      issues.push({ path: ["nominalUm"], code: "rule", message: MESSAGES.atMostSpecMax });
    }
  }
  const { specMinUm, specMaxUm } = input;
  if (!stopped(issues) && typeof specMinUm === "number" && typeof specMaxUm === "number" && !(specMinUm <= specMaxUm)) {
    issues.push({ path: ["specMinUm"], code: "rule", message: MESSAGES.atMostSpecMax });
  }
  return issues;
}

// ---------------------------------------------------------------------------------------------
// Results: inputs that are each in range can still combine into an overflow. Such a result
// names the input most likely at fault instead of showing NaN or Infinity.

/** For each output field, the input most likely at fault when it cannot be computed. */
export const resultBlame = {
  powder: {
    theoreticalCoverageM2PerKg: "specificGravity",
    materialUtilization: "firstPassEfficiency",
    practicalCoverageM2PerKg: "specificGravity",
    powderKg: "firstPassEfficiency",
    powderKgPerPart: "firstPassEfficiency",
    costTotal: "pricePerKg",
  },
  ecoat: {
    depositedSolidsKg: "areaM2",
    depositedSolidsKgPerPart: "areaM2",
    chargeC: "coulombicYieldMgPerC",
    chargeCPerPart: "coulombicYieldMgPerC",
    chargePerAreaCPerM2: "coulombicYieldMgPerC",
    averageCurrentA: "partsPerHour",
    solidsKgPerHour: "partsPerHour",
  },
  line: {
    carriersPerHour: "carrierPitchM",
    partsPerHour: "carrierPitchM",
    ovenDwellMin: "lineSpeedMPerMin",
    maxLineSpeedForDwellMPerMin: "requiredDwellMin",
    dwellMarginMin: "requiredDwellMin",
  },
  cure: {
    timeConstantMin: "heatTransferCoefficientWPerM2K",
    heatUpMin: "targetMetalTempC",
    totalMin: "holdMin",
    biotNumber: "thermalConductivityWPerMK",
    dwellMarginMin: "ovenDwellMin",
  },
  film: { spotsUm: "areas", areasUm: "areas", meanUm: "readingsUm", fractionBelowNominal: "readingsUm" },
} as const satisfies Record<string, Record<string, string>>;

/** The DomainError for an output that is not a finite number, naming the input at fault. */
export function nonFiniteResultError(output: string, blame: Readonly<Record<string, string>>): DomainError {
  const field = blame[output] ?? output;
  return new DomainError(field, `${field} is too extreme: the ${output} cannot be computed as a finite number from these inputs.`);
}

function allFinite(value: unknown): boolean {
  if (typeof value === "number") return Number.isFinite(value);
  if (Array.isArray(value)) return value.every(allFinite);
  return true;
}

/** Returns `result` when every number in it (lists included) is finite; throws the DomainError otherwise. */
export function finiteResult<R extends object>(result: R, blame: Readonly<Record<string, string>>): R {
  for (const [output, value] of Object.entries(result)) {
    if (!allFinite(value)) throw nonFiniteResultError(output, blame);
  }
  return result;
}
