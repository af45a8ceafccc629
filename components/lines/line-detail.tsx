"use client";
import Link from "next/link";
import { useMemo, useState } from "react";
import useSWR from "swr";
import { FetchError } from "@/lib/fetcher";
import type { ConveyorLineView, LineView } from "@/lib/server/lines";
import { lineTimeline } from "@/lib/lines/timeline";
import { STAGE_KIND_LABELS, type StageKind } from "@/lib/lines/stages";
import { formatSignificant, type UnitSystem } from "@/lib/coating-math/display-units";
import { browserOnly } from "@/components/ui/browser-only";
import { LineTimelineChart } from "./line-timeline";
import { dims, money, parse, show, toShown, unitOf } from "./unit-draft";

// The cure check is a tool below the line's facts; its code loads after the page has hydrated,
// which keeps it out of the page's first load.
const CureCheckPanel = browserOnly(
  () => import("./cure-check-panel").then((m) => m.CureCheckPanel),
  <p role="status" className="card text-sm text-ink-soft">Loading the cure check…</p>,
);

// Archiving is a manager's rare step at the foot of the page: its code loads on its own.
const ArchiveLine = browserOnly(() => import("./archive-line").then((m) => m.ArchiveLine), null);

interface Props {
  id: number;
  unitSystem: UnitSystem;
  currency: string;
  canEdit: boolean;
}

/** One line: its data, the timeline at a chosen speed and the cure check. */
export function LineDetail({ id, unitSystem: sys, currency, canEdit }: Props) {
  const { data, error, isLoading } = useSWR<{ line: LineView }>(`/api/lines/${id}`);
  if (isLoading) return <p role="status">Loading the line…</p>;
  if (error) {
    return (
      <p role="alert" className="text-oxide">
        {error instanceof FetchError && error.status === 404 ? "There is no such line." : `Could not load the line: ${error.message}`}{" "}
        <Link className="underline" href="/lines">Back to the lines</Link>
      </p>
    );
  }
  const line = data!.line;
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center gap-3">
        <h1>{line.name}</h1>
        <span className="rounded bg-plate-sunk px-2 py-0.5 text-sm">{line.kind === "conveyor" ? "Conveyor line" : "Batch oven"}</span>
        {line.archived && <span className="rounded bg-caution-light px-2 py-0.5 text-sm text-caution">Archived</span>}
        {canEdit && (
          <Link className="btn-quiet ml-auto" href={`/lines/${line.id}/edit`}>
            Edit line
          </Link>
        )}
      </div>
      {line.notes && <p className="max-w-3xl text-sm text-ink-soft">{line.notes}</p>}
      {line.kind === "conveyor" ? (
        <ConveyorBody line={line} unitSystem={sys} currency={currency} />
      ) : (
        <>
          <section className="card" aria-labelledby="oven-h">
            <h2 id="oven-h">Oven</h2>
            <dl className="mt-2 grid gap-x-6 gap-y-1 text-sm sm:grid-cols-[auto_1fr_auto_1fr]">
              <dt className="text-ink-soft">Interior (W × H × D)</dt>
              <dd className="num">{dims(line.interiorMm, sys)}</dd>
              <dt className="text-ink-soft">Racks per load</dt>
              <dd className="num">{line.racksPerLoad}</dd>
              <dt className="text-ink-soft">Rack window (W × H × D)</dt>
              <dd className="num">{dims(line.windowMm, sys)}</dd>
              <dt className="text-ink-soft">Load limit per rack</dt>
              <dd className="num">{show("massKg", line.maxLoadKg, sys, 4)}</dd>
              <dt className="text-ink-soft">Air temperature</dt>
              <dd className="num">{show("temperatureC", line.airTempC, sys, 4)}</dd>
              <dt className="text-ink-soft">Heat-transfer coefficient</dt>
              <dd className="num">{show("heatTransferWPerM2K", line.heatTransferCoefficientWPerM2K, sys)}</dd>
              <dt className="text-ink-soft">Load · unload</dt>
              <dd className="num">
                {formatSignificant(line.loadMin, 3)} min · {formatSignificant(line.unloadMin, 3)} min
              </dd>
              <dt className="text-ink-soft">Running cost</dt>
              <dd className="num">{money(line.hourlyCost, currency)} per hour</dd>
            </dl>
          </section>
          <CureCheckPanel line={line} unitSystem={sys} />
          <SafetyNote kinds={["cure-oven"]} />
        </>
      )}
      {canEdit && !line.archived && <ArchiveLine line={line} />}
    </div>
  );
}

function ConveyorBody({ line, unitSystem: sys, currency }: { line: ConveyorLineView; unitSystem: UnitSystem; currency: string }) {
  const [speed, setSpeed] = useState(line.lineSpeedNominalMPerMin);
  // three significant figures, as the speeds are shown everywhere else (9.84 ft/min, not 9.84252)
  const speedDraft = (mPerMin: number) => formatSignificant(toShown("speedMPerMin", mPerMin, sys), 3);
  const [speedText, setSpeedText] = useState(speedDraft(line.lineSpeedNominalMPerMin));
  const [speedError, setSpeedError] = useState<string | null>(null);
  const timeline = useMemo(() => {
    try {
      return lineTimeline({ stages: line.stages, lineSpeedMPerMin: speed, carrierPitchM: line.carrierPitchM, speedRange: line });
    } catch {
      return null;
    }
  }, [line, speed]);
  const lo = line.lineSpeedMinMPerMin;
  const hi = line.lineSpeedMaxMPerMin;

  function choose(metric: number) {
    setSpeed(metric);
    setSpeedText(speedDraft(metric));
    setSpeedError(null);
  }
  function typed(text: string) {
    setSpeedText(text);
    const v = text.trim() === speedDraft(speed) ? speed : parse("speedMPerMin", text, sys);
    if (v === undefined || Number.isNaN(v)) return setSpeedError("Enter the line speed as a number.");
    // a typed speed may sit a hair outside the range after conversion; the range ends are allowed
    if (v < lo * (1 - 1e-9) || v > hi * (1 + 1e-9)) {
      return setSpeedError(`Choose a speed from ${show("speedMPerMin", lo, sys)} to ${show("speedMPerMin", hi, sys)}.`);
    }
    setSpeedError(null);
    setSpeed(Math.min(hi, Math.max(lo, v)));
  }

  return (
    <>
      <section className="card" aria-labelledby="conveyor-h">
        <h2 id="conveyor-h">Conveyor</h2>
        <dl className="mt-2 grid gap-x-6 gap-y-1 text-sm sm:grid-cols-[auto_1fr_auto_1fr]">
          <dt className="text-ink-soft">Speed range</dt>
          <dd className="num">
            {show("speedMPerMin", lo, sys)} – {show("speedMPerMin", hi, sys)} (usually {show("speedMPerMin", line.lineSpeedNominalMPerMin, sys)})
          </dd>
          <dt className="text-ink-soft">Carrier pitch</dt>
          <dd className="num">{show("lengthM", line.carrierPitchM, sys)}</dd>
          <dt className="text-ink-soft">Carrier window (W × H × D)</dt>
          <dd className="num">{dims(line.windowMm, sys)}</dd>
          <dt className="text-ink-soft">Load limit per carrier</dt>
          <dd className="num">{show("massKg", line.maxLoadKg, sys, 4)}</dd>
          <dt className="text-ink-soft">Running cost</dt>
          <dd className="num">{money(line.hourlyCost, currency)} per hour</dd>
        </dl>
      </section>

      <section className="card space-y-3" aria-labelledby="timeline-h">
        <div className="flex flex-wrap items-end gap-4">
          <h2 id="timeline-h" className="mr-auto">Timeline</h2>
          <div className="w-40">
            <label className="label" htmlFor="line-speed">Line speed ({unitOf("speedMPerMin", sys)})</label>
            <input id="line-speed" className="field num" inputMode="decimal" value={speedText} aria-invalid={speedError ? true : undefined} aria-describedby={speedError ? "line-speed-err" : undefined} onChange={(e) => typed(e.target.value)} />
          </div>
          <input
            type="range"
            aria-label="Line speed slider"
            className="w-48 accent-phosphate"
            min={lo}
            max={hi}
            step={(hi - lo) / 100}
            value={speed}
            onChange={(e) => choose(Number(e.target.value))}
          />
          <div className="flex gap-1">
            <button type="button" className="btn-quiet" onClick={() => choose(lo)}>Slowest</button>
            <button type="button" className="btn-quiet" onClick={() => choose(line.lineSpeedNominalMPerMin)}>Usual</button>
            <button type="button" className="btn-quiet" onClick={() => choose(hi)}>Fastest</button>
          </div>
        </div>
        {speedError && <p id="line-speed-err" className="field-error">{speedError}</p>}
        {timeline ? <LineTimelineChart timeline={timeline} unitSystem={sys} /> : <p className="text-oxide">The timeline cannot be drawn for this speed.</p>}
        <table className="w-full text-left text-sm">
          <thead>
            <tr className="border-b border-plate-line">
              <th scope="col" className="py-1 pr-3 font-medium">#</th>
              <th scope="col" className="py-1 pr-3 font-medium">Stage</th>
              <th scope="col" className="py-1 pr-3 font-medium">Kind</th>
              <th scope="col" className="py-1 pr-3 font-medium">Conveyor length</th>
              <th scope="col" className="py-1 pr-3 font-medium">Air / bath</th>
              <th scope="col" className="py-1 pr-3 font-medium">Dwell</th>
              <th scope="col" className="py-1 font-medium">From – to</th>
            </tr>
          </thead>
          <tbody>
            {line.stages.map((s, i) => {
              const t = timeline?.stages[i];
              return (
                <tr key={s.position} className="border-b border-plate-line/60">
                  <td className="num py-1 pr-3">{i + 1}</td>
                  <td className="py-1 pr-3">{s.name}</td>
                  <td className="py-1 pr-3">
                    {STAGE_KIND_LABELS[s.kind]}
                    {s.kind === "powder-booth" && s.colourChangeMin != null && <span className="text-xs text-ink-soft"> · colour change {formatSignificant(s.colourChangeMin, 3)} min</span>}
                  </td>
                  <td className="num py-1 pr-3">{show("lengthM", s.lengthM, sys)}</td>
                  <td className="num py-1 pr-3">
                    {s.tempC != null ? show("temperatureC", s.tempC, sys, 4) : "—"}
                    {s.heatTransferCoefficientWPerM2K != null && <span className="text-xs text-ink-soft"> · h {show("heatTransferWPerM2K", s.heatTransferCoefficientWPerM2K, sys)}</span>}
                  </td>
                  <td className="num py-1 pr-3">{t ? `${formatSignificant(t.dwellMin, 3)} min` : "—"}</td>
                  <td className="num py-1">{t ? `${formatSignificant(t.startMin, 3)} – ${formatSignificant(t.endMin, 3)} min` : "—"}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </section>

      <CureCheckPanel line={line} lineSpeedMPerMin={speed} unitSystem={sys} />
      <SafetyNote kinds={line.stages.map((s) => s.kind)} />
    </>
  );
}

const SAFETY: Partial<Record<StageKind, string>> = {
  clean: "Cleaning and conversion tanks hold hot alkaline or acid chemicals: wear the PPE the SDS calls for and keep eyewash stations clear.",
  "e-coat": "The e-coat tank runs on high-voltage DC: lock out and verify before anyone reaches into or enters it.",
  "powder-booth": "Powder booths handle combustible dust: keep parts and guns grounded, and keep the booth's fire detection and extraction working.",
  "cure-oven": "Ovens: parts and racks leave hot; keep ventilation and purge working and never enter a running oven.",
};

function SafetyNote({ kinds }: { kinds: StageKind[] }) {
  const notes = [...new Set(kinds.map((k) => (k === "conversion" ? "clean" : k === "dry-off" ? "cure-oven" : k)))].flatMap((k) => (SAFETY[k] ? [SAFETY[k]!] : []));
  if (!notes.length) return null;
  return (
    <aside className="rounded-lg border border-caution-edge bg-caution-light p-4 text-sm" aria-labelledby="safety-h">
      <h2 id="safety-h" className="text-base text-caution">Safety</h2>
      <ul className="mt-1 ml-5 list-disc space-y-0.5">
        {notes.map((n) => <li key={n}>{n}</li>)}
      </ul>
      <p className="mt-2 text-ink-soft">These are reminders, not a procedure: local codes, the plant&apos;s own procedures and licensed practice come first.</p>
    </aside>
  );
}
