import { readJson, route } from "@/lib/server/http";
import { parseId } from "@/lib/server/coatings";
import { applyFit, type AppliedFit } from "@/lib/server/profiles";
import { applyFitSchema } from "@/lib/validation/profiles";

export type ApplyFitResponse = AppliedFit;

/** Stores the heat-transfer coefficient fitted from one part probe on the profile's oven (`{ probeIndex }`). */
export const POST = route<{ id: string }>("/api/profiles/[id]/apply-fit", "POST", async ({ request, params, user }) => {
  const id = parseId(params.id, "profile");
  const { probeIndex } = await readJson(request, applyFitSchema);
  return Response.json((await applyFit(id, probeIndex, user)) satisfies ApplyFitResponse);
});
