import { getDb, type Db } from "@/db/index";
import { findCoatingRow, curePointsOf } from "@/db/queries/coatings";
import {
  findLineRow,
  insertLine,
  listLineRows,
  setLineArchived,
  stagesOf,
  updateLine,
  type LineRow,
  type StageRow,
  type StageValues,
} from "@/db/queries/lines";
import { DomainError } from "@/lib/coating-math/errors";
import { cureCheck, type CureCheck, type CureCheckLine } from "@/lib/lines/cure-check";
import type { StageInput, StageKind } from "@/lib/lines/stages";
import { lineTimeline, type LineTimeline } from "@/lib/lines/timeline";
import type { CureCheckBody, LineInput } from "@/lib/validation/lines";
import type { UnitSystem } from "@/lib/coating-math/units";
import { nowSeconds, type UsageRef } from "./coatings";
import { wordsFor } from "./throughput";
import { ApiError, isUniqueViolation } from "./http";
import { runsUsingLine } from "@/db/queries/runs";
import { scenarioUsageOfLine } from "@/db/queries/scenarios";

export interface WindowMm {
  widthMm: number;
  heightMm: number;
  depthMm: number;
}

export interface StageView {
  position: number;
  name: string;
  kind: StageKind;
  lengthM: number;
  tempC: number | null;
  heatTransferCoefficientWPerM2K: number | null;
  colourChangeMin: number | null;
}

interface LineViewCommon {
  id: number;
  name: string;
  notes: string;
  hourlyCost: number;
  /** a carrier's usable window (conveyor) or each rack's (batch oven) */
  windowMm: WindowMm;
  maxLoadKg: number;
  archived: boolean;
  createdAt: number;
  updatedAt: number;
}

export interface ConveyorLineView extends LineViewCommon {
  kind: "conveyor";
  lineSpeedMinMPerMin: number;
  lineSpeedMaxMPerMin: number;
  lineSpeedNominalMPerMin: number;
  carrierPitchM: number;
  stages: StageView[];
}

export interface BatchOvenView extends LineViewCommon {
  kind: "batch";
  interiorMm: WindowMm;
  racksPerLoad: number;
  airTempC: number;
  heatTransferCoefficientWPerM2K: number;
  loadMin: number;
  unloadMin: number;
}

export type LineView = ConveyorLineView | BatchOvenView;

type UsageCheck = (db: Db, lineId: number) => Promise<UsageRef[]>;

/*
 * What refers to a line (run plans, scenarios…). Nothing does yet; each capability that stores
 * a line id adds its check to this list, in this file. DELETE is refused while any returns a row.
 */
export const lineUsageChecks: UsageCheck[] = [runsUsingLine, scenarioUsageOfLine];

export async function lineUsage(db: Db, lineId: number): Promise<UsageRef[]> {
  return (await Promise.all(lineUsageChecks.map((check) => check(db, lineId)))).flat();
}

const num = (v: number | null) => v ?? 0;

export function toLineView(l: LineRow, stages: StageRow[]): LineView {
  const common: LineViewCommon = {
    id: l.id,
    name: l.name,
    notes: l.notes,
    hourlyCost: l.hourly_cost,
    windowMm: { widthMm: l.window_width_mm, heightMm: l.window_height_mm, depthMm: l.window_depth_mm },
    maxLoadKg: l.max_load_kg,
    archived: l.archived_at !== null,
    createdAt: l.created_at,
    updatedAt: l.updated_at,
  };
  if (l.kind === "batch") {
    return {
      ...common,
      kind: "batch",
      interiorMm: { widthMm: num(l.interior_width_mm), heightMm: num(l.interior_height_mm), depthMm: num(l.interior_depth_mm) },
      racksPerLoad: num(l.racks_per_load),
      airTempC: num(l.air_temp_c),
      heatTransferCoefficientWPerM2K: num(l.heat_transfer_coefficient_w_per_m2k),
      loadMin: num(l.load_min),
      unloadMin: num(l.unload_min),
    };
  }
  return {
    ...common,
    kind: "conveyor",
    lineSpeedMinMPerMin: num(l.line_speed_min_m_per_min),
    lineSpeedMaxMPerMin: num(l.line_speed_max_m_per_min),
    lineSpeedNominalMPerMin: num(l.line_speed_nominal_m_per_min),
    carrierPitchM: num(l.carrier_pitch_m),
    stages: stages.map((s) => ({
      position: s.position,
      name: s.name,
      kind: s.kind,
      lengthM: s.length_m,
      tempC: s.temp_c,
      heatTransferCoefficientWPerM2K: s.heat_transfer_coefficient_w_per_m2k,
      colourChangeMin: s.colour_change_min,
    })),
  };
}

export async function listLines(opts: { includeArchived?: boolean } = {}): Promise<LineView[]> {
  const db = await getDb();
  const rows = await listLineRows(db, opts);
  const stages = await stagesOf(db, rows.map((r) => r.id));
  return rows.map((r) => toLineView(r, stages.filter((s) => s.line_id === r.id)));
}

export async function getLine(id: number): Promise<LineView> {
  const db = await getDb();
  const row = await findLineRow(db, id);
  if (!row) throw new ApiError(404, "not_found", "No such line.");
  return toLineView(row, await stagesOf(db, [id]));
}

/** Columns of a line from its input; the other kind's columns are cleared. */
function rowValues(v: LineInput) {
  const base = {
    name: v.name,
    kind: v.kind,
    notes: v.notes,
    hourly_cost: v.hourlyCost,
    window_width_mm: v.windowMm.widthMm,
    window_height_mm: v.windowMm.heightMm,
    window_depth_mm: v.windowMm.depthMm,
    max_load_kg: v.maxLoadKg,
    line_speed_min_m_per_min: null,
    line_speed_max_m_per_min: null,
    line_speed_nominal_m_per_min: null,
    carrier_pitch_m: null,
    interior_width_mm: null,
    interior_height_mm: null,
    interior_depth_mm: null,
    racks_per_load: null,
    air_temp_c: null,
    heat_transfer_coefficient_w_per_m2k: null,
    load_min: null,
    unload_min: null,
  };
  if (v.kind === "conveyor") {
    return {
      ...base,
      line_speed_min_m_per_min: v.lineSpeedMinMPerMin,
      line_speed_max_m_per_min: v.lineSpeedMaxMPerMin,
      line_speed_nominal_m_per_min: v.lineSpeedNominalMPerMin,
      carrier_pitch_m: v.carrierPitchM,
    };
  }
  return {
    ...base,
    interior_width_mm: v.interiorMm.widthMm,
    interior_height_mm: v.interiorMm.heightMm,
    interior_depth_mm: v.interiorMm.depthMm,
    racks_per_load: v.racksPerLoad,
    air_temp_c: v.airTempC,
    heat_transfer_coefficient_w_per_m2k: v.heatTransferCoefficientWPerM2K,
    load_min: v.loadMin,
    unload_min: v.unloadMin,
  };
}

function stageValues(v: LineInput): StageValues[] {
  if (v.kind !== "conveyor") return [];
  return v.stages.map((s) => ({
    name: s.name,
    kind: s.kind,
    length_m: s.lengthM,
    temp_c: s.tempC ?? null,
    heat_transfer_coefficient_w_per_m2k: s.heatTransferCoefficientWPerM2K ?? null,
    colour_change_min: s.colourChangeMin ?? null,
  }));
}

function nameTaken(e: unknown, name: string): never {
  if (isUniqueViolation(e)) throw new ApiError(409, "conflict", `A line named ${name} already exists.`, { name: "Choose another name." });
  throw e;
}

export async function createLine(input: LineInput): Promise<LineView> {
  const db = await getDb();
  const t = nowSeconds();
  let id: number;
  try {
    id = await insertLine(db, { ...rowValues(input), archived_at: input.archived ? t : null, created_at: t, updated_at: t }, stageValues(input));
  } catch (e) {
    nameTaken(e, input.name);
  }
  return getLine(id);
}

export async function replaceLine(id: number, input: LineInput): Promise<LineView> {
  const db = await getDb();
  const existing = await findLineRow(db, id);
  if (!existing) throw new ApiError(404, "not_found", "No such line.");
  const t = nowSeconds();
  const archived_at = input.archived === undefined ? existing.archived_at : input.archived ? (existing.archived_at ?? t) : null;
  try {
    await updateLine(db, id, { ...rowValues(input), archived_at, updated_at: t }, stageValues(input));
  } catch (e) {
    nameTaken(e, input.name);
  }
  return getLine(id);
}

/** DELETE: refused while anything uses the line (409 with the list); otherwise archived. */
export async function archiveLine(id: number): Promise<{ usedBy: UsageRef[]; line?: LineView }> {
  const db = await getDb();
  const row = await findLineRow(db, id);
  if (!row) throw new ApiError(404, "not_found", "No such line.");
  const usedBy = await lineUsage(db, id);
  if (usedBy.length) return { usedBy };
  if (row.archived_at === null) await setLineArchived(db, id, nowSeconds(), nowSeconds());
  return { usedBy, line: await getLine(id) };
}

const stageInputs = (stages: StageView[]): StageInput[] => stages.map(({ position: _p, ...s }) => s);

export type LineTimelineView = LineTimeline & { lineId: number; lineName: string };

/** The conveyor timeline at a speed (default: the line's nominal speed). */
export async function timelineFor(id: number, lineSpeedMPerMin?: number): Promise<LineTimelineView> {
  const line = await getLine(id);
  if (line.kind !== "conveyor") {
    throw new ApiError(400, "invalid_input", "A batch oven has no conveyor timeline; use the cure check for its cycle.", { id: "Choose a conveyor line." });
  }
  const t = lineTimeline({
    stages: stageInputs(line.stages),
    lineSpeedMPerMin: lineSpeedMPerMin ?? line.lineSpeedNominalMPerMin,
    carrierPitchM: line.carrierPitchM,
    speedRange: line,
  });
  return { lineId: line.id, lineName: line.name, ...t };
}

export type CureCheckView = CureCheck & {
  lineId: number;
  lineName: string;
  coating: { id: number; code: string; name: string; kind: string };
};

/** Where the pure check names its own inputs, the API names the request's field instead. */
function requestField(field: string): string {
  if (field.startsWith("coating")) return "coatingId";
  if (field.startsWith("line.")) return "line";
  return field;
}

export async function cureCheckFor(lineId: number, body: CureCheckBody, system: UnitSystem = "metric"): Promise<CureCheckView> {
  const db = await getDb();
  const line = await getLine(lineId);
  const coating = await findCoatingRow(db, body.coatingId);
  if (!coating) throw new ApiError(400, "invalid_input", "coatingId: no such coating.", { coatingId: "No such coating." });
  const schedule = (await curePointsOf(db, [coating.id])).map((p) => ({ metalTempC: p.metal_temp_c, holdMin: p.hold_min }));
  const pureLine: CureCheckLine =
    line.kind === "conveyor"
      ? { kind: "conveyor", lineSpeedMinMPerMin: line.lineSpeedMinMPerMin, lineSpeedMaxMPerMin: line.lineSpeedMaxMPerMin, stages: stageInputs(line.stages) }
      : { kind: "batch", airTempC: line.airTempC, heatTransferCoefficientWPerM2K: line.heatTransferCoefficientWPerM2K, loadMin: line.loadMin, unloadMin: line.unloadMin };
  try {
    const result = cureCheck({
      line: pureLine,
      coating: { kind: coating.kind, cureSchedule: schedule },
      thicknessMm: body.thicknessMm,
      lineSpeedMPerMin: line.kind === "conveyor" ? (body.lineSpeedMPerMin ?? line.lineSpeedNominalMPerMin) : body.lineSpeedMPerMin,
      startTempC: body.startTempC,
      words: wordsFor(system),
    });
    return {
      lineId: line.id,
      lineName: line.name,
      coating: { id: coating.id, code: coating.code, name: coating.name, kind: coating.kind },
      ...result,
    };
  } catch (e) {
    if (e instanceof DomainError) {
      const field = requestField(e.field);
      throw new ApiError(400, "invalid_input", e.message, { [field]: e.message });
    }
    throw e;
  }
}

/**
 * Stores a measured heat-transfer coefficient on one oven (oven profiles calibrate the heat-up
 * model with it): the stage at `stagePosition` of a conveyor line, or a batch oven's own value
 * when the position is null. `expectStageName` is the stage's name when the profile was measured:
 * a stage list edited since then answers 409 instead of writing onto another stage. Pass a
 * transaction as `db` to record the change beside it. Returns the value replaced.
 */
export async function storeOvenHeatTransfer(
  db: Db,
  lineId: number,
  stagePosition: number | null,
  expectStageName: string,
  heatTransferCoefficientWPerM2K: number,
): Promise<{ beforeWPerM2K: number | null; ovenName: string }> {
  const h = heatTransferCoefficientWPerM2K;
  if (!(h > 0 && h <= 1000)) {
    throw new ApiError(400, "invalid_input", "The heat-transfer coefficient must be greater than 0 and at most 1000 W/m²K.", { heatTransferCoefficientWPerM2K: "must be greater than 0 and at most 1000 W/m²K" });
  }
  const line = await findLineRow(db, lineId);
  if (!line) throw new ApiError(404, "not_found", "No such line.");
  const t = nowSeconds();
  if (stagePosition === null) {
    if (line.kind !== "batch") throw new ApiError(409, "conflict", `${line.name} is no longer a batch oven; the profile's oven cannot be found.`);
    await db.updateTable("lines").set({ heat_transfer_coefficient_w_per_m2k: h, updated_at: t }).where("id", "=", lineId).execute();
    return { beforeWPerM2K: line.heat_transfer_coefficient_w_per_m2k, ovenName: line.name };
  }
  const stage = (await stagesOf(db, [lineId])).find((s) => s.position === stagePosition);
  if (!stage || line.kind !== "conveyor" || (stage.kind !== "cure-oven" && stage.kind !== "dry-off") || stage.name !== expectStageName) {
    throw new ApiError(
      409,
      "conflict",
      `The stages of ${line.name} have changed since this profile was measured: stage ${stagePosition + 1} is ${stage ? `now "${stage.name}"` : "gone"}, not the oven "${expectStageName}". Nothing was stored.`,
    );
  }
  await db.updateTable("line_stages").set({ heat_transfer_coefficient_w_per_m2k: h }).where("id", "=", stage.id).execute();
  await db.updateTable("lines").set({ updated_at: t }).where("id", "=", lineId).execute();
  return { beforeWPerM2K: stage.heat_transfer_coefficient_w_per_m2k, ovenName: stage.name };
}
