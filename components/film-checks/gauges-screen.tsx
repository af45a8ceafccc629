"use client";
// The plant's film-thickness gauges: type, serial, last verification and when the next is due
// (overdue marked), the remembered CSV column mapping, add, edit, retire and delete.
// Validation happens on the server; its field messages are shown beside the fields.

import { useState } from "react";
import useSWR from "swr";
import { FetchError, sendJson } from "@/lib/fetcher";
import { TextField } from "@/components/ui/text-field";
import type { GaugeView } from "@/lib/server/film-checks";

interface Props {
  canEdit: boolean;
}

type Gauges = { gauges: GaugeView[] };

const TYPE_TEXT: Record<GaugeView["gaugeType"], string> = {
  type1: "Type 1 — magnetic pull-off",
  type2: "Type 2 — electronic",
};

interface FormValues {
  name: string;
  gaugeType: GaugeView["gaugeType"];
  serial: string;
  verifiedOn: string;
  verifyIntervalMonths: string;
}

const emptyForm: FormValues = { name: "", gaugeType: "type2", serial: "", verifiedOn: "", verifyIntervalMonths: "12" };

function formOf(g: GaugeView): FormValues {
  return { name: g.name, gaugeType: g.gaugeType, serial: g.serial, verifiedOn: g.verifiedOn ?? "", verifyIntervalMonths: String(g.verifyIntervalMonths) };
}

/** Form text → the API's JSON; the interval goes as typed so the server can name a bad one. */
function bodyOf(v: FormValues) {
  const months = v.verifyIntervalMonths.trim();
  return {
    name: v.name,
    gaugeType: v.gaugeType,
    serial: v.serial,
    verifiedOn: v.verifiedOn === "" ? null : v.verifiedOn,
    verifyIntervalMonths: months === "" || !/^-?\d+(\.\d+)?$/.test(months) ? months : Number(months),
  };
}

function GaugeForm({
  idPrefix,
  initial,
  submitLabel,
  onSubmit,
  onCancel,
}: {
  idPrefix: string;
  initial: FormValues;
  submitLabel: string;
  onSubmit: (v: FormValues) => Promise<Record<string, string> | null>;
  onCancel?: () => void;
}) {
  const [v, setV] = useState(initial);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [busy, setBusy] = useState(false);
  const set = (k: keyof FormValues) => (value: string) => setV((prev) => ({ ...prev, [k]: value }));
  return (
    <form
      className="space-y-3"
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        setBusy(true);
        void onSubmit(v)
          .then((errs) => setErrors(errs ?? {}))
          .finally(() => setBusy(false));
      }}
      onKeyDown={(e) => {
        if (e.key === "Escape" && onCancel) onCancel();
      }}
    >
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-5">
        <TextField label="Name" name="name" value={v.name} onChange={set("name")} error={errors.name} required />
        <div>
          <label htmlFor={`${idPrefix}-type`} className="label">Type (ASTM D7091)</label>
          <select
            id={`${idPrefix}-type`}
            className="field"
            value={v.gaugeType}
            aria-invalid={errors.gaugeType ? true : undefined}
            aria-describedby={errors.gaugeType ? `${idPrefix}-type-err` : undefined}
            onChange={(e) => set("gaugeType")(e.target.value)}
          >
            <option value="type1">{TYPE_TEXT.type1}</option>
            <option value="type2">{TYPE_TEXT.type2}</option>
          </select>
          {errors.gaugeType && <p id={`${idPrefix}-type-err`} className="field-error">{errors.gaugeType}</p>}
        </div>
        <TextField label="Serial number" name="serial" value={v.serial} onChange={set("serial")} error={errors.serial} autoComplete="off" />
        <TextField label="Last verified" name="verifiedOn" type="date" value={v.verifiedOn} onChange={set("verifiedOn")} error={errors.verifiedOn} hint="Blank if never verified." />
        <TextField
          label="Verify every (months)"
          name="verifyIntervalMonths"
          inputMode="numeric"
          value={v.verifyIntervalMonths}
          onChange={set("verifyIntervalMonths")}
          error={errors.verifyIntervalMonths}
          hint="Your plant's choice; 12 is common."
        />
      </div>
      {errors.form && <p role="alert" className="field-error">{errors.form}</p>}
      <div className="flex gap-2">
        <button type="submit" className="btn-primary" disabled={busy}>{busy ? "Saving…" : submitLabel}</button>
        {onCancel && <button type="button" className="btn-quiet" onClick={onCancel}>Cancel</button>}
      </div>
    </form>
  );
}

function fieldErrors(e: unknown): Record<string, string> {
  if (e instanceof FetchError) {
    const fields = { ...e.fields };
    if (Object.keys(fields).length === 0 || fields.body) fields.form = fields.body ?? e.message;
    return fields;
  }
  return { form: "Could not reach the server. Try again." };
}

function VerificationMark({ g }: { g: GaugeView }) {
  if (g.verification === "overdue") {
    return (
      <span className="rounded bg-oxide-light px-2 py-0.5 text-sm font-semibold text-oxide" data-testid="verification-overdue">
        {`Verification overdue (was due ${g.verificationDueOn})`}
      </span>
    );
  }
  if (g.verification === "never") return <span className="rounded bg-caution-light px-2 py-0.5 text-sm text-caution">No verification recorded</span>;
  return <span className="text-sm text-pass">{`Current — next due ${g.verificationDueOn}`}</span>;
}

export function GaugesScreen({ canEdit }: Props) {
  const { data, error, isLoading, mutate } = useSWR<Gauges, FetchError>("/api/gauges");
  const [editing, setEditing] = useState<number | null>(null);
  const [asking, setAsking] = useState<{ id: number; what: "retire" | "delete" | "forget" } | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const [actionError, setActionError] = useState<string | null>(null);
  const [adding, setAdding] = useState(false);

  if (isLoading) return <p role="status" className="text-ink-faint">Loading gauges…</p>;
  if (error || !data) {
    return (
      <div role="alert" className="card space-y-2 text-oxide">
        <p>{error?.message ?? "Could not load the gauges."}</p>
        <button type="button" className="btn-quiet" onClick={() => void mutate()}>Try again</button>
      </div>
    );
  }

  const inUse = data.gauges.filter((g) => g.retiredOn === null);
  const retired = data.gauges.filter((g) => g.retiredOn !== null);

  async function act(g: GaugeView, what: "retire" | "restore" | "delete" | "forget") {
    setActionError(null);
    try {
      if (what === "delete") await sendJson(`/api/gauges/${g.id}`, "DELETE");
      else await sendJson(`/api/gauges/${g.id}`, "PUT", what === "forget" ? { mapping: null } : { retired: what === "retire" });
      setAsking(null);
      setNotice(
        what === "delete"
          ? `${g.name} was deleted.`
          : what === "retire"
            ? `${g.name} was retired; the film checks that name it keep it.`
            : what === "restore"
              ? `${g.name} is back in use.`
              : `The CSV mapping of ${g.name} was forgotten; the next import asks for the column again.`,
      );
      await mutate();
    } catch (e) {
      setActionError(e instanceof FetchError ? e.message : "Could not reach the server. Try again.");
    }
  }

  async function add(v: FormValues): Promise<Record<string, string> | null> {
    // POST /api/gauges updates a gauge of the same name; adding must not overwrite one silently.
    if (data!.gauges.some((g) => g.name.trim().toLowerCase() === v.name.trim().toLowerCase())) {
      return { name: "A gauge of that name exists already; edit it in the list instead." };
    }
    try {
      const { gauge } = await sendJson<{ gauge: GaugeView }>("/api/gauges", "POST", bodyOf(v));
      setAdding(false);
      setNotice(`${gauge.name} was added.`);
      await mutate();
      return null;
    } catch (e) {
      return fieldErrors(e);
    }
  }

  async function save(g: GaugeView, v: FormValues): Promise<Record<string, string> | null> {
    try {
      await sendJson(`/api/gauges/${g.id}`, "PUT", bodyOf(v));
      setEditing(null);
      setNotice(`${v.name.trim()} was saved.`);
      await mutate();
      return null;
    } catch (e) {
      return fieldErrors(e);
    }
  }

  const confirmRow = (g: GaugeView) => {
    if (asking?.id !== g.id) return null;
    const text =
      asking.what === "retire"
        ? `Retire ${g.name}? It stays on the ${g.checkCount} film check${g.checkCount === 1 ? "" : "s"} that name it but is no longer offered for new readings.`
        : asking.what === "delete"
          ? `Delete ${g.name}? No film check names it; this cannot be undone.`
          : `Forget the CSV column mapping of ${g.name}?`;
    const label = asking.what === "retire" ? "Retire" : asking.what === "delete" ? "Delete" : "Forget";
    return (
      <tr>
        <td colSpan={7} className="pb-2">
          <div role="group" aria-label={`Confirm: ${label.toLowerCase()} ${g.name}`} className="flex flex-wrap items-center gap-2 rounded border border-caution-edge bg-caution-light p-2 text-sm">
            <span>{text}</span>
            <button type="button" className={asking.what === "forget" ? "btn-primary" : "btn-danger"} onClick={() => void act(g, asking.what)}>{label}</button>
            <button type="button" className="btn-quiet" autoFocus onClick={() => setAsking(null)}>Keep</button>
          </div>
        </td>
      </tr>
    );
  };

  return (
    <div className="space-y-6">
      {!canEdit && <p className="text-sm text-ink-soft">Read only: operators, supervisors and admins keep the gauge list.</p>}
      {notice && <p role="status" className="text-sm text-pass">{notice}</p>}
      {actionError && <p role="alert" className="text-sm text-oxide">{actionError}</p>}

      <section className="card space-y-3" aria-labelledby="g-list-h">
        <h2 id="g-list-h" className="text-lg font-semibold">Gauges in use</h2>
        {inUse.length === 0 ? (
          <p className="text-ink-faint">No gauges yet.{canEdit ? " Add the first one below." : ""}</p>
        ) : (
          <table className="w-full text-left text-sm" data-testid="gauges-table">
            <thead className="text-ink-soft">
              <tr>
                <th scope="col" className="py-1 pr-3 font-medium">Gauge</th>
                <th scope="col" className="py-1 pr-3 font-medium">Type</th>
                <th scope="col" className="py-1 pr-3 font-medium">Serial</th>
                <th scope="col" className="py-1 pr-3 font-medium">Last verified</th>
                <th scope="col" className="py-1 pr-3 font-medium">Verification</th>
                <th scope="col" className="py-1 pr-3 font-medium">Gauge CSV mapping</th>
                <th scope="col" className="py-1 font-medium"><span className="sr-only">Actions</span></th>
              </tr>
            </thead>
            <tbody>
              {inUse.map((g) =>
                editing === g.id ? (
                  <tr key={g.id} className="border-t border-plate-line">
                    <td colSpan={7} className="py-2">
                      <h3 className="mb-2 font-semibold">{`Edit ${g.name}`}</h3>
                      <GaugeForm idPrefix={`g-edit-${g.id}`} initial={formOf(g)} submitLabel="Save gauge" onSubmit={(v) => save(g, v)} onCancel={() => setEditing(null)} />
                    </td>
                  </tr>
                ) : (
                  <GaugeRows key={g.id} g={g} canEdit={canEdit} confirm={confirmRow(g)} onEdit={() => { setNotice(null); setAsking(null); setEditing(g.id); }} onAsk={(what) => setAsking({ id: g.id, what })} />
                ),
              )}
            </tbody>
          </table>
        )}
        <p className="text-xs text-ink-faint">
          The interval counts from the last verification date; a gauge is overdue the day after its due date. A gauge that film checks name is retired
          rather than deleted, so those records keep it.
        </p>
      </section>

      {canEdit && (
        <section className="card space-y-3" aria-labelledby="g-add-h">
          <h2 id="g-add-h" className="text-lg font-semibold">Add a gauge</h2>
          {adding ? (
            <GaugeForm idPrefix="g-add" initial={emptyForm} submitLabel="Add gauge" onSubmit={add} onCancel={() => setAdding(false)} />
          ) : (
            <button type="button" className="btn-primary" onClick={() => { setNotice(null); setAdding(true); }}>Add a gauge…</button>
          )}
        </section>
      )}

      {retired.length > 0 && (
        <section className="card space-y-2" aria-labelledby="g-retired-h">
          <h2 id="g-retired-h" className="text-lg font-semibold">Retired gauges</h2>
          <ul className="space-y-1 text-sm">
            {retired.map((g) => (
              <li key={g.id} className="flex flex-wrap items-center gap-2">
                <span>{`${g.name} — ${TYPE_TEXT[g.gaugeType]}, serial ${g.serial || "not recorded"}, retired ${g.retiredOn}, named by ${g.checkCount} film check${g.checkCount === 1 ? "" : "s"}`}</span>
                {canEdit && <button type="button" className="btn-quiet" onClick={() => void act(g, "restore")}>{`Bring ${g.name} back`}</button>}
              </li>
            ))}
          </ul>
        </section>
      )}
    </div>
  );
}

function GaugeRows({
  g,
  canEdit,
  confirm,
  onEdit,
  onAsk,
}: {
  g: GaugeView;
  canEdit: boolean;
  confirm: React.ReactNode;
  onEdit: () => void;
  onAsk: (what: "retire" | "delete" | "forget") => void;
}) {
  return (
    <>
      <tr className="border-t border-plate-line align-top" data-testid="gauge-row">
        <th scope="row" className="py-2 pr-3 font-medium">
          {g.name}
          <span className="block text-xs font-normal text-ink-faint">{`named by ${g.checkCount} film check${g.checkCount === 1 ? "" : "s"}`}</span>
        </th>
        <td className="py-2 pr-3">{TYPE_TEXT[g.gaugeType]}</td>
        <td className="py-2 pr-3">{g.serial || <span className="text-ink-faint">not recorded</span>}</td>
        <td className="num py-2 pr-3">{g.verifiedOn ?? <span className="text-ink-faint">never</span>}</td>
        <td className="py-2 pr-3">
          <VerificationMark g={g} />
          <span className="block text-xs text-ink-faint">{`every ${g.verifyIntervalMonths} month${g.verifyIntervalMonths === 1 ? "" : "s"}`}</span>
        </td>
        <td className="py-2 pr-3">
          {g.mapping ? (
            <>
              <span>{`column “${g.mapping.readingColumn}”, in ${g.mapping.unit === "mil" ? "mil" : "µm"}`}</span>
              {canEdit && (
                <button type="button" className="btn-quiet mt-1 block text-xs" onClick={() => onAsk("forget")}>Forget mapping…</button>
              )}
            </>
          ) : (
            <span className="text-ink-faint">none remembered</span>
          )}
        </td>
        <td className="py-2">
          {canEdit && (
            <div className="flex flex-wrap gap-1">
              <button type="button" className="btn-quiet" aria-label={`Edit ${g.name}`} onClick={onEdit}>Edit</button>
              <button type="button" className="btn-quiet" aria-label={`Retire ${g.name}`} onClick={() => onAsk("retire")}>Retire…</button>
              {/* only a gauge no record names may go for good */}
              {g.checkCount === 0 && (
                <button type="button" className="btn-quiet" aria-label={`Delete ${g.name}`} onClick={() => onAsk("delete")}>Delete…</button>
              )}
            </div>
          )}
        </td>
      </tr>
      {confirm}
    </>
  );
}
