"use client";
import { useState } from "react";
import { FetchError, sendJson } from "@/lib/fetcher";
import type { CoatingView, UsageRef } from "@/lib/server/coatings";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { TextField } from "@/components/ui/text-field";
import { parse, show, unitOf } from "@/components/lines/unit-draft";

/** Record a received lot: number, dates and quantity in the user's mass unit. */
export function ReceiveLotForm({ coating, unitSystem: sys, onReceived }: { coating: CoatingView; unitSystem: UnitSystem; onReceived: (c: CoatingView, lot: string) => void }) {
  const today = new Date().toISOString().slice(0, 10);
  const [v, setV] = useState({ lotNumber: "", receivedDate: today, mass: "", expiryDate: "" });
  const [fields, setFields] = useState<Record<string, string>>({});
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  return (
    <form
      className="grid items-start gap-3 border-t border-plate-line pt-3 sm:grid-cols-[1fr_1fr_1fr_1fr_auto]"
      noValidate
      aria-label="Receive a lot"
      onSubmit={async (e) => {
        e.preventDefault();
        const kg = parse("massKg", v.mass, sys);
        if (kg !== undefined && (Number.isNaN(kg) || kg <= 0)) {
          // stock cannot be negative; the server refuses it too
          setFields({ kgOnHand: Number.isNaN(kg) ? "Enter a number." : "Enter a quantity above 0." });
          return;
        }
        setBusy(true);
        setError(null);
        try {
          const res = await sendJson<{ coating: CoatingView }>(`/api/coatings/${coating.id}/lots`, "POST", {
            lotNumber: v.lotNumber,
            receivedDate: v.receivedDate,
            kgOnHand: kg,
            ...(v.expiryDate ? { expiryDate: v.expiryDate } : {}),
          });
          setFields({});
          onReceived(res.coating, v.lotNumber);
          setV({ lotNumber: "", receivedDate: today, mass: "", expiryDate: "" });
        } catch (err) {
          setFields(err instanceof FetchError ? err.fields : {});
          setError(err instanceof Error ? err.message : "Not received.");
        } finally {
          setBusy(false);
        }
      }}
    >
      <h3 className="font-semibold sm:col-span-5">Receive a lot</h3>
      <TextField label="Lot number" name="lotNumber" value={v.lotNumber} onChange={(s) => setV({ ...v, lotNumber: s })} error={fields.lotNumber} />
      <TextField label="Received on" name="receivedDate" type="date" value={v.receivedDate} onChange={(s) => setV({ ...v, receivedDate: s })} error={fields.receivedDate} />
      <TextField label={`Quantity (${unitOf("massKg", sys)})`} name="quantity" inputMode="decimal" value={v.mass} onChange={(s) => setV({ ...v, mass: s })} error={fields.kgOnHand} hint={`${coating.containerKind} of ${show("massKg", coating.containerKg, sys, 4)}`} />
      <TextField label="Expires on (optional)" name="expiryDate" type="date" value={v.expiryDate} onChange={(s) => setV({ ...v, expiryDate: s })} error={fields.expiryDate} hint={`Default: received + ${coating.shelfLifeMonths} months`} />
      <button className="btn-primary sm:mt-6" disabled={busy}>Receive lot</button>
      {error && !Object.keys(fields).length && <p role="alert" className="field-error sm:col-span-5">{error}</p>}
    </form>
  );
}

/** Archive the coating, with a confirmation; a coating still in use is refused with the list. */
export function ArchivePanel({ coating, onArchived }: { coating: CoatingView; onArchived: () => void }) {
  const [confirming, setConfirming] = useState(false);
  const [refusal, setRefusal] = useState<{ message: string; usedBy: UsageRef[] } | null>(null);
  return (
    <section className="card" aria-labelledby="archive-h">
      <h2 id="archive-h">Archive</h2>
      <p className="text-sm text-ink-soft">An archived coating leaves the library list and cannot be picked for new work; its lots and history stay.</p>
      {confirming ? (
        <div className="mt-2 flex gap-2">
          <button
            className="btn-danger"
            onClick={async () => {
              setConfirming(false);
              const res = await fetch(`/api/coatings/${coating.id}`, { method: "DELETE", headers: { accept: "application/json" } });
              if (res.ok) return onArchived();
              const body = (await res.json().catch(() => null)) as { error?: { message?: string; usedBy?: UsageRef[] } } | null;
              setRefusal({ message: body?.error?.message ?? `Not archived (${res.status}).`, usedBy: body?.error?.usedBy ?? [] });
            }}
          >
            Yes, archive {coating.code}
          </button>
          <button className="btn-quiet" onClick={() => setConfirming(false)}>Keep it</button>
        </div>
      ) : (
        <button className="btn-quiet mt-2" onClick={() => setConfirming(true)}>Archive…</button>
      )}
      {refusal && (
        <div role="alert" className="mt-2 text-sm text-oxide">
          <p>{refusal.message}</p>
          {refusal.usedBy.length > 0 && (
            <ul className="ml-5 list-disc">
              {refusal.usedBy.map((u) => <li key={`${u.kind}-${u.id}`}>{u.label}</li>)}
            </ul>
          )}
        </div>
      )}
    </section>
  );
}
