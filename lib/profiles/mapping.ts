/**
 * Column mapping of a logger file: which column is time (and in what form), the temperature
 * unit, which probe measured the oven air and which probes were clamped to parts of what section
 * thickness. `mapProfile` turns a table and a mapping into metric series (seconds from the first
 * reading, °C) and lists every problem with its row and column; nothing is stored until the list
 * is empty.
 */
import { convert, formatSignificant } from "../coating-math/display-units";
import { readClockCell, readNumberCell, type CsvTable } from "./csv-table";
import type { ProfileProblem } from "./problems";

export const TIME_FORMATS = ["seconds", "minutes", "clock"] as const;
export type TimeFormat = (typeof TIME_FORMATS)[number];
export const TEMPERATURE_UNITS = ["C", "F"] as const;
export type TemperatureUnit = (typeof TEMPERATURE_UNITS)[number];

export interface ProbeMapping {
  column: string;
  /** what the probe sat on ("Bench leg", "Base plate"); the column's name when empty */
  label: string;
  /** section thickness of the part under the probe (equivalent thickness 2·V/A) */
  thicknessMm: number | null;
}

export interface ColumnMapping {
  timeColumn: string | null;
  timeFormat: TimeFormat;
  temperatureUnit: TemperatureUnit;
  airColumn: string | null;
  probes: ProbeMapping[];
}

export interface ProbeSeries {
  column: string;
  label: string;
  thicknessMm: number;
  tempsC: number[];
}

/** A profile in metric: time from the first reading, temperatures in °C. */
export interface ProfileSeries {
  timeS: number[];
  airC: number[];
  probes: ProbeSeries[];
}

export interface MappedProfile {
  /** null while any problem remains */
  series: ProfileSeries | null;
  problems: ProfileProblem[];
}

/** A probe that warms less than this over the whole run is taken as disconnected (common practice, no source). */
export const MIN_PROBE_RISE_K = 20;
/** Readings outside this range are a thermocouple fault (open circuit codes like −999 or 9999), not a temperature. */
export const PLAUSIBLE_C = { min: -50, max: 700 } as const;
export const MIN_PROFILE_ROWS = 10;
/** At most this many cell problems are listed one by one; the rest are counted. */
export const MAX_LISTED_PROBLEMS = 100;
const DAY_S = 86_400;
const HALF_DAY_S = DAY_S / 2;

// °F → °C is affine; its two constants come from mathjs once, not from hand-typed factors.
const F_OFFSET_C = convert(0, "degF", "degC");
const F_SCALE = convert(1, "degF", "degC") - F_OFFSET_C;
const S_PER_MIN = convert(1, "min", "s");

export function toCelsius(value: number, unit: TemperatureUnit): number {
  return unit === "C" ? value : F_OFFSET_C + F_SCALE * value;
}

const TIME_HEADER = /\b(time|elapsed|clock|seconds?|secs?|minutes?|mins?|zeit|hh:mm)\b|^t$|\(s\)|\(min\)/i;
const AIR_HEADER = /\b(air|oven|ambient|amb)\b/i;

/** A first guess of the mapping from the header and the first readings; thicknesses are left for the user. */
export function suggestMapping(table: CsvTable): ColumnMapping {
  const first = table.rows.slice(0, 20);
  const isClock = (i: number) => first.length > 0 && first.every((r) => Number.isFinite(readClockCell(r.cells[i])) && r.cells[i].includes(":"));
  const isNumeric = (i: number) => first.length > 0 && first.every((r) => Number.isFinite(readNumberCell(r.cells[i], table.decimalComma)));
  const columns = table.header.map((name, i) => ({ name, i }));
  const named = columns.find((c) => TIME_HEADER.test(c.name) && (isClock(c.i) || isNumeric(c.i)));
  const time = named ?? columns.find((c) => isClock(c.i));
  let timeFormat: TimeFormat = "seconds";
  if (time) {
    if (isClock(time.i)) timeFormat = "clock";
    else if (/\bmin(ute)?s?\b|\(min\)/i.test(time.name)) timeFormat = "minutes";
  }
  const temperatureUnit: TemperatureUnit = table.header.some((h) => /°\s*F\b|\bdeg\s*F\b|\(F\)|\bfahrenheit\b/i.test(h)) ? "F" : "C";
  const others = columns.filter((c) => c !== time && isNumeric(c.i));
  const air = others.find((c) => AIR_HEADER.test(c.name)) ?? null;
  return {
    timeColumn: time?.name ?? null,
    timeFormat,
    temperatureUnit,
    airColumn: air?.name ?? null,
    probes: others.filter((c) => c !== air).map((c) => ({ column: c.name, label: c.name, thicknessMm: null })),
  };
}

function timeText(s: number, format: TimeFormat): string {
  if (format !== "clock") return `${formatSignificant(format === "minutes" ? s / S_PER_MIN : s, 6)} ${format === "minutes" ? "min" : "s"}`;
  const day = ((s % DAY_S) + DAY_S) % DAY_S;
  const pad = (n: number) => String(Math.floor(n)).padStart(2, "0");
  return `${pad(day / 3600)}:${pad((day % 3600) / 60)}:${pad(day % 60)}`;
}

/** Checks the mapping against the table and reads the series; every problem is listed. */
export function mapProfile(table: CsvTable, mapping: ColumnMapping): MappedProfile {
  const problems: ProfileProblem[] = [];
  let cellProblems = 0;
  const cell = (p: ProfileProblem) => {
    cellProblems += 1;
    if (cellProblems <= MAX_LISTED_PROBLEMS) problems.push(p);
  };
  const index = new Map(table.header.map((h, i) => [h, i]));
  const columnIndex = (field: string, name: string | null, missing: string): number | null => {
    if (name === null || name.trim() === "") {
      problems.push({ field, message: missing });
      return null;
    }
    const i = index.get(name);
    if (i === undefined) {
      problems.push({ field, column: name, message: `The file has no column named "${name}" (its columns: ${table.header.join(", ")}).` });
      return null;
    }
    return i;
  };

  const timeAt = columnIndex(
    "mapping.timeColumn",
    mapping.timeColumn,
    "No time column: choose the column that holds the time of each reading (seconds, minutes or clock times hh:mm:ss). A file without one cannot be read as a profile.",
  );
  const airAt = columnIndex(
    "mapping.airColumn",
    mapping.airColumn,
    "No air probe: choose the column of the probe that measured the oven air. The heat-transfer fit needs the air temperature beside each part's.",
  );
  if (mapping.probes.length === 0) {
    problems.push({ field: "mapping.probes", message: "Map at least one probe clamped to a part." });
  }
  const used = new Map<number, string>();
  if (timeAt !== null) used.set(timeAt, "the time");
  if (airAt !== null) {
    if (used.has(airAt)) problems.push({ field: "mapping.airColumn", column: mapping.airColumn!, message: `Column "${mapping.airColumn}" is already mapped as ${used.get(airAt)}.` });
    else used.set(airAt, "the air probe");
  }
  const probeAt = mapping.probes.map((p, k) => {
    const i = columnIndex(`mapping.probes.${k}.column`, p.column, `Choose the column of part probe ${k + 1}.`);
    if (i !== null) {
      if (used.has(i)) {
        problems.push({ field: `mapping.probes.${k}.column`, column: p.column, message: `Column "${p.column}" is already mapped as ${used.get(i)}.` });
      } else used.set(i, `part probe ${k + 1}`);
    }
    const name = p.label.trim() || p.column;
    if (p.thicknessMm === null || !Number.isFinite(p.thicknessMm) || p.thicknessMm <= 0) {
      problems.push({ field: `mapping.probes.${k}.thicknessMm`, column: p.column, message: `Enter the section thickness of the part under probe "${name}" (above 0 mm).` });
    }
    return i;
  });

  if (table.rows.length < MIN_PROFILE_ROWS) {
    problems.push({ field: "csv", message: `The file has ${table.rows.length} row${table.rows.length === 1 ? "" : "s"} of readings; a profile needs at least ${MIN_PROFILE_ROWS}.` });
  }

  // Times: read, put on one scale (clock times may pass midnight), strictly increasing.
  const times: number[] = [];
  if (timeAt !== null) {
    const name = table.header[timeAt];
    let dayOffset = 0;
    let prev: { s: number; row: number } | null = null;
    for (const r of table.rows) {
      const raw = r.cells[timeAt].trim();
      let s = Number.NaN;
      if (mapping.timeFormat === "clock") s = readClockCell(raw);
      else {
        const v = readNumberCell(raw, table.decimalComma);
        s = mapping.timeFormat === "minutes" ? v * S_PER_MIN : v;
      }
      if (!Number.isFinite(s)) {
        const expected = mapping.timeFormat === "clock" ? "a clock time hh:mm:ss" : `a number of ${mapping.timeFormat}`;
        cell({ field: "csv", row: r.line, column: name, message: raw === "" ? `Row ${r.line}, column "${name}": the time is missing.` : `Row ${r.line}, column "${name}": "${raw}" is not ${expected}.` });
        times.push(Number.NaN);
        continue;
      }
      // a clock reading far below the last one has passed midnight
      if (mapping.timeFormat === "clock" && prev && s + dayOffset < prev.s - HALF_DAY_S && s < DAY_S) dayOffset += DAY_S;
      s += dayOffset;
      if (prev && !(s > prev.s)) {
        const what = s === prev.s ? "repeats the time of row" : "is earlier than row";
        cell({
          field: "csv",
          row: r.line,
          column: name,
          message: `Row ${r.line}, column "${name}": ${timeText(s, mapping.timeFormat)} ${what} ${prev.row} (${timeText(prev.s, mapping.timeFormat)}); times must increase from row to row (a repeated or out-of-order row?).`,
        });
      }
      times.push(s);
      prev = { s, row: r.line };
    }
  }

  // Temperatures: numbers in the chosen unit, converted to °C, inside the plausible range.
  const readColumn = (i: number): number[] => {
    const name = table.header[i];
    return table.rows.map((r) => {
      const raw = r.cells[i].trim();
      const v = readNumberCell(raw, table.decimalComma);
      if (!Number.isFinite(v)) {
        cell({ field: "csv", row: r.line, column: name, message: raw === "" ? `Row ${r.line}, column "${name}": the temperature is missing.` : `Row ${r.line}, column "${name}": "${raw}" is not a number.` });
        return Number.NaN;
      }
      const c = toCelsius(v, mapping.temperatureUnit);
      if (c < PLAUSIBLE_C.min || c > PLAUSIBLE_C.max) {
        cell({
          field: "csv",
          row: r.line,
          column: name,
          message: `Row ${r.line}, column "${name}": ${raw} °${mapping.temperatureUnit} is outside ${PLAUSIBLE_C.min}…${PLAUSIBLE_C.max} °C; a thermocouple fault or open circuit? (Check the unit too.)`,
        });
        return Number.NaN;
      }
      return c;
    });
  };

  // A probe that barely warms was not in the oven or is not connected.
  const checkRise = (values: number[], field: string, column: string, what: string) => {
    const ok = values.filter(Number.isFinite);
    if (ok.length < 2) return;
    const rise = Math.max(...ok) - ok[0];
    if (rise < MIN_PROBE_RISE_K) {
      problems.push({
        field,
        column,
        message: `${what} (column "${column}") rises only ${formatSignificant(Math.max(rise, 0), 2)} K over the run (at least ${MIN_PROBE_RISE_K} K expected): disconnected, not clamped, or not the column you meant?`,
      });
    }
  };

  const air = airAt !== null ? readColumn(airAt) : null;
  if (air && airAt !== null) checkRise(air, "mapping.airColumn", table.header[airAt], "The air probe");
  const probes = mapping.probes.map((p, k) => {
    const i = probeAt[k];
    if (i === null) return null;
    const values = readColumn(i);
    checkRise(values, `mapping.probes.${k}.column`, table.header[i], `Probe "${p.label.trim() || p.column}"`);
    return values;
  });

  if (cellProblems > MAX_LISTED_PROBLEMS) {
    problems.push({ field: "csv", message: `…and ${cellProblems - MAX_LISTED_PROBLEMS} more bad cells not listed.` });
  }
  if (problems.length || air === null || timeAt === null) return { series: null, problems };
  const t0 = times[0];
  return {
    series: {
      timeS: times.map((t) => t - t0),
      airC: air,
      probes: mapping.probes.map((p, k) => ({
        column: p.column,
        label: p.label.trim() || p.column,
        thicknessMm: p.thicknessMm!,
        tempsC: probes[k]!,
      })),
    },
    problems,
  };
}
