import { redirect } from "next/navigation";
import { connection } from "next/server";
import { currentUser } from "@/lib/server/session";
import { AuthCard } from "@/components/auth-card";
import { SignInForm } from "./sign-in-form";

export const metadata = { title: "Sign in" };

export default async function SignInPage() {
  await connection();
  if (await currentUser()) redirect("/");
  return (
    <AuthCard title="Sign in">
      <SignInForm />
    </AuthCard>
  );
}
