"use client";
import Link from "next/link";
import { useState } from "react";
import { FetchError, sendJson } from "@/lib/fetcher";
import { TextField } from "@/components/ui/text-field";

/** Sets a password through a one-time link (invite or reset). */
export function SetPasswordForm({ token, endpoint, submitLabel }: { token: string; endpoint: string; submitLabel: string }) {
  const [password, setPassword] = useState("");
  const [repeat, setRepeat] = useState("");
  const [fields, setFields] = useState<Record<string, string>>({});
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  if (done) {
    return (
      <div className="space-y-3">
        <p role="status" className="rounded bg-pass-light px-3 py-2 text-sm text-pass">Password set for {done}.</p>
        <Link className="btn-primary" href="/sign-in">Go to sign-in</Link>
      </div>
    );
  }
  return (
    <form
      className="space-y-4"
      noValidate
      onSubmit={async (e) => {
        e.preventDefault();
        if (password !== repeat) {
          setFields({ repeat: "The two passwords differ." });
          return;
        }
        setBusy(true);
        try {
          const r = await sendJson<{ email: string }>(endpoint, "POST", { token, password });
          setDone(r.email);
        } catch (err) {
          setFields(err instanceof FetchError ? err.fields : {});
          setError(err instanceof Error ? err.message : "Not saved.");
        } finally {
          setBusy(false);
        }
      }}
    >
      <TextField label="New password" name="password" type="password" autoComplete="new-password" value={password} onChange={setPassword} error={fields.password} hint="At least 10 characters." />
      <TextField label="Repeat it" name="repeat" type="password" autoComplete="new-password" value={repeat} onChange={setRepeat} error={fields.repeat} />
      {error && !fields.password && <p role="alert" className="field-error">{error}</p>}
      <button className="btn-primary w-full justify-center" disabled={busy}>{submitLabel}</button>
    </form>
  );
}
