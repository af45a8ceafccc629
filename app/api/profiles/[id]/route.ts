import { ApiError, route } from "@/lib/server/http";
import { parseId } from "@/lib/server/coatings";
import { getProfile, removeProfile, type ProfileDetail } from "@/lib/server/profiles";

type P = { id: string };
export type ProfileResponse = { profile: ProfileDetail };

/** ?coatingId= judges the profile against another coating's cure schedule. */
export const GET = route<P>("/api/profiles/[id]", "GET", async ({ request, params }) => {
  const id = parseId(params.id, "profile");
  const raw = new URL(request.url).searchParams.get("coatingId");
  let coatingId: number | undefined;
  if (raw !== null && raw !== "") {
    if (!/^\d{1,12}$/.test(raw) || Number(raw) < 1) throw new ApiError(400, "invalid_input", "coatingId: enter a coating's id.", { coatingId: "Enter a coating's id." });
    coatingId = Number(raw);
  }
  return Response.json({ profile: await getProfile(id, coatingId) } satisfies ProfileResponse);
});

/** Deletes the profile; heat-transfer coefficients already stored from it stay, and so does their history. */
export const DELETE = route<P>("/api/profiles/[id]", "DELETE", async ({ params }) => {
  await removeProfile(parseId(params.id, "profile"));
  return Response.json({ deleted: true });
});
