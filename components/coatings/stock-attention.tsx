"use client";
import Link from "next/link";
import useSWR from "swr";
import type { CoatingsList } from "@/app/api/coatings/route";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { show } from "@/components/lines/unit-draft";
import { StockMarks, Swatch } from "./stock-marks";

/** Home panel: coatings that are low, near expiry or hold an expired lot. */
export function StockAttention({ unitSystem }: { unitSystem: UnitSystem }) {
  const { data, error, isLoading } = useSWR<CoatingsList>("/api/coatings");
  const items = (data?.coatings ?? []).filter((c) => c.lowStock || c.nearExpiry || c.hasExpiredStock);
  return (
    <section className="card" aria-labelledby="stock-attention-h">
      <h2 id="stock-attention-h">Coating stock to look at</h2>
      {isLoading ? (
        <p role="status" className="text-sm text-ink-soft">Loading stock…</p>
      ) : error ? (
        <p role="alert" className="text-sm text-oxide">Could not load the coatings.</p>
      ) : items.length === 0 ? (
        <p className="text-sm text-ink-soft">Every coating is above its reorder point and in date.</p>
      ) : (
        <ul className="mt-2 space-y-1 text-sm">
          {items.map((c) => (
            <li key={c.id} className="flex flex-wrap items-center gap-2">
              <Swatch hex={c.swatchHex} label={c.colourName} />
              <Link className="font-medium text-phosphate-dark underline-offset-2 hover:underline" href={`/coatings/${c.id}`}>{c.code}</Link>
              <span>{c.colourName}</span>
              <span className="num text-ink-soft">{show("massKg", c.usableStockKg, unitSystem, 4)} usable</span>
              <StockMarks coating={c} />
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
