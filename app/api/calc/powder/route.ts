import { powderEstimate } from "@/lib/coating-math/powder";
import { readJson, route } from "@/lib/server/http";
import { checkedResult, powderInputSchema, powderResultSchema, resultBlame, type PowderResultBody } from "@/lib/validation/calc";

export type PowderResult = PowderResultBody;

// Theoretical coverage 1000 / (SG × filmUm) and steady-state utilisation with reclaim.
export const POST = route("/api/calc/powder", "POST", async ({ request }) => {
  const input = await readJson(request, powderInputSchema);
  const result: PowderResult = checkedResult(powderResultSchema, powderEstimate(input), resultBlame.powder);
  return Response.json(result);
});
