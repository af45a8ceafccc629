/**
 * The actual-use feedback loop: after a run is done the operator records parts coated and powder
 * used per powder coat; the measured utilisation (deposited ÷ used) feeds a running estimate per
 * line × coating that the forecast uses once it rests on enough runs.
 */
import { getDb, type Db } from "@/db/index";
import { listCoatingRows } from "@/db/queries/coatings";
import { excludeAllUsage, findUsage, latestCoatOn, setUsageExcluded, upsertUsage, usageOf, usageOfRun, type UsageRow } from "@/db/queries/feedback";
import { listLineRows } from "@/db/queries/lines";
import { coatsOf, findRunRow, partsForRuns } from "@/db/queries/runs";
import { materialUtilization } from "@/lib/coating-math/powder";
import { depositedKg } from "@/lib/forecast/forecast";
import { runningEstimate, MIN_RUNS_FOR_MEASURED } from "@/lib/forecast/utilisation";
import { coatAreaPerPartM2 } from "@/lib/runs/plan-run";
import type { ActualUseInput } from "@/lib/validation/feedback";
import { epochToDate, nowSeconds } from "./coatings";
import { ApiError } from "./http";
import type { SessionUser } from "./session";

/**
 * Below this utilisation the powder recorded is more than the run could have sprayed (common
 * practice, no source: first-pass figures of 40–60 % are typical, REFERENCES.md; a fifth of that
 * deposited means a weighing or entry error far more often than a real loss).
 */
export const MIN_PLAUSIBLE_UTILISATION = 0.2;

/** A part row's areas in the pure planner's shape. */
export function partAreas(p: { area_m2: number; inside_area_m2: number; masked_area_m2: number }) {
  return { areaM2: p.area_m2, insideAreaM2: p.inside_area_m2, maskedAreaM2: p.masked_area_m2 };
}

export interface UtilisationEstimate {
  /** from the latest planned coat's first-pass and reclaim efficiencies, or null if none */
  nominal: number | null;
  /** mean of the included runs once there are MIN_RUNS_FOR_MEASURED, else null */
  measured: number | null;
  runs: number;
  spread: number | null;
}

/** The utilisation to plan with on a line × coating: the measured one from three runs on. */
export async function utilisationEstimate(db: Db, lineId: number, coatingId: number): Promise<UtilisationEstimate> {
  const [rows, coat] = await Promise.all([usageOf(db, { lineId, coatingId }), latestCoatOn(db, lineId, coatingId)]);
  const est = runningEstimate(rows.map((r) => ({ utilisation: r.utilisation, excluded: r.excluded === 1 })));
  const nominal = coat?.first_pass_efficiency ? materialUtilization(coat.first_pass_efficiency, coat.reclaim_efficiency ?? 0) : null;
  return { nominal, measured: est.measured, runs: est.runs, spread: est.spread };
}

/** Mean measured film of a run's coat from the film checks, or null (the target film is used then). */
async function measuredFilm(db: Db, runId: number, coatIndex: number): Promise<number | null> {
  try {
    const { measuredFilmUm } = await import("./film-checks");
    return await measuredFilmUm(db, String(runId), coatIndex);
  } catch {
    return null;
  }
}

export interface UsageView {
  id: number;
  runId: number;
  runDate: string | null;
  coatIndex: number;
  lineId: number;
  coatingId: number;
  partsCoated: number;
  kgUsed: number;
  areaM2: number;
  filmUm: number;
  filmMeasured: boolean;
  depositedKg: number;
  utilisation: number;
  excluded: boolean;
  recordedBy: string | null;
  recordedAt: number;
}

function usageView(r: UsageRow, runDate: string | null = null): UsageView {
  return {
    id: r.id,
    runId: r.run_id,
    runDate,
    coatIndex: r.coat_index,
    lineId: r.line_id,
    coatingId: r.coating_id,
    partsCoated: r.parts_coated,
    kgUsed: r.kg_used,
    areaM2: r.area_m2,
    filmUm: r.film_um,
    filmMeasured: r.film_measured === 1,
    depositedKg: r.kg_used * r.utilisation,
    utilisation: r.utilisation,
    excluded: r.excluded === 1,
    recordedBy: r.recorded_by,
    recordedAt: r.recorded_at,
  };
}

export interface ActualUseCoat {
  coatIndex: number;
  coatingId: number;
  code: string;
  name: string;
  kind: "powder" | "e-coat";
  targetFilmUm: number;
  measuredFilmUm: number | null;
  specificGravity: number | null;
  areaPerPartM2: number;
  estimate: UtilisationEstimate | null;
  recorded: UsageView | null;
}

export interface ActualUseView {
  runId: number;
  status: string;
  quantity: number;
  lineId: number;
  lineName: string;
  canRecord: boolean;
  coats: ActualUseCoat[];
}

async function runContext(db: Db, runId: number) {
  const run = await findRunRow(db, runId);
  if (!run) throw new ApiError(404, "not_found", "No such run.");
  const [coats, parts, coatings] = await Promise.all([coatsOf(db, [runId]), partsForRuns(db, [run.part_id]), listCoatingRows(db, { includeArchived: true })]);
  return { run, coats, part: parts[0] ?? null, coatings: new Map(coatings.map((c) => [c.id, c])) };
}

export async function getActualUse(runId: number): Promise<ActualUseView> {
  const db = await getDb();
  const { run, coats, part, coatings } = await runContext(db, runId);
  const recorded = await usageOfRun(db, runId);
  const out: ActualUseCoat[] = [];
  for (const c of coats) {
    const k = coatings.get(c.coating_id);
    if (!k) continue;
    out.push({
      coatIndex: c.position,
      coatingId: c.coating_id,
      code: k.code,
      name: k.name,
      kind: k.kind,
      targetFilmUm: c.film_um,
      measuredFilmUm: k.kind === "powder" ? await measuredFilm(db, runId, c.position) : null,
      specificGravity: k.specific_gravity,
      areaPerPartM2: part ? coatAreaPerPartM2(partAreas(part), k.kind) : 0,
      estimate: k.kind === "powder" ? await utilisationEstimate(db, run.line_id, k.id) : null,
      recorded: recorded.find((r) => r.coat_index === c.position) ? usageView(recorded.find((r) => r.coat_index === c.position)!, epochToDate(run.run_date)) : null,
    });
  }
  return { runId, status: run.status, quantity: run.quantity, lineId: run.line_id, lineName: run.line_name, canRecord: run.status === "done", coats: out };
}

/**
 * Records actual use per powder coat, all coats or none (one transaction). 0 kg is refused; a
 * figure implying less than MIN_PLAUSIBLE_UTILISATION, or more deposited than used, needs `confirm`.
 */
export async function recordActualUse(runId: number, input: ActualUseInput, user: SessionUser): Promise<ActualUseView> {
  const db = await getDb();
  const { run, coats, part, coatings } = await runContext(db, runId);
  if (run.status !== "done") {
    throw new ApiError(409, "conflict", "Record actual use once the run is done.", { status: `The run is ${run.status}; mark it done first.` });
  }
  if (!part) throw new ApiError(409, "conflict", "The run's part is missing from the catalogue.", { partId: "The run's part is missing." });
  const t = nowSeconds();
  const rows: Parameters<typeof upsertUsage>[1][] = [];
  const warnings: Record<string, string> = {};
  const seen = new Set<number>();
  for (const [i, c] of input.coats.entries()) {
    const f = (name: string) => `coats.${i}.${name}`;
    if (seen.has(c.coatIndex)) throw new ApiError(400, "invalid_input", `${f("coatIndex")}: coat ${c.coatIndex + 1} is entered twice.`, { [f("coatIndex")]: "Enter each coat once." });
    seen.add(c.coatIndex);
    const coat = coats.find((x) => x.position === c.coatIndex);
    const coating = coat ? coatings.get(coat.coating_id) : undefined;
    if (!coat || !coating) throw new ApiError(400, "invalid_input", `${f("coatIndex")}: the run has no coat ${c.coatIndex + 1}.`, { [f("coatIndex")]: "No such coat on this run." });
    if (coating.kind !== "powder" || coating.specific_gravity === null) {
      throw new ApiError(400, "invalid_input", `${f("coatIndex")}: ${coating.code} is not a powder with a specific gravity; actual use is recorded for powder coats.`, { [f("coatIndex")]: "Only powder coats are weighed." });
    }
    if (c.kgUsed <= 0) {
      throw new ApiError(400, "invalid_input", `${f("kgUsed")}: enter the powder used in kg, more than 0 (weigh the boxes before and after the run).`, { [f("kgUsed")]: "Enter the kg used, more than 0." });
    }
    if (c.partsCoated > run.quantity) {
      throw new ApiError(400, "invalid_input", `${f("partsCoated")}: at most the run's ${run.quantity} parts.`, { [f("partsCoated")]: `At most ${run.quantity} parts.` });
    }
    const areaM2 = coatAreaPerPartM2(partAreas(part), "powder") * c.partsCoated;
    const measured = await measuredFilm(db, runId, c.coatIndex);
    const filmUm = measured ?? coat.film_um;
    // Products Finishing coverage, metric form: deposited kg = area × film × SG / 1000
    const deposited = depositedKg({ areaM2, filmUm, specificGravity: coating.specific_gravity });
    const utilisation = deposited / c.kgUsed;
    if (utilisation < MIN_PLAUSIBLE_UTILISATION) {
      warnings[f("kgUsed")] = `${c.kgUsed} kg is more than coat ${c.coatIndex + 1} could have sprayed: only ${deposited.toFixed(2)} kg went onto the parts (utilisation ${(utilisation * 100).toFixed(0)} %). Check the weighing.`;
    } else if (utilisation > 1) {
      warnings[f("kgUsed")] = `${c.kgUsed} kg is less than the ${deposited.toFixed(2)} kg the film on the parts needs. Check the weighing and parts coated.`;
    }
    rows.push({
      run_id: runId,
      coat_index: c.coatIndex,
      line_id: run.line_id,
      coating_id: coating.id,
      parts_coated: c.partsCoated,
      kg_used: c.kgUsed,
      area_m2: areaM2,
      film_um: filmUm,
      film_measured: measured === null ? 0 : 1,
      utilisation,
      excluded: 0,
      recorded_by: user.id,
      recorded_at: t,
    });
  }
  const first = Object.entries(warnings)[0];
  if (first && input.confirm !== true) {
    throw new ApiError(409, "conflict", `${first[0]}: ${first[1]} Send confirm: true to save it anyway.`, { ...warnings, confirm: "Confirm to save these figures anyway." });
  }
  await db.transaction().execute(async (trx) => {
    for (const r of rows) await upsertUsage(trx, r);
  });
  return getActualUse(runId);
}

export interface EstimateView extends UtilisationEstimate {
  lineId: number;
  lineName: string;
  coatingId: number;
  code: string;
  name: string;
  minRuns: number;
  history: UsageView[];
}

/** Every line × coating with recorded use, its estimate and history (newest last). */
export async function listEstimates(): Promise<EstimateView[]> {
  const db = await getDb();
  const [rows, lines, coatings] = await Promise.all([usageOf(db), listLineRows(db, { includeArchived: true }), listCoatingRows(db, { includeArchived: true })]);
  const runDates = new Map<number, string>();
  const runIds = [...new Set(rows.map((r) => r.run_id))];
  if (runIds.length) {
    for (const r of await db.selectFrom("runs").select(["id", "run_date"]).where("id", "in", runIds).execute()) runDates.set(r.id, epochToDate(r.run_date));
  }
  const keys = [...new Set(rows.map((r) => `${r.line_id}:${r.coating_id}`))];
  const out: EstimateView[] = [];
  for (const key of keys) {
    const [lineId, coatingId] = key.split(":").map(Number);
    const line = lines.find((l) => l.id === lineId);
    const coating = coatings.find((c) => c.id === coatingId);
    out.push({
      lineId,
      lineName: line?.name ?? `Line ${lineId}`,
      coatingId,
      code: coating?.code ?? "?",
      name: coating?.name ?? "",
      minRuns: MIN_RUNS_FOR_MEASURED,
      ...(await utilisationEstimate(db, lineId, coatingId)),
      history: rows.filter((r) => r.line_id === lineId && r.coating_id === coatingId).map((r) => usageView(r, runDates.get(r.run_id) ?? null)),
    });
  }
  return out.sort((a, b) => a.lineName.localeCompare(b.lineName) || a.code.localeCompare(b.code));
}

export async function setExcluded(id: number, excluded: boolean): Promise<UsageView> {
  const db = await getDb();
  const row = await findUsage(db, id);
  if (!row) throw new ApiError(404, "not_found", "No such usage record.");
  await setUsageExcluded(db, id, excluded);
  return usageView((await findUsage(db, id))!);
}

/** Starts the estimate afresh: every recorded run on the line × coating is excluded (kept as history). */
export async function resetEstimate(lineId: number, coatingId: number): Promise<{ excluded: number }> {
  const db = await getDb();
  return { excluded: await excludeAllUsage(db, lineId, coatingId) };
}
