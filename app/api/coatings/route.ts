import { route, readJson, ApiError } from "@/lib/server/http";
import { createCoating, listCoatings, type CoatingView } from "@/lib/server/coatings";
import { coatingInputSchema } from "@/lib/validation/coatings";

export type CoatingsList = { coatings: CoatingView[] };

/** ?q= searches code, name, colour, chemistry and supplier; ?kind=powder|e-coat; ?archived=1 includes archived. */
export const GET = route("/api/coatings", "GET", async ({ request }) => {
  const url = new URL(request.url);
  const kind = url.searchParams.get("kind") || undefined;
  if (kind !== undefined && kind !== "powder" && kind !== "e-coat") {
    throw new ApiError(400, "invalid_input", 'kind: choose "powder" or "e-coat".', { kind: 'Choose "powder" or "e-coat".' });
  }
  const coatings = await listCoatings({
    q: url.searchParams.get("q") ?? undefined,
    kind,
    includeArchived: url.searchParams.get("archived") === "1",
  });
  return Response.json({ coatings } satisfies CoatingsList);
});

export const POST = route("/api/coatings", "POST", async ({ request }) => {
  const input = await readJson(request, coatingInputSchema);
  return Response.json({ coating: await createCoating(input) }, { status: 201 });
});
