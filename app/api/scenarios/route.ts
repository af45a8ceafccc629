import { route, readJson } from "@/lib/server/http";
import { createScenario, listScenarios, type ScenarioView } from "@/lib/server/scenarios";
import { scenarioInputSchema } from "@/lib/validation/scenarios";

export type ScenariosList = { scenarios: ScenarioView[] };

/** ?archived=1 includes deleted (archived) scenarios. */
export const GET = route("/api/scenarios", "GET", async ({ request }) => {
  const includeArchived = new URL(request.url).searchParams.get("archived") === "1";
  return Response.json({ scenarios: await listScenarios({ includeArchived }) } satisfies ScenariosList);
});

export const POST = route("/api/scenarios", "POST", async ({ request, user }) => {
  const input = await readJson(request, scenarioInputSchema);
  return Response.json({ scenario: await createScenario(input, user) }, { status: 201 });
});
