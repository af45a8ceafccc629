// An independent checker for racking plans, written apart from the planner: it imports nothing
// from lib/rack and re-derives every rule from the product contract (window frame, clearance as
// the gap between neighbours, orientation modes, load limit).

export interface CheckedInput {
  part: { lengthMm: number; widthMm: number; heightMm: number; massKg: number };
  carrier: { widthMm: number; heightMm: number; depthMm: number; maxLoadKg: number };
  clearanceMm: number;
  orientations: "any" | "upright";
  orientation?: { alongWidthMm: number; alongHeightMm: number; alongDepthMm: number };
}

export interface CheckedPlan {
  count: number;
  limitedBy: string;
  blocks: { count: number }[];
  placements: { minMm: number[]; sizeMm: number[] }[];
}

/** Geometric slack: well above float noise on mm-sized sums, far below anything physical. */
const EPS_MM = 1e-6;

const close = (a: number, b: number) => Math.abs(a - b) <= EPS_MM * Math.max(1, Math.abs(a), Math.abs(b));

function sameMultiset(a: number[], b: number[]): boolean {
  const x = [...a].sort((p, q) => p - q);
  const y = [...b].sort((p, q) => p - q);
  return x.length === y.length && x.every((v, i) => close(v, y[i]));
}

/** Every rule a plan breaks, as readable lines; an empty list means the plan is sound. */
export function placementProblems(input: CheckedInput, plan: CheckedPlan): string[] {
  const problems: string[] = [];
  const { part, carrier, clearanceMm: c } = input;
  const window = [carrier.widthMm, carrier.heightMm, carrier.depthMm];
  const partDims = [part.lengthMm, part.widthMm, part.heightMm];

  if (plan.count !== plan.placements.length) {
    problems.push(`count ${plan.count} but ${plan.placements.length} placements`);
  }
  const blockSum = plan.blocks.reduce((s, b) => s + b.count, 0);
  if (blockSum !== plan.count) problems.push(`block counts sum to ${blockSum}, count is ${plan.count}`);
  if (plan.count * part.massKg > carrier.maxLoadKg * (1 + 1e-9)) {
    problems.push(`${plan.count} parts of ${part.massKg} kg exceed the ${carrier.maxLoadKg} kg limit`);
  }
  if (plan.limitedBy === "load" && (plan.count + 1) * part.massKg <= carrier.maxLoadKg * (1 - 1e-9)) {
    problems.push("limitedBy load, yet one more part would be within the load limit");
  }
  if (plan.limitedBy !== "load" && plan.limitedBy !== "space") {
    problems.push(`limitedBy is ${plan.limitedBy}`);
  }

  plan.placements.forEach((p, i) => {
    for (let axis = 0; axis < 3; axis++) {
      const lo = p.minMm[axis];
      const hi = lo + p.sizeMm[axis];
      if (!(lo >= -EPS_MM) || !(hi <= window[axis] + EPS_MM)) {
        problems.push(`placement ${i} leaves the window on axis ${axis}: ${lo}..${hi}`);
      }
    }
    if (!sameMultiset(p.sizeMm, partDims)) {
      problems.push(`placement ${i} size ${p.sizeMm.join("×")} is not the part turned`);
    }
    if (input.orientations === "upright" && !close(p.sizeMm[1], part.heightMm)) {
      problems.push(`placement ${i} is not upright: ${p.sizeMm[1]} along y`);
    }
    const o = input.orientation;
    const forced = o ? [o.alongWidthMm, o.alongHeightMm, o.alongDepthMm] : null;
    if (forced && !forced.every((v, a) => close(p.sizeMm[a], v))) {
      problems.push(`placement ${i} ignores the forced orientation`);
    }
  });

  // Two parts are far enough apart when, along at least one axis, the gap between them is at
  // least the clearance. Sweep in x order: once the next part starts ≥ c past this one's end
  // along x, so do all later ones.
  const boxes = plan.placements
    .map((p) => ({ lo: p.minMm, hi: p.minMm.map((v, a) => v + p.sizeMm[a]) }))
    .sort((a, b) => a.lo[0] - b.lo[0]);
  for (let i = 0; i < boxes.length; i++) {
    for (let j = i + 1; j < boxes.length; j++) {
      if (boxes[j].lo[0] - boxes[i].hi[0] >= c - EPS_MM) break;
      const separated = [0, 1, 2].some((a) => {
        const gap = Math.max(boxes[j].lo[a] - boxes[i].hi[a], boxes[i].lo[a] - boxes[j].hi[a]);
        return gap >= c - EPS_MM;
      });
      if (!separated) {
        problems.push(`parts at ${boxes[i].lo.join(",")} and ${boxes[j].lo.join(",")} are closer than ${c} mm`);
        if (problems.length > 20) return problems;
      }
    }
  }
  return problems;
}

/**
 * The best single-orientation grid counted the slow way, by stepping parts along each axis
 * until the next one would not fit. Independent of the planner's closed-form count.
 */
export function bruteSingleGridCount(input: CheckedInput): number {
  const { lengthMm: l, widthMm: w, heightMm: h } = input.part;
  const { widthMm: W, heightMm: H, depthMm: D } = input.carrier;
  const c = input.clearanceMm;
  const along = (span: number, size: number) => {
    let n = 0;
    while ((n + 1) * size + n * c <= span + EPS_MM) n += 1;
    return n;
  };
  const turns = input.orientation
    ? [[input.orientation.alongWidthMm, input.orientation.alongHeightMm, input.orientation.alongDepthMm]]
    : input.orientations === "upright"
      ? [
          [l, h, w],
          [w, h, l],
        ]
      : [
          [l, w, h],
          [l, h, w],
          [w, l, h],
          [w, h, l],
          [h, l, w],
          [h, w, l],
        ];
  return Math.max(...turns.map(([x, y, z]) => along(W, x) * along(H, y) * along(D, z)));
}
