"use client";
import { useState } from "react";
import type { UsageRef } from "@/lib/server/coatings";

/**
 * "Archive…" with a confirmation, for any record the API archives on DELETE. When the API refuses
 * (the record is still in use) its message and the list of users are shown.
 */
export function ArchivePanel({
  url,
  name,
  explanation,
  headingId,
  onArchived,
}: {
  /** the record's API address; DELETE archives it */
  url: string;
  /** shown in the confirm button: "Yes, archive {name}" */
  name: string;
  explanation: string;
  headingId: string;
  onArchived: () => void;
}) {
  const [confirming, setConfirming] = useState(false);
  const [refusal, setRefusal] = useState<{ message: string; usedBy: UsageRef[] } | null>(null);
  return (
    <section className="card" aria-labelledby={headingId}>
      <h2 id={headingId}>Archive</h2>
      <p className="text-sm text-ink-soft">{explanation}</p>
      {confirming ? (
        <div className="mt-2 flex gap-2">
          <button
            className="btn-danger"
            onClick={async () => {
              setConfirming(false);
              const res = await fetch(url, { method: "DELETE", headers: { accept: "application/json" } });
              if (res.ok) return onArchived();
              const body = (await res.json().catch(() => null)) as { error?: { message?: string; usedBy?: UsageRef[] } } | null;
              setRefusal({ message: body?.error?.message ?? `Not archived (${res.status}).`, usedBy: body?.error?.usedBy ?? [] });
            }}
          >
            Yes, archive {name}
          </button>
          <button className="btn-quiet" onClick={() => setConfirming(false)}>
            Keep it
          </button>
        </div>
      ) : (
        <button className="btn-quiet mt-2" onClick={() => setConfirming(true)}>
          Archive…
        </button>
      )}
      {refusal && (
        <div role="alert" className="mt-2 text-sm text-oxide">
          <p>{refusal.message}</p>
          {refusal.usedBy.length > 0 && (
            <ul className="ml-5 list-disc">
              {refusal.usedBy.map((u) => (
                <li key={`${u.kind}-${u.id}`}>{u.label}</li>
              ))}
            </ul>
          )}
        </div>
      )}
    </section>
  );
}
