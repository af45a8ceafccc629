import { readJson, route } from "@/lib/server/http";
import { resetEstimate } from "@/lib/server/feedback";
import { feedbackResetSchema } from "@/lib/validation/feedback";

/** Resets a line × coating's estimate: all its runs are excluded (kept as history). */
export const POST = route("/api/feedback/reset", "POST", async ({ request }) => {
  const { lineId, coatingId } = await readJson(request, feedbackResetSchema);
  return Response.json(await resetEstimate(lineId, coatingId));
});
