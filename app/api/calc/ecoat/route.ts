import { ecoatEstimate } from "@/lib/coating-math/ecoat";
import { readJson, route } from "@/lib/server/http";
import { checkedResult, ecoatInputSchema, ecoatResultSchema, resultBlame, type EcoatResultBody } from "@/lib/validation/calc";

export type EcoatResult = EcoatResultBody;

// Deposited solids ρ × DFT × A, charge from coulombic yield, current from parts per hour.
export const POST = route("/api/calc/ecoat", "POST", async ({ request }) => {
  const input = await readJson(request, ecoatInputSchema);
  const result: EcoatResult = checkedResult(ecoatResultSchema, ecoatEstimate(input), resultBlame.ecoat);
  return Response.json(result);
});
