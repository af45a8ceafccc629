"use client";
// The runs of a day: filter by day and line, the computed numbers of each run, and the
// "Plan a run" form for supervisors.

import Link from "next/link";
import { useState } from "react";
import useSWR from "swr";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import type { LinesList } from "@/app/api/lines/route";
import type { RunsList } from "@/app/api/runs/route";
import type { RunPartView } from "@/lib/server/runs";
import { addDays, dayLabel, duration, localToday, money, q } from "./format";
import { browserOnly } from "@/components/ui/browser-only";
import { StatusBadge, Swatch } from "./status-badge";

// The planning form loads when someone opens it: it stays out of the list's first load.
const RunForm = browserOnly(
  () => import("./run-form").then((m) => m.RunForm),
  <p role="status" className="text-sm text-ink-soft">Loading the form…</p>,
);

interface Props {
  parts: RunPartView[];
  unitSystem: UnitSystem;
  currency: string;
  canPlan: boolean;
}

export function RunsPage({ parts, unitSystem: sys, currency, canPlan }: Props) {
  const [date, setDate] = useState(localToday);
  const [lineId, setLineId] = useState("");
  const [planning, setPlanning] = useState(false);
  const { data: linesBody } = useSWR<LinesList>("/api/lines");
  const key = `/api/runs?date=${date}${lineId ? `&lineId=${lineId}` : ""}`;
  const { data, error, isLoading } = useSWR<RunsList>(date ? key : null);

  return (
    <div className="space-y-6">
      {canPlan && (
        <div>
          {planning ? (
            <section aria-labelledby="plan-h" className="space-y-3">
              <h2 id="plan-h">Plan a run</h2>
              <RunForm parts={parts} unitSystem={sys} currency={currency} onCancel={() => setPlanning(false)} />
            </section>
          ) : (
            <button type="button" className="btn-primary" onClick={() => setPlanning(true)}>
              Plan a run
            </button>
          )}
        </div>
      )}

      <section aria-labelledby="list-h" className="space-y-3">
        <div className="flex flex-wrap items-end gap-3">
          <h2 id="list-h" className="mr-auto">Runs on {dayLabel(date)}</h2>
          <div className="flex items-end gap-1">
            <button type="button" className="btn-quiet" onClick={() => setDate((d) => addDays(d, -1))} aria-label="Previous day">←</button>
            <div>
              <label htmlFor="runs-day" className="label">Showing day</label>
              <input id="runs-day" type="date" className="field" value={date} onChange={(e) => setDate(e.target.value)} />
            </div>
            <button type="button" className="btn-quiet" onClick={() => setDate((d) => addDays(d, 1))} aria-label="Next day">→</button>
          </div>
          <div>
            <label htmlFor="runs-line" className="label">Showing line</label>
            <select id="runs-line" className="field" value={lineId} onChange={(e) => setLineId(e.target.value)}>
              <option value="">All lines</option>
              {linesBody?.lines.map((l) => (
                <option key={l.id} value={l.id}>{l.name}</option>
              ))}
            </select>
          </div>
        </div>
        {isLoading ? (
          <p role="status">Loading runs…</p>
        ) : error ? (
          <p role="alert" className="text-oxide">Could not load the runs: {error.message}</p>
        ) : !data?.runs.length ? (
          <p className="card text-ink-soft">No runs on this day{lineId ? " on this line" : ""}.{canPlan ? " Plan one with Plan a run." : ""}</p>
        ) : (
          <div className="card overflow-x-auto p-0">
            <table className="w-full text-left text-sm" data-testid="runs-table">
              <thead className="bg-plate-sunk text-ink-soft">
                <tr>
                  <th className="px-3 py-2 font-medium">Line · shift</th>
                  <th className="px-3 py-2 font-medium">Part</th>
                  <th className="px-3 py-2 font-medium">Coats</th>
                  <th className="px-3 py-2 text-right font-medium">Quantity</th>
                  <th className="px-3 py-2 text-right font-medium">Carriers or racks</th>
                  <th className="px-3 py-2 text-right font-medium">Line time</th>
                  <th className="px-3 py-2 text-right font-medium">Material per coating</th>
                  <th className="px-3 py-2 text-right font-medium">Cost per part</th>
                  <th className="px-3 py-2 font-medium">Status</th>
                </tr>
              </thead>
              <tbody>
                {data.runs.map((r) => (
                  <tr key={r.id} className="border-t border-plate-line align-top" data-run-id={r.id}>
                    <td className="px-3 py-2">
                      {r.line.name}
                      <span className="block text-xs text-ink-faint">shift {r.shift}</span>
                    </td>
                    <td className="px-3 py-2">
                      <Link className="font-medium text-phosphate-dark underline-offset-2 hover:underline" href={`/runs/${r.id}`}>
                        {r.part?.number ?? "—"}
                      </Link>
                      <span className="block text-xs text-ink-faint">{r.part?.name}</span>
                    </td>
                    <td className="px-3 py-2">
                      <ul className="space-y-0.5">
                        {r.coats.map((c) => (
                          <li key={c.position} className="flex items-center gap-1.5 whitespace-nowrap">
                            {c.coating && <Swatch hex={c.coating.swatchHex} label={c.coating.colourName} />}
                            {c.coating?.code ?? "?"} <span className="text-ink-faint">{q("filmUm", c.filmUm, sys)}</span>
                          </li>
                        ))}
                      </ul>
                    </td>
                    <td className="px-3 py-2 text-right num">{r.quantity.toLocaleString("en-US")}</td>
                    {r.summary ? (
                      <>
                        <td className="px-3 py-2 text-right num">
                          {r.summary.carriers.toLocaleString("en-US")} {r.line.kind === "conveyor" ? "carriers" : "racks"}
                          <span className="block text-xs text-ink-faint">{r.summary.partsPerCarrier} per {r.line.kind === "conveyor" ? "carrier" : "rack"}</span>
                        </td>
                        <td className="px-3 py-2 text-right num">{duration(r.summary.lineTimeMin)}</td>
                        <td className="px-3 py-2 text-right num">
                          <ul>
                            {r.summary.materials.map((m) => (
                              <li key={m.code} className="whitespace-nowrap">
                                {q("massKg", m.kg, sys)} <span className="text-xs text-ink-faint">{m.code}</span>
                              </li>
                            ))}
                          </ul>
                        </td>
                        <td className="px-3 py-2 text-right num">{money(r.summary.costPerPart, currency)}</td>
                      </>
                    ) : (
                      <td colSpan={4} className="px-3 py-2 text-oxide">{r.planError?.message ?? "Does not plan."}</td>
                    )}
                    <td className="px-3 py-2">
                      <StatusBadge status={r.status} />
                      {r.summary && !r.summary.cures && <span className="mt-1 block text-xs text-oxide">cure fails</span>}
                      <Link className="mt-1 block text-xs text-phosphate-dark underline-offset-2 hover:underline" href={`/runs/${r.id}/sheet`}>
                        Run sheet
                      </Link>
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>
    </div>
  );
}
