"use client";
// Run chart per coating × line: mean dry film of each film check and the share of its readings
// within the spec, in run-date order, so drift shows before parts fail.

import { useState } from "react";
import useSWR from "swr";
import type { FetchError } from "@/lib/fetcher";
import { toDisplay, type UnitSystem } from "@/lib/coating-math/display-units";
import type { CoatingsList } from "@/app/api/coatings/route";
import type { LinesList } from "@/app/api/lines/route";
import type { TrendPoint } from "@/lib/server/film-checks";

interface Props {
  unitSystem: UnitSystem;
  initialCoatingId: number | null;
  initialLineId: number | null;
}

type Trend = { points: TrendPoint[]; specMinUm: number | null; specMaxUm: number | null };

const W = 560;
const H = 180;
const PAD = { l: 44, r: 12, t: 12, b: 26 };

function Chart({ points, y, lo, hi, band, label, fmt }: { points: TrendPoint[]; y: (p: TrendPoint) => number; lo: number; hi: number; band?: [number, number]; label: string; fmt: (v: number) => string }) {
  const px = (i: number) => PAD.l + (points.length === 1 ? 0.5 : i / (points.length - 1)) * (W - PAD.l - PAD.r);
  const py = (v: number) => H - PAD.b - ((v - lo) / (hi - lo || 1)) * (H - PAD.t - PAD.b);
  return (
    <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-label={label} className="w-full max-w-2xl" data-testid="run-chart">
      {band && <rect x={PAD.l} width={W - PAD.l - PAD.r} y={py(band[1])} height={Math.max(0, py(band[0]) - py(band[1]))} className="fill-pass-light" />}
      <line x1={PAD.l} x2={PAD.l} y1={PAD.t} y2={H - PAD.b} className="stroke-ink-faint" />
      <line x1={PAD.l} x2={W - PAD.r} y1={H - PAD.b} y2={H - PAD.b} className="stroke-ink-faint" />
      <text x={PAD.l - 4} y={py(hi) + 4} textAnchor="end" className="fill-ink-faint text-[10px]">{fmt(hi)}</text>
      <text x={PAD.l - 4} y={py(lo)} textAnchor="end" className="fill-ink-faint text-[10px]">{fmt(lo)}</text>
      <polyline fill="none" className="stroke-phosphate" strokeWidth={2} points={points.map((p, i) => `${px(i)},${py(y(p))}`).join(" ")} />
      {points.map((p, i) => (
        <g key={p.checkId}>
          <circle cx={px(i)} cy={py(y(p))} r={4} className="fill-phosphate-dark">
            <title>{`Run ${p.runId}, ${p.date}: ${fmt(y(p))}`}</title>
          </circle>
          <text x={px(i)} y={H - 8} textAnchor="middle" className="fill-ink-faint text-[10px]">{p.date.slice(5)}</text>
        </g>
      ))}
    </svg>
  );
}

export function QualityTrend({ unitSystem: sys, initialCoatingId, initialLineId }: Props) {
  const coatings = useSWR<CoatingsList, FetchError>("/api/coatings");
  const lines = useSWR<LinesList, FetchError>("/api/lines");
  const [coatingId, setCoatingId] = useState<number | null>(initialCoatingId);
  const [lineId, setLineId] = useState<number | null>(initialLineId);
  const cId = coatingId ?? coatings.data?.coatings[0]?.id ?? null;
  const lId = lineId ?? lines.data?.lines[0]?.id ?? null;
  const trend = useSWR<Trend, FetchError>(cId && lId ? `/api/quality/trend?coatingId=${cId}&lineId=${lId}` : null);
  const fmtFilm = (um: number) => {
    const d = toDisplay("filmUm", um, sys);
    return `${Number(d.value.toFixed(sys === "us" ? 2 : 0))} ${d.unit}`;
  };

  if (coatings.error || lines.error) return <p role="alert" className="text-oxide">Could not load coatings and lines.</p>;
  if (!coatings.data || !lines.data) return <p className="text-ink-faint">Loading…</p>;
  const pts = trend.data?.points ?? [];
  const min = trend.data?.specMinUm ?? 0;
  const max = trend.data?.specMaxUm ?? 0;
  const lo = Math.min(min * 0.8, ...pts.map((p) => p.meanUm));
  const hi = Math.max(max * 1.2, ...pts.map((p) => p.meanUm));

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap gap-4">
        <div>
          <label htmlFor="q-coating" className="label">Coating</label>
          <select id="q-coating" className="field" value={cId ?? ""} onChange={(e) => setCoatingId(Number(e.target.value))}>
            {coatings.data.coatings.map((c) => <option key={c.id} value={c.id}>{`${c.code} ${c.name}`}</option>)}
          </select>
        </div>
        <div>
          <label htmlFor="q-line" className="label">Line</label>
          <select id="q-line" className="field" value={lId ?? ""} onChange={(e) => setLineId(Number(e.target.value))}>
            {lines.data.lines.map((l) => <option key={l.id} value={l.id}>{l.name}</option>)}
          </select>
        </div>
      </div>
      {trend.error && <p role="alert" className="text-oxide">{trend.error.message}</p>}
      {trend.isLoading && <p className="text-ink-faint">Loading the trend…</p>}
      {trend.data && pts.length === 0 && <p className="text-ink-faint">No film checks of this coating on this line yet.</p>}
      {pts.length > 0 && (
        <>
          <section className="card">
            <h2 className="font-semibold">{`Mean dry film per check (spec ${fmtFilm(min)}–${fmtFilm(max)}, green band)`}</h2>
            <Chart points={pts} y={(p) => p.meanUm} lo={lo} hi={hi} band={[min, max]} label="Mean film by run date" fmt={fmtFilm} />
          </section>
          <section className="card">
            <h2 className="font-semibold">Share of readings within the spec</h2>
            <Chart points={pts} y={(p) => p.fractionInSpec} lo={0} hi={1} label="Share of readings in spec by run date" fmt={(v) => `${Math.round(v * 100)} %`} />
          </section>
          <table className="text-sm">
            <thead><tr><th className="pr-4 text-left">Run</th><th className="pr-4 text-left">Date</th><th className="pr-4 text-right">Readings</th><th className="pr-4 text-right">Mean</th><th className="text-right">In spec</th></tr></thead>
            <tbody>
              {pts.map((p) => (
                <tr key={p.checkId}>
                  <td className="pr-4"><a className="text-phosphate-dark underline" href={`/runs/${p.runId}/film`}>{p.runId}</a></td>
                  <td className="pr-4">{p.date}</td>
                  <td className="num pr-4 text-right">{p.readingCount}</td>
                  <td className="num pr-4 text-right">{fmtFilm(p.meanUm)}</td>
                  <td className="num text-right">{`${Math.round(p.fractionInSpec * 100)} %`}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </>
      )}
    </div>
  );
}
