import { route, readJson } from "@/lib/server/http";
import { changeUser } from "@/lib/server/users";
import { userPatchSchema } from "@/lib/validation/auth";

export const PATCH = route<{ id: string }>("/api/admin/users/[id]", "PATCH", async ({ request, user, params }) => {
  const patch = await readJson(request, userPatchSchema);
  return Response.json({ user: await changeUser(user.id, params.id, patch) });
});
