"use client";
import Link from "next/link";
import { useState } from "react";
import useSWR from "swr";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { formatQuantity } from "@/lib/coating-math/display-units";
import { FetchError, sendJson } from "@/lib/fetcher";
import type { CoatingForecastView, ForecastView } from "@/lib/server/forecast";
import type { RequestView } from "@/lib/server/purchasing";
import { StockChart } from "./stock-chart";

interface Props {
  unitSystem: UnitSystem;
  canOrder: boolean;
}

const kg = (v: number, sys: UnitSystem) => formatQuantity("massKg", v, sys, 4);

/** The forecast table: need against stock and open requests per coating; purchasers pick lines to order. */
export function ForecastPage({ unitSystem, canOrder }: Props) {
  const [horizonText, setHorizonText] = useState("28");
  const [horizon, setHorizon] = useState(28);
  const [horizonError, setHorizonError] = useState("");
  const { data, error, isLoading, mutate } = useSWR<{ forecast: ForecastView }>(`/api/forecast?horizonDays=${horizon}`);
  const [chartId, setChartId] = useState<number | null>(null);
  const [picked, setPicked] = useState<Record<number, string>>({});
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);

  function applyHorizon(e: React.FormEvent) {
    e.preventDefault();
    const n = Number(horizonText);
    if (!Number.isInteger(n) || n < 1 || n > 366) {
      setHorizonError("Enter a whole number of days from 1 to 366 (at most a year).");
      return;
    }
    setHorizonError("");
    setHorizon(n);
  }

  const coatings = data?.forecast.coatings ?? [];
  const chart = coatings.find((c) => c.coatingId === chartId) ?? coatings.find((c) => c.demandKg > 0) ?? coatings[0];

  function toggle(c: CoatingForecastView) {
    setPicked((p) => {
      const next = { ...p };
      if (next[c.coatingId] !== undefined) delete next[c.coatingId];
      else next[c.coatingId] = String(Math.max(1, c.orderContainers));
      return next;
    });
  }

  async function send() {
    const lines = Object.entries(picked).map(([id, n]) => ({ coatingId: Number(id), containers: Number(n) }));
    const bad = lines.find((l) => !Number.isInteger(l.containers) || l.containers < 1);
    if (bad) {
      setMessage({ kind: "error", text: "Enter a whole number of containers, at least 1, for each chosen coating." });
      return;
    }
    setBusy(true);
    setMessage(null);
    try {
      const { requests } = await sendJson<{ requests: RequestView[] }>("/api/purchase-requests", "POST", { lines });
      setPicked({});
      setMessage({ kind: "ok", text: `Sent ${requests.map((r) => `${r.reference} to ${r.supplierName}`).join(", ")}.` });
      await mutate();
    } catch (e) {
      setMessage({ kind: "error", text: e instanceof FetchError ? e.message : "Could not send the purchase requests." });
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="space-y-4">
      <form className="flex flex-wrap items-end gap-3" onSubmit={applyHorizon} aria-label="Forecast horizon">
        <div>
          <label htmlFor="horizon" className="label">Horizon (days)</label>
          <input id="horizon" name="horizonDays" className="field w-28" inputMode="numeric" value={horizonText} onChange={(e) => setHorizonText(e.target.value)} aria-describedby={horizonError ? "horizon-err" : undefined} aria-invalid={horizonError ? true : undefined} />
        </div>
        <button type="submit" className="btn-quiet">Show</button>
        <a className="btn-quiet" href={`/api/forecast.csv?horizonDays=${horizon}`} download>Export CSV</a>
        {horizonError && <p id="horizon-err" role="alert" className="field-error w-full">{horizonError}</p>}
      </form>

      {isLoading ? (
        <p role="status">Working out the forecast…</p>
      ) : error ? (
        <p role="alert" className="text-oxide">Could not load the forecast: {(error as Error).message}</p>
      ) : !coatings.length ? (
        <p className="card text-sm text-ink-soft">No coatings in the library yet.</p>
      ) : (
        <>
          <p className="text-sm text-ink-soft">
            {data!.forecast.today} to {data!.forecast.endDate}: runs planned or in progress, stock used oldest expiry first, open purchase requests arriving at sent date + lead time.
          </p>
          {data!.forecast.problems.length > 0 && (
            <ul className="card border-caution text-sm" aria-label="Left out of the forecast">
              {data!.forecast.problems.map((p) => <li key={p}>{p}</li>)}
            </ul>
          )}
          <div className="overflow-x-auto">
            <table className="w-full text-sm [&_td]:px-2 [&_th]:px-2" aria-label="Material forecast">
              <thead>
                <tr className="text-left">
                  {canOrder && <th scope="col">Order</th>}
                  <th scope="col">Coating</th>
                  <th scope="col" className="text-right">Needed</th>
                  <th scope="col" className="text-right">In stock</th>
                  <th scope="col" className="text-right">Ordered</th>
                  <th scope="col">Runs out</th>
                  <th scope="col">Order by</th>
                  <th scope="col" className="text-right">To order</th>
                  <th scope="col">Expires before use</th>
                  <th scope="col"><span className="sr-only">Chart</span></th>
                </tr>
              </thead>
              <tbody>
                {coatings.map((c) => (
                  <tr key={c.coatingId} className="border-t border-plate-line align-top" data-coating={c.code}>
                    {canOrder && (
                      <td className="py-1">
                        <input type="checkbox" aria-label={`Order ${c.code}`} checked={picked[c.coatingId] !== undefined} onChange={() => toggle(c)} />
                        {picked[c.coatingId] !== undefined && (
                          <input className="field ml-1 w-16" inputMode="numeric" aria-label={`${c.code} containers to order`} value={picked[c.coatingId]} onChange={(e) => setPicked((p) => ({ ...p, [c.coatingId]: e.target.value }))} />
                        )}
                      </td>
                    )}
                    <td className="py-1">
                      <span className="mr-1 inline-block h-3 w-3 rounded-sm border border-plate-line align-middle" style={{ background: c.swatchHex }} aria-hidden />
                      <span className="font-medium">{c.code}</span> {c.name}
                      <div className="text-xs text-ink-soft">{c.supplierName || "no supplier"} · lead time {c.leadTimeDays} d</div>
                    </td>
                    <td className="num py-1 text-right">{kg(c.demandKg, unitSystem)}</td>
                    <td className="num py-1 text-right" data-stock>{kg(c.stockKg, unitSystem)}</td>
                    <td className="num py-1 text-right">{c.incomingKg > 0 ? kg(c.incomingKg, unitSystem) : "—"}</td>
                    <td className={`py-1 ${c.stockOutDate ? "font-medium text-oxide" : ""}`}>{c.stockOutDate ?? "—"}</td>
                    <td className={`py-1 ${c.orderLate ? "font-medium text-oxide" : ""}`}>{c.latestOrderDate ? `${c.latestOrderDate}${c.orderLate ? " (late)" : ""}` : "—"}</td>
                    <td className="num py-1 text-right">{c.orderContainers > 0 ? `${c.orderContainers} × ${kg(c.containerKg, unitSystem)} ${c.containerKind}` : "—"}</td>
                    <td className="py-1 text-xs">
                      {c.expiringLots.length ? c.expiringLots.map((l) => <div key={l.lotNumber} className="text-caution">{l.lotNumber}: {kg(l.wastedKg, unitSystem)} on {l.expiryDate}</div>) : "—"}
                    </td>
                    <td className="py-1">
                      <button type="button" className="btn-quiet text-xs" aria-pressed={chart?.coatingId === c.coatingId} onClick={() => setChartId(c.coatingId)}>Chart</button>
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          {canOrder && (
            <div className="flex flex-wrap items-center gap-2">
              <button type="button" className="btn-primary" disabled={busy || Object.keys(picked).length === 0} onClick={send}>
                {busy ? "Sending…" : "Send purchase requests"}
              </button>
              <span className="text-xs text-ink-soft">One e-mail per supplier with the chosen coatings. <Link className="underline" href="/purchase-requests">All purchase requests</Link></span>
            </div>
          )}
          {message && <p role={message.kind === "error" ? "alert" : "status"} className={message.kind === "error" ? "field-error" : "text-sm text-pass"}>{message.text}</p>}
          {chart && (
            <section className="card" aria-labelledby="chart-h">
              <h2 id="chart-h">{chart.code}: projected stock</h2>
              <StockChart code={chart.code} series={chart.series} reorderPointKg={chart.reorderPointKg} stockOutDate={chart.stockOutDate} shortfallKg={chart.shortfallKg} unitSystem={unitSystem} />
              {chart.demands.length > 0 && (
                <ul className="mt-2 text-xs text-ink-soft">
                  {chart.demands.map((d) => (
                    <li key={`${d.runId}-${d.coatIndex}`}>
                      <Link className="underline" href={`/runs/${d.runId}`}>Run {d.runId}</Link> {d.date} {d.lineName}: {d.quantity} × {d.partNumber}, {kg(d.kg, unitSystem)}
                      {d.utilisation !== null && ` at ${(d.utilisation * 100).toFixed(0)} % utilisation${d.measured ? " (measured)" : " (nominal)"}`}
                    </li>
                  ))}
                </ul>
              )}
            </section>
          )}
        </>
      )}
    </div>
  );
}
