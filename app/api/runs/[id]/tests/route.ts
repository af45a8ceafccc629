import { readJson, route } from "@/lib/server/http";
import { parseId } from "@/lib/server/coatings";
import { recordTest, runTests } from "@/lib/server/film-checks";
import { filmTestInputSchema } from "@/lib/validation/film-checks";

type P = { id: string };

/** Cure, adhesion, appearance and coverage records of the run, oldest first. */
export const GET = route<P>("/api/runs/[id]/tests", "GET", async ({ params }) =>
  Response.json({ tests: await runTests(parseId(params.id, "run")) }),
);

export const POST = route<P>("/api/runs/[id]/tests", "POST", async ({ request, params, user }) => {
  const runId = parseId(params.id, "run");
  const input = await readJson(request, filmTestInputSchema);
  return Response.json({ test: await recordTest(runId, input, user) }, { status: 201 });
});
