/**
 * The change log of film checks in words: "who, when, field: old → new", with film values in the
 * reader's unit (µm or mil). The log stores the film check's stored columns before and after each
 * change; this turns a pair of them into lines a person can check. Pure: no next, react, db.
 */
import { convert, type UnitSystem } from "../coating-math/display-units";
import { flattenReadings } from "./readings";

/** A film check's stored columns as the log keeps them (old_json / new_json). */
export interface StoredFilmCheck {
  coat_position: number;
  rule: "sspc-pa2" | "iso19840";
  spec_min_um: number | null;
  spec_max_um: number | null;
  nominal_um: number | null;
  gauge_id: number | null;
  /** JSON text: number[][][] (SSPC-PA 2) or number[] (ISO 19840), µm */
  readings_json: string;
  notes: string;
}

export interface LogChange {
  field: string;
  from: string;
  to: string;
}

export interface LogDescription {
  summary: string;
  changes: LogChange[];
}

export interface LogContext {
  system: UnitSystem;
  /** "coat 2 (PP-430)" for a coat index */
  coatLabel: (coatIndex: number) => string;
  /** a gauge's name, or null when it is gone */
  gaugeName: (gaugeId: number) => string | null;
}

/** Past this many changed readings the log says how many changed instead of listing each. */
export const MAX_READING_LINES = 8;

/** A film thickness (µm) in the reader's unit: 1 decimal in µm, 2 in mil. */
export function filmText(valueUm: number, system: UnitSystem): string {
  if (system === "us") return `${Number(convert(valueUm, "um", "mil").toFixed(2))} mil`;
  return `${Number(valueUm.toFixed(1))} µm`;
}

type Readings = number[] | number[][][];

function parseReadings(text: unknown): Readings {
  if (typeof text !== "string") return [];
  try {
    const v = JSON.parse(text) as unknown;
    return Array.isArray(v) ? (v as Readings) : [];
  } catch {
    return [];
  }
}

/** The log's JSON of a film check, or null; early records kept only the readings array. */
export function asStoredCheck(value: unknown): Partial<StoredFilmCheck> | null {
  if (Array.isArray(value)) return { readings_json: JSON.stringify(value) };
  if (value && typeof value === "object") return value as Partial<StoredFilmCheck>;
  return null;
}

function readingsSummary(readings: Readings, system: UnitSystem): string {
  const flat = flattenReadings(readings);
  if (!flat.length) return "no readings";
  const mean = flat.reduce((a, b) => a + b, 0) / flat.length;
  return `${flat.length} reading${flat.length === 1 ? "" : "s"}, mean ${filmText(mean, system)}`;
}

/** Position labels and values of every reading, or null when the two shapes differ. */
function pairedReadings(a: Readings, b: Readings): { label: string; from: number; to: number }[] | null {
  if (a.length !== b.length) return null;
  const out: { label: string; from: number; to: number }[] = [];
  for (let i = 0; i < a.length; i++) {
    const x = a[i];
    const y = b[i];
    if (typeof x === "number" && typeof y === "number") {
      out.push({ label: `reading ${i + 1}`, from: x, to: y });
      continue;
    }
    if (!Array.isArray(x) || !Array.isArray(y) || x.length !== y.length) return null;
    for (let j = 0; j < x.length; j++) {
      const sx = x[j];
      const sy = y[j];
      if (!Array.isArray(sx) || !Array.isArray(sy) || sx.length !== sy.length) return null;
      for (let k = 0; k < sx.length; k++) out.push({ label: `area ${i + 1}, spot ${j + 1}, reading ${k + 1}`, from: sx[k], to: sy[k] });
    }
  }
  return out;
}

function readingChanges(oldText: unknown, newText: unknown, system: UnitSystem): LogChange[] {
  const a = parseReadings(oldText);
  const b = parseReadings(newText);
  const pairs = pairedReadings(a, b);
  if (pairs) {
    const changed = pairs.filter((p) => p.from !== p.to);
    if (changed.length === 0) return [];
    if (changed.length <= MAX_READING_LINES) {
      return changed.map((p) => ({ field: p.label, from: filmText(p.from, system), to: filmText(p.to, system) }));
    }
    return [{ field: `readings (${changed.length} changed)`, from: readingsSummary(a, system), to: readingsSummary(b, system) }];
  }
  return [{ field: "readings", from: readingsSummary(a, system), to: readingsSummary(b, system) }];
}

const ruleText = (r: unknown) => (r === "iso19840" ? "ISO 19840" : r === "sspc-pa2" ? "SSPC-PA 2" : "—");

/** Differences between two stored versions, one line per field that changed. */
export function filmCheckChanges(before: Partial<StoredFilmCheck>, after: Partial<StoredFilmCheck>, ctx: LogContext): LogChange[] {
  const { system } = ctx;
  const changes: LogChange[] = [];
  const spec = (v: number | null | undefined, blank: string) => (v === null || v === undefined ? blank : filmText(v, system));
  const gauge = (id: number | null | undefined) => (id === null || id === undefined ? "not recorded" : (ctx.gaugeName(id) ?? `gauge ${id} (deleted)`));
  const notes = (n: string | undefined) => (n ? `“${n}”` : "none");

  if (before.coat_position !== after.coat_position && after.coat_position !== undefined) {
    changes.push({ field: "coat", from: before.coat_position === undefined ? "—" : ctx.coatLabel(before.coat_position), to: ctx.coatLabel(after.coat_position) });
  }
  if (before.rule !== after.rule && after.rule !== undefined) changes.push({ field: "rule", from: ruleText(before.rule), to: ruleText(after.rule) });
  if (before.spec_min_um !== after.spec_min_um) {
    changes.push({ field: "spec minimum", from: spec(before.spec_min_um, "the coating's"), to: spec(after.spec_min_um, "the coating's") });
  }
  if (before.spec_max_um !== after.spec_max_um) {
    changes.push({ field: "spec maximum", from: spec(before.spec_max_um, "the coating's"), to: spec(after.spec_max_um, "the coating's") });
  }
  if (before.nominal_um !== after.nominal_um) {
    changes.push({ field: "nominal", from: spec(before.nominal_um, "the spec minimum"), to: spec(after.nominal_um, "the spec minimum") });
  }
  if (before.gauge_id !== after.gauge_id) changes.push({ field: "gauge", from: gauge(before.gauge_id), to: gauge(after.gauge_id) });
  if (before.readings_json !== after.readings_json) changes.push(...readingChanges(before.readings_json, after.readings_json, system));
  if ((before.notes ?? "") !== (after.notes ?? "")) changes.push({ field: "notes", from: notes(before.notes), to: notes(after.notes) });
  return changes;
}

/** One log row of a film check in words. */
export function describeFilmCheckLog(action: string, oldValue: unknown, newValue: unknown, ctx: LogContext): LogDescription {
  const before = asStoredCheck(oldValue);
  const after = asStoredCheck(newValue);
  const subject = (v: Partial<StoredFilmCheck> | null) =>
    v?.coat_position === undefined ? "a film check" : `${ctx.coatLabel(v.coat_position)}${v.rule ? `, ${ruleText(v.rule)}` : ""}`;
  if (action === "create") {
    return { summary: `Recorded ${subject(after)}: ${readingsSummary(parseReadings(after?.readings_json), ctx.system)}.`, changes: [] };
  }
  if (action === "delete") {
    return { summary: `Deleted ${subject(before)} (${readingsSummary(parseReadings(before?.readings_json), ctx.system)}).`, changes: [] };
  }
  const changes = filmCheckChanges(before ?? {}, after ?? {}, ctx);
  return { summary: changes.length ? `Edited ${subject(after)}.` : `Saved ${subject(after)} without changes.`, changes };
}
