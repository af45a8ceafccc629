import type { OrientationMode, PartBoxMm, RackOrientation } from "./types";

type Triple = [number, number, number];

/** Two lengths are the same part dimension when they agree to a part in 10⁹ (input rounding). */
export function sameLengthMm(a: number, b: number): boolean {
  return Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));
}

function sameTriple(a: Triple, b: Triple): boolean {
  return sameLengthMm(a[0], b[0]) && sameLengthMm(a[1], b[1]) && sameLengthMm(a[2], b[2]);
}

function isPermutation(given: number[], dims: number[]): boolean {
  const a = [...given].sort((p, q) => p - q);
  const b = [...dims].sort((p, q) => p - q);
  return a.length === b.length && a.every((v, i) => sameLengthMm(v, b[i]));
}

export function toOrientation([x, y, z]: Triple): RackOrientation {
  return { alongWidthMm: x, alongHeightMm: y, alongDepthMm: z };
}

export function toTriple(o: RackOrientation): Triple {
  return [o.alongWidthMm, o.alongHeightMm, o.alongDepthMm];
}

/**
 * The distinct orientations a mode allows, in a fixed order that also breaks ties: the part as
 * drawn (CAD z up, CAD x along travel) first, then the other upright one, then the lying ones.
 */
export function allowedOrientations(part: PartBoxMm, mode: OrientationMode): RackOrientation[] {
  const { lengthMm: l, widthMm: w, heightMm: h } = part;
  const candidates: Triple[] =
    mode === "upright"
      ? [
          [l, h, w],
          [w, h, l],
        ]
      : [
          [l, h, w],
          [w, h, l],
          [l, w, h],
          [w, l, h],
          [h, w, l],
          [h, l, w],
        ];
  const distinct: Triple[] = [];
  for (const c of candidates) {
    if (!distinct.some((d) => sameTriple(d, c))) distinct.push(c);
  }
  return distinct.map(toOrientation);
}

/** Why a forced orientation is not allowed for this part and mode, or null when it is. */
export function orientationProblem(
  part: PartBoxMm,
  mode: OrientationMode,
  orientation: RackOrientation,
): string | null {
  const { lengthMm: l, widthMm: w, heightMm: h } = part;
  const given = toTriple(orientation);
  if (!isPermutation(given, [l, w, h])) {
    return `The orientation must place the part's own dimensions (${l} × ${w} × ${h} mm), one along each axis.`;
  }
  if (mode === "upright") {
    // The other two may still swap, but only if the height really is along y.
    if (!sameLengthMm(given[1], h) || !isPermutation([given[0], given[2]], [l, w])) {
      return `Upright racking keeps the part's height (${h} mm) vertical: alongHeightMm must be ${h}.`;
    }
  }
  return null;
}
