/**
 * Oven profiles: logger files read and mapped (lib/profiles), stored against a line's oven,
 * judged against a coating's cure schedule, and used to calibrate the oven's heat-transfer
 * coefficient (stored through lib/server/lines.ts, with a history of every change).
 */
import { getDb, type Db } from "@/db/index";
import { curePointsOf, findCoatingRow, type CoatingRow } from "@/db/queries/coatings";
import { findLineRow, stagesOf, type LineRow, type StageRow } from "@/db/queries/lines";
import {
  deleteProfile as deleteProfileRow,
  findLoggerByName,
  findLoggerRow,
  findProfileRow,
  fitsOfOven,
  insertFit,
  insertProfile,
  listLoggerRows,
  listProfileRows,
  upsertLogger,
  userNames,
  type ProfileRow,
} from "@/db/queries/profiles";
import type { CurePoint } from "@/lib/coating-math/cure";
import { DomainError } from "@/lib/coating-math/errors";
import { readCsvTable, type CsvTable } from "@/lib/profiles/csv-table";
import { DEFAULT_MIN_DELTA_K, fitHeatTransfer, STEEL } from "@/lib/profiles/fit";
import { mapProfile, suggestMapping, type ColumnMapping, type ProfileSeries } from "@/lib/profiles/mapping";
import { ProfileInputError, type ProfileProblem } from "@/lib/profiles/problems";
import { probeVerdict, verdictReasons, type ProbeVerdict } from "@/lib/profiles/verdict";
import type { SessionUser } from "@/lib/server/session";
import type { LoggerBody, ProfileCreateBody, ProfilePreviewBody } from "@/lib/validation/profiles";
import { nowSeconds } from "./coatings";
import { ApiError } from "./http";
import { storeOvenHeatTransfer } from "./lines";

/** Points sent for the chart; verdicts and fits always use every reading. */
const CHART_POINTS = 1200;
const PREVIEW_ROWS = 12;
const PREVIEW_MAX_ROWS = 40;

export interface LoggerView {
  id: number;
  name: string;
  mapping: ColumnMapping;
  updatedAt: number;
}

export interface PreviewRow {
  row: number;
  cells: string[];
}

export interface ProfilePreview {
  ok: boolean;
  header: string[];
  headerRow: number;
  skippedLines: number;
  delimiter: string;
  rowCount: number;
  /** the mapping checked: the one sent, else the logger's remembered one, else a guess */
  mapping: ColumnMapping | null;
  mappingSource: "sent" | "logger" | "suggested" | null;
  suggested: ColumnMapping | null;
  problems: ProfileProblem[];
  /** the first rows and the rows with bad cells */
  rows: PreviewRow[];
  summary: {
    durationS: number;
    sampleCount: number;
    airPeakC: number;
    probes: { label: string; thicknessMm: number; startC: number; peakC: number }[];
  } | null;
}

export interface OvenView {
  lineId: number;
  lineName: string;
  lineKind: "conveyor" | "batch";
  /** null for a batch oven */
  stagePosition: number | null;
  /** the oven's name when the profile was imported */
  stageName: string;
  /** the oven as it is now; null when the stage list no longer has it */
  current: { name: string; airTempC: number | null; heatTransferCoefficientWPerM2K: number | null } | null;
}

export interface FitView {
  heatTransferCoefficientWPerM2K: number;
  samplesUsed: number;
  rmsK: number;
  timeConstantMin: number;
  biotNumber: number;
  warnings: string[];
}

export interface ProbeResult {
  index: number;
  label: string;
  column: string;
  thicknessMm: number;
  verdict: ProbeVerdict | null;
  /** the verdict in sentences (metric); the screen words it in the user's units */
  reasons: string[];
  fit: FitView | null;
  /** why there is no fit for this probe */
  fitError: string | null;
}

export interface FitHistoryView {
  id: number;
  profileId: number | null;
  profileName: string;
  probeLabel: string;
  thicknessMm: number;
  beforeWPerM2K: number | null;
  afterWPerM2K: number;
  rmsK: number;
  appliedBy: string | null;
  appliedAt: number;
}

export interface ProfileCoating {
  id: number;
  code: string;
  name: string;
  kind: "powder" | "e-coat";
  cureSchedule: CurePoint[];
}

export interface ProfileDetail {
  id: number;
  name: string;
  oven: OvenView;
  /** the coating chosen at import */
  coatingId: number;
  /** the coating judged now (?coatingId= may pick another) */
  coating: ProfileCoating;
  runId: string | null;
  logger: { id: number; name: string } | null;
  fileName: string;
  measuredOn: string | null;
  notes: string;
  overbakeMarginK: number;
  /** highest schedule point + margin */
  overbakeLimitC: number | null;
  sampleCount: number;
  durationS: number;
  createdAt: number;
  createdBy: string | null;
  mapping: ColumnMapping;
  probes: ProbeResult[];
  /** at most CHART_POINTS readings, with each probe's fitted model */
  chart: { timeS: number[]; airC: number[]; probes: { tempsC: number[]; modelC: number[] | null }[] };
  fitHistory: FitHistoryView[];
  assumptions: { densityKgPerM3: number; specificHeatJPerKgK: number; minDeltaK: number };
}

export interface ProfileSummary {
  id: number;
  name: string;
  lineId: number;
  lineName: string;
  stageName: string;
  coatingCode: string;
  runId: string | null;
  loggerName: string | null;
  measuredOn: string | null;
  createdAt: number;
  sampleCount: number;
  durationS: number;
  probes: { label: string; thicknessMm: number; pass: boolean | null; cureIndex: number | null; underCured: boolean; overbaked: boolean }[];
}

const parseMapping = (json: string): ColumnMapping => JSON.parse(json) as ColumnMapping;
const parseSeries = (json: string): ProfileSeries => JSON.parse(json) as ProfileSeries;

function loggerView(r: { id: number; name: string; mapping_json: string; updated_at: number }): LoggerView {
  return { id: r.id, name: r.name, mapping: parseMapping(r.mapping_json), updatedAt: r.updated_at };
}

export async function listLoggers(): Promise<LoggerView[]> {
  return (await listLoggerRows(await getDb())).map(loggerView);
}

/** Remembers a mapping under the logger's name (creates the logger on first use). */
export async function saveLogger(body: LoggerBody): Promise<{ logger: LoggerView; created: boolean }> {
  const db = await getDb();
  const { id, created } = await upsertLogger(db, body.name, JSON.stringify(body.mapping), nowSeconds());
  return { logger: loggerView((await findLoggerRow(db, id))!), created };
}

/** Reads the file; an unreadable one is a single problem on `csv`. */
function readTable(csv: string): { table: CsvTable | null; problems: ProfileProblem[] } {
  try {
    return { table: readCsvTable(csv), problems: [] };
  } catch (e) {
    if (e instanceof DomainError) return { table: null, problems: [{ field: "csv", message: e.message }] };
    throw e;
  }
}

function mappingFits(table: CsvTable, m: ColumnMapping): boolean {
  const cols = new Set(table.header);
  return [m.timeColumn, m.airColumn, ...m.probes.map((p) => p.column)].every((c) => c !== null && cols.has(c));
}

/** Checks a file and a mapping without storing anything: the wizard's preview with its bad cells. */
export async function previewProfile(body: ProfilePreviewBody): Promise<ProfilePreview> {
  const { table, problems: readProblems } = readTable(body.csv);
  if (!table) {
    return { ok: false, header: [], headerRow: 0, skippedLines: 0, delimiter: ",", rowCount: 0, mapping: null, mappingSource: null, suggested: null, problems: readProblems, rows: [], summary: null };
  }
  const suggested = suggestMapping(table);
  let mapping: ColumnMapping = suggested;
  let mappingSource: ProfilePreview["mappingSource"] = "suggested";
  if (body.mapping) {
    mapping = body.mapping;
    mappingSource = "sent";
  } else if (body.loggerName) {
    const logger = await findLoggerByName(await getDb(), body.loggerName);
    const remembered = logger ? parseMapping(logger.mapping_json) : null;
    if (remembered && mappingFits(table, remembered)) {
      mapping = remembered;
      mappingSource = "logger";
    }
  }
  const { series, problems } = mapProfile(table, mapping);
  const badRows = new Set(problems.flatMap((p) => (p.row === undefined ? [] : [p.row])));
  const rows = table.rows
    .filter((r, i) => i < PREVIEW_ROWS || badRows.has(r.line))
    .slice(0, PREVIEW_MAX_ROWS)
    .map((r) => ({ row: r.line, cells: r.cells }));
  return {
    ok: problems.length === 0,
    header: table.header,
    headerRow: table.headerLine,
    skippedLines: table.skippedLines,
    delimiter: table.delimiter,
    rowCount: table.rows.length,
    mapping,
    mappingSource,
    suggested,
    problems,
    rows,
    summary: series
      ? {
          durationS: series.timeS[series.timeS.length - 1],
          sampleCount: series.timeS.length,
          airPeakC: Math.max(...series.airC),
          probes: series.probes.map((p) => ({ label: p.label, thicknessMm: p.thicknessMm, startC: p.tempsC[0], peakC: Math.max(...p.tempsC) })),
        }
      : null,
  };
}

interface ResolvedOven {
  line: LineRow;
  stage: StageRow | null;
  name: string;
}

/** The oven a profile is attached to; input errors name the request field. */
async function resolveOven(db: Db, lineId: number, stagePosition: number | null): Promise<ResolvedOven> {
  const line = await findLineRow(db, lineId);
  if (!line) throw new ApiError(400, "invalid_input", "lineId: no such line.", { lineId: "No such line." });
  if (line.kind === "batch") {
    if (stagePosition !== null) {
      throw new ApiError(400, "invalid_input", "stagePosition: a batch oven has no stages; send null.", { stagePosition: "A batch oven has no stages; leave it empty." });
    }
    return { line, stage: null, name: line.name };
  }
  const stages = await stagesOf(db, [lineId]);
  const stage = stagePosition === null ? undefined : stages.find((s) => s.position === stagePosition);
  if (!stage || (stage.kind !== "cure-oven" && stage.kind !== "dry-off")) {
    const ovens = stages.filter((s) => s.kind === "cure-oven" || s.kind === "dry-off").map((s) => `${s.position} (${s.name})`);
    throw new ApiError(400, "invalid_input", `stagePosition: choose one of ${line.name}'s ovens: ${ovens.join(", ")}.`, {
      stagePosition: `Choose an oven stage of ${line.name}: ${ovens.join(", ")}.`,
    });
  }
  return { line, stage, name: stage.name };
}

async function coatingWithSchedule(db: Db, coatingId: number, field: string): Promise<{ row: CoatingRow; schedule: CurePoint[] }> {
  const row = await findCoatingRow(db, coatingId);
  if (!row) throw new ApiError(400, "invalid_input", `${field}: no such coating.`, { [field]: "No such coating." });
  const schedule = (await curePointsOf(db, [coatingId])).map((p) => ({ metalTempC: p.metal_temp_c, holdMin: p.hold_min }));
  if (!schedule.length) throw new ApiError(400, "invalid_input", `${field}: the coating has no cure schedule.`, { [field]: "This coating has no cure schedule points." });
  return { row, schedule };
}

/** Stores a profile when the file and mapping are valid; otherwise throws ProfileInputError with every problem. */
export async function createProfile(body: ProfileCreateBody, user: SessionUser): Promise<ProfileDetail> {
  const db = await getDb();
  const oven = await resolveOven(db, body.lineId, body.stagePosition);
  await coatingWithSchedule(db, body.coatingId, "coatingId");
  const { table, problems: readProblems } = readTable(body.csv);
  if (!table) throw new ProfileInputError(readProblems);
  const { series, problems } = mapProfile(table, body.mapping);
  if (!series) throw new ProfileInputError(problems);
  const t = nowSeconds();
  const loggerName = body.loggerName?.trim() || null;
  // the mapping is stored with the labels the series uses (an empty label means the column's name)
  const mapping: ColumnMapping = { ...body.mapping, probes: body.mapping.probes.map((p) => ({ ...p, label: p.label.trim() || p.column })) };
  const id = await db.transaction().execute(async (trx) => {
    const logger = loggerName ? await upsertLogger(trx, loggerName, JSON.stringify(mapping), t) : null;
    return insertProfile(trx, {
      name: body.name,
      line_id: oven.line.id,
      stage_position: oven.stage?.position ?? null,
      stage_name: oven.name,
      coating_id: body.coatingId,
      run_id: body.runId?.trim() || null,
      logger_id: logger?.id ?? null,
      file_name: body.fileName,
      measured_on: body.measuredOn ?? null,
      notes: body.notes,
      overbake_margin_k: body.overbakeMarginK,
      sample_count: series.timeS.length,
      duration_s: series.timeS[series.timeS.length - 1],
      probe_count: series.probes.length,
      mapping_json: JSON.stringify(mapping),
      series_json: JSON.stringify(series),
      created_by: user.id,
      created_at: t,
    });
  });
  return getProfile(id);
}

function verdictOf(series: ProfileSeries, tempsC: number[], schedule: CurePoint[], overbakeLimitC: number | null, marginK: number) {
  try {
    const verdict = probeVerdict({ timeS: series.timeS, metalC: tempsC, schedule, overbakeLimitC });
    return { verdict, reasons: verdictReasons(verdict, undefined, marginK) };
  } catch (e) {
    if (e instanceof DomainError) return { verdict: null, reasons: [e.message] };
    throw e;
  }
}

function overbakeLimit(schedule: CurePoint[], marginK: number): number | null {
  return schedule.length ? Math.max(...schedule.map((p) => p.metalTempC)) + marginK : null;
}

function strideIndices(n: number, max: number): number[] {
  if (n <= max) return Array.from({ length: n }, (_, i) => i);
  const step = (n - 1) / (max - 1);
  return Array.from({ length: max }, (_, k) => Math.round(k * step));
}

async function ovenView(db: Db, row: ProfileRow): Promise<OvenView> {
  const line = (await findLineRow(db, row.line_id))!;
  let current: OvenView["current"] = null;
  if (row.stage_position === null) {
    if (line.kind === "batch") current = { name: line.name, airTempC: line.air_temp_c, heatTransferCoefficientWPerM2K: line.heat_transfer_coefficient_w_per_m2k };
  } else {
    const stage = (await stagesOf(db, [line.id])).find((s) => s.position === row.stage_position);
    if (stage && stage.name === row.stage_name && (stage.kind === "cure-oven" || stage.kind === "dry-off")) {
      current = { name: stage.name, airTempC: stage.temp_c, heatTransferCoefficientWPerM2K: stage.heat_transfer_coefficient_w_per_m2k };
    }
  }
  return { lineId: line.id, lineName: line.name, lineKind: line.kind, stagePosition: row.stage_position, stageName: row.stage_name, current };
}

async function fitHistory(db: Db, lineId: number, stagePosition: number | null): Promise<FitHistoryView[]> {
  return (await fitsOfOven(db, lineId, stagePosition)).map((f) => ({
    id: f.id,
    profileId: f.profile_id,
    profileName: f.profile_name,
    probeLabel: f.probe_label,
    thicknessMm: f.thickness_mm,
    beforeWPerM2K: f.h_before_w_per_m2k,
    afterWPerM2K: f.h_after_w_per_m2k,
    rmsK: f.rms_k,
    appliedBy: f.applied_by_name ?? null,
    appliedAt: f.applied_at,
  }));
}

function fitProbe(series: ProfileSeries, k: number) {
  const p = series.probes[k];
  try {
    return { fit: fitHeatTransfer({ timeS: series.timeS, airC: series.airC, metalC: p.tempsC, thicknessMm: p.thicknessMm }), error: null };
  } catch (e) {
    if (e instanceof DomainError) return { fit: null, error: e.message };
    throw e;
  }
}

/** One profile with its verdict per probe (against its coating, or `judgeCoatingId`) and its fits. */
export async function getProfile(id: number, judgeCoatingId?: number): Promise<ProfileDetail> {
  const db = await getDb();
  const row = await findProfileRow(db, id);
  if (!row) throw new ApiError(404, "not_found", "No such profile.");
  const { row: coating, schedule } = await coatingWithSchedule(db, judgeCoatingId ?? row.coating_id, "coatingId");
  const series = parseSeries(row.series_json);
  const limit = overbakeLimit(schedule, row.overbake_margin_k);
  const fits = series.probes.map((_, k) => fitProbe(series, k));
  const probes: ProbeResult[] = series.probes.map((p, k) => {
    const { verdict, reasons } = verdictOf(series, p.tempsC, schedule, limit, row.overbake_margin_k);
    const { fit, error } = fits[k];
    return {
      index: k,
      label: p.label,
      column: p.column,
      thicknessMm: p.thicknessMm,
      verdict,
      reasons,
      fit: fit && {
        heatTransferCoefficientWPerM2K: fit.heatTransferCoefficientWPerM2K,
        samplesUsed: fit.samplesUsed,
        rmsK: fit.rmsK,
        timeConstantMin: fit.timeConstantMin,
        biotNumber: fit.biotNumber,
        warnings: fit.warnings,
      },
      fitError: error,
    };
  });
  const at = strideIndices(series.timeS.length, CHART_POINTS);
  const logger = row.logger_id === null ? null : await findLoggerRow(db, row.logger_id);
  const creator = row.created_by ? (await userNames(db, [row.created_by]))[0] : undefined;
  return {
    id: row.id,
    name: row.name,
    oven: await ovenView(db, row),
    coatingId: row.coating_id,
    coating: { id: coating.id, code: coating.code, name: coating.name, kind: coating.kind, cureSchedule: schedule },
    runId: row.run_id,
    logger: logger ? { id: logger.id, name: logger.name } : null,
    fileName: row.file_name,
    measuredOn: row.measured_on,
    notes: row.notes,
    overbakeMarginK: row.overbake_margin_k,
    overbakeLimitC: limit,
    sampleCount: row.sample_count,
    durationS: row.duration_s,
    createdAt: row.created_at,
    createdBy: creator?.name ?? null,
    mapping: parseMapping(row.mapping_json),
    probes,
    chart: {
      timeS: at.map((i) => series.timeS[i]),
      airC: at.map((i) => series.airC[i]),
      probes: series.probes.map((p, k) => ({ tempsC: at.map((i) => p.tempsC[i]), modelC: fits[k].fit ? at.map((i) => fits[k].fit!.modelC[i]) : null })),
    },
    fitHistory: await fitHistory(db, row.line_id, row.stage_position),
    assumptions: { densityKgPerM3: STEEL.densityKgPerM3, specificHeatJPerKgK: STEEL.specificHeatJPerKgK, minDeltaK: DEFAULT_MIN_DELTA_K },
  };
}

/** Every profile (newest first), each probe judged against the profile's own coating. */
export async function listProfiles(filter: { lineId?: number } = {}): Promise<ProfileSummary[]> {
  const db = await getDb();
  const rows = await listProfileRows(db, filter);
  const lineIds = [...new Set(rows.map((r) => r.line_id))];
  const coatingIds = [...new Set(rows.map((r) => r.coating_id))];
  const [lines, coatings, points, loggers] = await Promise.all([
    lineIds.length ? db.selectFrom("lines").select(["id", "name"]).where("id", "in", lineIds).execute() : [],
    coatingIds.length ? db.selectFrom("coatings").select(["id", "code"]).where("id", "in", coatingIds).execute() : [],
    curePointsOf(db, coatingIds),
    listLoggerRows(db),
  ]);
  return rows.map((r) => {
    const schedule = points.filter((p) => p.coating_id === r.coating_id).map((p) => ({ metalTempC: p.metal_temp_c, holdMin: p.hold_min }));
    const series = parseSeries(r.series_json);
    const limit = overbakeLimit(schedule, r.overbake_margin_k);
    return {
      id: r.id,
      name: r.name,
      lineId: r.line_id,
      lineName: lines.find((l) => l.id === r.line_id)?.name ?? "",
      stageName: r.stage_name,
      coatingCode: coatings.find((c) => c.id === r.coating_id)?.code ?? "",
      runId: r.run_id,
      loggerName: loggers.find((l) => l.id === r.logger_id)?.name ?? null,
      measuredOn: r.measured_on,
      createdAt: r.created_at,
      sampleCount: r.sample_count,
      durationS: r.duration_s,
      probes: series.probes.map((p) => {
        const { verdict } = schedule.length ? verdictOf(series, p.tempsC, schedule, limit, r.overbake_margin_k) : { verdict: null };
        return {
          label: p.label,
          thicknessMm: p.thicknessMm,
          pass: verdict?.pass ?? null,
          cureIndex: verdict?.cureIndex ?? null,
          underCured: verdict?.underCured ?? false,
          overbaked: verdict?.overbaked ?? false,
        };
      }),
    };
  });
}

export async function removeProfile(id: number): Promise<void> {
  const db = await getDb();
  if (!(await deleteProfileRow(db, id))) throw new ApiError(404, "not_found", "No such profile.");
}

export interface AppliedFit {
  oven: OvenView;
  fit: FitHistoryView;
}

/**
 * Stores one probe's fitted h on the profile's oven, so every cure check and throughput figure
 * for the line uses the measured oven, and records the change in the history.
 */
export async function applyFit(id: number, probeIndex: number, user: SessionUser): Promise<AppliedFit> {
  const db = await getDb();
  const row = await findProfileRow(db, id);
  if (!row) throw new ApiError(404, "not_found", "No such profile.");
  const series = parseSeries(row.series_json);
  const probe = series.probes[probeIndex];
  if (!probe) {
    throw new ApiError(400, "invalid_input", `probeIndex: this profile has ${series.probes.length} part probes (0–${series.probes.length - 1}).`, {
      probeIndex: `Choose a probe from 0 to ${series.probes.length - 1}.`,
    });
  }
  const { fit, error } = fitProbe(series, probeIndex);
  if (!fit) throw new ApiError(400, "invalid_input", `probeIndex: no fit for probe "${probe.label}": ${error}`, { probeIndex: error! });
  const h = fit.heatTransferCoefficientWPerM2K;
  const t = nowSeconds();
  const fitId = await db.transaction().execute(async (trx) => {
    const { beforeWPerM2K } = await storeOvenHeatTransfer(trx, row.line_id, row.stage_position, row.stage_name, h);
    return insertFit(trx, {
      line_id: row.line_id,
      stage_position: row.stage_position,
      stage_name: row.stage_name,
      profile_id: row.id,
      profile_name: row.name,
      probe_label: probe.label,
      thickness_mm: probe.thicknessMm,
      h_before_w_per_m2k: beforeWPerM2K,
      h_after_w_per_m2k: h,
      rms_k: fit.rmsK,
      applied_by: user.id,
      applied_at: t,
    });
  });
  const history = await fitHistory(db, row.line_id, row.stage_position);
  return { oven: await ovenView(db, row), fit: history.find((f) => f.id === fitId)! };
}
