import { cureHeatUp } from "@/lib/coating-math/cure";
import { readJson, route } from "@/lib/server/http";
import { checkedResult, cureInputSchema, cureResultSchema, resultBlame, type CureResultBody } from "@/lib/validation/calc";

export type CureResult = CureResultBody;

// Lumped metal heat-up in a convection oven plus the hold time; a warning when Bi ≥ 0.1.
export const POST = route("/api/calc/cure", "POST", async ({ request }) => {
  const input = await readJson(request, cureInputSchema);
  const result: CureResult = checkedResult(cureResultSchema, cureHeatUp(input), resultBlame.cure);
  return Response.json(result);
});
