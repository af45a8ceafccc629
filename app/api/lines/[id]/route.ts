import { route, readJson } from "@/lib/server/http";
import { parseId } from "@/lib/server/coatings";
import { archiveLine, getLine, replaceLine } from "@/lib/server/lines";
import { lineInputSchema } from "@/lib/validation/lines";

type P = { id: string };

export const GET = route<P>("/api/lines/[id]", "GET", async ({ params }) => Response.json({ line: await getLine(parseId(params.id, "line")) }));

/** Replaces the line and its stage list; `archived` archives or restores it. */
export const PUT = route<P>("/api/lines/[id]", "PUT", async ({ request, params }) => {
  const id = parseId(params.id, "line");
  const input = await readJson(request, lineInputSchema);
  return Response.json({ line: await replaceLine(id, input) });
});

/** Archives the line, or answers 409 with what still uses it. */
export const DELETE = route<P>("/api/lines/[id]", "DELETE", async ({ params }) => {
  const { usedBy, line } = await archiveLine(parseId(params.id, "line"));
  if (usedBy.length) {
    return Response.json(
      {
        error: {
          code: "conflict",
          message: `This line is used by ${usedBy.length} record${usedBy.length === 1 ? "" : "s"}; archive it instead (PUT with archived: true).`,
          usedBy,
        },
      },
      { status: 409 },
    );
  }
  return Response.json({ line });
});
