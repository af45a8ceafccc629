import { publicRoute, readJson } from "@/lib/server/http";
import { checkCredentials } from "@/lib/server/auth";
import { clientAddress } from "@/lib/server/rate-limit";
import { startSession } from "@/lib/server/session";
import { signInSchema } from "@/lib/validation/auth";

export const POST = publicRoute("/api/auth/sign-in", "POST", async ({ request }) => {
  const { email, password } = await readJson(request, signInSchema);
  const user = await checkCredentials(email, password, clientAddress(request));
  const cookie = await startSession(user.id, request);
  return Response.json(
    { user: { id: user.id, email: user.email, name: user.name, role: user.role, unitSystem: user.unit_system } },
    { headers: { "set-cookie": cookie } },
  );
});
