/** Forecast query: the horizon in days, at most a year. */
import { MAX_HORIZON_DAYS } from "@/lib/forecast/forecast";

export const DEFAULT_HORIZON_DAYS = 28;

export const HORIZON_MESSAGE = `Enter a whole number of days from 1 to ${MAX_HORIZON_DAYS} (at most a year).`;

/** `horizonDays` from a query string, or null when it is not a whole number 1 … 366. */
export function horizonDaysOf(raw: string | null): number | null {
  if (raw === null || raw === "") return DEFAULT_HORIZON_DAYS;
  const n = /^\d{1,6}$/.test(raw) ? Number(raw) : NaN;
  return Number.isInteger(n) && n >= 1 && n <= MAX_HORIZON_DAYS ? n : null;
}
