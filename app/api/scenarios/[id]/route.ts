import { route, readJson } from "@/lib/server/http";
import { parseId } from "@/lib/server/coatings";
import { deleteScenario, getScenario, replaceScenario } from "@/lib/server/scenarios";
import { scenarioInputSchema } from "@/lib/validation/scenarios";

type P = { id: string };

export const GET = route<P>("/api/scenarios/[id]", "GET", async ({ params }) =>
  Response.json({ scenario: await getScenario(parseId(params.id, "scenario")) }),
);

/** Replaces the scenario; `archived: false` restores a deleted one. */
export const PUT = route<P>("/api/scenarios/[id]", "PUT", async ({ request, params }) => {
  const id = parseId(params.id, "scenario");
  const input = await readJson(request, scenarioInputSchema);
  return Response.json({ scenario: await replaceScenario(id, input) });
});

/** Takes the scenario off the list (archived; nothing else refers to a scenario). */
export const DELETE = route<P>("/api/scenarios/[id]", "DELETE", async ({ params }) =>
  Response.json({ scenario: await deleteScenario(parseId(params.id, "scenario")) }),
);
