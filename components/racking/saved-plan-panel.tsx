"use client";
// The saved racking plan for the part and line picked on the planner: loads it into the form
// once, and saves, updates or deletes it. The server validates and plans; its field errors are
// shown here and handed to the planner for the fields it owns.

import { useEffect, useState } from "react";
import useSWR, { useSWRConfig } from "swr";
import Link from "next/link";
import { FetchError, sendJson } from "@/lib/fetcher";
import { formatQuantity, type UnitSystem } from "@/lib/coating-math/display-units";
import { codeWords, type OrientationCode } from "@/lib/rack/orientation-code";
import type { RackPlansList, SavedRackPlan, SavedRackPlanSummary } from "@/app/api/rack/plans/route";
import { whenText } from "./when-text";

export const PLANS_URL = "/api/rack/plans";

export interface PlanSettings {
  clearanceMm: number;
  orientations: "any" | "upright";
  orientationOverride: OrientationCode | null;
}

interface Props {
  part: { id: string; number: string } | null;
  line: { id: number; name: string; kind: "conveyor" | "batch" } | null;
  /** the form's part box and window are the stored part's and line's (the plan uses those) */
  matches: boolean;
  onUseStored: () => void;
  /** the form's choices, or null while the form has errors */
  settings: PlanSettings | null;
  /** the count the form shows for these choices */
  previewCount: number | null;
  canSave: boolean;
  unitSystem: UnitSystem;
  onLoad: (plan: SavedRackPlanSummary) => void;
  onFieldErrors: (fields: Record<string, string>) => void;
}

const sameSettings = (a: PlanSettings, b: SavedRackPlanSummary) =>
  Math.abs(a.clearanceMm - b.clearanceMm) <= 1e-6 * Math.max(1, b.clearanceMm) &&
  a.orientations === b.orientations &&
  a.orientationOverride === b.orientationOverride;

export function SavedPlanPanel({ part, line, matches, onUseStored, settings, previewCount, canSave, unitSystem, onLoad, onFieldErrors }: Props) {
  const key = part && line ? `${PLANS_URL}?partId=${encodeURIComponent(part.id)}&lineId=${line.id}` : null;
  const { data, error, isLoading, mutate } = useSWR<RackPlansList, FetchError>(key, { shouldRetryOnError: false });
  const { mutate: mutateAll } = useSWRConfig();
  const existing = data?.plans[0] ?? null;
  const [loadedFor, setLoadedFor] = useState<string | null>(null);
  const [note, setNote] = useState("");
  const [busy, setBusy] = useState(false);
  const [confirming, setConfirming] = useState(false);
  const [message, setMessage] = useState<{ ok: boolean; text: string; fields?: Record<string, string> } | null>(null);

  // A saved plan is loaded into the form once per part × line picked.
  useEffect(() => {
    if (!key || !data || loadedFor === key) return;
    setLoadedFor(key);
    setConfirming(false);
    setMessage(null);
    onFieldErrors({});
    const plan = data.plans[0];
    setNote(plan?.note ?? "");
    if (plan) onLoad(plan);
    // onLoad and onFieldErrors are the planner's setters; the effect keys on the pair and its answer
  }, [key, data, loadedFor]);

  if (!part || !line) {
    return (
      <section className="card no-print" aria-labelledby="saved-plan-h" data-testid="saved-plan">
        <h2 id="saved-plan-h">Saved plan</h2>
        <p className="mt-1 text-sm text-ink-soft">
          {canSave
            ? "Take the part from the catalogue and the window from a line to save this plan for them; runs of that part on that line then use it."
            : "Saved plans for a part on a line are listed below; engineers and supervisors save them."}
        </p>
      </section>
    );
  }

  const dirty = existing !== null && settings !== null && (!sameSettings(settings, existing) || note.trim() !== existing.note);

  async function save() {
    if (!settings || !part || !line) return;
    setBusy(true);
    setMessage(null);
    onFieldErrors({});
    const body = { partId: part.id, lineId: line.id, ...settings, note };
    try {
      const { plan } = existing
        ? await sendJson<{ plan: SavedRackPlan }>(`${PLANS_URL}/${existing.id}`, "PUT", body)
        : await sendJson<{ plan: SavedRackPlan }>(PLANS_URL, "POST", body);
      await mutate({ plans: [plan] }, { revalidate: false });
      await mutateAll(PLANS_URL);
      setNote(plan.note);
      setMessage({ ok: true, text: `${existing ? "Updated" : "Saved"}: ${plan.partsPerCarrier} parts per ${line.kind === "batch" ? "rack" : "carrier"}.` });
    } catch (e) {
      const fe = e instanceof FetchError ? e : null;
      onFieldErrors(fe?.fields ?? {});
      setMessage({ ok: false, text: fe?.message ?? "The plan could not be saved.", fields: fe?.fields });
    } finally {
      setBusy(false);
    }
  }

  async function remove() {
    if (!existing) return;
    setBusy(true);
    setConfirming(false);
    try {
      await sendJson(`${PLANS_URL}/${existing.id}`, "DELETE");
      await mutate({ plans: [] }, { revalidate: false });
      await mutateAll(PLANS_URL);
      setMessage({ ok: true, text: "Deleted. Runs of this part on this line go back to the planner's count." });
    } catch (e) {
      setMessage({ ok: false, text: e instanceof FetchError ? e.message : "The plan could not be deleted." });
    } finally {
      setBusy(false);
    }
  }

  const len = (mm: number) => formatQuantity("lengthMm", mm, unitSystem, 4);
  const word = line.kind === "batch" ? "rack" : "carrier";
  const noteError = message?.fields?.note;
  return (
    <section className="card no-print space-y-3" aria-labelledby="saved-plan-h" aria-busy={busy || isLoading} data-testid="saved-plan">
      <h2 id="saved-plan-h">
        Saved plan: {part.number} on {line.name}
      </h2>
      {error ? (
        <p role="alert" className="field-error">Saved plans could not be loaded: {error.message}</p>
      ) : isLoading || !data ? (
        <p role="status" className="text-sm text-ink-faint">Looking for a saved plan…</p>
      ) : existing ? (
        <div className="text-sm" data-testid="saved-plan-facts">
          <p>
            Plan {existing.id}: <span className="num font-semibold">{existing.partsPerCarrier}</span> per {word} (limited by {existing.limitedBy}),{" "}
            {existing.orientationOverride ? `by hand: ${codeWords(existing.orientationOverride)}` : "the planner's best orientation"}, clearance{" "}
            <span className="num">{len(existing.clearanceMm)}</span>
            {existing.orientations === "upright" ? ", upright only" : ""}.
          </p>
          <p className="text-xs text-ink-faint">
            Updated by {existing.updatedByName ?? "someone since removed"}, {whenText(existing.updatedAt)}.{" "}
            <Link className="text-phosphate-dark underline" href={`/racking/plans/${existing.id}`}>
              Printable view
            </Link>
          </p>
          {dirty && <p className="mt-1 text-caution">The form differs from the saved plan: update it to keep the change.</p>}
        </div>
      ) : (
        <p className="text-sm text-ink-soft">No saved plan for this part on this line yet: runs use the planner&apos;s count.</p>
      )}

      {canSave && data && (
        <>
          {!matches && (
            <div className="rounded border border-caution-edge bg-caution-light p-2 text-sm" role="note">
              <p>
                The part or window fields differ from {part.number} and {line.name} as stored. A saved plan always uses the catalogue part and the
                line&apos;s window.
              </p>
              <button type="button" className="btn-quiet mt-1" onClick={onUseStored}>
                Use the stored sizes
              </button>
            </div>
          )}
          <div>
            <label htmlFor="plan-note" className="label">Note for the line (optional)</label>
            <textarea
              id="plan-note"
              className="field"
              rows={2}
              maxLength={1000}
              value={note}
              onChange={(e) => setNote(e.target.value)}
              aria-invalid={noteError ? true : undefined}
              aria-describedby={noteError ? "plan-note-err" : undefined}
            />
            {noteError && <p id="plan-note-err" className="field-error">{noteError}</p>}
          </div>
          <div className="flex flex-wrap items-center gap-2">
            <button type="button" className="btn-primary" onClick={save} disabled={busy || !matches || !settings || (existing !== null && !dirty)}>
              {existing ? "Update plan" : "Save plan"}
            </button>
            {existing &&
              (confirming ? (
                <>
                  <button type="button" className="btn-danger" onClick={remove} disabled={busy}>
                    Yes, delete plan {existing.id}
                  </button>
                  <button type="button" className="btn-quiet" onClick={() => setConfirming(false)}>
                    Keep it
                  </button>
                </>
              ) : (
                <button type="button" className="btn-quiet" onClick={() => setConfirming(true)} disabled={busy}>
                  Delete plan…
                </button>
              ))}
            {previewCount !== null && matches && settings && (!existing || dirty) && (
              <span className="text-xs text-ink-faint">Saves {previewCount} per {word} as shown.</span>
            )}
          </div>
        </>
      )}
      {message && (
        <div role={message.ok ? "status" : "alert"} className={message.ok ? "text-sm text-phosphate-dark" : "text-sm text-oxide"} data-testid="saved-plan-message">
          <p>{message.text}</p>
          {message.fields && Object.keys(message.fields).length > 0 && (
            <ul className="ml-5 list-disc">
              {Object.entries(message.fields).map(([f, m]) => (
                <li key={f}>
                  {FIELD_NAMES[f] ?? f}: {m}
                </li>
              ))}
            </ul>
          )}
        </div>
      )}
    </section>
  );
}

const FIELD_NAMES: Record<string, string> = {
  partId: "Part",
  lineId: "Line",
  clearanceMm: "Clearance",
  orientations: "Orientations",
  orientationOverride: "Orientation",
  note: "Note",
};
