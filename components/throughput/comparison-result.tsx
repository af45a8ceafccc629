"use client";
// The answer of a comparison: what limits each column, the side-by-side table and the charts.

import { browserOnly } from "@/components/ui/browser-only";
import type { ThroughputComparison } from "@/lib/server/throughput";
import { ComparisonTable } from "./comparison-table";
import { show, sig, type UnitTable } from "./shown-units";

const ThroughputChart = browserOnly(
  () => import("./throughput-chart").then((m) => m.ThroughputChart),
  <p role="status" className="text-sm text-ink-soft">Drawing the charts…</p>,
);

export function ComparisonResult({ result: r, units }: { result: ThroughputComparison; units: UnitTable }) {
  const c = r.coating;
  return (
    <>
      <p className="text-sm text-ink-soft num">
        {r.part.label}: {show(units, "areaM2", r.part.areaM2)} coated, {show(units, "massKg", r.part.massKg)}, {show(units, "lengthMm", r.part.thicknessMm)} section ·{" "}
        {c.code} at {show(units, "filmUm", c.filmUm)}, SG {c.specificGravity}, {sig(c.firstPassEfficiency * 100, 3)} % first pass,{" "}
        {c.reclaimEfficiency > 0 ? `${sig(c.reclaimEfficiency * 100, 3)} % reclaimed` : "no reclaim"}.
      </p>
      <div>
        <h3 className="text-sm font-semibold">What limits each</h3>
        <ul className="mt-1 space-y-1.5 text-sm">
          {r.columns.map((col, i) => (
            <li key={i} data-testid="limit" data-kind={col.figures.limit.kind}>
              <strong>{col.label}:</strong> <span className={col.figures.cures ? "" : "text-oxide"}>{col.figures.limit.sentence}</span>
              {col.figures.notes.length > 0 && (
                <ul className="ml-5 list-disc text-xs text-ink-soft">
                  {col.figures.notes.map((n) => <li key={n}>{n}</li>)}
                </ul>
              )}
            </li>
          ))}
        </ul>
      </div>
      <ComparisonTable comparison={r} units={units} />
      <ThroughputChart
        currency={r.currency}
        columns={r.columns.map((col) => ({ label: col.label, partsPerHour: col.figures.partsPerHour, costPerPart: col.figures.costPerPart, cures: col.figures.cures }))}
      />
      <p className="text-xs text-ink-faint">
        Green bars cure; red bars run faster than the oven cures the part. Cost per part = powder + line running cost ÷ parts per hour; e-coat primer
        material is not included.
      </p>
    </>
  );
}
