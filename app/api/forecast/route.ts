import { route } from "@/lib/server/http";
import { buildForecast, parseHorizon } from "@/lib/server/forecast";

/** Material forecast over ?horizonDays= (default 28, at most 366). */
export const GET = route("/api/forecast", "GET", async ({ request }) => {
  const horizonDays = parseHorizon(new URL(request.url).searchParams.get("horizonDays"));
  return Response.json({ forecast: await buildForecast(horizonDays) });
});
