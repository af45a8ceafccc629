/**
 * Film checks of a run: DFT readings per coat judged against the spec with the shared acceptance
 * rules (lib/coating-math/film.ts), the other tests (cure, adhesion, appearance, coverage),
 * gauges, the quality trend per coating × line, and a log of every change. Once a run is done,
 * only an admin may change its records.
 */
import { getDb, type Db } from "@/db/index";
import { coatsOf, findRunRow } from "@/db/queries/runs";
import * as q from "@/db/queries/film-checks";
import { evaluateFilm, type FilmEvaluation } from "@/lib/coating-math/film";
import { flattenReadings, fractionInSpec, localizeFilmText } from "@/lib/film-checks/readings";
import type { CsvMapping } from "@/lib/film-checks/csv-mapping";
import { describeFilmCheckLog, type LogChange } from "@/lib/film-checks/change-log";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { PA2_MIN_READINGS_PER_SPOT, PA2_SPOTS_PER_AREA } from "@/lib/coating-math/film";
import { ApiError, isUniqueViolation } from "./http";
import { addMonths, dateToEpoch, epochToDate, nowSeconds } from "./coatings";
import type { SessionUser } from "./session";
import type { FilmCheckInput, FilmTestInput, GaugeInput, GaugeUpdate } from "@/lib/validation/film-checks";

/** Who may open the gauges page (admin always may); changing gauges follows the access table. */
export const GAUGE_PAGE_ROLES = ["operator", "supervisor", "engineer", "manager"] as const;

export interface CoatSpec {
  coatIndex: number;
  coatingId: number;
  coatingCode: string;
  coatingName: string;
  plannedFilmUm: number;
  specMinUm: number;
  specMaxUm: number;
}

export interface FilmCheckView {
  id: number;
  runId: number;
  coatIndex: number;
  rule: "sspc-pa2" | "iso19840";
  /** the override saved on the check, or null (the coating's range applies) */
  specMinOverrideUm: number | null;
  specMaxOverrideUm: number | null;
  nominalUm: number | null;
  specMinUm: number;
  specMaxUm: number;
  gaugeId: number | null;
  gaugeName: string | null;
  areas: number[][][] | null;
  readingsUm: number[] | null;
  readingCount: number;
  meanUm: number | null;
  notes: string;
  createdBy: string | null;
  createdAt: number;
  updatedAt: number;
  pass: boolean;
  /** in the viewer's units */
  reasons: string[];
  warnings: string[];
  spotsUm: number[][] | null;
}

export interface FilmTestView {
  id: number;
  kind: "cure" | "adhesion" | "appearance" | "coverage";
  data: Record<string, unknown>;
  summary: string;
  recordedBy: string | null;
  recordedAt: number;
}

export interface GaugeView {
  id: number;
  name: string;
  gaugeType: "type1" | "type2";
  serial: string;
  verifiedOn: string | null;
  mapping: CsvMapping | null;
  /** the plant's verification interval for this gauge */
  verifyIntervalMonths: number;
  /** verifiedOn + the interval; null when never verified */
  verificationDueOn: string | null;
  /** "overdue" once today is past the due date; "never" when no verification is recorded */
  verification: "current" | "overdue" | "never";
  retiredOn: string | null;
  /** film checks that name this gauge (a gauge in use is retired, not deleted) */
  checkCount: number;
}

export interface LogView {
  id: number;
  entity: string;
  entityId: number;
  action: string;
  userName: string | null;
  at: number;
  old: unknown;
  new: unknown;
  /** in words, film values in the viewer's units */
  summary: string;
  /** field: from → to, for edits */
  changes: LogChange[];
}

/** SSPC-PA 2 sampling of one coat: what the run's coated surface needs and what is recorded. */
export interface CoatSampling {
  coatIndex: number;
  surfaceAreaM2: number;
  areaCount: number;
  spotCount: number;
  minReadingCount: number;
  /** areas, spots and readings in this coat's SSPC-PA 2 checks */
  recordedAreas: number;
  recordedSpots: number;
  /** areas with all 5 spots of at least 3 readings */
  completeAreas: number;
  /** readings of every check of the coat (either rule) */
  recordedReadings: number;
}

export interface RunFilmChecks {
  run: { id: number; status: string; partNumber: string; partName: string; lineName: string; date: string; locked: boolean; lockReason: string | null };
  coats: CoatSpec[];
  checks: FilmCheckView[];
  tests: FilmTestView[];
  log: LogView[];
  sampling: { coats: CoatSampling[]; unavailable: string | null };
}

const mean = (v: readonly number[]) => (v.length ? v.reduce((a, b) => a + b, 0) / v.length : null);

async function runOrThrow(db: Db, runId: number) {
  const run = await findRunRow(db, runId);
  if (!run) throw new ApiError(404, "not_found", "No such run.");
  return run;
}

/** The run's coats with the film range each is judged against by default. */
async function coatSpecs(db: Db, runId: number): Promise<CoatSpec[]> {
  const coats = await coatsOf(db, [runId]);
  if (!coats.length) return [];
  const coatings = await db
    .selectFrom("coatings")
    .select(["id", "code", "name", "film_min_um", "film_max_um"])
    .where(
      "id",
      "in",
      coats.map((c) => c.coating_id),
    )
    .execute();
  const byId = new Map(coatings.map((c) => [c.id, c]));
  return coats.map((c) => {
    const coating = byId.get(c.coating_id)!;
    return {
      coatIndex: c.position,
      coatingId: c.coating_id,
      coatingCode: coating.code,
      coatingName: coating.name,
      plannedFilmUm: c.film_um,
      specMinUm: coating.film_min_um,
      specMaxUm: coating.film_max_um,
    };
  });
}

/**
 * Why this user may not write film records on a run in this status, or null. Readings are taken
 * on coated parts, so not before the run starts nor on a cancelled run; records of a done run are
 * kept and only an admin may change them.
 */
function lockReasonFor(status: string, user: SessionUser): string | null {
  if (status === "draft" || status === "planned") return "Film readings are taken on coated parts: this run has not started yet.";
  if (status === "cancelled") return "This run was cancelled: no parts were coated on it.";
  if (status === "done" && user.role !== "admin") return "This run is done: its film records are kept and only an admin may change them.";
  return null;
}

function requireWritable(status: string, user: SessionUser): void {
  const reason = lockReasonFor(status, user);
  if (reason) throw new ApiError(409, "conflict", reason);
}

function evaluationInput(
  rule: "sspc-pa2" | "iso19840",
  specMinUm: number,
  specMaxUm: number,
  nominalUm: number | null,
  readings: number[] | number[][][],
) {
  return rule === "sspc-pa2"
    ? ({ rule, specMinUm, specMaxUm, areas: readings as number[][][] } as const)
    : ({ rule, specMinUm, specMaxUm, nominalUm: nominalUm ?? specMinUm, readingsUm: readings as number[] } as const);
}

function checkView(row: q.FilmCheckWithNames, coat: CoatSpec | undefined, system: UnitSystem): FilmCheckView {
  const readings = JSON.parse(row.readings_json) as number[] | number[][][];
  const specMinUm = row.spec_min_um ?? coat?.specMinUm ?? 0;
  const specMaxUm = row.spec_max_um ?? coat?.specMaxUm ?? 0;
  const flat = flattenReadings(readings);
  let ev: FilmEvaluation | null = null;
  let problem: string | null = null;
  try {
    ev = evaluateFilm(evaluationInput(row.rule, specMinUm, specMaxUm, row.nominal_um, readings));
  } catch (e) {
    problem = e instanceof Error ? e.message : String(e);
  }
  return {
    id: row.id,
    runId: row.run_id,
    coatIndex: row.coat_position,
    rule: row.rule,
    specMinOverrideUm: row.spec_min_um,
    specMaxOverrideUm: row.spec_max_um,
    nominalUm: row.nominal_um,
    specMinUm,
    specMaxUm,
    gaugeId: row.gauge_id,
    gaugeName: row.gauge_name,
    areas: row.rule === "sspc-pa2" ? (readings as number[][][]) : null,
    readingsUm: row.rule === "iso19840" ? (readings as number[]) : null,
    readingCount: flat.length,
    meanUm: mean(flat),
    notes: row.notes,
    createdBy: row.created_by_name,
    createdAt: row.created_at,
    updatedAt: row.updated_at,
    pass: ev?.pass ?? false,
    reasons: (ev?.reasons ?? [problem ?? "Not judged."]).map((r) => localizeFilmText(r, system)),
    warnings: (ev?.warnings ?? []).map((r) => localizeFilmText(r, system)),
    spotsUm: ev?.rule === "sspc-pa2" ? ev.spotsUm : null,
  };
}

const CLASS_WORDS: Record<number, string> = {
  5: "edges smooth, none detached",
  4: "small flakes, under 5 % affected",
  3: "5–15 % removed",
  2: "15–35 % removed",
  1: "35–65 % removed",
  0: "over 65 % removed",
};

/** One line in words for a test record. */
export function testSummary(kind: FilmTestView["kind"], d: Record<string, unknown>): string {
  switch (kind) {
    case "cure":
      return `Solvent rub (ASTM D5402): ${String(d.rubCount)} double rubs with ${String(d.solvent)} — ${d.result === "pass" ? "pass" : "fail"}`;
    case "adhesion": {
      const rating = Number(d.rating);
      return `Adhesion (ASTM D3359 method ${String(d.method)}): class ${rating}${String(d.method)} — ${CLASS_WORDS[rating] ?? ""}`;
    }
    case "appearance":
      return `Appearance: ${d.gloss60Gu === null || d.gloss60Gu === undefined ? "gloss not measured" : `gloss ${String(d.gloss60Gu)} GU at 60°`}${d.colourNote ? `; ${String(d.colourNote)}` : ""}`;
    case "coverage":
      return `Coverage after e-coat: ${d.result === "pass" ? "pass" : d.result === "touch-up" ? "touch-up needed" : "strip and recoat"}`;
  }
}

function testView(row: q.FilmTestWithName): FilmTestView {
  const data = JSON.parse(row.data_json) as Record<string, unknown>;
  return {
    id: row.id,
    kind: row.kind,
    data,
    summary: testSummary(row.kind, data),
    recordedBy: row.recorded_by_name,
    recordedAt: row.recorded_at,
  };
}

function gaugeView(g: q.GaugeRow, checkCount: number, today = epochToDate(nowSeconds())): GaugeView {
  const verifiedOn = g.verified_at === null ? null : epochToDate(g.verified_at);
  const due = verifiedOn === null ? null : addMonths(verifiedOn, g.verify_interval_months);
  return {
    id: g.id,
    name: g.name,
    gaugeType: g.gauge_type,
    serial: g.serial,
    verifiedOn,
    mapping: g.mapping_json ? (JSON.parse(g.mapping_json) as CsvMapping) : null,
    verifyIntervalMonths: g.verify_interval_months,
    verificationDueOn: due,
    // ISO dates compare as text; due on the day itself is still current.
    verification: due === null ? "never" : today > due ? "overdue" : "current",
    retiredOn: g.retired_at === null ? null : epochToDate(g.retired_at),
    checkCount,
  };
}

async function gaugeViewById(db: Db, id: number): Promise<GaugeView> {
  const row = await q.findGauge(db, id);
  if (!row) throw new ApiError(404, "not_found", "No such gauge.");
  return gaugeView(row, (await q.gaugeUseCounts(db)).get(id) ?? 0);
}

/** What the coated surface of each coat needs (the run sheet's SSPC-PA 2 plan) against what is recorded. */
async function samplingOf(runId: number, checks: FilmCheckView[]): Promise<RunFilmChecks["sampling"]> {
  // Loaded on demand: the run service reaches this module through the feedback loop.
  const { getRun } = await import("./runs");
  let run;
  try {
    run = await getRun(runId);
  } catch (e) {
    if (e instanceof ApiError) return { coats: [], unavailable: e.message };
    throw e;
  }
  if (!run.plan) {
    return { coats: [], unavailable: `This run does not plan (${run.planError?.message ?? "its part is missing"}), so its coated surface is not known.` };
  }
  const coats = run.plan.coats.map((c): CoatSampling => {
    let recordedAreas = 0;
    let recordedSpots = 0;
    let completeAreas = 0;
    let recordedReadings = 0;
    for (const check of checks.filter((x) => x.coatIndex === c.position)) {
      recordedReadings += check.readingCount;
      for (const spots of check.areas ?? []) {
        recordedAreas += 1;
        recordedSpots += spots.length;
        if (spots.length >= PA2_SPOTS_PER_AREA && spots.every((r) => r.length >= PA2_MIN_READINGS_PER_SPOT)) completeAreas += 1;
      }
    }
    return {
      coatIndex: c.position,
      surfaceAreaM2: c.areaM2,
      areaCount: c.filmCheck.areaCount,
      spotCount: c.filmCheck.spotCount,
      minReadingCount: c.filmCheck.minReadingCount,
      recordedAreas,
      recordedSpots,
      completeAreas,
      recordedReadings,
    };
  });
  return { coats, unavailable: null };
}

function logView(
  l: q.FilmLogRow & { user_name: string | null },
  coats: CoatSpec[],
  gaugeNames: Map<number, string>,
  system: UnitSystem,
): LogView {
  const oldV = l.old_json ? (JSON.parse(l.old_json) as unknown) : null;
  const newV = l.new_json ? (JSON.parse(l.new_json) as unknown) : null;
  let summary = `${l.action} ${l.entity.replace("_", " ")} ${l.entity_id}`;
  let changes: LogChange[] = [];
  if (l.entity === "film_check") {
    const coatLabel = (i: number) => {
      const c = coats.find((x) => x.coatIndex === i);
      return `coat ${i + 1}${c ? ` (${c.coatingCode})` : ""}`;
    };
    ({ summary, changes } = describeFilmCheckLog(l.action, oldV, newV, { system, coatLabel, gaugeName: (id) => gaugeNames.get(id) ?? null }));
  } else if (l.entity === "film_test" && newV && typeof newV === "object") {
    const { kind, ...data } = newV as { kind: FilmTestView["kind"] } & Record<string, unknown>;
    summary = `Recorded a test: ${localizeFilmText(testSummary(kind, data), system)}.`;
  }
  return { id: l.id, entity: l.entity, entityId: l.entity_id, action: l.action, userName: l.user_name, at: l.at, old: oldV, new: newV, summary, changes };
}

export async function runFilmChecks(runId: number, user: SessionUser): Promise<RunFilmChecks> {
  const db = await getDb();
  const run = await runOrThrow(db, runId);
  const coats = await coatSpecs(db, runId);
  const byIndex = new Map(coats.map((c) => [c.coatIndex, c]));
  const checks = (await q.filmChecksOfRun(db, runId)).map((r) => checkView(r, byIndex.get(r.coat_position), user.unitSystem));
  const tests = (await q.filmTestsOfRun(db, runId)).map(testView);
  const gaugeNames = new Map((await q.listGaugeRows(db)).map((g) => [g.id, g.name]));
  const log = (await q.filmLogOfRun(db, runId)).map((l) => logView(l, coats, gaugeNames, user.unitSystem));
  const lockReason = lockReasonFor(run.status, user);
  return {
    run: {
      id: run.id,
      status: run.status,
      partNumber: run.part_number,
      partName: run.part_name,
      lineName: run.line_name,
      date: epochToDate(run.run_date),
      locked: lockReason !== null,
      lockReason,
    },
    coats,
    checks,
    tests,
    log,
    sampling: await samplingOf(runId, checks),
  };
}

/** The stored form of an input, checked against the run and judged once so impossible input is 400. */
async function prepare(db: Db, runId: number, input: FilmCheckInput, currentGaugeId: number | null = null) {
  const coats = await coatSpecs(db, runId);
  const coat = coats.find((c) => c.coatIndex === input.coatIndex);
  if (!coat) {
    throw new ApiError(400, "invalid_input", `This run has no coat ${input.coatIndex + 1}.`, { coatIndex: "Choose one of the run's coats." });
  }
  const readings = input.rule === "sspc-pa2" ? input.areas : input.readingsUm;
  const specMinUm = input.specMinUm ?? coat.specMinUm;
  const specMaxUm = input.specMaxUm ?? coat.specMaxUm;
  const nominalUm = input.rule === "iso19840" ? (input.nominalUm ?? null) : null;
  // Throws a DomainError with the path (areas.0.1) on a short spot or a reversed spec → 400.
  evaluateFilm(evaluationInput(input.rule, specMinUm, specMaxUm, nominalUm, readings));
  if (input.gaugeId != null) {
    const gauge = await q.findGauge(db, input.gaugeId);
    if (!gauge) throw new ApiError(400, "invalid_input", "No such gauge.", { gaugeId: "Choose a gauge from the list." });
    // A retired gauge stays on the records that name it, but new readings need a gauge in use.
    if (gauge.retired_at !== null && gauge.id !== currentGaugeId) {
      throw new ApiError(400, "invalid_input", `${gauge.name} is retired.`, { gaugeId: `${gauge.name} is retired; choose a gauge in use.` });
    }
  }
  return {
    coat_position: input.coatIndex,
    rule: input.rule,
    spec_min_um: input.specMinUm ?? null,
    spec_max_um: input.specMaxUm ?? null,
    nominal_um: nominalUm,
    gauge_id: input.gaugeId ?? null,
    readings_json: JSON.stringify(readings),
    notes: input.notes ?? "",
  };
}

async function log(db: Db, runId: number, entity: string, entityId: number, action: string, user: SessionUser, oldV: unknown, newV: unknown) {
  await q.insertFilmLog(db, {
    run_id: runId,
    entity,
    entity_id: entityId,
    action,
    user_id: user.id,
    at: nowSeconds(),
    old_json: oldV === null ? null : JSON.stringify(oldV),
    new_json: newV === null ? null : JSON.stringify(newV),
  });
}

export async function createFilmCheck(runId: number, input: FilmCheckInput, user: SessionUser): Promise<FilmCheckView> {
  const db = await getDb();
  const run = await runOrThrow(db, runId);
  requireWritable(run.status, user);
  const values = await prepare(db, runId, input);
  const t = nowSeconds();
  const id = await db.transaction().execute(async (trx) => {
    const newId = await q.insertFilmCheck(trx, { ...values, run_id: runId, created_by: user.id, created_at: t, updated_at: t });
    await log(trx, runId, "film_check", newId, "create", user, null, values);
    return newId;
  });
  return getFilmCheck(id, user);
}

export async function getFilmCheck(id: number, user: SessionUser): Promise<FilmCheckView> {
  const db = await getDb();
  const row = await q.findFilmCheck(db, id);
  if (!row) throw new ApiError(404, "not_found", "No such film check.");
  const coat = (await coatSpecs(db, row.run_id)).find((c) => c.coatIndex === row.coat_position);
  return checkView(row, coat, user.unitSystem);
}

function stored(row: q.FilmCheckRow) {
  const { coat_position, rule, spec_min_um, spec_max_um, nominal_um, gauge_id, readings_json, notes } = row;
  return { coat_position, rule, spec_min_um, spec_max_um, nominal_um, gauge_id, readings_json, notes };
}

export async function updateFilmCheck(id: number, input: FilmCheckInput, user: SessionUser): Promise<FilmCheckView> {
  const db = await getDb();
  const row = await q.findFilmCheck(db, id);
  if (!row) throw new ApiError(404, "not_found", "No such film check.");
  const run = await runOrThrow(db, row.run_id);
  requireWritable(run.status, user);
  const values = await prepare(db, row.run_id, input, row.gauge_id);
  await db.transaction().execute(async (trx) => {
    await q.updateFilmCheck(trx, id, { ...values, updated_at: nowSeconds() });
    await log(trx, row.run_id, "film_check", id, "update", user, stored(row), values);
  });
  return getFilmCheck(id, user);
}

export async function removeFilmCheck(id: number, user: SessionUser): Promise<void> {
  const db = await getDb();
  const row = await q.findFilmCheck(db, id);
  if (!row) throw new ApiError(404, "not_found", "No such film check.");
  const run = await runOrThrow(db, row.run_id);
  requireWritable(run.status, user);
  await db.transaction().execute(async (trx) => {
    await q.deleteFilmCheck(trx, id);
    await log(trx, row.run_id, "film_check", id, "delete", user, stored(row), null);
  });
}

export async function runTests(runId: number): Promise<FilmTestView[]> {
  const db = await getDb();
  await runOrThrow(db, runId);
  return (await q.filmTestsOfRun(db, runId)).map(testView);
}

export async function recordTest(runId: number, input: FilmTestInput, user: SessionUser): Promise<FilmTestView> {
  const db = await getDb();
  const run = await runOrThrow(db, runId);
  requireWritable(run.status, user);
  const { kind, ...data } = input;
  const id = await db.transaction().execute(async (trx) => {
    const newId = await q.insertFilmTest(trx, {
      run_id: runId,
      kind,
      data_json: JSON.stringify(data),
      recorded_by: user.id,
      recorded_at: nowSeconds(),
    });
    await log(trx, runId, "film_test", newId, "create", user, null, input);
    return newId;
  });
  const view = (await q.filmTestsOfRun(db, runId)).find((t) => t.id === id)!;
  return testView(view);
}

export async function listGauges(): Promise<GaugeView[]> {
  const db = await getDb();
  const counts = await q.gaugeUseCounts(db);
  const today = epochToDate(nowSeconds());
  return (await q.listGaugeRows(db)).map((g) => gaugeView(g, counts.get(g.id) ?? 0, today));
}

/** A verification date as stored: a real calendar day, not after today. */
function verifiedAt(date: string | null | undefined, current: number | null): number | null {
  if (date === undefined) return current;
  if (date === null) return null;
  const s = dateToEpoch(date);
  if (!Number.isFinite(s) || epochToDate(s) !== date) {
    throw new ApiError(400, "invalid_input", "verifiedOn: That day does not exist.", { verifiedOn: "Enter a real date like 2026-12-03." });
  }
  if (s > nowSeconds()) {
    throw new ApiError(400, "invalid_input", "verifiedOn: The verification date is in the future.", { verifiedOn: "Enter the day the gauge was last verified (today or earlier)." });
  }
  return s;
}

const mappingJson = (m: GaugeInput["mapping"], current: string | null) => (m === undefined ? current : m === null ? null : JSON.stringify(m));

/** Adds a gauge, or updates the one of that name (its type, serial, verification date, CSV mapping). */
export async function saveGauge(input: GaugeInput): Promise<{ gauge: GaugeView; created: boolean }> {
  const db = await getDb();
  const existing = await q.findGaugeByName(db, input.name);
  const values = {
    name: input.name,
    gauge_type: input.gaugeType,
    serial: input.serial ?? existing?.serial ?? "",
    verified_at: verifiedAt(input.verifiedOn, existing?.verified_at ?? null),
    verify_interval_months: input.verifyIntervalMonths ?? existing?.verify_interval_months ?? 12,
    mapping_json: mappingJson(input.mapping, existing?.mapping_json ?? null),
  };
  if (existing) {
    await q.updateGauge(db, existing.id, values);
    return { gauge: await gaugeViewById(db, existing.id), created: false };
  }
  const id = await q.insertGauge(db, { ...values, created_at: nowSeconds() });
  return { gauge: await gaugeViewById(db, id), created: true };
}

export async function getGauge(id: number): Promise<GaugeView> {
  return gaugeViewById(await getDb(), id);
}

/** Changes the fields sent; `retired` archives the gauge (or brings it back), `mapping: null` forgets the CSV mapping. */
export async function updateGauge(id: number, input: GaugeUpdate): Promise<GaugeView> {
  const db = await getDb();
  const row = await q.findGauge(db, id);
  if (!row) throw new ApiError(404, "not_found", "No such gauge.");
  try {
    await q.updateGauge(db, id, {
      name: input.name ?? row.name,
      gauge_type: input.gaugeType ?? row.gauge_type,
      serial: input.serial ?? row.serial,
      verified_at: verifiedAt(input.verifiedOn, row.verified_at),
      verify_interval_months: input.verifyIntervalMonths ?? row.verify_interval_months,
      mapping_json: mappingJson(input.mapping, row.mapping_json),
      retired_at: input.retired === undefined ? row.retired_at : input.retired ? (row.retired_at ?? nowSeconds()) : null,
    });
  } catch (e) {
    if (isUniqueViolation(e)) {
      throw new ApiError(409, "conflict", `A gauge named "${input.name}" exists already.`, { name: "Choose a name no other gauge has." });
    }
    throw e;
  }
  return gaugeViewById(db, id);
}

/** Deletes a gauge no film check names; one in use is refused (409) — retire it instead. */
export async function removeGauge(id: number): Promise<void> {
  const db = await getDb();
  const row = await q.findGauge(db, id);
  if (!row) throw new ApiError(404, "not_found", "No such gauge.");
  const used = (await q.gaugeUseCounts(db)).get(id) ?? 0;
  if (used > 0) {
    throw new ApiError(409, "conflict", `${used} film check${used === 1 ? " names" : "s name"} ${row.name}: retire it instead, so those records keep their gauge.`);
  }
  await q.deleteGauge(db, id);
}

export interface TrendPoint {
  runId: number;
  date: string;
  checkId: number;
  meanUm: number;
  fractionInSpec: number;
  readingCount: number;
  specMinUm: number;
  specMaxUm: number;
}

/** Mean film and share of readings within the spec, per film check of a coating on a line, by run date. */
export async function qualityTrend(coatingId: number, lineId: number): Promise<{ points: TrendPoint[]; specMinUm: number | null; specMaxUm: number | null }> {
  const db = await getDb();
  const coating = await db.selectFrom("coatings").select(["film_min_um", "film_max_um"]).where("id", "=", coatingId).executeTakeFirst();
  if (!coating) throw new ApiError(404, "not_found", "No such coating.");
  const rows = await q.checksForTrend(db, coatingId, lineId);
  const points: TrendPoint[] = [];
  for (const r of rows) {
    const flat = flattenReadings(JSON.parse(r.readings_json) as number[] | number[][][]);
    const specMinUm = r.spec_min_um ?? coating.film_min_um;
    const specMaxUm = r.spec_max_um ?? coating.film_max_um;
    const m = mean(flat);
    const f = fractionInSpec(flat, specMinUm, specMaxUm);
    if (m === null || f === null) continue;
    points.push({ runId: r.run_id, date: epochToDate(r.run_date), checkId: r.id, meanUm: m, fractionInSpec: f, readingCount: flat.length, specMinUm, specMaxUm });
  }
  return { points, specMinUm: coating.film_min_um, specMaxUm: coating.film_max_um };
}

/**
 * Measured mean dry film (µm) of a run's coat over all its film checks' readings, or null when
 * none were taken. Used by the material forecast's actual-use feedback.
 */
export async function measuredFilmUm(db: Db, runId: string, coatIndex: number): Promise<number | null> {
  const id = Number(runId);
  if (!Number.isSafeInteger(id)) return null;
  const rows = await db
    .selectFrom("film_checks")
    .select("readings_json")
    .where("run_id", "=", id)
    .where("coat_position", "=", coatIndex)
    .execute();
  const all: number[] = [];
  for (const r of rows) all.push(...flattenReadings(JSON.parse(r.readings_json) as number[] | number[][][]));
  return mean(all);
}
