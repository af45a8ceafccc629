import { publicRoute, readJson } from "@/lib/server/http";
import { setPasswordWithToken } from "@/lib/server/auth";
import { acceptInviteSchema } from "@/lib/validation/auth";

export const POST = publicRoute("/api/auth/accept-invite", "POST", async ({ request }) => {
  const { token, password } = await readJson(request, acceptInviteSchema);
  const user = await setPasswordWithToken(token, "invite", password);
  return Response.json({ ok: true, email: user.email });
});
