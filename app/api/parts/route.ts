import { readJson, route } from "@/lib/server/http";
import { createPart, listParts, type PartView } from "@/lib/server/parts";
import { partInputSchema } from "@/lib/validation/parts";

export type PartsList = { parts: PartView[] };

/** ?q= searches number, name and customer; ?archived=1 includes archived parts. */
export const GET = route("/api/parts", "GET", async ({ request }) => {
  const url = new URL(request.url);
  const parts = await listParts({ q: url.searchParams.get("q") ?? undefined, includeArchived: url.searchParams.get("archived") === "1" });
  return Response.json({ parts } satisfies PartsList);
});

export const POST = route("/api/parts", "POST", async ({ request }) => {
  const input = await readJson(request, partInputSchema);
  return Response.json({ part: await createPart(input) }, { status: 201 });
});
