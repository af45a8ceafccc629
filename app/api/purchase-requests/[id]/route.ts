import { readJson, route } from "@/lib/server/http";
import { parseId } from "@/lib/server/coatings";
import { getRequest, setRequestStatus } from "@/lib/server/purchasing";
import { requestStatusSchema } from "@/lib/validation/purchasing";

export const GET = route<{ id: string }>("/api/purchase-requests/[id]", "GET", async ({ params }) =>
  Response.json({ request: await getRequest(parseId(params.id, "purchase request")) }),
);

/** Confirms or cancels a request. */
export const PATCH = route<{ id: string }>("/api/purchase-requests/[id]", "PATCH", async ({ request, params }) => {
  const id = parseId(params.id, "purchase request");
  const { status } = await readJson(request, requestStatusSchema);
  return Response.json({ request: await setRequestStatus(id, status) });
});
