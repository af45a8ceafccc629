"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import type { LineView } from "@/lib/server/lines";
import type { UsageRef } from "@/lib/server/coatings";

/** Archive a line, with a confirmation; a line still used by planned runs is refused with the list. */
export function ArchiveLine({ line }: { line: LineView }) {
  const router = useRouter();
  const [confirming, setConfirming] = useState(false);
  const [refusal, setRefusal] = useState<{ message: string; usedBy: UsageRef[] } | null>(null);
  return (
    <section className="card" aria-labelledby="archive-line-h">
      <h2 id="archive-line-h">Archive</h2>
      <p className="text-sm text-ink-soft">An archived line leaves the list and cannot be picked for new runs; its data stays.</p>
      {confirming ? (
        <div className="mt-2 flex gap-2">
          <button
            className="btn-danger"
            onClick={async () => {
              setConfirming(false);
              const res = await fetch(`/api/lines/${line.id}`, { method: "DELETE", headers: { accept: "application/json" } });
              if (res.ok) return router.push("/lines");
              const body = (await res.json().catch(() => null)) as { error?: { message?: string; usedBy?: UsageRef[] } } | null;
              setRefusal({ message: body?.error?.message ?? `Not archived (${res.status}).`, usedBy: body?.error?.usedBy ?? [] });
            }}
          >
            Yes, archive {line.name}
          </button>
          <button className="btn-quiet" onClick={() => setConfirming(false)}>Keep it</button>
        </div>
      ) : (
        <button className="btn-quiet mt-2" onClick={() => setConfirming(true)}>Archive…</button>
      )}
      {refusal && (
        <div role="alert" className="mt-2 text-sm text-oxide">
          <p>{refusal.message}</p>
          <ul className="ml-5 list-disc">
            {refusal.usedBy.map((u) => <li key={`${u.kind}-${u.id}`}>{u.label}</li>)}
          </ul>
        </div>
      )}
    </section>
  );
}

