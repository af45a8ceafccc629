import { planRack } from "@/lib/rack/plan";
import type { RackPlan } from "@/lib/rack/types";
import { readJson, route } from "@/lib/server/http";
import { rackPlanInputSchema } from "@/lib/validation/rack";

/**
 * The racking plan: count, limitedBy, reason, blocks (main grid first) and one placement per part
 * counted, in millimetres in the carrier window's frame. `spaceCount` (parts that fit by space
 * alone) and each block's `originMm` come on top of the contract's fields.
 */
export type RackPlanResult = RackPlan;

// Pure arithmetic on the numbers sent: nothing is read or stored. A part that fits nowhere or a
// load limit below one part is a plan of 0 with its reason, not an error.
export const POST = route("/api/rack/plan", "POST", async ({ request }) => {
  const input = await readJson(request, rackPlanInputSchema);
  const result: RackPlanResult = planRack(input);
  return Response.json(result);
});
