// Racking planner benchmark: 1,000 seeded random carriers and parts. Times the full planner
// (single grid + mixed guillotine blocks) against the single-grid planner alone in the same
// run, and counts the parts the mixed blocks add. Prints; never fails on timing.
// Run: npx tsx bench/rack.ts, or without tsx installed: node_modules/.bin/jiti bench/rack.ts

import { realpathSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { performance } from "node:perf_hooks";
import { planRack, planSingleGrid } from "../lib/rack/plan";
import type { RackPlanInput } from "../lib/rack/types";

const CASES = 1000;
const WARM_UP_CASES = 200;
const SEED = 0x5eed_2026;

/** mulberry32: a small seeded generator, so every run plans the same cases. */
function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Parts and windows around a common scale; at most ~3000 parts per carrier by volume. */
export function randomRackCases(count: number, seed = SEED): RackPlanInput[] {
  const rnd = seededRandom(seed);
  const between = (lo: number, hi: number) => lo + (hi - lo) * rnd();
  const round1 = (v: number) => Math.round(v * 10) / 10;
  const cases: RackPlanInput[] = [];
  while (cases.length < count) {
    const scaleMm = between(20, 1000);
    const part = {
      lengthMm: round1(scaleMm * between(0.15, 1)),
      widthMm: round1(scaleMm * between(0.15, 1)),
      heightMm: round1(scaleMm * between(0.15, 1)),
      massKg: round1(between(0.1, 50)),
    };
    const carrier = {
      widthMm: round1(scaleMm * between(0.8, 7)),
      heightMm: round1(scaleMm * between(0.8, 7)),
      depthMm: round1(scaleMm * between(0.8, 5)),
      maxLoadKg: Math.round(between(10, 5000)),
    };
    const clearanceMm = rnd() < 0.25 ? 0 : round1(scaleMm * between(0, 0.3));
    const c = clearanceMm;
    const volumeBound =
      ((carrier.widthMm + c) * (carrier.heightMm + c) * (carrier.depthMm + c)) /
      ((part.lengthMm + c) * (part.widthMm + c) * (part.heightMm + c));
    if (volumeBound > 3000) continue;
    cases.push({ part, carrier, clearanceMm, orientations: rnd() < 0.5 ? "any" : "upright" });
  }
  return cases;
}

function percentile(sortedMs: number[], p: number): number {
  const i = Math.min(sortedMs.length - 1, Math.ceil((p / 100) * sortedMs.length) - 1);
  return sortedMs[Math.max(0, i)];
}

export interface TimingSummary {
  p50Ms: number;
  p95Ms: number;
  maxMs: number;
  totalMs: number;
  /** The same percentile on process CPU time, less disturbed by other work on a shared machine. */
  cpuP95Ms: number;
}

export interface RackBenchResult {
  cases: number;
  full: TimingSummary;
  singleGrid: TimingSummary;
  /** Full planner time / single-grid time, over all cases. */
  timeRatio: number;
  singleGridParts: number;
  mixedParts: number;
  /** Extra parts by space from mixed blocks, as a % of the single-grid total. */
  gainPercent: number;
  casesImproved: number;
}

type Planner = (c: RackPlanInput) => { spaceCount: number };

function summarise(ms: number[], cpuMs: number[]): TimingSummary {
  const sorted = [...ms].sort((a, b) => a - b);
  return {
    p50Ms: percentile(sorted, 50),
    p95Ms: percentile(sorted, 95),
    maxMs: sorted[sorted.length - 1],
    totalMs: ms.reduce((s, v) => s + v, 0),
    cpuP95Ms: percentile([...cpuMs].sort((a, b) => a - b), 95),
  };
}

/** Times both planners case by case, alternating, so load from elsewhere hits both alike. */
function timeInterleaved(cases: RackPlanInput[], planners: Planner[]) {
  const runs = planners.map(() => ({ ms: [] as number[], cpuMs: [] as number[], counts: [] as number[] }));
  for (const c of cases) {
    planners.forEach((plan, i) => {
      const cpu0 = process.cpuUsage();
      const t0 = performance.now();
      const result = plan(c);
      runs[i].ms.push(performance.now() - t0);
      const cpu = process.cpuUsage(cpu0);
      runs[i].cpuMs.push((cpu.user + cpu.system) / 1000);
      runs[i].counts.push(result.spaceCount);
    });
  }
  return runs.map((r) => ({ summary: summarise(r.ms, r.cpuMs), counts: r.counts }));
}

export function runRackBench(caseCount = CASES): RackBenchResult {
  const cases = randomRackCases(caseCount);
  // Warm the JIT on other cases so the first timed ones are not compile time.
  for (const c of randomRackCases(WARM_UP_CASES, SEED + 1)) {
    planSingleGrid(c);
    planRack(c);
  }
  const [single, full] = timeInterleaved(cases, [planSingleGrid, planRack]);
  const singleGridParts = single.counts.reduce((s, v) => s + v, 0);
  const mixedParts = full.counts.reduce((s, v) => s + v, 0);
  return {
    cases: cases.length,
    full: full.summary,
    singleGrid: single.summary,
    timeRatio: full.summary.totalMs / single.summary.totalMs,
    singleGridParts,
    mixedParts,
    gainPercent: ((mixedParts - singleGridParts) / singleGridParts) * 100,
    casesImproved: full.counts.filter((v, i) => v > single.counts[i]).length,
  };
}

export function printRackBench(r: RackBenchResult): void {
  const line = (name: string, t: TimingSummary) =>
    `${name.padEnd(22)} p50 ${t.p50Ms.toFixed(3)} ms  p95 ${t.p95Ms.toFixed(3)} ms  max ${t.maxMs.toFixed(3)} ms  total ${t.totalMs.toFixed(1)} ms  (CPU p95 ${t.cpuP95Ms.toFixed(3)} ms)`;
  console.log(`rack planner, ${r.cases} seeded random cases`);
  console.log(line("single grid (baseline)", r.singleGrid));
  console.log(line("full (mixed blocks)", r.full));
  console.log(`time ratio full / baseline: ${r.timeRatio.toFixed(1)}×  (target: full p95 < 5 ms)`);
  console.log(
    `parts by space: baseline ${r.singleGridParts}, mixed ${r.mixedParts}, gain ${r.gainPercent.toFixed(2)} % ` +
      `(${r.casesImproved} of ${r.cases} cases improved)`,
  );
}

const invokedPath = process.argv[1];
const isMain = (() => {
  try {
    return invokedPath !== undefined && realpathSync(invokedPath) === realpathSync(fileURLToPath(import.meta.url));
  } catch {
    return false;
  }
})();
if (isMain) printRackBench(runRackBench());
