"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";

export function SignOutButton() {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  return (
    <button
      type="button"
      className="rounded border border-plate/30 px-2 py-1 text-plate hover:bg-plate/10"
      disabled={busy}
      onClick={async () => {
        setBusy(true);
        await fetch("/api/auth/sign-out", { method: "POST" }).catch(() => undefined);
        router.replace("/sign-in");
        router.refresh();
      }}
    >
      Sign out
    </button>
  );
}
