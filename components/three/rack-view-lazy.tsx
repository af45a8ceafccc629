"use client";
import { browserOnly } from "@/components/ui/browser-only";
import type { RackViewProps } from "./rack-view";

/** The 3D rack view, fetched in the browser only: three.js stays out of every other page. */
export const RackViewLazy = browserOnly<RackViewProps>(
  () => import("./rack-view").then((m) => m.RackView),
  <div role="status" className="flex h-[26rem] items-center justify-center rounded-lg border border-plate-line bg-white text-sm text-ink-faint">
    Loading the 3D view…
  </div>,
);
