"use client";
import { browserOnly } from "@/components/ui/browser-only";
import type { PartPreviewProps } from "./part-preview";

/** The 3D part preview, fetched in the browser only: three.js stays off pages without 3D. */
export const PartPreviewLazy = browserOnly<PartPreviewProps>(
  () => import("./part-preview").then((m) => m.PartPreview),
  <div role="status" className="flex h-80 items-center justify-center rounded-lg border border-plate-line bg-white text-sm text-ink-faint">
    Loading the 3D preview…
  </div>,
);
