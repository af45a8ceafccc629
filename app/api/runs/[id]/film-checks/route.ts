import { readJson, route } from "@/lib/server/http";
import { parseId } from "@/lib/server/coatings";
import { createFilmCheck, runFilmChecks } from "@/lib/server/film-checks";
import { filmCheckInputSchema } from "@/lib/validation/film-checks";

type P = { id: string };

/** The run's coats with their spec, its film checks judged, other tests and the change log. */
export const GET = route<P>("/api/runs/[id]/film-checks", "GET", async ({ params, user }) =>
  Response.json(await runFilmChecks(parseId(params.id, "run"), user)),
);

/** Records the readings of one coat (400 naming areas.0.1.2 on a bad reading; 409 once the run is done). */
export const POST = route<P>("/api/runs/[id]/film-checks", "POST", async ({ request, params, user }) => {
  const runId = parseId(params.id, "run");
  const input = await readJson(request, filmCheckInputSchema);
  return Response.json({ check: await createFilmCheck(runId, input, user) }, { status: 201 });
});
