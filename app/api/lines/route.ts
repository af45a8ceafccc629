import { route, readJson } from "@/lib/server/http";
import { createLine, listLines, type LineView } from "@/lib/server/lines";
import { lineInputSchema } from "@/lib/validation/lines";

export type LinesList = { lines: LineView[] };

/** ?archived=1 includes archived lines. */
export const GET = route("/api/lines", "GET", async ({ request }) => {
  const includeArchived = new URL(request.url).searchParams.get("archived") === "1";
  return Response.json({ lines: await listLines({ includeArchived }) } satisfies LinesList);
});

export const POST = route("/api/lines", "POST", async ({ request }) => {
  const input = await readJson(request, lineInputSchema);
  return Response.json({ line: await createLine(input) }, { status: 201 });
});
