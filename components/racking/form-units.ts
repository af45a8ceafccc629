// Form fields hold what the user typed, in their display units; the API takes metric values.

import { formatSignificant, fromDisplay, toDisplay, unitLabel, type QuantityKind, type UnitSystem } from "@/lib/coating-math/display-units";

/** A metric value as the text a field starts with, in `system` (4 significant figures). */
export function fieldText(kind: QuantityKind | null, metricValue: number, system: UnitSystem): string {
  const shown = kind ? toDisplay(kind, metricValue, system).value : metricValue;
  return formatSignificant(shown, 4);
}

/** Typed text → a number, or null when it is not one ("1,5" is read as 1.5). */
export function parseNumber(text: string): number | null {
  const t = text.trim().replace(",", ".");
  if (t === "" || !/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(t)) return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : null;
}

/** Typed text in `system` → the metric value, or null when it is not a number. */
export function metricFrom(kind: QuantityKind | null, text: string, system: UnitSystem): number | null {
  const n = parseNumber(text);
  if (n === null) return null;
  return kind ? fromDisplay(kind, n, system) : n;
}

/** The same quantity re-typed for another unit system (the unit switch in the header). */
export function convertText(kind: QuantityKind | null, text: string, from: UnitSystem, to: UnitSystem): string {
  if (!kind || from === to) return text;
  const metric = metricFrom(kind, text, from);
  return metric === null ? text : fieldText(kind, metric, to);
}

export function withUnit(label: string, kind: QuantityKind | null, system: UnitSystem, unitless?: string): string {
  return kind ? `${label} (${unitLabel(kind, system)})` : unitless ? `${label} (${unitless})` : label;
}
