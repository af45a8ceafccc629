import { readJson, route } from "@/lib/server/http";
import { parseId } from "@/lib/server/coatings";
import { setExcluded } from "@/lib/server/feedback";
import { feedbackPatchSchema } from "@/lib/validation/feedback";

/** Excludes a run's record from the running estimate, or takes it back in. */
export const PATCH = route<{ id: string }>("/api/feedback/[id]", "PATCH", async ({ request, params }) => {
  const id = parseId(params.id, "usage record");
  const { excluded } = await readJson(request, feedbackPatchSchema);
  return Response.json({ usage: await setExcluded(id, excluded) });
});
