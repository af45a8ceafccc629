"use client";
import Link from "next/link";
import { useMemo, useState } from "react";
import useSWR from "swr";
import type { CoatingsList } from "@/app/api/coatings/route";
import type { CoatingView } from "@/lib/server/coatings";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { CHEMISTRY_LABELS } from "@/lib/coatings/chemistries";
import { money, show, unitOf, toShown } from "@/components/lines/unit-draft";
import { StockMarks, Swatch } from "./stock-marks";

type SortKey = "code" | "name" | "stock" | "expiry";

/** The coatings library: search, kind filter, stock marks; each row opens the coating. */
export function CoatingsTable({ unitSystem, currency, canEdit }: { unitSystem: UnitSystem; currency: string; canEdit: boolean }) {
  const [q, setQ] = useState("");
  const [kind, setKind] = useState<"" | "powder" | "e-coat">("");
  const [attention, setAttention] = useState(false);
  const [archived, setArchived] = useState(false);
  const [sort, setSort] = useState<{ key: SortKey; desc: boolean }>({ key: "code", desc: false });
  const { data, error, isLoading } = useSWR<CoatingsList>(archived ? "/api/coatings?archived=1" : "/api/coatings");

  const rows = useMemo(() => {
    const needle = q.trim().toLowerCase();
    const list = (data?.coatings ?? []).filter(
      (c) =>
        (!kind || c.kind === kind) &&
        (!attention || c.lowStock || c.nearExpiry || c.hasExpiredStock) &&
        (!needle || [c.code, c.name, c.colourName, CHEMISTRY_LABELS[c.chemistry], c.supplierName].some((s) => s.toLowerCase().includes(needle))),
    );
    const key = (c: CoatingView): string | number =>
      sort.key === "stock" ? c.usableStockKg : sort.key === "expiry" ? nextExpiry(c) ?? "9999" : sort.key === "name" ? c.name.toLowerCase() : c.code;
    return [...list].sort((a, b) => (key(a) < key(b) ? -1 : key(a) > key(b) ? 1 : 0) * (sort.desc ? -1 : 1));
  }, [data, q, kind, attention, sort]);

  const header = (key: SortKey, label: string) => (
    <th scope="col" className="py-2 pr-3 font-medium" aria-sort={sort.key === key ? (sort.desc ? "descending" : "ascending") : undefined}>
      <button className="flex items-center gap-1" onClick={() => setSort({ key, desc: sort.key === key ? !sort.desc : false })}>
        {label}
        <span aria-hidden>{sort.key === key ? (sort.desc ? "▼" : "▲") : "↕"}</span>
      </button>
    </th>
  );

  return (
    <div className="space-y-4">
      <div className="card flex flex-wrap items-end gap-3" role="search">
        <div className="min-w-64 grow">
          <label htmlFor="coating-search" className="label">Search</label>
          <input id="coating-search" className="field" type="search" placeholder="Code, name, colour, chemistry or supplier" value={q} onChange={(e) => setQ(e.target.value)} />
        </div>
        <div>
          <label htmlFor="coating-kind" className="label">Kind</label>
          <select id="coating-kind" className="field" value={kind} onChange={(e) => setKind(e.target.value as typeof kind)}>
            <option value="">All kinds</option>
            <option value="powder">Powder</option>
            <option value="e-coat">E-coat</option>
          </select>
        </div>
        <label className="flex items-center gap-2 pb-1.5 text-sm">
          <input type="checkbox" checked={attention} onChange={(e) => setAttention(e.target.checked)} /> Needs attention only
        </label>
        <label className="flex items-center gap-2 pb-1.5 text-sm">
          <input type="checkbox" checked={archived} onChange={(e) => setArchived(e.target.checked)} /> Show archived
        </label>
        {canEdit && <Link href="/coatings/new" className="btn-primary ml-auto">New coating</Link>}
      </div>

      <section className="card overflow-x-auto" aria-label="Coatings">
        {isLoading ? (
          <p role="status">Loading coatings…</p>
        ) : error ? (
          <p role="alert" className="text-oxide">Could not load the coatings: {error.message}</p>
        ) : rows.length === 0 ? (
          <p className="text-ink-soft">{data?.coatings.length ? "No coating matches these filters." : "The library is empty. A purchaser adds the first coating."}</p>
        ) : (
          <table className="w-full text-left text-sm">
            <thead>
              <tr className="border-b border-plate-line">
                {header("code", "Code")}
                {header("name", "Name")}
                <th scope="col" className="py-2 pr-3 font-medium">Kind · chemistry</th>
                <th scope="col" className="py-2 pr-3 font-medium">Film</th>
                {header("stock", "Usable stock")}
                {header("expiry", "Next expiry")}
                <th scope="col" className="py-2 pr-3 font-medium">Price</th>
                <th scope="col" className="py-2 pr-3 font-medium">Supplier</th>
              </tr>
            </thead>
            <tbody>
              {rows.map((c) => (
                <tr key={c.id} className="border-b border-plate-line/60 align-top" data-code={c.code}>
                  <td className="py-2 pr-3 font-medium whitespace-nowrap">
                    <Link className="inline-flex items-center gap-2 text-phosphate-dark underline-offset-2 hover:underline" href={`/coatings/${c.id}`}>
                      <Swatch hex={c.swatchHex} label={c.colourName} /> {c.code}
                    </Link>
                    {c.archived && <span className="ml-2 text-xs text-ink-faint">archived</span>}
                  </td>
                  <td className="py-2 pr-3">
                    {c.name}
                    <div className="text-xs text-ink-soft">{c.colourName}</div>
                  </td>
                  <td className="py-2 pr-3">
                    <span>{c.kind === "powder" ? "Powder" : "E-coat"}</span>
                    <div className="text-xs text-ink-soft">{CHEMISTRY_LABELS[c.chemistry]}</div>
                  </td>
                  <td className="num py-2 pr-3 whitespace-nowrap">
                    {fmtRange(toShown("filmUm", c.filmMinUm, unitSystem), toShown("filmUm", c.filmMaxUm, unitSystem))} {unitOf("filmUm", unitSystem)}
                  </td>
                  <td className="num py-2 pr-3">
                    <div className="whitespace-nowrap">{show("massKg", c.usableStockKg, unitSystem, 4)}</div>
                    <StockMarks coating={c} />
                  </td>
                  <td className="num py-2 pr-3 whitespace-nowrap">{nextExpiry(c) ?? "—"}</td>
                  <td className="num py-2 pr-3 whitespace-nowrap">
                    {money(toShown("pricePerKg", c.pricePerKg, unitSystem), currency)}/{unitOf("pricePerKg", unitSystem)}
                  </td>
                  <td className="py-2 pr-3">
                    {c.supplierName}
                    <div className="text-xs text-ink-soft">{c.leadTimeDays} days lead time</div>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
      <p className="text-xs text-ink-faint">
        Low stock: usable stock (lots not yet expired) at or below the coating&apos;s reorder point. Near expiry: a lot with stock expires within 60 days.
      </p>
    </div>
  );
}

function nextExpiry(c: CoatingView): string | null {
  return c.lots.find((l) => l.status === "ok" || l.status === "near-expiry")?.expiryDate ?? null;
}

function fmtRange(a: number, b: number): string {
  const f = (v: number) => String(Number(v.toPrecision(3)));
  return `${f(a)}–${f(b)}`;
}
