import { route } from "@/lib/server/http";
import { receiveMesh, type MeshView } from "@/lib/server/meshes";

export type MeshResult = MeshView;

/**
 * Multipart form: `file` (binary or ASCII STL) and `unit` ("mm" | "in"), in either order. The
 * body is streamed (never buffered whole): see lib/server/meshes.ts.
 */
export const POST = route("/api/meshes", "POST", async ({ request, user }) =>
  Response.json(await receiveMesh(request, user.id), { status: 201 }),
);
