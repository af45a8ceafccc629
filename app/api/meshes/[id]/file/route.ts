import { route } from "@/lib/server/http";
import { meshFile } from "@/lib/server/meshes";

type P = { id: string };

/** The stored STL, streamed from the data folder. */
export const GET = route<P>("/api/meshes/[id]/file", "GET", async ({ params }) => {
  const { stream, sizeBytes, fileName } = await meshFile(params.id);
  const ascii = fileName.replace(/[^\x20-\x7e]|["\\]/g, "_");
  return new Response(stream, {
    headers: {
      "content-type": "model/stl",
      "content-length": String(sizeBytes),
      "content-disposition": `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(fileName)}`,
      "cache-control": "private, max-age=3600",
    },
  });
});
