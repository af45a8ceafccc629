"use client";
// Home panel: today's runs on each line, in board order, with a link to each run sheet.

import Link from "next/link";
import useSWR from "swr";
import type { RunsList } from "@/app/api/runs/route";
import type { RunListItem } from "@/lib/server/runs";
import { duration, localToday } from "./format";
import { StatusBadge, Swatch } from "./status-badge";

/** `floor`: what the line works to, so drafts (not yet released to the floor) are left out. */
export function TodayRuns({ showBoard, floor = false }: { showBoard: boolean; floor?: boolean }) {
  const today = localToday();
  const { data, error, isLoading } = useSWR<RunsList>(`/api/runs?date=${today}`);
  const byLine = new Map<string, RunListItem[]>();
  for (const r of data?.runs ?? []) {
    if (r.status === "cancelled" || (floor && r.status === "draft")) continue;
    byLine.set(r.line.name, [...(byLine.get(r.line.name) ?? []), r]);
  }
  return (
    <section className="card" aria-labelledby="today-runs-h" data-testid="today-runs">
      <div className="flex flex-wrap items-baseline gap-3">
        <h2 id="today-runs-h" className="mr-auto">Today&apos;s runs</h2>
        <Link className="text-sm text-phosphate-dark underline-offset-2 hover:underline" href="/runs">All runs</Link>
      </div>
      {isLoading ? (
        <p role="status" className="mt-2 text-sm">Loading today&apos;s runs…</p>
      ) : error ? (
        <p role="alert" className="mt-2 text-sm text-oxide">Could not load today&apos;s runs: {error.message}</p>
      ) : byLine.size === 0 ? (
        <p className="mt-2 text-sm text-ink-soft">No runs planned for today.</p>
      ) : (
        <div className="mt-2 grid gap-4 md:grid-cols-2 xl:grid-cols-3">
          {[...byLine.entries()].map(([line, runs]) => (
            <div key={line}>
              <h3 className="text-sm font-semibold">
                {showBoard ? (
                  <Link className="underline-offset-2 hover:underline" href={`/board?lineId=${runs[0].lineId}&date=${today}`}>{line}</Link>
                ) : (
                  line
                )}
              </h3>
              <ol className="mt-1 space-y-1 text-sm">
                {runs.map((r) => (
                  <li key={r.id} className="flex flex-wrap items-center gap-x-2 gap-y-0.5">
                    <span className="text-xs text-ink-faint">S{r.shift}</span>
                    <span className="flex gap-0.5">
                      {r.coats.map((c) => c.coating && <Swatch key={c.position} hex={c.coating.swatchHex} label={c.coating.colourName} />)}
                    </span>
                    <Link className="font-medium text-phosphate-dark underline-offset-2 hover:underline" href={`/runs/${r.id}/sheet`}>
                      {r.part?.number ?? "?"} × {r.quantity.toLocaleString("en-US")}
                    </Link>
                    {r.summary && <span className="num text-xs text-ink-faint">{duration(r.summary.lineTimeMin)}</span>}
                    <StatusBadge status={r.status} />
                  </li>
                ))}
              </ol>
            </div>
          ))}
        </div>
      )}
    </section>
  );
}
