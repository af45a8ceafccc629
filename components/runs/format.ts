// Numbers on the run screens, in the user's unit system (stored values are metric).
import { formatQuantity, formatSignificant, type QuantityKind, type UnitSystem } from "@/lib/coating-math/display-units";

export function q(kind: QuantityKind, value: number, system: UnitSystem, sig = 3): string {
  return formatQuantity(kind, value, system, sig);
}

/** "1 h 38 min" for long spans, "38.5 min" for short ones, "40 s" under a minute. */
export function duration(min: number): string {
  if (min !== 0 && Math.abs(min) < 1) return `${Math.round(min * 60)} s`;
  if (Math.abs(min) < 60) return `${formatSignificant(min, 3)} min`;
  const sign = min < 0 ? "−" : "";
  const m = Math.round(Math.abs(min));
  return `${sign}${Math.floor(m / 60)} h ${String(m % 60).padStart(2, "0")} min`;
}

/** Money in the plant's currency; an unknown code still shows the number. */
export function money(amount: number, currency: string): string {
  try {
    return new Intl.NumberFormat("en-US", { style: "currency", currency }).format(amount);
  } catch {
    return `${amount.toFixed(2)} ${currency}`;
  }
}

export function percent(fraction: number): string {
  return `${formatSignificant(fraction * 100, 3)} %`;
}

/** "2026-12-03" → "Thu 3 Dec 2026" (the day as stored, no time-zone shift). */
export function dayLabel(date: string): string {
  const d = new Date(`${date}T00:00:00Z`);
  if (Number.isNaN(d.getTime())) return date;
  return d.toLocaleDateString("en-GB", { weekday: "short", day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });
}

/** Today in the browser's time zone as YYYY-MM-DD. */
export function localToday(): string {
  const d = new Date();
  return `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, "0")}-${String(d.getDate()).padStart(2, "0")}`;
}

export function addDays(date: string, days: number): string {
  const t = Date.parse(`${date}T00:00:00Z`) + days * 86_400_000;
  return new Date(t).toISOString().slice(0, 10);
}

export function plural(n: number, one: string, many = `${one}s`): string {
  return `${n.toLocaleString("en-US")} ${n === 1 ? one : many}`;
}
