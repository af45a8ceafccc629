"use client";
// Every saved racking plan, as last saved: part, line, count, orientation, who and when, with
// links to the printable view and back into the planner.

import useSWR from "swr";
import Link from "next/link";
import type { FetchError } from "@/lib/fetcher";
import { formatQuantity, type UnitSystem } from "@/lib/coating-math/display-units";
import { codeWords } from "@/lib/rack/orientation-code";
import type { RackPlansList } from "@/app/api/rack/plans/route";
import { whenText } from "./when-text";


export function SavedPlansList({ unitSystem }: { unitSystem: UnitSystem }) {
  const { data, error, isLoading } = useSWR<RackPlansList, FetchError>("/api/rack/plans", { shouldRetryOnError: false });
  const len = (mm: number) => formatQuantity("lengthMm", mm, unitSystem, 4);
  return (
    <section className="card no-print" aria-labelledby="saved-plans-h" data-testid="saved-plans">
      <h2 id="saved-plans-h">Saved racking plans</h2>
      <p className="mt-1 text-sm text-ink-soft">
        One per part and line. Runs of the part on the line use the saved plan&apos;s count unless the run sets one by hand.
      </p>
      {error ? (
        <p role="alert" className="field-error mt-2">Saved plans could not be loaded: {error.message}</p>
      ) : isLoading || !data ? (
        <p role="status" className="mt-2 text-sm text-ink-faint">Loading saved plans…</p>
      ) : data.plans.length === 0 ? (
        <p className="mt-2 text-sm">No saved plans yet. Take a part from the catalogue and a window from a line above, then save the plan.</p>
      ) : (
        <div className="mt-2 overflow-x-auto">
          <table className="w-full text-left text-sm">
            <thead className="text-ink-soft">
              <tr>
                <th scope="col" className="py-1 pr-3 font-medium">Part</th>
                <th scope="col" className="py-1 pr-3 font-medium">Line</th>
                <th scope="col" className="py-1 pr-3 font-medium">Parts per carrier or rack</th>
                <th scope="col" className="py-1 pr-3 font-medium">Orientation</th>
                <th scope="col" className="py-1 pr-3 font-medium">Clearance</th>
                <th scope="col" className="py-1 pr-3 font-medium">Updated</th>
                <th scope="col" className="py-1 pr-3 font-medium"><span className="sr-only">Links</span></th>
              </tr>
            </thead>
            <tbody>
              {data.plans.map((p) => (
                <tr key={p.id} className="border-t border-plate-line align-top">
                  <td className="py-1 pr-3">
                    <span className="num">{p.part.number}</span> · {p.part.name}
                    {p.part.archived && <span className="block text-xs text-ink-faint">archived part</span>}
                  </td>
                  <td className="py-1 pr-3">
                    {p.line.name}
                    {p.line.archived && <span className="block text-xs text-ink-faint">archived line</span>}
                  </td>
                  <td className="py-1 pr-3">
                    <span className="num font-semibold">{p.partsPerCarrier}</span> <span className="text-xs text-ink-faint">limited by {p.limitedBy}</span>
                    {p.maybeStale && <span className="block text-xs text-caution">The part or line changed since: open to check.</span>}
                  </td>
                  <td className="py-1 pr-3">
                    {p.orientationOverride ? `By hand: ${codeWords(p.orientationOverride)}` : "Best found"}
                    {p.orientations === "upright" && <span className="block text-xs text-ink-faint">upright only</span>}
                  </td>
                  <td className="py-1 pr-3 num">{len(p.clearanceMm)}</td>
                  <td className="py-1 pr-3">
                    {p.updatedByName ?? "—"}
                    <span className="block text-xs text-ink-faint">{whenText(p.updatedAt)}</span>
                  </td>
                  <td className="py-1 pr-3 whitespace-nowrap">
                    <Link className="text-phosphate-dark underline" href={`/racking/plans/${p.id}`}>
                      Printable view<span className="sr-only"> of plan {p.id}</span>
                    </Link>
                    {/* A full load, so the planner starts afresh with this part and line picked. */}
                    <a className="ml-3 text-phosphate-dark underline" href={`/racking?part=${encodeURIComponent(p.partId)}&line=${p.lineId}`}>
                      Open<span className="sr-only"> plan {p.id}</span> in planner
                    </a>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
