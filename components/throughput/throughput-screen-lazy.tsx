"use client";
// The comparison screen is fetched after the page's first paint (its data comes from the API
// anyway), so the page's first-load JavaScript stays within the budget; Recharts loads later still.

import { browserOnly } from "@/components/ui/browser-only";

export const ThroughputScreenLazy = browserOnly(
  () => import("./throughput-screen").then((m) => m.ThroughputScreen),
  <p role="status" className="card text-sm text-ink-soft">Loading the comparison…</p>,
);
