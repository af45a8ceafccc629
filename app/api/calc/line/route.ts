import { lineThroughput } from "@/lib/coating-math/line";
import { readJson, route } from "@/lib/server/http";
import { checkedResult, lineInputSchema, lineResultSchema, resultBlame, type LineResultBody } from "@/lib/validation/calc";

export type LineResult = LineResultBody;

// Carriers per hour = speed × 60 / pitch; oven dwell = oven path / speed.
export const POST = route("/api/calc/line", "POST", async ({ request }) => {
  const input = await readJson(request, lineInputSchema);
  const result: LineResult = checkedResult(lineResultSchema, lineThroughput(input), resultBlame.line);
  return Response.json(result);
});
