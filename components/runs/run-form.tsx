"use client";
// "Plan a run": part, quantity, line, day and shift, racking, coats in order, masking. The server
// plans what is typed as it is typed (POST /api/runs/preview, debounced) and the summary beside
// the form shows carriers, line time, material, cost and the cure check; saving stores a draft.

import { useEffect, useMemo, useState } from "react";
import { useRouter } from "next/navigation";
import useSWR from "swr";
import { TextField } from "@/components/ui/text-field";
import { FetchError, sendJson } from "@/lib/fetcher";
import { unitLabel, type UnitSystem } from "@/lib/coating-math/display-units";
import { fieldText, metricFrom, parseNumber } from "@/components/racking/form-units";
import type { CoatingsList } from "@/app/api/coatings/route";
import type { LinesList } from "@/app/api/lines/route";
import type { RunPreviewResult } from "@/app/api/runs/preview/route";
import type { RunSaved } from "@/app/api/runs/route";
import type { RunDetail, RunPartView } from "@/lib/server/runs";
import type { CoatingView } from "@/lib/server/coatings";
import type { RunInputRaw } from "@/lib/validation/runs";
import { CoatsTable, PlanFacts, Warnings } from "./plan-summary";
import { RackDiagram } from "./rack-diagram";
import { localToday, q } from "./format";
import { Swatch } from "./status-badge";

interface CoatDraft {
  key: number;
  coatingId: string;
  film: string;
  fpePct: string;
  reclaimPct: string;
}

interface Draft {
  partId: string;
  quantity: string;
  lineId: string;
  date: string;
  shift: string;
  lineSpeed: string;
  clearance: string;
  orientations: "upright" | "any";
  override: string;
  coats: CoatDraft[];
  masking: string;
  notes: string;
}

let coatKey = 1;
const newCoat = (over: Partial<CoatDraft> = {}): CoatDraft => ({ key: coatKey++, coatingId: "", film: "", fpePct: "50", reclaimPct: "0", ...over });

const pctText = (f: number | null) => (f === null ? "" : String(Math.round(f * 1000) / 10));

function draftFrom(run: RunDetail | undefined, sys: UnitSystem): Draft {
  if (!run) {
    return {
      partId: "",
      quantity: "",
      lineId: "",
      date: localToday(),
      shift: "1",
      lineSpeed: "",
      clearance: fieldText("lengthMm", 50, sys),
      orientations: "upright",
      override: "",
      coats: [newCoat()],
      masking: "",
      notes: "",
    };
  }
  return {
    partId: run.partId,
    quantity: String(run.quantity),
    lineId: String(run.lineId),
    date: run.date,
    shift: String(run.shift),
    lineSpeed: run.lineSpeedMPerMin === null ? "" : fieldText("speedMPerMin", run.lineSpeedMPerMin, sys),
    clearance: fieldText("lengthMm", run.clearanceMm, sys),
    orientations: run.orientations,
    override: run.partsPerCarrierOverride === null ? "" : String(run.partsPerCarrierOverride),
    coats: run.coats.map((c) =>
      newCoat({
        coatingId: String(c.coatingId),
        film: fieldText("filmUm", c.filmUm, sys),
        fpePct: c.firstPassEfficiency === null ? "50" : pctText(c.firstPassEfficiency),
        reclaimPct: c.reclaimEfficiency === null ? "0" : pctText(c.reclaimEfficiency),
      }),
    ),
    masking: run.masking,
    notes: run.notes,
  };
}

type Errors = Record<string, string>;

/** The typed draft → the API body, or the local errors (not a number, empty). */
function toBody(d: Draft, sys: UnitSystem, coatings: Map<number, CoatingView>, keepOrientation: RunDetail["orientation"]): { body: RunInputRaw | null; errors: Errors } {
  const errors: Errors = {};
  const num = (field: string, text: string, convert: (n: number) => number | null, required = true): number | null => {
    if (text.trim() === "") {
      if (required) errors[field] = "Enter a value.";
      return null;
    }
    const v = convert(parseNumber(text) ?? NaN);
    if (v === null || !Number.isFinite(v)) {
      errors[field] = "Enter a number.";
      return null;
    }
    return v;
  };
  if (!d.partId) errors.partId = "Choose a part.";
  if (!d.lineId) errors.lineId = "Choose a line.";
  const quantity = num("quantity", d.quantity, (n) => n);
  const lineSpeed = num("lineSpeedMPerMin", d.lineSpeed, () => metricFrom("speedMPerMin", d.lineSpeed, sys), false);
  const clearance = num("clearanceMm", d.clearance, () => metricFrom("lengthMm", d.clearance, sys));
  const override = num("partsPerCarrierOverride", d.override, (n) => n, false);
  const coats = d.coats.map((c, i) => {
    if (!c.coatingId) errors[`coats.${i}.coatingId`] = "Choose a coating.";
    const film = num(`coats.${i}.filmUm`, c.film, () => metricFrom("filmUm", c.film, sys));
    const powder = coatings.get(Number(c.coatingId))?.kind === "powder";
    const fpe = powder ? num(`coats.${i}.firstPassEfficiency`, c.fpePct, (n) => n / 100) : null;
    const reclaim = powder ? num(`coats.${i}.reclaimEfficiency`, c.reclaimPct, (n) => n / 100, false) : null;
    return { coatingId: Number(c.coatingId), filmUm: film ?? 0, ...(powder ? { firstPassEfficiency: fpe, reclaimEfficiency: reclaim ?? 0 } : {}) };
  });
  if (Object.keys(errors).length) return { body: null, errors };
  return {
    body: {
      partId: d.partId,
      quantity: quantity!,
      lineId: Number(d.lineId),
      date: d.date,
      shift: Number(d.shift) as 1 | 2 | 3,
      lineSpeedMPerMin: lineSpeed,
      clearanceMm: clearance!,
      orientations: d.orientations,
      orientation: keepOrientation,
      partsPerCarrierOverride: override,
      coats,
      masking: d.masking,
      notes: d.notes,
    },
    errors,
  };
}

function useDebounced<T>(value: T, ms: number): T {
  const [shown, setShown] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setShown(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return shown;
}

async function previewFetcher([url, body]: [string, string]): Promise<RunPreviewResult> {
  return sendJson<RunPreviewResult>(url, "POST", JSON.parse(body));
}

interface Props {
  parts: RunPartView[];
  unitSystem: UnitSystem;
  currency: string;
  /** editing this run; otherwise a new draft */
  initial?: RunDetail;
  onSaved?: (saved: RunSaved) => void;
  onCancel?: () => void;
}

export function RunForm({ parts, unitSystem: sys, currency, initial, onSaved, onCancel }: Props) {
  const router = useRouter();
  const [draft, setDraft] = useState<Draft>(() => draftFrom(initial, sys));
  const [saving, setSaving] = useState(false);
  const [saveError, setSaveError] = useState<FetchError | null>(null);
  // a field's own errors show once it has been changed, or all of them after a try to save
  const [touched, setTouched] = useState<ReadonlySet<string>>(() => new Set(initial ? ["*"] : []));
  const [tried, setTried] = useState(false);
  const touch = (f: string) => setTouched((t) => (t.has(f) ? t : new Set(t).add(f)));
  const { data: linesBody, error: linesError } = useSWR<LinesList>("/api/lines");
  const { data: coatingsBody, error: coatingsError } = useSWR<CoatingsList>("/api/coatings");
  const lines = useMemo(() => linesBody?.lines.filter((l) => !l.archived) ?? [], [linesBody]);
  const coatings = useMemo(() => new Map((coatingsBody?.coatings ?? []).map((c) => [c.id, c])), [coatingsBody]);
  const line = lines.find((l) => String(l.id) === draft.lineId);
  const part = parts.find((p) => p.id === draft.partId);

  const set = <K extends keyof Draft>(k: K) => (v: Draft[K]) => {
    touch(String(k));
    setDraft((d) => ({ ...d, [k]: v }));
  };
  const setCoat = (key: number, patch: Partial<CoatDraft>) => {
    touch("coats");
    setDraft((d) => ({ ...d, coats: d.coats.map((c) => (c.key === key ? { ...c, ...patch } : c)) }));
  };
  const moveCoat = (i: number, by: -1 | 1) =>
    setDraft((d) => {
      const coats = [...d.coats];
      const j = i + by;
      if (j < 0 || j >= coats.length) return d;
      [coats[i], coats[j]] = [coats[j], coats[i]];
      return { ...d, coats };
    });

  function pickCoating(key: number, id: string) {
    touch("coats");
    const c = coatings.get(Number(id));
    setDraft((d) => ({
      ...d,
      coats: d.coats.map((x) =>
        x.key === key ? { ...x, coatingId: id, film: c && x.film.trim() === "" ? fieldText("filmUm", (c.filmMinUm + c.filmMaxUm) / 2, sys) : x.film } : x,
      ),
    }));
  }

  // a forced orientation is kept only while the part stays the same
  const keepOrientation = initial && initial.partId === draft.partId ? initial.orientation : null;
  const { body, errors: localErrors } = useMemo(() => toBody(draft, sys, coatings, keepOrientation), [draft, sys, coatings, keepOrientation]);
  const bodyText = body ? JSON.stringify(body) : null;
  const debounced = useDebounced(bodyText, 300);
  const previewUrl = `/api/runs/preview${initial ? `?runId=${initial.id}` : ""}`;
  const { data: preview, error: previewError, isValidating } = useSWR<RunPreviewResult, FetchError>(
    debounced ? [previewUrl, debounced] : null,
    previewFetcher,
    { keepPreviousData: true, shouldRetryOnError: false, revalidateOnFocus: false },
  );
  const apiFields = (saveError?.fields ?? (debounced === bodyText ? previewError?.fields : undefined)) ?? {};
  const showLocal = (f: string) => tried || touched.has("*") || touched.has(f) || (f.startsWith("coats.") && touched.has("coats"));
  // the API words some field errors as a fragment ("must be …"): make it a sentence
  const sentence = (m: string | undefined) => (m && /^[a-z]/.test(m) ? `${m[0].toUpperCase()}${m.slice(1)}${m.endsWith(".") ? "" : "."}` : m);
  const err = (f: string) => sentence((showLocal(f) ? localErrors[f] : undefined) ?? apiFields[f]);
  const shown = !previewError && preview && bodyText ? preview : null;
  const stale = shown !== null && (debounced !== bodyText || isValidating);
  // the preview says when a saved racking plan decides this run's racking
  const savedPlanId = shown?.plan.racking.savedPlanId ?? null;

  async function save(e: React.FormEvent) {
    e.preventDefault();
    if (!body) {
      setTried(true);
      // take the keyboard to the first field that needs attention
      requestAnimationFrame(() => (document.querySelector<HTMLElement>('form [aria-invalid="true"]'))?.focus());
      return;
    }
    setSaving(true);
    setSaveError(null);
    try {
      const saved = initial
        ? await sendJson<RunSaved>(`/api/runs/${initial.id}`, "PUT", body)
        : await sendJson<RunSaved>("/api/runs", "POST", body);
      if (onSaved) onSaved(saved);
      else router.push(`/runs/${saved.run.id}`);
    } catch (x) {
      setSaveError(x instanceof FetchError ? x : new FetchError(0, "server_error", "Could not save the run."));
    } finally {
      setSaving(false);
    }
  }

  const unitOf = (k: "lengthMm" | "speedMPerMin" | "filmUm") => unitLabel(k, sys);
  const textarea = (id: string, label: string, value: string, onChange: (v: string) => void, hint: string, field: string) => (
    <div>
      <label htmlFor={id} className="label">{label}</label>
      <textarea id={id} className="field min-h-20" value={value} onChange={(e) => onChange(e.target.value)} aria-describedby={`${id}-hint`} aria-invalid={err(field) ? true : undefined} />
      <p id={`${id}-hint`} className="mt-1 text-xs text-ink-faint">{hint}</p>
      {err(field) && <p className="field-error">{err(field)}</p>}
    </div>
  );

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,26rem)_minmax(0,1fr)]">
      <form onSubmit={save} noValidate aria-label={initial ? "Edit the run" : "Plan a run"} className="space-y-4">
        <fieldset className="card space-y-3">
          <legend className="px-1 font-semibold">Part</legend>
          {parts.length === 0 ? (
            <p className="text-sm text-ink-soft">No parts in the catalogue yet: an engineer adds them under Parts.</p>
          ) : (
            <div>
              <label htmlFor="run-part" className="label">Part</label>
              <select id="run-part" className="field" value={draft.partId} onChange={(e) => set("partId")(e.target.value)} aria-invalid={err("partId") ? true : undefined}>
                <option value="">— choose a part —</option>
                {parts.map((p) => (
                  <option key={p.id} value={p.id}>{p.number} · {p.name}</option>
                ))}
              </select>
              {err("partId") && <p className="field-error">{err("partId")}</p>}
              {part && (
                <p className="mt-1 text-xs text-ink-faint num" data-testid="part-facts">
                  {[part.lengthMm, part.widthMm, part.heightMm].map((v) => q("lengthMm", v, sys, 4)).join(" × ")}, {q("massKg", part.massKg, sys)}; outside {q("areaM2", part.areaM2, sys)}
                  {part.insideAreaM2 > 0 && `, inside ${q("areaM2", part.insideAreaM2, sys)}`}
                  {part.maskedAreaM2 > 0 && `, masked ${q("areaM2", part.maskedAreaM2, sys)}`}; section {q("lengthMm", part.thicknessMm, sys)}
                </p>
              )}
            </div>
          )}
          <TextField label="Quantity (parts)" name="quantity" inputMode="numeric" value={draft.quantity} onChange={set("quantity")} error={err("quantity")} />
        </fieldset>

        <fieldset className="card space-y-3">
          <legend className="px-1 font-semibold">Line and day</legend>
          <div>
            <label htmlFor="run-line" className="label">Line</label>
            <select id="run-line" className="field" value={draft.lineId} onChange={(e) => set("lineId")(e.target.value)} aria-invalid={err("lineId") ? true : undefined} aria-describedby={err("lineId") ? "run-line-err" : undefined}>
              <option value="">{linesError ? "Could not load the lines" : lines.length ? "— choose a line —" : "Loading lines…"}</option>
              {lines.map((l) => (
                <option key={l.id} value={l.id}>{l.name}</option>
              ))}
            </select>
            {err("lineId") && <p id="run-line-err" className="field-error" data-testid="line-error">{err("lineId")}</p>}
          </div>
          <div className="grid grid-cols-2 gap-3">
            <div>
              <label htmlFor="run-date" className="label">Day</label>
              <input id="run-date" type="date" className="field" value={draft.date} onChange={(e) => set("date")(e.target.value)} aria-invalid={err("date") ? true : undefined} />
              {err("date") && <p className="field-error">{err("date")}</p>}
            </div>
            <div>
              <label htmlFor="run-shift" className="label">Shift</label>
              <select id="run-shift" className="field" value={draft.shift} onChange={(e) => set("shift")(e.target.value)}>
                <option value="1">1</option>
                <option value="2">2</option>
                <option value="3">3</option>
              </select>
            </div>
          </div>
          {line?.kind === "conveyor" && (
            <TextField
              label={`Line speed (${unitOf("speedMPerMin")})`}
              name="lineSpeed"
              inputMode="decimal"
              value={draft.lineSpeed}
              onChange={set("lineSpeed")}
              error={err("lineSpeedMPerMin")}
              hint={`Empty: the line's usual ${q("speedMPerMin", line.lineSpeedNominalMPerMin, sys)} (range ${q("speedMPerMin", line.lineSpeedMinMPerMin, sys)}–${q("speedMPerMin", line.lineSpeedMaxMPerMin, sys)}).`}
            />
          )}
        </fieldset>

        <fieldset className="card space-y-3">
          <legend className="px-1 font-semibold">Racking</legend>
          {savedPlanId !== null && (
            <p className="rounded border border-plate-line bg-plate/40 p-2 text-sm" data-testid="saved-plan-note">
              This part has a saved racking plan on this line: the run hangs it that way, so the clearance and orientation
              below are not used while the plan stands (a count set by hand still wins).{" "}
              <a className="text-phosphate-dark underline" href={`/racking/plans/${savedPlanId}`}>
                Racking plan {savedPlanId}
              </a>
            </p>
          )}
          <TextField label={`Clearance between parts (${unitOf("lengthMm")})`} name="clearance" inputMode="decimal" value={draft.clearance} onChange={set("clearance")} error={err("clearanceMm")} />
          <div role="radiogroup" aria-label="Orientations" className="flex flex-wrap gap-4 text-sm">
            <label className="flex items-center gap-1.5">
              <input type="radio" name="run-orientations" checked={draft.orientations === "upright"} onChange={() => set("orientations")("upright")} />
              Upright only
            </label>
            <label className="flex items-center gap-1.5">
              <input type="radio" name="run-orientations" checked={draft.orientations === "any"} onChange={() => set("orientations")("any")} />
              Any orientation
            </label>
          </div>
          {err("orientation") && <p className="field-error">{err("orientation")}</p>}
          <TextField
            label={`Parts per ${line?.kind === "batch" ? "rack" : "carrier"}, set by hand`}
            name="override"
            inputMode="numeric"
            value={draft.override}
            onChange={set("override")}
            error={err("partsPerCarrierOverride")}
            hint="Leave empty to use the racking planner's count."
          />
        </fieldset>

        <fieldset className="card space-y-3">
          <legend className="px-1 font-semibold">Coats, in order</legend>
          {coatingsError && <p className="field-error">Could not load the coatings: {coatingsError.message}</p>}
          <ol className="space-y-3">
            {draft.coats.map((c, i) => {
              const coating = coatings.get(Number(c.coatingId));
              return (
                <li key={c.key} className="rounded-md border border-plate-line p-3" data-testid={`coat-${i}`}>
                  <div className="flex items-center gap-2">
                    <span className="font-medium">Coat {i + 1}</span>
                    {coating && <Swatch hex={coating.swatchHex} label={coating.colourName} />}
                    <span className="ml-auto flex gap-1">
                      <button type="button" className="btn-quiet px-2 py-0.5" onClick={() => moveCoat(i, -1)} disabled={i === 0} aria-label={`Move coat ${i + 1} earlier`}>↑</button>
                      <button type="button" className="btn-quiet px-2 py-0.5" onClick={() => moveCoat(i, 1)} disabled={i === draft.coats.length - 1} aria-label={`Move coat ${i + 1} later`}>↓</button>
                      <button
                        type="button"
                        className="btn-quiet px-2 py-0.5"
                        onClick={() => setDraft((d) => ({ ...d, coats: d.coats.filter((x) => x.key !== c.key) }))}
                        disabled={draft.coats.length === 1}
                        aria-label={`Remove coat ${i + 1}`}
                      >
                        Remove
                      </button>
                    </span>
                  </div>
                  <div className="mt-2 space-y-2">
                    <div>
                      <label htmlFor={`coat-${c.key}-coating`} className="label">Coat {i + 1} coating</label>
                      <select
                        id={`coat-${c.key}-coating`}
                        className="field"
                        value={c.coatingId}
                        onChange={(e) => pickCoating(c.key, e.target.value)}
                        aria-invalid={err(`coats.${i}.coatingId`) ? true : undefined}
                      >
                        <option value="">— choose a coating —</option>
                        {[...coatings.values()]
                          .filter((k) => !k.archived || String(k.id) === c.coatingId)
                          .map((k) => (
                            <option key={k.id} value={k.id}>
                              {k.code} · {k.kind === "e-coat" ? "e-coat" : "powder"} · {k.colourName}
                            </option>
                          ))}
                      </select>
                      {err(`coats.${i}.coatingId`) && <p className="field-error">{err(`coats.${i}.coatingId`)}</p>}
                    </div>
                    <TextField
                      label={`Coat ${i + 1} film (${unitOf("filmUm")})`}
                      name={`coat-${i}-film`}
                      inputMode="decimal"
                      value={c.film}
                      onChange={(v) => setCoat(c.key, { film: v })}
                      error={err(`coats.${i}.filmUm`)}
                      hint={coating ? `The coating's film build: ${q("filmUm", coating.filmMinUm, sys)}–${q("filmUm", coating.filmMaxUm, sys)}.` : undefined}
                    />
                    {coating?.kind === "powder" && (
                      <div className="grid grid-cols-2 gap-2">
                        <TextField
                          label={`Coat ${i + 1} first-pass efficiency (%)`}
                          name={`coat-${i}-fpe`}
                          inputMode="decimal"
                          value={c.fpePct}
                          onChange={(v) => setCoat(c.key, { fpePct: v })}
                          error={err(`coats.${i}.firstPassEfficiency`)}
                        />
                        <TextField
                          label={`Coat ${i + 1} reclaim (%)`}
                          name={`coat-${i}-reclaim`}
                          inputMode="decimal"
                          value={c.reclaimPct}
                          onChange={(v) => setCoat(c.key, { reclaimPct: v })}
                          error={err(`coats.${i}.reclaimEfficiency`)}
                        />
                      </div>
                    )}
                  </div>
                </li>
              );
            })}
          </ol>
          {err("coats") && <p className="field-error">{err("coats")}</p>}
          <button type="button" className="btn-quiet" onClick={() => setDraft((d) => ({ ...d, coats: [...d.coats, newCoat()] }))} disabled={draft.coats.length >= 4}>
            Add a coat
          </button>
        </fieldset>

        <fieldset className="card space-y-3">
          <legend className="px-1 font-semibold">Masking and notes</legend>
          {textarea("run-masking", "Masking list", draft.masking, set("masking"), "One item per line: what to plug, cap or tape, and with what.", "masking")}
          {textarea("run-notes", "Notes", draft.notes, set("notes"), "Anything the line should know: order number, samples, hanging.", "notes")}
        </fieldset>

        {saveError && (
          <p role="alert" className="field-error">
            {saveError.message}
          </p>
        )}
        <div className="flex gap-2">
          <button type="submit" className="btn-primary" disabled={saving}>
            {saving ? "Saving…" : initial ? "Save changes" : "Save as draft"}
          </button>
          {onCancel && (
            <button type="button" className="btn-quiet" onClick={onCancel}>
              Cancel
            </button>
          )}
        </div>
      </form>

      <section className="card h-fit space-y-4 lg:sticky lg:top-4" aria-labelledby="run-summary-h" aria-live="polite" aria-busy={stale}>
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="run-summary-h">The plan</h2>
          {stale && <span className="text-xs text-ink-faint" role="status">Updating…</span>}
        </div>
        {previewError && debounced === bodyText ? (
          <p className="field-error" role="alert" data-testid="preview-error">
            {previewError.fields && Object.keys(previewError.fields).length
              ? "The plan appears once the marked fields are put right."
              : previewError.message}
          </p>
        ) : !bodyText ? (
          <p className="text-sm text-ink-soft">Choose a part, a line and at least one coating, and enter the quantity and film: the plan appears here.</p>
        ) : !shown ? (
          <p className="text-sm text-ink-faint" role="status">Planning…</p>
        ) : (
          <div className={`space-y-4 ${stale ? "opacity-70" : ""}`} data-testid="run-summary">
            <PlanFacts plan={shown.plan} unitSystem={sys} currency={currency} />
            <Warnings warnings={shown.warnings} />
            <CoatsTable plan={shown.plan} unitSystem={sys} currency={currency} />
            <div>
              <h3 className="text-sm font-semibold">Racking</h3>
              <p className="mt-1 text-sm text-ink-soft">{shown.rackingReason}</p>
              <div className="mt-2">
                <RackDiagram windowMm={shown.plan.racking.windowMm} placements={shown.plan.racking.plan.placements} unitSystem={sys} heightPx={160} />
              </div>
            </div>
          </div>
        )}
      </section>
    </div>
  );
}
