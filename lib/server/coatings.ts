import { getDb, type Db } from "@/db/index";
import {
  curePointsOf,
  findCoatingRow,
  insertCoating,
  insertLot,
  listCoatingRows,
  lotsOf,
  setCoatingArchived,
  updateCoating,
  type CoatingRow,
  type CurePointRow,
  type LotRow,
} from "@/db/queries/coatings";
import type { CurePoint } from "@/lib/coating-math/cure";
import type { CoatingKind } from "@/lib/lines/stages";
import type { Chemistry } from "@/lib/coatings/chemistries";
import type { CoatingInput, LotInput } from "@/lib/validation/coatings";
import { ApiError, isUniqueViolation } from "./http";
import { runsUsingCoating } from "@/db/queries/runs";

/** A lot is "near expiry" this many days before its expiry date (common practice, no source). */
export const NEAR_EXPIRY_DAYS = 60;
const DAY_S = 86_400;

export type LotStatus = "ok" | "near-expiry" | "expired" | "empty";

export interface LotView {
  id: number;
  lotNumber: string;
  receivedDate: string;
  expiryDate: string;
  kgOnHand: number;
  daysToExpiry: number;
  status: LotStatus;
}

export interface CoatingView {
  id: number;
  code: string;
  name: string;
  kind: CoatingKind;
  chemistry: Chemistry;
  colourName: string;
  swatchHex: string;
  specificGravity: number | null;
  volumeSolidsFraction: number | null;
  weightSolidsFraction: number | null;
  filmDensityGPerCm3: number | null;
  filmMinUm: number;
  filmMaxUm: number;
  cureSchedule: CurePoint[];
  pricePerKg: number;
  containerKind: "box" | "drum";
  containerKg: number;
  supplierName: string;
  supplierEmail: string;
  leadTimeDays: number;
  shelfLifeMonths: number;
  reorderPointKg: number;
  archived: boolean;
  createdAt: number;
  updatedAt: number;
  lots: LotView[];
  /** kg in lots not yet expired */
  usableStockKg: number;
  expiredStockKg: number;
  /** usable stock at or below the reorder point (or none at all) */
  lowStock: boolean;
  /** a lot with stock expires within NEAR_EXPIRY_DAYS */
  nearExpiry: boolean;
  hasExpiredStock: boolean;
}

export interface UsageRef {
  kind: string;
  id: string | number;
  label: string;
}

type UsageCheck = (db: Db, coatingId: number) => Promise<UsageRef[]>;

/*
 * What refers to a coating (run plans, forecasts, purchase requests…). Nothing does yet; each
 * capability that stores a coating id adds its check to this list, in this file (not at run
 * time, so no import order can skip it). DELETE is refused while any check returns a row.
 */
export const coatingUsageChecks: UsageCheck[] = [runsUsingCoating];

export async function coatingUsage(db: Db, coatingId: number): Promise<UsageRef[]> {
  return (await Promise.all(coatingUsageChecks.map((check) => check(db, coatingId)))).flat();
}

export const nowSeconds = () => Math.floor(Date.now() / 1000);

/** "2026-12-02" → epoch seconds at 00:00 UTC of that day. */
export function dateToEpoch(date: string): number {
  return Date.parse(`${date}T00:00:00Z`) / 1000;
}

export function epochToDate(s: number): string {
  return new Date(s * 1000).toISOString().slice(0, 10);
}

/** The same day `months` later; a day past the month's end falls back to its last day (Jan 31 + 1 → Feb 28). */
export function addMonths(date: string, months: number): string {
  const [y, m, d] = date.split("-").map(Number);
  const target = new Date(Date.UTC(y, m - 1 + months, 1));
  const lastDay = new Date(Date.UTC(target.getUTCFullYear(), target.getUTCMonth() + 1, 0)).getUTCDate();
  target.setUTCDate(Math.min(d, lastDay));
  return target.toISOString().slice(0, 10);
}

export function parseId(raw: string, what: string): number {
  const id = /^\d{1,12}$/.test(raw) ? Number(raw) : NaN;
  if (!Number.isSafeInteger(id) || id < 1) throw new ApiError(404, "not_found", `No such ${what}.`);
  return id;
}

function lotView(l: LotRow, todayS: number): LotView {
  const daysToExpiry = Math.floor((l.expires_at - todayS) / DAY_S);
  const status: LotStatus =
    l.kg_on_hand <= 0 ? "empty" : daysToExpiry <= 0 ? "expired" : daysToExpiry <= NEAR_EXPIRY_DAYS ? "near-expiry" : "ok";
  return {
    id: l.id,
    lotNumber: l.lot_number,
    receivedDate: epochToDate(l.received_at),
    expiryDate: epochToDate(l.expires_at),
    kgOnHand: l.kg_on_hand,
    daysToExpiry,
    status,
  };
}

export function toCoatingView(c: CoatingRow, points: CurePointRow[], lots: LotRow[], nowS = nowSeconds()): CoatingView {
  const todayS = dateToEpoch(epochToDate(nowS));
  const lotViews = lots.map((l) => lotView(l, todayS));
  const sum = (ls: LotView[]) => ls.reduce((a, l) => a + l.kgOnHand, 0);
  const usableStockKg = sum(lotViews.filter((l) => l.status === "ok" || l.status === "near-expiry"));
  return {
    id: c.id,
    code: c.code,
    name: c.name,
    kind: c.kind,
    chemistry: c.chemistry as Chemistry,
    colourName: c.colour_name,
    swatchHex: c.swatch_hex,
    specificGravity: c.specific_gravity,
    volumeSolidsFraction: c.volume_solids_fraction,
    weightSolidsFraction: c.weight_solids_fraction,
    filmDensityGPerCm3: c.film_density_g_per_cm3,
    filmMinUm: c.film_min_um,
    filmMaxUm: c.film_max_um,
    cureSchedule: points.map((p) => ({ metalTempC: p.metal_temp_c, holdMin: p.hold_min })),
    pricePerKg: c.price_per_kg,
    containerKind: c.container_kind,
    containerKg: c.container_kg,
    supplierName: c.supplier_name,
    supplierEmail: c.supplier_email,
    leadTimeDays: c.lead_time_days,
    shelfLifeMonths: c.shelf_life_months,
    reorderPointKg: c.reorder_point_kg,
    archived: c.archived_at !== null,
    createdAt: c.created_at,
    updatedAt: c.updated_at,
    lots: lotViews,
    usableStockKg,
    expiredStockKg: sum(lotViews.filter((l) => l.status === "expired")),
    lowStock: usableStockKg <= 0 || usableStockKg <= c.reorder_point_kg,
    nearExpiry: lotViews.some((l) => l.status === "near-expiry"),
    hasExpiredStock: lotViews.some((l) => l.status === "expired"),
  };
}

async function views(db: Db, rows: CoatingRow[]): Promise<CoatingView[]> {
  const ids = rows.map((r) => r.id);
  const [points, lots] = await Promise.all([curePointsOf(db, ids), lotsOf(db, ids)]);
  const now = nowSeconds();
  return rows.map((r) =>
    toCoatingView(
      r,
      points.filter((p) => p.coating_id === r.id),
      lots.filter((l) => l.coating_id === r.id),
      now,
    ),
  );
}

export interface CoatingFilter {
  q?: string;
  kind?: CoatingKind;
  includeArchived?: boolean;
}

export async function listCoatings(filter: CoatingFilter = {}): Promise<CoatingView[]> {
  const db = await getDb();
  let rows = await listCoatingRows(db, { includeArchived: filter.includeArchived });
  if (filter.kind) rows = rows.filter((r) => r.kind === filter.kind);
  const q = filter.q?.trim().toLowerCase();
  if (q) {
    rows = rows.filter((r) =>
      [r.code, r.name, r.colour_name, r.chemistry, r.supplier_name].some((s) => s.toLowerCase().includes(q)),
    );
  }
  return views(db, rows);
}

export async function getCoating(id: number): Promise<CoatingView> {
  const db = await getDb();
  const row = await findCoatingRow(db, id);
  if (!row) throw new ApiError(404, "not_found", "No such coating.");
  return (await views(db, [row]))[0];
}

function rowValues(v: CoatingInput) {
  const powder = v.kind === "powder";
  return {
    code: v.code,
    name: v.name,
    kind: v.kind,
    chemistry: v.chemistry,
    colour_name: v.colourName,
    swatch_hex: v.swatchHex.toLowerCase(),
    specific_gravity: powder ? (v.specificGravity ?? null) : null,
    volume_solids_fraction: powder ? null : (v.volumeSolidsFraction ?? null),
    weight_solids_fraction: powder ? null : (v.weightSolidsFraction ?? null),
    film_density_g_per_cm3: powder ? null : (v.filmDensityGPerCm3 ?? null),
    film_min_um: v.filmMinUm,
    film_max_um: v.filmMaxUm,
    price_per_kg: v.pricePerKg,
    container_kind: v.containerKind,
    container_kg: v.containerKg,
    supplier_name: v.supplierName,
    supplier_email: v.supplierEmail.toLowerCase(),
    lead_time_days: v.leadTimeDays,
    shelf_life_months: v.shelfLifeMonths,
    reorder_point_kg: v.reorderPointKg,
  };
}

const pointValues = (v: CoatingInput) => v.cureSchedule.map((p) => ({ metal_temp_c: p.metalTempC, hold_min: p.holdMin }));

function codeTaken(e: unknown, code: string): never {
  if (isUniqueViolation(e)) throw new ApiError(409, "conflict", `A coating with code ${code} already exists.`, { code: "Choose another code." });
  throw e;
}

export async function createCoating(input: CoatingInput): Promise<CoatingView> {
  const db = await getDb();
  const t = nowSeconds();
  let id: number;
  try {
    id = await insertCoating(db, { ...rowValues(input), archived_at: input.archived ? t : null, created_at: t, updated_at: t }, pointValues(input));
  } catch (e) {
    codeTaken(e, input.code);
  }
  return getCoating(id);
}

export async function replaceCoating(id: number, input: CoatingInput): Promise<CoatingView> {
  const db = await getDb();
  const existing = await findCoatingRow(db, id);
  if (!existing) throw new ApiError(404, "not_found", "No such coating.");
  const t = nowSeconds();
  const archived_at = input.archived === undefined ? existing.archived_at : input.archived ? (existing.archived_at ?? t) : null;
  try {
    await updateCoating(db, id, { ...rowValues(input), archived_at, updated_at: t }, pointValues(input));
  } catch (e) {
    codeTaken(e, input.code);
  }
  return getCoating(id);
}

/**
 * DELETE: refused while anything uses the coating (409 with the list: archive it with PUT
 * `archived: true` instead); otherwise the coating is archived, keeping its lots and history.
 */
export async function archiveCoating(id: number): Promise<{ usedBy: UsageRef[]; coating?: CoatingView }> {
  const db = await getDb();
  const row = await findCoatingRow(db, id);
  if (!row) throw new ApiError(404, "not_found", "No such coating.");
  const usedBy = await coatingUsage(db, id);
  if (usedBy.length) return { usedBy };
  if (row.archived_at === null) await setCoatingArchived(db, id, nowSeconds(), nowSeconds());
  return { usedBy, coating: await getCoating(id) };
}

/** Receives a lot into stock; the expiry defaults to the received date plus the shelf life. */
export async function receiveLot(coatingId: number, input: LotInput): Promise<CoatingView> {
  const db = await getDb();
  const coating = await findCoatingRow(db, coatingId);
  if (!coating) throw new ApiError(404, "not_found", "No such coating.");
  // a day's grace for time zones ahead of UTC
  if (dateToEpoch(input.receivedDate) > nowSeconds() + DAY_S) {
    throw new ApiError(400, "invalid_input", "receivedDate: cannot be in the future.", { receivedDate: "A lot cannot be received in the future." });
  }
  const expiryDate = input.expiryDate ?? addMonths(input.receivedDate, coating.shelf_life_months);
  try {
    await insertLot(db, {
      coating_id: coatingId,
      lot_number: input.lotNumber,
      received_at: dateToEpoch(input.receivedDate),
      expires_at: dateToEpoch(expiryDate),
      kg_on_hand: input.kgOnHand,
      created_at: nowSeconds(),
    });
  } catch (e) {
    if (isUniqueViolation(e)) {
      throw new ApiError(409, "conflict", `Lot ${input.lotNumber} of ${coating.code} is already in stock.`, { lotNumber: "This lot number is already recorded for this coating." });
    }
    throw e;
  }
  return getCoating(coatingId);
}
