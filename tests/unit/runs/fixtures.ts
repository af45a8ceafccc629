/**
 * Invented inputs for the run tests, in the shapes the plan takes: Bramblecote's e-coat + powder
 * conveyor line, its powder-only line and its batch oven, and three coatings (figures as in
 * db/seed/coatings-lines.ts).
 */
import type { PlanBatchLine, PlanCoating, PlanConveyorLine, PlanPart } from "../../../lib/runs/plan-run";
import type { StageInput } from "../../../lib/lines/stages";

const st = (name: string, kind: StageInput["kind"], lengthM: number, extra: Partial<StageInput> = {}): StageInput => ({ name, kind, lengthM, ...extra });

/** 224 m of stages in all. */
export const line1: PlanConveyorLine = {
  kind: "conveyor",
  name: "Line 1",
  windowMm: { widthMm: 500, heightMm: 1500, depthMm: 600 },
  maxLoadKg: 45,
  hourlyCost: 410,
  lineSpeedMinMPerMin: 1.5,
  lineSpeedMaxMPerMin: 4.5,
  lineSpeedNominalMPerMin: 3,
  carrierPitchM: 0.6,
  stages: [
    st("Alkaline clean", "clean", 9, { tempC: 60 }),
    st("Rinse 1", "rinse", 3),
    st("Rinse 2", "rinse", 3),
    st("Conditioner", "rinse", 2),
    st("Zinc phosphate", "conversion", 6, { tempC: 50 }),
    st("Rinse 3", "rinse", 3),
    st("DI rinse", "rinse", 3),
    st("E-coat tank", "e-coat", 12, { tempC: 32 }),
    st("Permeate rinse", "rinse", 4),
    st("Final DI rinse", "rinse", 3),
    st("E-coat bake oven", "cure-oven", 75, { tempC: 215, heatTransferCoefficientWPerM2K: 35 }),
    st("Cool-down 1", "cool", 15),
    st("Powder booth", "powder-booth", 6, { colourChangeMin: 20 }),
    st("Powder cure oven", "cure-oven", 60, { tempC: 210, heatTransferCoefficientWPerM2K: 30 }),
    st("Cool-down 2", "cool", 20),
  ],
};

export const line2: PlanConveyorLine = {
  kind: "conveyor",
  name: "Line 2",
  windowMm: { widthMm: 800, heightMm: 1800, depthMm: 700 },
  maxLoadKg: 80,
  hourlyCost: 260,
  lineSpeedMinMPerMin: 1.2,
  lineSpeedMaxMPerMin: 3.6,
  lineSpeedNominalMPerMin: 2.4,
  carrierPitchM: 0.9,
  stages: [
    st("Cleaner-coater", "conversion", 7, { tempC: 55 }),
    st("Rinse", "rinse", 3),
    st("Dry-off oven", "dry-off", 10, { tempC: 150, heatTransferCoefficientWPerM2K: 25 }),
    st("Powder booth A", "powder-booth", 5, { colourChangeMin: 15 }),
    st("Cure oven", "cure-oven", 54, { tempC: 205, heatTransferCoefficientWPerM2K: 28 }),
  ],
};

export const batchOven: PlanBatchLine = {
  kind: "batch",
  name: "Batch oven B",
  windowMm: { widthMm: 1000, heightMm: 2000, depthMm: 2800 },
  maxLoadKg: 250,
  hourlyCost: 65,
  racksPerLoad: 4,
  airTempC: 200,
  heatTransferCoefficientWPerM2K: 22,
  loadMin: 12,
  unloadMin: 10,
};

const base = { volumeSolidsFraction: null, weightSolidsFraction: null, filmDensityGPerCm3: null, specificGravity: null };

export const ecoat: PlanCoating = {
  ...base,
  id: 1,
  code: "EC-200",
  name: "Cathodic epoxy e-coat primer",
  kind: "e-coat",
  colourName: "Forge Black",
  swatchHex: "#23262a",
  volumeSolidsFraction: 0.4,
  weightSolidsFraction: 0.5,
  filmDensityGPerCm3: 1.4,
  filmMinUm: 18,
  filmMaxUm: 25,
  cureSchedule: [
    { metalTempC: 180, holdMin: 20 },
    { metalTempC: 190, holdMin: 15 },
    { metalTempC: 205, holdMin: 10 },
  ],
  pricePerKg: 7.2,
  containerKind: "drum",
  containerKg: 200,
};

export const greenPowder: PlanCoating = {
  ...base,
  id: 2,
  code: "PP-410",
  name: "Outdoor polyester, gloss",
  kind: "powder",
  colourName: "Bramble Green",
  swatchHex: "#3f6b47",
  specificGravity: 1.55,
  filmMinUm: 60,
  filmMaxUm: 90,
  cureSchedule: [
    { metalTempC: 190, holdMin: 12 },
    { metalTempC: 200, holdMin: 10 },
    { metalTempC: 210, holdMin: 8 },
  ],
  pricePerKg: 9.4,
  containerKind: "box",
  containerKg: 25,
};

export const zincPrimer: PlanCoating = {
  ...greenPowder,
  id: 3,
  code: "PZ-610",
  name: "Zinc-rich epoxy primer",
  colourName: "Zinc Primer Grey",
  swatchHex: "#8d9092",
  specificGravity: 2.6,
  filmMinUm: 50,
  filmMaxUm: 75,
  pricePerKg: 14.8,
  containerKg: 20,
};

export const whiteHybrid: PlanCoating = {
  ...greenPowder,
  id: 4,
  code: "PH-510",
  name: "Indoor hybrid, matt",
  colourName: "Chalk White",
  swatchHex: "#f1efe8",
  specificGravity: 1.4,
  filmMinUm: 50,
  filmMaxUm: 80,
  cureSchedule: [
    { metalTempC: 180, holdMin: 15 },
    { metalTempC: 190, holdMin: 12 },
    { metalTempC: 200, holdMin: 8 },
  ],
  pricePerKg: 8.3,
};

/** A bench end frame: 1.2 m² outside, 0.3 m² inside (tube bores), 0.1 m² masked, 6 kg, 3 mm steel. */
export const benchEnd: PlanPart = {
  number: "BE-100",
  name: "Bench end frame",
  lengthMm: 600,
  widthMm: 60,
  heightMm: 450,
  massKg: 6,
  areaM2: 1.2,
  insideAreaM2: 0.3,
  maskedAreaM2: 0.1,
  thicknessMm: 3,
};
