import { readJson, route } from "@/lib/server/http";
import { listGauges, saveGauge } from "@/lib/server/film-checks";
import { gaugeInputSchema } from "@/lib/validation/film-checks";

export const GET = route("/api/gauges", "GET", async () => Response.json({ gauges: await listGauges() }));

/** Adds a gauge, or updates the one of the same name (e.g. to remember its CSV column mapping). */
export const POST = route("/api/gauges", "POST", async ({ request }) => {
  const input = await readJson(request, gaugeInputSchema);
  const { gauge, created } = await saveGauge(input);
  return Response.json({ gauge }, { status: created ? 201 : 200 });
});
