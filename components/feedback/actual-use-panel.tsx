"use client";
import Link from "next/link";
import { useState } from "react";
import useSWR from "swr";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { formatQuantity, fromDisplay, unitLabel } from "@/lib/coating-math/display-units";
import { FetchError, sendJson } from "@/lib/fetcher";
import type { ActualUseView } from "@/lib/server/feedback";
import { UtilisationFigures } from "./utilisation-figures";

/** A done run's actual use per powder coat: parts coated and powder used (weighed), and what it implies. */
export function ActualUsePanel({ runId, unitSystem, canRecord }: { runId: number; unitSystem: UnitSystem; canRecord: boolean }) {
  const url = `/api/runs/${runId}/actual-use`;
  const { data, error, isLoading, mutate } = useSWR<{ actualUse: ActualUseView }>(url);
  const [drafts, setDrafts] = useState<Record<number, { parts: string; used: string }>>({});
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [confirmText, setConfirmText] = useState("");
  const [saved, setSaved] = useState("");
  const [busy, setBusy] = useState(false);

  if (isLoading) return <p role="status">Loading actual use…</p>;
  if (error) return <p role="alert" className="text-oxide">{(error as FetchError).status === 404 ? "There is no such run." : `Could not load: ${(error as Error).message}`}</p>;
  const v = data!.actualUse;
  const powder = v.coats.filter((c) => c.kind === "powder");
  const draft = (i: number) => drafts[i] ?? { parts: String(v.quantity), used: "" };
  const massUnit = unitLabel("massKg", unitSystem);

  async function submit(confirm: boolean) {
    const coats = powder.map((c) => ({
      coatIndex: c.coatIndex,
      partsCoated: Number(draft(c.coatIndex).parts),
      kgUsed: draft(c.coatIndex).used.trim() === "" ? NaN : fromDisplay("massKg", Number(draft(c.coatIndex).used), unitSystem),
    }));
    const local: Record<string, string> = {};
    coats.forEach((c, i) => {
      if (!Number.isInteger(c.partsCoated) || c.partsCoated < 1) local[`coats.${i}.partsCoated`] = "Enter the parts coated, a whole number of at least 1.";
      if (!Number.isFinite(c.kgUsed) || c.kgUsed <= 0) local[`coats.${i}.kgUsed`] = `Enter the powder used in ${massUnit}, more than 0.`;
    });
    setErrors(local);
    setConfirmText("");
    setSaved("");
    if (Object.keys(local).length) return;
    setBusy(true);
    try {
      await sendJson(url, "POST", { coats, ...(confirm ? { confirm: true } : {}) });
      setSaved("Saved. The utilisation estimate is updated.");
      setDrafts({});
      await mutate();
    } catch (e) {
      if (e instanceof FetchError && e.status === 409 && e.fields.confirm) setConfirmText(e.message);
      else if (e instanceof FetchError) setErrors({ ...e.fields, _: e.message });
      else setErrors({ _: "Could not save the actual use." });
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="space-y-4">
      <p className="text-sm text-ink-soft">
        Run {v.runId} on {v.lineName}: {v.quantity} parts planned. Weigh the powder boxes (or hopper) before and after the run; the difference is the powder used.
        Coatwright works out the deposited mass from the coated area, the film (the film checks' measured mean where there is one, else the target) and the specific gravity.
      </p>
      {!powder.length && <p className="card text-sm">This run has no powder coat; e-coat use is not weighed here.</p>}
      {powder.map((c, i) => (
        <section key={c.coatIndex} className="card space-y-2" aria-labelledby={`coat-${c.coatIndex}`}>
          <h2 id={`coat-${c.coatIndex}`}>Coat {c.coatIndex + 1}: {c.code} {c.name}</h2>
          <p className="text-sm">
            Film used: {formatQuantity("filmUm", c.measuredFilmUm ?? c.targetFilmUm, unitSystem, 3)} ({c.measuredFilmUm !== null ? "measured mean" : "target; no film checks yet"}) · area per part {c.areaPerPartM2.toFixed(3)} m²
          </p>
          {c.estimate && <UtilisationFigures e={c.estimate} />}
          {c.recorded && (
            <p className="text-sm" data-recorded>
              Recorded: {c.recorded.partsCoated} parts, {formatQuantity("massKg", c.recorded.kgUsed, unitSystem, 4)} used, {formatQuantity("massKg", c.recorded.depositedKg, unitSystem, 4)} deposited → utilisation <strong>{(c.recorded.utilisation * 100).toFixed(1)} %</strong>
              {c.recorded.excluded && " (excluded from the estimate)"}
            </p>
          )}
          {canRecord && v.canRecord && (
            <div className="grid gap-2 sm:grid-cols-2">
              <div>
                <label className="label" htmlFor={`parts-${c.coatIndex}`}>Parts coated</label>
                <input id={`parts-${c.coatIndex}`} className="field" inputMode="numeric" value={draft(c.coatIndex).parts} onChange={(e) => setDrafts((d) => ({ ...d, [c.coatIndex]: { ...draft(c.coatIndex), parts: e.target.value } }))} />
                {errors[`coats.${i}.partsCoated`] && <p className="field-error">{errors[`coats.${i}.partsCoated`]}</p>}
              </div>
              <div>
                <label className="label" htmlFor={`used-${c.coatIndex}`}>Powder used ({massUnit})</label>
                <input id={`used-${c.coatIndex}`} className="field" inputMode="decimal" value={draft(c.coatIndex).used} onChange={(e) => setDrafts((d) => ({ ...d, [c.coatIndex]: { ...draft(c.coatIndex), used: e.target.value } }))} />
                {errors[`coats.${i}.kgUsed`] && <p className="field-error">{errors[`coats.${i}.kgUsed`]}</p>}
              </div>
            </div>
          )}
        </section>
      ))}
      {!v.canRecord && <p className="text-sm text-ink-soft">Actual use is recorded once the run is done (it is {v.status}).</p>}
      {canRecord && v.canRecord && powder.length > 0 && (
        <div className="space-y-2">
          {confirmText && (
            <div role="alertdialog" aria-labelledby="use-confirm" className="rounded-md border border-caution bg-caution-light p-3 text-sm">
              <p id="use-confirm">{confirmText}</p>
              <button type="button" className="btn-primary mt-2" disabled={busy} onClick={() => submit(true)}>Save anyway</button>
            </div>
          )}
          {errors._ && <p role="alert" className="field-error">{errors._}</p>}
          <button type="button" className="btn-primary" disabled={busy} onClick={() => submit(false)}>{busy ? "Saving…" : "Save actual use"}</button>
          {saved && <p role="status" className="text-sm text-pass">{saved}</p>}
        </div>
      )}
      <p className="text-xs text-ink-soft">
        Safety: empty and weigh powder containers with the booth stopped and extraction running; powder dust is combustible — follow the plant's procedures and local codes. <Link className="underline" href="/feedback">All utilisation estimates</Link>
      </p>
    </div>
  );
}
