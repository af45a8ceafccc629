"use client";
import { useRouter } from "next/navigation";
import { useId, useMemo, useState } from "react";
import useSWR from "swr";
import { sendJson } from "@/lib/fetcher";
import type { CoatingsList } from "@/app/api/coatings/route";
import type { LinesList } from "@/app/api/lines/route";
import type { LoggersList } from "@/app/api/loggers/route";
import type { ProfileCreated } from "@/app/api/profiles/route";
import type { ProfilePreviewResponse } from "@/app/api/profiles/preview/route";
import type { PreviewRow, ProfilePreview } from "@/lib/server/profiles";
import type { ColumnMapping, TemperatureUnit, TimeFormat } from "@/lib/profiles/mapping";
import type { ProfileProblem } from "@/lib/profiles/problems";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { TextField } from "@/components/ui/text-field";
import { deltaDraft, deltaUnit, durationText, lengthDraft, lengthText, lengthUnit, parseDelta, parseLength, tempText } from "./profile-units";

type Role = "time" | "air" | "part" | "unused";
interface ColumnDraft {
  name: string;
  role: Role;
  label: string;
  thickness: string;
}
interface Draft {
  timeFormat: TimeFormat;
  temperatureUnit: TemperatureUnit;
  columns: ColumnDraft[];
}

const NEW_LOGGER = "__new__";
type RefusedBody = { error?: { message?: string; fields?: Record<string, string>; problems?: ProfileProblem[] } };
/** The JSON body limit is 1 MB; the file travels inside it as text. */
const MAX_FILE_CHARS = 990_000;
const ROLE_LABELS: Record<Role, string> = { time: "Time", air: "Air probe", part: "Part probe", unused: "Not used" };

function draftFrom(header: string[], m: ColumnMapping, sys: UnitSystem): Draft {
  return {
    timeFormat: m.timeFormat,
    temperatureUnit: m.temperatureUnit,
    columns: header.map((name) => {
      const probe = m.probes.find((p) => p.column === name);
      if (name === m.timeColumn) return { name, role: "time", label: "", thickness: "" };
      if (name === m.airColumn) return { name, role: "air", label: "", thickness: "" };
      if (probe) return { name, role: "part", label: probe.label === name ? "" : probe.label, thickness: lengthDraft(probe.thicknessMm, sys) };
      return { name, role: "unused", label: "", thickness: "" };
    }),
  };
}

/** The draft as the API's mapping; a thickness that is not a number goes as null (the check names it). */
function mappingFrom(d: Draft, sys: UnitSystem): ColumnMapping {
  return {
    timeColumn: d.columns.find((c) => c.role === "time")?.name ?? null,
    timeFormat: d.timeFormat,
    temperatureUnit: d.temperatureUnit,
    airColumn: d.columns.find((c) => c.role === "air")?.name ?? null,
    probes: d.columns
      .filter((c) => c.role === "part")
      .map((c) => {
        const mm = parseLength(c.thickness, sys);
        return { column: c.name, label: c.label.trim(), thicknessMm: mm === undefined || Number.isNaN(mm) || mm <= 0 ? null : mm };
      }),
  };
}

const today = () => new Date().toISOString().slice(0, 10);

/** Upload a logger CSV → map its columns → check it (bad cells shown) → save. */
export function ImportWizard({ unitSystem: sys, onClose }: { unitSystem: UnitSystem; onClose: () => void }) {
  const ids = useId();
  const router = useRouter();
  const { data: loggers } = useSWR<LoggersList>("/api/loggers");
  const { data: lines, error: linesError } = useSWR<LinesList>("/api/lines");
  const { data: coatings, error: coatingsError } = useSWR<CoatingsList>("/api/coatings");

  const [file, setFile] = useState<{ name: string; text: string } | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const [loggerPick, setLoggerPick] = useState("");
  const [newLogger, setNewLogger] = useState("");
  const [draft, setDraft] = useState<Draft | null>(null);
  const [preview, setPreview] = useState<ProfilePreview | null>(null);
  const [mappingNote, setMappingNote] = useState<string | null>(null);
  const [checked, setChecked] = useState(false);
  const [busy, setBusy] = useState(false);
  const [name, setName] = useState("");
  const [lineId, setLineId] = useState("");
  const [oven, setOven] = useState("");
  const [coatingId, setCoatingId] = useState("");
  const [runId, setRunId] = useState("");
  const [measuredOn, setMeasuredOn] = useState(today());
  const [margin, setMargin] = useState(deltaDraft(20, sys));
  const [notes, setNotes] = useState("");
  const [fields, setFields] = useState<Record<string, string>>({});
  const [saveError, setSaveError] = useState<string | null>(null);

  const lineList = lines?.lines ?? [];
  const line = lineList.find((l) => String(l.id) === lineId) ?? lineList[0];
  const ovens = useMemo(() => {
    if (!line) return [];
    if (line.kind === "batch") return [{ value: "batch", label: `${line.name} (the oven itself)` }];
    return line.stages.filter((s) => s.kind === "cure-oven" || s.kind === "dry-off").map((s) => ({ value: String(s.position), label: `${s.name} (stage ${s.position + 1})` }));
  }, [line]);
  const chosenOven = ovens.find((o) => o.value === oven) ?? ovens[ovens.length - 1];
  const loggerName = loggerPick === NEW_LOGGER ? newLogger.trim() : loggerPick;

  async function runPreview(text: string, body: { mapping?: ColumnMapping; loggerName?: string }) {
    setBusy(true);
    try {
      const { preview: p } = await sendJson<ProfilePreviewResponse>("/api/profiles/preview", "POST", { csv: text, ...body });
      setPreview(p);
      return p;
    } catch (e) {
      setFileError(e instanceof Error ? e.message : "The file could not be checked.");
      setPreview(null);
      return null;
    } finally {
      setBusy(false);
    }
  }

  /** A new file or a new logger: ask the server for the mapping to start from. */
  async function startMapping(text: string, logger: string) {
    const p = await runPreview(text, logger && logger !== NEW_LOGGER ? { loggerName: logger } : {});
    setChecked(false);
    if (!p || !p.mapping) {
      setDraft(null);
      return;
    }
    setDraft(draftFrom(p.header, p.mapping, sys));
    setMappingNote(
      p.mappingSource === "logger"
        ? `Columns mapped as in ${logger}'s last file. Check the thicknesses: they may differ this time.`
        : "Columns guessed from the header: check each one, and enter the section thickness under every part probe.",
    );
  }

  async function onFile(e: React.ChangeEvent<HTMLInputElement>) {
    const f = e.target.files?.[0];
    setFileError(null);
    setPreview(null);
    setDraft(null);
    if (!f) return setFile(null);
    const text = await f.text();
    if (text.length > MAX_FILE_CHARS) {
      setFile(null);
      return setFileError(`The file is ${Math.round(text.length / 1000)} kB; at most ${MAX_FILE_CHARS / 1000} kB can be imported. Log less often or split the run.`);
    }
    setFile({ name: f.name, text });
    if (!name) setName(f.name.replace(/\.[^.]+$/, ""));
    await startMapping(text, loggerPick);
  }

  async function onLogger(value: string) {
    setLoggerPick(value);
    if (file && value && value !== NEW_LOGGER) await startMapping(file.text, value);
  }

  function edit(fn: (d: Draft) => Draft) {
    setDraft((d) => (d ? fn(d) : d));
    setChecked(false);
  }
  function setRole(i: number, role: Role) {
    edit((d) => ({
      ...d,
      // one time column and one air probe: picking it elsewhere frees the old one
      columns: d.columns.map((c, k) => (k === i ? { ...c, role } : (role === "time" || role === "air") && c.role === role ? { ...c, role: "unused" } : c)),
    }));
  }
  function setColumn(i: number, patch: Partial<ColumnDraft>) {
    edit((d) => ({ ...d, columns: d.columns.map((c, k) => (k === i ? { ...c, ...patch } : c)) }));
  }

  async function check() {
    if (!file || !draft) return;
    const p = await runPreview(file.text, { mapping: mappingFrom(draft, sys) });
    setChecked(!!p?.ok);
  }

  async function save(e: React.FormEvent) {
    e.preventDefault();
    if (!file || !draft) return;
    const local: Record<string, string> = {};
    const marginK = parseDelta(margin, sys);
    if (marginK === undefined || Number.isNaN(marginK) || marginK < 0) local.overbakeMarginK = `Enter a margin of 0 ${deltaUnit(sys)} or more.`;
    if (!coatingId) local.coatingId = "Choose the coating to judge the cure against.";
    if (!name.trim()) local.name = "Enter a name for the profile.";
    if (loggerPick === NEW_LOGGER && !newLogger.trim()) local.loggerName = "Enter the new logger's name or serial.";
    if (!line || !chosenOven) local.stagePosition = "Choose the oven the logger went through.";
    setFields(local);
    setSaveError(null);
    if (Object.keys(local).length) return;
    setBusy(true);
    try {
      const res = await fetch("/api/profiles", {
        method: "POST",
        headers: { "content-type": "application/json", accept: "application/json" },
        body: JSON.stringify({
          name: name.trim(),
          lineId: line!.id,
          stagePosition: chosenOven!.value === "batch" ? null : Number(chosenOven!.value),
          coatingId: Number(coatingId),
          runId: runId.trim() || null,
          ...(loggerName ? { loggerName } : {}),
          fileName: file.name,
          measuredOn: measuredOn || null,
          notes,
          overbakeMarginK: marginK,
          csv: file.text,
          mapping: mappingFrom(draft, sys),
        }),
      });
      const body = (await res.json().catch(() => null)) as (ProfileCreated & RefusedBody) | null;
      if (res.ok && body?.profile) return router.push(`/profiles/${body.profile.id}`);
      // a refused import lists every problem (the shared fetcher keeps only the fields)
      const error = body?.error;
      setFields(error?.fields ?? {});
      if (error?.problems && preview) setPreview({ ...preview, ok: false, problems: error.problems });
      setChecked(false);
      setSaveError(error?.message ?? `The profile was not saved (${res.status}).`);
    } catch {
      setSaveError("The profile was not saved: the server could not be reached.");
    } finally {
      setBusy(false);
    }
  }

  const badCells = new Map((preview?.problems ?? []).filter((p) => p.row !== undefined && p.column).map((p) => [`${p.row}|${p.column}`, p.message]));
  const problemFor = (field: string) => preview?.problems.find((p) => p.field === field)?.message;

  return (
    <section className="card space-y-5" aria-labelledby={`${ids}-h`}>
      <div className="flex items-start gap-3">
        <div className="grow">
          <h2 id={`${ids}-h`}>Import a profile</h2>
          <p className="text-sm text-ink-soft">A CSV from a temperature data logger: a time column, the air probe and one or more probes clamped to parts. Nothing is stored until every column reads cleanly.</p>
        </div>
        <button type="button" className="btn-quiet" onClick={onClose}>Cancel</button>
      </div>

      <fieldset className="space-y-3">
        <legend className="text-base font-semibold">1 · Logger file</legend>
        <div className="grid gap-3 sm:grid-cols-2">
          <div>
            <label className="label" htmlFor={`${ids}-logger`}>Logger</label>
            <select id={`${ids}-logger`} className="field" value={loggerPick} onChange={(e) => onLogger(e.target.value)}>
              <option value="">Not a saved logger (map the columns each time)</option>
              {(loggers?.loggers ?? []).map((l) => (
                <option key={l.id} value={l.name}>{l.name}</option>
              ))}
              <option value={NEW_LOGGER}>A new logger…</option>
            </select>
            <p className="mt-1 text-xs text-ink-faint">The column mapping is remembered per logger for its next file.</p>
          </div>
          {loggerPick === NEW_LOGGER && (
            <TextField label="New logger's name or serial" name="newLogger" value={newLogger} onChange={setNewLogger} error={fields.loggerName} />
          )}
        </div>
        <div>
          <label className="label" htmlFor={`${ids}-file`}>Logger file (CSV)</label>
          <input id={`${ids}-file`} type="file" accept=".csv,.txt,text/csv,text/plain" className="field" onChange={onFile} aria-describedby={fileError ? `${ids}-file-err` : undefined} />
          {fileError && <p id={`${ids}-file-err`} role="alert" className="field-error">{fileError}</p>}
          {file && preview && (
            <p className="mt-1 text-sm text-ink-soft" data-testid="file-facts">
              {file.name}: {preview.rowCount} readings, {preview.header.length} columns
              {preview.skippedLines > 0 && `, ${preview.skippedLines} logger line${preview.skippedLines === 1 ? "" : "s"} above the header skipped`}
              {preview.delimiter !== "," && `, separated by "${preview.delimiter === "\t" ? "tab" : preview.delimiter}"`}.
            </p>
          )}
        </div>
      </fieldset>

      {file && preview && !draft && preview.problems.length > 0 && <ProblemList problems={preview.problems} />}

      {draft && preview && (
        <form className="space-y-5" noValidate onSubmit={save} aria-label="Import a profile">
          <fieldset className="space-y-3">
            <legend className="text-base font-semibold">2 · Map the columns</legend>
            {mappingNote && <p className="text-sm text-ink-soft">{mappingNote}</p>}
            <div className="grid gap-3 sm:grid-cols-2">
              <div>
                <label className="label" htmlFor={`${ids}-tf`}>Time is written as</label>
                <select id={`${ids}-tf`} className="field" value={draft.timeFormat} onChange={(e) => edit((d) => ({ ...d, timeFormat: e.target.value as TimeFormat }))}>
                  <option value="seconds">Seconds from the start</option>
                  <option value="minutes">Minutes from the start</option>
                  <option value="clock">Clock time (hh:mm:ss)</option>
                </select>
              </div>
              <div>
                <label className="label" htmlFor={`${ids}-tu`}>Temperatures are in</label>
                <select id={`${ids}-tu`} className="field" value={draft.temperatureUnit} onChange={(e) => edit((d) => ({ ...d, temperatureUnit: e.target.value as TemperatureUnit }))}>
                  <option value="C">°C</option>
                  <option value="F">°F</option>
                </select>
              </div>
            </div>
            <table className="w-full text-left text-sm" data-testid="column-mapping">
              <thead>
                <tr className="border-b border-plate-line">
                  <th scope="col" className="py-1 pr-3 font-medium">Column</th>
                  <th scope="col" className="py-1 pr-3 font-medium">Holds</th>
                  <th scope="col" className="py-1 pr-3 font-medium">Probe sits on</th>
                  <th scope="col" className="py-1 font-medium">Section thickness ({lengthUnit(sys)})</th>
                </tr>
              </thead>
              <tbody>
                {draft.columns.map((c, i) => {
                  const probeIndex = draft.columns.slice(0, i).filter((x) => x.role === "part").length;
                  const thicknessError = c.role === "part" ? problemFor(`mapping.probes.${probeIndex}.thicknessMm`) : undefined;
                  const columnError =
                    c.role === "part" ? problemFor(`mapping.probes.${probeIndex}.column`) : c.role === "air" ? problemFor("mapping.airColumn") : c.role === "time" ? problemFor("mapping.timeColumn") : undefined;
                  return (
                    <tr key={c.name} className="border-b border-plate-line/60 align-top">
                      <th scope="row" className="py-1.5 pr-3 font-normal">{c.name}</th>
                      <td className="py-1.5 pr-3">
                        <select className="field" aria-label={`What column ${c.name} holds`} value={c.role} onChange={(e) => setRole(i, e.target.value as Role)} aria-invalid={columnError ? true : undefined}>
                          {(Object.keys(ROLE_LABELS) as Role[]).map((r) => (
                            <option key={r} value={r}>{ROLE_LABELS[r]}</option>
                          ))}
                        </select>
                        {columnError && <p className="field-error">{columnError}</p>}
                      </td>
                      <td className="py-1.5 pr-3">
                        {c.role === "part" && (
                          <input className="field" aria-label={`Part under ${c.name}`} placeholder={c.name} value={c.label} onChange={(e) => setColumn(i, { label: e.target.value })} />
                        )}
                      </td>
                      <td className="py-1.5">
                        {c.role === "part" && (
                          <>
                            <input
                              className="field num"
                              inputMode="decimal"
                              aria-label={`Section thickness under ${c.name} (${lengthUnit(sys)})`}
                              value={c.thickness}
                              aria-invalid={thicknessError ? true : undefined}
                              onChange={(e) => setColumn(i, { thickness: e.target.value })}
                            />
                            {thicknessError && <p className="field-error">{thicknessError}</p>}
                          </>
                        )}
                      </td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
            <p className="text-xs text-ink-faint">Section thickness: the equivalent thickness of the section under the probe (a plate&apos;s thickness, half a round bar&apos;s diameter).</p>
          </fieldset>

          <fieldset className="space-y-3">
            <legend className="text-base font-semibold">3 · Oven, coating and run</legend>
            <div className="grid gap-3 sm:grid-cols-3">
              <div>
                <label className="label" htmlFor={`${ids}-line`}>Line</label>
                <select id={`${ids}-line`} className="field" value={line ? String(line.id) : ""} onChange={(e) => { setLineId(e.target.value); setOven(""); }}>
                  {!lines && !linesError && <option value="">Loading lines…</option>}
                  {lineList.map((l) => (
                    <option key={l.id} value={l.id}>{l.name}</option>
                  ))}
                </select>
                {linesError && <p className="field-error">Could not load the lines.</p>}
              </div>
              <div>
                <label className="label" htmlFor={`${ids}-oven`}>Oven</label>
                <select id={`${ids}-oven`} className="field" value={chosenOven?.value ?? ""} onChange={(e) => setOven(e.target.value)} aria-invalid={fields.stagePosition ? true : undefined}>
                  {ovens.length === 0 && <option value="">This line has no oven</option>}
                  {ovens.map((o) => (
                    <option key={o.value} value={o.value}>{o.label}</option>
                  ))}
                </select>
                {fields.stagePosition && <p className="field-error">{fields.stagePosition}</p>}
              </div>
              <div>
                <label className="label" htmlFor={`${ids}-coating`}>Coating (its cure schedule)</label>
                <select id={`${ids}-coating`} className="field" value={coatingId} onChange={(e) => setCoatingId(e.target.value)} aria-invalid={fields.coatingId ? true : undefined}>
                  <option value="">{coatings ? "Choose a coating" : coatingsError ? "Could not load the coatings" : "Loading coatings…"}</option>
                  {(coatings?.coatings ?? []).map((c) => (
                    <option key={c.id} value={c.id}>{c.code} · {c.name} ({c.colourName})</option>
                  ))}
                </select>
                {fields.coatingId && <p className="field-error">{fields.coatingId}</p>}
              </div>
              <TextField label="Profile name" name="name" value={name} onChange={setName} error={fields.name} />
              <TextField label="Run id (optional)" name="runId" value={runId} onChange={setRunId} error={fields.runId} />
              <TextField label="Logged on" name="measuredOn" type="date" value={measuredOn} onChange={setMeasuredOn} error={fields.measuredOn} />
              <TextField
                label={`Over-bake margin (${deltaUnit(sys)})`}
                name="overbakeMarginK"
                inputMode="decimal"
                value={margin}
                onChange={setMargin}
                error={fields.overbakeMarginK}
                hint="Above the schedule's highest temperature plus this margin the metal counts as over-baked. The coatings library has no maximum metal temperature; use the coating maker's if you have it."
              />
              <div className="sm:col-span-2">
                <label className="label" htmlFor={`${ids}-notes`}>Notes</label>
                <textarea id={`${ids}-notes`} className="field" rows={2} value={notes} onChange={(e) => setNotes(e.target.value)} />
              </div>
            </div>
          </fieldset>

          <fieldset className="space-y-3">
            <legend className="text-base font-semibold">4 · Check and save</legend>
            <div className="flex flex-wrap gap-2">
              <button type="button" className="btn-quiet" onClick={check} disabled={busy}>Check the file</button>
              <button type="submit" className="btn-primary" disabled={busy || !checked}>Save profile</button>
            </div>
            {!checked && !busy && <p className="text-sm text-ink-soft">Check the file with this mapping before saving it.</p>}
            {preview.problems.length > 0 ? (
              <ProblemList problems={preview.problems} />
            ) : checked && preview.summary ? (
              <div className="rounded-md border border-pass/40 bg-pass-light/50 p-3 text-sm" data-testid="check-ok" role="status">
                <p className="font-medium text-pass">Every cell reads cleanly: {preview.summary.sampleCount} readings over {durationText(preview.summary.durationS)}.</p>
                <ul className="mt-1 ml-5 list-disc">
                  <li>Air peaks at {tempText(preview.summary.airPeakC, sys)}.</li>
                  {preview.summary.probes.map((p) => (
                    <li key={p.label}>
                      {p.label} ({lengthText(p.thicknessMm, sys)}): {tempText(p.startC, sys)} → peak {tempText(p.peakC, sys)}
                    </li>
                  ))}
                </ul>
              </div>
            ) : null}
            {saveError && <p role="alert" className="field-error">{saveError}</p>}
            <PreviewTable preview={preview} badCells={badCells} />
          </fieldset>
        </form>
      )}
    </section>
  );
}

function ProblemList({ problems }: { problems: ProfileProblem[] }) {
  return (
    <div role="alert" className="rounded-md border border-oxide/40 bg-oxide-light/50 p-3 text-sm" data-testid="problems">
      <p className="font-medium text-oxide">
        {problems.length === 1 ? "One problem" : `${problems.length} problems`} to fix; nothing is stored until the file and mapping read cleanly.
      </p>
      <ul className="mt-1 ml-5 list-disc space-y-0.5">
        {problems.map((p, i) => (
          <li key={i}>{p.message}</li>
        ))}
      </ul>
    </div>
  );
}

function PreviewTable({ preview, badCells }: { preview: ProfilePreview; badCells: Map<string, string> }) {
  if (!preview.rows.length) return null;
  const badRows = new Set([...badCells.keys()].map((k) => Number(k.split("|")[0])));
  const bad = preview.rows.filter((r) => badRows.has(r.row));
  const first = preview.rows.filter((r) => !badRows.has(r.row));
  return (
    <div className="space-y-3 text-sm">
      {bad.length > 0 && (
        <div>
          <h3 className="font-semibold text-oxide">Rows with bad cells</h3>
          <RowsTable header={preview.header} rows={bad} badCells={badCells} testId="preview-table" />
        </div>
      )}
      <details open={bad.length === 0}>
        <summary className="cursor-pointer text-ink-soft">The first rows of the file</summary>
        <div className="mt-1 max-h-80 overflow-auto">
          <RowsTable header={preview.header} rows={first} badCells={badCells} testId={bad.length ? "first-rows" : "preview-table"} />
        </div>
      </details>
    </div>
  );
}

function RowsTable({ header, rows, badCells, testId }: { header: string[]; rows: PreviewRow[]; badCells: Map<string, string>; testId: string }) {
  return (
    <table className="w-full text-left" data-testid={testId}>
      <thead className="sticky top-0 bg-plate-raised">
        <tr className="border-b border-plate-line">
          <th scope="col" className="py-1 pr-3 font-medium">Row</th>
          {header.map((h) => (
            <th key={h} scope="col" className="py-1 pr-3 font-medium">{h}</th>
          ))}
        </tr>
      </thead>
      <tbody>
        {rows.map((r) => (
          <tr key={r.row} className="border-b border-plate-line/60">
            <th scope="row" className="num py-0.5 pr-3 font-normal text-ink-soft">{r.row}</th>
            {r.cells.map((cell, k) => {
              const bad = badCells.get(`${r.row}|${header[k]}`);
              return (
                <td key={k} className={`num py-0.5 pr-3 ${bad ? "bg-oxide-light font-semibold text-oxide" : ""}`} title={bad} data-bad={bad ? true : undefined}>
                  {cell === "" ? <span className="text-ink-faint">(empty)</span> : cell}
                </td>
              );
            })}
          </tr>
        ))}
      </tbody>
    </table>
  );
}
