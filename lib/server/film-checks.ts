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
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { ApiError } from "./http";
import { dateToEpoch, epochToDate, nowSeconds } from "./coatings";
import type { SessionUser } from "./session";
import type { FilmCheckInput, FilmTestInput, GaugeInput } from "@/lib/validation/film-checks";

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
}

export interface RunFilmChecks {
  run: { id: number; status: string; partNumber: string; partName: string; lineName: string; date: string; locked: boolean };
  coats: CoatSpec[];
  checks: FilmCheckView[];
  tests: FilmTestView[];
  log: LogView[];
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

/** Records of a done run are kept: only an admin may change them. */
function requireWritable(status: string, user: SessionUser): void {
  if (status === "done" && user.role !== "admin") {
    throw new ApiError(409, "conflict", "This run is done: its film records are kept and only an admin may change them.");
  }
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

function gaugeView(g: q.GaugeRow): GaugeView {
  return {
    id: g.id,
    name: g.name,
    gaugeType: g.gauge_type,
    serial: g.serial,
    verifiedOn: g.verified_at === null ? null : epochToDate(g.verified_at),
    mapping: g.mapping_json ? (JSON.parse(g.mapping_json) as CsvMapping) : null,
  };
}

export async function runFilmChecks(runId: number, user: SessionUser): Promise<RunFilmChecks> {
  const db = await getDb();
  const run = await runOrThrow(db, runId);
  const coats = await coatSpecs(db, runId);
  const byIndex = new Map(coats.map((c) => [c.coatIndex, c]));
  const checks = (await q.filmChecksOfRun(db, runId)).map((r) => checkView(r, byIndex.get(r.coat_position), user.unitSystem));
  const tests = (await q.filmTestsOfRun(db, runId)).map(testView);
  const log = (await q.filmLogOfRun(db, runId)).map((l) => ({
    id: l.id,
    entity: l.entity,
    entityId: l.entity_id,
    action: l.action,
    userName: l.user_name,
    at: l.at,
    old: l.old_json ? (JSON.parse(l.old_json) as unknown) : null,
    new: l.new_json ? (JSON.parse(l.new_json) as unknown) : null,
  }));
  return {
    run: {
      id: run.id,
      status: run.status,
      partNumber: run.part_number,
      partName: run.part_name,
      lineName: run.line_name,
      date: epochToDate(run.run_date),
      locked: run.status === "done" && user.role !== "admin",
    },
    coats,
    checks,
    tests,
    log,
  };
}

/** The stored form of an input, checked against the run and judged once so impossible input is 400. */
async function prepare(db: Db, runId: number, input: FilmCheckInput) {
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
  if (input.gaugeId != null && !(await q.findGauge(db, input.gaugeId))) {
    throw new ApiError(400, "invalid_input", "No such gauge.", { gaugeId: "Choose a gauge from the list." });
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
  const values = await prepare(db, row.run_id, input);
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
  return (await q.listGaugeRows(await getDb())).map(gaugeView);
}

/** Adds a gauge, or updates the one of that name (its type, serial, verification date, CSV mapping). */
export async function saveGauge(input: GaugeInput): Promise<{ gauge: GaugeView; created: boolean }> {
  const db = await getDb();
  const existing = await q.findGaugeByName(db, input.name);
  const values = {
    name: input.name,
    gauge_type: input.gaugeType,
    serial: input.serial ?? existing?.serial ?? "",
    verified_at: input.verifiedOn === undefined ? (existing?.verified_at ?? null) : input.verifiedOn === null ? null : dateToEpoch(input.verifiedOn),
    mapping_json: input.mapping === undefined ? (existing?.mapping_json ?? null) : input.mapping === null ? null : JSON.stringify(input.mapping),
  };
  if (existing) {
    await q.updateGauge(db, existing.id, values);
    return { gauge: gaugeView((await q.findGauge(db, existing.id))!), created: false };
  }
  const id = await q.insertGauge(db, { ...values, created_at: nowSeconds() });
  return { gauge: gaugeView((await q.findGauge(db, id))!), created: true };
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
