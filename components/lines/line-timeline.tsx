"use client";
import type { LineTimeline } from "@/lib/lines/timeline";
import { STAGE_KIND_LABELS, STAGE_KINDS } from "@/lib/lines/stages";
import { formatSignificant, type UnitSystem } from "@/lib/coating-math/display-units";
import { show } from "./unit-draft";
import { STAGE_COLOURS } from "./stage-style";

/** Minutes between axis ticks: about six ticks over the total. */
function tickStep(totalMin: number): number {
  const rough = totalMin / 6;
  const pow = 10 ** Math.floor(Math.log10(rough));
  return [1, 2, 5, 10].map((m) => m * pow).find((s) => s >= rough) ?? rough;
}

/** A carrier's trip from load to unload: one horizontal band, each stage as wide as its dwell. */
export function LineTimelineChart({ timeline, unitSystem: sys }: { timeline: LineTimeline; unitSystem: UnitSystem }) {
  const total = timeline.totalMin;
  const step = tickStep(total);
  const ticks: number[] = [];
  for (let t = 0; t <= total + 1e-9; t += step) ticks.push(t);
  const kinds = STAGE_KINDS.filter((k) => timeline.stages.some((s) => s.kind === k));
  const pct = (min: number) => `${(min / total) * 100}%`;
  return (
    <figure className="space-y-2" aria-labelledby="timeline-caption">
      <figcaption id="timeline-caption" className="text-sm">
        Load to unload in <strong className="num" data-testid="timeline-total">{formatSignificant(total, 3)} min</strong> over{" "}
        <span className="num">{show("lengthM", timeline.totalLengthM, sys)}</span> of conveyor at{" "}
        <span className="num">{show("speedMPerMin", timeline.lineSpeedMPerMin, sys)}</span>
        {timeline.carriersPerHour !== null && (
          <>
            {" "}· <span className="num">{formatSignificant(timeline.carriersPerHour, 3)}</span> carriers per hour
          </>
        )}
      </figcaption>
      <div
        className="relative flex h-14 w-full overflow-hidden rounded border border-plate-line"
        role="img"
        aria-label={`Timeline: ${timeline.stages.map((s) => `${s.name} ${formatSignificant(s.dwellMin, 3)} min`).join(", ")}`}
        data-testid="line-timeline"
      >
        {timeline.stages.map((s) => (
          <div
            key={s.position}
            className="flex h-full items-center justify-center overflow-hidden border-r border-white/60 px-0.5 text-[11px] leading-tight last:border-r-0"
            style={{ width: pct(s.dwellMin), backgroundColor: STAGE_COLOURS[s.kind].fill, color: STAGE_COLOURS[s.kind].text }}
            title={`${s.name}: ${formatSignificant(s.dwellMin, 3)} min (${formatSignificant(s.startMin, 3)}–${formatSignificant(s.endMin, 3)} min)`}
          >
            {s.dwellMin / total > 0.06 && (
              <span className="truncate text-center">
                {s.name}
                <br />
                <span className="num">{formatSignificant(s.dwellMin, 3)} min</span>
              </span>
            )}
          </div>
        ))}
      </div>
      <div className="relative h-5 text-[11px] text-ink-faint" aria-hidden>
        {ticks.map((t) => (
          <span key={t} className="num absolute -translate-x-1/2 before:absolute before:-top-1 before:left-1/2 before:h-1 before:border-l before:border-ink-faint" style={{ left: pct(t) }}>
            {formatSignificant(t, 3)}
          </span>
        ))}
        <span className="absolute right-0 translate-y-3">min</span>
      </div>
      <ul className="flex flex-wrap gap-x-4 gap-y-1 pt-2 text-xs" aria-label="Legend">
        {kinds.map((k) => (
          <li key={k} className="flex items-center gap-1">
            <span className="inline-block h-3 w-3 rounded-sm" style={{ backgroundColor: STAGE_COLOURS[k].fill }} aria-hidden />
            {STAGE_KIND_LABELS[k]}
          </li>
        ))}
      </ul>
    </figure>
  );
}
