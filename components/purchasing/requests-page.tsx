"use client";
import { useState } from "react";
import useSWR from "swr";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { formatQuantity, formatSignificant, fromDisplay, toDisplay, unitLabel } from "@/lib/coating-math/display-units";
import { FetchError, sendJson } from "@/lib/fetcher";
import type { RequestView } from "@/lib/server/purchasing";

const STATUS_LABEL: Record<RequestView["status"], string> = { sent: "Sent", confirmed: "Confirmed", received: "Received", cancelled: "Cancelled" };

/** Purchase requests: confirm, cancel, and receive as stock lots. */
export function RequestsPage({ unitSystem, canEdit }: { unitSystem: UnitSystem; canEdit: boolean }) {
  const { data, error, isLoading, mutate } = useSWR<{ requests: RequestView[] }>("/api/purchase-requests");
  if (isLoading) return <p role="status">Loading purchase requests…</p>;
  if (error) return <p role="alert" className="text-oxide">Could not load purchase requests: {(error as Error).message}</p>;
  const requests = data?.requests ?? [];
  if (!requests.length) return <p className="card text-sm text-ink-soft">No purchase requests yet. Send one from the forecast.</p>;
  return (
    <ul className="space-y-3">
      {requests.map((r) => (
        <RequestCard key={r.id} r={r} unitSystem={unitSystem} canEdit={canEdit} onChange={() => mutate()} />
      ))}
    </ul>
  );
}

function RequestCard({ r, unitSystem, canEdit, onChange }: { r: RequestView; unitSystem: UnitSystem; canEdit: boolean; onChange: () => void }) {
  const [receiving, setReceiving] = useState(false);
  const [asking, setAsking] = useState(false);
  const [busy, setBusy] = useState(false);
  const [msg, setMsg] = useState("");
  const kg = (v: number) => formatQuantity("massKg", v, unitSystem, 4);

  async function status(s: "confirmed" | "cancelled") {
    setBusy(true);
    setMsg("");
    try {
      await sendJson(`/api/purchase-requests/${r.id}`, "PATCH", { status: s });
      setAsking(false);
      onChange();
    } catch (e) {
      setMsg(e instanceof FetchError ? e.message : "Could not change the request.");
    } finally {
      setBusy(false);
    }
  }

  return (
    <li className="card space-y-2" aria-labelledby={`pr-${r.id}`} data-reference={r.reference}>
      <div className="flex flex-wrap items-baseline gap-2">
        <h2 id={`pr-${r.id}`} className="mr-auto">
          {r.reference} <span className="font-normal text-ink-soft">to {r.supplierName} ({r.supplierEmail})</span>
        </h2>
        <span className="rounded bg-plate-sunk px-2 py-0.5 text-xs" data-status={r.status}>{STATUS_LABEL[r.status]}</span>
        <span className="text-xs text-ink-soft">sent {r.sentDate}</span>
      </div>
      <table className="w-full text-sm [&_td]:px-2 [&_th]:px-2" aria-label={`Lines of ${r.reference}`}>
        <thead>
          <tr className="text-left">
            <th scope="col">Coating</th>
            <th scope="col" className="text-right">Ordered</th>
            <th scope="col" className="text-right">Received</th>
            <th scope="col">Expected</th>
          </tr>
        </thead>
        <tbody>
          {r.lines.map((l) => (
            <tr key={l.id} className="border-t border-plate-line">
              <td>{l.code} {l.name}</td>
              <td className="num text-right">{l.containers} × {kg(l.containerKg)} = {kg(l.orderedKg)}</td>
              <td className="num text-right">{kg(l.receivedKg)}</td>
              <td>{l.expectedDate}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {canEdit && r.nextStatuses.length > 0 && !receiving && (
        <div className="flex flex-wrap gap-2" role="group" aria-label={`Actions for ${r.reference}`}>
          {r.nextStatuses.includes("confirmed") && <button type="button" className="btn-quiet" disabled={busy} onClick={() => status("confirmed")}>Supplier confirmed</button>}
          {r.nextStatuses.includes("received") && <button type="button" className="btn-primary" disabled={busy} onClick={() => setReceiving(true)}>Receive…</button>}
          {r.nextStatuses.includes("cancelled") && <button type="button" className="btn-danger" disabled={busy} onClick={() => setAsking(true)}>Cancel request</button>}
        </div>
      )}
      {asking && (
        <div role="alertdialog" aria-labelledby={`cancel-${r.id}`} className="rounded-md border border-oxide bg-oxide-light p-3 text-sm">
          <p id={`cancel-${r.id}`}>Cancel {r.reference}? Tell {r.supplierName} too; no e-mail is sent for a cancellation.</p>
          <div className="mt-2 flex gap-2">
            <button type="button" className="btn-danger" disabled={busy} onClick={() => status("cancelled")}>Yes, cancel it</button>
            <button type="button" className="btn-quiet" onClick={() => setAsking(false)}>Keep it</button>
          </div>
        </div>
      )}
      {receiving && <ReceiveForm r={r} onDone={() => { setReceiving(false); onChange(); }} onCancel={() => setReceiving(false)} unitSystem={unitSystem} />}
      {msg && <p role="alert" className="field-error">{msg}</p>}
    </li>
  );
}

interface LotDraft {
  lotNumber: string;
  kgReceived: string;
  expiryDate: string;
}

function ReceiveForm({ r, onDone, onCancel, unitSystem }: { r: RequestView; onDone: () => void; onCancel: () => void; unitSystem: UnitSystem }) {
  const today = new Date().toISOString().slice(0, 10);
  const [receivedDate, setReceivedDate] = useState(today);
  const [lots, setLots] = useState<Record<number, LotDraft>>(() =>
    Object.fromEntries(r.lines.map((l) => [l.id, { lotNumber: "", kgReceived: formatSignificant(toDisplay("massKg", Math.max(0, l.orderedKg - l.receivedKg), unitSystem).value, 6), expiryDate: "" }])),
  );
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [confirmText, setConfirmText] = useState("");
  const [busy, setBusy] = useState(false);

  async function submit(confirm: boolean) {
    const body = {
      lots: r.lines.map((l) => ({
        lineId: l.id,
        lotNumber: lots[l.id].lotNumber,
        kgReceived: fromDisplay("massKg", Number(lots[l.id].kgReceived), unitSystem),
        receivedDate,
        ...(lots[l.id].expiryDate ? { expiryDate: lots[l.id].expiryDate } : {}),
      })),
      ...(confirm ? { confirm: true } : {}),
    };
    setBusy(true);
    setErrors({});
    setConfirmText("");
    try {
      await sendJson(`/api/purchase-requests/${r.id}/receive`, "POST", body);
      onDone();
    } catch (e) {
      if (e instanceof FetchError && e.status === 409 && e.fields.confirm) setConfirmText(e.message);
      else if (e instanceof FetchError) setErrors({ ...e.fields, _: e.message });
      else setErrors({ _: "Could not receive the request." });
    } finally {
      setBusy(false);
    }
  }

  return (
    <form className="space-y-3 rounded-md border border-plate-line p-3" onSubmit={(e) => { e.preventDefault(); void submit(false); }} aria-label={`Receive ${r.reference}`}>
      <p className="text-sm">Enter the supplier's lot numbers. The expiry defaults to the received date plus the coating's shelf life.</p>
      <div>
        <label className="label" htmlFor={`rd-${r.id}`}>Received on</label>
        <input id={`rd-${r.id}`} type="date" className="field" value={receivedDate} onChange={(e) => setReceivedDate(e.target.value)} />
      </div>
      {r.lines.map((l, i) => (
        <fieldset key={l.id} className="grid gap-2 sm:grid-cols-3">
          <legend className="text-sm font-medium">{l.code} {l.name} ({formatQuantity("massKg", l.orderedKg, unitSystem, 4)} ordered)</legend>
          <div>
            <label className="label" htmlFor={`lot-${l.id}`}>Lot number</label>
            <input id={`lot-${l.id}`} name={`lotNumber-${i}`} className="field" value={lots[l.id].lotNumber} onChange={(e) => setLots((s) => ({ ...s, [l.id]: { ...s[l.id], lotNumber: e.target.value } }))} />
            {errors[`lots.${i}.lotNumber`] && <p className="field-error">{errors[`lots.${i}.lotNumber`]}</p>}
          </div>
          <div>
            <label className="label" htmlFor={`kg-${l.id}`}>Received ({unitLabel("massKg", unitSystem)})</label>
            <input id={`kg-${l.id}`} name={`kgReceived-${i}`} className="field" inputMode="decimal" value={lots[l.id].kgReceived} onChange={(e) => setLots((s) => ({ ...s, [l.id]: { ...s[l.id], kgReceived: e.target.value } }))} />
            {errors[`lots.${i}.kgReceived`] && <p className="field-error">{errors[`lots.${i}.kgReceived`]}</p>}
          </div>
          <div>
            <label className="label" htmlFor={`exp-${l.id}`}>Expiry (optional)</label>
            <input id={`exp-${l.id}`} type="date" className="field" value={lots[l.id].expiryDate} onChange={(e) => setLots((s) => ({ ...s, [l.id]: { ...s[l.id], expiryDate: e.target.value } }))} />
          </div>
        </fieldset>
      ))}
      {errors._ && <p role="alert" className="field-error">{errors._}</p>}
      {confirmText && (
        <div role="alertdialog" aria-labelledby={`over-${r.id}`} className="rounded-md border border-caution bg-caution-light p-3 text-sm">
          <p id={`over-${r.id}`}>{confirmText}</p>
          <button type="button" className="btn-primary mt-2" disabled={busy} onClick={() => submit(true)}>Receive anyway</button>
        </div>
      )}
      <div className="flex gap-2">
        <button type="submit" className="btn-primary" disabled={busy}>{busy ? "Receiving…" : "Receive into stock"}</button>
        <button type="button" className="btn-quiet" onClick={onCancel}>Cancel</button>
      </div>
    </form>
  );
}
