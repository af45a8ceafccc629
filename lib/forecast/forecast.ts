/**
 * Material forecast, pure: one coating's stock walked day by day over a horizon. Lots are used
 * first-expiry-first-out (FEFO); a lot past its expiry is written off; open purchase requests arrive
 * on their expected day; planned runs take their material on their day. From the walk: the day
 * stock runs out, the shortfall, the order in whole containers, the latest day to order given the
 * supplier's lead time, and the lots that expire before they are used.
 * Days are whole days counted from today (day 0).
 */
import { DomainError, requireInRange } from "../coating-math/errors";
import { tolerantCeil } from "../coating-math/compare";

/** A year and a day: the longest horizon asked for (leap years). */
export const MAX_HORIZON_DAYS = 366;

export interface ForecastLot {
  lotNumber: string;
  kgOnHand: number;
  /** the first day the lot may no longer be used */
  expiresDay: number;
}

export interface ForecastDemand {
  day: number;
  kg: number;
  runId: number;
}

export interface ForecastArrival {
  day: number;
  kg: number;
  reference: string;
  /** expiry of the delivered lot; never within the horizon when left out */
  expiresDay?: number;
}

export interface ForecastCoatingInput {
  containerKg: number;
  leadTimeDays: number;
  reorderPointKg: number;
  lots: readonly ForecastLot[];
  demands: readonly ForecastDemand[];
  arrivals: readonly ForecastArrival[];
}

export interface ExpiringLot {
  lotNumber: string;
  expiresDay: number;
  /** kg still in the lot when it expires */
  wastedKg: number;
}

export interface ForecastPoint {
  day: number;
  /** usable stock at the end of the day */
  stockKg: number;
}

export interface CoatingForecast {
  demandKg: number;
  /** usable stock today (lots not yet expired) */
  stockKg: number;
  incomingKg: number;
  /** first day a run's need is not met in full, or null */
  stockOutDay: number | null;
  /** first day the closing stock falls below the reorder point, or null */
  reorderDay: number | null;
  shortfallKg: number;
  closingStockKg: number;
  /** kg to order: shortfall plus the reorder point, less what is left at the end */
  orderKg: number;
  orderContainers: number;
  /** (stock-out or reorder day) − lead time; negative means already late; null when nothing is needed */
  latestOrderDay: number | null;
  expiringLots: ExpiringLot[];
  series: ForecastPoint[];
}

interface Held {
  lotNumber: string;
  kg: number;
  expiresDay: number;
}

function checkInput(input: ForecastCoatingInput, horizonDays: number): void {
  requireInRange("horizonDays", horizonDays, { gte: 1, lte: MAX_HORIZON_DAYS, integer: true });
  requireInRange("containerKg", input.containerKg, { gt: 0 });
  requireInRange("leadTimeDays", input.leadTimeDays, { gte: 0 });
  requireInRange("reorderPointKg", input.reorderPointKg, { gte: 0 });
  input.lots.forEach((l, i) => requireInRange(`lots.${i}.kgOnHand`, l.kgOnHand, { gte: 0 }));
  input.demands.forEach((d, i) => requireInRange(`demands.${i}.kg`, d.kg, { gte: 0 }));
  input.arrivals.forEach((a, i) => requireInRange(`arrivals.${i}.kg`, a.kg, { gte: 0 }));
}

/** Forecast of one coating over days 0 … horizonDays − 1. */
export function forecastCoating(input: ForecastCoatingInput, horizonDays: number): CoatingForecast {
  checkInput(input, horizonDays);
  const held: Held[] = input.lots.filter((l) => l.kgOnHand > 0).map((l) => ({ lotNumber: l.lotNumber, kg: l.kgOnHand, expiresDay: l.expiresDay }));
  const stockKg = held.filter((l) => l.expiresDay > 0).reduce((a, l) => a + l.kg, 0);
  const inHorizon = <T extends { day: number }>(xs: readonly T[]) => xs.filter((x) => x.day >= 0 && x.day < horizonDays);
  const demands = inHorizon(input.demands);
  const arrivals = inHorizon(input.arrivals);
  const expiringLots: ExpiringLot[] = [];
  const series: ForecastPoint[] = [];
  let stockOutDay: number | null = null;
  let reorderDay: number | null = null;
  let shortfallKg = 0;

  for (let day = 0; day < horizonDays; day++) {
    for (const a of arrivals.filter((x) => x.day === day)) {
      held.push({ lotNumber: a.reference, kg: a.kg, expiresDay: a.expiresDay ?? Number.POSITIVE_INFINITY });
    }
    // write off what expires today, before any run may use it
    for (const l of held) {
      if (l.expiresDay <= day && l.kg > 0) {
        if (l.expiresDay >= 0 && l.expiresDay < horizonDays) expiringLots.push({ lotNumber: l.lotNumber, expiresDay: l.expiresDay, wastedKg: l.kg });
        l.kg = 0;
      }
    }
    // FEFO: the lot that expires first is used first
    held.sort((a, b) => a.expiresDay - b.expiresDay);
    let need = demands.filter((d) => d.day === day).reduce((a, d) => a + d.kg, 0);
    for (const l of held) {
      if (need <= 0) break;
      const take = Math.min(l.kg, need);
      l.kg -= take;
      need -= take;
    }
    // float noise below a gram is not a stock-out
    if (need > 0) shortfallKg += need;
    if (need > 1e-3) stockOutDay ??= day;
    const closing = held.reduce((a, l) => a + l.kg, 0);
    if (closing < input.reorderPointKg) reorderDay ??= day;
    series.push({ day, stockKg: closing });
  }

  const closingStockKg = series.length ? series[series.length - 1].stockKg : stockKg;
  const orderKg = Math.max(0, shortfallKg + input.reorderPointKg - closingStockKg);
  const orderContainers = orderKg > 0 ? tolerantCeil(orderKg / input.containerKg) : 0;
  const attentionDay = stockOutDay ?? reorderDay;
  return {
    demandKg: demands.reduce((a, d) => a + d.kg, 0),
    stockKg,
    incomingKg: arrivals.reduce((a, x) => a + x.kg, 0),
    stockOutDay,
    reorderDay,
    shortfallKg,
    closingStockKg,
    orderKg,
    orderContainers,
    latestOrderDay: attentionDay === null || orderContainers === 0 ? null : attentionDay - input.leadTimeDays,
    expiringLots,
    series,
  };
}

/** Powder as sprayed: deposited mass ÷ utilisation; deposited kg = area × film × SG / 1000. */
export function powderSprayedKg(input: { areaM2: number; filmUm: number; specificGravity: number; utilisation: number }): number {
  requireInRange("areaM2", input.areaM2, { gte: 0 });
  requireInRange("filmUm", input.filmUm, { gt: 0 });
  requireInRange("specificGravity", input.specificGravity, { gt: 0 });
  requireInRange("utilisation", input.utilisation, { gt: 0, lte: 1 });
  return depositedKg(input) / input.utilisation;
}

/** Deposited film mass. Source: Products Finishing coverage, metric form m²/kg = 1000 / (SG × µm). */
export function depositedKg(input: { areaM2: number; filmUm: number; specificGravity: number }): number {
  return (input.areaM2 * input.filmUm * input.specificGravity) / 1000;
}

/**
 * E-coat paint as supplied: deposited solids ÷ weight solids, plus a loss allowance (drag-out,
 * ultrafiltrate; Products Finishing "Estimating the Electrocoat Usage of a Part" — "plus losses").
 */
export function ecoatPaintKg(input: { depositedSolidsKg: number; weightSolidsFraction: number; lossAllowanceFraction: number }): number {
  requireInRange("depositedSolidsKg", input.depositedSolidsKg, { gte: 0 });
  requireInRange("weightSolidsFraction", input.weightSolidsFraction, { gt: 0, lte: 1 });
  requireInRange("lossAllowanceFraction", input.lossAllowanceFraction, { gte: 0, lt: 1 });
  return (input.depositedSolidsKg / input.weightSolidsFraction) * (1 + input.lossAllowanceFraction);
}

/** E-coat loss allowance applied in the forecast (common practice, no source). */
export const ECOAT_LOSS_ALLOWANCE_FRACTION = 0.1;

/** Days from `fromDay` to `toDay`, both "YYYY-MM-DD". */
export function daysBetween(fromDate: string, toDate: string): number {
  const a = Date.parse(`${fromDate}T00:00:00Z`);
  const b = Date.parse(`${toDate}T00:00:00Z`);
  if (Number.isNaN(a) || Number.isNaN(b)) throw new DomainError("date", "Enter dates as YYYY-MM-DD.");
  return Math.round((b - a) / 86_400_000);
}

export function addDays(date: string, days: number): string {
  return new Date(Date.parse(`${date}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
}
