"use client";
// A run's film checks: the SSPC-PA 2 sampling plan, entering a coat's DFT readings, the verdict
// with every reason, the histogram against the spec band, editing and deleting a check, the other
// tests (cure, adhesion, appearance, coverage) and the change log in words.

import Link from "next/link";
import { useState } from "react";
import useSWR from "swr";
import { FetchError, sendJson } from "@/lib/fetcher";
import { fromDisplay, toDisplay, type UnitSystem } from "@/lib/coating-math/display-units";
import { flattenReadings, groupReadings } from "@/lib/film-checks/readings";
import type { FilmCheckView, GaugeView, RunFilmChecks } from "@/lib/server/film-checks";
import { FilmHistogram } from "./film-histogram";
import { ReadingEntry } from "./reading-entry";
import { FilmTestsPanel } from "./film-tests-panel";
import { ChangeLogList, when } from "./change-log-list";
import { CheckEditor } from "./check-editor";
import { SamplingPanel } from "./sampling-panel";

interface Props {
  runId: number;
  unitSystem: UnitSystem;
  canWrite: boolean;
  isAdmin: boolean;
  /** whether the gauges page is open to this role (link shown) */
  canSeeGauges: boolean;
}

export function FilmChecksView({ runId, unitSystem: sys, canWrite, isAdmin, canSeeGauges }: Props) {
  const url = `/api/runs/${runId}/film-checks`;
  const { data, error, isLoading, mutate } = useSWR<RunFilmChecks, FetchError>(url);
  const gauges = useSWR<{ gauges: GaugeView[] }, FetchError>("/api/gauges");
  const fmt = (um: number) => {
    const d = toDisplay("filmUm", um, sys);
    return `${Number(d.value.toFixed(sys === "us" ? 2 : 1))} ${d.unit}`;
  };
  const unit = toDisplay("filmUm", 1, sys).unit;

  const [coatIndex, setCoatIndex] = useState(0);
  const [rule, setRule] = useState<"sspc-pa2" | "iso19840">("sspc-pa2");
  const [gaugeId, setGaugeId] = useState<number | null>(null);
  const [perSpot, setPerSpot] = useState(3);
  const [perArea, setPerArea] = useState(5);
  const [specMin, setSpecMin] = useState("");
  const [specMax, setSpecMax] = useState("");
  const [readingsUm, setReadingsUm] = useState<number[]>([]);
  const [saving, setSaving] = useState(false);
  const [saveError, setSaveError] = useState<{ message: string; fields: Record<string, string> } | null>(null);
  const [asking, setAsking] = useState<number | null>(null);
  const [editing, setEditing] = useState<number | null>(null);
  const [notice, setNotice] = useState<string | null>(null);

  if (isLoading) return <p role="status" className="text-ink-faint">Loading film checks…</p>;
  if (error || !data) {
    return (
      <div role="alert" className="card space-y-2 text-oxide">
        <p>{error?.status === 404 ? "There is no such run." : (error?.message ?? "Could not load the film checks.")}</p>
        {error?.status !== 404 && <button type="button" className="btn-quiet" onClick={() => void mutate()}>Try again</button>}
      </div>
    );
  }

  const { run, coats, checks, tests, log, sampling } = data;
  const writable = canWrite && !run.locked;
  const coat = coats.find((c) => c.coatIndex === coatIndex) ?? coats[0];
  const allGauges = gauges.data?.gauges ?? [];
  // Retired gauges stay on old records but are not offered for new readings.
  const inUse = allGauges.filter((g) => g.retiredOn === null);
  const gauge = inUse.find((g) => g.id === gaugeId) ?? null;
  const lockReason = run.lockReason ?? "";

  async function save() {
    setSaving(true);
    setSaveError(null);
    const toUm = (t: string) => (t.trim() === "" ? null : fromDisplay("filmUm", Number(t), sys));
    const common = { coatIndex: coat.coatIndex, gaugeId: gauge?.id ?? null, specMinUm: toUm(specMin), specMaxUm: toUm(specMax) };
    const body =
      rule === "sspc-pa2"
        ? { rule, ...common, areas: groupReadings(readingsUm, perSpot, perArea) }
        : { rule, ...common, readingsUm };
    try {
      await sendJson(url, "POST", body);
      setReadingsUm([]);
      await mutate();
    } catch (e) {
      const f = e instanceof FetchError ? e : null;
      setSaveError({ message: f?.message ?? "Could not save.", fields: f?.fields ?? {} });
    } finally {
      setSaving(false);
    }
  }

  async function remove(id: number) {
    try {
      await sendJson(`/api/film-checks/${id}`, "DELETE");
      setAsking(null);
      setNotice("The film check was deleted; the deletion is in the change log.");
      await mutate();
    } catch (e) {
      setSaveError({ message: e instanceof Error ? e.message : "Could not delete.", fields: {} });
    }
  }

  return (
    <div className="space-y-6">
      <header>
        <h1 className="text-2xl font-semibold">Film checks — run {run.id}</h1>
        <p className="text-ink-soft">
          {run.partNumber} {run.partName} · {run.lineName} · {run.date} ·{" "}
          <Link className="text-phosphate-dark underline" href={`/runs/${run.id}`}>back to the run</Link>
        </p>
        {run.status === "done" && (
          <p id="fc-lock-reason" className="mt-2 rounded border border-caution-edge bg-caution-light p-2 text-sm">
            This run is done: its film records are kept{isAdmin ? "; as admin you may still correct them, and every change is logged." : " and only an admin may change them, so editing is off."}
          </p>
        )}
        {!canWrite && (
          <p className="mt-2 text-sm text-ink-soft">Read only: operators, supervisors and admins record and edit film checks.</p>
        )}
        {canSeeGauges && (
          <p className="mt-1 text-sm">
            <Link className="text-phosphate-dark underline" href="/quality/gauges">Gauges and their verification</Link>
          </p>
        )}
      </header>

      <SamplingPanel sampling={sampling} coats={coats} unitSystem={sys} />

      {canWrite && run.locked && (
        <p role="status" className="card text-sm text-ink-soft" data-testid="film-locked">{lockReason}</p>
      )}

      {writable && coats.length > 0 && (
        <section className="card space-y-4" aria-labelledby="new-check">
          <h2 id="new-check" className="text-lg font-semibold">Enter readings</h2>
          <div className="flex flex-wrap gap-4">
            <div>
              <label htmlFor="fc-coat" className="label">Coat</label>
              <select id="fc-coat" className="field" value={coat.coatIndex} onChange={(e) => setCoatIndex(Number(e.target.value))}>
                {coats.map((c) => (
                  <option key={c.coatIndex} value={c.coatIndex}>{`${c.coatIndex + 1}: ${c.coatingCode} ${c.coatingName} (${fmt(c.specMinUm)}–${fmt(c.specMaxUm)})`}</option>
                ))}
              </select>
            </div>
            <div>
              <label htmlFor="fc-rule" className="label">Acceptance rule</label>
              <select id="fc-rule" className="field" value={rule} onChange={(e) => setRule(e.target.value as "sspc-pa2" | "iso19840")}>
                <option value="sspc-pa2">SSPC-PA 2 (spots and areas)</option>
                <option value="iso19840">ISO 19840 (80–20 rule)</option>
              </select>
            </div>
            <div>
              <label htmlFor="fc-gauge" className="label">Gauge</label>
              <select
                id="fc-gauge"
                className="field"
                value={gauge?.id ?? ""}
                aria-describedby={gauge && gauge.verification !== "current" ? "fc-gauge-warn" : undefined}
                onChange={(e) => setGaugeId(e.target.value ? Number(e.target.value) : null)}
              >
                <option value="">Not recorded</option>
                {inUse.map((g) => (
                  <option key={g.id} value={g.id}>
                    {`${g.name} (${g.gaugeType === "type1" ? "type 1" : "type 2"}${g.verifiedOn ? `, verified ${g.verifiedOn}` : ""}${g.verification === "overdue" ? ", verification overdue" : g.verification === "never" ? ", never verified" : ""})`}
                  </option>
                ))}
              </select>
              {gauges.error && <p className="field-error">Could not load the gauges; readings can still be saved without one.</p>}
              {gauge && gauge.verification !== "current" && (
                <p id="fc-gauge-warn" className="mt-1 max-w-xs text-xs text-caution">
                  {gauge.verification === "overdue"
                    ? `Verification was due ${gauge.verificationDueOn}: check ${gauge.name} on reference standards as your plant's procedure says before relying on it.`
                    : `No verification is recorded for ${gauge.name}.`}
                </p>
              )}
            </div>
            {rule === "sspc-pa2" && (
              <>
                <div>
                  <label htmlFor="fc-per-spot" className="label">Readings a spot</label>
                  <input id="fc-per-spot" className="field w-20 num" type="number" min={3} max={10} value={perSpot} onChange={(e) => setPerSpot(Math.max(1, Number(e.target.value) || 3))} />
                </div>
                <div>
                  <label htmlFor="fc-per-area" className="label">Spots an area</label>
                  <input id="fc-per-area" className="field w-20 num" type="number" min={1} max={10} value={perArea} onChange={(e) => setPerArea(Math.max(1, Number(e.target.value) || 5))} />
                </div>
              </>
            )}
            <div>
              <label htmlFor="fc-min" className="label">{`Spec min (${unit}, blank: coating's)`}</label>
              <input id="fc-min" className="field w-28 num" inputMode="decimal" value={specMin} placeholder={String(Number(toDisplay("filmUm", coat.specMinUm, sys).value.toFixed(2)))} onChange={(e) => setSpecMin(e.target.value)} />
            </div>
            <div>
              <label htmlFor="fc-max" className="label">{`Spec max (${unit})`}</label>
              <input id="fc-max" className="field w-28 num" inputMode="decimal" value={specMax} placeholder={String(Number(toDisplay("filmUm", coat.specMaxUm, sys).value.toFixed(2)))} onChange={(e) => setSpecMax(e.target.value)} />
            </div>
          </div>
          <ReadingEntry
            key={`${coat.coatIndex}-${gaugeId ?? "none"}`}
            unitSystem={sys}
            readingsUm={readingsUm}
            onChange={setReadingsUm}
            readingsPerSpot={rule === "sspc-pa2" ? perSpot : 1_000_000}
            spotsPerArea={perArea}
            gauge={gauge}
            onGaugeSaved={() => void gauges.mutate()}
          />
          {saveError && (
            <div role="alert" className="text-sm text-oxide">
              <p>{saveError.message}</p>
              {Object.keys(saveError.fields).length > 1 && (
                <ul className="list-disc pl-5">{Object.entries(saveError.fields).map(([k, v]) => <li key={k}>{`${k}: ${v}`}</li>)}</ul>
              )}
            </div>
          )}
          <div className="flex gap-2">
            <button type="button" className="btn-primary" disabled={saving || readingsUm.length === 0} onClick={() => void save()}>
              {saving ? "Saving…" : "Save and judge"}
            </button>
            <button type="button" className="btn-quiet" disabled={readingsUm.length === 0} onClick={() => setReadingsUm([])}>Clear</button>
          </div>
        </section>
      )}

      <section aria-labelledby="checks-h" className="space-y-3">
        <h2 id="checks-h" className="text-lg font-semibold">Film checks</h2>
        {notice && <p role="status" className="text-sm text-pass">{notice}</p>}
        {checks.length === 0 && <p className="text-ink-faint">No readings recorded for this run yet.</p>}
        {checks.map((c: FilmCheckView) => {
          const cs = coats.find((x) => x.coatIndex === c.coatIndex);
          const flat = flattenReadings(c.areas ?? c.readingsUm ?? []);
          const history = log.filter((l) => l.entity === "film_check" && l.entityId === c.id);
          return (
            <article key={c.id} className="card space-y-2" data-testid="film-check">
              <div className="flex flex-wrap items-center gap-3">
                <h3 className="font-semibold">{`Coat ${c.coatIndex + 1}: ${cs?.coatingCode ?? ""} — ${c.rule === "sspc-pa2" ? "SSPC-PA 2" : "ISO 19840"}`}</h3>
                <span className={`rounded px-2 py-0.5 text-sm font-semibold ${c.pass ? "bg-pass-light text-pass" : "bg-oxide-light text-oxide"}`}>{c.pass ? "Pass" : "Fail"}</span>
              </div>
              <p className="text-sm text-ink-soft">
                {`${c.readingCount} readings, mean ${c.meanUm === null ? "—" : fmt(c.meanUm)}; spec ${fmt(c.specMinUm)}–${fmt(c.specMaxUm)}${c.specMinOverrideUm !== null || c.specMaxOverrideUm !== null ? " (set on this check)" : ""}; gauge ${c.gaugeName ?? "not recorded"}; by ${c.createdBy ?? "—"}, ${when(c.createdAt)}${c.updatedAt > c.createdAt ? `; last edited ${when(c.updatedAt)}` : ""}`}
              </p>
              {c.reasons.length > 0 && (
                <ul className="list-disc pl-5 text-sm text-oxide" aria-label="Why it fails">{c.reasons.map((r) => <li key={r}>{r}</li>)}</ul>
              )}
              {c.warnings.length > 0 && <ul className="list-disc pl-5 text-sm text-caution">{c.warnings.map((r) => <li key={r}>{r}</li>)}</ul>}
              {c.notes && <p className="text-sm">{`Notes: ${c.notes}`}</p>}
              {editing === c.id ? (
                <CheckEditor
                  check={c}
                  coats={coats}
                  gauges={allGauges}
                  unitSystem={sys}
                  onCancel={() => setEditing(null)}
                  onSaved={() => {
                    setEditing(null);
                    setNotice("Changes saved and logged.");
                    void mutate();
                  }}
                />
              ) : (
                <FilmHistogram valuesUm={flat} specMinUm={c.specMinUm} specMaxUm={c.specMaxUm} unitSystem={sys} title={`Readings of coat ${c.coatIndex + 1}`} />
              )}
              {writable && editing !== c.id && (
                asking === c.id ? (
                  <div className="flex flex-wrap items-center gap-2" role="group" aria-label="Confirm delete">
                    <span className="text-sm">Delete these readings? The deletion is logged.</span>
                    <button type="button" className="btn-danger" onClick={() => void remove(c.id)}>Delete</button>
                    <button type="button" className="btn-quiet" autoFocus onClick={() => setAsking(null)}>Keep</button>
                  </div>
                ) : (
                  <div className="flex gap-2">
                    <button type="button" className="btn-quiet" onClick={() => { setNotice(null); setEditing(c.id); }}>Edit readings…</button>
                    <button type="button" className="btn-quiet" onClick={() => setAsking(c.id)}>Delete…</button>
                  </div>
                )
              )}
              {canWrite && run.locked && (
                <div className="flex items-center gap-2">
                  <button type="button" className="btn-quiet" disabled aria-describedby={`lock-${c.id}`}>Edit readings…</button>
                  <span id={`lock-${c.id}`} className="text-sm text-ink-soft">{lockReason}</span>
                </div>
              )}
              <details className="text-sm">
                <summary className="cursor-pointer text-ink-soft">{`History of this check (${history.length})`}</summary>
                <div className="mt-1">
                  <ChangeLogList entries={history} empty="No changes logged for this check." />
                </div>
              </details>
            </article>
          );
        })}
      </section>

      <FilmTestsPanel runId={runId} tests={tests} writable={writable} onSaved={() => void mutate()} />

      <section aria-labelledby="log-h">
        <details className="card">
          <summary id="log-h" className="cursor-pointer font-semibold">{`Change log of the run (${log.length})`}</summary>
          <p className="mt-1 text-xs text-ink-faint">Every recording, edit and deletion of this run&apos;s film checks and tests, newest first; film values in your units.</p>
          <div className="mt-2">
            <ChangeLogList entries={log} empty="Nothing recorded yet." />
          </div>
        </details>
      </section>
    </div>
  );
}
