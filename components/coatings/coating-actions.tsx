"use client";
import { useState } from "react";
import { FetchError, sendJson } from "@/lib/fetcher";
import type { CoatingView } from "@/lib/server/coatings";
import { ArchivePanel } from "@/components/ui/archive-panel";
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
export function ArchiveCoating({ coating, onArchived }: { coating: CoatingView; onArchived: () => void }) {
  return (
    <ArchivePanel
      url={`/api/coatings/${coating.id}`}
      name={coating.code}
      headingId="archive-h"
      explanation="An archived coating leaves the library list and cannot be picked for new work; its lots and history stay."
      onArchived={onArchived}
    />
  );
}
