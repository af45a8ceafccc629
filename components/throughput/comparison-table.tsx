"use client";
// Side by side: one column per line or scenario, one row per measure, the best cell marked.

import type { Measure, SpeedSource, ThroughputFigures } from "@/lib/lines/throughput-compare";
import type { ThroughputComparison } from "@/lib/server/throughput";
import { money, show, sig, type UnitTable } from "./shown-units";

const SPEED_SOURCE: Record<SpeedSource, string> = {
  scenario: "set by the scenario",
  "fastest-curing": "fastest that cures",
  "line-max": "the line's top speed",
  "line-min": "the line's slowest",
  nominal: "nominal",
};

const PPC_SOURCE = { planned: "racking plan", hand: "entered by hand", scenario: "set by the scenario" } as const;

interface Row {
  label: string;
  measure?: Measure;
  cell: (f: ThroughputFigures) => React.ReactNode;
  /** hide the row when no column has a value */
  when?: (f: ThroughputFigures) => boolean;
}

export function ComparisonTable({ comparison: c, units }: { comparison: ThroughputComparison; units: UnitTable }) {
  const min = (v: number | null) => (v === null ? "–" : `${sig(v, 3)} min`);
  const cur = (v: number | null) => (v === null ? "–" : money(v, c.currency));
  const rows: Row[] = [
    {
      label: "Line speed",
      cell: (f) =>
        f.lineSpeedMPerMin === null ? (
          "batch oven"
        ) : (
          <>
            {show(units, "speedMPerMin", f.lineSpeedMPerMin)}
            <span className="block text-xs text-ink-faint">{SPEED_SOURCE[f.speedSource!]}</span>
          </>
        ),
    },
    { label: "Carrier pitch", cell: (f) => (f.carrierPitchM === null ? "–" : show(units, "lengthM", f.carrierPitchM)), when: (f) => f.carrierPitchM !== null },
    {
      label: "Parts per carrier or rack",
      cell: (f) => (
        <>
          {f.partsPerCarrier}
          <span className="block text-xs text-ink-faint">{PPC_SOURCE[f.partsPerCarrierSource]}{f.rackPlan.limitedBy === "load" && f.partsPerCarrierSource === "planned" ? ", load-limited" : ""}</span>
        </>
      ),
    },
    { label: "Carriers (racks) per hour", measure: "carriersPerHour", cell: (f) => sig(f.carriersPerHour, 4) },
    { label: "Parts per hour", measure: "partsPerHour", cell: (f) => sig(f.partsPerHour, 4) },
    { label: `Parts per ${sig(c.shiftHours, 3)} h shift`, cell: (f) => sig(f.partsPerShift, 4) },
    { label: "Powder-coated area per hour", measure: "areaM2PerHour", cell: (f) => show(units, "areaRateM2PerH", f.areaM2PerHour, 4) },
    {
      label: "E-coated area per hour",
      cell: (f) => (f.eCoatAreaM2PerHour === null ? "–" : show(units, "areaRateM2PerH", f.eCoatAreaM2PerHour, 4)),
      when: (f) => f.eCoatAreaM2PerHour !== null,
    },
    {
      label: "Cure oven",
      cell: (f) => (
        <>
          {f.ovenName}
          <span className="block text-xs text-ink-faint">
            {f.ovenLengthM !== null ? `${show(units, "lengthM", f.ovenLengthM)} at ` : "air "}
            {show(units, "temperatureC", f.airTempC)}
          </span>
        </>
      ),
    },
    { label: "Oven dwell", cell: (f) => min(f.ovenDwellMin) },
    { label: "Cure needs (heat-up + hold)", cell: (f) => min(f.cureRequiredMin) },
    {
      label: "Cure margin",
      measure: "cureMarginMin",
      cell: (f) => (
        <>
          {min(f.cureMarginMin)}
          {!f.cures && <span className="block text-xs font-medium text-oxide" data-mark="no-cure">does not cure</span>}
        </>
      ),
    },
    { label: "Batch cycle", cell: (f) => min(f.batchCycleMin), when: (f) => f.batchCycleMin !== null },
    { label: "Powder per part", measure: "powderKgPerPart", cell: (f) => show(units, "massKg", f.powderKgPerPart) },
    { label: "Powder per hour", cell: (f) => show(units, "massRateKgPerH", f.powderKgPerHour, 3) },
    { label: "Powder cost per part", cell: (f) => cur(f.materialCostPerPart) },
    { label: "Line cost per part", cell: (f) => cur(f.lineCostPerPart) },
    { label: "Cost per part", measure: "costPerPart", cell: (f) => <strong>{cur(f.costPerPart)}</strong> },
  ];
  const shown = rows.filter((r) => !r.when || c.columns.some((col) => r.when!(col.figures)));
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-sm" data-testid="comparison-table">
        <caption className="sr-only">Throughput side by side; the best value of a row is marked best.</caption>
        <thead>
          <tr className="border-b border-plate-line text-left">
            <th scope="col" className="py-1.5 pr-3 font-medium text-ink-soft">Measure</th>
            {c.columns.map((col, i) => (
              <th key={i} scope="col" className="py-1.5 pr-3 align-bottom font-semibold">
                {col.label}
                {col.source === "scenario" && <span className="block text-xs font-normal text-ink-faint">scenario on {col.lineName}</span>}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {shown.map((r) => (
            <tr key={r.label} className="border-b border-plate-line/60 align-top">
              <th scope="row" className="py-1.5 pr-3 text-left font-normal text-ink-soft">{r.label}</th>
              {c.columns.map((col, i) => {
                const best = r.measure !== undefined && c.best[r.measure].includes(i) && c.columns.length > 1;
                return (
                  <td key={i} className={`num py-1.5 pr-3 ${best ? "bg-pass-light" : ""}`} data-best={best ? "true" : undefined}>
                    {r.cell(col.figures)}
                    {best && <span className="ml-1 rounded bg-pass px-1 text-[10px] font-semibold uppercase text-white">best</span>}
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
