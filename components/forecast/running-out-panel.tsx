"use client";
import Link from "next/link";
import useSWR from "swr";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { formatQuantity } from "@/lib/coating-math/display-units";
import type { ForecastView } from "@/lib/server/forecast";

/** Home panel (purchaser): coatings the next four weeks' plan runs out of, or whose lots expire unused. */
export function RunningOutPanel({ unitSystem }: { unitSystem: UnitSystem }) {
  const { data, error, isLoading } = useSWR<{ forecast: ForecastView }>("/api/forecast?horizonDays=28");
  const items = (data?.forecast.coatings ?? []).filter((c) => c.stockOutDate || c.expiringLots.length || c.orderContainers > 0);
  return (
    <section className="card" aria-labelledby="running-out-h">
      <h2 id="running-out-h">Running out or expiring in the next 4 weeks</h2>
      {isLoading ? (
        <p role="status" className="text-sm text-ink-soft">Working out the forecast…</p>
      ) : error ? (
        <p role="alert" className="text-sm text-oxide">Could not load the forecast.</p>
      ) : !items.length ? (
        <p className="text-sm text-ink-soft">The plan is covered by stock and open orders.</p>
      ) : (
        <ul className="mt-2 space-y-1 text-sm">
          {items.map((c) => (
            <li key={c.coatingId}>
              <span className="font-medium">{c.code}</span>{" "}
              {c.stockOutDate ? <span className="text-oxide">runs out {c.stockOutDate}</span> : "below reorder point"}
              {c.orderContainers > 0 && <> · order {c.orderContainers} × {formatQuantity("massKg", c.containerKg, unitSystem, 4)} by {c.latestOrderDate}{c.orderLate ? " (late)" : ""}</>}
              {c.expiringLots.map((l) => <span key={l.lotNumber} className="text-caution"> · lot {l.lotNumber} expires {l.expiryDate} with {formatQuantity("massKg", l.wastedKg, unitSystem, 3)}</span>)}
            </li>
          ))}
        </ul>
      )}
      <Link className="mt-2 inline-block text-sm text-phosphate-dark underline" href="/forecast">Forecast</Link>
    </section>
  );
}
