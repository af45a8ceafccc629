// Plain words for the catalogue's coded values (kept free of zod so the list page stays light).
import type { AreaOrigin, MassOrigin, PartMaterial } from "@/lib/parts/part-fields";

export const MATERIAL_LABELS: Readonly<Record<PartMaterial, string>> = {
  steel: "Steel",
  stainless: "Stainless steel",
  aluminium: "Aluminium",
  other: "Other",
};

export const AREA_ORIGIN_LABELS: Readonly<Record<AreaOrigin, string>> = {
  mesh: "STL mesh",
  template: "Shape template",
  formula: "Formula",
  manual: "Entered",
};

export const MASS_ORIGIN_LABELS: Readonly<Record<MassOrigin, string>> = {
  volume: "metal volume × density",
  sheet: "thin-wall estimate",
  entered: "entered",
};

