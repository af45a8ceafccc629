"use client";
import { useState } from "react";
import { browserOnly } from "@/components/ui/browser-only";
import type { UnitSystem } from "@/lib/coating-math/display-units";

// Each calculator is a chunk of its own, fetched in the browser once this page has hydrated, so
// the page's first-load JavaScript is the unit switch and the section links. They render in the
// browser only: a calculator hydrated from a late chunk would drop what was typed before it came.
const loading = (label: string) => <p role="status" className="card text-sm text-ink-soft">Loading the {label} calculator…</p>;
const PowderCalculator = browserOnly(() => import("./powder-calculator").then((m) => m.PowderCalculator), loading("powder"));
const EcoatCalculator = browserOnly(() => import("./ecoat-calculator").then((m) => m.EcoatCalculator), loading("e-coat"));
const LineCalculator = browserOnly(() => import("./line-calculator").then((m) => m.LineCalculator), loading("line"));
const CureCalculator = browserOnly(() => import("./cure-calculator").then((m) => m.CureCalculator), loading("cure"));
const FilmCalculator = browserOnly(() => import("./film-calculator").then((m) => m.FilmCalculator), loading("film"));

const sections = [
  { id: "powder", label: "Powder use" },
  { id: "ecoat", label: "E-coat" },
  { id: "line", label: "Line throughput" },
  { id: "cure", label: "Cure and heat-up" },
  { id: "film", label: "Film acceptance" },
];

/**
 * The calculators page. Everything runs in the browser with the same code and input rules as
 * POST /api/calc/*; the unit switch here changes this page only (the header's switch changes
 * the account's preference, and this page follows it when it does).
 */
export function Calculators({ initialSystem, currency }: { initialSystem: UnitSystem; currency: string }) {
  const [system, setSystem] = useState(initialSystem);
  const [fromAccount, setFromAccount] = useState(initialSystem);
  if (fromAccount !== initialSystem) {
    setFromAccount(initialSystem);
    setSystem(initialSystem);
  }
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <nav aria-label="Calculators on this page" className="text-sm">
          <ul className="flex flex-wrap gap-x-4 gap-y-1">
            {sections.map((s) => (
              <li key={s.id}>
                <a className="text-phosphate underline-offset-2 hover:underline" href={`#${s.id}`}>{s.label}</a>
              </li>
            ))}
          </ul>
        </nav>
        <fieldset className="flex items-center gap-1 rounded-md border border-plate-line bg-plate-raised p-1 text-sm">
          <legend className="sr-only">Units on this page</legend>
          {(["metric", "us"] as const).map((s) => (
            <label
              key={s}
              className={`cursor-pointer rounded px-3 py-1 has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-phosphate ${system === s ? "bg-phosphate text-white" : "text-ink-soft hover:bg-plate-sunk"}`}
            >
              <input type="radio" name="calc-units" value={s} className="sr-only" checked={system === s} onChange={() => setSystem(s)} />
              {s === "metric" ? "Metric" : "US customary"}
            </label>
          ))}
        </fieldset>
      </div>
      <PowderCalculator system={system} currency={currency} />
      <EcoatCalculator system={system} />
      <LineCalculator system={system} />
      <CureCalculator system={system} />
      <FilmCalculator system={system} />
    </div>
  );
}
