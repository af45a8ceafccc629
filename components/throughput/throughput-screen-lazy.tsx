"use client";
// The comparison screen is fetched after the page's first paint (its data comes from the API
// anyway), so the page's first-load JavaScript stays within the budget; Recharts loads later still.

import dynamic from "next/dynamic";

export const ThroughputScreenLazy = dynamic(() => import("./throughput-screen").then((m) => m.ThroughputScreen), {
  ssr: false,
  loading: () => <p role="status" className="card text-sm text-ink-soft">Loading the comparison…</p>,
});
