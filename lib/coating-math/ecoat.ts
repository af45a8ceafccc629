/**
 * Electrocoat: deposited solids, charge and rectifier current from coulombic yield, paint use
 * from volume solids, and the anode-area check.
 */
import { requireFiniteResult, requireInRange, requirePositive } from "./errors";
import { isAtMost } from "./compare";
import { convert } from "./display-units";

/** kg deposited by a film of 1 g/cm³ density, 1 µm thick, over 1 m² (mathjs: 1e-3). */
const KG_PER_GCM3_UM_M2 = convert(1, "g um m^2 / cm^3", "kg");
const MG_PER_KG = convert(1, "kg", "mg");
const S_PER_H = convert(1, "h", "s");
/** Litres of film per m² per µm (1 µm × 1 m² = 1 mL). */
const L_PER_M2_PER_UM = convert(1, "um", "L/m^2");

export interface EcoatEstimateInput {
  /** coated area of one part */
  areaM2: number;
  /** dry (cured) film thickness */
  filmUm: number;
  /** cured film density; ~1.3–1.5 g/cm³ (from memory) */
  filmDensityGPerCm3: number;
  /** deposited film mass per coulomb; ~30 mg/C for cathodic epoxy (from memory) */
  coulombicYieldMgPerC: number;
  parts?: number;
  partsPerHour?: number;
}

export interface EcoatEstimate {
  /** for all parts */
  depositedSolidsKg: number;
  depositedSolidsKgPerPart: number;
  /** for all parts */
  chargeC: number;
  chargeCPerPart: number;
  /** charge per coated area, C/m² */
  chargePerAreaCPerM2: number;
  averageCurrentA?: number;
  solidsKgPerHour?: number;
}

/**
 * Deposited solids m = ρ · DFT · A; charge Q = m / CE; average current
 * I = (Q/A) · (m² coated per minute) / 60 — derived from the definition of coulombic yield.
 */
export function ecoatEstimate(input: EcoatEstimateInput): EcoatEstimate {
  const { areaM2, filmUm, filmDensityGPerCm3, coulombicYieldMgPerC, partsPerHour } = input;
  const parts = input.parts ?? 1;
  requirePositive("areaM2", areaM2);
  requirePositive("filmUm", filmUm);
  requirePositive("filmDensityGPerCm3", filmDensityGPerCm3);
  requirePositive("coulombicYieldMgPerC", coulombicYieldMgPerC);
  requireInRange("parts", parts, { gte: 1, integer: true });
  if (partsPerHour !== undefined) requirePositive("partsPerHour", partsPerHour);

  const depositedSolidsKgPerPart = filmDensityGPerCm3 * filmUm * areaM2 * KG_PER_GCM3_UM_M2;
  const chargeCPerPart = (depositedSolidsKgPerPart * MG_PER_KG) / coulombicYieldMgPerC;
  requireFiniteResult("coulombicYieldMgPerC", chargeCPerPart * parts, "charge");
  const result: EcoatEstimate = {
    depositedSolidsKg: depositedSolidsKgPerPart * parts,
    depositedSolidsKgPerPart,
    chargeC: chargeCPerPart * parts,
    chargeCPerPart,
    chargePerAreaCPerM2: chargeCPerPart / areaM2,
  };
  if (partsPerHour !== undefined) {
    result.averageCurrentA = (chargeCPerPart * partsPerHour) / S_PER_H;
    result.solidsKgPerHour = depositedSolidsKgPerPart * partsPerHour;
  }
  return result;
}

export interface EcoatPaintUseInput {
  areaM2: number;
  filmUm: number;
  /** volume solids of the paint as supplied, (0, 1] */
  volumeSolidsFraction: number;
}

export interface EcoatPaintUse {
  /** theoretical paint volume, no losses */
  paintL: number;
  paintLPerM2: number;
  paintUsGalPerFt2: number;
}

/**
 * Theoretical paint use: volume of film / volume solids. The US form,
 * gal/ft² = 144 · DFT(in) / (231 · VS), is Products Finishing, "Estimating the Electrocoat Usage
 * of a Part"; real use adds drag-out and other losses.
 */
export function ecoatPaintUse(input: EcoatPaintUseInput): EcoatPaintUse {
  const { areaM2, filmUm, volumeSolidsFraction } = input;
  requirePositive("areaM2", areaM2);
  requirePositive("filmUm", filmUm);
  requireInRange("volumeSolidsFraction", volumeSolidsFraction, { gt: 0, lte: 1 });
  const paintLPerM2 = (filmUm * L_PER_M2_PER_UM) / volumeSolidsFraction;
  return {
    paintL: paintLPerM2 * areaM2,
    paintLPerM2,
    paintUsGalPerFt2: convert(paintLPerM2, "L/m^2", "gallon/ft^2"),
  };
}

/** Largest part (cathode) to anode area ratio: 4 : 1 (Products Finishing Q&A, June 2014). */
export const MAX_CATHODE_TO_ANODE_RATIO = 4;

export interface AnodeRatioCheck {
  ratio: number;
  ok: boolean;
  minAnodeAreaM2: number;
  message: string;
}

export function anodeRatioCheck(cathodeAreaM2: number, anodeAreaM2: number): AnodeRatioCheck {
  requirePositive("cathodeAreaM2", cathodeAreaM2);
  requirePositive("anodeAreaM2", anodeAreaM2);
  const ratio = cathodeAreaM2 / anodeAreaM2;
  const ok = isAtMost(ratio, MAX_CATHODE_TO_ANODE_RATIO);
  const minAnodeAreaM2 = cathodeAreaM2 / MAX_CATHODE_TO_ANODE_RATIO;
  const shown = `${Number(ratio.toFixed(2))} : 1`;
  const message = ok
    ? `Part-to-anode area ratio ${shown} is within the ${MAX_CATHODE_TO_ANODE_RATIO} : 1 limit.`
    : `Part-to-anode area ratio ${shown} exceeds ${MAX_CATHODE_TO_ANODE_RATIO} : 1; ` +
      `at least ${Number(minAnodeAreaM2.toPrecision(3))} m² of anode is needed.`;
  return { ratio, ok, minAnodeAreaM2, message };
}
