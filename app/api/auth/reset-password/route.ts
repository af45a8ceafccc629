import { publicRoute, readJson } from "@/lib/server/http";
import { setPasswordWithToken } from "@/lib/server/auth";
import { resetPasswordSchema } from "@/lib/validation/auth";

export const POST = publicRoute("/api/auth/reset-password", "POST", async ({ request }) => {
  const { token, password } = await readJson(request, resetPasswordSchema);
  const user = await setPasswordWithToken(token, "reset", password);
  return Response.json({ ok: true, email: user.email });
});
