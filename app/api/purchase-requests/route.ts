import { readJson, route } from "@/lib/server/http";
import { createRequests, listRequests } from "@/lib/server/purchasing";
import { createRequestsSchema } from "@/lib/validation/purchasing";

export const GET = route("/api/purchase-requests", "GET", async () => Response.json({ requests: await listRequests() }));

/** One request per supplier for the chosen coatings, e-mailed to each supplier. */
export const POST = route("/api/purchase-requests", "POST", async ({ request, user }) => {
  const input = await readJson(request, createRequestsSchema);
  return Response.json({ requests: await createRequests(input, user) }, { status: 201 });
});
