"use client";
import dynamic from "next/dynamic";
import type { PartPreviewProps } from "./part-preview";

/** The 3D part preview, fetched in the browser only: three.js stays off pages without 3D. */
export const PartPreviewLazy = dynamic<PartPreviewProps>(() => import("./part-preview").then((m) => m.PartPreview), {
  ssr: false,
  loading: () => (
    <div role="status" className="flex h-80 items-center justify-center rounded-lg border border-plate-line bg-white text-sm text-ink-faint">
      Loading the 3D preview…
    </div>
  ),
});
