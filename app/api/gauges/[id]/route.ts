import { readJson, route } from "@/lib/server/http";
import { parseId } from "@/lib/server/coatings";
import { getGauge, removeGauge, updateGauge } from "@/lib/server/film-checks";
import { gaugeUpdateSchema } from "@/lib/validation/film-checks";

type P = { id: string };

export const GET = route<P>("/api/gauges/[id]", "GET", async ({ params }) => Response.json({ gauge: await getGauge(parseId(params.id, "gauge")) }));

/** Changes the fields sent: name, type, serial, verification date and interval, CSV mapping (null forgets it), retired. */
export const PUT = route<P>("/api/gauges/[id]", "PUT", async ({ request, params }) => {
  const id = parseId(params.id, "gauge");
  const input = await readJson(request, gaugeUpdateSchema);
  return Response.json({ gauge: await updateGauge(id, input) });
});

/** Only a gauge no film check names may be deleted (409 otherwise: retire it instead). */
export const DELETE = route<P>("/api/gauges/[id]", "DELETE", async ({ params }) => {
  await removeGauge(parseId(params.id, "gauge"));
  return Response.json({ deleted: true });
});
