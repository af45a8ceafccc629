"use client";
// Editing one recorded film check: its readings cell by cell, gauge, spec override and notes.
// Cells are checked as they are typed (the same parser as entry); nothing is sent while a cell is
// bad, and the server's own refusals (a short spot, a reversed spec) come back onto the cells.

import { useRef, useState } from "react";
import { FetchError, sendJson } from "@/lib/fetcher";
import { fromDisplay, toDisplay, type UnitSystem } from "@/lib/coating-math/display-units";
import { parseCell } from "@/lib/film-checks/readings";
import type { CoatSpec, FilmCheckView, GaugeView } from "@/lib/server/film-checks";

interface Props {
  check: FilmCheckView;
  coats: CoatSpec[];
  gauges: GaugeView[];
  unitSystem: UnitSystem;
  onSaved: () => void;
  onCancel: () => void;
}

/** A cell remembers the stored value it was opened with, so untouched cells keep it exactly (no round trip through mil). */
interface Cell {
  id: string;
  text: string;
  orig: { text: string; um: number } | null;
}
interface Spot {
  id: string;
  cells: Cell[];
}
interface Area {
  id: string;
  spots: Spot[];
}

let nextId = 0;
const newId = () => `c${++nextId}`;

const READINGS_PER_NEW_SPOT = 3;
const SPOTS_PER_NEW_AREA = 5;

function shownText(um: number, sys: UnitSystem): string {
  return String(Number(toDisplay("filmUm", um, sys).value.toFixed(sys === "us" ? 2 : 1)));
}

function cellFrom(um: number, sys: UnitSystem): Cell {
  const text = shownText(um, sys);
  return { id: newId(), text, orig: { text, um } };
}
const blankCell = (): Cell => ({ id: newId(), text: "", orig: null });
const blankSpot = (): Spot => ({ id: newId(), cells: Array.from({ length: READINGS_PER_NEW_SPOT }, blankCell) });

/** null for a blank cell (dropped), else the value in µm or why it is not one. */
function cellValue(c: Cell, sys: UnitSystem): { um: number } | { error: string } | null {
  if (c.orig && c.text === c.orig.text) return { um: c.orig.um };
  if (c.text.trim() === "") return null;
  const r = parseCell(c.text, sys);
  return "valueUm" in r ? { um: r.valueUm } : { error: r.message };
}

/** A spec field: blank = the coating's (null), unchanged = the stored value, else the typed number. */
function specValue(text: string, orig: { text: string; um: number | null }, sys: UnitSystem): { um: number | null } | { error: string } {
  if (text === orig.text) return { um: orig.um };
  const t = text.trim().replace(/^(\d+),(\d+)$/, "$1.$2");
  if (t === "") return { um: null };
  const n = Number(t);
  if (!Number.isFinite(n)) return { error: `Enter a number of ${toDisplay("filmUm", 1, sys).unit}, or leave blank.` };
  return { um: fromDisplay("filmUm", n, sys) };
}

export function CheckEditor({ check, coats, gauges, unitSystem: sys, onSaved, onCancel }: Props) {
  const unit = toDisplay("filmUm", 1, sys).unit;
  const root = useRef<HTMLDivElement>(null);
  const saveRef = useRef<HTMLButtonElement>(null);
  const pa2 = check.rule === "sspc-pa2";
  const idp = `edit-${check.id}`;

  const [areas, setAreas] = useState<Area[]>(() =>
    (check.areas ?? []).map((spots) => ({ id: newId(), spots: spots.map((rs) => ({ id: newId(), cells: rs.map((um) => cellFrom(um, sys)) })) })),
  );
  const [flat, setFlat] = useState<Cell[]>(() => (check.readingsUm ?? []).map((um) => cellFrom(um, sys)));
  const [coatIndex, setCoatIndex] = useState(check.coatIndex);
  const [gaugeId, setGaugeId] = useState<number | null>(check.gaugeId);
  const specOrig = (um: number | null) => ({ text: um === null ? "" : shownText(um, sys), um });
  const [origMin] = useState(() => specOrig(check.specMinOverrideUm));
  const [origMax] = useState(() => specOrig(check.specMaxOverrideUm));
  const [origNominal] = useState(() => specOrig(check.nominalUm));
  const [specMin, setSpecMin] = useState(origMin.text);
  const [specMax, setSpecMax] = useState(origMax.text);
  const [nominal, setNominal] = useState(origNominal.text);
  const [notes, setNotes] = useState(check.notes);
  const [saving, setSaving] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const [serverCells, setServerCells] = useState<Record<string, string>>({});
  const [serverFields, setServerFields] = useState<Record<string, string>>({});
  const [otherErrors, setOtherErrors] = useState<string[]>([]);

  // --- what would be sent, the bad cells, and where each sent path came from
  const localErrors: { id: string; label: string; message: string }[] = [];
  const pathToId: Record<string, string> = {};
  const outAreas: number[][][] = [];
  const outFlat: number[] = [];
  if (pa2) {
    areas.forEach((a, i) => {
      const outSpots: number[][] = [];
      a.spots.forEach((s, j) => {
        const vals: number[] = [];
        s.cells.forEach((c, k) => {
          const v = cellValue(c, sys);
          if (v === null) return;
          if ("error" in v) {
            localErrors.push({ id: c.id, label: `Area ${i + 1}, spot ${j + 1}, reading ${k + 1}`, message: v.error });
            return;
          }
          pathToId[`areas.${outAreas.length}.${outSpots.length}.${vals.length}`] = c.id;
          vals.push(v.um);
        });
        if (vals.length) {
          pathToId[`areas.${outAreas.length}.${outSpots.length}`] = s.id;
          outSpots.push(vals);
        }
      });
      if (outSpots.length) {
        pathToId[`areas.${outAreas.length}`] = a.id;
        outAreas.push(outSpots);
      }
    });
  } else {
    flat.forEach((c, k) => {
      const v = cellValue(c, sys);
      if (v === null) return;
      if ("error" in v) {
        localErrors.push({ id: c.id, label: `Reading ${k + 1}`, message: v.error });
        return;
      }
      pathToId[`readingsUm.${outFlat.length}`] = c.id;
      outFlat.push(v.um);
    });
  }
  const min = specValue(specMin, origMin, sys);
  const max = specValue(specMax, origMax, sys);
  const nom = specValue(nominal, origNominal, sys);
  const fieldError = (name: string, v: { error: string } | { um: number | null }) => ("error" in v ? v.error : serverFields[name]);
  const localById = new Map(localErrors.map((e) => [e.id, e.message]));
  const localCount = localErrors.length + ["error" in min, "error" in max, !pa2 && "error" in nom].filter(Boolean).length;

  function clearServer(id: string) {
    if (!serverCells[id]) return;
    setServerCells((prev) => {
      const rest = { ...prev };
      delete rest[id];
      return rest;
    });
  }

  function focusNext(e: React.KeyboardEvent<HTMLInputElement>) {
    if (e.key !== "Enter") return;
    e.preventDefault();
    const all = [...(root.current?.querySelectorAll<HTMLInputElement>("input[data-cell]") ?? [])];
    const next = all[all.indexOf(e.currentTarget) + 1];
    (next ?? saveRef.current)?.focus();
  }

  function cellInput(c: Cell, label: string, onText: (t: string) => void) {
    const err = localById.get(c.id) ?? serverCells[c.id];
    return (
      <input
        key={c.id}
        data-cell
        data-bad={err ? "true" : undefined}
        className={`field w-20 num ${err ? "bg-oxide-light" : ""}`}
        inputMode="decimal"
        autoComplete="off"
        aria-label={`${label} (${unit})`}
        aria-invalid={err ? true : undefined}
        title={err}
        value={c.text}
        onChange={(e) => {
          clearServer(c.id);
          onText(e.target.value);
        }}
        onKeyDown={focusNext}
      />
    );
  }

  const setCell = (ai: number, si: number, ci: number, text: string) =>
    setAreas((prev) =>
      prev.map((a, i) =>
        i !== ai ? a : { ...a, spots: a.spots.map((s, j) => (j !== si ? s : { ...s, cells: s.cells.map((c, k) => (k !== ci ? c : { ...c, text })) })) },
      ),
    );
  const addReading = (ai: number, si: number) =>
    setAreas((prev) => prev.map((a, i) => (i !== ai ? a : { ...a, spots: a.spots.map((s, j) => (j !== si ? s : { ...s, cells: [...s.cells, blankCell()] })) })));
  const addSpot = (ai: number) => setAreas((prev) => prev.map((a, i) => (i !== ai ? a : { ...a, spots: [...a.spots, blankSpot()] })));
  const addArea = () => setAreas((prev) => [...prev, { id: newId(), spots: Array.from({ length: SPOTS_PER_NEW_AREA }, blankSpot) }]);

  async function save() {
    setMessage(null);
    setOtherErrors([]);
    if (localCount > 0) {
      setMessage(`Fix the ${localCount === 1 ? "marked entry" : `${localCount} marked entries`} first; nothing was saved.`);
      root.current?.querySelector<HTMLElement>("[aria-invalid=true]")?.focus();
      return;
    }
    const common = {
      coatIndex,
      gaugeId,
      specMinUm: "um" in min ? min.um : null,
      specMaxUm: "um" in max ? max.um : null,
      notes,
    };
    const body = pa2 ? { rule: check.rule, ...common, areas: outAreas } : { rule: check.rule, ...common, nominalUm: "um" in nom ? nom.um : null, readingsUm: outFlat };
    setSaving(true);
    try {
      await sendJson(`/api/film-checks/${check.id}`, "PUT", body);
      onSaved();
    } catch (e) {
      const f = e instanceof FetchError ? e : null;
      const cells: Record<string, string> = {};
      const named: Record<string, string> = {};
      const other: string[] = [];
      for (const [path, msg] of Object.entries(f?.fields ?? {})) {
        if (pathToId[path]) cells[pathToId[path]] = msg;
        else if (["specMinUm", "specMaxUm", "nominalUm", "gaugeId", "notes", "coatIndex"].includes(path)) named[path] = msg;
        else other.push(msg);
      }
      setServerCells(cells);
      setServerFields(named);
      setOtherErrors(other);
      setMessage(`${f?.message ?? "Could not save the changes."} Nothing was saved.`);
    } finally {
      setSaving(false);
    }
  }

  const spotErrors = (id: string) => serverCells[id];
  const usable = gauges.filter((g) => g.retiredOn === null || g.id === check.gaugeId);
  const err = (name: string, v: { error: string } | { um: number | null }) => {
    const m = fieldError(name, v);
    return m ? <p id={`${idp}-${name}-err`} className="field-error">{m}</p> : null;
  };

  return (
    <div
      ref={root}
      className="space-y-3 rounded-md border border-phosphate bg-plate p-3"
      role="group"
      aria-label={`Edit film check of coat ${check.coatIndex + 1}`}
      onKeyDown={(e) => {
        if (e.key === "Escape") onCancel();
      }}
    >
      <div className="flex flex-wrap gap-3">
        <div>
          <label htmlFor={`${idp}-coat`} className="label">Coat</label>
          <select id={`${idp}-coat`} className="field" value={coatIndex} onChange={(e) => setCoatIndex(Number(e.target.value))}>
            {coats.map((c) => (
              <option key={c.coatIndex} value={c.coatIndex}>{`${c.coatIndex + 1}: ${c.coatingCode} ${c.coatingName}`}</option>
            ))}
          </select>
          {serverFields.coatIndex && <p className="field-error">{serverFields.coatIndex}</p>}
        </div>
        <div>
          <label htmlFor={`${idp}-gauge`} className="label">Gauge</label>
          <select id={`${idp}-gauge`} className="field" value={gaugeId ?? ""} onChange={(e) => setGaugeId(e.target.value ? Number(e.target.value) : null)}>
            <option value="">Not recorded</option>
            {usable.map((g) => (
              <option key={g.id} value={g.id}>{`${g.name}${g.retiredOn ? " (retired)" : ""}`}</option>
            ))}
          </select>
          {serverFields.gaugeId && <p className="field-error">{serverFields.gaugeId}</p>}
        </div>
        <div>
          <label htmlFor={`${idp}-min`} className="label">{`Spec min (${unit}, blank: coating's)`}</label>
          <input id={`${idp}-min`} className="field w-28 num" inputMode="decimal" value={specMin} aria-invalid={fieldError("specMinUm", min) ? true : undefined} aria-describedby={fieldError("specMinUm", min) ? `${idp}-specMinUm-err` : undefined} onChange={(e) => setSpecMin(e.target.value)} />
          {err("specMinUm", min)}
        </div>
        <div>
          <label htmlFor={`${idp}-max`} className="label">{`Spec max (${unit}, blank: coating's)`}</label>
          <input id={`${idp}-max`} className="field w-28 num" inputMode="decimal" value={specMax} aria-invalid={fieldError("specMaxUm", max) ? true : undefined} aria-describedby={fieldError("specMaxUm", max) ? `${idp}-specMaxUm-err` : undefined} onChange={(e) => setSpecMax(e.target.value)} />
          {err("specMaxUm", max)}
        </div>
        {!pa2 && (
          <div>
            <label htmlFor={`${idp}-nom`} className="label">{`Nominal (${unit}, blank: spec min)`}</label>
            <input id={`${idp}-nom`} className="field w-28 num" inputMode="decimal" value={nominal} aria-invalid={fieldError("nominalUm", nom) ? true : undefined} aria-describedby={fieldError("nominalUm", nom) ? `${idp}-nominalUm-err` : undefined} onChange={(e) => setNominal(e.target.value)} />
            {err("nominalUm", nom)}
          </div>
        )}
        <div className="min-w-64 flex-1">
          <label htmlFor={`${idp}-notes`} className="label">Notes</label>
          <input id={`${idp}-notes`} className="field" maxLength={2000} value={notes} onChange={(e) => setNotes(e.target.value)} />
          {serverFields.notes && <p className="field-error">{serverFields.notes}</p>}
        </div>
      </div>

      <p className="text-xs text-ink-faint">{`Readings in ${unit}. Enter moves to the next cell; clear a cell to drop that reading (an emptied spot or area is dropped). Esc cancels.`}</p>

      {pa2 ? (
        <div className="space-y-2">
          {areas.map((a, i) => (
            <fieldset key={a.id} className="rounded border border-plate-line p-2">
              <legend className="px-1 text-sm font-medium">{`Area ${i + 1}`}</legend>
              {spotErrors(a.id) && <p className="field-error">{spotErrors(a.id)}</p>}
              {a.spots.map((s, j) => (
                <div key={s.id} className="flex flex-wrap items-center gap-1 py-0.5">
                  <span className="w-14 text-xs text-ink-soft">{`Spot ${j + 1}`}</span>
                  {s.cells.map((c, k) => cellInput(c, `Area ${i + 1}, spot ${j + 1}, reading ${k + 1}`, (t) => setCell(i, j, k, t)))}
                  <button type="button" className="btn-quiet px-2 py-0.5" aria-label={`Add a reading to area ${i + 1}, spot ${j + 1}`} onClick={() => addReading(i, j)}>+</button>
                  {spotErrors(s.id) && <span className="field-error mt-0">{spotErrors(s.id)}</span>}
                </div>
              ))}
              <button type="button" className="btn-quiet mt-1 text-xs" onClick={() => addSpot(i)}>{`Add a spot to area ${i + 1}`}</button>
            </fieldset>
          ))}
          <button type="button" className="btn-quiet text-xs" onClick={addArea}>Add an area (5 spots)</button>
        </div>
      ) : (
        <div className="flex flex-wrap items-center gap-1">
          {flat.map((c, k) => cellInput(c, `Reading ${k + 1}`, (t) => setFlat((prev) => prev.map((x, n) => (n === k ? { ...x, text: t } : x)))))}
          <button type="button" className="btn-quiet px-2 py-0.5" aria-label="Add a reading" onClick={() => setFlat((prev) => [...prev, blankCell()])}>+</button>
        </div>
      )}

      {(localErrors.length > 0 || message || otherErrors.length > 0) && (
        <div role="alert" className="text-sm text-oxide">
          {message && <p>{message}</p>}
          {localErrors.length > 0 && (
            <ul className="list-disc pl-5">{localErrors.map((e) => <li key={e.id}>{`${e.label}: ${e.message}`}</li>)}</ul>
          )}
          {otherErrors.length > 0 && <ul className="list-disc pl-5">{otherErrors.map((m) => <li key={m}>{m}</li>)}</ul>}
        </div>
      )}

      <div className="flex gap-2">
        <button ref={saveRef} type="button" className="btn-primary" disabled={saving} onClick={() => void save()}>
          {saving ? "Saving…" : "Save changes"}
        </button>
        <button type="button" className="btn-quiet" onClick={onCancel}>Cancel</button>
      </div>
    </div>
  );
}
