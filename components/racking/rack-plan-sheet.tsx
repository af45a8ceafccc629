// The printable racking plan for the line: the picture (front and side, plain SVG) and the plain
// list — tiers from the bottom, parts per tier, spacing — on one page of A4 or Letter. Rendered
// on the server; no 3D here.

import { formatQuantity, type UnitSystem } from "@/lib/coating-math/display-units";
import { codeOfOrientation, codeWords } from "@/lib/rack/orientation-code";
import { tierRows, type PitchRangeMm } from "@/lib/rack/tiers";
import type { SavedRackPlan } from "@/lib/server/rack-plans";
import { RackDiagram } from "@/components/runs/rack-diagram";
import { PrintButton } from "@/components/runs/print-button";
import { reasonText } from "./reason-text";

interface Props {
  plan: SavedRackPlan;
  unitSystem: UnitSystem;
  plantName: string;
  printedAt: string;
}

/** "2026-12-03 14:05 UTC": the server does not know the reader's time zone. */
export function utcText(epochS: number): string {
  return `${new Date(epochS * 1000).toISOString().slice(0, 16).replace("T", " ")} UTC`;
}

export function RackPlanSheet({ plan, unitSystem: sys, plantName, printedAt }: Props) {
  const len = (mm: number) => formatQuantity("lengthMm", mm, sys, 4);
  const kg = (v: number) => formatQuantity("massKg", v, sys, 4);
  const spacing = (p: PitchRangeMm | null) =>
    p === null ? "—" : Math.abs(p.maxMm - p.minMm) <= 1e-6 * Math.max(1, p.maxMm) ? len(p.minMm) : `${len(p.minMm)} to ${len(p.maxMm)}`;
  const { part, line, window, result } = plan;
  const box = { lengthMm: part.lengthMm, widthMm: part.widthMm, heightMm: part.heightMm };
  const word = line.kind === "batch" ? "rack" : "carrier";
  const input = {
    part: { ...box, massKg: part.massKg },
    carrier: window,
    clearanceMm: plan.clearanceMm,
    orientations: plan.orientations,
    ...(plan.orientation ? { orientation: plan.orientation } : {}),
  };
  const tiers = tierRows(result.placements);
  const blockWords = (o: SavedRackPlan["result"]["blocks"][number]["orientation"]) => {
    const code = codeOfOrientation(box, o);
    return code ? codeWords(code) : "—";
  };
  const orientationText = plan.orientationOverride
    ? `Set by hand: ${codeWords(plan.orientationOverride)}`
    : `Best found${result.blocks[0] ? `: ${blockWords(result.blocks[0].orientation)}${result.blocks.length > 1 ? ", with further blocks turned as listed" : ""}` : ""}`;

  return (
    <article className="print-sheet rack-sheet space-y-4" data-testid="rack-plan-sheet">
      <header className="flex flex-wrap items-start gap-3 border-b border-ink pb-2">
        <div className="mr-auto">
          <p className="text-xs uppercase tracking-wide text-ink-soft">{plantName} · racking plan {plan.id}</p>
          <h1>
            {part.number} {part.name} on {line.name}
          </h1>
          <p className="text-sm">
            <span className="num text-lg font-semibold" data-testid="sheet-count">{result.count}</span> parts per {word}
            {" · "}limited by {result.limitedBy}
          </p>
        </div>
        <div className="no-print">
          <PrintButton />
        </div>
      </header>

      {plan.changedSinceSave && (
        <p role="note" className="rounded border border-caution-edge bg-caution-light p-2 text-sm">
          The part or line has changed since this plan was saved ({plan.partsPerCarrier} per {word} then). The figures below are
          planned from them as they are now; save the plan again on the racking page to keep them.
        </p>
      )}

      <section aria-labelledby="rs-plan">
        <h2 id="rs-plan">The plan</h2>
        <table className="sheet-table mt-1 w-full text-sm">
          <tbody>
            <tr>
              <th scope="row">Part</th>
              <td>
                {part.number} — {part.name}: {len(part.lengthMm)} long × {len(part.widthMm)} wide × {len(part.heightMm)} high, {kg(part.massKg)}
              </td>
            </tr>
            <tr>
              <th scope="row">Line</th>
              <td>
                {line.name} ({line.kind === "batch" ? "batch-oven rack" : "conveyor carrier"})
              </td>
            </tr>
            <tr>
              <th scope="row">{word === "rack" ? "Rack" : "Carrier"} window</th>
              <td className="num">
                {len(window.widthMm)} along travel × {len(window.heightMm)} high × {len(window.depthMm)} across; load limit {kg(window.maxLoadKg)}
              </td>
            </tr>
            <tr>
              <th scope="row">Clearance</th>
              <td className="num">{len(plan.clearanceMm)} between neighbouring parts</td>
            </tr>
            <tr>
              <th scope="row">Orientation</th>
              <td>
                {orientationText}
                {plan.orientations === "upright" ? " (upright only: height vertical)" : ""}
              </td>
            </tr>
            <tr>
              <th scope="row">Parts per {word}</th>
              <td className="num">
                {result.count} ({kg(result.count * part.massKg)} of {kg(window.maxLoadKg)} allowed)
              </td>
            </tr>
            <tr>
              <th scope="row">Limited by</th>
              <td data-testid="sheet-reason">
                {reasonText(result, input, sys)}
              </td>
            </tr>
          </tbody>
        </table>
        {plan.note && (
          <p className="mt-1 whitespace-pre-line text-sm">
            <strong>Note:</strong> {plan.note}
          </p>
        )}
      </section>

      {result.count === 0 ? (
        <p className="text-sm font-semibold">Nothing to hang with these choices: do not rack this part on this line until the plan is changed.</p>
      ) : (
        <>
          <section aria-labelledby="rs-picture" className="rack-sheet-keep">
            <h2 id="rs-picture">Picture</h2>
            <div className="mt-1">
              <RackDiagram windowMm={window} placements={result.placements} unitSystem={sys} heightPx={230} />
            </div>
            <p className="mt-1 text-xs">The dashed outline is the usable window; grey boxes are the parts&apos; bounding boxes, drawn to scale.</p>
          </section>

          <section aria-labelledby="rs-tiers" className="rack-sheet-keep">
            <h2 id="rs-tiers">Tiers, from the bottom</h2>
            <table className="sheet-table mt-1 w-full text-sm" data-testid="sheet-tiers">
              <thead>
                <tr>
                  <th>Tier</th>
                  <th>Lower face above the window floor</th>
                  <th>Parts in the tier</th>
                  <th>Along travel × across</th>
                  <th>Part height</th>
                  <th>Spacing along travel (centre to centre)</th>
                  <th>Spacing across (centre to centre)</th>
                </tr>
              </thead>
              <tbody>
                {tiers.map((t, i) => (
                  <tr key={i}>
                    <td className="num">{i + 1}</td>
                    <td className="num">{len(t.bottomMm)}</td>
                    <td className="num">{t.count}</td>
                    <td className="num">
                      {t.alongCount} × {t.acrossCount}
                    </td>
                    <td className="num">{len(t.heightMm)}</td>
                    <td className="num">{spacing(t.alongPitchMm)}</td>
                    <td className="num">{spacing(t.acrossPitchMm)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
            <p className="mt-1 text-xs">
              Tier 1 hangs lowest. Spacing is part size plus clearance; &quot;—&quot; means one part that way. When the load decides,
              the lowest tiers are filled first.
            </p>
          </section>

          <section aria-labelledby="rs-blocks">
            <h2 id="rs-blocks">Blocks</h2>
            <ul className="mt-1 list-disc pl-5 text-sm">
              {result.blocks.map((b, i) => (
                <li key={i}>
                  {i === 0 ? "Main grid" : `Block ${i + 1}`}: <span className="num">{b.grid.join(" × ")}</span> (along × tiers × across),{" "}
                  {b.count} {b.count === 1 ? "part" : "parts"}, {blockWords(b.orientation)} ({len(b.orientation.alongWidthMm)} ×{" "}
                  {len(b.orientation.alongHeightMm)} × {len(b.orientation.alongDepthMm)}), first part&apos;s corner at{" "}
                  <span className="num">{b.originMm.map(len).join(", ")}</span>
                </li>
              ))}
            </ul>
          </section>
        </>
      )}

      <section aria-labelledby="rs-safety">
        <h2 id="rs-safety">Safety</h2>
        <p className="mt-1 text-sm">
          Never hang more than the {word}&apos;s rated load ({kg(window.maxLoadKg)}); hooks and racks gain weight as cured coating
          builds on them. Hang on clean hooks so every part is grounded for electrostatic spraying. Parts leave the cure oven hot:
          unload with heat-resistant gloves after the cool-down your plant sets. Follow your plant&apos;s own procedures and local
          codes.
        </p>
      </section>

      <footer className="grid grid-cols-2 gap-4 border-t border-ink pt-2 text-xs">
        <p>
          Saved by {plan.createdByName ?? "—"} {utcText(plan.createdAt)}; last updated by {plan.updatedByName ?? "—"} {utcText(plan.updatedAt)}
        </p>
        <p className="text-right">Printed {printedAt} · plan {plan.id}</p>
      </footer>
    </article>
  );
}
