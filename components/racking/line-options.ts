// The finishing lines the planner can take a window from. /api/lines belongs to another part of
// the product; its answer is read defensively, and anything unexpected simply hides the picker.

export interface WindowMm {
  widthMm: number;
  heightMm: number;
  depthMm: number;
}

interface LineOptionCommon {
  id: number;
  name: string;
  windowMm: WindowMm;
  maxLoadKg: number;
}

export interface ConveyorOption extends LineOptionCommon {
  kind: "conveyor";
  lineSpeedMPerMin: number;
  carrierPitchM: number;
}

export interface BatchOption extends LineOptionCommon {
  kind: "batch";
  racksPerLoad: number;
  loadMin: number;
  unloadMin: number;
}

export type LineOption = ConveyorOption | BatchOption;

const isPositive = (v: unknown): v is number => typeof v === "number" && Number.isFinite(v) && v > 0;
const isNonNegative = (v: unknown): v is number => typeof v === "number" && Number.isFinite(v) && v >= 0;

function windowOf(v: unknown): WindowMm | null {
  if (!v || typeof v !== "object") return null;
  const w = v as Record<string, unknown>;
  return isPositive(w.widthMm) && isPositive(w.heightMm) && isPositive(w.depthMm)
    ? { widthMm: w.widthMm, heightMm: w.heightMm, depthMm: w.depthMm }
    : null;
}

function lineOf(v: unknown): LineOption | null {
  if (!v || typeof v !== "object") return null;
  const l = v as Record<string, unknown>;
  const windowMm = windowOf(l.windowMm);
  if (l.archived === true || typeof l.id !== "number" || typeof l.name !== "string" || !windowMm || !isPositive(l.maxLoadKg)) {
    return null;
  }
  const common = { id: l.id, name: l.name, windowMm, maxLoadKg: l.maxLoadKg };
  if (l.kind === "conveyor" && isPositive(l.lineSpeedNominalMPerMin) && isPositive(l.carrierPitchM)) {
    return { ...common, kind: "conveyor", lineSpeedMPerMin: l.lineSpeedNominalMPerMin, carrierPitchM: l.carrierPitchM };
  }
  if (l.kind === "batch" && isPositive(l.racksPerLoad) && isNonNegative(l.loadMin) && isNonNegative(l.unloadMin)) {
    return { ...common, kind: "batch", racksPerLoad: l.racksPerLoad, loadMin: l.loadMin, unloadMin: l.unloadMin };
  }
  return null;
}

/** `{ lines: [...] }` → the lines usable here; anything else → an empty list. */
export function lineOptions(body: unknown): LineOption[] {
  if (!body || typeof body !== "object") return [];
  const lines = (body as { lines?: unknown }).lines;
  if (!Array.isArray(lines)) return [];
  return lines.map(lineOf).filter((l): l is LineOption => l !== null);
}
