// Home panel for managers: parts per hour and cost per part on every line for the reference part.
// A server component: the figures arrive worked out, so it adds no JavaScript to the page.

import Link from "next/link";
import type { HomeThroughput } from "@/lib/server/throughput";
import { money, sig } from "./shown-units";

export function ThroughputHomePanel({ data }: { data: HomeThroughput }) {
  return (
    <section className="card" aria-labelledby="home-throughput-h">
      <div className="flex items-baseline gap-3">
        <h2 id="home-throughput-h">Throughput by line</h2>
        <Link href="/throughput" className="ml-auto text-sm text-phosphate-dark underline-offset-2 hover:underline">Compare lines and scenarios</Link>
      </div>
      {!data.ok ? (
        <p className="mt-1 text-sm text-ink-soft">{data.message}</p>
      ) : (
        <>
          <p className="mt-1 text-xs text-ink-faint">{data.partLabel} in {data.coatingLabel}, each line at the fastest speed that cures it.</p>
          <table className="mt-2 w-full text-sm">
            <thead>
              <tr className="border-b border-plate-line text-left text-ink-soft">
                <th scope="col" className="py-1 pr-3 font-medium">Line</th>
                <th scope="col" className="py-1 pr-3 text-right font-medium">Parts per hour</th>
                <th scope="col" className="py-1 pr-3 text-right font-medium">Cost per part</th>
                <th scope="col" className="py-1 font-medium">What limits it</th>
              </tr>
            </thead>
            <tbody>
              {data.rows.map((r) => (
                <tr key={r.lineId} className="border-b border-plate-line/60 align-top">
                  <td className="py-1.5 pr-3">{r.lineName}</td>
                  <td className="num py-1.5 pr-3 text-right">{sig(r.partsPerHour, 4)}</td>
                  <td className="num py-1.5 pr-3 text-right">{r.costPerPart === null ? "–" : money(r.costPerPart, data.currency)}</td>
                  <td className={`py-1.5 text-xs ${r.cures ? "text-ink-soft" : "text-oxide"}`}>{r.limit}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </>
      )}
    </section>
  );
}
