// The printable run sheet: what the line needs at the hooks and the ovens, on one or two pages of
// A4 or Letter. Rendered on the server from the run's plan; the stylesheet beside it handles print.

import type { UnitSystem } from "@/lib/coating-math/display-units";
import { ISO19840_LOW_FRACTION, ISO19840_MAX_SHARE_BELOW_NOMINAL, PA2_MIN_READINGS_PER_SPOT, PA2_SPOTS_PER_AREA } from "@/lib/coating-math/film";
import { maskingItems } from "@/lib/runs/masking";
import { rackTiers, runSteps, safetyNotes, type SheetStep } from "@/lib/runs/sheet";
import type { CoatPlan, RunPlan } from "@/lib/runs/plan-run";
import { RUN_STATUS_LABELS } from "@/lib/runs/status";
import type { RunDetail } from "@/lib/server/runs";
import { RackViewLazy } from "@/components/three/rack-view-lazy";
import { containerText } from "./plan-summary";
import { dayLabel, duration, percent, plural, q } from "./format";
import { PrintButton } from "./print-button";
import { RackDiagram } from "./rack-diagram";

interface Props {
  run: RunDetail;
  plan: RunPlan;
  unitSystem: UnitSystem;
  plantName: string;
  printedAt: string;
}

function coatName(c: CoatPlan): string {
  return `coat ${c.position + 1}, ${c.code} ${c.name} (${c.colourName})`;
}

function StepText({ step, plan, run, sys }: { step: SheetStep; plan: RunPlan; run: RunDetail; sys: UnitSystem }) {
  const coat = step.coat === undefined ? undefined : plan.coats[step.coat];
  const where = [
    step.dwellMin !== undefined ? duration(step.dwellMin) : null,
    step.lengthM !== undefined ? q("lengthM", step.lengthM, sys) : null,
    step.tempC !== undefined && step.tempC !== null ? `at ${q("temperatureC", step.tempC, sys, 4)}` : null,
  ]
    .filter(Boolean)
    .join(", ");
  const word = plan.lineKind === "conveyor" ? "carrier" : "rack";
  switch (step.kind) {
    case "masking": {
      const items = maskingItems(run.masking);
      return <>Mask: {items.length ? "as listed under Masking below." : "nothing listed for this run."}</>;
    }
    case "hang":
      return step.pass ? (
        <>{step.title}: unload, let cool, and hang again the same way.</>
      ) : (
        <>
          Hang {plural(plan.racking.partsPerCarrier, "part")} per {word} as drawn, on clean hooks (a coated hook does not ground the part):{" "}
          {plural(plan.carriers, word)} in all.
        </>
      );
    case "blow-off":
      return <>Blow off dust, swarf and loose scale with clean, dry compressed air; wear eye protection and never aim it at skin.</>;
    case "pretreat":
      return <>{step.title}{where ? ` — ${where}` : ""}.</>;
    case "e-coat":
      return coat ? (
        <>
          {step.title}: {coatName(coat)} to {q("filmUm", coat.filmUm, sys)} — {where} immersed.
        </>
      ) : (
        <>{step.title} — not used for this run; the carriers pass through as the line&apos;s procedure sets out.</>
      );
    case "dry-off":
      return <>{step.title} — {where}.</>;
    case "spray":
      return coat ? (
        <>
          {step.title}: spray {coatName(coat)} to {q("filmUm", coat.filmUm, sys)} (range {q("filmUm", coat.filmMinUm, sys)}–{q("filmUm", coat.filmMaxUm, sys)})
          {coat.firstPassEfficiency !== null && `; planned first-pass efficiency ${percent(coat.firstPassEfficiency)}`}.
        </>
      ) : (
        <>{step.title} — not used on this pass.</>
      );
    case "cure":
      return coat ? (
        <>
          {step.title}: oven air {q("temperatureC", coat.cure.airTempC, sys, 4)},{" "}
          {plan.lineKind === "conveyor" ? `dwell ${duration(coat.cure.dwellMin ?? 0)}` : `hold the load ${duration(coat.cure.dwellMin ?? 0)} once loaded`}; cures {coatName(coat)}
          {coat.cure.curePoint && coat.cure.heatUpMin !== null && (
            <>
              {" "}
              — metal to {q("temperatureC", coat.cure.curePoint.metalTempC, sys, 4)} in about {duration(coat.cure.heatUpMin)}, then {duration(coat.cure.curePoint.holdMin)} at temperature
            </>
          )}
          .
        </>
      ) : (
        <>{step.title} — {where}; no coat cures here on this pass.</>
      );
    case "cool":
      return <>{step.title} — {where}.</>;
    case "load":
      return <>{step.title}, {run.lineView.kind === "batch" ? `${plural(run.lineView.racksPerLoad, "rack")} to a full load` : ""}; keep the oven&apos;s purge and exhaust running.</>;
    case "unload":
      return <>Unload only once cool enough to handle, with heat-resistant gloves; remove the masking; check the film as planned below.</>;
  }
}

export function RunSheet({ run, plan, unitSystem: sys, plantName, printedAt }: Props) {
  const line = run.lineView;
  const pureLine = line.kind === "conveyor" ? { kind: "conveyor" as const, stages: line.stages } : { kind: "batch" as const };
  const steps = runSteps(pureLine, plan);
  const notes = safetyNotes(pureLine, plan);
  const masking = maskingItems(run.masking);
  const tiers = rackTiers(plan.racking.plan.placements.slice(0, plan.racking.partsPerCarrier));
  const word = plan.lineKind === "conveyor" ? "carrier" : "rack";
  const part = run.part!;

  return (
    <article className="print-sheet run-sheet space-y-5" data-testid="run-sheet">
      <header className="flex flex-wrap items-start gap-3 border-b border-ink pb-2">
        <div className="mr-auto">
          <p className="text-xs uppercase tracking-wide text-ink-soft">{plantName} · run sheet</p>
          <h1>
            Run {run.id}: {run.quantity.toLocaleString("en-US")} × {part.number} {part.name}
          </h1>
          <p className="text-sm">
            {run.line.name} · {dayLabel(run.date)} · shift {run.shift} · {RUN_STATUS_LABELS[run.status]}
          </p>
        </div>
        <div className="no-print">
          <PrintButton />
        </div>
      </header>

      <section aria-labelledby="s-job">
        <h2 id="s-job">The job</h2>
        <table className="sheet-table mt-1 w-full text-sm">
          <tbody>
            <tr>
              <th scope="row">Part</th>
              <td>{part.number} — {part.name}{part.customer ? ` (${part.customer})` : ""}</td>
              <th scope="row">Quantity</th>
              <td className="num">{run.quantity.toLocaleString("en-US")}</td>
            </tr>
            <tr>
              <th scope="row">Part size, mass</th>
              <td className="num">
                {[part.lengthMm, part.widthMm, part.heightMm].map((v) => q("lengthMm", v, sys, 4)).join(" × ")}, {q("massKg", part.massKg, sys)}, section {q("lengthMm", part.thicknessMm, sys)}
              </td>
              <th scope="row">{plan.lineKind === "conveyor" ? "Line speed" : "Oven loads"}</th>
              <td className="num">{plan.lineSpeedMPerMin !== null ? q("speedMPerMin", plan.lineSpeedMPerMin, sys) : `${plan.loads} per coat`}</td>
            </tr>
            <tr>
              <th scope="row">Parts per {word}</th>
              <td className="num">{plan.racking.partsPerCarrier} ({q("massKg", plan.racking.loadKg, sys)} of {q("massKg", plan.racking.maxLoadKg, sys)} allowed)</td>
              <th scope="row">{word === "carrier" ? "Carriers" : "Racks"}</th>
              <td className="num">{plan.carriers.toLocaleString("en-US")}{plan.passes > 1 ? `, ${plan.passes} passes` : ""}</td>
            </tr>
            <tr>
              <th scope="row">Line time</th>
              <td className="num" colSpan={3}>
                {duration(plan.lineTimeMin)} from the first {word} on to the last off
              </td>
            </tr>
          </tbody>
        </table>
      </section>

      <section aria-labelledby="s-coats">
        <h2 id="s-coats">Coats and ovens</h2>
        <table className="sheet-table mt-1 w-full text-sm">
          <thead>
            <tr>
              <th>Coat</th>
              <th>Film target</th>
              <th>Oven</th>
              <th>Oven air</th>
              <th>{plan.lineKind === "conveyor" ? "Dwell" : "Heat-up + hold"}</th>
              <th>Needed</th>
              <th>Margin</th>
            </tr>
          </thead>
          <tbody>
            {plan.coats.map((c) => (
              <tr key={c.position}>
                <td>
                  {c.position + 1}. {c.code} {c.name}, {c.colourName} ({c.kind})
                </td>
                <td className="num">
                  {q("filmUm", c.filmUm, sys)} ({q("filmUm", c.filmMinUm, sys)}–{q("filmUm", c.filmMaxUm, sys)})
                </td>
                <td>{c.cure.ovenName}</td>
                <td className="num">{q("temperatureC", c.cure.airTempC, sys, 4)}</td>
                <td className="num">{c.cure.dwellMin !== null ? duration(c.cure.dwellMin) : "—"}</td>
                <td className="num">{c.cure.requiredMin !== null ? duration(c.cure.requiredMin) : "—"}</td>
                <td className="num">{c.cure.marginMin !== null ? `${c.cure.marginMin >= 0 ? "+" : "−"}${duration(Math.abs(c.cure.marginMin))}` : c.cure.pass ? "cures" : "DOES NOT CURE"}</td>
              </tr>
            ))}
          </tbody>
        </table>
        {!plan.cures && <p className="mt-1 text-sm font-semibold">A coat does not cure at this setting: do not run until the supervisor changes the plan.</p>}
      </section>

      <section aria-labelledby="s-rack" className="sheet-rack">
        <h2 id="s-rack">Racking</h2>
        <p className="text-sm">{run.rackingReason ?? plan.racking.reason}{plan.racking.overridden ? ` Set by hand to ${plan.racking.partsPerCarrier} per ${word}.` : ""}</p>
        <div className="mt-2 flex flex-wrap items-start gap-6">
          <RackDiagram windowMm={plan.racking.windowMm} placements={plan.racking.plan.placements.slice(0, plan.racking.partsPerCarrier)} unitSystem={sys} heightPx={210} />
          <div className="text-sm">
            <p>
              Window {q("lengthMm", plan.racking.windowMm.widthMm, sys, 4)} along travel × {q("lengthMm", plan.racking.windowMm.heightMm, sys, 4)} high ×{" "}
              {q("lengthMm", plan.racking.windowMm.depthMm, sys, 4)} across; clearance {q("lengthMm", plan.racking.clearanceMm, sys)};{" "}
              {plan.racking.orientations === "upright" ? "upright only" : "any orientation"}.
            </p>
            <table className="sheet-table mt-1 text-sm" data-testid="sheet-tiers">
              <thead>
                <tr>
                  <th>Tier</th>
                  <th>Lower face above the floor</th>
                  <th>Parts</th>
                </tr>
              </thead>
              <tbody>
                {tiers.map((t, i) => (
                  <tr key={i}>
                    <td className="num">{i + 1}</td>
                    <td className="num">{q("lengthMm", t.bottomMm, sys, 4)}</td>
                    <td className="num">{t.count}</td>
                  </tr>
                ))}
              </tbody>
            </table>
            <ul className="mt-1 list-disc pl-5">
              {plan.racking.plan.blocks.map((b, i) => (
                <li key={i} className="num">
                  {b.grid.join(" × ")} (along × up × across), {plural(b.count, "part")}, each {q("lengthMm", b.orientation.alongWidthMm, sys, 4)} ×{" "}
                  {q("lengthMm", b.orientation.alongHeightMm, sys, 4)} × {q("lengthMm", b.orientation.alongDepthMm, sys, 4)}
                </li>
              ))}
            </ul>
          </div>
        </div>
        <div className="no-print mt-3">
          <RackViewLazy
            windowMm={plan.racking.windowMm}
            placements={plan.racking.plan.placements.slice(0, plan.racking.partsPerCarrier)}
            clearanceMm={plan.racking.clearanceMm}
            partMassKg={part.massKg}
            maxLoadKg={plan.racking.maxLoadKg}
            spaceCount={plan.racking.spaceCount}
            unitSystem={sys}
          />
        </div>
      </section>

      <section aria-labelledby="s-mask">
        <h2 id="s-mask">Masking</h2>
        {masking.length ? (
          <ul className="sheet-checklist mt-1 text-sm">
            {masking.map((m) => (
              <li key={m}>
                <span className="sheet-box" aria-hidden="true" /> {m}
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-sm">No masking listed for this run.</p>
        )}
        {run.notes && <p className="mt-1 whitespace-pre-line text-sm"><strong>Notes:</strong> {run.notes}</p>}
      </section>

      <section aria-labelledby="s-steps" className="sheet-breakable">
        <h2 id="s-steps">Steps</h2>
        <ol className="sheet-steps mt-1 list-decimal space-y-0.5 pl-6 text-sm" data-testid="sheet-steps">
          {steps.map((step, i) => (
            <li key={i} className={step.idle ? "text-ink-soft" : undefined}>
              <StepText step={step} plan={plan} run={run} sys={sys} />
            </li>
          ))}
        </ol>
      </section>

      <section aria-labelledby="s-material">
        <h2 id="s-material">Material</h2>
        <table className="sheet-table mt-1 w-full text-sm" data-testid="sheet-material">
          <thead>
            <tr>
              <th>Coat</th>
              <th>Coated area, whole run</th>
              <th>Expected use</th>
              <th>Draw from stock</th>
            </tr>
          </thead>
          <tbody>
            {plan.coats.map((c) => (
              <tr key={c.position}>
                <td>{c.position + 1}. {c.code} {c.colourName}</td>
                <td className="num">{q("areaM2", c.areaM2, sys)} ({q("areaM2", c.areaPerPartM2, sys)} per part)</td>
                <td className="num">
                  {q("massKg", c.materialKg, sys)}
                  {c.paintL !== null && `, ${q("volumeL", c.paintL, sys)} of paint`}
                  {c.materialUtilization !== null && ` (utilisation ${percent(c.materialUtilization)})`}
                </td>
                <td className="num">{containerText(c.containers, c.containerKind, c.containerKg, sys)}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <p className="mt-1 text-xs">
          Powder: theoretical coverage 1000 / (specific gravity × film in µm) m²/kg at the planned utilisation. E-coat: deposited solids
          (film density × film × area) as paint at its weight solids, without drag-out losses.
        </p>
      </section>

      <section aria-labelledby="s-film">
        <h2 id="s-film">Film check</h2>
        <table className="sheet-table mt-1 w-full text-sm" data-testid="sheet-film">
          <thead>
            <tr>
              <th>Coat</th>
              <th>Specified film</th>
              <th>Surface</th>
              <th>SSPC-PA 2: areas</th>
              <th>Spots</th>
              <th>Gauge readings, at least</th>
            </tr>
          </thead>
          <tbody>
            {plan.coats.map((c) => (
              <tr key={c.position}>
                <td>{c.position + 1}. {c.code}</td>
                <td className="num">{q("filmUm", c.filmMinUm, sys)}–{q("filmUm", c.filmMaxUm, sys)}</td>
                <td className="num">{q("areaM2", c.areaM2, sys)}</td>
                <td className="num">{c.filmCheck.areaCount}</td>
                <td className="num">{c.filmCheck.spotCount}</td>
                <td className="num">{c.filmCheck.minReadingCount}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <p className="mt-1 text-xs">
          SSPC-PA 2: a spot is the average of at least {PA2_MIN_READINGS_PER_SPOT} gauge readings in a 4 cm (1.5 in) circle, {PA2_SPOTS_PER_AREA} spots per area;
          area averages within the specified range, no spot below 80 % of the minimum or above 120 % of the maximum. Where the job is
          inspected to ISO 19840 instead, take the readings its sampling table sets for the area (confirm the count in your copy of the
          standard): the mean at least the nominal film, every reading at least {percent(ISO19840_LOW_FRACTION)} of nominal, no more than{" "}
          {percent(ISO19840_MAX_SHARE_BELOW_NOMINAL)} of readings below nominal, none above the maximum. Gauges to ASTM D7091 / ISO 2360.
        </p>
      </section>

      <section aria-labelledby="s-safety" className="sheet-safety">
        <h2 id="s-safety">Safety</h2>
        <ul className="mt-1 space-y-1.5 text-sm">
          {notes.map((n) => (
            <li key={n.topic}>
              <strong>{n.title}.</strong> {n.text} <span className="text-xs">({n.refs.join("; ")})</span>
            </li>
          ))}
        </ul>
        <p className="mt-1.5 text-xs">
          These are reminders, not a procedure: follow your plant&apos;s own procedures, the safety data sheets, local codes and the
          instructions of the equipment makers, and ask your supervisor when in doubt.
        </p>
      </section>

      <footer className="sheet-signoff grid grid-cols-3 gap-6 pt-4 text-xs">
        <p>Prepared by ____________________</p>
        <p>Started ____________ Finished ____________</p>
        <p>Film checked by ____________________</p>
        <p className="col-span-3 text-ink-soft">Printed {printedAt} · run {run.id}</p>
      </footer>
    </article>
  );
}
