"use client";
// Saved what-if scenarios: a line with its speed, pitch, parts per carrier, powder oven length or
// air temperature changed. Managers (and admin) save, duplicate and delete; others read.

import { useState } from "react";
import { TextField } from "@/components/ui/text-field";
import { FetchError, sendJson } from "@/lib/fetcher";
import type { LineView } from "@/lib/server/lines";
import type { ScenarioView } from "@/lib/server/scenarios";
import type { PartRef } from "@/lib/validation/scenarios";
import { fieldText, show, sig, toShown, unitOf, type ShownKind, type UnitTable } from "./shown-units";
import { useUnitTexts } from "./use-unit-texts";

const OVERRIDES = {
  lineSpeedMPerMin: "speedMPerMin",
  carrierPitchM: "lengthM",
  partsPerCarrier: null,
  ovenLengthM: "lengthM",
  airTempC: "temperatureC",
} as const satisfies Record<string, ShownKind | null>;
type Override = keyof typeof OVERRIDES;
const CONVEYOR_ONLY: Override[] = ["lineSpeedMPerMin", "carrierPitchM", "ovenLengthM"];

/** The powder cure oven: the first cure oven after the powder booth. */
function powderOven(line: LineView) {
  if (line.kind !== "conveyor") return null;
  const booth = line.stages.findIndex((s) => s.kind === "powder-booth");
  return booth < 0 ? null : (line.stages.find((s, i) => i > booth && s.kind === "cure-oven") ?? null);
}

function changes(s: ScenarioView, units: UnitTable): string {
  const o = s.overrides;
  const parts = [
    o.lineSpeedMPerMin !== undefined && `speed ${show(units, "speedMPerMin", o.lineSpeedMPerMin)}`,
    o.carrierPitchM !== undefined && `pitch ${show(units, "lengthM", o.carrierPitchM)}`,
    o.partsPerCarrier !== undefined && `${o.partsPerCarrier} per carrier`,
    o.ovenLengthM !== undefined && `oven ${show(units, "lengthM", o.ovenLengthM)}`,
    o.airTempC !== undefined && `oven air ${show(units, "temperatureC", o.airTempC)}`,
  ].filter(Boolean);
  return parts.length ? parts.join(" · ") : "no changes (the line as it is)";
}

interface Props {
  units: UnitTable;
  lines: LineView[];
  scenarios: ScenarioView[];
  canEdit: boolean;
  currentPart: PartRef | null;
  currentCoatingId: number | null;
  /** refreshes the scenario list; resolves when it has the change */
  onChanged: () => Promise<unknown>;
  onSaved: (id: number) => void;
  onUsePart: (part: PartRef, coatingId: number | null) => void;
}

const EMPTY = { lineSpeedMPerMin: "", carrierPitchM: "", partsPerCarrier: "", ovenLengthM: "", airTempC: "" };

export function ScenarioEditor({ units, lines, scenarios, canEdit, currentPart, currentCoatingId, onChanged, onSaved, onUsePart }: Props) {
  const [editing, setEditing] = useState<ScenarioView | null>(null);
  const [name, setName] = useState("");
  const [lineId, setLineId] = useState("");
  const [withPart, setWithPart] = useState(true);
  const { texts, set, stored, setTexts } = useUnitTexts(OVERRIDES, units, () => ({ ...EMPTY }));
  const [fields, setFields] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<{ text: string; error: boolean } | null>(null);
  const [busy, setBusy] = useState(false);
  const [confirmDelete, setConfirmDelete] = useState<number | null>(null);

  const line = lines.find((l) => String(l.id) === lineId) ?? null;
  /** "3.94–11.8 ft/min" */
  const speedRange = (l: { lineSpeedMinMPerMin: number; lineSpeedMaxMPerMin: number }) =>
    `${sig(toShown(units, "speedMPerMin", l.lineSpeedMinMPerMin), 3)}–${show(units, "speedMPerMin", l.lineSpeedMaxMPerMin)}`;
  const oven = line ? powderOven(line) : null;

  function edit(s: ScenarioView | null) {
    setEditing(s);
    setFields({});
    setMessage(null);
    setName(s?.name ?? "");
    setLineId(s ? String(s.lineId) : "");
    setWithPart(s === null);
    setTexts(() => {
      const next = { ...EMPTY };
      if (s) for (const f of Object.keys(OVERRIDES) as Override[]) if (s.overrides[f] !== undefined) next[f] = fieldText(units, OVERRIDES[f], s.overrides[f]!);
      return next;
    });
  }

  const localError = (f: Override): string | undefined => {
    if (texts[f].trim() === "") return undefined;
    const v = stored(f);
    if (v === null) return "Enter a number, or leave it empty to keep the line's own.";
    // the range is the line's own and inclusive; the server checks it again
    if (f === "lineSpeedMPerMin" && line?.kind === "conveyor") {
      const slack = 1e-9 * Math.max(Math.abs(v), 1);
      if (v < line.lineSpeedMinMPerMin - slack || v > line.lineSpeedMaxMPerMin + slack) {
        return `Enter a speed within the line's range ${speedRange(line)}.`;
      }
    }
    return undefined;
  };

  async function save(e: React.FormEvent) {
    e.preventDefault();
    const errs: Record<string, string> = {};
    if (!name.trim()) errs.name = "Enter the scenario's name.";
    if (!line) errs.lineId = "Choose the line it changes.";
    for (const f of Object.keys(OVERRIDES) as Override[]) if (localError(f)) errs[`overrides.${f}`] = localError(f)!;
    if (Object.keys(errs).length) {
      setFields(errs);
      setMessage({ text: "Check the marked fields.", error: true });
      return;
    }
    const overrides: Record<string, number> = {};
    for (const f of Object.keys(OVERRIDES) as Override[]) {
      if (line!.kind === "batch" && CONVEYOR_ONLY.includes(f)) continue;
      const v = stored(f);
      if (v !== null) overrides[f] = v;
    }
    const body = {
      name: name.trim(),
      lineId: line!.id,
      overrides,
      part: withPart ? currentPart : (editing?.part ?? null),
      coatingId: withPart ? currentCoatingId : (editing?.coatingId ?? null),
    };
    setBusy(true);
    try {
      const r = editing
        ? await sendJson<{ scenario: ScenarioView }>(`/api/scenarios/${editing.id}`, "PUT", body)
        : await sendJson<{ scenario: ScenarioView }>("/api/scenarios", "POST", body);
      await onChanged();
      if (!editing) onSaved(r.scenario.id);
      setFields({});
      setMessage({ text: `Saved ${r.scenario.name}${editing ? "" : "; it is ticked for the comparison above"}.`, error: false });
      setEditing(r.scenario);
      setWithPart(false);
    } catch (err) {
      if (err instanceof FetchError) {
        setFields(err.fields);
        setMessage({ text: err.message, error: true });
      } else setMessage({ text: "Not saved; try again.", error: true });
    } finally {
      setBusy(false);
    }
  }

  async function act(what: "duplicate" | "delete", s: ScenarioView) {
    setBusy(true);
    setConfirmDelete(null);
    try {
      if (what === "duplicate") {
        const r = await sendJson<{ scenario: ScenarioView }>(`/api/scenarios/${s.id}/duplicate`, "POST");
        await onChanged();
        edit(r.scenario);
        setMessage({ text: `Copied as ${r.scenario.name}; edit it below.`, error: false });
      } else {
        await sendJson(`/api/scenarios/${s.id}`, "DELETE");
        await onChanged();
        if (editing?.id === s.id) edit(null);
        setMessage({ text: `Deleted ${s.name}.`, error: false });
      }
    } catch (err) {
      setMessage({ text: err instanceof Error ? err.message : "That did not work; try again.", error: true });
    } finally {
      setBusy(false);
    }
  }

  const hint = (f: Override): string | undefined => {
    if (!line) return undefined;
    if (line.kind === "batch") {
      if (f === "airTempC") return `Empty: the oven's ${show(units, "temperatureC", line.airTempC)}.`;
      if (f === "partsPerCarrier") return "Per rack. Empty: from the racking plan.";
      return undefined;
    }
    if (f === "lineSpeedMPerMin") return `Empty: the fastest that cures. Range ${speedRange(line)}.`;
    if (f === "carrierPitchM") return `Empty: the line's ${show(units, "lengthM", line.carrierPitchM)}.`;
    if (f === "partsPerCarrier") return "Empty: from the racking plan.";
    if (f === "ovenLengthM") return oven ? `${oven.name}; empty: its ${show(units, "lengthM", oven.lengthM)}.` : "This line has no powder cure oven.";
    if (f === "airTempC") return oven?.tempC != null ? `${oven.name}; empty: its ${show(units, "temperatureC", oven.tempC)}.` : undefined;
    return undefined;
  };
  const overrideField = (f: Override, label: string) => {
    if (line?.kind === "batch" && CONVEYOR_ONLY.includes(f)) return null;
    const kind = OVERRIDES[f];
    return (
      <TextField
        key={f}
        label={kind ? `${label} (${unitOf(units, kind)})` : label}
        name={f}
        value={texts[f]}
        onChange={set(f)}
        inputMode="decimal"
        hint={hint(f)}
        error={localError(f) ?? fields[`overrides.${f}`]}
      />
    );
  };

  return (
    <section className="card space-y-4" aria-labelledby="scenarios-h">
      <h2 id="scenarios-h">Scenarios</h2>
      {scenarios.length === 0 ? (
        <p className="text-sm text-ink-soft">No scenarios saved yet.</p>
      ) : (
        <table className="w-full text-sm" data-testid="scenario-list">
          <thead>
            <tr className="border-b border-plate-line text-left text-ink-soft">
              <th scope="col" className="py-1 pr-3 font-medium">Name</th>
              <th scope="col" className="py-1 pr-3 font-medium">Line</th>
              <th scope="col" className="py-1 pr-3 font-medium">What changes</th>
              <th scope="col" className="py-1 pr-3 font-medium">Made by</th>
              <th scope="col" className="py-1"><span className="sr-only">Actions</span></th>
            </tr>
          </thead>
          <tbody>
            {scenarios.map((s) => (
              <tr key={s.id} className="border-b border-plate-line/60 align-top" data-scenario={s.name}>
                <td className="py-1.5 pr-3 font-medium">{s.name}</td>
                <td className="py-1.5 pr-3">{s.lineName}</td>
                <td className="num py-1.5 pr-3">{changes(s, units)}</td>
                <td className="py-1.5 pr-3 text-ink-soft">{s.createdByName ?? "–"}</td>
                <td className="py-1.5">
                  <div className="flex flex-wrap justify-end gap-1.5">
                    {s.part && (
                      <button type="button" className="btn-quiet" onClick={() => onUsePart(s.part!, s.coatingId)} aria-label={`Use its part and powder above: ${s.name}`}>
                        Use its part
                      </button>
                    )}
                    {canEdit && confirmDelete === s.id ? (
                      <>
                        <button type="button" className="btn-danger" disabled={busy} onClick={() => act("delete", s)}>Yes, delete {s.name}</button>
                        <button type="button" className="btn-quiet" onClick={() => setConfirmDelete(null)}>Keep it</button>
                      </>
                    ) : canEdit ? (
                      <>
                        <button type="button" className="btn-quiet" onClick={() => edit(s)} aria-label={`Edit ${s.name}`}>Edit</button>
                        <button type="button" className="btn-quiet" disabled={busy} onClick={() => act("duplicate", s)} aria-label={`Duplicate ${s.name}`}>Duplicate</button>
                        <button type="button" className="btn-quiet" onClick={() => setConfirmDelete(s.id)} aria-label={`Delete ${s.name}`}>Delete…</button>
                      </>
                    ) : null}
                  </div>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}

      {message && (
        <p role={message.error ? "alert" : "status"} className={`text-sm ${message.error ? "text-oxide" : "text-pass"}`}>{message.text}</p>
      )}

      {canEdit ? (
        <form onSubmit={save} className="space-y-3 border-t border-plate-line pt-3" noValidate aria-labelledby="scenario-form-h">
          <div className="flex items-center gap-3">
            <h3 id="scenario-form-h" className="font-semibold">{editing ? `Edit ${editing.name}` : "New scenario"}</h3>
            {editing && (
              <button type="button" className="btn-quiet ml-auto" onClick={() => edit(null)}>Start a new one</button>
            )}
          </div>
          <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
            <TextField label="Scenario name" name="scenario-name" value={name} onChange={setName} error={fields.name} />
            <div>
              <label htmlFor="scenario-line" className="label">Base line</label>
              <select id="scenario-line" className="field" value={lineId} onChange={(e) => setLineId(e.target.value)} aria-invalid={fields.lineId ? true : undefined}>
                <option value="">— choose —</option>
                {lines.map((l) => (
                  <option key={l.id} value={l.id}>{l.name}</option>
                ))}
              </select>
              {fields.lineId && <p className="field-error">{fields.lineId}</p>}
            </div>
          </div>
          {line && (
            <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-5">
              {overrideField("lineSpeedMPerMin", "Line speed")}
              {overrideField("carrierPitchM", "Carrier pitch")}
              {overrideField("partsPerCarrier", "Parts per carrier")}
              {overrideField("ovenLengthM", "Powder oven length")}
              {overrideField("airTempC", "Oven air temperature")}
            </div>
          )}
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" checked={withPart} onChange={(e) => setWithPart(e.target.checked)} />
            {editing ? "Replace its part and powder with the ones chosen above" : "Save the part and powder chosen above with it"}
          </label>
          {(fields.coatingId || fields["part.partId"]) && <p className="field-error">{fields.coatingId ?? fields["part.partId"]}</p>}
          <aside className="rounded-md border border-caution-edge bg-caution-light p-3 text-xs">
            A faster conveyor, a hotter oven or a longer oven changes the oven&apos;s heat and exhaust load and how hot parts come off the line. Treat a
            scenario as arithmetic: before running it for real, check it against the oven&apos;s safety settings (NFPA 86), the booth&apos;s limits and the
            plant&apos;s own procedures.
          </aside>
          <button type="submit" className="btn-primary" disabled={busy}>{busy ? "Saving…" : editing ? "Save changes" : "Save scenario"}</button>
        </form>
      ) : (
        <p className="text-xs text-ink-faint">Managers save and change scenarios; you can compare them above.</p>
      )}
    </section>
  );
}
