/**
 * What a run sheet lists beside the numbers: the steps in the order the parts meet them, and the
 * safety notes that apply to this run's stages. Pure: metric values only, the screen formats.
 */
import { stageDwellMin } from "../coating-math/line";
import type { StageInput, StageKind } from "../lines/stages";
import type { RunPlan } from "./plan-run";

export type StepKind = "masking" | "hang" | "blow-off" | "pretreat" | "e-coat" | "dry-off" | "spray" | "cure" | "cool" | "load" | "unload";

export interface SheetStep {
  kind: StepKind;
  title: string;
  /** the line stage (conveyor lines) */
  stageName?: string;
  lengthM?: number;
  dwellMin?: number;
  tempC?: number | null;
  /** index into plan.coats of the coat applied or cured here */
  coat?: number;
  /** the stage is passed through without coating (e.g. the e-coat tank on a powder-only run) */
  idle?: boolean;
  pass?: number;
}

const PRETREAT: readonly StageKind[] = ["clean", "rinse", "conversion"];


function conveyorSteps(stages: readonly StageInput[], plan: RunPlan): SheetStep[] {
  const steps: SheetStep[] = [];
  const speed = plan.lineSpeedMPerMin!;
  for (let pass = 1; pass <= plan.passes; pass++) {
    const coats = plan.coats.filter((c) => c.pass === pass);
    stages.forEach((s, position) => {
      const base = { stageName: s.name, lengthM: s.lengthM, dwellMin: stageDwellMin(s.lengthM, speed), tempC: s.tempC ?? null, pass };
      const applied = coats.find((c) => c.applyStage?.position === position);
      const cured = coats.find((c) => c.cure.ovenPosition === position);
      if (PRETREAT.includes(s.kind)) steps.push({ kind: "pretreat", title: s.name, ...base });
      else if (s.kind === "e-coat") steps.push({ kind: "e-coat", title: s.name, ...base, ...(applied ? { coat: applied.position } : { idle: true }) });
      else if (s.kind === "powder-booth") steps.push({ kind: "spray", title: s.name, ...base, ...(applied ? { coat: applied.position } : { idle: true }) });
      else if (s.kind === "cure-oven") steps.push({ kind: "cure", title: s.name, ...base, ...(cured ? { coat: cured.position } : { idle: true }) });
      else if (s.kind === "dry-off") steps.push({ kind: "dry-off", title: s.name, ...base });
      else steps.push({ kind: "cool", title: s.name, ...base });
    });
    if (pass < plan.passes) steps.push({ kind: "hang", title: `Re-hang for pass ${pass + 1}`, pass: pass + 1 });
  }
  return steps;
}

function batchSteps(plan: RunPlan): SheetStep[] {
  const steps: SheetStep[] = [{ kind: "pretreat", title: "Pretreat as the plant's procedure for this part sets out" }];
  for (const c of plan.coats) {
    steps.push({ kind: "spray", title: `Spray coat ${c.position + 1}`, coat: c.position });
    steps.push({ kind: "load", title: `Load ${plan.loads} oven load${plan.loads === 1 ? "" : "s"}` });
    steps.push({ kind: "cure", title: "Cure in the batch oven", coat: c.position, tempC: c.cure.airTempC, dwellMin: c.cure.dwellMin ?? undefined });
  }
  return steps;
}

/** Masking, hanging, blow-off, the line's stages (or the batch cycle), unloading. */
export function runSteps(line: { kind: "conveyor"; stages: readonly StageInput[] } | { kind: "batch" }, plan: RunPlan): SheetStep[] {
  return [
    { kind: "masking", title: "Mask" },
    { kind: "hang", title: "Hang the parts" },
    { kind: "blow-off", title: "Blow off" },
    ...(line.kind === "conveyor" ? conveyorSteps(line.stages, plan) : batchSteps(plan)),
    { kind: "unload", title: "Unload, remove masking, check the film" },
  ];
}

export interface SafetyNote {
  topic: "powder" | "oven" | "pretreatment" | "e-coat";
  title: string;
  text: string;
  /** documents to point to */
  refs: string[];
}

// REFERENCES.md, "Safety documents to point users to".
const NOTES: Readonly<Record<SafetyNote["topic"], Omit<SafetyNote, "topic">>> = {
  powder: {
    title: "Powder booth: combustible dust and grounding",
    text: "Coating powder in the air can burn or explode. Keep the booth's extraction running, clean up spills with an approved vacuum, not compressed air, and keep ignition sources out. Ground every part through clean hooks and the operator through conductive footwear or the gun handle; a part that is not grounded can spark.",
    refs: ["NFPA 33", "NFPA 652", "NFPA 654", "NFPA 70 Art. 516", "OSHA 29 CFR 1910.107"],
  },
  oven: {
    title: "Ovens and hot parts",
    text: "Do not enter or reach into an oven that is running; the oven's purge and exhaust must be working before it fires. Parts, hooks and carriers leave the oven near cure temperature and stay hot: handle them with heat-resistant gloves and only after the cool-down.",
    refs: ["NFPA 86"],
  },
  pretreatment: {
    title: "Acid and alkaline pretreatment",
    text: "Cleaners and phosphate baths burn skin and eyes. Wear the gloves, goggles or face shield and apron the SDS calls for; know where the eyewash and shower are before you start.",
    refs: ["OSHA 29 CFR 1910.132", "OSHA 29 CFR 1910.151(c)", "OSHA 29 CFR 1910.1200"],
  },
  "e-coat": {
    title: "E-coat tank: high-voltage DC",
    text: "The tank runs at hundreds of volts DC while parts are in it. Never touch the bath, anodes or parts in the tank while the rectifier is on; lock out and verify before any work in or over the tank.",
    refs: ["OSHA 29 CFR 1910.147", "NFPA 70E"],
  },
};

/** The notes that apply to this run: its coats' kinds, the line's pretreatment and ovens. */
export function safetyNotes(line: { kind: "conveyor"; stages: readonly StageInput[] } | { kind: "batch" }, plan: RunPlan): SafetyNote[] {
  const topics = new Set<SafetyNote["topic"]>();
  if (line.kind === "batch" || line.stages.some((s) => PRETREAT.includes(s.kind))) topics.add("pretreatment");
  if (plan.coats.some((c) => c.kind === "e-coat")) topics.add("e-coat");
  if (plan.coats.some((c) => c.kind === "powder")) topics.add("powder");
  topics.add("oven");
  const order: SafetyNote["topic"][] = ["powder", "oven", "pretreatment", "e-coat"];
  return order.filter((t) => topics.has(t)).map((topic) => ({ topic, ...NOTES[topic] }));
}

/** Placements grouped by the height of their lower face: one tier per level, lowest first. */
export function rackTiers(placements: readonly { minMm: readonly number[]; sizeMm: readonly number[] }[]): { bottomMm: number; count: number }[] {
  const tiers: { bottomMm: number; count: number }[] = [];
  for (const p of placements) {
    const y = p.minMm[1];
    const tier = tiers.find((t) => Math.abs(t.bottomMm - y) <= 1e-6 * Math.max(1, Math.abs(y)));
    if (tier) tier.count += 1;
    else tiers.push({ bottomMm: y, count: 1 });
  }
  return tiers.sort((a, b) => a.bottomMm - b.bottomMm);
}
