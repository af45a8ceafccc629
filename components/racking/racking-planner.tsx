"use client";
// The racking planner screen: part box and carrier window in the user's units → POST
// /api/rack/plan (debounced, SWR keyed by the input) → count, reason, blocks, the 3D rack, a
// printable list, and what the count means per line.

import { useEffect, useMemo, useState } from "react";
import useSWR from "swr";
import { TextField } from "@/components/ui/text-field";
import { RackViewLazy } from "@/components/three/rack-view-lazy";
import { FetchError, sendJson } from "@/lib/fetcher";
import { formatQuantity, unitLabel, type QuantityKind, type UnitSystem } from "@/lib/coating-math/display-units";
import { allowedOrientations } from "@/lib/rack/orientations";
import type { RackPlanResult } from "@/app/api/rack/plan/route";
import type { RackPlanRequest } from "@/lib/validation/rack";
import { convertText, fieldText, metricFrom, withUnit } from "./form-units";
import { lineOptions, type LineOption } from "./line-options";
import { PerLine } from "./per-line";
import { orientationWords, RackPlanList } from "./rack-plan-list";
import { reasonText } from "./reason-text";
import { CataloguePartPicker } from "@/components/parts/catalogue-part-picker";
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

const orientationKey = (o: { alongWidthMm: number; alongHeightMm: number; alongDepthMm: number }) =>
  `${o.alongWidthMm}|${o.alongHeightMm}|${o.alongDepthMm}`;

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

export function RackingPlanner({ unitSystem, shiftHours }: { unitSystem: UnitSystem; shiftHours: number }) {
  const [system, setSystem] = useState(unitSystem);
  const [values, setValues] = useState<Values>(() => {
    const v = {} as Values;
    for (const f of Object.keys(FIELDS) as FieldName[]) v[f] = fieldText(FIELDS[f], START_METRIC[f], unitSystem);
    return v;
  });
  const [mode, setMode] = useState<"any" | "upright">("upright");
  const [forced, setForced] = useState("");
  const [line, setLine] = useState<LineOption | null>(null);
  // A part taken from the catalogue: its box, and its mesh once loaded (drawn while the box matches).
  const [picked, setPicked] = useState<{ boxMm: [number, number, number]; mesh: Float32Array | null } | null>(null);

  function pickPart(part: PartView | null) {
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

  const set = (f: FieldName) => (text: string) => setValues((v) => ({ ...v, [f]: text }));

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
  const orientationChoices = useMemo(() => (partBox ? allowedOrientations(partBox, mode) : []), [partBox, mode]);
  const forcedOrientation = orientationChoices.find((o) => orientationKey(o) === forced);

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

  // Another part of the product serves /api/lines; when it is missing or fails, no picker.
  const { data: linesBody } = useSWR<unknown>("/api/lines", { shouldRetryOnError: false });
  const lines = lineOptions(linesBody);

  const apiErrors: Partial<Record<FieldName | "orientation", string>> = {};
  let apiMessage: string | null = null;
  if (error && debounced === body) {
    for (const [path, message] of Object.entries(error.fields ?? {})) {
      const f = API_FIELD[path];
      if (f) apiErrors[f] = message;
    }
    apiMessage = error.message;
  }
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
  const kg = (v: number) => formatQuantity("massKg", v, unitSystem, 4);
  const len = (mm: number) => formatQuantity("lengthMm", mm, unitSystem, 4);

  return (
    <div className="space-y-6">
      <div className="grid gap-6 lg:grid-cols-[22rem_minmax(0,1fr)]">
        <form className="no-print space-y-4" onSubmit={(e) => e.preventDefault()} aria-label="Racking input" noValidate>
          <fieldset className="card space-y-3">
            <legend className="px-1 font-semibold">Part (its bounding box)</legend>
            <CataloguePartPicker onPick={pickPart} onMesh={(mesh) => setPicked((p) => (p ? { ...p, mesh } : p))} />
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
                value={forcedOrientation ? forced : ""}
                onChange={(e) => setForced(e.target.value)}
                disabled={!partBox}
                aria-invalid={apiErrors.orientation ? true : undefined}
              >
                <option value="">Let the planner choose</option>
                {partBox &&
                  orientationChoices.map((o) => (
                    <option key={orientationKey(o)} value={orientationKey(o)}>
                      {orientationWords({ ...partBox, massKg: 1 }, o)} ({[o.alongWidthMm, o.alongHeightMm, o.alongDepthMm].map(len).join(" × ")})
                    </option>
                  ))}
              </select>
              {apiErrors.orientation && <p className="field-error">{apiErrors.orientation}</p>}
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
              <div className={stale ? "opacity-70" : undefined}>
                <p className="mt-1 flex flex-wrap items-baseline gap-3">
                  <span className="num text-4xl font-semibold" data-testid="plan-count">
                    {shown.plan.count}
                  </span>
                  <span className={`rounded px-2 py-0.5 text-sm ${shown.plan.limitedBy === "load" ? "bg-caution-light text-caution" : "bg-phosphate-light text-phosphate-dark"}`}>
                    limited by {shown.plan.limitedBy}
                  </span>
                  <span className="num text-sm text-ink-soft">
                    {kg(shown.plan.count * shown.input.part.massKg)} of {kg(shown.input.carrier.maxLoadKg)}
                  </span>
                </p>
                <p className="mt-2 text-sm" data-testid="plan-reason">
                  {reasonText(shown.plan, shown.input, unitSystem)}
                </p>
                {shown.plan.blocks.length > 0 && (
                  <ul className="mt-2 space-y-0.5 text-sm">
                    {shown.plan.blocks.map((b, i) => (
                      <li key={i}>
                        <span className="num">{b.grid.join(" × ")}</span> ({b.count} parts): {orientationWords(shown.input.part, b.orientation)}
                      </li>
                    ))}
                  </ul>
                )}
              </div>
            )}
          </section>
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

      {shown && <RackPlanList input={shown.input} plan={shown.plan} unitSystem={unitSystem} />}

      <div className="no-print">
        <PerLine partsPerCarrier={shown?.plan.count ?? 0} unitSystem={unitSystem} shiftHours={shiftHours} line={line} />
      </div>

      <aside className="rounded-lg border border-caution-edge bg-caution-light p-4 text-sm text-ink" role="note" aria-labelledby="rack-safety-h">
        <h2 id="rack-safety-h" className="text-base">Safety</h2>
        <p className="mt-1">
          The load limit is the carrier&apos;s and its hooks&apos; rated load: never hang more, and remember that hooks and racks
          gain weight as cured coating builds up on them. Parts leave a cure oven hot (around{" "}
          {formatQuantity("temperatureC", 200, unitSystem)}) and stay hot well after: unload with heat-resistant gloves and only
          after the cool-down your plant sets. Follow your plant&apos;s own procedures and local codes.
        </p>
        <p className="mt-1 text-xs text-ink-soft">Sizes are in {unitLabel("lengthMm", unitSystem)}, masses in {unitLabel("massKg", unitSystem)}.</p>
      </aside>
    </div>
  );
}
