"use client";
import Link from "next/link";
import { useState } from "react";
import useSWR from "swr";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { formatQuantity } from "@/lib/coating-math/display-units";
import { FetchError, sendJson } from "@/lib/fetcher";
import type { EstimateView } from "@/lib/server/feedback";
import { UtilisationFigures } from "./utilisation-figures";

/** Measured utilisation per line × coating, its history, and (supervisors) exclude or reset. */
export function EstimatesPage({ unitSystem, canEdit }: { unitSystem: UnitSystem; canEdit: boolean }) {
  const { data, error, isLoading, mutate } = useSWR<{ estimates: EstimateView[] }>("/api/feedback");
  const [busy, setBusy] = useState(false);
  const [asking, setAsking] = useState<string | null>(null);
  const [msg, setMsg] = useState("");
  if (isLoading) return <p role="status">Loading estimates…</p>;
  if (error) return <p role="alert" className="text-oxide">Could not load the estimates: {(error as Error).message}</p>;
  const estimates = data?.estimates ?? [];
  if (!estimates.length) return <p className="card text-sm text-ink-soft">No actual use recorded yet. Operators record it on a done run's page (Actual use).</p>;

  async function act(fn: () => Promise<unknown>) {
    setBusy(true);
    setMsg("");
    try {
      await fn();
      setAsking(null);
      await mutate();
    } catch (e) {
      setMsg(e instanceof FetchError ? e.message : "Could not save the change.");
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="space-y-4">
      {msg && <p role="alert" className="field-error">{msg}</p>}
      {estimates.map((e) => {
        const key = `${e.lineId}:${e.coatingId}`;
        return (
          <section key={key} className="card space-y-2" aria-labelledby={`est-${key}`} data-estimate={`${e.lineName} ${e.code}`}>
            <div className="flex flex-wrap items-baseline gap-2">
              <h2 id={`est-${key}`} className="mr-auto">{e.lineName} · {e.code} {e.name}</h2>
              {canEdit && e.runs > 0 && <button type="button" className="btn-quiet text-oxide" disabled={busy} onClick={() => setAsking(key)}>Reset estimate</button>}
            </div>
            <UtilisationFigures e={e} minRuns={e.minRuns} />
            {asking === key && (
              <div role="alertdialog" aria-labelledby={`reset-${key}`} className="rounded-md border border-oxide bg-oxide-light p-3 text-sm">
                <p id={`reset-${key}`}>Exclude all {e.runs} runs and start the estimate afresh? The history is kept.</p>
                <div className="mt-2 flex gap-2">
                  <button type="button" className="btn-danger" disabled={busy} onClick={() => act(() => sendJson("/api/feedback/reset", "POST", { lineId: e.lineId, coatingId: e.coatingId }))}>Yes, reset</button>
                  <button type="button" className="btn-quiet" onClick={() => setAsking(null)}>Keep it</button>
                </div>
              </div>
            )}
            <table className="w-full text-sm [&_td]:px-2 [&_th]:px-2" aria-label={`History of ${e.lineName} ${e.code}`}>
              <thead>
                <tr className="text-left">
                  <th scope="col">Run</th>
                  <th scope="col" className="text-right">Parts</th>
                  <th scope="col" className="text-right">Used</th>
                  <th scope="col" className="text-right">Deposited</th>
                  <th scope="col" className="text-right">Utilisation</th>
                  <th scope="col">In estimate</th>
                </tr>
              </thead>
              <tbody>
                {e.history.map((h) => (
                  <tr key={h.id} className={`border-t border-plate-line ${h.excluded ? "text-ink-faint line-through" : ""}`}>
                    <td><Link className="underline" href={`/runs/${h.runId}`}>Run {h.runId}</Link> {h.runDate} · coat {h.coatIndex + 1}</td>
                    <td className="num text-right">{h.partsCoated}</td>
                    <td className="num text-right">{formatQuantity("massKg", h.kgUsed, unitSystem, 4)}</td>
                    <td className="num text-right">{formatQuantity("massKg", h.depositedKg, unitSystem, 4)}</td>
                    <td className="num text-right">{(h.utilisation * 100).toFixed(1)} %</td>
                    <td>
                      {canEdit ? (
                        <label className="inline-flex items-center gap-1 no-underline">
                          <input type="checkbox" checked={!h.excluded} disabled={busy} onChange={() => act(() => sendJson(`/api/feedback/${h.id}`, "PATCH", { excluded: !h.excluded }))} />
                          <span className="sr-only">Include run {h.runId} in the estimate</span>
                          {h.excluded ? "excluded" : "included"}
                        </label>
                      ) : h.excluded ? "excluded" : "included"}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </section>
        );
      })}
    </div>
  );
}
