import { readJson, route } from "@/lib/server/http";
import { previewProfile, type ProfilePreview } from "@/lib/server/profiles";
import { profilePreviewSchema } from "@/lib/validation/profiles";

export type ProfilePreviewResponse = { preview: ProfilePreview };

/**
 * Reads a logger file with a mapping (or suggests one: the named logger's remembered mapping
 * when its columns are all there, else a guess from the header) and lists every problem.
 * Stores nothing; a file with problems is still a 200 with `ok: false`.
 */
export const POST = route("/api/profiles/preview", "POST", async ({ request }) => {
  const body = await readJson(request, profilePreviewSchema);
  return Response.json({ preview: await previewProfile(body) } satisfies ProfilePreviewResponse);
});
