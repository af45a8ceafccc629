"use client";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { formatQuantity, toDisplay } from "@/lib/coating-math/display-units";

interface Props {
  code: string;
  series: { date: string; stockKg: number }[];
  reorderPointKg: number;
  stockOutDate: string | null;
  /** need not met over the horizon: stock cannot go below zero, so the line alone cannot show it */
  shortfallKg: number;
  unitSystem: UnitSystem;
}

const W = 640;
const H = 200;
const PAD = { l: 56, r: 12, t: 12, b: 28 };

/** Projected usable stock per day, as a plain SVG step line, with the reorder point dashed. */
export function StockChart({ code, series, reorderPointKg, stockOutDate, shortfallKg, unitSystem }: Props) {
  if (!series.length) return null;
  const shown = (kg: number) => toDisplay("massKg", kg, unitSystem).value;
  const maxY = Math.max(1, ...series.map((p) => shown(p.stockKg)), shown(reorderPointKg)) * 1.1;
  const x = (i: number) => PAD.l + (i / Math.max(1, series.length - 1)) * (W - PAD.l - PAD.r);
  const y = (v: number) => PAD.t + (1 - v / maxY) * (H - PAD.t - PAD.b);
  // a step line: hold each day's closing stock until the next day
  const path = series.map((p, i) => (i === 0 ? `M${x(0).toFixed(1)} ${y(shown(p.stockKg)).toFixed(1)}` : `H${x(i).toFixed(1)} V${y(shown(p.stockKg)).toFixed(1)}`)).join(" ");
  const unit = toDisplay("massKg", 1, unitSystem).unit;
  const ticks = [0, 0.5, 1].map((f) => f * maxY);
  const first = series[0];
  const last = series[series.length - 1];
  const outAt = stockOutDate ? series.findIndex((p) => p.date === stockOutDate) : -1;
  const shortText = formatQuantity("massKg", shortfallKg, unitSystem, 3);
  return (
    <figure className="space-y-1">
      <svg viewBox={`0 0 ${W} ${H}`} className="w-full max-w-2xl" role="img" aria-label={`Projected stock of ${code} from ${first.date} to ${last.date}: ${formatQuantity("massKg", first.stockKg, unitSystem, 4)} to ${formatQuantity("massKg", last.stockKg, unitSystem, 4)}${stockOutDate ? `, runs out ${stockOutDate}, ${shortText} short` : ""}.`}>
        {ticks.map((t) => (
          <g key={t}>
            <line x1={PAD.l} x2={W - PAD.r} y1={y(t)} y2={y(t)} stroke="#d3d6cf" />
            <text x={PAD.l - 6} y={y(t) + 4} textAnchor="end" fontSize="11" fill="#3f4c57">{Math.round(t)} {unit}</text>
          </g>
        ))}
        <line x1={PAD.l} x2={W - PAD.r} y1={y(shown(reorderPointKg))} y2={y(shown(reorderPointKg))} stroke="#8a6100" strokeDasharray="4 3" />
        <path d={path} fill="none" stroke="#1d6b63" strokeWidth="2" />
        {outAt >= 0 && (
          <g data-testid="stock-out-mark">
            <line x1={x(outAt)} x2={x(outAt)} y1={PAD.t} y2={H - PAD.b} stroke="#a8461f" strokeWidth="2" strokeDasharray="5 3" />
            <text x={Math.min(x(outAt) + 4, W - PAD.r - 150)} y={PAD.t + 12} fontSize="11" fill="#a8461f">
              runs out {stockOutDate}: {shortText} short
            </text>
          </g>
        )}
        <text x={PAD.l} y={H - 8} fontSize="11" fill="#3f4c57">{first.date}</text>
        <text x={W - PAD.r} y={H - 8} fontSize="11" fill="#3f4c57" textAnchor="end">{last.date}</text>
      </svg>
      <figcaption className="text-xs text-ink-soft">
        Projected usable stock of {code} at the end of each day (solid); reorder point {formatQuantity("massKg", reorderPointKg, unitSystem, 4)} (dashed).
        {stockOutDate && ` Stock cannot fall below zero: from ${stockOutDate} (red mark) the runs need ${shortText} more than there is.`}
      </figcaption>
    </figure>
  );
}
