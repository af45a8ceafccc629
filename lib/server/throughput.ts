import { getDb, type Db } from "@/db/index";
import { curePointsOf, findCoatingRow, listCoatingRows } from "@/db/queries/coatings";
import { listLineRows } from "@/db/queries/lines";
import { findPartFigures, findScenarioRows } from "@/db/queries/scenarios";
import { convert, formatQuantity, type UnitSystem } from "@/lib/coating-math/units";
import {
  bestPerMeasure,
  throughputFigures,
  type CompareLine,
  type ComparePart,
  type FigureWords,
  type Measure,
  type ScenarioOverrides,
  type ThroughputFigures,
} from "@/lib/lines/throughput-compare";
import type { ThroughputCompareBody } from "@/lib/validation/scenarios";
import { ApiError } from "./http";
import { plantSettings } from "./plant";
import { lineForCompare, parseOverrides, toCompareLine } from "./scenarios";

/**
 * The part the home panel and the comparison screen start from: an invented bench end frame of
 * 2 mm steel (figures entered by hand, not from the catalogue).
 */
export const REFERENCE_PART = {
  label: "Reference part: bench end frame",
  areaM2: 0.8,
  insideAreaM2: 0,
  massKg: 6.5,
  thicknessMm: 2,
  lengthMm: 450,
  widthMm: 60,
  heightMm: 700,
} as const;

export interface CompareColumn {
  label: string;
  source: "line" | "scenario";
  lineId: number;
  scenarioId: number | null;
  lineName: string;
  overrides: ScenarioOverrides;
  figures: ThroughputFigures;
}

export interface ThroughputComparison {
  part: ComparePart & { partId: string | null; label: string };
  coating: {
    id: number;
    code: string;
    name: string;
    specificGravity: number;
    pricePerKg: number;
    filmUm: number;
    firstPassEfficiency: number;
    reclaimEfficiency: number;
  };
  currency: string;
  shiftHours: number;
  columns: CompareColumn[];
  /** per measure, the indexes of the best columns */
  best: Record<Measure, number[]>;
}

const bad = (field: string, message: string) => new ApiError(400, "invalid_input", `${field}: ${message}`, { [field]: message });

/** Sentences in the user's units; every conversion goes through mathjs (units.ts). */
export function wordsFor(system: UnitSystem): FigureWords {
  return {
    speed: (v) => formatQuantity("speedMPerMin", v, system, 3),
    length: (v) => formatQuantity("lengthM", v, system, 3),
    lengthMm: (v) => formatQuantity("lengthMm", v, system, 4),
    mass: (v) => formatQuantity("massKg", v, system, 4),
    temperature: (v) => formatQuantity("temperatureC", v, system, 3),
  };
}

async function resolvePart(db: Db, ref: ThroughputCompareBody["part"]): Promise<ThroughputComparison["part"]> {
  if (!("partId" in ref)) return { ...ref, partId: null, label: "Part entered by hand" };
  const p = await findPartFigures(db, ref.partId);
  if (!p) throw bad("part.partId", "No such part.");
  // powder goes on the outside area less what is masked
  const areaM2 = p.area_m2 - p.masked_area_m2;
  if (!(areaM2 > 0)) throw bad("part.partId", `${p.number} has no coated area left after masking.`);
  return {
    partId: p.id,
    label: `${p.number} — ${p.name}`,
    areaM2,
    insideAreaM2: p.inside_area_m2,
    massKg: p.mass_kg,
    thicknessMm: p.thickness_mm,
    lengthMm: p.length_mm,
    widthMm: p.width_mm,
    heightMm: p.height_mm,
  };
}

async function resolveCoating(db: Db, body: ThroughputCompareBody) {
  const c = await findCoatingRow(db, body.coatingId);
  if (!c) throw bad("coatingId", "No such coating.");
  if (c.kind !== "powder") throw bad("coatingId", `${c.code} is an e-coat paint; choose a powder.`);
  if (c.specific_gravity === null) throw bad("coatingId", `${c.code} has no specific gravity; add it in the coatings library.`);
  const cureSchedule = (await curePointsOf(db, [c.id])).map((p) => ({ metalTempC: p.metal_temp_c, holdMin: p.hold_min }));
  if (!cureSchedule.length) throw bad("coatingId", `${c.code} has no cure schedule.`);
  return {
    view: {
      id: c.id,
      code: c.code,
      name: c.name,
      specificGravity: c.specific_gravity,
      pricePerKg: c.price_per_kg,
      // no film given: the middle of the coating's film range
      filmUm: body.filmUm ?? (c.film_min_um + c.film_max_um) / 2,
      firstPassEfficiency: body.firstPassEfficiency,
      reclaimEfficiency: body.reclaimEfficiency,
    },
    cureSchedule,
  };
}

interface ResolvedItem {
  label: string;
  source: "line" | "scenario";
  lineId: number;
  scenarioId: number | null;
  line: CompareLine;
  overrides: ScenarioOverrides;
  partsPerCarrier?: number;
}

async function resolveItems(db: Db, items: ThroughputCompareBody["items"]): Promise<ResolvedItem[]> {
  const scenarioIds = items.flatMap((it) => (it.scenarioId !== undefined ? [it.scenarioId] : []));
  const scenarios = new Map((await findScenarioRows(db, scenarioIds)).map((s) => [s.id, s]));
  const out: ResolvedItem[] = [];
  for (const [i, it] of items.entries()) {
    if (it.scenarioId !== undefined) {
      const s = scenarios.get(it.scenarioId);
      if (!s || s.archived) throw bad(`items.${i}.scenarioId`, "No such scenario.");
      const line = await lineForCompare(db, s.line_id, `items.${i}.scenarioId`);
      out.push({ label: s.name, source: "scenario", lineId: line.id, scenarioId: s.id, line: toCompareLine(line), overrides: parseOverrides(s.overrides_json), partsPerCarrier: it.partsPerCarrier });
    } else {
      const line = await lineForCompare(db, it.lineId!, `items.${i}.lineId`);
      out.push({ label: line.name, source: "line", lineId: line.id, scenarioId: null, line: toCompareLine(line), overrides: {}, partsPerCarrier: it.partsPerCarrier });
    }
  }
  return out;
}

/** Where the pure module names its own input, the request's field instead. */
function requestField(i: number, field: string): string {
  if (field.startsWith("overrides.") || field === "partsPerCarrier") return `items.${i}.${field}`;
  if (field === "lineSpeedMPerMin") return `items.${i}.overrides.lineSpeedMPerMin`;
  if (field === "part" || field.startsWith("part.")) return field;
  if (field === "thicknessMm" || field === "areaM2") return `part.${field}`;
  if (["clearanceMm", "orientations", "filmUm", "firstPassEfficiency", "reclaimEfficiency"].includes(field)) return field;
  if (field.startsWith("coating") || field === "specificGravity" || field === "pricePerKg" || field.startsWith("points")) return "coatingId";
  return `items.${i}`;
}

/** One column of figures per line or scenario, for one part and powder, and the best per measure. */
export async function compareThroughput(body: ThroughputCompareBody, system: UnitSystem): Promise<ThroughputComparison> {
  const db = await getDb();
  const plant = await plantSettings();
  const part = await resolvePart(db, body.part);
  const coating = await resolveCoating(db, body);
  const items = await resolveItems(db, body.items);
  const words = wordsFor(system);
  const columns = items.map((it, i): CompareColumn => {
    try {
      const figures = throughputFigures({
        line: it.line,
        overrides: it.overrides,
        part,
        powder: { ...coating.view, cureSchedule: coating.cureSchedule },
        options: {
          partsPerCarrier: it.partsPerCarrier ?? body.partsPerCarrier,
          clearanceMm: body.clearanceMm,
          orientations: body.orientations,
          shiftHours: plant.shiftHours,
        },
        words,
      });
      return { label: it.label, source: it.source, lineId: it.lineId, scenarioId: it.scenarioId, lineName: it.line.name, overrides: it.overrides, figures };
    } catch (e) {
      const field = e instanceof Error ? (e as Error & { field?: unknown }).field : undefined;
      if (typeof field !== "string") throw e;
      const at = requestField(i, field);
      throw new ApiError(400, "invalid_input", `${it.label}: ${(e as Error).message}`, { [at]: (e as Error).message });
    }
  });
  return { part, coating: coating.view, currency: plant.currency, shiftHours: plant.shiftHours, columns, best: bestPerMeasure(columns.map((c) => c.figures)) };
}

export interface HomeThroughputRow {
  lineId: number;
  lineName: string;
  partsPerHour: number;
  costPerPart: number | null;
  cures: boolean;
  limit: string;
}

export type HomeThroughput =
  | { ok: true; partLabel: string; coatingLabel: string; currency: string; rows: HomeThroughputRow[] }
  | { ok: false; message: string };

/** Home panel: every live line for the reference part in the first powder. Never throws. */
export async function homeThroughput(system: UnitSystem): Promise<HomeThroughput> {
  try {
    const db = await getDb();
    const lines = await listLineRows(db);
    const powder = (await listCoatingRows(db)).filter((c) => c.kind === "powder").sort((a, b) => a.code.localeCompare(b.code))[0];
    if (!lines.length) return { ok: false, message: "No lines yet: a manager adds them under Lines." };
    if (!powder) return { ok: false, message: "No powder coating in the library yet." };
    const { label: _label, ...manual } = REFERENCE_PART;
    const r = await compareThroughput(
      {
        items: lines.map((l) => ({ lineId: l.id })),
        part: manual,
        coatingId: powder.id,
        firstPassEfficiency: 0.5,
        reclaimEfficiency: 0,
        clearanceMm: 50,
        orientations: "upright",
      },
      system,
    );
    return {
      ok: true,
      partLabel: REFERENCE_PART.label,
      coatingLabel: `${r.coating.code} ${r.coating.name}`,
      currency: r.currency,
      rows: r.columns.map((c) => ({
        lineId: c.lineId,
        lineName: c.lineName,
        partsPerHour: c.figures.partsPerHour,
        costPerPart: c.figures.costPerPart,
        cures: c.figures.cures,
        limit: c.figures.limit.sentence,
      })),
    };
  } catch (e) {
    console.error(e);
    return { ok: false, message: e instanceof Error ? e.message : "The comparison could not be worked out." };
  }
}

// ---------------------------------------------------------------------------------------------
// Display units for the comparison screen. Client bundles stay free of mathjs: the factors are
// worked out here, through mathjs, and handed to the page as plain numbers.

export type ShownKind =
  | "speedMPerMin"
  | "lengthM"
  | "lengthMm"
  | "areaM2"
  | "massKg"
  | "temperatureC"
  | "filmUm"
  | "areaRateM2PerH"
  | "massRateKgPerH"
  | "perKg";

/** shown = stored × factor + offset */
export interface UnitFactor {
  label: string;
  factor: number;
  offset: number;
}

export type UnitTable = { system: UnitSystem } & Record<ShownKind, UnitFactor>;

const UNIT_PAIRS: Record<ShownKind, { stored: string; metric: [string, string]; us: [string, string] }> = {
  speedMPerMin: { stored: "m/min", metric: ["m/min", "m/min"], us: ["ft/min", "ft/min"] },
  lengthM: { stored: "m", metric: ["m", "m"], us: ["ft", "ft"] },
  lengthMm: { stored: "mm", metric: ["mm", "mm"], us: ["inch", "in"] },
  areaM2: { stored: "m^2", metric: ["m^2", "m²"], us: ["ft^2", "ft²"] },
  massKg: { stored: "kg", metric: ["kg", "kg"], us: ["lbm", "lb"] },
  temperatureC: { stored: "degC", metric: ["degC", "°C"], us: ["degF", "°F"] },
  filmUm: { stored: "um", metric: ["um", "µm"], us: ["mil", "mil"] },
  areaRateM2PerH: { stored: "m^2/h", metric: ["m^2/h", "m²/h"], us: ["ft^2/h", "ft²/h"] },
  massRateKgPerH: { stored: "kg/h", metric: ["kg/h", "kg/h"], us: ["lbm/h", "lb/h"] },
  // a price per kg shown per lb: money per mass
  perKg: { stored: "kg^-1", metric: ["kg^-1", "kg"], us: ["lbm^-1", "lb"] },
};

export function unitTable(system: UnitSystem): UnitTable {
  const table = { system } as UnitTable;
  for (const kind of Object.keys(UNIT_PAIRS) as ShownKind[]) {
    const u = UNIT_PAIRS[kind];
    const [math, label] = u[system];
    const offset = convert(0, u.stored, math);
    table[kind] = { label, factor: convert(1, u.stored, math) - offset, offset };
  }
  return table;
}
