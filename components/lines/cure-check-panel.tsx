"use client";
import { useId, useState } from "react";
import useSWR from "swr";
import { FetchError, sendJson } from "@/lib/fetcher";
import type { CoatingsList } from "@/app/api/coatings/route";
import type { CureCheckResponse } from "@/app/api/lines/[id]/cure-check/route";
import type { CureCheckView, LineView } from "@/lib/server/lines";
import { APPLYING_STAGE } from "@/lib/lines/stages";
import { formatSignificant, type UnitSystem } from "@/lib/coating-math/display-units";
import { TextField } from "@/components/ui/text-field";
import { draft, parse, show, unitOf } from "./unit-draft";

interface Props {
  line: LineView;
  /** the speed chosen on the line page (conveyor lines) */
  lineSpeedMPerMin?: number;
  unitSystem: UnitSystem;
}

const minutes = (v: number) => `${formatSignificant(v, 3)} min`;
const signedMinutes = (v: number) => `${v >= 0 ? "+" : "−"}${formatSignificant(Math.abs(v), 3)} min`;

/** Pick a coating, enter a section thickness: does it cure on this line at this speed? */
export function CureCheckPanel({ line, lineSpeedMPerMin, unitSystem: sys }: Props) {
  const ids = useId();
  const { data: coatings, error: coatingsError } = useSWR<CoatingsList>("/api/coatings");
  const usable = (coatings?.coatings ?? []).filter(
    (c) => line.kind === "batch" || line.stages.some((s) => s.kind === APPLYING_STAGE[c.kind]),
  );
  const [coatingId, setCoatingId] = useState<string>("");
  const [thickness, setThickness] = useState("");
  const [start, setStart] = useState(draft("temperatureC", 20, sys));
  const [fields, setFields] = useState<Record<string, string>>({});
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [result, setResult] = useState<CureCheckView | null>(null);
  const [history, setHistory] = useState<CureCheckView[]>([]);
  const chosen = coatingId || (usable[0] ? String(usable[0].id) : "");

  async function run(e: React.FormEvent) {
    e.preventDefault();
    const thicknessMm = parse("lengthMm", thickness, sys);
    const startTempC = parse("temperatureC", start, sys, 20);
    const local: Record<string, string> = {};
    if (thicknessMm === undefined) local.thicknessMm = "Enter the thickest section of the part.";
    else if (Number.isNaN(thicknessMm)) local.thicknessMm = "Enter a number.";
    if (startTempC !== undefined && Number.isNaN(startTempC)) local.startTempC = "Enter a number.";
    if (!chosen) local.coatingId = "Pick a coating.";
    if (Object.keys(local).length) {
      setFields(local);
      setError(null);
      return;
    }
    setBusy(true);
    setError(null);
    try {
      const res = await sendJson<CureCheckResponse>(`/api/lines/${line.id}/cure-check`, "POST", {
        coatingId: Number(chosen),
        thicknessMm,
        ...(line.kind === "conveyor" && lineSpeedMPerMin !== undefined ? { lineSpeedMPerMin } : {}),
        ...(startTempC !== undefined ? { startTempC } : {}),
      });
      setFields({});
      setResult(res.cureCheck);
      setHistory((h) => [res.cureCheck, ...h].slice(0, 8));
    } catch (err) {
      setFields(err instanceof FetchError ? err.fields : {});
      setError(err instanceof Error ? err.message : "The check failed.");
    } finally {
      setBusy(false);
    }
  }

  return (
    <section className="card space-y-4" aria-labelledby={`${ids}-h`}>
      <div>
        <h2 id={`${ids}-h`}>Cure check</h2>
        <p className="text-sm text-ink-soft">
          Metal heat-up of the part&apos;s thickest section (lumped model) plus the coating&apos;s hold, against{" "}
          {line.kind === "conveyor" ? "the oven dwell at the chosen speed" : "the batch cycle: load, heat-up, hold, unload"}. Use the
          equivalent thickness: a plate&apos;s thickness, half a round bar&apos;s diameter.
        </p>
      </div>
      <form className="grid items-end gap-3 sm:grid-cols-[2fr_1fr_1fr_auto]" noValidate onSubmit={run} aria-label="Cure check">
        <div>
          <label className="label" htmlFor={`${ids}-coating`}>Coating</label>
          <select id={`${ids}-coating`} className="field" value={chosen} onChange={(e) => setCoatingId(e.target.value)} aria-invalid={fields.coatingId ? true : undefined}>
            {!coatings && !coatingsError && <option value="">Loading coatings…</option>}
            {coatings && usable.length === 0 && <option value="">No coating can go on this line</option>}
            {usable.map((c) => (
              <option key={c.id} value={c.id}>
                {c.code} · {c.name} ({c.colourName})
              </option>
            ))}
          </select>
          {coatingsError && <p className="field-error">Could not load the coatings.</p>}
          {fields.coatingId && <p className="field-error">{fields.coatingId}</p>}
        </div>
        <TextField label={`Section thickness (${unitOf("lengthMm", sys)})`} name="thickness" inputMode="decimal" value={thickness} onChange={setThickness} error={fields.thicknessMm} />
        <TextField label={`Part start temperature (${unitOf("temperatureC", sys)})`} name="startTemp" inputMode="decimal" value={start} onChange={setStart} error={fields.startTempC} />
        <button className="btn-primary mb-0.5" disabled={busy}>Check cure</button>
      </form>
      {line.kind === "conveyor" && lineSpeedMPerMin !== undefined && (
        <p className="text-sm text-ink-soft">
          At <span className="num">{show("speedMPerMin", lineSpeedMPerMin, sys)}</span> (change the speed above).
        </p>
      )}
      {(error && !Object.keys(fields).length) || fields.lineSpeedMPerMin || fields.line ? (
        <p role="alert" className="field-error">{fields.lineSpeedMPerMin ?? fields.line ?? error}</p>
      ) : null}
      {result && <CureResult r={result} unitSystem={sys} lineSpeedMinMPerMin={line.kind === "conveyor" ? line.lineSpeedMinMPerMin : undefined} />}
      {history.length > 1 && <CheckHistory rows={history} unitSystem={sys} />}
    </section>
  );
}

/** The verdict in the user's units (the API's `reason` is in metric). */
function verdict(r: CureCheckView, sys: UnitSystem, lineSpeedMinMPerMin?: number): string {
  if (r.curePoint === null) {
    return `Does not cure: the oven air (${show("temperatureC", r.airTempC, sys, 4)}) is not above any point of the cure schedule, and metal never reaches the air temperature.`;
  }
  if (r.lineKind === "batch") return `Cures in a ${minutes(r.cycleMin ?? 0)} cycle per load.`;
  if (r.pass) return `Cures with ${minutes(r.marginMin ?? 0)} to spare at ${show("speedMPerMin", r.lineSpeedMPerMin, sys)}.`;
  const short = `Short by ${minutes(-(r.marginMin ?? 0))} at ${show("speedMPerMin", r.lineSpeedMPerMin, sys)}: `;
  return r.fastestCuringSpeedInRangeMPerMin !== null
    ? `${short}run at ${show("speedMPerMin", r.fastestCuringSpeedInRangeMPerMin, sys)} or slower.`
    : `${short}even the slowest speed${lineSpeedMinMPerMin !== undefined ? ` (${show("speedMPerMin", lineSpeedMinMPerMin, sys)})` : ""} is too fast; use the batch oven or a thinner section.`;
}

function CureResult({ r, unitSystem: sys, lineSpeedMinMPerMin }: { r: CureCheckView; unitSystem: UnitSystem; lineSpeedMinMPerMin?: number }) {
  const available = r.lineKind === "conveyor" ? r.dwellMin : null;
  const scale = Math.max(available ?? 0, r.requiredMin ?? 0, 1e-9);
  return (
    <div className={`rounded-md border p-3 ${r.pass ? "border-pass/40 bg-pass-light/50" : "border-oxide/40 bg-oxide-light/50"}`} data-testid="cure-result" data-pass={r.pass}>
      <p className="flex flex-wrap items-center gap-2">
        <span className={`rounded px-2 py-0.5 text-sm font-semibold text-white ${r.pass ? "bg-pass" : "bg-oxide"}`}>{r.pass ? "Cures" : "Does not cure"}</span>
        <span className="text-sm">
          {r.coating.code} at <span className="num">{show("lengthMm", r.thicknessMm, sys)}</span> section
          {r.lineKind === "conveyor" && (
            <>
              {" "}in {r.ovenStage.name} at <span className="num">{show("speedMPerMin", r.lineSpeedMPerMin, sys)}</span>
            </>
          )}
        </span>
      </p>
      <dl className="mt-3 grid grid-cols-2 gap-x-6 gap-y-1 text-sm sm:grid-cols-4">
        <div>
          <dt className="text-ink-soft">Metal heat-up</dt>
          <dd className="num font-medium" data-testid="heat-up">{r.heatUpMin === null ? "—" : minutes(r.heatUpMin)}</dd>
        </div>
        <div>
          <dt className="text-ink-soft">Hold</dt>
          <dd className="num font-medium">
            {r.curePoint ? `${minutes(r.curePoint.holdMin)} at ${show("temperatureC", r.curePoint.metalTempC, sys, 4)}` : "—"}
          </dd>
        </div>
        <div>
          <dt className="text-ink-soft">Needed (heat-up + hold)</dt>
          <dd className="num font-medium" data-testid="needed">{r.requiredMin === null ? "—" : minutes(r.requiredMin)}</dd>
        </div>
        {r.lineKind === "conveyor" ? (
          <>
            <div>
              <dt className="text-ink-soft">Oven dwell</dt>
              <dd className="num font-medium" data-testid="dwell">{minutes(r.dwellMin)}</dd>
            </div>
            <div>
              <dt className="text-ink-soft">Margin</dt>
              <dd className={`num font-semibold ${r.pass ? "text-pass" : "text-oxide"}`} data-testid="margin">{r.marginMin === null ? "—" : signedMinutes(r.marginMin)}</dd>
            </div>
            <div className="col-span-2">
              <dt className="text-ink-soft">Fastest speed that still cures</dt>
              <dd className="num font-medium" data-testid="fastest">
                {r.fastestCuringSpeedInRangeMPerMin !== null
                  ? show("speedMPerMin", r.fastestCuringSpeedInRangeMPerMin, sys)
                  : r.requiredMin === null
                    ? "none: the oven is too cool for this schedule"
                    : `none within the line's range (it would need ${show("speedMPerMin", r.fastestCuringSpeedMPerMin ?? 0, sys)})`}
                {r.fastestCuringSpeedMPerMin !== null && r.fastestCuringSpeedInRangeMPerMin !== null && r.fastestCuringSpeedMPerMin > r.fastestCuringSpeedInRangeMPerMin && " (the line's top speed)"}
              </dd>
            </div>
          </>
        ) : (
          <div>
            <dt className="text-ink-soft">Cycle (load + heat-up + hold + unload)</dt>
            <dd className="num font-medium" data-testid="cycle">{r.cycleMin === null ? "—" : minutes(r.cycleMin)}</dd>
          </div>
        )}
        <div className="col-span-2">
          <dt className="text-ink-soft">Oven air</dt>
          <dd className="num">
            {show("temperatureC", r.airTempC, sys, 4)} · h {show("heatTransferWPerM2K", r.heatTransferCoefficientWPerM2K, sys)}
          </dd>
        </div>
      </dl>
      {r.requiredMin !== null && available !== null && (
        <div className="mt-3 space-y-1 text-xs" aria-hidden title="Needed: heat-up (light) then hold (dark); dwell: time in the oven">
          <Bar label="Needed" parts={[[r.heatUpMin ?? 0, "#c98a6e", "heat-up"], [r.holdMin ?? 0, "#a8461f", "hold"]]} scale={scale} />
          <Bar label="Dwell" parts={[[available, "#1d6b63", "oven dwell"]]} scale={scale} />
        </div>
      )}
      <p className="mt-2 text-sm" data-testid="verdict">{verdict(r, sys, lineSpeedMinMPerMin)}</p>
      {r.warnings.map((w) => (
        <p key={w} className="mt-1 rounded bg-caution-light px-2 py-1 text-sm text-caution">{w}</p>
      ))}
      <details className="mt-2 text-sm">
        <summary className="cursor-pointer text-ink-soft">Every point of the cure schedule</summary>
        <table className="mt-1">
          <thead>
            <tr className="text-left">
              <th scope="col" className="pr-4 font-medium">Metal temperature</th>
              <th scope="col" className="pr-4 font-medium">Heat-up</th>
              <th scope="col" className="pr-4 font-medium">Hold</th>
              <th scope="col" className="font-medium">Total</th>
            </tr>
          </thead>
          <tbody>
            {r.points.map((p) => (
              <tr key={p.metalTempC} className={r.curePoint?.metalTempC === p.metalTempC ? "font-semibold" : ""}>
                <td className="num pr-4">{show("temperatureC", p.metalTempC, sys, 4)}</td>
                <td className="num pr-4">{p.heatUpMin === null ? "never (not below the air)" : minutes(p.heatUpMin)}</td>
                <td className="num pr-4">{minutes(p.holdMin)}</td>
                <td className="num">{p.totalMin === null ? "—" : minutes(p.totalMin)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </details>
    </div>
  );
}

function Bar({ label, parts, scale }: { label: string; parts: [number, string, string][]; scale: number }) {
  return (
    <div className="flex items-center gap-2">
      <span className="w-14 text-ink-soft">{label}</span>
      <div className="flex h-3 grow overflow-hidden rounded-sm bg-plate-sunk">
        {parts.map(([v, colour, name]) => (
          <div key={name} title={`${name} ${minutes(v)}`} style={{ width: `${(v / scale) * 100}%`, backgroundColor: colour }} />
        ))}
      </div>
    </div>
  );
}

function CheckHistory({ rows, unitSystem: sys }: { rows: CureCheckView[]; unitSystem: UnitSystem }) {
  return (
    <div>
      <h3 className="text-sm font-semibold">Checks on this page</h3>
      <table className="mt-1 w-full text-left text-sm" data-testid="cure-history">
        <thead>
          <tr className="border-b border-plate-line">
            <th scope="col" className="py-1 pr-3 font-medium">Coating</th>
            <th scope="col" className="py-1 pr-3 font-medium">Section</th>
            <th scope="col" className="py-1 pr-3 font-medium">Needed</th>
            <th scope="col" className="py-1 pr-3 font-medium">{rows[0].lineKind === "conveyor" ? "Dwell" : "Cycle"}</th>
            <th scope="col" className="py-1 pr-3 font-medium">Margin</th>
            <th scope="col" className="py-1 font-medium">Result</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r, i) => (
            <tr key={i} className="border-b border-plate-line/60">
              <td className="py-1 pr-3">{r.coating.code}</td>
              <td className="num py-1 pr-3">{show("lengthMm", r.thicknessMm, sys)}</td>
              <td className="num py-1 pr-3">{r.requiredMin === null ? "—" : minutes(r.requiredMin)}</td>
              <td className="num py-1 pr-3">{r.lineKind === "conveyor" ? `${minutes(r.dwellMin)} at ${show("speedMPerMin", r.lineSpeedMPerMin, sys)}` : r.cycleMin === null ? "—" : minutes(r.cycleMin)}</td>
              <td className="num py-1 pr-3">{r.lineKind === "conveyor" && r.marginMin !== null ? signedMinutes(r.marginMin) : "—"}</td>
              <td className={`py-1 font-medium ${r.pass ? "text-pass" : "text-oxide"}`}>{r.pass ? "Cures" : "Does not cure"}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
