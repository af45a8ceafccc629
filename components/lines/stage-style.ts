import type { StageKind } from "@/lib/lines/stages";

/** Fill and text colour of each stage kind on the timeline (the legend names them too). */
export const STAGE_COLOURS: Readonly<Record<StageKind, { fill: string; text: string }>> = {
  clean: { fill: "#7fa7bf", text: "#10232e" },
  rinse: { fill: "#b9d3e1", text: "#10232e" },
  conversion: { fill: "#6f9280", text: "#ffffff" },
  "e-coat": { fill: "#3e4a61", text: "#ffffff" },
  "dry-off": { fill: "#e0b84a", text: "#2b1f00" },
  "powder-booth": { fill: "#1d6b63", text: "#ffffff" },
  "cure-oven": { fill: "#a8461f", text: "#ffffff" },
  cool: { fill: "#cfd2ca", text: "#1e262d" },
};
