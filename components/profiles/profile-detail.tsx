"use client";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";
import { flushSync } from "react-dom";
import useSWR from "swr";
import { FetchError, sendJson } from "@/lib/fetcher";
import type { CoatingsList } from "@/app/api/coatings/route";
import type { ProfileResponse } from "@/app/api/profiles/[id]/route";
import type { ProbeResult, ProfileDetail } from "@/lib/server/profiles";
import { verdictReasons } from "@/lib/profiles/verdict";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { deltaText, durationText, hText, lengthText, minutesText, PROBE_COLOURS, profileFormat, tempText } from "./profile-units";
import { browserOnly } from "@/components/ui/browser-only";

// Recharts stays out of the first load: the chart arrives after the verdicts.
const ProfileChart = browserOnly(
  () => import("./profile-chart").then((m) => m.ProfileChart),
  <p role="status" className="h-[380px] text-sm text-ink-soft">Loading the chart…</p>,
);

// The calibration tool sits below the verdicts; its code loads on its own, after the page's.
const Calibration = browserOnly(
  () => import("./oven-calibration").then((m) => m.Calibration),
  <p role="status" className="card text-sm text-ink-soft">Loading the oven calibration…</p>,
);

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
