"use client";
// The parts catalogue: search, material and origin filters, sortable columns; each row opens the
// part. No three.js here: the 3D preview lives on the part page.

import Link from "next/link";
import { useMemo, useState } from "react";
import useSWR from "swr";
import { SortHeader, sortRows, type SortState } from "@/components/ui/sort-header";
import type { PartsList } from "@/app/api/parts/route";
import type { PartView } from "@/lib/server/parts";
import type { AreaOrigin, PartMaterial } from "@/lib/parts/part-fields";
import { AREA_ORIGIN_LABELS, MATERIAL_LABELS } from "./part-labels";
import { showArea, showBox, showMass, type UnitSystem } from "./part-units";

type Column = "number" | "name" | "customer" | "material" | "coatedArea" | "mass" | "box" | "origin";

/** Search over number, name, customer and notes. */
function matches(p: PartView, query: string): boolean {
  const needle = query.trim().toLowerCase();
  if (!needle) return true;
  return [p.number, p.name, p.customer, p.notes].some((s) => s.toLowerCase().includes(needle));
}

function sortValue(p: PartView, column: Column): string | number {
  switch (column) {
    case "material":
      return MATERIAL_LABELS[p.material];
    case "coatedArea":
      return p.coatedAreaM2;
    case "mass":
      return p.massKg;
    case "box":
      return Math.max(p.lengthMm, p.widthMm, p.heightMm);
    case "origin":
      return AREA_ORIGIN_LABELS[p.areaOrigin];
    default:
      return p[column];
  }
}

export function PartsTable({ unitSystem, canEdit }: { unitSystem: UnitSystem; canEdit: boolean }) {
  const [q, setQ] = useState("");
  const [material, setMaterial] = useState<"" | PartMaterial>("");
  const [origin, setOrigin] = useState<"" | AreaOrigin>("");
  const [archived, setArchived] = useState(false);
  const [sort, setSort] = useState<SortState<Column>>({ key: "number", desc: false });
  const { data, error, isLoading } = useSWR<PartsList>(archived ? "/api/parts?archived=1" : "/api/parts");

  const shown = useMemo(
    () =>
      sortRows(
        (data?.parts ?? []).filter((p) => (!material || p.material === material) && (!origin || p.areaOrigin === origin) && matches(p, q)),
        sort,
        sortValue,
      ),
    [data, material, origin, q, sort],
  );
  const header = (column: Column, label: string, numeric = false) => (
    <SortHeader label={label} column={column} sort={sort} onSort={setSort} numeric={numeric} />
  );

  return (
    <div className="space-y-4">
      <div className="card flex flex-wrap items-end gap-3" role="search">
        <div className="min-w-64 grow">
          <label htmlFor="part-search" className="label">Search</label>
          <input id="part-search" className="field" type="search" placeholder="Number, name, customer or notes" value={q} onChange={(e) => setQ(e.target.value)} />
        </div>
        <div>
          <label htmlFor="part-material" className="label">Material</label>
          <select id="part-material" className="field" value={material} onChange={(e) => setMaterial(e.target.value as typeof material)}>
            <option value="">All materials</option>
            {(Object.keys(MATERIAL_LABELS) as PartMaterial[]).map((m) => (
              <option key={m} value={m}>{MATERIAL_LABELS[m]}</option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="part-origin" className="label">Area from</label>
          <select id="part-origin" className="field" value={origin} onChange={(e) => setOrigin(e.target.value as typeof origin)}>
            <option value="">Any source</option>
            {(Object.keys(AREA_ORIGIN_LABELS) as AreaOrigin[]).map((o) => (
              <option key={o} value={o}>{AREA_ORIGIN_LABELS[o]}</option>
            ))}
          </select>
        </div>
        <label className="flex items-center gap-2 pb-1.5 text-sm">
          <input type="checkbox" checked={archived} onChange={(e) => setArchived(e.target.checked)} /> Show archived
        </label>
        <div className="ml-auto flex flex-wrap gap-2">
          <a className="btn-quiet" href={archived ? "/api/parts/export.csv?archived=1" : "/api/parts/export.csv"} download>
            Export CSV
          </a>
          {canEdit && (
            <>
              <Link href="/parts/import" className="btn-quiet">Import CSV</Link>
              <Link href="/parts/new" className="btn-primary">Create part</Link>
            </>
          )}
        </div>
      </div>

      <section className="card overflow-x-auto" aria-label="Parts">
        {isLoading ? (
          <p role="status">Loading parts…</p>
        ) : error ? (
          <p role="alert" className="text-oxide">Could not load the parts: {error.message}</p>
        ) : shown.length === 0 ? (
          <p className="text-ink-soft">
            {data?.parts.length ? "No part matches these filters." : canEdit ? "The catalogue is empty. Create the first part or import a CSV list." : "The catalogue is empty. An engineer adds the parts."}
          </p>
        ) : (
          <table className="w-full text-left text-sm" data-testid="parts-table">
            <thead>
              <tr className="border-b border-plate-line">
                {header("number", "Number")}
                {header("name", "Name")}
                {header("customer", "Customer")}
                {header("material", "Material")}
                {header("coatedArea", "Coated area", true)}
                {header("mass", "Mass", true)}
                {header("box", "Size (L × W × H)", true)}
                {header("origin", "Area from")}
              </tr>
            </thead>
            <tbody>
              {shown.map((p) => (
                <tr key={p.id} className="border-b border-plate-line/60 align-top" data-number={p.number}>
                  <td className="py-2 pr-3">
                    <span className="whitespace-nowrap font-medium">
                      <Link className="text-phosphate-dark underline-offset-2 hover:underline" href={`/parts/${p.id}`}>
                        {p.number}
                      </Link>
                      {p.archived && <span className="ml-2 text-xs font-normal text-ink-faint">archived</span>}
                    </span>
                  </td>
                  <td className="py-2 pr-3">{p.name}</td>
                  <td className="py-2 pr-3">{p.customer || "—"}</td>
                  <td className="py-2 pr-3">{MATERIAL_LABELS[p.material]}</td>
                  <td className="py-2 pr-3">
                    <span className="num whitespace-nowrap">
                      {showArea(p.coatedAreaM2, unitSystem)}
                      {p.insideAreaM2 > 0 && <span className="block text-xs text-ink-soft">+ {showArea(p.insideAreaM2, unitSystem, 3)} inside</span>}
                    </span>
                  </td>
                  <td className="py-2 pr-3">
                    <span className="num whitespace-nowrap">{showMass(p.massKg, unitSystem, 3)}</span>
                  </td>
                  <td className="py-2 pr-3">
                    <span className="num whitespace-nowrap">{showBox(p.lengthMm, p.widthMm, p.heightMm, unitSystem)}</span>
                  </td>
                  <td className="py-2 pr-3">{AREA_ORIGIN_LABELS[p.areaOrigin]}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
      <p className="text-xs text-ink-faint">
        Coated area is the outside area less masking. The inside of tubes and boxes is listed apart: e-coat reaches it, powder mostly does not.
      </p>
    </div>
  );
}
