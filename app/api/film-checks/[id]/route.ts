import { readJson, route } from "@/lib/server/http";
import { parseId } from "@/lib/server/coatings";
import { getFilmCheck, removeFilmCheck, updateFilmCheck } from "@/lib/server/film-checks";
import { filmCheckInputSchema } from "@/lib/validation/film-checks";

type P = { id: string };

export const GET = route<P>("/api/film-checks/[id]", "GET", async ({ params, user }) =>
  Response.json({ check: await getFilmCheck(parseId(params.id, "film check"), user) }),
);

/** Replaces the readings (logged, old → new); a done run's checks only by an admin. */
export const PUT = route<P>("/api/film-checks/[id]", "PUT", async ({ request, params, user }) => {
  const id = parseId(params.id, "film check");
  const input = await readJson(request, filmCheckInputSchema);
  return Response.json({ check: await updateFilmCheck(id, input, user) });
});

export const DELETE = route<P>("/api/film-checks/[id]", "DELETE", async ({ params, user }) => {
  await removeFilmCheck(parseId(params.id, "film check"), user);
  return Response.json({ deleted: true });
});
