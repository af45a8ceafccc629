"use client";
// The gauges screen loads after the page's first paint, like the film-check screen.

import { browserOnly } from "@/components/ui/browser-only";
import type { GaugesScreen } from "./gauges-screen";

export const GaugesScreenLazy = browserOnly<Parameters<typeof GaugesScreen>[0]>(
  () => import("./gauges-screen").then((m) => m.GaugesScreen),
  <p role="status" className="card text-sm text-ink-soft">
    Loading gauges…
  </p>,
);
