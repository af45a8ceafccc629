/**
 * Material forecast service: planned runs (planned or in progress, dated in the horizon) turned
 * into material per coating per day, stock by lot, and open purchase requests, walked by the pure
 * lib/forecast/forecast.ts. Powder uses the measured utilisation of the line × coating once the
 * feedback loop rests on enough runs.
 */
import { getDb, type Db } from "@/db/index";
import { listCoatingRows, lotsOf, type CoatingRow } from "@/db/queries/coatings";
import { coatsOf, listRunRows, partsForRuns } from "@/db/queries/runs";
import { materialUtilization } from "@/lib/coating-math/powder";
import { addDays, daysBetween, ECOAT_LOSS_ALLOWANCE_FRACTION, ecoatPaintKg, forecastCoating, powderSprayedKg, type ForecastDemand, type ForecastArrival } from "@/lib/forecast/forecast";
import { coatAreaPerPartM2 } from "@/lib/runs/plan-run";
import { HORIZON_MESSAGE, horizonDaysOf } from "@/lib/validation/forecast";
import { dateToEpoch, epochToDate, nowSeconds } from "./coatings";
import { partAreas, utilisationEstimate, type UtilisationEstimate } from "./feedback";
import { ApiError } from "./http";
import { openRequests } from "./purchasing";

const DAY_S = 86_400;

export function parseHorizon(raw: string | null): number {
  const n = horizonDaysOf(raw);
  if (n === null) throw new ApiError(400, "invalid_input", `horizonDays: ${HORIZON_MESSAGE}`, { horizonDays: HORIZON_MESSAGE });
  return n;
}

export interface DemandView {
  runId: number;
  date: string;
  lineName: string;
  partNumber: string;
  quantity: number;
  coatIndex: number;
  kg: number;
  /** powder: the utilisation used, and whether it is the measured one */
  utilisation: number | null;
  measured: boolean;
}

export interface CoatingForecastView {
  coatingId: number;
  code: string;
  name: string;
  kind: "powder" | "e-coat";
  swatchHex: string;
  supplierName: string;
  supplierEmail: string;
  containerKind: "box" | "drum";
  containerKg: number;
  leadTimeDays: number;
  reorderPointKg: number;
  demandKg: number;
  stockKg: number;
  incomingKg: number;
  stockOutDate: string | null;
  reorderDate: string | null;
  shortfallKg: number;
  closingStockKg: number;
  orderKg: number;
  orderContainers: number;
  latestOrderDate: string | null;
  /** latest order date already passed */
  orderLate: boolean;
  expiringLots: { lotNumber: string; expiryDate: string; wastedKg: number }[];
  series: { date: string; stockKg: number }[];
  demands: DemandView[];
  arrivals: { reference: string; date: string; kg: number }[];
}

export interface ForecastView {
  today: string;
  horizonDays: number;
  endDate: string;
  coatings: CoatingForecastView[];
  /** runs or coats left out, and why */
  problems: string[];
}

export async function buildForecast(horizonDays: number): Promise<ForecastView> {
  const db = await getDb();
  return forecastFrom(db, horizonDays);
}

async function forecastFrom(db: Db, horizonDays: number): Promise<ForecastView> {
  const today = epochToDate(nowSeconds());
  const todayS = dateToEpoch(today);
  const runs = await listRunRows(db, { fromDay: todayS, toDay: todayS + (horizonDays - 1) * DAY_S, statuses: ["planned", "in-progress"] });
  const [coats, parts, coatingRows, requests] = await Promise.all([
    coatsOf(db, runs.map((r) => r.id)),
    partsForRuns(db, [...new Set(runs.map((r) => r.part_id))]),
    listCoatingRows(db, { includeArchived: true }),
    openRequests(db),
  ]);
  const coatings = new Map(coatingRows.map((c) => [c.id, c]));
  const lots = await lotsOf(db, coatingRows.map((c) => c.id));
  const problems: string[] = [];
  const demands = new Map<number, (ForecastDemand & { view: DemandView })[]>();
  const estimates = new Map<string, UtilisationEstimate>();

  for (const run of runs) {
    const part = parts.find((p) => p.id === run.part_id);
    if (!part) {
      problems.push(`Run ${run.id}: its part is missing; left out.`);
      continue;
    }
    for (const c of coats.filter((x) => x.run_id === run.id)) {
      const k = coatings.get(c.coating_id);
      if (!k) continue;
      const areaM2 = coatAreaPerPartM2(partAreas(part), k.kind) * run.quantity;
      let kg: number;
      let utilisation: number | null = null;
      let measured = false;
      if (k.kind === "powder") {
        if (k.specific_gravity === null || c.first_pass_efficiency === null) {
          problems.push(`Run ${run.id}, coat ${c.position + 1} (${k.code}): no specific gravity or first-pass efficiency; left out.`);
          continue;
        }
        const key = `${run.line_id}:${k.id}`;
        if (!estimates.has(key)) estimates.set(key, await utilisationEstimate(db, run.line_id, k.id));
        const est = estimates.get(key)!;
        measured = est.measured !== null;
        utilisation = est.measured ?? materialUtilization(c.first_pass_efficiency, c.reclaim_efficiency ?? 0);
        kg = powderSprayedKg({ areaM2, filmUm: c.film_um, specificGravity: k.specific_gravity, utilisation });
      } else {
        if (k.film_density_g_per_cm3 === null || k.weight_solids_fraction === null) {
          problems.push(`Run ${run.id}, coat ${c.position + 1} (${k.code}): no film density or weight solids; left out.`);
          continue;
        }
        // deposited solids = area × film × density (g/cm³ = SG) / 1000, as for powder
        const solids = (areaM2 * c.film_um * k.film_density_g_per_cm3) / 1000;
        kg = ecoatPaintKg({ depositedSolidsKg: solids, weightSolidsFraction: k.weight_solids_fraction, lossAllowanceFraction: ECOAT_LOSS_ALLOWANCE_FRACTION });
      }
      const date = epochToDate(run.run_date);
      const list = demands.get(k.id) ?? [];
      list.push({
        day: daysBetween(today, date),
        kg,
        runId: run.id,
        view: { runId: run.id, date, lineName: run.line_name, partNumber: run.part_number, quantity: run.quantity, coatIndex: c.position, kg, utilisation, measured },
      });
      demands.set(k.id, list);
    }
  }

  const arrivals = new Map<number, (ForecastArrival & { date: string })[]>();
  for (const r of requests) {
    for (const l of r.lines) {
      const kg = Math.max(0, l.orderedKg - l.receivedKg);
      if (kg <= 0) continue;
      // an overdue delivery is still expected: count it from today
      const day = Math.max(0, daysBetween(today, l.expectedDate));
      const list = arrivals.get(l.coatingId) ?? [];
      list.push({ day, kg, reference: r.reference, date: addDays(today, day) });
      arrivals.set(l.coatingId, list);
    }
  }

  const out: CoatingForecastView[] = [];
  for (const k of coatingRows) {
    const kLots = lots.filter((l) => l.coating_id === k.id && l.kg_on_hand > 0);
    const kDemands = demands.get(k.id) ?? [];
    const kArrivals = arrivals.get(k.id) ?? [];
    if (k.archived_at !== null && !kDemands.length && !kArrivals.length) continue;
    out.push(coatingView(k, today, horizonDays, kLots, kDemands, kArrivals));
  }
  out.sort((a, b) => (a.stockOutDate ?? "9999").localeCompare(b.stockOutDate ?? "9999") || b.orderContainers - a.orderContainers || a.code.localeCompare(b.code));
  return { today, horizonDays, endDate: addDays(today, horizonDays - 1), coatings: out, problems };
}

function coatingView(
  k: CoatingRow,
  today: string,
  horizonDays: number,
  lots: { lot_number: string; kg_on_hand: number; expires_at: number }[],
  demands: (ForecastDemand & { view: DemandView })[],
  arrivals: (ForecastArrival & { date: string })[],
): CoatingForecastView {
  const f = forecastCoating(
    {
      containerKg: k.container_kg,
      leadTimeDays: k.lead_time_days,
      reorderPointKg: k.reorder_point_kg,
      lots: lots.map((l) => ({ lotNumber: l.lot_number, kgOnHand: l.kg_on_hand, expiresDay: daysBetween(today, epochToDate(l.expires_at)) })),
      demands,
      arrivals,
    },
    horizonDays,
  );
  const date = (d: number | null) => (d === null ? null : addDays(today, d));
  return {
    coatingId: k.id,
    code: k.code,
    name: k.name,
    kind: k.kind,
    swatchHex: k.swatch_hex,
    supplierName: k.supplier_name,
    supplierEmail: k.supplier_email,
    containerKind: k.container_kind,
    containerKg: k.container_kg,
    leadTimeDays: k.lead_time_days,
    reorderPointKg: k.reorder_point_kg,
    demandKg: f.demandKg,
    stockKg: f.stockKg,
    incomingKg: f.incomingKg,
    stockOutDate: date(f.stockOutDay),
    reorderDate: date(f.reorderDay),
    shortfallKg: f.shortfallKg,
    closingStockKg: f.closingStockKg,
    orderKg: f.orderKg,
    orderContainers: f.orderContainers,
    latestOrderDate: date(f.latestOrderDay),
    orderLate: f.latestOrderDay !== null && f.latestOrderDay < 0,
    expiringLots: f.expiringLots.map((l) => ({ lotNumber: l.lotNumber, expiryDate: addDays(today, l.expiresDay), wastedKg: l.wastedKg })),
    series: f.series.map((p) => ({ date: addDays(today, p.day), stockKg: p.stockKg })),
    demands: demands.map((d) => d.view),
    arrivals: arrivals.map((a) => ({ reference: a.reference, date: a.date, kg: a.kg })),
  };
}

/** The forecast as CSV rows, one per coating. */
export function forecastCsvRows(f: ForecastView): Record<string, string | number>[] {
  return f.coatings.map((c) => ({
    code: c.code,
    name: c.name,
    kind: c.kind,
    supplier: c.supplierName,
    demand_kg: round(c.demandKg),
    stock_kg: round(c.stockKg),
    incoming_kg: round(c.incomingKg),
    stock_out_date: c.stockOutDate ?? "",
    shortfall_kg: round(c.shortfallKg),
    closing_stock_kg: round(c.closingStockKg),
    order_containers: c.orderContainers,
    container_kg: c.containerKg,
    latest_order_date: c.latestOrderDate ?? "",
    expiring_lots: c.expiringLots.map((l) => `${l.lotNumber} ${l.expiryDate} ${round(l.wastedKg)} kg`).join("; "),
  }));
}

const round = (x: number) => Math.round(x * 1000) / 1000;
