/**
 * Numbers on the throughput screen in the user's unit system. The conversion factors come from
 * the server (worked out through mathjs in lib/server/throughput.ts#unitTable) so this client
 * code carries no unit library and no typed factor: shown = stored × factor + offset.
 */
import type { ShownKind, UnitTable } from "@/lib/server/throughput";

export type { ShownKind, UnitTable };

export function toShown(units: UnitTable, kind: ShownKind, stored: number): number {
  const u = units[kind];
  return stored * u.factor + u.offset;
}

export function fromShown(units: UnitTable, kind: ShownKind, shown: number): number {
  const u = units[kind];
  return (shown - u.offset) / u.factor;
}

/**
 * `n` significant figures, never in exponent form, integer digits kept, trailing zeros trimmed;
 * whole numbers of four digits or more get thousands separators (2,434).
 */
export function sig(value: number, n = 3): string {
  if (!Number.isFinite(value)) return "–";
  if (value === 0) return "0";
  const digits = Math.floor(Math.log10(Math.abs(value))) + 1;
  if (digits >= n) return Math.round(value).toLocaleString("en-US");
  const text = String(Number(value.toFixed(Math.min(n - digits, 20))));
  return text === "-0" ? "0" : text;
}

/** "3.04 m/min", "9.98 ft/min". */
export function show(units: UnitTable, kind: ShownKind, stored: number, n = 3): string {
  return `${sig(toShown(units, kind, stored), n)} ${units[kind].label}`;
}

export function unitOf(units: UnitTable, kind: ShownKind): string {
  return units[kind].label;
}

/** The text a field starts with for a stored value (4 significant figures, no separators). */
export function fieldText(units: UnitTable, kind: ShownKind | null, stored: number): string {
  const v = kind ? toShown(units, kind, stored) : stored;
  return sig(v, 4).replace(/,/g, "");
}

/** Typed text → a number, or null ("1,5" reads as 1.5; "" is null). */
export function parseNumber(text: string): number | null {
  const t = text.trim().replace(",", ".");
  if (t === "" || !/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(t)) return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : null;
}

/** Typed text in the shown unit → the stored metric value, or null. */
export function storedFrom(units: UnitTable, kind: ShownKind | null, text: string): number | null {
  const n = parseNumber(text);
  if (n === null) return null;
  return kind ? fromShown(units, kind, n) : n;
}

export function money(value: number, currency: string): string {
  try {
    return new Intl.NumberFormat("en-US", { style: "currency", currency, minimumFractionDigits: 2, maximumFractionDigits: value < 1 ? 3 : 2 }).format(value);
  } catch {
    return `${value.toFixed(2)} ${currency}`;
  }
}
