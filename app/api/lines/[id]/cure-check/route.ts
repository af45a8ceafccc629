import { route, readJson } from "@/lib/server/http";
import { parseId } from "@/lib/server/coatings";
import { cureCheckFor, type CureCheckView } from "@/lib/server/lines";
import { cureCheckInputSchema } from "@/lib/validation/lines";

export type CureCheckResponse = { cureCheck: CureCheckView };

/** Does a part of this section thickness cure in this line's oven at this speed? */
export const POST = route<{ id: string }>("/api/lines/[id]/cure-check", "POST", async ({ request, params, user }) => {
  const id = parseId(params.id, "line");
  const body = await readJson(request, cureCheckInputSchema);
  return Response.json({ cureCheck: await cureCheckFor(id, body, user.unitSystem) } satisfies CureCheckResponse);
});
