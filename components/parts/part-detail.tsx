"use client";
// One part: its areas, mass, size and notes in the user's units, the 3D preview when it has a
// mesh (three.js is fetched only then), and edit / archive for engineers.

import Link from "next/link";
import { useState } from "react";
import useSWR from "swr";
import type { PartResult } from "@/app/api/parts/[id]/route";
import { PartPreviewLazy } from "@/components/three/part-preview-lazy";
import { FetchError, sendJson } from "@/lib/fetcher";
import type { TemplateInfo } from "@/lib/server/parts";
import { MASS_ORIGIN_LABELS, MATERIAL_LABELS } from "./part-labels";
import { inputFromView } from "./part-input";
import { showArea, showBox, showBytes, showDensity, showLength, showMass, showVolume, type UnitSystem } from "./part-units";

const ORIGIN_PHRASE = { mesh: "the STL mesh", template: "a shape template", formula: "a formula", manual: "a typed figure" } as const;

interface Props {
  id: string;
  unitSystem: UnitSystem;
  canEdit: boolean;
  templates: TemplateInfo[];
}

export function PartDetail({ id, unitSystem, canEdit, templates }: Props) {
  const url = `/api/parts/${id}`;
  const { data, error, isLoading, mutate } = useSWR<PartResult, FetchError>(url);
  const [confirming, setConfirming] = useState(false);
  const [busy, setBusy] = useState(false);
  const [actionError, setActionError] = useState<string | null>(null);

  if (isLoading) return <p role="status">Loading the part…</p>;
  if (error) {
    return (
      <p role="alert" className="text-oxide">
        {error.status === 404 ? "There is no such part." : `Could not load the part: ${error.message}`}
      </p>
    );
  }
  if (!data) return null;
  const { part, mesh } = data;
  const template = templates.find((t) => t.id === part.templateId);

  async function setArchived(archived: boolean) {
    setBusy(true);
    setActionError(null);
    try {
      const next = archived
        ? await sendJson<{ part: PartResult["part"] }>(url, "DELETE")
        : await sendJson<{ part: PartResult["part"] }>(url, "PUT", inputFromView(part, false));
      await mutate({ part: next.part, mesh }, { revalidate: false });
      setConfirming(false);
    } catch (e) {
      setActionError((e as Error).message);
    } finally {
      setBusy(false);
    }
  }

  const len = (mm: number) => showLength(mm, unitSystem);

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1>
            <span className="num">{part.number}</span> · {part.name}
          </h1>
          <p className="mt-1 text-sm text-ink-soft">
            {part.customer || "No customer"} · {MATERIAL_LABELS[part.material]}
            {part.archived && <span className="ml-2 rounded bg-plate-sunk px-2 py-0.5 text-xs">Archived</span>}
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          <Link className="btn-quiet" href={`/racking?part=${part.id}`}>Plan racking</Link>
          {canEdit && !part.archived && (
            <>
              <Link className="btn-primary" href={`/parts/${part.id}/edit`}>Edit</Link>
              <button type="button" className="btn-quiet" onClick={() => setConfirming(true)} disabled={busy}>Archive</button>
            </>
          )}
          {canEdit && part.archived && (
            <button type="button" className="btn-quiet" onClick={() => setArchived(false)} disabled={busy}>Restore</button>
          )}
        </div>
      </div>

      {confirming && (
        <div role="alertdialog" aria-labelledby="archive-q" className="rounded-md border border-caution-edge bg-caution-light p-3 text-sm">
          <p id="archive-q">
            Archive {part.number}? It leaves the catalogue lists and pickers but stays on record; you can restore it later. Parts are never deleted.
          </p>
          <div className="mt-2 flex gap-2">
            <button type="button" className="btn-danger" onClick={() => setArchived(true)} disabled={busy}>Archive {part.number}</button>
            <button type="button" className="btn-quiet" onClick={() => setConfirming(false)} disabled={busy} autoFocus>Keep it</button>
          </div>
        </div>
      )}
      {actionError && <p role="alert" className="field-error">{actionError}</p>}

      <div className="grid gap-4 lg:grid-cols-3">
        <section className="card" aria-labelledby="area-h">
          <h2 id="area-h">Area</h2>
          <dl className="mt-2 space-y-1.5 text-sm">
            <Row term="Outside area" value={showArea(part.areaM2, unitSystem)} />
            <Row term="Masked" value={`− ${showArea(part.maskedAreaM2, unitSystem, 3)}`} />
            <Row term="Coated area" value={showArea(part.coatedAreaM2, unitSystem)} strong testId="part-coated" />
            <Row term="Inside area (kept apart)" value={showArea(part.insideAreaM2, unitSystem)} />
          </dl>
          <p className="mt-2 text-xs text-ink-soft">
            From {ORIGIN_PHRASE[part.areaOrigin]}
            {template && `: ${template.name.toLowerCase()}, ${template.dimensions.map((d) => `${d.label.toLowerCase()} ${len(part.dimensionsMm?.[d.name] ?? 0)}`).join(", ")}`}
            {part.areaOrigin === "formula" && part.formula && (
              <>
                : <code className="font-mono">{part.formula}</code> with{" "}
                {Object.entries(part.dimensionsMm ?? {}).map(([k, v]) => `${k} = ${len(v)}`).join(", ")}
              </>
            )}
            {part.areaOrigin === "mesh" && mesh && `: ${mesh.fileName}, whose whole surface is ${showArea(mesh.areaM2, unitSystem)}`}.
            The inside of tubes and boxes takes e-coat; powder mostly does not reach it.
          </p>
        </section>
        <section className="card" aria-labelledby="mass-h">
          <h2 id="mass-h">Mass and metal</h2>
          <dl className="mt-2 space-y-1.5 text-sm">
            <Row term="Mass" value={showMass(part.massKg, unitSystem)} strong testId="part-mass" />
            <Row term="Found from" value={MASS_ORIGIN_LABELS[part.massOrigin]} />
            <Row term="Density" value={showDensity(part.densityKgPerM3, unitSystem)} />
            <Row term="Section thickness" value={len(part.thicknessMm)} />
            {mesh?.closed && <Row term="Mesh volume" value={showVolume(mesh.volumeM3, unitSystem)} />}
          </dl>
        </section>
        <section className="card" aria-labelledby="size-h">
          <h2 id="size-h">Size (bounding box)</h2>
          <dl className="mt-2 space-y-1.5 text-sm">
            <Row term="Length (x)" value={len(part.lengthMm)} />
            <Row term="Width (y)" value={len(part.widthMm)} />
            <Row term="Height (z)" value={len(part.heightMm)} />
          </dl>
          <p className="mt-2 text-xs text-ink-soft">Racking counts the part as this box: {showBox(part.lengthMm, part.widthMm, part.heightMm, unitSystem)}.</p>
        </section>
      </div>

      {part.notes && (
        <section className="card" aria-labelledby="notes-h">
          <h2 id="notes-h">Notes</h2>
          <p className="mt-1 whitespace-pre-line text-sm">{part.notes}</p>
        </section>
      )}

      {mesh ? (
        <section className="card space-y-2" aria-labelledby="mesh-h">
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <h2 id="mesh-h">3D model</h2>
            <a className="text-sm text-phosphate-dark underline-offset-2 hover:underline" href={`/api/meshes/${mesh.id}/file`} download={mesh.fileName}>
              Download {mesh.fileName} ({showBytes(mesh.sizeBytes)})
            </a>
          </div>
          <p className="text-xs text-ink-soft">
            {mesh.triangleCount.toLocaleString("en-US")} triangles, drawn in {mesh.unit === "mm" ? "millimetres" : "inches"}, {mesh.closed ? "closed" : "not closed"}.
          </p>
          <PartPreviewLazy meshId={mesh.id} unit={mesh.unit} unitSystem={unitSystem} bboxMm={mesh.bboxMm} sizeBytes={mesh.sizeBytes} triangleCount={mesh.triangleCount} />
        </section>
      ) : (
        <p className="text-sm text-ink-faint">No 3D model is attached to this part.</p>
      )}
    </div>
  );
}

function Row({ term, value, strong, testId }: { term: string; value: string; strong?: boolean; testId?: string }) {
  return (
    <div className="flex items-baseline justify-between gap-3">
      <dt className="text-ink-soft">{term}</dt>
      <dd className={`num text-right ${strong ? "font-semibold" : ""}`} data-testid={testId}>{value}</dd>
    </div>
  );
}
