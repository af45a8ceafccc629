/**
 * Powder use: theoretical coverage from specific gravity and film build, material utilisation
 * with reclaim, and the powder needed for a run.
 */
import { DomainError, requireFiniteResult, requireInRange, requirePositive } from "./errors";
import { convert } from "./display-units";

/**
 * m²/kg covered by 1 kg of powder of SG 1 at 1 µm: 1 kg at SG 1 is 1 L, and 1 L spread at 1 µm
 * covers 1000 m² (ASTM D5965 defines SG against water, 1 g/cm³). Derived through mathjs.
 */
const M2_PER_KG_AT_SG1_1UM = convert(1, "cm^3/(g um)", "m^2/kg");

/**
 * Same constant in US trade units: ft²/lb for SG 1 at 1 mil — 192.2 exactly from water's
 * density (trade articles print 192.3 or 192.4).
 */
const FT2_PER_LB_AT_SG1_1MIL = convert(M2_PER_KG_AT_SG1_1UM / convert(1, "mil", "um"), "m^2/kg", "ft^2/lbm");

export interface PowderEstimateInput {
  /** coated area of one part */
  areaM2: number;
  filmUm: number;
  specificGravity: number;
  /** powder deposited / powder sprayed on the first pass, (0, 1] */
  firstPassEfficiency: number;
  /** share of the overspray recovered and resprayed, [0, 1] */
  reclaimEfficiency?: number;
  parts?: number;
  pricePerKg?: number;
}

export interface PowderEstimate {
  theoreticalCoverageM2PerKg: number;
  materialUtilization: number;
  practicalCoverageM2PerKg: number;
  /** for all parts */
  powderKg: number;
  powderKgPerPart: number;
  costTotal?: number;
}

/** Theoretical coverage, m²/kg = 1000 / (SG × film µm). Source: PRODUCT.md / REFERENCES.md (Products Finishing, metric form). */
export function theoreticalCoverageM2PerKg(specificGravity: number, filmUm: number): number {
  requirePositive("specificGravity", specificGravity);
  requirePositive("filmUm", filmUm);
  return M2_PER_KG_AT_SG1_1UM / (specificGravity * filmUm);
}

/** Theoretical coverage in ft²/lb at 1 mil: 192.2 / SG (Products Finishing, "Coverage of Powder"). */
export function theoreticalCoverageFt2PerLbPerMil(specificGravity: number): number {
  requirePositive("specificGravity", specificGravity);
  return FT2_PER_LB_AT_SG1_1MIL / specificGravity;
}

/**
 * Steady-state utilisation when a fraction r of the overspray is reclaimed and resprayed with
 * the same first-pass efficiency η: U = η / (1 − r(1 − η)) (derived: geometric series of passes).
 */
export function materialUtilization(firstPassEfficiency: number, reclaimEfficiency = 0): number {
  requireInRange("firstPassEfficiency", firstPassEfficiency, { gt: 0, lte: 1 });
  requireInRange("reclaimEfficiency", reclaimEfficiency, { gte: 0, lte: 1 });
  return firstPassEfficiency / (1 - reclaimEfficiency * (1 - firstPassEfficiency));
}

/** Powder needed for `parts` parts of `areaM2` each, and its cost. */
export function powderEstimate(input: PowderEstimateInput): PowderEstimate {
  const { areaM2, filmUm, specificGravity, firstPassEfficiency, pricePerKg } = input;
  const reclaimEfficiency = input.reclaimEfficiency ?? 0;
  const parts = input.parts ?? 1;
  requirePositive("areaM2", areaM2);
  requireInRange("parts", parts, { gte: 1, integer: true });
  if (pricePerKg !== undefined) requireInRange("pricePerKg", pricePerKg, { gte: 0 });

  const theoretical = theoreticalCoverageM2PerKg(specificGravity, filmUm);
  const utilization = materialUtilization(firstPassEfficiency, reclaimEfficiency);
  const practical = theoretical * utilization;
  const powderKgPerPart = areaM2 / practical;
  const powderKg = requireFiniteResult("firstPassEfficiency", powderKgPerPart * parts, "powder mass");

  const result: PowderEstimate = {
    theoreticalCoverageM2PerKg: theoretical,
    materialUtilization: utilization,
    practicalCoverageM2PerKg: practical,
    powderKg,
    powderKgPerPart,
  };
  if (pricePerKg !== undefined) result.costTotal = powderKg * pricePerKg;
  return result;
}

export interface FilmFromPowderMassInput {
  /** powder used (sprayed and not recovered) */
  powderKg: number;
  areaM2: number;
  specificGravity: number;
  /** share of the used powder that ended up on the parts; 1 when `powderKg` was weighed on the parts */
  materialUtilization?: number;
}

/** Average film build implied by powder use: the coverage formula solved for film. */
export function filmFromPowderMass(input: FilmFromPowderMassInput): number {
  const { powderKg, areaM2, specificGravity } = input;
  const utilization = input.materialUtilization ?? 1;
  requirePositive("powderKg", powderKg);
  requirePositive("areaM2", areaM2);
  requirePositive("specificGravity", specificGravity);
  requireInRange("materialUtilization", utilization, { gt: 0, lte: 1 });
  // film = 1000 · U · m / (SG · A), from m = A · SG · film / (1000 · U)
  return (M2_PER_KG_AT_SG1_1UM * utilization * powderKg) / (specificGravity * areaM2);
}

/**
 * First-pass transfer efficiency from a weigh test: mass gained by the parts / powder sprayed,
 * by weight (Products Finishing, "What Impacts Transfer Efficiency?").
 */
export function firstPassEfficiencyFromWeighTest(massGainedKg: number, powderSprayedKg: number): number {
  requireInRange("massGainedKg", massGainedKg, { gte: 0 });
  requirePositive("powderSprayedKg", powderSprayedKg);
  if (massGainedKg > powderSprayedKg) {
    throw new DomainError(
      "massGainedKg",
      `massGainedKg (${massGainedKg}) cannot exceed the powder sprayed (${powderSprayedKg} kg).`,
    );
  }
  return massGainedKg / powderSprayedKg;
}
