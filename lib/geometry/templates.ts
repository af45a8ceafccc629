/**
 * Dimension templates: common shop shapes whose coated area follows from a few lengths.
 * Corners are sharp (no bend radius) and welds are ignored; every area is of the bare metal.
 * Dimensions are in mm; results are m² and m³.
 */
import { GeometryError } from "./errors";
import { M2_PER_MM2, M3_PER_MM3 } from "./length-units";

export interface TemplateDimension {
  /** key in the dimensions object, e.g. "lengthMm" */
  name: string;
  /** plain label for a form */
  label: string;
  kind: "length";
  unit: "mm";
}

export interface TemplateMeasure {
  /** everything reached from outside, cut ends and edges included */
  outsideAreaM2: number;
  /** the bore or interior (a tube's inside, a box's inside); 0 when there is none */
  insideAreaM2: number;
  /** the part of outsideAreaM2 that is cut ends, plate edges or a rim, shown separately */
  edgeAreaM2: number;
  /** metal volume, for mass */
  volumeM3: number;
  bboxMm: { x: number; y: number; z: number };
}

export interface DimensionTemplate {
  id: string;
  name: string;
  description: string;
  dimensions: readonly TemplateDimension[];
  measure(dimensionsMm: Record<string, number>): TemplateMeasure;
}

const PI = Math.PI;

function dim(name: string, label: string): TemplateDimension {
  return { name, label, kind: "length", unit: "mm" };
}

/** Reads and checks the named dimensions: each must be a positive finite number of mm. */
function read(template: { dimensions: readonly TemplateDimension[] }, values: Record<string, number>): Record<string, number> {
  const out: Record<string, number> = {};
  for (const d of template.dimensions) {
    const v = values[d.name];
    if (typeof v !== "number" || !Number.isFinite(v) || v <= 0) {
      throw new GeometryError("invalid_dimension", `${d.label} must be a positive number of millimetres.`, d.name);
    }
    out[d.name] = v;
  }
  return out;
}

function fmtMm(v: number): string {
  return `${Number(v.toPrecision(6))} mm`;
}

/** Throws unless `small` < `limit` (e.g. a wall thinner than half the width). */
function requireLess(small: number, limit: number, field: string, message: string): void {
  if (!(small < limit)) throw new GeometryError("invalid_dimension", message, field);
}

function result(outsideMm2: number, insideMm2: number, edgeMm2: number, volumeMm3: number, x: number, y: number, z: number): TemplateMeasure {
  return {
    outsideAreaM2: outsideMm2 * M2_PER_MM2,
    insideAreaM2: insideMm2 * M2_PER_MM2,
    edgeAreaM2: edgeMm2 * M2_PER_MM2,
    volumeM3: volumeMm3 * M3_PER_MM3,
    bboxMm: { x, y, z },
  };
}

const flatPlate: DimensionTemplate = {
  id: "flat-plate",
  name: "Flat plate",
  description: "A flat sheet or plate: both faces plus the edges all round.",
  dimensions: [dim("lengthMm", "Length"), dim("widthMm", "Width"), dim("thicknessMm", "Thickness")],
  measure(values) {
    const { lengthMm: L, widthMm: W, thicknessMm: T } = read(this, values);
    // common practice, no source: coated area = 2 x face area + perimeter x thickness
    const edge = 2 * (L + W) * T;
    return result(2 * L * W + edge, 0, edge, L * W * T, L, W, T);
  },
};

const rectangularTube: DimensionTemplate = {
  id: "rectangular-tube",
  name: "Rectangular tube",
  description: "Square or rectangular hollow section: outside walls and the two cut ends; the inside separately.",
  dimensions: [
    dim("lengthMm", "Length"),
    dim("widthMm", "Outside width"),
    dim("heightMm", "Outside height"),
    dim("wallMm", "Wall thickness"),
  ],
  measure(values) {
    const { lengthMm: L, widthMm: W, heightMm: H, wallMm: t } = read(this, values);
    requireLess(2 * t, Math.min(W, H), "wallMm", `The wall (${fmtMm(t)}) must be less than half the smaller outside side (${fmtMm(Math.min(W, H))}).`);
    const wi = W - 2 * t;
    const hi = H - 2 * t;
    const section = W * H - wi * hi;
    const ends = 2 * section;
    return result(2 * (W + H) * L + ends, 2 * (wi + hi) * L, ends, section * L, L, W, H);
  },
};

const roundTube: DimensionTemplate = {
  id: "round-tube",
  name: "Round tube",
  description: "Round tube or pipe: outside surface and the two cut ends; the bore separately (coat it only if the finish reaches inside).",
  dimensions: [dim("lengthMm", "Length"), dim("outsideDiameterMm", "Outside diameter"), dim("wallMm", "Wall thickness")],
  measure(values) {
    const { lengthMm: L, outsideDiameterMm: D, wallMm: t } = read(this, values);
    requireLess(2 * t, D, "wallMm", `The wall (${fmtMm(t)}) must be less than half the outside diameter (${fmtMm(D)}).`);
    const d = D - 2 * t;
    const section = (PI / 4) * (D * D - d * d);
    const ends = 2 * section;
    return result(PI * D * L + ends, PI * d * L, ends, section * L, L, D, D);
  },
};

const roundBar: DimensionTemplate = {
  id: "round-bar",
  name: "Round bar",
  description: "Solid round bar: the cylinder surface and both ends.",
  dimensions: [dim("lengthMm", "Length"), dim("diameterMm", "Diameter")],
  measure(values) {
    const { lengthMm: L, diameterMm: D } = read(this, values);
    const disc = (PI / 4) * D * D;
    return result(PI * D * L + 2 * disc, 0, 2 * disc, disc * L, L, D, D);
  },
};

const angle: DimensionTemplate = {
  id: "angle",
  name: "Angle",
  description: "L-shaped angle of equal thickness: all faces along the length and the two cut ends.",
  dimensions: [
    dim("lengthMm", "Length"),
    dim("legAMm", "First leg (outside)"),
    dim("legBMm", "Second leg (outside)"),
    dim("thicknessMm", "Thickness"),
  ],
  measure(values) {
    const { lengthMm: L, legAMm: A, legBMm: B, thicknessMm: t } = read(this, values);
    requireLess(t, Math.min(A, B), "thicknessMm", `The thickness (${fmtMm(t)}) must be less than the shorter leg (${fmtMm(Math.min(A, B))}).`);
    // Sharp corners: perimeter = A + B + (A - t) + (B - t) + 2t = 2(A + B)
    const perimeter = 2 * (A + B);
    const section = t * (A + B - t);
    return result(perimeter * L + 2 * section, 0, 2 * section, section * L, L, A, B);
  },
};

const channel: DimensionTemplate = {
  id: "channel",
  name: "Channel",
  description: "U or C channel of equal thickness: all faces along the length and the two cut ends.",
  dimensions: [
    dim("lengthMm", "Length"),
    dim("webHeightMm", "Web height (outside)"),
    dim("flangeWidthMm", "Flange width (outside)"),
    dim("thicknessMm", "Thickness"),
  ],
  measure(values) {
    const { lengthMm: L, webHeightMm: H, flangeWidthMm: B, thicknessMm: t } = read(this, values);
    requireLess(2 * t, H, "thicknessMm", `The thickness (${fmtMm(t)}) must be less than half the web height (${fmtMm(H)}).`);
    requireLess(t, B, "thicknessMm", `The thickness (${fmtMm(t)}) must be less than the flange width (${fmtMm(B)}).`);
    // Sharp corners: outer H + 2B, inner (H - 2t) + 2(B - t), two flange tips t each
    const perimeter = 2 * H + 4 * B - 2 * t;
    const section = H * t + 2 * (B - t) * t;
    return result(perimeter * L + 2 * section, 0, 2 * section, section * L, L, B, H);
  },
};

const closedCylinder: DimensionTemplate = {
  id: "closed-cylinder",
  name: "Closed cylinder (drum)",
  description: "A drum or tank closed at both ends: outside shell and ends; the interior separately.",
  dimensions: [dim("diameterMm", "Outside diameter"), dim("heightMm", "Outside height"), dim("wallMm", "Wall thickness")],
  measure(values) {
    const { diameterMm: D, heightMm: H, wallMm: t } = read(this, values);
    requireLess(2 * t, Math.min(D, H), "wallMm", `The wall (${fmtMm(t)}) must be less than half the smaller of diameter and height (${fmtMm(Math.min(D, H))}).`);
    const d = D - 2 * t;
    const h = H - 2 * t;
    const outside = PI * D * H + 2 * (PI / 4) * D * D;
    const inside = PI * d * h + 2 * (PI / 4) * d * d;
    const volume = (PI / 4) * (D * D * H - d * d * h);
    return result(outside, inside, 0, volume, D, D, H);
  },
};

const openBox: DimensionTemplate = {
  id: "open-box",
  name: "Open box (tray)",
  description: "A box open at the top: outside bottom and walls plus the top rim; the inside separately.",
  dimensions: [
    dim("lengthMm", "Outside length"),
    dim("widthMm", "Outside width"),
    dim("heightMm", "Outside height"),
    dim("wallMm", "Wall and bottom thickness"),
  ],
  measure(values) {
    const { lengthMm: L, widthMm: W, heightMm: H, wallMm: t } = read(this, values);
    requireLess(2 * t, Math.min(L, W), "wallMm", `The wall (${fmtMm(t)}) must be less than half the smaller outside side (${fmtMm(Math.min(L, W))}).`);
    requireLess(t, H, "wallMm", `The wall (${fmtMm(t)}) must be less than the height (${fmtMm(H)}).`);
    const li = L - 2 * t;
    const wi = W - 2 * t;
    const hi = H - t; // inside depth above the bottom
    const rim = L * W - li * wi;
    const outside = L * W + 2 * (L + W) * H + rim;
    const inside = li * wi + 2 * (li + wi) * hi;
    const volume = L * W * H - li * wi * hi;
    return result(outside, inside, rim, volume, L, W, H);
  },
};

export const DIMENSION_TEMPLATES: readonly DimensionTemplate[] = [
  flatPlate,
  rectangularTube,
  roundTube,
  roundBar,
  angle,
  channel,
  closedCylinder,
  openBox,
];

export function findTemplate(id: string): DimensionTemplate {
  const template = DIMENSION_TEMPLATES.find((t) => t.id === id);
  if (!template) {
    throw new GeometryError(
      "unknown_template",
      `There is no shape template "${id}". Choose one of: ${DIMENSION_TEMPLATES.map((t) => t.id).join(", ")}.`,
      "templateId",
    );
  }
  return template;
}

export function measureTemplate(id: string, dimensionsMm: Record<string, number>): TemplateMeasure {
  return findTemplate(id).measure(dimensionsMm);
}
