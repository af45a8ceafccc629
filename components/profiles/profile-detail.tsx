"use client";
import dynamic from "next/dynamic";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";
import { flushSync } from "react-dom";
import useSWR from "swr";
import { FetchError, sendJson } from "@/lib/fetcher";
import type { CoatingsList } from "@/app/api/coatings/route";
import type { ProfileResponse } from "@/app/api/profiles/[id]/route";
import type { ApplyFitResponse } from "@/app/api/profiles/[id]/apply-fit/route";
import type { ProbeResult, ProfileDetail } from "@/lib/server/profiles";
import { verdictReasons } from "@/lib/profiles/verdict";
import { formatSignificant, type UnitSystem } from "@/lib/coating-math/display-units";
import { deltaText, durationText, hText, lengthText, minutesText, PROBE_COLOURS, profileFormat, tempText } from "./profile-units";

// Recharts stays out of the first load: the chart arrives after the verdicts.
const ProfileChart = dynamic(() => import("./profile-chart").then((m) => m.ProfileChart), {
  ssr: false,
  loading: () => <p role="status" className="h-[380px] text-sm text-ink-soft">Loading the chart…</p>,
});

interface Props {
  id: number;
  unitSystem: UnitSystem;
  /** may store a fitted h on the oven */
  canApply: boolean;
  canDelete: boolean;
}

const dateTime = (s: number) => new Date(s * 1000).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" });

/** One measured profile: chart, verdict per probe, fitted heat-transfer coefficients, history. */
export function ProfileDetailView({ id, unitSystem: sys, canApply, canDelete }: Props) {
  const [judgeId, setJudgeId] = useState("");
  const key = `/api/profiles/${id}${judgeId ? `?coatingId=${judgeId}` : ""}`;
  const { data, error, isLoading, mutate } = useSWR<ProfileResponse>(key, { keepPreviousData: true });
  const { data: coatings } = useSWR<CoatingsList>("/api/coatings");
  const [printing, setPrinting] = useState(false);

  useEffect(() => {
    // the chart is drawn at a fixed width for paper before the browser lays out the printout
    const before = () => flushSync(() => setPrinting(true));
    const after = () => setPrinting(false);
    window.addEventListener("beforeprint", before);
    window.addEventListener("afterprint", after);
    return () => {
      window.removeEventListener("beforeprint", before);
      window.removeEventListener("afterprint", after);
    };
  }, []);

  if (isLoading && !data) return <p role="status">Loading the profile…</p>;
  if (error && !data) {
    return (
      <p role="alert" className="text-oxide">
        {error instanceof FetchError && error.status === 404 ? "There is no such profile." : `Could not load the profile: ${error.message}`}{" "}
        <Link className="underline" href="/profiles">Back to the profiles</Link>
      </p>
    );
  }
  const p = data!.profile;
  const passCount = p.probes.filter((q) => q.verdict?.pass).length;
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-start gap-3">
        <div className="grow">
          <h1>{p.name}</h1>
          <p className="mt-1 text-sm text-ink-soft">
            {p.oven.lineName} · {p.oven.stageName} · judged against {p.coating.code} · {passCount} of {p.probes.length} probes cured
          </p>
        </div>
        <div className="no-print flex gap-2">
          <button type="button" className="btn-quiet" onClick={() => window.print()}>Print</button>
          {canDelete && <DeleteProfile profile={p} />}
        </div>
      </div>

      <section className="card print:border-0 print:p-0" aria-labelledby="facts-h">
        <h2 id="facts-h" className="sr-only">About this profile</h2>
        <dl className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-[auto_1fr_auto_1fr]">
          <dt className="text-ink-soft">Oven</dt>
          <dd>
            <Link className="text-phosphate-dark underline-offset-2 hover:underline" href={`/lines/${p.oven.lineId}`}>{p.oven.lineName}</Link> → {p.oven.stageName}
            {p.oven.current && (
              <span className="text-ink-soft">
                {" "}({p.oven.current.airTempC !== null ? `air ${tempText(p.oven.current.airTempC, sys)}, ` : ""}
                {p.oven.current.heatTransferCoefficientWPerM2K !== null ? `h ${hText(p.oven.current.heatTransferCoefficientWPerM2K, sys)}` : "no h"})
              </span>
            )}
          </dd>
          <dt className="text-ink-soft"><label htmlFor="judge-coating">Judged against</label></dt>
          <dd>
            <select id="judge-coating" className="field no-print py-0.5" value={judgeId || String(p.coatingId)} onChange={(e) => setJudgeId(e.target.value === String(p.coatingId) ? "" : e.target.value)}>
              {(coatings?.coatings ?? [{ id: p.coating.id, code: p.coating.code, name: p.coating.name }]).map((c) => (
                <option key={c.id} value={c.id}>
                  {c.code} · {c.name}{c.id === p.coatingId ? " (chosen at import)" : ""}
                </option>
              ))}
            </select>
            <span className="hidden print:inline">{p.coating.code} · {p.coating.name}</span>
          </dd>
          <dt className="text-ink-soft">Cure schedule</dt>
          <dd className="num">{p.coating.cureSchedule.map((c) => `${minutesText(c.holdMin)} at ${tempText(c.metalTempC, sys)}`).join(" · ")}</dd>
          <dt className="text-ink-soft">Over-bake limit</dt>
          <dd className="num">
            {p.overbakeLimitC === null ? "—" : `${tempText(p.overbakeLimitC, sys)} (highest schedule point + ${deltaText(p.overbakeMarginK, sys)} margin)`}
          </dd>
          <dt className="text-ink-soft">Readings</dt>
          <dd className="num">{p.sampleCount} over {durationText(p.durationS)}</dd>
          <dt className="text-ink-soft">Logger</dt>
          <dd>{p.logger?.name ?? "—"}{p.fileName && <span className="text-ink-soft"> · {p.fileName}</span>}</dd>
          <dt className="text-ink-soft">Logged on</dt>
          <dd>{p.measuredOn ?? "—"}{p.runId && <span className="text-ink-soft"> · run {p.runId}</span>}</dd>
          <dt className="text-ink-soft">Imported</dt>
          <dd>{dateTime(p.createdAt)}{p.createdBy && ` by ${p.createdBy}`}</dd>
        </dl>
        {p.notes && <p className="mt-2 text-sm">{p.notes}</p>}
        {!p.oven.current && (
          <p className="mt-2 rounded bg-caution-light px-2 py-1 text-sm text-caution">
            The stage list of {p.oven.lineName} has changed since this profile was measured: {p.oven.stageName} is no longer at its place, so a fitted h cannot be stored from here.
          </p>
        )}
      </section>

      <figure className="card print:break-inside-avoid" aria-labelledby="chart-h">
        <h2 id="chart-h">Metal and air temperature</h2>
        <div className="mt-2" role="img" aria-label={`Temperature against time for the air and ${p.probes.length} part probes; the cure window is shaded and each fitted model is dashed.`}>
          <ProfileChart
            timeS={p.chart.timeS}
            airC={p.chart.airC}
            probes={p.probes.map((q, k) => ({ label: q.label, tempsC: p.chart.probes[k].tempsC, modelC: p.chart.probes[k].modelC }))}
            cureWindowC={[Math.min(...p.coating.cureSchedule.map((c) => c.metalTempC)), Math.max(...p.coating.cureSchedule.map((c) => c.metalTempC))]}
            overbakeLimitC={p.overbakeLimitC}
            unitSystem={sys}
            widthPx={printing ? 680 : undefined}
          />
        </div>
        <figcaption className="mt-1 text-xs text-ink-soft">
          Shaded: {p.coating.code}&apos;s cure window, {tempText(Math.min(...p.coating.cureSchedule.map((c) => c.metalTempC)), sys)} to{" "}
          {tempText(Math.max(...p.coating.cureSchedule.map((c) => c.metalTempC)), sys)} metal temperature. Dashed: the lumped heat-up model run with each probe&apos;s fitted h over the measured air.
        </figcaption>
      </figure>

      <section className="space-y-3" aria-labelledby="verdicts-h">
        <h2 id="verdicts-h">Cure verdict per probe</h2>
        <div className="grid gap-4 lg:grid-cols-2">
          {p.probes.map((q) => (
            <ProbeVerdictCard key={q.index} probe={q} profile={p} unitSystem={sys} />
          ))}
        </div>
        <p className="text-xs text-ink-soft">
          Cure index = Σ Δt / t<sub>required</sub>(T) over the time the metal is at or above the schedule&apos;s lowest temperature, with t<sub>required</sub> read
          straight between the schedule&apos;s points; 100 % or more is cured. Above the highest point the highest point&apos;s time is used: common practice,
          no single source. The coating maker&apos;s data sheet and your own cure tests (solvent rub, adhesion) decide in the end.
        </p>
      </section>

      <Calibration profile={p} unitSystem={sys} canApply={canApply} onApplied={() => mutate()} />

      <aside className="rounded-lg border border-caution-edge bg-caution-light p-4 text-sm print:break-inside-avoid" aria-labelledby="safety-h">
        <h2 id="safety-h" className="text-base text-caution">Safety</h2>
        <p className="mt-1">
          The logger&apos;s thermal barrier, the probes and the parts leave the oven hot: let them cool or handle them with heat-resistant gloves, and
          never reach into a running oven or onto a moving conveyor to place or retrieve a logger.
        </p>
        <p className="mt-1 text-ink-soft">These are reminders, not a procedure: local codes, the plant&apos;s own procedures and licensed practice come first.</p>
      </aside>
    </div>
  );
}

function badge(q: ProbeResult): { text: string; className: string } {
  if (!q.verdict) return { text: "No verdict", className: "bg-ink-faint" };
  if (q.verdict.overbaked && q.verdict.underCured) return { text: "Under-cured and over-baked", className: "bg-oxide" };
  if (q.verdict.overbaked) return { text: "Over-baked", className: "bg-oxide" };
  if (q.verdict.underCured) return { text: "Under-cured", className: "bg-oxide" };
  return { text: "Cured", className: "bg-pass" };
}

function ProbeVerdictCard({ probe: q, profile: p, unitSystem: sys }: { probe: ProbeResult; profile: ProfileDetail; unitSystem: UnitSystem }) {
  const v = q.verdict;
  const b = badge(q);
  const reasons = v ? verdictReasons(v, profileFormat(sys), p.overbakeMarginK) : q.reasons;
  return (
    <article
      className={`rounded-lg border p-4 print:break-inside-avoid ${v?.pass ? "border-pass/40 bg-pass-light/40" : "border-oxide/40 bg-oxide-light/40"}`}
      aria-labelledby={`probe-${q.index}-h`}
      data-testid="probe-verdict"
      data-probe={q.label}
      data-pass={v?.pass ?? false}
    >
      <div className="flex flex-wrap items-center gap-2">
        <span aria-hidden className="inline-block h-3 w-3 rounded-full" style={{ backgroundColor: PROBE_COLOURS[q.index % PROBE_COLOURS.length] }} />
        <h3 id={`probe-${q.index}-h`} className="font-semibold">{q.label}</h3>
        <span className="text-sm text-ink-soft">{lengthText(q.thicknessMm, sys)} section · column {q.column}</span>
        <span className={`ml-auto rounded px-2 py-0.5 text-sm font-semibold text-white ${b.className}`}>{b.text}</span>
      </div>
      <ul className="mt-2 space-y-1 text-sm" data-testid="verdict-reasons">
        {reasons.map((r) => (
          <li key={r}>{r}</li>
        ))}
      </ul>
      {v && (
        <>
          <dl className="mt-3 grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-4">
            <div>
              <dt className="text-ink-soft">Cure index</dt>
              <dd className="num font-semibold" data-testid="cure-index">{Math.round(v.cureIndex * 100)} %</dd>
            </div>
            <div>
              <dt className="text-ink-soft">Reached {tempText(v.lowestC, sys)}</dt>
              <dd className="num">{v.reachedLowestAtMin === null ? "never" : `after ${minutesText(v.reachedLowestAtMin)}`}</dd>
            </div>
            <div>
              <dt className="text-ink-soft">Peak metal</dt>
              <dd className="num">{tempText(v.peakC, sys)} at {minutesText(v.peakAtMin)}</dd>
            </div>
            <div>
              <dt className="text-ink-soft">Above over-bake limit</dt>
              <dd className="num">{v.overbakeLimitC === null ? "—" : minutesText(v.aboveOverbakeMin)}</dd>
            </div>
          </dl>
          <table className="mt-3 w-full text-left text-sm">
            <thead>
              <tr className="border-b border-plate-line">
                <th scope="col" className="py-1 pr-3 font-medium">Schedule point</th>
                <th scope="col" className="py-1 pr-3 font-medium">Time at or above</th>
                <th scope="col" className="py-1 font-medium">This point alone</th>
              </tr>
            </thead>
            <tbody>
              {v.points.map((pt) => (
                <tr key={pt.metalTempC} className="border-b border-plate-line/60">
                  <td className="num py-1 pr-3">{minutesText(pt.holdMin)} at {tempText(pt.metalTempC, sys)}</td>
                  <td className="num py-1 pr-3">{minutesText(pt.aboveMin)}</td>
                  <td className={`py-1 ${pt.met ? "text-pass" : "text-ink-soft"}`}>{pt.met ? "met" : "not met"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </>
      )}
    </article>
  );
}

function Calibration({ profile: p, unitSystem: sys, canApply, onApplied }: { profile: ProfileDetail; unitSystem: UnitSystem; canApply: boolean; onApplied: () => void }) {
  const [confirming, setConfirming] = useState<number | null>(null);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const current = p.oven.current?.heatTransferCoefficientWPerM2K ?? null;

  async function apply(q: ProbeResult) {
    setBusy(true);
    setMessage(null);
    try {
      const res = await sendJson<ApplyFitResponse>(`/api/profiles/${p.id}/apply-fit`, "POST", { probeIndex: q.index });
      setMessage({ ok: true, text: `Stored: ${res.fit.probeLabel}'s ${hText(res.fit.afterWPerM2K, sys)} is now the heat-transfer coefficient of ${p.oven.stageName}. Cure checks and throughput for ${p.oven.lineName} use it from now on.` });
      setConfirming(null);
      onApplied();
    } catch (e) {
      setMessage({ ok: false, text: e instanceof Error ? e.message : "Nothing was stored." });
    } finally {
      setBusy(false);
    }
  }

  return (
    <section className="card space-y-3 print:break-inside-avoid" aria-labelledby="fit-h">
      <div>
        <h2 id="fit-h">Calibrate the oven</h2>
        <p className="text-sm text-ink-soft">
          The heat-transfer coefficient h that makes the lumped heat-up model follow each part probe, given the air probe: least squares on ρ c L<sub>c</sub> dT/dt = h (T<sub>air</sub> − T)
          with L<sub>c</sub> = thickness/2, steel ρ {p.assumptions.densityKgPerM3} kg/m³ and c {p.assumptions.specificHeatJPerKgK} J/(kg·K) as the cure check assumes, over the readings where the air leads
          the metal by more than {deltaText(p.assumptions.minDeltaK, sys)}. {p.oven.stageName} now uses {current === null ? "no h" : hText(current, sys)}.
        </p>
      </div>
      <table className="w-full text-left text-sm" data-testid="fits">
        <thead>
          <tr className="border-b border-plate-line">
            <th scope="col" className="py-1 pr-3 font-medium">Probe</th>
            <th scope="col" className="py-1 pr-3 font-medium">Fitted h</th>
            <th scope="col" className="py-1 pr-3 font-medium">Model vs. measured (RMS)</th>
            <th scope="col" className="py-1 pr-3 font-medium">Readings used</th>
            <th scope="col" className="py-1 pr-3 font-medium">Time constant</th>
            <th scope="col" className="no-print py-1 font-medium"><span className="sr-only">Action</span></th>
          </tr>
        </thead>
        <tbody>
          {p.probes.map((q) => (
            <tr key={q.index} className="border-b border-plate-line/60 align-top" data-probe={q.label}>
              <th scope="row" className="py-1.5 pr-3 font-normal">{q.label} <span className="text-ink-soft">({lengthText(q.thicknessMm, sys)})</span></th>
              {q.fit ? (
                <>
                  <td className="num py-1.5 pr-3 font-semibold" data-testid="fitted-h">{hText(q.fit.heatTransferCoefficientWPerM2K, sys)}</td>
                  <td className="num py-1.5 pr-3">{deltaText(q.fit.rmsK, sys)}</td>
                  <td className="num py-1.5 pr-3">{q.fit.samplesUsed}</td>
                  <td className="num py-1.5 pr-3">
                    {minutesText(q.fit.timeConstantMin)} <span className="text-ink-soft">· Bi {formatSignificant(q.fit.biotNumber, 2)}</span>
                    {q.fit.warnings.map((w) => <p key={w} className="text-caution">{w}</p>)}
                  </td>
                  <td className="no-print py-1.5">
                    {canApply && p.oven.current && (
                      confirming === q.index ? (
                        <div className="space-y-1 rounded border border-caution-edge bg-caution-light p-2" role="group" aria-label={`Confirm storing ${q.label}'s h`}>
                          <p>
                            Store {hText(q.fit.heatTransferCoefficientWPerM2K, sys)} on {p.oven.stageName} of {p.oven.lineName}
                            {current !== null ? ` in place of ${hText(current, sys)}` : ""}? Every cure check and throughput figure for the line will use it.
                          </p>
                          <div className="flex gap-2">
                            <button type="button" className="btn-primary" disabled={busy} onClick={() => apply(q)}>Yes, store it</button>
                            <button type="button" className="btn-quiet" onClick={() => setConfirming(null)}>Cancel</button>
                          </div>
                        </div>
                      ) : (
                        <button type="button" className="btn-quiet" onClick={() => setConfirming(q.index)}>Use this h for {p.oven.stageName}</button>
                      )
                    )}
                  </td>
                </>
              ) : (
                <td colSpan={5} className="py-1.5 text-ink-soft">No fit: {q.fitError}</td>
              )}
            </tr>
          ))}
        </tbody>
      </table>
      {message && (
        <p role={message.ok ? "status" : "alert"} className={`text-sm ${message.ok ? "text-pass" : "text-oxide"}`} data-testid="apply-message">{message.text}</p>
      )}
      <div>
        <h3 className="text-sm font-semibold">Coefficients stored on {p.oven.stageName}</h3>
        {p.fitHistory.length === 0 ? (
          <p className="text-sm text-ink-soft">None yet: the oven still uses the value it was set up with.</p>
        ) : (
          <table className="mt-1 w-full text-left text-sm" data-testid="fit-history">
            <thead>
              <tr className="border-b border-plate-line">
                <th scope="col" className="py-1 pr-3 font-medium">When</th>
                <th scope="col" className="py-1 pr-3 font-medium">h before → after</th>
                <th scope="col" className="py-1 pr-3 font-medium">From</th>
                <th scope="col" className="py-1 font-medium">By</th>
              </tr>
            </thead>
            <tbody>
              {p.fitHistory.map((f) => (
                <tr key={f.id} className="border-b border-plate-line/60">
                  <td className="py-1 pr-3">{dateTime(f.appliedAt)}</td>
                  <td className="num py-1 pr-3">{f.beforeWPerM2K === null ? "—" : hText(f.beforeWPerM2K, sys)} → {hText(f.afterWPerM2K, sys)}</td>
                  <td className="py-1 pr-3">
                    {f.profileId === null ? f.profileName : f.profileId === p.id ? "this profile" : <Link className="text-phosphate-dark underline-offset-2 hover:underline" href={`/profiles/${f.profileId}`}>{f.profileName}</Link>}
                    , {f.probeLabel} ({lengthText(f.thicknessMm, sys)}), RMS {deltaText(f.rmsK, sys)}
                  </td>
                  <td className="py-1">{f.appliedBy ?? "—"}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </div>
    </section>
  );
}

function DeleteProfile({ profile }: { profile: ProfileDetail }) {
  const router = useRouter();
  const [confirming, setConfirming] = useState(false);
  const [error, setError] = useState<string | null>(null);
  if (!confirming) return <button type="button" className="btn-quiet" onClick={() => setConfirming(true)}>Delete…</button>;
  return (
    <div className="flex flex-wrap items-center gap-2 rounded border border-oxide/40 bg-oxide-light/50 p-2 text-sm" role="group" aria-label="Confirm deleting the profile">
      <span>Delete this profile? Coefficients already stored from it stay on the oven.</span>
      <button
        type="button"
        className="btn-danger"
        onClick={async () => {
          try {
            await sendJson(`/api/profiles/${profile.id}`, "DELETE");
            router.push("/profiles");
          } catch (e) {
            setError(e instanceof Error ? e.message : "Not deleted.");
          }
        }}
      >
        Yes, delete it
      </button>
      <button type="button" className="btn-quiet" onClick={() => setConfirming(false)}>Keep it</button>
      {error && <p role="alert" className="field-error">{error}</p>}
    </div>
  );
}
