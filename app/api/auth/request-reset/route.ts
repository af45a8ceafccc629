import { publicRoute, readJson } from "@/lib/server/http";
import { requestPasswordReset } from "@/lib/server/auth";
import { requestResetSchema } from "@/lib/validation/auth";

export const POST = publicRoute("/api/auth/request-reset", "POST", async ({ request }) => {
  const { email } = await readJson(request, requestResetSchema);
  await requestPasswordReset(email, request);
  // Same answer whether or not the account exists.
  return Response.json({ ok: true, message: "If that address has an account, a reset link is on its way." });
});
