import Papa from "papaparse";
import { route } from "@/lib/server/http";
import { buildForecast, forecastCsvRows, parseHorizon } from "@/lib/server/forecast";

/** The forecast as CSV, one row per coating. */
export const GET = route("/api/forecast.csv", "GET", async ({ request }) => {
  const horizonDays = parseHorizon(new URL(request.url).searchParams.get("horizonDays"));
  const f = await buildForecast(horizonDays);
  const csv = Papa.unparse(forecastCsvRows(f), { newline: "\r\n" });
  return new Response(`${csv}\r\n`, {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="forecast-${f.today}-${horizonDays}d.csv"`,
      "cache-control": "no-store",
    },
  });
});
