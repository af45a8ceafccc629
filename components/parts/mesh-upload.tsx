"use client";
// Upload an STL with a real progress bar (XMLHttpRequest reports bytes sent), then show what the
// server measured. When the size suggests the other unit, the engineer confirms or switches it.

import { useEffect, useId, useRef, useState } from "react";
import type { MeshView } from "@/lib/server/meshes";
import { PartPreviewLazy } from "@/components/three/part-preview-lazy";
import { showArea, showBox, showBytes, showVolume, type UnitSystem } from "./part-units";

interface Props {
  unitSystem: UnitSystem;
  maxBytes: number;
  mesh: MeshView | null;
  /** a new mesh (or null when cleared); `confirmed` is false while the unit still needs a look */
  onMesh: (mesh: MeshView | null, confirmed: boolean) => void;
  error?: string;
}

type Upload = { state: "idle" } | { state: "sending"; sent: number; total: number } | { state: "measuring" } | { state: "failed"; message: string };

function apiMessage(status: number, text: string): string {
  try {
    const body = JSON.parse(text) as { error?: { message?: string } };
    if (body.error?.message) return body.error.message;
  } catch {
    /* not JSON */
  }
  return `The upload failed (${status}).`;
}

export function MeshUpload({ unitSystem, maxBytes, mesh, onMesh, error }: Props) {
  const id = useId();
  const [file, setFile] = useState<File | null>(null);
  const [unit, setUnit] = useState<"mm" | "in">(unitSystem === "us" ? "in" : "mm");
  const [upload, setUpload] = useState<Upload>({ state: "idle" });
  const [confirmed, setConfirmed] = useState(true);
  const [switching, setSwitching] = useState(false);
  const xhr = useRef<XMLHttpRequest | null>(null);
  useEffect(() => () => xhr.current?.abort(), []);

  function start() {
    if (!file) return;
    if (file.size > maxBytes) {
      setUpload({ state: "failed", message: `The file is ${showBytes(file.size)}; at most ${showBytes(maxBytes)} can be uploaded.` });
      return;
    }
    const form = new FormData();
    // The unit goes first so the server measures in it as the bytes arrive.
    form.append("unit", unit);
    form.append("file", file);
    const req = new XMLHttpRequest();
    xhr.current = req;
    req.open("POST", "/api/meshes");
    req.setRequestHeader("accept", "application/json");
    req.upload.onprogress = (e) => setUpload({ state: "sending", sent: e.loaded, total: e.lengthComputable ? e.total : file.size });
    req.upload.onload = () => setUpload({ state: "measuring" });
    req.onload = () => {
      xhr.current = null;
      if (req.status === 201) {
        const m = JSON.parse(req.responseText) as MeshView;
        setUpload({ state: "idle" });
        setConfirmed(m.unitHint === null);
        onMesh(m, m.unitHint === null);
      } else {
        setUpload({ state: "failed", message: apiMessage(req.status, req.responseText) });
      }
    };
    req.onerror = () => {
      xhr.current = null;
      setUpload({ state: "failed", message: "The upload stopped: the connection to the server was lost. Try again." });
    };
    req.onabort = () => setUpload({ state: "idle" });
    setUpload({ state: "sending", sent: 0, total: file.size });
    req.send(form);
  }

  async function switchUnit() {
    if (!mesh) return;
    setSwitching(true);
    try {
      const res = await fetch(`/api/meshes/${mesh.id}`, {
        method: "PATCH",
        headers: { "content-type": "application/json", accept: "application/json" },
        body: JSON.stringify({ unit: mesh.unit === "mm" ? "in" : "mm" }),
      });
      const text = await res.text();
      if (!res.ok) throw new Error(apiMessage(res.status, text));
      const m = JSON.parse(text) as MeshView;
      setUnit(m.unit);
      setConfirmed(true);
      onMesh(m, true);
    } catch (e) {
      setUpload({ state: "failed", message: (e as Error).message });
    } finally {
      setSwitching(false);
    }
  }

  const busy = upload.state === "sending" || upload.state === "measuring";
  const unitWord = (u: "mm" | "in") => (u === "mm" ? "millimetres" : "inches");

  return (
    <div className="space-y-3">
      <div className="grid gap-3 sm:grid-cols-[minmax(0,1fr)_auto] sm:items-end">
        <div>
          <label htmlFor={`${id}-file`} className="label">STL file (binary or text)</label>
          <input
            id={`${id}-file`}
            type="file"
            accept=".stl,model/stl,application/sla"
            className="field"
            disabled={busy}
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? `${id}-err` : `${id}-hint`}
            onChange={(e) => {
              setFile(e.target.files?.[0] ?? null);
              setUpload({ state: "idle" });
            }}
          />
          <p id={`${id}-hint`} className="mt-1 text-xs text-ink-faint">At most {showBytes(maxBytes)}. The area, volume and size are measured on the server.</p>
          {error && <p id={`${id}-err`} className="field-error">{error}</p>}
        </div>
        <fieldset>
          <legend className="label">Drawn in</legend>
          <div className="flex gap-3 pb-1.5 text-sm">
            {(["mm", "in"] as const).map((u) => (
              <label key={u} className="flex items-center gap-1.5">
                <input type="radio" name={`${id}-unit`} value={u} checked={unit === u} disabled={busy} onChange={() => setUnit(u)} />
                {unitWord(u)}
              </label>
            ))}
          </div>
        </fieldset>
      </div>
      <div className="flex flex-wrap items-center gap-2">
        <button type="button" className="btn-primary" disabled={!file || busy} onClick={start}>
          {mesh ? "Upload another file" : "Upload and measure"}
        </button>
        {busy && (
          <button type="button" className="btn-quiet" onClick={() => xhr.current?.abort()}>
            Cancel upload
          </button>
        )}
      </div>

      {upload.state === "sending" && (
        <div className="space-y-1" role="status" aria-live="polite">
          <progress
            className="h-3 w-full overflow-hidden rounded bg-plate-sunk accent-phosphate"
            max={upload.total || 1}
            value={upload.sent}
            aria-label="Upload progress"
            data-testid="upload-progress"
          />
          <p className="num text-xs text-ink-soft">
            Sending {showBytes(upload.sent)} of {showBytes(upload.total)} ({Math.round((100 * upload.sent) / (upload.total || 1))} %)
          </p>
        </div>
      )}
      {upload.state === "measuring" && (
        <p role="status" className="text-sm text-ink-soft" data-testid="upload-measuring">
          <progress className="mr-2 h-3 w-40 align-middle accent-phosphate" aria-label="Upload progress" max={1} value={1} data-testid="upload-progress" />
          Sent; measuring…
        </p>
      )}
      {upload.state === "failed" && (
        <p role="alert" className="rounded-md border border-oxide bg-oxide-light p-3 text-sm text-ink" data-testid="upload-error">
          {upload.message}
        </p>
      )}

      {mesh && (
        <div className="space-y-3" data-testid="mesh-result">
          <dl className="grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-3">
            <div>
              <dt className="text-ink-soft">File</dt>
              <dd className="break-all">{mesh.fileName} ({mesh.format}, {showBytes(mesh.sizeBytes)})</dd>
            </div>
            <div>
              <dt className="text-ink-soft">Triangles</dt>
              <dd className="num">{mesh.triangleCount.toLocaleString("en-US")}</dd>
            </div>
            <div>
              <dt className="text-ink-soft">Surface area (all faces)</dt>
              <dd className="num font-semibold" data-testid="mesh-area">{showArea(mesh.areaM2, unitSystem)}</dd>
            </div>
            <div>
              <dt className="text-ink-soft">Volume</dt>
              <dd className="num font-semibold" data-testid="mesh-volume">{mesh.closed ? showVolume(mesh.volumeM3, unitSystem) : "— (mesh not closed)"}</dd>
            </div>
            <div className="col-span-2">
              <dt className="text-ink-soft">Bounding box (x × y × z)</dt>
              <dd className="num font-semibold" data-testid="mesh-box">{showBox(mesh.bboxMm.x, mesh.bboxMm.y, mesh.bboxMm.z, unitSystem)}</dd>
            </div>
          </dl>
          {!mesh.closed && (
            <p className="rounded-md border border-caution-edge bg-caution-light p-3 text-sm">
              The mesh is not closed (some edges belong to one triangle only), so its volume means nothing. The area is still measured; the mass is
              estimated from the surface and the section thickness unless you enter it.
            </p>
          )}
          {mesh.unitHint && !confirmed && (
            <div className="rounded-md border border-caution-edge bg-caution-light p-3 text-sm" role="alert" data-testid="unit-check">
              <p className="font-semibold">Check the unit</p>
              <p className="mt-1">{mesh.unitHint}</p>
              <div className="mt-2 flex flex-wrap gap-2">
                <button type="button" className="btn-primary" disabled={switching} onClick={switchUnit}>
                  It was drawn in {unitWord(mesh.unit === "mm" ? "in" : "mm")}
                </button>
                <button
                  type="button"
                  className="btn-quiet"
                  disabled={switching}
                  onClick={() => {
                    setConfirmed(true);
                    onMesh(mesh, true);
                  }}
                >
                  Keep {unitWord(mesh.unit)}
                </button>
              </div>
            </div>
          )}
          <PartPreviewLazy
            key={`${mesh.id}-${mesh.unit}`}
            meshId={mesh.id}
            unit={mesh.unit}
            unitSystem={unitSystem}
            bboxMm={mesh.bboxMm}
            sizeBytes={mesh.sizeBytes}
            triangleCount={mesh.triangleCount}
          />
        </div>
      )}
    </div>
  );
}
