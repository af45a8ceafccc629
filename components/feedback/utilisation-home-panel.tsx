"use client";
import Link from "next/link";
import useSWR from "swr";
import type { EstimateView } from "@/lib/server/feedback";

const pct = (u: number | null) => (u === null ? "—" : `${(u * 100).toFixed(0)} %`);

/** Home panel (manager): measured against nominal powder utilisation by line. */
export function UtilisationHomePanel() {
  const { data, error, isLoading } = useSWR<{ estimates: EstimateView[] }>("/api/feedback");
  const items = data?.estimates ?? [];
  return (
    <section className="card" aria-labelledby="util-h">
      <h2 id="util-h">Powder utilisation: measured against nominal</h2>
      {isLoading ? (
        <p role="status" className="text-sm text-ink-soft">Loading…</p>
      ) : error ? (
        <p role="alert" className="text-sm text-oxide">Could not load the estimates.</p>
      ) : !items.length ? (
        <p className="text-sm text-ink-soft">No actual use recorded yet.</p>
      ) : (
        <ul className="mt-2 space-y-1 text-sm">
          {items.map((e) => (
            <li key={`${e.lineId}:${e.coatingId}`}>
              {e.lineName} · {e.code}: measured <span className="num font-medium">{e.measured === null ? `— (${e.runs}/${e.minRuns} runs)` : pct(e.measured)}</span> against nominal <span className="num">{pct(e.nominal)}</span>
            </li>
          ))}
        </ul>
      )}
      <Link className="mt-2 inline-block text-sm text-phosphate-dark underline" href="/feedback">History and estimates</Link>
    </section>
  );
}
