import { ApiError, readJson, route } from "@/lib/server/http";
import { archivePart, getPart, replacePart } from "@/lib/server/parts";
import type { MeshView } from "@/lib/server/meshes";
import type { PartView } from "@/lib/server/parts";
import { partInputSchema } from "@/lib/validation/parts";

type P = { id: string };
export type PartResult = { part: PartView; mesh: MeshView | null };

export const GET = route<P>("/api/parts/[id]", "GET", async ({ params }) => Response.json((await getPart(params.id)) satisfies PartResult));

/** Replaces the part; `archived` archives or restores it. */
export const PUT = route<P>("/api/parts/[id]", "PUT", async ({ request, params }) => {
  const input = await readJson(request, partInputSchema);
  return Response.json({ part: await replacePart(params.id, input) });
});

/** Archives the part. Parts are never deleted: plans and runs may refer to them. */
export const DELETE = route<P>("/api/parts/[id]", "DELETE", async ({ request, params }) => {
  const hard = new URL(request.url).searchParams.get("hard");
  if (hard !== null && hard !== "0") {
    throw new ApiError(400, "invalid_input", "Parts are archived, never deleted: plans and runs may refer to them. Send DELETE without ?hard to archive.", {
      hard: "Parts cannot be deleted, only archived.",
    });
  }
  return Response.json({ part: await archivePart(params.id) });
});
