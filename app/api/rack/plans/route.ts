import { invalidInput, readJson, route } from "@/lib/server/http";
import { createRackPlan, listRackPlans, type RackPlansList, type SavedRackPlan, type SavedRackPlanSummary } from "@/lib/server/rack-plans";
import { rackPlanQuerySchema, rackPlanSaveSchema } from "@/lib/validation/rack-plans";

export type { RackPlansList, SavedRackPlan, SavedRackPlanSummary };

/** Saved racking plans as last saved (not planned again); ?partId= and ?lineId= narrow the list. */
export const GET = route("/api/rack/plans", "GET", async ({ request }) => {
  const parsed = rackPlanQuerySchema.safeParse(Object.fromEntries(new URL(request.url).searchParams));
  if (!parsed.success) throw invalidInput(parsed.error);
  return Response.json({ plans: await listRackPlans(parsed.data) } satisfies RackPlansList);
});

/** Saves a plan for a part × line (one each: a second is a 409 naming lineId), planned afresh. */
export const POST = route("/api/rack/plans", "POST", async ({ request, user }) => {
  const input = await readJson(request, rackPlanSaveSchema);
  return Response.json({ plan: await createRackPlan(input, user) }, { status: 201 });
});
