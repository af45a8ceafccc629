import { parseId } from "@/lib/server/coatings";
import { readJson, route } from "@/lib/server/http";
import { getRackPlan, removeRackPlan, replaceRackPlan } from "@/lib/server/rack-plans";
import { rackPlanSaveSchema } from "@/lib/validation/rack-plans";

type P = { id: string };

/** One saved plan with `result`, planned now from the part and line as they are. */
export const GET = route<P>("/api/rack/plans/[id]", "GET", async ({ params }) =>
  Response.json({ plan: await getRackPlan(parseId(params.id, "racking plan")) }),
);

/** Replaces the plan's choices (same body as POST) and plans it again. */
export const PUT = route<P>("/api/rack/plans/[id]", "PUT", async ({ request, params, user }) => {
  const id = parseId(params.id, "racking plan");
  const input = await readJson(request, rackPlanSaveSchema);
  return Response.json({ plan: await replaceRackPlan(id, input, user) });
});

/** Deletes the plan; runs of the part on the line go back to the live planner. */
export const DELETE = route<P>("/api/rack/plans/[id]", "DELETE", async ({ params }) => {
  const id = parseId(params.id, "racking plan");
  await removeRackPlan(id);
  return Response.json({ deleted: { id } });
});
