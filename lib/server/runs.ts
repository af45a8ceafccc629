/**
 * Runs service: reads runs with their part, line and coatings, plans them with the pure
 * lib/runs/plan-run.ts, stores them (run and coats in one transaction), moves them through their
 * statuses, and builds a line's day board.
 */
import { getDb, type Db } from "@/db/index";
import { curePointsOf, listCoatingRows } from "@/db/queries/coatings";
import { listLineRows, stagesOf } from "@/db/queries/lines";
import { getPlantSettings } from "@/db/queries/plant-settings";
import { findRackPlanFor, rackPlansForParts, type RackPlanRow } from "@/db/queries/rack-plans";
import {
  coatsOf,
  deleteDraftRun,
  findPartForRun,
  freezeRunPlan,
  findRunRow,
  insertRun,
  listPartsForRuns,
  listRunRows,
  partsForRuns,
  setRunStatus,
  setSequences,
  unfrozenRunRows,
  updateRun,
  type RunCoatRow,
  type RunCoatValues,
  type RunListRow,
  type RunPartRow,
} from "@/db/queries/runs";
import { DomainError } from "@/lib/coating-math/errors";
import { formatSignificant } from "@/lib/coating-math/units";
import { formatQuantity, type UnitSystem } from "@/lib/coating-math/display-units";
import { daysBetween, MAX_HORIZON_DAYS } from "@/lib/forecast/forecast";
import { cureKey, proposeOrder, scheduleBoard, type BoardSchedule, type BoardSlot, type ColourChange } from "@/lib/runs/board";
import { runRackingReason } from "@/lib/runs/racking-reason";
import { planRun, type PlanCoating, type PlanPart, type PlanRunInput, type RunPlan } from "@/lib/runs/plan-run";
import { canTransition, isEditable, occupiesLine, RUN_STATUS_LABELS, RUN_TRANSITIONS, type RunStatus } from "@/lib/runs/status";
import type { RackOrientation } from "@/lib/rack/types";
import type { BoardOrder, RunInput } from "@/lib/validation/runs";
import { dateToEpoch, epochToDate, nowSeconds, toCoatingView, type CoatingView } from "./coatings";
import { utilisationEstimate } from "./feedback";
import { buildForecast } from "./forecast";
import { ApiError } from "./http";
import { toLineView, type LineView } from "./lines";
import { savedPlanKey, savedRackingOf, type SavedRacking } from "./rack-plans";
import type { SessionUser } from "./session";

export interface RunPartView {
  id: string;
  number: string;
  name: string;
  customer: string;
  material: string;
  thicknessMm: number;
  massKg: number;
  areaM2: number;
  insideAreaM2: number;
  maskedAreaM2: number;
  lengthMm: number;
  widthMm: number;
  heightMm: number;
  meshId: string | null;
  archived: boolean;
}

export interface RunCoatView {
  position: number;
  coatingId: number;
  filmUm: number;
  firstPassEfficiency: number | null;
  reclaimEfficiency: number | null;
  coating: { code: string; name: string; kind: "powder" | "e-coat"; colourName: string; swatchHex: string; archived: boolean } | null;
}

export interface PlanProblem {
  field: string;
  message: string;
}

interface RunViewBase {
  id: number;
  status: RunStatus;
  date: string;
  shift: number;
  sequence: number;
  quantity: number;
  partId: string;
  part: RunPartView | null;
  lineId: number;
  line: { id: number; name: string; kind: "conveyor" | "batch" };
  /** as stored: null means the line's nominal speed */
  lineSpeedMPerMin: number | null;
  clearanceMm: number;
  orientations: "any" | "upright";
  orientation: RackOrientation | null;
  partsPerCarrierOverride: number | null;
  coats: RunCoatView[];
  masking: string;
  notes: string;
  createdAt: number;
  updatedAt: number;
  /** statuses this run may move to */
  nextStatuses: RunStatus[];
  editable: boolean;
  /** why the stored run no longer plans (a line or coating changed under it), or null */
  planError: PlanProblem | null;
  /** when the plan was frozen (the run started or was cancelled), epoch s; null: planned on read */
  planFrozenAt: number | null;
}

export interface RunSummary {
  partsPerCarrier: number;
  carriers: number;
  lineTimeMin: number;
  materialKg: number;
  /** per coating, in coat order: e-coat paint and powder are stocked and bought apart */
  materials: { code: string; kind: "powder" | "e-coat"; kg: number }[];
  costPerPart: number;
  runCost: number;
  cures: boolean;
  warnings: number;
}

/** A run in a list: its numbers summed up. */
export interface RunListItem extends RunViewBase {
  summary: RunSummary | null;
}

/** One run with its full plan and the line it runs on. */
export interface RunDetail extends RunViewBase {
  plan: RunPlan | null;
  lineView: LineView;
  /** the plan's warnings and, when the run ends past its shift, that one too */
  warnings: string[];
  /** the racking sentence in the reader's units (the plan's own is metric) */
  rackingReason: string | null;
}

export interface SavedRun {
  run: RunDetail;
  /** things to look at; the run is saved anyway */
  warnings: string[];
}

interface Context {
  lines: Map<number, LineView>;
  coatings: Map<number, CoatingView>;
  parts: Map<string, RunPartRow>;
  /** saved racking plans of these parts, keyed savedPlanKey(partId, lineId) */
  savedPlans: Map<string, RackPlanRow>;
}

async function loadContext(db: Db, partIds: string[]): Promise<Context> {
  const [lineRows, coatingRows, parts, savedPlans] = await Promise.all([
    listLineRows(db, { includeArchived: true }),
    listCoatingRows(db, { includeArchived: true }),
    partsForRuns(db, [...new Set(partIds)]),
    rackPlansForParts(db, [...new Set(partIds)]),
  ]);
  const [stages, points] = await Promise.all([stagesOf(db, lineRows.map((l) => l.id)), curePointsOf(db, coatingRows.map((c) => c.id))]);
  return {
    lines: new Map(lineRows.map((l) => [l.id, toLineView(l, stages.filter((s) => s.line_id === l.id))])),
    // lots are not needed to plan; the view's stock fields stay empty here
    coatings: new Map(coatingRows.map((c) => [c.id, toCoatingView(c, points.filter((p) => p.coating_id === c.id), [])])),
    parts: new Map(parts.map((p) => [p.id, p])),
    savedPlans: new Map(savedPlans.map((r) => [savedPlanKey(r.part_id, r.line_id), r])),
  };
}

export function toPartView(p: RunPartRow): RunPartView {
  return {
    id: p.id,
    number: p.number,
    name: p.name,
    customer: p.customer,
    material: p.material,
    thicknessMm: p.thickness_mm,
    massKg: p.mass_kg,
    areaM2: p.area_m2,
    insideAreaM2: p.inside_area_m2,
    maskedAreaM2: p.masked_area_m2,
    lengthMm: p.length_mm,
    widthMm: p.width_mm,
    heightMm: p.height_mm,
    meshId: p.mesh_id,
    archived: p.archived === 1,
  };
}

export function planPartOf(p: RunPartView): PlanPart {
  return {
    number: p.number,
    name: p.name,
    lengthMm: p.lengthMm,
    widthMm: p.widthMm,
    heightMm: p.heightMm,
    massKg: p.massKg,
    areaM2: p.areaM2,
    insideAreaM2: p.insideAreaM2,
    maskedAreaM2: p.maskedAreaM2,
    thicknessMm: p.thicknessMm,
  };
}

interface StoredRun {
  quantity: number;
  lineSpeedMPerMin: number | null;
  clearanceMm: number;
  orientations: "any" | "upright";
  orientation: RackOrientation | null;
  partsPerCarrierOverride: number | null;
  coats: { coatingId: number; filmUm: number; firstPassEfficiency: number | null; reclaimEfficiency: number | null }[];
}

/** Measured powder utilisation per line × coating, keyed `lineId:coatingId` (only those with a measured figure). */
type MeasuredMap = Map<string, { utilization: number; runs: number }>;
const measuredKey = (lineId: number, coatingId: number) => `${lineId}:${coatingId}`;

/**
 * The measured utilisation of each powder line × coating pair from the actual-use records:
 * non-null from MIN_RUNS_FOR_MEASURED recorded runs on (lib/server/feedback.ts). A mean outside
 * (0, 1] (bad weighings confirmed anyway) is left out, so the plan falls back to the nominal figure.
 */
async function measuredUtilisations(db: Db, pairs: { lineId: number; coatingId: number }[], coatings: Map<number, PlanCoating>): Promise<MeasuredMap> {
  const out: MeasuredMap = new Map();
  const keys = new Set<string>();
  for (const { lineId, coatingId } of pairs) {
    const key = measuredKey(lineId, coatingId);
    if (keys.has(key) || coatings.get(coatingId)?.kind !== "powder") continue;
    keys.add(key);
    const est = await utilisationEstimate(db, lineId, coatingId);
    if (est.measured !== null && est.measured > 0 && est.measured <= 1) out.set(key, { utilization: est.measured, runs: est.runs });
  }
  return out;
}

/**
 * Runs still being planned follow their part × line's saved racking plan as it changes. Once a
 * run starts (or is cancelled) the plan's racking is copied into the run (changeRunStatus), so a
 * later edit of the plan never rewrites what was actually hung and coated.
 */
function followsSavedPlan(status: RunStatus): boolean {
  return status === "draft" || status === "planned";
}

/**
 * The run's racking: a saved racking plan for its part × line replaces the run's own clearance and
 * orientation (the live planner's best); a count set by hand on the run still wins over both.
 */
function runRacking(run: StoredRun, part: RunPartView, saved: RackPlanRow | undefined): PlanRunInput["racking"] {
  if (saved && run.partsPerCarrierOverride === null) {
    const s: SavedRacking = savedRackingOf(saved, part);
    return { clearanceMm: s.clearanceMm, orientations: s.orientations, orientation: s.orientation, partsPerCarrierOverride: null, savedPlanId: s.savedPlanId };
  }
  return {
    clearanceMm: run.clearanceMm,
    orientations: run.orientations,
    orientation: run.orientation,
    partsPerCarrierOverride: run.partsPerCarrierOverride,
  };
}

/** The pure plan's input from a run and what it refers to; null pieces are reported as problems. */
function planInput(
  run: StoredRun,
  part: RunPartView,
  line: LineView,
  coatings: Map<number, PlanCoating>,
  measured: MeasuredMap = new Map(),
  saved?: RackPlanRow,
): PlanRunInput {
  return {
    part: planPartOf(part),
    quantity: run.quantity,
    line,
    lineSpeedMPerMin: run.lineSpeedMPerMin,
    racking: runRacking(run, part, saved),
    coats: run.coats.map((c, i) => {
      const coating = coatings.get(c.coatingId);
      if (!coating) throw new DomainError(`coats.${i}.coatingId`, "No such coating.");
      const m = coating.kind === "powder" ? measured.get(measuredKey(line.id, c.coatingId)) : undefined;
      return {
        coating,
        filmUm: c.filmUm,
        firstPassEfficiency: c.firstPassEfficiency,
        reclaimEfficiency: c.reclaimEfficiency,
        ...(m ? { measuredUtilization: m.utilization, measuredRuns: m.runs } : {}),
      };
    }),
  };
}

function tryPlan(
  run: StoredRun,
  part: RunPartView | null,
  line: LineView | undefined,
  coatings: Map<number, PlanCoating>,
  measured: MeasuredMap,
  saved?: RackPlanRow,
): { plan: RunPlan | null; planError: PlanProblem | null } {
  if (!part) return { plan: null, planError: { field: "partId", message: "The run's part is missing from the catalogue." } };
  if (!line) return { plan: null, planError: { field: "lineId", message: "The run's line is missing." } };
  try {
    return { plan: planRun(planInput(run, part, line, coatings, measured, saved)), planError: null };
  } catch (e) {
    if (e instanceof DomainError) return { plan: null, planError: { field: e.field, message: e.message } };
    throw e;
  }
}

function storedOf(row: RunListRow, coats: RunCoatRow[]): StoredRun {
  return {
    quantity: row.quantity,
    lineSpeedMPerMin: row.line_speed_m_per_min,
    clearanceMm: row.clearance_mm,
    orientations: row.orientations,
    orientation: row.orientation_json ? (JSON.parse(row.orientation_json) as RackOrientation) : null,
    partsPerCarrierOverride: row.parts_per_carrier_override,
    coats: coats.map((c) => ({ coatingId: c.coating_id, filmUm: c.film_um, firstPassEfficiency: c.first_pass_efficiency, reclaimEfficiency: c.reclaim_efficiency })),
  };
}

function baseView(row: RunListRow, coats: RunCoatRow[], ctx: Context): Omit<RunViewBase, "planError"> & { stored: StoredRun } {
  const stored = storedOf(row, coats);
  const part = ctx.parts.get(row.part_id);
  return {
    id: row.id,
    status: row.status,
    date: epochToDate(row.run_date),
    shift: row.shift,
    sequence: row.sequence,
    quantity: row.quantity,
    partId: row.part_id,
    part: part ? toPartView(part) : null,
    lineId: row.line_id,
    line: { id: row.line_id, name: row.line_name, kind: row.line_kind },
    lineSpeedMPerMin: row.line_speed_m_per_min,
    clearanceMm: row.clearance_mm,
    orientations: row.orientations,
    orientation: stored.orientation,
    partsPerCarrierOverride: row.parts_per_carrier_override,
    coats: coats.map((c) => {
      const k = ctx.coatings.get(c.coating_id);
      return {
        position: c.position,
        coatingId: c.coating_id,
        filmUm: c.film_um,
        firstPassEfficiency: c.first_pass_efficiency,
        reclaimEfficiency: c.reclaim_efficiency,
        coating: k ? { code: k.code, name: k.name, kind: k.kind, colourName: k.colourName, swatchHex: k.swatchHex, archived: k.archived } : null,
      };
    }),
    masking: row.masking,
    notes: row.notes,
    createdAt: row.created_at,
    updatedAt: row.updated_at,
    nextStatuses: [...RUN_TRANSITIONS[row.status]],
    editable: isEditable(row.status),
    planFrozenAt: row.plan_json ? row.plan_frozen_at : null,
    stored,
  };
}

function summaryOf(plan: RunPlan): RunSummary {
  return {
    partsPerCarrier: plan.racking.partsPerCarrier,
    carriers: plan.carriers,
    lineTimeMin: plan.lineTimeMin,
    materialKg: plan.materialKg,
    materials: plan.coats.reduce<RunSummary["materials"]>((list, c) => {
      const same = list.find((m) => m.code === c.code);
      if (same) same.kg += c.materialKg;
      else list.push({ code: c.code, kind: c.kind, kg: c.materialKg });
      return list;
    }, []),
    costPerPart: plan.cost.totalPerPart,
    runCost: plan.cost.runTotal,
    cures: plan.cures,
    warnings: plan.warnings.length,
  };
}

interface Planned {
  row: RunListRow;
  base: ReturnType<typeof baseView>;
  plan: RunPlan | null;
  planError: PlanProblem | null;
}

async function planRows(db: Db, rows: RunListRow[]): Promise<{ planned: Planned[]; ctx: Context }> {
  const [coats, ctx] = await Promise.all([coatsOf(db, rows.map((r) => r.id)), loadContext(db, rows.map((r) => r.part_id))]);
  const lineOf = new Map(rows.map((r) => [r.id, r.line_id]));
  const measured = await measuredUtilisations(
    db,
    coats.map((c) => ({ lineId: lineOf.get(c.run_id)!, coatingId: c.coating_id })),
    ctx.coatings,
  );
  const planned = rows.map((row) => {
    const base = baseView(
      row,
      coats.filter((c) => c.run_id === row.id),
      ctx,
    );
    if (row.plan_json) return { row, base, plan: JSON.parse(row.plan_json) as RunPlan, planError: null };
    const saved = followsSavedPlan(row.status) ? ctx.savedPlans.get(savedPlanKey(row.part_id, row.line_id)) : undefined;
    const { plan, planError } = tryPlan(base.stored, base.part, ctx.lines.get(row.line_id), ctx.coatings, measured, saved);
    return { row, base, plan, planError };
  });
  return { planned, ctx };
}

function strip<T extends { stored: StoredRun }>(b: T): Omit<T, "stored"> {
  const { stored: _s, ...rest } = b;
  return rest;
}

export interface RunQuery {
  /** a single day, or from/to inclusive; no day: from today on */
  date?: string;
  from?: string;
  to?: string;
  lineId?: number;
  shift?: number;
}

export async function listRuns(q: RunQuery = {}): Promise<RunListItem[]> {
  const db = await getDb();
  const fromDay = dateToEpoch(q.date ?? q.from ?? epochToDate(nowSeconds()));
  const toDay = q.date ? dateToEpoch(q.date) : q.to ? dateToEpoch(q.to) : undefined;
  const rows = await listRunRows(db, { fromDay, toDay, lineId: q.lineId, shift: q.shift });
  const { planned } = await planRows(db, rows);
  return planned.map((p) => ({ ...strip(p.base), planError: p.planError, summary: p.plan ? summaryOf(p.plan) : null }));
}

/**
 * One run with its plan and warnings. `reader`: the units to word the racking sentence in, and
 * also warn, in those units, when the material forecast leaves too little of a coating for a run
 * still being planned (the run page and sheet ask).
 */
export async function getRun(id: number, reader?: UnitSystem): Promise<RunDetail> {
  const db = await getDb();
  const row = await findRunRow(db, id);
  if (!row) throw new ApiError(404, "not_found", "No such run.");
  const { planned, ctx } = await planRows(db, [row]);
  const p = planned[0];
  const date = epochToDate(row.run_date);
  const shift = occupiesLine(row.status) ? await shiftWarnings(row.id, row.line_id, date, row.shift) : [];
  const stock = reader && p.plan && followsSavedPlan(row.status) ? await stockWarnings(p.plan, date, row.id, reader) : [];
  return {
    ...strip(p.base),
    planError: p.planError,
    plan: p.plan,
    lineView: ctx.lines.get(row.line_id)!,
    warnings: [...(p.plan?.warnings ?? []), ...shift, ...stock],
    rackingReason: p.plan ? runRackingReason(p.plan.racking, p.base.part, reader ?? "metric") : null,
  };
}

/**
 * Coats whose coating the material forecast (planned and started runs, stock, open purchase
 * requests) cannot cover by the run's day. A run the forecast already counts (`runId`, planned)
 * is short when the coating runs out on or before its day; a draft or an unsaved run is short
 * when it needs more than the forecast leaves at the end of its day.
 */
async function stockWarnings(plan: RunPlan, date: string, runId: number | null, system: UnitSystem): Promise<string[]> {
  const days = daysBetween(epochToDate(nowSeconds()), date);
  if (days < 0 || days >= MAX_HORIZON_DAYS) return [];
  const forecast = await buildForecast(days + 1);
  const kg = (v: number) => formatQuantity("massKg", v, system, 3);
  const needs = new Map<number, { code: string; kg: number }>();
  for (const c of plan.coats) needs.set(c.coatingId, { code: c.code, kg: (needs.get(c.coatingId)?.kg ?? 0) + c.materialKg });
  const out: string[] = [];
  for (const [coatingId, need] of needs) {
    const f = forecast.coatings.find((c) => c.coatingId === coatingId);
    if (!f) continue;
    const counted = runId !== null && f.demands.some((d) => d.runId === runId);
    if (counted) {
      if (f.stockOutDate !== null && f.stockOutDate <= date) {
        out.push(
          `${need.code}: the material forecast runs out on ${f.stockOutDate}, short of ${kg(f.shortfallKg)} by ${date} with this run's ${kg(need.kg)} counted ` +
            `(${kg(f.stockKg)} usable in stock, ${kg(f.incomingKg)} on order). Order more or move runs (purchasing sees the detail in the material forecast).`,
        );
      }
    } else {
      const left = f.series.at(-1)?.stockKg ?? f.stockKg;
      if (need.kg > left + 1e-9) {
        out.push(
          `${need.code}: this run needs ${kg(need.kg)}, but the material forecast leaves ${kg(left)} usable on ${date} after the planned runs ` +
            `(${kg(f.stockKg)} in stock, ${kg(f.incomingKg)} on order). Order more or move runs (purchasing sees the detail in the material forecast).`,
        );
      }
    }
  }
  return out;
}

/** Parts a run may be planned for (the form's list). */
export async function partsForRunForm(): Promise<RunPartView[]> {
  return (await listPartsForRuns(await getDb())).map(toPartView);
}

/** Checks what the input refers to exists and is current; 400 naming the field otherwise. */
async function checkReferences(db: Db, input: RunInput): Promise<{ part: RunPartView; line: LineView; coatings: Map<number, PlanCoating> }> {
  const partRow = await findPartForRun(db, input.partId);
  const ctx = await loadContext(db, []);
  const fields: Record<string, string> = {};
  if (!partRow) fields.partId = "No such part.";
  else if (partRow.archived === 1) fields.partId = `Part ${partRow.number} is archived; choose a current part.`;
  const line = ctx.lines.get(input.lineId);
  if (!line) fields.lineId = "No such line.";
  else if (line.archived) fields.lineId = `${line.name} is archived; choose a line in use.`;
  input.coats.forEach((c, i) => {
    const coating = ctx.coatings.get(c.coatingId);
    if (!coating) fields[`coats.${i}.coatingId`] = "No such coating.";
    else if (coating.archived) fields[`coats.${i}.coatingId`] = `${coating.code} is archived; choose a current coating.`;
  });
  const first = Object.entries(fields)[0];
  if (first) throw new ApiError(400, "invalid_input", `${first[0]}: ${first[1]}`, fields);
  return { part: toPartView(partRow!), line: line!, coatings: ctx.coatings };
}

function storedFromInput(input: RunInput): StoredRun {
  return {
    quantity: input.quantity,
    lineSpeedMPerMin: input.lineSpeedMPerMin ?? null,
    clearanceMm: input.clearanceMm,
    orientations: input.orientations,
    orientation: input.orientation ?? null,
    partsPerCarrierOverride: input.partsPerCarrierOverride ?? null,
    coats: input.coats.map((c) => ({
      coatingId: c.coatingId,
      filmUm: c.filmUm,
      firstPassEfficiency: c.firstPassEfficiency ?? null,
      reclaimEfficiency: c.reclaimEfficiency ?? null,
    })),
  };
}

function rowValues(input: RunInput, plan: RunPlan) {
  return {
    part_id: input.partId,
    quantity: input.quantity,
    line_id: input.lineId,
    run_date: dateToEpoch(input.date),
    shift: input.shift,
    line_speed_m_per_min: input.lineSpeedMPerMin ?? null,
    clearance_mm: input.clearanceMm,
    orientations: input.orientations,
    orientation_json: input.orientation ? JSON.stringify(input.orientation) : null,
    parts_per_carrier_override: input.partsPerCarrierOverride ?? null,
    masking: input.masking,
    notes: input.notes,
    // powder-only fields are not kept on an e-coat coat
    _coats: input.coats.map((c, i): RunCoatValues => {
      const powder = plan.coats[i].kind === "powder";
      return {
        coating_id: c.coatingId,
        film_um: c.filmUm,
        first_pass_efficiency: powder ? (c.firstPassEfficiency ?? null) : null,
        reclaim_efficiency: powder ? (c.reclaimEfficiency ?? 0) : null,
      };
    }),
  };
}

/** Plans the input (a DomainError becomes a 400 naming the field) before anything is written. */
async function planChecked(db: Db, input: RunInput): Promise<RunPlan> {
  return (await planCheckedWithPart(db, input)).plan;
}

/** planChecked, with the part it was planned for (the preview words the racking with it). */
async function planCheckedWithPart(db: Db, input: RunInput): Promise<{ plan: RunPlan; part: RunPartView }> {
  const { part, line, coatings } = await checkReferences(db, input);
  const measured = await measuredUtilisations(db, input.coats.map((c) => ({ lineId: line.id, coatingId: c.coatingId })), coatings);
  const saved = await findRackPlanFor(db, input.partId, input.lineId);
  return { plan: planRun(planInput(storedFromInput(input), part, line, coatings, measured, saved)), part };
}

const hours = (min: number) => formatSignificant(min / 60, 3);

/** Warnings for the line's day and shift after a save: the board's overflow for this run. */
async function shiftWarnings(runId: number, lineId: number, date: string, shift: number): Promise<string[]> {
  const board = await getBoard(lineId, date);
  const s = board.shifts.find((x) => x.shift === shift);
  const slot = s?.runs.find((r) => r.id === runId)?.slot;
  if (!s || !slot || slot.fits) return [];
  const others = s.runs.length - 1;
  return [
    `${others ? `With the ${others} other run${others === 1 ? "" : "s"} on` : "On"} ${board.lineName} on ${date}, shift ${shift}, this run ends ` +
      `${formatSignificant(slot.overflowMin, 3)} min after the ${hours(s.shiftMin)} h shift (the shift needs ${hours(s.filledMin)} h). ` +
      `Move a run to another shift, day or line, or plan overtime.`,
  ];
}

export interface RunPreview {
  plan: RunPlan;
  warnings: string[];
  /** the racking sentence in the reader's units */
  rackingReason: string;
}

/**
 * The plan of a run not yet saved (the form's live summary), with the shift warning it would
 * get: the run goes last on its board, or keeps its place when it is `exceptRunId` being edited.
 */
export async function previewRun(input: RunInput, exceptRunId?: number, reader?: UnitSystem): Promise<RunPreview> {
  const db = await getDb();
  const { plan, part } = await planCheckedWithPart(db, input);
  const board = await getBoard(input.lineId, input.date);
  const s = board.shifts.find((x) => x.shift === input.shift);
  const others = (s?.runs ?? []).map((r) => ({ id: r.id, loadingMin: r.loadingMin, lineTimeMin: r.lineTimeMin, boothColours: r.coats.filter((c) => c.kind === "powder").map((c) => c.swatchHex) }));
  const mine = { id: -1, loadingMin: plan.loadingMin, lineTimeMin: plan.lineTimeMin, boothColours: plan.coats.filter((c) => c.kind === "powder").map((c) => c.swatchHex) };
  const at = exceptRunId === undefined ? -1 : others.findIndex((r) => r.id === exceptRunId);
  // editing a run that stays on its board keeps its place; otherwise it goes last
  const runs = at >= 0 ? others.map((r, i) => (i === at ? mine : r)) : [...others.filter((r) => r.id !== exceptRunId), mine];
  const sched = scheduleBoard(runs, { colourChangeMin: board.colourChangeMin, shiftMin: board.shiftHours * 60 });
  const slot = sched.slots.find((x) => x.id === -1)!;
  const warnings = [...plan.warnings];
  if (!slot.fits) {
    const n = runs.length - 1;
    warnings.push(
      `${n ? `With the ${n} other run${n === 1 ? "" : "s"} on` : "On"} ${board.lineName} on ${input.date}, shift ${input.shift}, this run would end ` +
        `${formatSignificant(slot.overflowMin, 3)} min after the ${hours(sched.shiftMin)} h shift.`,
    );
  }
  // an edited run that the forecast counts is left in it: its own old figures stand in for the new
  if (reader) warnings.push(...(await stockWarnings(plan, input.date, exceptRunId ?? null, reader)));
  return { plan, warnings, rackingReason: runRackingReason(plan.racking, part, reader ?? "metric") };
}

export async function createRun(input: RunInput, user: SessionUser): Promise<SavedRun> {
  const db = await getDb();
  const plan = await planChecked(db, input);
  const t = nowSeconds();
  const { _coats, ...row } = rowValues(input, plan);
  const id = await insertRun(db, { ...row, status: "draft", created_by: user.id, created_at: t, updated_at: t }, _coats);
  const run = await getRun(id);
  return { run, warnings: run.warnings };
}

export async function replaceRun(id: number, input: RunInput): Promise<SavedRun> {
  const db = await getDb();
  const existing = await findRunRow(db, id);
  if (!existing) throw new ApiError(404, "not_found", "No such run.");
  if (!isEditable(existing.status)) {
    throw new ApiError(409, "conflict", `A run that is ${RUN_STATUS_LABELS[existing.status].toLowerCase()} cannot be changed.`);
  }
  const plan = await planChecked(db, input);
  const { _coats, ...row } = rowValues(input, plan);
  await updateRun(db, id, { ...row, updated_at: nowSeconds() }, _coats);
  const run = await getRun(id);
  return { run, warnings: run.warnings };
}

export async function removeRun(id: number): Promise<void> {
  const db = await getDb();
  const existing = await findRunRow(db, id);
  if (!existing) throw new ApiError(404, "not_found", "No such run.");
  if (existing.status !== "draft" || !(await deleteDraftRun(db, id))) {
    throw new ApiError(409, "conflict", `Only a draft run can be deleted; this one is ${RUN_STATUS_LABELS[existing.status].toLowerCase()}. Cancel it instead.`);
  }
}

export async function changeRunStatus(id: number, to: RunStatus): Promise<RunDetail> {
  const db = await getDb();
  const run = await getRun(id);
  if (!canTransition(run.status, to)) {
    const allowed = RUN_TRANSITIONS[run.status].map((s) => RUN_STATUS_LABELS[s].toLowerCase());
    throw new ApiError(
      409,
      "conflict",
      `A run that is ${RUN_STATUS_LABELS[run.status].toLowerCase()} cannot become ${RUN_STATUS_LABELS[to].toLowerCase()}` +
        (allowed.length ? `; it can become ${allowed.join(" or ")}.` : "; it is final."),
    );
  }
  if ((to === "planned" || to === "in-progress") && run.planError) {
    throw new ApiError(409, "conflict", `This run no longer plans (${run.planError.message}); edit it first.`);
  }
  const saved =
    followsSavedPlan(run.status) && !followsSavedPlan(to) && run.partsPerCarrierOverride === null && run.part
      ? await findRackPlanFor(db, run.partId, run.lineId)
      : undefined;
  const t = nowSeconds();
  const moved = await db.transaction().execute(async (trx) => {
    if (!(await setRunStatus(trx, id, run.status, to, t))) return false;
    // from here on the run keeps the plan it started with (see the frozen-run-plans migration)
    if (!followsSavedPlan(to) && run.plan && run.planFrozenAt === null) await freezeRunPlan(trx, id, JSON.stringify(run.plan), t);
    if (saved && run.part) {
      // freeze the saved plan's racking into the run (see followsSavedPlan)
      const r = savedRackingOf(saved, run.part);
      await trx
        .updateTable("runs")
        .set({ clearance_mm: r.clearanceMm, orientations: r.orientations, orientation_json: r.orientation ? JSON.stringify(r.orientation) : null })
        .where("id", "=", id)
        .execute();
    }
    return true;
  });
  if (!moved) throw new ApiError(409, "conflict", "The run changed meanwhile; reload it and try again.");
  return getRun(id);
}

/**
 * Freezes the plan of every run past planning that has none yet (runs started before plans were
 * frozen, or written straight into the database such as the demo's); at start-up. Returns how many.
 */
export async function freezeStartedRuns(): Promise<number> {
  const db = await getDb();
  const rows = await unfrozenRunRows(db);
  if (!rows.length) return 0;
  const { planned } = await planRows(db, rows);
  const t = nowSeconds();
  let frozen = 0;
  await db.transaction().execute(async (trx) => {
    for (const p of planned) if (p.plan && (await freezeRunPlan(trx, p.row.id, JSON.stringify(p.plan), t))) frozen++;
  });
  return frozen;
}

// ---------------------------------------------------------------------------------------------
// Day board

export interface BoardRunView {
  id: number;
  status: RunStatus;
  sequence: number;
  quantity: number;
  part: { number: string; name: string };
  coats: { code: string; kind: "powder" | "e-coat"; colourName: string; swatchHex: string }[];
  carriers: number | null;
  loadingMin: number;
  lineTimeMin: number;
  cureKey: string;
  /** the swatch the proposal orders by: the first powder coat's, else the last coat's */
  orderSwatchHex: string;
  planError: PlanProblem | null;
  slot: BoardSlot;
}

export interface BoardShiftView {
  shift: number;
  shiftMin: number;
  runs: BoardRunView[];
  colourChanges: ColourChange[];
  filledMin: number;
  leftMin: number;
  fits: boolean;
}

export interface BoardView {
  lineId: number;
  lineName: string;
  lineKind: "conveyor" | "batch";
  date: string;
  shiftHours: number;
  colourChangeMin: number;
  shifts: BoardShiftView[];
}

function boothColourChangeMin(line: LineView): number {
  if (line.kind !== "conveyor") return 0;
  return line.stages.find((s) => s.kind === "powder-booth")?.colourChangeMin ?? 0;
}

function boardRun(p: Planned, ctx: Context): Omit<BoardRunView, "slot"> {
  const coats = p.base.coats.flatMap((c) => (c.coating ? [{ code: c.coating.code, kind: c.coating.kind, colourName: c.coating.colourName, swatchHex: c.coating.swatchHex }] : []));
  const powder = coats.filter((c) => c.kind === "powder");
  const key = p.base.coats.map((c) => cureKey(ctx.coatings.get(c.coatingId)?.cureSchedule ?? [])).join(" + ");
  return {
    id: p.row.id,
    status: p.row.status,
    sequence: p.row.sequence,
    quantity: p.row.quantity,
    part: { number: p.row.part_number, name: p.row.part_name },
    coats,
    carriers: p.plan?.carriers ?? null,
    loadingMin: p.plan?.loadingMin ?? 0,
    lineTimeMin: p.plan?.lineTimeMin ?? 0,
    cureKey: key,
    orderSwatchHex: (powder[0] ?? coats[coats.length - 1])?.swatchHex ?? "#808080",
    planError: p.planError,
  };
}

function scheduleShift(shift: number, runs: Omit<BoardRunView, "slot">[], colourChangeMin: number, shiftMin: number): BoardShiftView {
  const s: BoardSchedule = scheduleBoard(
    runs.map((r) => ({ id: r.id, loadingMin: r.loadingMin, lineTimeMin: r.lineTimeMin, boothColours: r.coats.filter((c) => c.kind === "powder").map((c) => c.swatchHex) })),
    { colourChangeMin, shiftMin },
  );
  return {
    shift,
    shiftMin,
    runs: runs.map((r, i) => ({ ...r, slot: s.slots[i] })),
    colourChanges: s.colourChanges,
    filledMin: s.filledMin,
    leftMin: s.leftMin,
    fits: s.fits,
  };
}

async function boardData(lineId: number, date: string) {
  const db = await getDb();
  const day = dateToEpoch(date);
  const rows = (await listRunRows(db, { fromDay: day, toDay: day, lineId })).filter((r) => occupiesLine(r.status));
  const { planned, ctx } = await planRows(db, rows);
  const line = ctx.lines.get(lineId);
  if (!line) throw new ApiError(404, "not_found", "No such line.");
  const settings = await getPlantSettings(db);
  const shiftHours = settings?.shift_hours ?? 8;
  return { line, planned, ctx, shiftHours, shiftMin: shiftHours * 60 };
}

function byShift(planned: Planned[]): Map<number, Planned[]> {
  const m = new Map<number, Planned[]>([[1, []]]);
  for (const p of planned) {
    const list = m.get(p.row.shift) ?? [];
    list.push(p);
    m.set(p.row.shift, list);
  }
  return new Map([...m.entries()].sort((a, b) => a[0] - b[0]));
}

/** The line's day: each shift's runs in board order, colour changes, the shift filled and left. */
export async function getBoard(lineId: number, date: string): Promise<BoardView> {
  const { line, planned, ctx, shiftHours, shiftMin } = await boardData(lineId, date);
  const colourChangeMin = boothColourChangeMin(line);
  return {
    lineId,
    lineName: line.name,
    lineKind: line.kind,
    date,
    shiftHours,
    colourChangeMin,
    shifts: [...byShift(planned).entries()].map(([shift, list]) =>
      scheduleShift(
        shift,
        list.map((p) => boardRun(p, ctx)),
        colourChangeMin,
        shiftMin,
      ),
    ),
  };
}

export interface ProposedShift {
  shift: number;
  runIds: number[];
  /** the shift as it would run in the proposed order */
  proposed: BoardShiftView;
}

export interface BoardProposal {
  lineId: number;
  date: string;
  shifts: ProposedShift[];
}

/** A proposed order per shift: grouped by cure schedule, light to dark (lib/runs/board.ts). */
export async function proposeBoard(lineId: number, date: string): Promise<BoardProposal> {
  const { line, planned, ctx, shiftMin } = await boardData(lineId, date);
  const colourChangeMin = boothColourChangeMin(line);
  return {
    lineId,
    date,
    shifts: [...byShift(planned).entries()].map(([shift, list]) => {
      const runs = list.map((p) => boardRun(p, ctx));
      const ids = proposeOrder(runs.map((r) => ({ id: r.id, cureKey: r.cureKey, swatchHex: r.orderSwatchHex })));
      const ordered = ids.map((id) => runs.find((r) => r.id === id)!);
      return { shift, runIds: ids, proposed: scheduleShift(shift, ordered, colourChangeMin, shiftMin) };
    }),
  };
}

/** Saves a shift's order; the ids must be exactly that shift's runs (409 when the board changed). */
export async function saveBoardOrder(order: BoardOrder): Promise<BoardView> {
  const db = await getDb();
  const day = dateToEpoch(order.date);
  const rows = (await listRunRows(db, { fromDay: day, toDay: day, lineId: order.lineId, shift: order.shift })).filter((r) => occupiesLine(r.status));
  const have = new Set(rows.map((r) => r.id));
  const same = have.size === order.runIds.length && order.runIds.every((id) => have.has(id));
  if (!same) {
    throw new ApiError(409, "conflict", "The board has changed since it was loaded (a run was added, moved or cancelled); reload it and order again.", {
      runIds: `Send exactly the ${have.size} run${have.size === 1 ? "" : "s"} of shift ${order.shift}.`,
    });
  }
  await setSequences(db, order.runIds, nowSeconds());
  return getBoard(order.lineId, order.date);
}
