import { publicRoute } from "@/lib/server/http";
import { endSession } from "@/lib/server/session";

export const POST = publicRoute("/api/auth/sign-out", "POST", async ({ request }) => {
  const cookie = await endSession(request);
  return Response.json({ ok: true }, { headers: { "set-cookie": cookie } });
});
