import { readJson, route } from "@/lib/server/http";
import { parseId } from "@/lib/server/coatings";
import { getActualUse, recordActualUse } from "@/lib/server/feedback";
import { actualUseSchema } from "@/lib/validation/feedback";

export const GET = route<{ id: string }>("/api/runs/[id]/actual-use", "GET", async ({ params }) =>
  Response.json({ actualUse: await getActualUse(parseId(params.id, "run")) }),
);

/** Parts coated and powder used per powder coat of a done run; implausible figures need confirm: true. */
export const POST = route<{ id: string }>("/api/runs/[id]/actual-use", "POST", async ({ request, params, user }) => {
  const id = parseId(params.id, "run");
  const input = await readJson(request, actualUseSchema);
  return Response.json({ actualUse: await recordActualUse(id, input, user) }, { status: 201 });
});
