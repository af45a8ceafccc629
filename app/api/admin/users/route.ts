import { route, readJson } from "@/lib/server/http";
import { inviteUser } from "@/lib/server/auth";
import { allUsers } from "@/lib/server/users";
import { inviteSchema } from "@/lib/validation/auth";

export const GET = route("/api/admin/users", "GET", async () => Response.json({ users: await allUsers() }));

/** Invite: creates the account without a password and e-mails a one-time link (72 h). */
export const POST = route("/api/admin/users", "POST", async ({ request }) => {
  const input = await readJson(request, inviteSchema);
  const { id } = await inviteUser(input, request);
  return Response.json({ id }, { status: 201 });
});
