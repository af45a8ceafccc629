"use client";
// The racking planner screen: part box and carrier window in the user's units → POST
// /api/rack/plan (debounced, SWR keyed by the input) → count, reason, blocks, the 3D rack, a
// printable list, and what the count means per line.

import { useEffect, useMemo, useState } from "react";
import useSWR from "swr";
import { TextField } from "@/components/ui/text-field";
import { RackViewLazy } from "@/components/three/rack-view-lazy";
import { FetchError, sendJson } from "@/lib/fetcher";
import { formatQuantity, type QuantityKind, type UnitSystem } from "@/lib/coating-math/display-units";
import { codeOfOrientation, codeWords, distinctCodes, orientationFromCode, type OrientationCode } from "@/lib/rack/orientation-code";
import type { RackPlanResult } from "@/app/api/rack/plan/route";
import type { SavedRackPlanSummary } from "@/app/api/rack/plans/route";
import type { RackPlanRequest } from "@/lib/validation/rack";
import { convertText, fieldText, metricFrom, withUnit } from "./form-units";
import { lineOptions, type LineOption } from "./line-options";
import { CataloguePartPickerLazy, PerLineLazy, PlanResultLazy, RackPlanListLazy, SavedPlanPanelLazy, SavedPlansListLazy } from "./lazy-sections";
import type { PlanSettings } from "./saved-plan-panel";
import type { PartView } from "@/lib/server/parts";

const FIELDS = {
  lengthMm: "lengthMm",
  widthMm: "lengthMm",
  heightMm: "lengthMm",
  massKg: "massKg",
  carrierWidthMm: "lengthMm",
  carrierHeightMm: "lengthMm",
  carrierDepthMm: "lengthMm",
  maxLoadKg: "massKg",
  clearanceMm: "lengthMm",
} as const satisfies Record<string, QuantityKind>;

type FieldName = keyof typeof FIELDS;
type Values = Record<FieldName, string>;

// A bracket-sized example part on a medium carrier, so the screen opens on a real plan.
const START_METRIC: Record<FieldName, number> = {
  lengthMm: 300,
  widthMm: 200,
  heightMm: 100,
  massKg: 1.2,
  carrierWidthMm: 1000,
  carrierHeightMm: 1500,
  carrierDepthMm: 600,
  maxLoadKg: 150,
  clearanceMm: 50,
};

/** API error paths → the form field that shows them. */
const API_FIELD: Record<string, FieldName | "orientation"> = {
  "part.lengthMm": "lengthMm",
  "part.widthMm": "widthMm",
  "part.heightMm": "heightMm",
  "part.massKg": "massKg",
  "carrier.widthMm": "carrierWidthMm",
  "carrier.heightMm": "carrierHeightMm",
  "carrier.depthMm": "carrierDepthMm",
  "carrier.maxLoadKg": "maxLoadKg",
  clearanceMm: "clearanceMm",
  orientation: "orientation",
};

/** Form values within display rounding (4 significant figures) of the stored ones. */
const near = (a: number | undefined, b: number) => a !== undefined && Math.abs(a - b) <= 1e-3 * Math.max(1, Math.abs(b));

function useDebounced<T>(value: T, ms: number): T {
  const [shown, setShown] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setShown(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return shown;
}

interface Planned {
  input: RackPlanRequest;
  plan: RackPlanResult;
}

async function planFetcher([url, body]: [string, string]): Promise<Planned> {
  const input = JSON.parse(body) as RackPlanRequest;
  return { input, plan: await sendJson<RackPlanResult>(url, "POST", input) };
}

interface PlannerProps {
  unitSystem: UnitSystem;
  shiftHours: number;
  /** engineers, supervisors and admins save plans; everyone else reads them */
  canSave: boolean;
  /** ?line= in the address: the line to take the window from once lines load */
  initialLineId: number | null;
}

export function RackingPlanner({ unitSystem, shiftHours, canSave, initialLineId }: PlannerProps) {
  const [system, setSystem] = useState(unitSystem);
  const [values, setValues] = useState<Values>(() => {
    const v = {} as Values;
    for (const f of Object.keys(FIELDS) as FieldName[]) v[f] = fieldText(FIELDS[f], START_METRIC[f], unitSystem);
    return v;
  });
  const [mode, setMode] = useState<"any" | "upright">("upright");
  const [forced, setForced] = useState<OrientationCode | "">("");
  const [line, setLine] = useState<LineOption | null>(null);
  const [catalogPart, setCatalogPart] = useState<Pick<PartView, "id" | "number" | "name" | "lengthMm" | "widthMm" | "heightMm" | "massKg"> | null>(null);
  // Field errors from the last save of a plan (the server validates and plans).
  const [saveErrors, setSaveErrors] = useState<Record<string, string>>({});
  // A part taken from the catalogue: its box, and its mesh once loaded (drawn while the box matches).
  const [picked, setPicked] = useState<{ boxMm: [number, number, number]; mesh: Float32Array | null } | null>(null);

  function pickPart(part: PartView | null) {
    setCatalogPart(part);
    if (!part) return setPicked(null);
    setPicked({ boxMm: [part.lengthMm, part.widthMm, part.heightMm], mesh: null });
    setValues((v) => ({
      ...v,
      lengthMm: fieldText("lengthMm", part.lengthMm, unitSystem),
      widthMm: fieldText("lengthMm", part.widthMm, unitSystem),
      heightMm: fieldText("lengthMm", part.heightMm, unitSystem),
      massKg: fieldText("massKg", part.massKg, unitSystem),
    }));
  }

  // The header's unit switch re-renders the page in the other system: re-type what was entered.
  if (system !== unitSystem) {
    setSystem(unitSystem);
    setValues((v) => {
      const next = { ...v };
      for (const f of Object.keys(FIELDS) as FieldName[]) next[f] = convertText(FIELDS[f], v[f], system, unitSystem);
      return next;
    });
  }

  const set = (f: FieldName) => (text: string) => {
    setValues((v) => ({ ...v, [f]: text }));
    if (f === "clearanceMm") setSaveErrors({});
  };

  // Local checks first (a number, above zero); the API checks the rest and names the field.
  const local = useMemo(() => {
    const errors: Partial<Record<FieldName, string>> = {};
    const metric = {} as Record<FieldName, number>;
    for (const f of Object.keys(FIELDS) as FieldName[]) {
      const m = values[f].trim() === "" ? null : metricFrom(FIELDS[f], values[f], unitSystem);
      if (m === null) errors[f] = values[f].trim() === "" ? "Enter a value." : "Enter a number.";
      else if (f === "clearanceMm" ? m < 0 : m <= 0) errors[f] = f === "clearanceMm" ? "Enter 0 or more." : "Enter a value above 0.";
      else metric[f] = m;
    }
    const { carrierWidthMm: w, carrierHeightMm: h, carrierDepthMm: d, clearanceMm: c } = metric;
    if (w && h && d && c !== undefined && c > Math.max(w, h, d)) {
      errors.clearanceMm = "The clearance is larger than every side of the window.";
    }
    return { errors, metric };
  }, [values, unitSystem]);

  const partBox = useMemo(() => {
    const { lengthMm, widthMm, heightMm } = local.metric;
    return lengthMm && widthMm && heightMm ? { lengthMm, widthMm, heightMm } : null;
  }, [local.metric]);
  const orientationChoices = useMemo(() => (partBox ? distinctCodes(partBox, mode) : []), [partBox, mode]);
  // A code naming the same orientation as an earlier one (two equal sides) stands for it.
  const forcedCode = partBox && forced ? codeOfOrientation(partBox, orientationFromCode(partBox, forced)) : null;
  const forcedOrientation = partBox && forcedCode && orientationChoices.includes(forcedCode) ? orientationFromCode(partBox, forcedCode) : undefined;

  const body = useMemo(() => {
    if (Object.keys(local.errors).length > 0) return null;
    const m = local.metric;
    const input: RackPlanRequest = {
      part: { lengthMm: m.lengthMm, widthMm: m.widthMm, heightMm: m.heightMm, massKg: m.massKg },
      carrier: { widthMm: m.carrierWidthMm, heightMm: m.carrierHeightMm, depthMm: m.carrierDepthMm, maxLoadKg: m.maxLoadKg },
      clearanceMm: m.clearanceMm,
      orientations: mode,
      ...(forcedOrientation ? { orientation: forcedOrientation } : {}),
    };
    return JSON.stringify(input);
  }, [local, mode, forcedOrientation]);

  const debounced = useDebounced(body, 250);
  const { data, error, isValidating } = useSWR<Planned, FetchError>(debounced ? ["/api/rack/plan", debounced] : null, planFetcher, {
    keepPreviousData: true,
    shouldRetryOnError: false,
  });
  // With an orientation chosen by hand, the planner's best for comparison.
  const bestBody = useMemo(() => {
    if (!debounced || !forcedOrientation) return null;
    const { orientation: _o, ...rest } = JSON.parse(debounced) as RackPlanRequest;
    return JSON.stringify(rest);
  }, [debounced, forcedOrientation]);
  const { data: best } = useSWR<Planned, FetchError>(bestBody ? ["/api/rack/plan", bestBody] : null, planFetcher, { shouldRetryOnError: false });

  // Another part of the product serves /api/lines; when it is missing or fails, no picker.
  const { data: linesBody } = useSWR<unknown>("/api/lines", { shouldRetryOnError: false });
  const lines = lineOptions(linesBody);
  const [lineFromAddress, setLineFromAddress] = useState(initialLineId);
  if (lineFromAddress !== null && lines.length > 0) {
    setLineFromAddress(null);
    pickLine(String(lineFromAddress));
  }

  const apiErrors: Partial<Record<FieldName | "orientation", string>> = {};
  let apiMessage: string | null = null;
  if (error && debounced === body) {
    for (const [path, message] of Object.entries(error.fields ?? {})) {
      const f = API_FIELD[path];
      if (f) apiErrors[f] = message;
    }
    apiMessage = error.message;
  }
  if (saveErrors.clearanceMm) apiErrors.clearanceMm ??= saveErrors.clearanceMm;
  if (saveErrors.orientationOverride) apiErrors.orientation ??= saveErrors.orientationOverride;
  const fieldError = (f: FieldName) => local.errors[f] ?? apiErrors[f];

  const field = (f: FieldName, label: string, hint?: string) => (
    <TextField
      label={withUnit(label, FIELDS[f], unitSystem)}
      name={f}
      value={values[f]}
      onChange={set(f)}
      inputMode="decimal"
      error={fieldError(f)}
      hint={hint}
    />
  );

  function pickLine(id: string) {
    const picked = lines.find((l) => String(l.id) === id) ?? null;
    setLine(picked);
    if (!picked) return;
    setValues((v) => ({
      ...v,
      carrierWidthMm: fieldText("lengthMm", picked.windowMm.widthMm, unitSystem),
      carrierHeightMm: fieldText("lengthMm", picked.windowMm.heightMm, unitSystem),
      carrierDepthMm: fieldText("lengthMm", picked.windowMm.depthMm, unitSystem),
      maxLoadKg: fieldText("massKg", picked.maxLoadKg, unitSystem),
    }));
  }

  const shown = !error && data ? data : null;
  const stale = shown !== null && (debounced !== body || isValidating || JSON.stringify(shown.input) !== debounced);
  const bestShown = best && bestBody && JSON.stringify(best.input) === bestBody ? best.plan : null;

  // The saved plan panel: the choices as the API takes them, and whether the sizes are the stored ones.
  const settings: PlanSettings | null =
    Object.keys(local.errors).length > 0
      ? null
      : { clearanceMm: local.metric.clearanceMm, orientations: mode, orientationOverride: forcedOrientation && forcedCode ? forcedCode : null };
  const m = local.metric;
  const matches =
    catalogPart !== null &&
    line !== null &&
    near(m.lengthMm, catalogPart.lengthMm) &&
    near(m.widthMm, catalogPart.widthMm) &&
    near(m.heightMm, catalogPart.heightMm) &&
    near(m.massKg, catalogPart.massKg) &&
    near(m.carrierWidthMm, line.windowMm.widthMm) &&
    near(m.carrierHeightMm, line.windowMm.heightMm) &&
    near(m.carrierDepthMm, line.windowMm.depthMm) &&
    near(m.maxLoadKg, line.maxLoadKg);

  function useStoredSizes() {
    setValues((v) => ({
      ...v,
      ...(catalogPart
        ? {
            lengthMm: fieldText("lengthMm", catalogPart.lengthMm, unitSystem),
            widthMm: fieldText("lengthMm", catalogPart.widthMm, unitSystem),
            heightMm: fieldText("lengthMm", catalogPart.heightMm, unitSystem),
            massKg: fieldText("massKg", catalogPart.massKg, unitSystem),
          }
        : {}),
    }));
    if (line) pickLine(String(line.id));
  }

  function loadSaved(plan: SavedRackPlanSummary) {
    setMode(plan.orientations);
    setForced(plan.orientationOverride ?? "");
    setValues((v) => ({ ...v, clearanceMm: fieldText("lengthMm", plan.clearanceMm, unitSystem) }));
  }
  const len = (mm: number) => formatQuantity("lengthMm", mm, unitSystem, 4);

  return (
    <div className="space-y-6">
      <div className="grid gap-6 lg:grid-cols-[22rem_minmax(0,1fr)]">
        <form className="no-print space-y-4" onSubmit={(e) => e.preventDefault()} aria-label="Racking input" noValidate>
          <fieldset className="card space-y-3">
            <legend className="px-1 font-semibold">Part (its bounding box)</legend>
            <CataloguePartPickerLazy onPick={pickPart} onMesh={(mesh) => setPicked((p) => (p ? { ...p, mesh } : p))} />
            <div className="grid grid-cols-2 gap-3">
              {field("lengthMm", "Part length")}
              {field("widthMm", "Part width")}
              {field("heightMm", "Part height", "Kept vertical when upright.")}
              {field("massKg", "Part mass")}
            </div>
          </fieldset>
          <fieldset className="card space-y-3">
            <legend className="px-1 font-semibold">Carrier window (usable space)</legend>
            {lines.length > 0 && (
              <div>
                <label htmlFor="line-pick" className="label">Take the window from a line</label>
                <select id="line-pick" className="field" value={line ? String(line.id) : ""} onChange={(e) => pickLine(e.target.value)}>
                  <option value="">— type the window below —</option>
                  {lines.map((l) => (
                    <option key={l.id} value={l.id}>
                      {l.name} ({l.kind === "conveyor" ? "conveyor carrier" : "batch-oven rack"})
                    </option>
                  ))}
                </select>
              </div>
            )}
            <div className="grid grid-cols-2 gap-3">
              {field("carrierWidthMm", "Window width, along travel")}
              {field("carrierHeightMm", "Window height")}
              {field("carrierDepthMm", "Window depth, across")}
              {field("maxLoadKg", "Load limit")}
            </div>
          </fieldset>
          <fieldset className="card space-y-3">
            <legend className="px-1 font-semibold">Racking</legend>
            {field("clearanceMm", "Clearance between parts", "The gap left between neighbouring parts.")}
            <div role="radiogroup" aria-label="Orientations" className="flex flex-wrap gap-4 text-sm">
              <label className="flex items-center gap-1.5">
                <input type="radio" name="orientations" checked={mode === "upright"} onChange={() => setMode("upright")} />
                Upright only (height vertical, as hung from a hook)
              </label>
              <label className="flex items-center gap-1.5">
                <input type="radio" name="orientations" checked={mode === "any"} onChange={() => setMode("any")} />
                Any orientation
              </label>
            </div>
            <div>
              <label htmlFor="forced-orientation" className="label">Orientation</label>
              <select
                id="forced-orientation"
                className="field"
                value={forcedOrientation && forcedCode ? forcedCode : ""}
                onChange={(e) => {
                  setForced(e.target.value as OrientationCode | "");
                  setSaveErrors({});
                }}
                disabled={!partBox}
                aria-invalid={apiErrors.orientation ? true : undefined}
                aria-describedby={apiErrors.orientation ? "forced-orientation-err" : "forced-orientation-hint"}
              >
                <option value="">Best found (the planner chooses)</option>
                {partBox &&
                  orientationChoices.map((code) => {
                    const o = orientationFromCode(partBox, code);
                    return (
                      <option key={code} value={code}>
                        By hand: {codeWords(code)} ({[o.alongWidthMm, o.alongHeightMm, o.alongDepthMm].map(len).join(" × ")})
                      </option>
                    );
                  })}
              </select>
              {apiErrors.orientation ? (
                <p id="forced-orientation-err" className="field-error">{apiErrors.orientation}</p>
              ) : (
                <p id="forced-orientation-hint" className="mt-1 text-xs text-ink-faint" data-testid="orientation-count" aria-live="polite">
                  {!shown
                    ? "Choose one to count that way only (no mixed blocks)."
                    : forcedOrientation
                      ? `${shown.plan.count} this way${bestShown ? `; best found ${bestShown.count}` : ""}.`
                      : `${shown.plan.count} with the planner's best; choose one to count that way only.`}
                </p>
              )}
            </div>
          </fieldset>
        </form>

        <div className="space-y-4">
          <section className="card" aria-labelledby="result-h" aria-live="polite" aria-busy={stale}>
            <div className="flex flex-wrap items-baseline justify-between gap-2">
              <h2 id="result-h">Parts per carrier</h2>
              {stale && <span className="text-xs text-ink-faint" role="status">Updating…</span>}
            </div>
            {apiMessage ? (
              <p className="field-error" role="alert">
                {apiMessage}
              </p>
            ) : Object.keys(local.errors).length > 0 && !shown ? (
              <p className="mt-1 text-sm text-ink-soft">Fill in the part and the window to see the plan.</p>
            ) : !shown ? (
              <p className="mt-1 text-sm text-ink-faint" role="status">Planning…</p>
            ) : (
              <PlanResultLazy plan={shown.plan} input={shown.input} best={bestShown} stale={stale} unitSystem={unitSystem} />
            )}
          </section>
          <SavedPlanPanelLazy
            part={catalogPart}
            line={line}
            matches={matches}
            onUseStored={useStoredSizes}
            settings={settings}
            previewCount={shown && !stale ? shown.plan.count : null}
            canSave={canSave}
            unitSystem={unitSystem}
            onLoad={loadSaved}
            onFieldErrors={setSaveErrors}
          />
          {shown && (
            <RackViewLazy
              windowMm={shown.input.carrier}
              placements={shown.plan.placements}
              clearanceMm={shown.input.clearanceMm}
              partMassKg={shown.input.part.massKg}
              maxLoadKg={shown.input.carrier.maxLoadKg}
              spaceCount={shown.plan.spaceCount}
              partMesh={
                picked?.mesh && picked.boxMm.every((mm, i) => Math.abs(mm - [shown.input.part.lengthMm, shown.input.part.widthMm, shown.input.part.heightMm][i]) <= 0.01 * mm)
                  ? picked.mesh
                  : null
              }
              unitSystem={unitSystem}
            />
          )}
        </div>
      </div>

      {shown && <RackPlanListLazy input={shown.input} plan={shown.plan} unitSystem={unitSystem} />}

      <SavedPlansListLazy unitSystem={unitSystem} />

      <div className="no-print">
        <PerLineLazy partsPerCarrier={shown?.plan.count ?? 0} unitSystem={unitSystem} shiftHours={shiftHours} line={line} />
      </div>

    </div>
  );
}
