/**
 * Coating chemistries and their display names. Plain constants without zod, so client components
 * can show them without pulling the validation library into the browser; lib/validation/coatings
 * builds its schemas from the same lists.
 */
export const POWDER_CHEMISTRIES = ["polyester", "super-durable-polyester", "epoxy", "hybrid", "polyurethane", "acrylic", "zinc-rich-epoxy"] as const;
export const ECOAT_CHEMISTRIES = ["cathodic-epoxy", "cathodic-acrylic", "anodic-acrylic"] as const;
export const CHEMISTRIES = [...POWDER_CHEMISTRIES, ...ECOAT_CHEMISTRIES] as const;
export type Chemistry = (typeof CHEMISTRIES)[number];

export const CHEMISTRY_LABELS: Readonly<Record<Chemistry, string>> = {
  polyester: "Polyester",
  "super-durable-polyester": "Super-durable polyester",
  epoxy: "Epoxy",
  hybrid: "Hybrid (epoxy-polyester)",
  polyurethane: "Polyurethane",
  acrylic: "Acrylic",
  "zinc-rich-epoxy": "Zinc-rich epoxy primer",
  "cathodic-epoxy": "Cathodic epoxy e-coat",
  "cathodic-acrylic": "Cathodic acrylic e-coat",
  "anodic-acrylic": "Anodic acrylic e-coat",
};
