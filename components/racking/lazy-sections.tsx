"use client";
// The racking page's sections that wait for data anyway (the catalogue, saved plans) or sit below
// the fold, fetched after hydration so that the planner itself stays within the first-load budget
// (DEVELOPERS.md, "Performance budget").

import { browserOnly } from "@/components/ui/browser-only";
import type { ComponentProps } from "react";
import type { CataloguePartPicker } from "@/components/parts/catalogue-part-picker";
import type { PerLine } from "./per-line";
import type { PlanResult } from "./plan-result";
import type { RackPlanList } from "./rack-plan-list";
import type { SavedPlanPanel } from "./saved-plan-panel";
import type { SavedPlansList } from "./saved-plans-list";

const loading = (what: string) => (
  <p role="status" className="card text-sm text-ink-faint">
    Loading {what}…
  </p>
);

export const SavedPlansListLazy = browserOnly<ComponentProps<typeof SavedPlansList>>(
  () => import("./saved-plans-list").then((m) => m.SavedPlansList),
  loading("saved plans"),
);

export const RackPlanListLazy = browserOnly<ComponentProps<typeof RackPlanList>>(
  () => import("./rack-plan-list").then((m) => m.RackPlanList),
  loading("the plan as a list"),
);

export const PerLineLazy = browserOnly<ComponentProps<typeof PerLine>>(
  () => import("./per-line").then((m) => m.PerLine),
  loading("the per-line figures"),
);

export const SavedPlanPanelLazy = browserOnly<ComponentProps<typeof SavedPlanPanel>>(
  () => import("./saved-plan-panel").then((m) => m.SavedPlanPanel),
  loading("the saved plan"),
);

/** The catalogue's part list arrives after hydration in any case; its picker's code may too. */
export const CataloguePartPickerLazy = browserOnly<ComponentProps<typeof CataloguePartPicker>>(
  () => import("@/components/parts/catalogue-part-picker").then((m) => m.CataloguePartPicker),
  <p role="status" className="text-sm text-ink-faint">
    Loading the parts catalogue…
  </p>,
);

/** The answer arrives from the API after hydration; its card's code comes with it. */
export const PlanResultLazy = browserOnly<ComponentProps<typeof PlanResult>>(
  () => import("./plan-result").then((m) => m.PlanResult),
  <p role="status" className="mt-1 text-sm text-ink-faint">
    Planning…
  </p>,
);
