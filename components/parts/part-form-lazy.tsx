"use client";
// The part form's code (~7 kB gzip) is a chunk of its own, fetched in the browser once the page
// has hydrated; that keeps the create and edit pages' first-load JavaScript within the budget
// (tests/e2e/budget.test.ts). It renders in the browser only: a form rendered on the server but
// hydrated from a late chunk would drop the clicks made before the chunk arrived.

import { browserOnly } from "@/components/ui/browser-only";

export const PartFormLazy = browserOnly(
  () => import("./part-form").then((m) => m.PartForm),
  <p role="status" className="card text-sm text-ink-soft">Loading the form…</p>,
);
