"use client";
import Link from "next/link";
import { useState } from "react";
import useSWR from "swr";
import type { LinesList } from "@/app/api/lines/route";
import type { LineView } from "@/lib/server/lines";
import { formatSignificant, type UnitSystem } from "@/lib/coating-math/display-units";
// dims comes from unit-draft, not line-detail: importing the detail view put it in this page's first load.
import { dims, money, show } from "./unit-draft";

/** Every finishing line as a card: kind, speed or cycle data, its ovens, running cost. */
export function LinesListView({ unitSystem: sys, currency, canEdit }: { unitSystem: UnitSystem; currency: string; canEdit: boolean }) {
  const [archived, setArchived] = useState(false);
  const { data, error, isLoading } = useSWR<LinesList>(archived ? "/api/lines?archived=1" : "/api/lines");
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center gap-3">
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" checked={archived} onChange={(e) => setArchived(e.target.checked)} /> Show archived
        </label>
        {canEdit && <Link href="/lines/new" className="btn-primary ml-auto">New line</Link>}
      </div>
      {isLoading ? (
        <p role="status">Loading lines…</p>
      ) : error ? (
        <p role="alert" className="text-oxide">Could not load the lines: {error.message}</p>
      ) : !data?.lines.length ? (
        <p className="card text-ink-soft">No lines yet.{canEdit ? " Add the first one with New line." : " A manager adds them."}</p>
      ) : (
        <ul className="grid gap-4 md:grid-cols-2 xl:grid-cols-3">
          {data.lines.map((l) => (
            <li key={l.id} className="card flex flex-col gap-2">
              <div className="flex items-start gap-2">
                <h2 className="grow">
                  <Link className="text-phosphate-dark underline-offset-2 hover:underline" href={`/lines/${l.id}`}>{l.name}</Link>
                </h2>
                <span className="rounded bg-plate-sunk px-2 py-0.5 text-xs whitespace-nowrap">{l.kind === "conveyor" ? "Conveyor" : "Batch oven"}</span>
              </div>
              {l.archived && <span className="text-xs text-caution">Archived</span>}
              <LineFacts line={l} unitSystem={sys} currency={currency} />
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

function LineFacts({ line: l, unitSystem: sys, currency }: { line: LineView; unitSystem: UnitSystem; currency: string }) {
  if (l.kind === "batch") {
    return (
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-sm">
        <dt className="text-ink-soft">Racks per load</dt>
        <dd className="num">{l.racksPerLoad} × {dims(l.windowMm, sys)}</dd>
        <dt className="text-ink-soft">Air</dt>
        <dd className="num">{show("temperatureC", l.airTempC, sys, 4)}</dd>
        <dt className="text-ink-soft">Load · unload</dt>
        <dd className="num">{formatSignificant(l.loadMin, 3)} · {formatSignificant(l.unloadMin, 3)} min</dd>
        <dt className="text-ink-soft">Cost</dt>
        <dd className="num">{money(l.hourlyCost, currency)}/h</dd>
      </dl>
    );
  }
  const ovens = l.stages.filter((s) => s.kind === "cure-oven");
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-sm">
      <dt className="text-ink-soft">Speed</dt>
      <dd className="num">{show("speedMPerMin", l.lineSpeedMinMPerMin, sys)} – {show("speedMPerMin", l.lineSpeedMaxMPerMin, sys)}</dd>
      <dt className="text-ink-soft">Stages</dt>
      <dd className="num">{l.stages.length}, {show("lengthM", l.stages.reduce((a, s) => a + s.lengthM, 0), sys)} of conveyor</dd>
      <dt className="text-ink-soft">Cure ovens</dt>
      <dd className="num">{ovens.map((o) => `${o.name} ${show("lengthM", o.lengthM, sys)}`).join("; ") || "none"}</dd>
      <dt className="text-ink-soft">Carrier</dt>
      <dd className="num">{dims(l.windowMm, sys)}, {show("massKg", l.maxLoadKg, sys, 4)}</dd>
      <dt className="text-ink-soft">Cost</dt>
      <dd className="num">{money(l.hourlyCost, currency)}/h</dd>
    </dl>
  );
}
