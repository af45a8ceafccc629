"use client";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { FetchError, sendJson } from "@/lib/fetcher";
import { TextField } from "@/components/ui/text-field";

export function SignInForm() {
  const router = useRouter();
  const [email, setEmail] = useState("");
  const [password, setPassword] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [fields, setFields] = useState<Record<string, string>>({});
  const [busy, setBusy] = useState(false);
  return (
    <form
      className="space-y-4"
      noValidate
      onSubmit={async (e) => {
        e.preventDefault();
        setBusy(true);
        setError(null);
        try {
          await sendJson("/api/auth/sign-in", "POST", { email, password });
          router.replace("/");
          router.refresh();
        } catch (err) {
          setFields(err instanceof FetchError ? err.fields : {});
          setError(err instanceof Error ? err.message : "Could not sign in.");
          setBusy(false);
        }
      }}
    >
      <TextField label="E-mail" name="email" type="email" autoComplete="username" value={email} onChange={setEmail} error={fields.email} required />
      <TextField label="Password" name="password" type="password" autoComplete="current-password" value={password} onChange={setPassword} error={fields.password} required />
      {error && (
        <p role="alert" className="rounded border border-oxide/40 bg-oxide-light px-3 py-2 text-sm text-oxide">
          {error}
        </p>
      )}
      <button className="btn-primary w-full justify-center" disabled={busy}>
        {busy ? "Signing in…" : "Sign in"}
      </button>
      <p className="text-center text-sm">
        <Link className="text-phosphate underline" href="/forgot-password">Forgot your password?</Link>
      </p>
    </form>
  );
}
