import { route, readJson } from "@/lib/server/http";
import { compareThroughput, type ThroughputComparison } from "@/lib/server/throughput";
import { throughputCompareSchema } from "@/lib/validation/scenarios";

export type ThroughputCompareResponse = { comparison: ThroughputComparison };

/** Lines and saved scenarios side by side for one part and powder; sentences in the user's units. */
export const POST = route("/api/throughput/compare", "POST", async ({ request, user }) => {
  const body = await readJson(request, throughputCompareSchema);
  return Response.json({ comparison: await compareThroughput(body, user.unitSystem) } satisfies ThroughputCompareResponse);
});
