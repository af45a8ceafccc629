// A stored part as the input PUT /api/parts/[id] takes (for archive/restore from the part page).
import type { PartView } from "@/lib/server/parts";

export function inputFromView(p: PartView, archived: boolean): Record<string, unknown> {
  const body: Record<string, unknown> = {
    number: p.number,
    name: p.name,
    customer: p.customer,
    notes: p.notes,
    material: p.material,
    densityKgPerM3: p.densityKgPerM3,
    thicknessMm: p.thicknessMm,
    areaOrigin: p.areaOrigin,
    maskedAreaM2: p.maskedAreaM2,
    meshId: p.meshId,
    // the stored box; for a template it matches the template's or is the part's own (formed) box
    lengthMm: p.lengthMm,
    widthMm: p.widthMm,
    heightMm: p.heightMm,
    archived,
  };
  if (p.massOrigin === "entered") body.massKg = p.massKg;
  if (p.areaOrigin !== "template") body.insideAreaM2 = p.insideAreaM2;
  if (p.areaOrigin === "template") Object.assign(body, { templateId: p.templateId, dimensionsMm: p.dimensionsMm });
  if (p.areaOrigin === "formula") Object.assign(body, { formula: p.formula, dimensionsMm: p.dimensionsMm });
  if (p.areaOrigin === "manual") body.areaM2 = p.areaM2;
  return body;
}
