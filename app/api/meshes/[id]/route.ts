import { readJson, route } from "@/lib/server/http";
import { changeMeshUnit, getMesh } from "@/lib/server/meshes";
import { meshUnitSchema } from "@/lib/validation/parts";

type P = { id: string };

export const GET = route<P>("/api/meshes/[id]", "GET", async ({ params }) => Response.json(await getMesh(params.id)));

/** `{ unit }`: the file was drawn in the other unit; every number is rescaled exactly. */
export const PATCH = route<P>("/api/meshes/[id]", "PATCH", async ({ request, params }) => {
  const { unit } = await readJson(request, meshUnitSchema);
  return Response.json(await changeMeshUnit(params.id, unit));
});
