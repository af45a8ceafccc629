import { readJson, route } from "@/lib/server/http";
import { previewRun, type RunPreview } from "@/lib/server/runs";
import { runInputSchema } from "@/lib/validation/runs";

export type RunPreviewResult = RunPreview;

// Read-only: the plan of the body as POST /api/runs would save it, and the warnings it would
// get, stock ones in the reader's units (?runId= when editing that run, so it keeps its place on
// the board). Nothing is stored.
export const POST = route("/api/runs/preview", "POST", async ({ request, user }) => {
  const raw = new URL(request.url).searchParams.get("runId");
  const runId = raw && /^\d{1,12}$/.test(raw) ? Number(raw) : undefined;
  const input = await readJson(request, runInputSchema);
  return Response.json((await previewRun(input, runId, user.unitSystem)) satisfies RunPreviewResult);
});
