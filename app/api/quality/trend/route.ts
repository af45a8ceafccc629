import { ApiError, invalidInput, route } from "@/lib/server/http";
import { qualityTrend } from "@/lib/server/film-checks";
import { trendQuerySchema } from "@/lib/validation/film-checks";

/** Mean film and share of readings in spec per film check of a coating on a line, by run date. */
export const GET = route("/api/quality/trend", "GET", async ({ request }) => {
  const url = new URL(request.url);
  const parsed = trendQuerySchema.safeParse({ coatingId: url.searchParams.get("coatingId") ?? undefined, lineId: url.searchParams.get("lineId") ?? undefined });
  if (!parsed.success) throw invalidInput(parsed.error);
  if (!parsed.data) throw new ApiError(400, "invalid_input", "Choose a coating and a line.");
  return Response.json(await qualityTrend(parsed.data.coatingId, parsed.data.lineId));
});
