"use client";
// The parts catalogue: search, material and origin filters, sortable columns; each row opens the
// part. No three.js here: the 3D preview lives on the part page.

import Link from "next/link";
import { useMemo, useState } from "react";
import useSWR from "swr";
import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type FilterFn,
  type SortingState,
} from "@tanstack/react-table";
import type { PartsList } from "@/app/api/parts/route";
import type { PartView } from "@/lib/server/parts";
import type { AreaOrigin, PartMaterial } from "@/lib/validation/parts";
import { AREA_ORIGIN_LABELS, MATERIAL_LABELS } from "./part-labels";
import { showArea, showBox, showMass, type UnitSystem } from "./part-units";

const search: FilterFn<PartView> = (row, _column, value: string) => {
  const needle = value.trim().toLowerCase();
  if (!needle) return true;
  const p = row.original;
  return [p.number, p.name, p.customer, p.notes].some((s) => s.toLowerCase().includes(needle));
};

export function PartsTable({ unitSystem, canEdit }: { unitSystem: UnitSystem; canEdit: boolean }) {
  const [q, setQ] = useState("");
  const [material, setMaterial] = useState<"" | PartMaterial>("");
  const [origin, setOrigin] = useState<"" | AreaOrigin>("");
  const [archived, setArchived] = useState(false);
  const [sorting, setSorting] = useState<SortingState>([{ id: "number", desc: false }]);
  const { data, error, isLoading } = useSWR<PartsList>(archived ? "/api/parts?archived=1" : "/api/parts");

  const rows = useMemo(
    () => (data?.parts ?? []).filter((p) => (!material || p.material === material) && (!origin || p.areaOrigin === origin)),
    [data, material, origin],
  );

  const columns = useMemo<ColumnDef<PartView>[]>(
    () => [
      {
        id: "number",
        accessorKey: "number",
        header: "Number",
        cell: ({ row }) => (
          <span className="whitespace-nowrap font-medium">
            <Link className="text-phosphate-dark underline-offset-2 hover:underline" href={`/parts/${row.original.id}`}>
              {row.original.number}
            </Link>
            {row.original.archived && <span className="ml-2 text-xs font-normal text-ink-faint">archived</span>}
          </span>
        ),
      },
      { id: "name", accessorKey: "name", header: "Name" },
      { id: "customer", accessorKey: "customer", header: "Customer", cell: ({ getValue }) => (getValue<string>() || "—") },
      { id: "material", accessorFn: (p) => MATERIAL_LABELS[p.material], header: "Material" },
      {
        id: "coatedArea",
        accessorKey: "coatedAreaM2",
        header: "Coated area",
        sortingFn: "basic",
        cell: ({ row }) => (
          <span className="num whitespace-nowrap">
            {showArea(row.original.coatedAreaM2, unitSystem)}
            {row.original.insideAreaM2 > 0 && (
              <span className="block text-xs text-ink-soft">+ {showArea(row.original.insideAreaM2, unitSystem, 3)} inside</span>
            )}
          </span>
        ),
      },
      {
        id: "mass",
        accessorKey: "massKg",
        header: "Mass",
        sortingFn: "basic",
        cell: ({ row }) => <span className="num whitespace-nowrap">{showMass(row.original.massKg, unitSystem, 3)}</span>,
      },
      {
        id: "box",
        accessorFn: (p) => Math.max(p.lengthMm, p.widthMm, p.heightMm),
        header: "Size (L × W × H)",
        sortingFn: "basic",
        cell: ({ row }) => (
          <span className="num whitespace-nowrap">{showBox(row.original.lengthMm, row.original.widthMm, row.original.heightMm, unitSystem)}</span>
        ),
      },
      { id: "origin", accessorFn: (p) => AREA_ORIGIN_LABELS[p.areaOrigin], header: "Area from" },
    ],
    [unitSystem],
  );

  const table = useReactTable({
    data: rows,
    columns,
    state: { sorting, globalFilter: q },
    onSortingChange: setSorting,
    onGlobalFilterChange: setQ,
    globalFilterFn: search,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });
  const shown = table.getRowModel().rows;

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
              {table.getHeaderGroups().map((hg) => (
                <tr key={hg.id} className="border-b border-plate-line">
                  {hg.headers.map((h) => {
                    const sorted = h.column.getIsSorted();
                    return (
                      <th key={h.id} scope="col" className="py-2 pr-3 font-medium" aria-sort={sorted ? (sorted === "desc" ? "descending" : "ascending") : undefined}>
                        <button type="button" className="flex items-center gap-1" onClick={h.column.getToggleSortingHandler()}>
                          {flexRender(h.column.columnDef.header, h.getContext())}
                          <span aria-hidden>{sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}</span>
                        </button>
                      </th>
                    );
                  })}
                </tr>
              ))}
            </thead>
            <tbody>
              {shown.map((row) => (
                <tr key={row.id} className="border-b border-plate-line/60 align-top" data-number={row.original.number}>
                  {row.getVisibleCells().map((cell) => (
                    <td key={cell.id} className="py-2 pr-3">{flexRender(cell.column.columnDef.cell, cell.getContext())}</td>
                  ))}
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
