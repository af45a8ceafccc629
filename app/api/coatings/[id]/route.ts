import { route, readJson } from "@/lib/server/http";
import { archiveCoating, getCoating, parseId, replaceCoating } from "@/lib/server/coatings";
import { coatingInputSchema } from "@/lib/validation/coatings";

type P = { id: string };

export const GET = route<P>("/api/coatings/[id]", "GET", async ({ params }) =>
  Response.json({ coating: await getCoating(parseId(params.id, "coating")) }),
);

/** Replaces the coating and its cure schedule; `archived` archives or restores it. */
export const PUT = route<P>("/api/coatings/[id]", "PUT", async ({ request, params }) => {
  const id = parseId(params.id, "coating");
  const input = await readJson(request, coatingInputSchema);
  return Response.json({ coating: await replaceCoating(id, input) });
});

/** Archives the coating, or answers 409 with what still uses it. */
export const DELETE = route<P>("/api/coatings/[id]", "DELETE", async ({ params }) => {
  const { usedBy, coating } = await archiveCoating(parseId(params.id, "coating"));
  if (usedBy.length) {
    return Response.json(
      {
        error: {
          code: "conflict",
          message: `This coating is used by ${usedBy.length} record${usedBy.length === 1 ? "" : "s"}; archive it instead (PUT with archived: true).`,
          usedBy,
        },
      },
      { status: 409 },
    );
  }
  return Response.json({ coating });
});
