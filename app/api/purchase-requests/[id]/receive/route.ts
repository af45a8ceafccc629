import { readJson, route } from "@/lib/server/http";
import { parseId } from "@/lib/server/coatings";
import { receiveRequest } from "@/lib/server/purchasing";
import { receiveSchema } from "@/lib/validation/purchasing";

/** Receives a request as stock lots (all or nothing); more than ordered needs confirm: true. */
export const POST = route<{ id: string }>("/api/purchase-requests/[id]/receive", "POST", async ({ request, params }) => {
  const id = parseId(params.id, "purchase request");
  const input = await readJson(request, receiveSchema);
  return Response.json({ request: await receiveRequest(id, input) }, { status: 201 });
});
