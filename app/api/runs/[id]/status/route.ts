import { readJson, route } from "@/lib/server/http";
import { parseId } from "@/lib/server/coatings";
import { changeRunStatus } from "@/lib/server/runs";
import { runStatusSchema } from "@/lib/validation/runs";

type P = { id: string };

/** { status }: draft → planned → in-progress → done, or cancelled; any other move is 409. */
export const POST = route<P>("/api/runs/[id]/status", "POST", async ({ request, params }) => {
  const id = parseId(params.id, "run");
  const { status } = await readJson(request, runStatusSchema);
  return Response.json({ run: await changeRunStatus(id, status) });
});
