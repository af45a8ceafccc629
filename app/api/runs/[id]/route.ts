import { readJson, route } from "@/lib/server/http";
import { parseId } from "@/lib/server/coatings";
import { getRun, removeRun, replaceRun, type RunDetail } from "@/lib/server/runs";
import { runInputSchema } from "@/lib/validation/runs";

type P = { id: string };
export type RunOne = { run: RunDetail };

/** The run with its computed plan (null with `planError` when it no longer plans) and warnings, stock ones in the reader's units. */
export const GET = route<P>("/api/runs/[id]", "GET", async ({ params, user }) =>
  Response.json({ run: await getRun(parseId(params.id, "run"), user.unitSystem) } satisfies RunOne),
);

/** Replaces a draft or planned run (409 once it has started). */
export const PUT = route<P>("/api/runs/[id]", "PUT", async ({ request, params }) => {
  const id = parseId(params.id, "run");
  const input = await readJson(request, runInputSchema);
  return Response.json(await replaceRun(id, input));
});

/** Deletes a draft; any other status is 409 (cancel it instead). */
export const DELETE = route<P>("/api/runs/[id]", "DELETE", async ({ params }) => {
  await removeRun(parseId(params.id, "run"));
  return Response.json({ deleted: true });
});
