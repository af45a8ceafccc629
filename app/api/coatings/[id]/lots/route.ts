import { route, readJson } from "@/lib/server/http";
import { parseId, receiveLot } from "@/lib/server/coatings";
import { lotInputSchema } from "@/lib/validation/coatings";

/** Receives a lot into stock; answers the coating with its lots. */
export const POST = route<{ id: string }>("/api/coatings/[id]/lots", "POST", async ({ request, params }) => {
  const id = parseId(params.id, "coating");
  const input = await readJson(request, lotInputSchema);
  return Response.json({ coating: await receiveLot(id, input) }, { status: 201 });
});
