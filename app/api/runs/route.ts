import { readJson, route } from "@/lib/server/http";
import { createRun, listRuns, type RunListItem, type SavedRun } from "@/lib/server/runs";
import { queryObject, runInputSchema, runQuerySchema } from "@/lib/validation/runs";

export type RunsList = { runs: RunListItem[] };
export type RunSaved = SavedRun;

/** ?date=YYYY-MM-DD (or ?from=&to=), ?lineId=, ?shift=; without a day, runs from today on. */
export const GET = route("/api/runs", "GET", async ({ request }) => {
  const q = runQuerySchema.parse(queryObject(request.url));
  return Response.json({ runs: await listRuns(q) } satisfies RunsList);
});

/** Plans and saves a draft run; `warnings` (cure, film build, shift overflow) do not refuse it. */
export const POST = route("/api/runs", "POST", async ({ request, user }) => {
  const input = await readJson(request, runInputSchema);
  return Response.json((await createRun(input, user)) satisfies RunSaved, { status: 201 });
});
