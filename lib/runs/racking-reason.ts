// A run's racking sentence in the reader's units (the plan words it in mm and kg). The server
// words it for the reader so run pages need not ship the sentence builder.
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { rackReason, rackReasonUnits } from "@/lib/rack/explain";
import type { RunRacking } from "./plan-run";

type PartBox = { lengthMm: number; widthMm: number; heightMm: number; massKg: number };

export function runRackingReason(r: RunRacking, part: PartBox | null, system: UnitSystem): string {
  if (system === "metric" || !part) return r.reason;
  const { widthMm, heightMm, depthMm } = r.windowMm;
  const sentence = rackReason(
    {
      part,
      windowMm: [widthMm, heightMm, depthMm],
      maxLoadKg: r.maxLoadKg,
      clearanceMm: r.clearanceMm,
      orientations: r.orientations,
      count: r.plan.count,
      spaceCount: r.plan.spaceCount,
      limitedBy: r.plan.limitedBy,
      blocks: r.plan.blocks,
    },
    rackReasonUnits(system),
  );
  return r.savedPlanId !== null ? `From saved racking plan ${r.savedPlanId}. ${sentence}` : sentence;
}
