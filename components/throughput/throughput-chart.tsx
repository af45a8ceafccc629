"use client";
// Bar charts of parts per hour and cost per part, one bar per column. Loaded in the browser only
// (browserOnly) so Recharts stays out of the page's first load; only the pieces used are imported.

import { Bar, BarChart, CartesianGrid, Cell, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { money, sig } from "./shown-units";

export interface ChartColumn {
  label: string;
  partsPerHour: number;
  costPerPart: number | null;
  cures: boolean;
}

const GOOD = "#1d6b63"; // phosphate
const SCRAP = "#a8461f"; // oxide: the part does not cure

function short(label: string): string {
  return label.length > 22 ? `${label.slice(0, 21)}…` : label;
}

function OneChart({ title, data, value, format, testId }: {
  title: string;
  data: ChartColumn[];
  value: (c: ChartColumn) => number | null;
  format: (v: number) => string;
  testId: string;
}) {
  const rows = data.map((c) => ({ name: short(c.label), full: c.label, v: value(c) ?? 0, cures: c.cures }));
  return (
    <figure className="min-w-0 flex-1" data-testid={testId}>
      <figcaption className="mb-1 text-sm font-medium text-ink-soft">{title}</figcaption>
      <div className="h-64 w-full">
        <ResponsiveContainer width="100%" height="100%">
          <BarChart data={rows} margin={{ top: 8, right: 8, bottom: 8, left: 8 }}>
            <CartesianGrid strokeDasharray="3 3" vertical={false} stroke="#d3d6cf" />
            <XAxis dataKey="name" tick={{ fontSize: 11 }} interval={0} />
            <YAxis tick={{ fontSize: 11 }} tickFormatter={(v: number) => format(v)} width={64} />
            <Tooltip formatter={(v) => format(Number(v))} labelFormatter={(_l, p) => (p?.[0]?.payload as { full?: string } | undefined)?.full ?? ""} />
            <Bar dataKey="v" name={title} isAnimationActive={false}>
              {rows.map((r) => (
                <Cell key={r.full} fill={r.cures ? GOOD : SCRAP} />
              ))}
            </Bar>
          </BarChart>
        </ResponsiveContainer>
      </div>
    </figure>
  );
}

export function ThroughputChart({ columns, currency }: { columns: ChartColumn[]; currency: string }) {
  return (
    <div className="flex flex-col gap-4 md:flex-row" data-testid="throughput-chart">
      <OneChart title="Parts per hour" data={columns} value={(c) => c.partsPerHour} format={(v) => sig(v, 3)} testId="chart-parts-per-hour" />
      <OneChart title="Cost per part" data={columns} value={(c) => c.costPerPart} format={(v) => money(v, currency)} testId="chart-cost-per-part" />
    </div>
  );
}
