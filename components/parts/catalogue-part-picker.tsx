"use client";
// "Take the part from the catalogue" on the racking page: fills the part box (mesh x → length,
// y → width, z → height, as stored) and mass, and hands over the part's mesh for the 3D rack
// view once it is loaded. ?part=<id> in the address preselects a part (the part page links so).

import { useEffect, useRef, useState } from "react";
import { useSearchParams } from "next/navigation";
import useSWR from "swr";
import type { PartsList } from "@/app/api/parts/route";
import type { MeshView } from "@/lib/server/meshes";
import type { PartView } from "@/lib/server/parts";
import { loadPartMesh } from "./load-part-mesh";

interface Props {
  onPick: (part: PartView | null) => void;
  onMesh: (positions: Float32Array | null) => void;
}

export function CataloguePartPicker({ onPick, onMesh }: Props) {
  const params = useSearchParams();
  const { data, error } = useSWR<PartsList>("/api/parts", { shouldRetryOnError: false });
  const [pickedId, setPickedId] = useState("");
  const [meshState, setMeshState] = useState<"none" | "loading" | "ready" | "failed">("none");
  const abort = useRef<AbortController | null>(null);
  const preselected = useRef(false);
  const parts = data?.parts ?? [];

  function pick(id: string) {
    setPickedId(id);
    abort.current?.abort();
    const part = parts.find((p) => p.id === id) ?? null;
    onPick(part);
    onMesh(null);
    if (!part?.meshId) {
      setMeshState("none");
      return;
    }
    const controller = new AbortController();
    abort.current = controller;
    setMeshState("loading");
    fetch(`/api/meshes/${part.meshId}`, { signal: controller.signal, headers: { accept: "application/json" } })
      .then((r) => (r.ok ? (r.json() as Promise<MeshView>) : Promise.reject(new Error(String(r.status)))))
      .then((mesh) => loadPartMesh(mesh.id, mesh.unit, controller.signal))
      .then((positions) => {
        onMesh(positions);
        setMeshState("ready");
      })
      .catch(() => {
        if (!controller.signal.aborted) setMeshState("failed");
      });
  }

  useEffect(() => {
    const wanted = params.get("part");
    if (preselected.current || !wanted || !data) return;
    preselected.current = true;
    if (data.parts.some((p) => p.id === wanted)) pick(wanted);
    // pick() reads the list this effect waited for; it runs once per page
  }, [data, params]);
  useEffect(() => () => abort.current?.abort(), []);

  if (error || (data && parts.length === 0)) return null;
  return (
    <div>
      <label htmlFor="catalogue-part" className="label">Take the part from the catalogue</label>
      <select id="catalogue-part" className="field" value={pickedId} onChange={(e) => pick(e.target.value)} disabled={!data}>
        <option value="">{data ? "— type the part below —" : "Loading parts…"}</option>
        {parts.map((p) => (
          <option key={p.id} value={p.id}>
            {p.number} · {p.name}
          </option>
        ))}
      </select>
      {meshState === "loading" && <p role="status" className="mt-1 text-xs text-ink-faint">Loading the part&apos;s 3D model…</p>}
      {meshState === "ready" && <p className="mt-1 text-xs text-ink-faint">The 3D view draws the part&apos;s own shape while the box matches it.</p>}
      {meshState === "failed" && <p className="mt-1 text-xs text-oxide">The part&apos;s 3D model could not be loaded; the view shows boxes.</p>}
    </div>
  );
}
