"use client";
import Link from "next/link";
import { useState } from "react";
import { sendJson } from "@/lib/fetcher";
import type { ApplyFitResponse } from "@/app/api/profiles/[id]/apply-fit/route";
import type { ProbeResult, ProfileDetail } from "@/lib/server/profiles";
import { formatSignificant, type UnitSystem } from "@/lib/coating-math/display-units";
import { deltaText, hText, lengthText, minutesText } from "./profile-units";

const dateTime = (s: number) => new Date(s * 1000).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" });

/** The h fitted to each part probe, storing one on the oven (with a confirmation), and the stored history. */
export function Calibration({ profile: p, unitSystem: sys, canApply, onApplied }: { profile: ProfileDetail; unitSystem: UnitSystem; canApply: boolean; onApplied: () => void }) {
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
