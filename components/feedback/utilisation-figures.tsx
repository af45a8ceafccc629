import type { UtilisationEstimate } from "@/lib/server/feedback";

const pct = (u: number | null) => (u === null ? "—" : `${(u * 100).toFixed(1)} %`);

/** Nominal and measured utilisation side by side, with how many runs the measured one rests on. */
export function UtilisationFigures({ e, minRuns = 3 }: { e: UtilisationEstimate; minRuns?: number }) {
  return (
    <dl className="flex flex-wrap gap-x-6 gap-y-1 text-sm" aria-label="Utilisation">
      <div>
        <dt className="text-xs text-ink-soft">Nominal</dt>
        <dd className="num" data-nominal>{pct(e.nominal)}</dd>
      </div>
      <div>
        <dt className="text-xs text-ink-soft">Measured</dt>
        <dd className="num font-medium" data-measured>
          {e.measured === null ? `— (${e.runs} of ${minRuns} runs)` : pct(e.measured)}
        </dd>
      </div>
      <div>
        <dt className="text-xs text-ink-soft">Runs · spread (s.d.)</dt>
        <dd className="num">
          {e.runs} · {e.spread === null ? "—" : `${(e.spread * 100).toFixed(1)} points`}
        </dd>
      </div>
    </dl>
  );
}
