import { ApiError, readJson, route } from "@/lib/server/http";
import { parseId } from "@/lib/server/coatings";
import { createProfile, listProfiles, type ProfileDetail, type ProfileSummary } from "@/lib/server/profiles";
import { ProfileInputError } from "@/lib/profiles/problems";
import { profileCreateSchema } from "@/lib/validation/profiles";

export type ProfilesList = { profiles: ProfileSummary[] };
export type ProfileCreated = { profile: ProfileDetail };

/** ?lineId= keeps one line's profiles. */
export const GET = route("/api/profiles", "GET", async ({ request }) => {
  const raw = new URL(request.url).searchParams.get("lineId");
  let lineId: number | undefined;
  if (raw !== null && raw !== "") {
    try {
      lineId = parseId(raw, "line");
    } catch {
      throw new ApiError(400, "invalid_input", "lineId: enter a line's id.", { lineId: "Enter a line's id." });
    }
  }
  return Response.json({ profiles: await listProfiles({ lineId }) } satisfies ProfilesList);
});

/**
 * Stores a logger file (JSON: `csv` text and its `mapping`) against a line's oven and a coating.
 * Nothing is stored while the file or mapping has a problem: the 400 lists every one, each with
 * its field and, for a bad cell, its row and column.
 */
export const POST = route("/api/profiles", "POST", async ({ request, user }) => {
  const body = await readJson(request, profileCreateSchema);
  try {
    return Response.json({ profile: await createProfile(body, user) } satisfies ProfileCreated, { status: 201 });
  } catch (e) {
    if (e instanceof ProfileInputError) return refused(e);
    throw e;
  }
});

function refused(e: ProfileInputError): Response {
  const fields: Record<string, string> = {};
  for (const p of e.problems) fields[p.field] ??= p.message;
  const message = e.problems.length === 1 ? e.problems[0].message : `${e.problems.length} problems with the file or its mapping; nothing was stored. First: ${e.problems[0].message}`;
  return Response.json({ error: { code: "invalid_input", message, fields, problems: e.problems } }, { status: 400 });
}
