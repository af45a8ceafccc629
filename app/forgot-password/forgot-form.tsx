"use client";
import Link from "next/link";
import { useState } from "react";
import { FetchError, sendJson } from "@/lib/fetcher";
import { TextField } from "@/components/ui/text-field";

export function ForgotForm() {
  const [email, setEmail] = useState("");
  const [message, setMessage] = useState<string | null>(null);
  const [fields, setFields] = useState<Record<string, string>>({});
  const [busy, setBusy] = useState(false);
  return (
    <form
      className="space-y-4"
      noValidate
      onSubmit={async (e) => {
        e.preventDefault();
        setBusy(true);
        try {
          const r = await sendJson<{ message: string }>("/api/auth/request-reset", "POST", { email });
          setFields({});
          setMessage(r.message);
        } catch (err) {
          setFields(err instanceof FetchError ? err.fields : {});
          setMessage(err instanceof Error && !(err instanceof FetchError && err.fields.email) ? err.message : null);
        } finally {
          setBusy(false);
        }
      }}
    >
      <p className="text-sm text-ink-soft">We e-mail a link that lets you choose a new password. It works once, for one hour.</p>
      <TextField label="E-mail" name="email" type="email" autoComplete="username" value={email} onChange={setEmail} error={fields.email} />
      {message && <p role="status" className="text-sm">{message}</p>}
      <button className="btn-primary w-full justify-center" disabled={busy}>Send reset link</button>
      <p className="text-center text-sm"><Link className="text-phosphate underline" href="/sign-in">Back to sign-in</Link></p>
    </form>
  );
}
