"use client";
import Link from "next/link";
import { useState } from "react";
import useSWR from "swr";
import type { ProfilesList } from "@/app/api/profiles/route";
import type { ProfileSummary } from "@/lib/server/profiles";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { browserOnly } from "@/components/ui/browser-only";
import { durationText, lengthText } from "./profile-units";

// The wizard loads when someone starts an import: it stays out of the list's first load.
const ImportWizard = browserOnly(
  () => import("./import-wizard").then((m) => m.ImportWizard),
  <p role="status" className="card text-sm text-ink-soft">Loading the import wizard…</p>,
);

/** Every measured profile with its verdicts at a glance, and the import wizard. */
export function ProfilesView({ unitSystem: sys, canImport }: { unitSystem: UnitSystem; canImport: boolean }) {
  const { data, error, isLoading } = useSWR<ProfilesList>("/api/profiles");
  const [importing, setImporting] = useState(false);
  return (
    <div className="space-y-4">
      {canImport && !importing && (
        <button type="button" className="btn-primary" onClick={() => setImporting(true)}>Import a profile</button>
      )}
      {importing && <ImportWizard unitSystem={sys} onClose={() => setImporting(false)} />}
      <section className="card" aria-labelledby="profiles-h">
        <h2 id="profiles-h">Measured profiles</h2>
        {isLoading ? (
          <p role="status" className="mt-2 text-sm">Loading the profiles…</p>
        ) : error ? (
          <p role="alert" className="mt-2 text-oxide">Could not load the profiles: {error.message}</p>
        ) : !data?.profiles.length ? (
          <p className="mt-2 text-sm text-ink-soft">No profiles yet.{canImport ? " Import a data logger's file with Import a profile." : " A supervisor or engineer imports them."}</p>
        ) : (
          <table className="mt-2 w-full text-left text-sm" data-testid="profiles-table">
            <thead>
              <tr className="border-b border-plate-line">
                <th scope="col" className="py-1 pr-3 font-medium">Profile</th>
                <th scope="col" className="py-1 pr-3 font-medium">Oven</th>
                <th scope="col" className="py-1 pr-3 font-medium">Coating</th>
                <th scope="col" className="py-1 pr-3 font-medium">Probes</th>
                <th scope="col" className="py-1 pr-3 font-medium">Logged</th>
                <th scope="col" className="py-1 font-medium">Logger</th>
              </tr>
            </thead>
            <tbody>
              {data.profiles.map((p) => (
                <ProfileRow key={p.id} p={p} sys={sys} />
              ))}
            </tbody>
          </table>
        )}
      </section>
    </div>
  );
}

function ProfileRow({ p, sys }: { p: ProfileSummary; sys: UnitSystem }) {
  return (
    <tr className="border-b border-plate-line/60 align-top">
      <td className="py-1.5 pr-3">
        <Link className="text-phosphate-dark underline-offset-2 hover:underline" href={`/profiles/${p.id}`}>{p.name}</Link>
        {p.runId && <span className="block text-xs text-ink-soft">run {p.runId}</span>}
      </td>
      <td className="py-1.5 pr-3">{p.lineName} → {p.stageName}</td>
      <td className="py-1.5 pr-3">{p.coatingCode}</td>
      <td className="py-1.5 pr-3">
        <ul className="space-y-0.5">
          {p.probes.map((q) => (
            <li key={q.label} className="flex flex-wrap items-center gap-1">
              <span className={`rounded px-1.5 text-xs font-semibold text-white ${q.pass ? "bg-pass" : q.pass === null ? "bg-ink-faint" : "bg-oxide"}`}>
                {q.pass ? "Cured" : q.pass === null ? "No verdict" : q.overbaked && !q.underCured ? "Over-baked" : "Under-cured"}
              </span>
              <span>{q.label} ({lengthText(q.thicknessMm, sys)})</span>
              {q.cureIndex !== null && <span className="num text-ink-soft">{Math.round(q.cureIndex * 100)} %</span>}
            </li>
          ))}
        </ul>
      </td>
      <td className="num py-1.5 pr-3">
        {p.measuredOn ?? "—"}
        <span className="block text-xs text-ink-soft">{p.sampleCount} readings, {durationText(p.durationS)}</span>
      </td>
      <td className="py-1.5">{p.loggerName ?? "—"}</td>
    </tr>
  );
}
