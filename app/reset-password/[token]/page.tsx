import { connection } from "next/server";
import { tokenState } from "@/lib/server/auth";
import { AuthCard } from "@/components/auth-card";
import { SetPasswordForm } from "@/components/set-password-form";
import { TokenProblem } from "@/components/token-problem";

export const metadata = { title: "Choose a new password" };

export default async function ResetPage({ params }: { params: Promise<{ token: string }> }) {
  await connection();
  const { token } = await params;
  const state = await tokenState(token, "reset");
  return (
    <AuthCard title="Choose a new password">
      {state === "valid" ? (
        <SetPasswordForm token={token} endpoint="/api/auth/reset-password" submitLabel="Save new password" />
      ) : (
        <TokenProblem state={state} again={{ href: "/forgot-password", label: "Ask for a new reset link" }} />
      )}
    </AuthCard>
  );
}
