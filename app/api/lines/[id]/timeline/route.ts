import { ApiError, route } from "@/lib/server/http";
import { parseId } from "@/lib/server/coatings";
import { timelineFor, type LineTimelineView } from "@/lib/server/lines";

export type TimelineResponse = { timeline: LineTimelineView };

/** ?lineSpeedMPerMin= (default: the line's nominal speed): each stage's dwell and the total. */
export const GET = route<{ id: string }>("/api/lines/[id]/timeline", "GET", async ({ request, params }) => {
  const id = parseId(params.id, "line");
  const raw = new URL(request.url).searchParams.get("lineSpeedMPerMin");
  let speed: number | undefined;
  if (raw !== null && raw !== "") {
    speed = Number(raw);
    if (!Number.isFinite(speed) || speed <= 0) {
      throw new ApiError(400, "invalid_input", "lineSpeedMPerMin: must be a number greater than 0 m/min.", { lineSpeedMPerMin: "must be a number greater than 0 m/min" });
    }
  }
  return Response.json({ timeline: await timelineFor(id, speed) } satisfies TimelineResponse);
});
