"use client";
// The film-check screen loads after the page's first paint (its data comes from the API anyway),
// so the page's first-load JavaScript stays within the budget.

import { browserOnly } from "@/components/ui/browser-only";
import type { FilmChecksView } from "./film-checks-view";

export const FilmChecksLazy = browserOnly<Parameters<typeof FilmChecksView>[0]>(
  () => import("./film-checks-view").then((m) => m.FilmChecksView),
  <p role="status" className="card text-sm text-ink-soft">
    Loading film checks…
  </p>,
);
