import { getDb } from "@/db/index";
import { updateUser } from "@/db/queries/users";
import { route, readJson } from "@/lib/server/http";
import { mePatchSchema } from "@/lib/validation/auth";

export const GET = route("/api/me", "GET", async ({ user }) => Response.json({ user }));

export const PATCH = route("/api/me", "PATCH", async ({ request, user }) => {
  const { unitSystem } = await readJson(request, mePatchSchema);
  await updateUser(await getDb(), user.id, { unit_system: unitSystem });
  return Response.json({ user: { ...user, unitSystem } });
});
