// The plan's reason sentence in the user's units. The API words it in mm and kg; for metric users
// that sentence is shown as is, for US users the same facts are worded again in inches and pounds
// by the planner's own sentence builder (lib/rack/explain.ts).

import type { UnitSystem } from "@/lib/coating-math/display-units";
import { rackReason, rackReasonUnits } from "@/lib/rack/explain";
import type { RackPlanResult } from "@/app/api/rack/plan/route";
import type { RackPlanRequest } from "@/lib/validation/rack";

export function reasonText(plan: RackPlanResult, input: RackPlanRequest, system: UnitSystem): string {
  if (system === "metric") return plan.reason;
  const { part, carrier } = input;
  return rackReason(
    {
      part,
      windowMm: [carrier.widthMm, carrier.heightMm, carrier.depthMm],
      maxLoadKg: carrier.maxLoadKg,
      clearanceMm: input.clearanceMm,
      orientations: input.orientations,
      orientation: input.orientation,
      count: plan.count,
      spaceCount: plan.spaceCount,
      limitedBy: plan.limitedBy,
      blocks: plan.blocks,
    },
    rackReasonUnits(system),
  );
}
