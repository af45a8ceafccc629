import { AuthCard } from "@/components/auth-card";
import { ForgotForm } from "./forgot-form";

export const metadata = { title: "Forgot password" };

export default function ForgotPage() {
  return (
    <AuthCard title="Reset your password">
      <ForgotForm />
    </AuthCard>
  );
}
