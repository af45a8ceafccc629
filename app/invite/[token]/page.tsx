import { connection } from "next/server";
import { tokenState } from "@/lib/server/auth";
import { AuthCard } from "@/components/auth-card";
import { SetPasswordForm } from "@/components/set-password-form";
import { TokenProblem } from "@/components/token-problem";

export const metadata = { title: "Set your password" };

export default async function InvitePage({ params }: { params: Promise<{ token: string }> }) {
  await connection();
  const { token } = await params;
  const state = await tokenState(token, "invite");
  return (
    <AuthCard title="Welcome to Coatwright">
      {state === "valid" ? (
        <SetPasswordForm token={token} endpoint="/api/auth/accept-invite" submitLabel="Set password" />
      ) : (
        <TokenProblem state={state} again={{ href: "/sign-in", label: "Ask your admin for a new invitation" }} />
      )}
    </AuthCard>
  );
}
