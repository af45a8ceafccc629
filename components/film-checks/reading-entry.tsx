"use client";
// Entering one coat's gauge readings: by keyboard (one reading per Enter), by pasting a column,
// or by importing a gauge's CSV export through a column mapping remembered per gauge.

import { useRef, useState } from "react";
import { parseCell, parseCells, type CellError } from "@/lib/film-checks/readings";
import { readMappedCsv, type CsvMapping } from "@/lib/film-checks/csv-mapping";
import { toDisplay, type UnitSystem } from "@/lib/coating-math/display-units";
import { sendJson } from "@/lib/fetcher";
import type { GaugeView } from "@/lib/server/film-checks";

interface Props {
  unitSystem: UnitSystem;
  readingsUm: number[];
  onChange: (readingsUm: number[]) => void;
  readingsPerSpot: number;
  spotsPerArea: number;
  gauge: GaugeView | null;
  onGaugeSaved: () => void;
}

type Mode = "keys" | "paste" | "csv";

export function ReadingEntry({ unitSystem: sys, readingsUm, onChange, readingsPerSpot, spotsPerArea, gauge, onGaugeSaved }: Props) {
  const [mode, setMode] = useState<Mode>("keys");
  const unit = toDisplay("filmUm", 1, sys).unit;
  const show = (um: number) => Number(toDisplay("filmUm", um, sys).value.toFixed(sys === "us" ? 2 : 1));

  // Keyboard
  const [key, setKey] = useState("");
  const [keyError, setKeyError] = useState<string | null>(null);
  const keyRef = useRef<HTMLInputElement>(null);
  const n = readingsUm.length;
  const spotNo = Math.floor(n / readingsPerSpot);
  // ISO 19840 takes a flat list: the parent passes an unbounded spot size.
  const flat = readingsPerSpot >= 1_000_000;
  const nextLabel = flat
    ? `reading ${n + 1}`
    : `Area ${Math.floor(spotNo / spotsPerArea) + 1}, spot ${(spotNo % spotsPerArea) + 1}, reading ${(n % readingsPerSpot) + 1}`;
  function addKey() {
    if (key.trim() === "") return;
    const r = parseCell(key, sys);
    if ("message" in r) {
      setKeyError(r.message);
      return;
    }
    setKeyError(null);
    onChange([...readingsUm, r.valueUm]);
    setKey("");
  }

  // Paste
  const [paste, setPaste] = useState("");
  const [pasteErrors, setPasteErrors] = useState<CellError[]>([]);
  function applyPaste() {
    const r = parseCells(paste, sys);
    setPasteErrors(r.errors);
    if (r.errors.length === 0 && r.valuesUm.length) {
      onChange([...readingsUm, ...r.valuesUm]);
      setPaste("");
    }
  }

  // CSV
  const [rows, setRows] = useState<string[][] | null>(null);
  const [fileName, setFileName] = useState("");
  const [mapping, setMapping] = useState<CsvMapping>(gauge?.mapping ?? { readingColumn: "", unit: "um" });
  const [csvErrors, setCsvErrors] = useState<CellError[]>([]);
  const [csvProblem, setCsvProblem] = useState<string | null>(null);
  const [remember, setRemember] = useState(true);
  const [csvNote, setCsvNote] = useState<string | null>(null);
  function onFile(file: File | undefined) {
    if (!file) return;
    setFileName(file.name);
    setCsvErrors([]);
    setCsvProblem(null);
    setCsvNote(null);
    // papaparse loads only when a file is chosen: most entry is by keyboard.
    void import("papaparse").then(({ default: Papa }) => Papa.parse<string[]>(file, {
      skipEmptyLines: true,
      complete: (res) => {
        const data = res.data;
        setRows(data);
        const header = (data[0] ?? []).map((h) => h.trim());
        const saved = gauge?.mapping;
        if (saved && header.includes(saved.readingColumn)) setMapping(saved);
        else if (saved) {
          setMapping({ ...saved, readingColumn: "" });
          setCsvProblem(`This file has no "${saved.readingColumn}" column, which ${gauge?.name} is mapped to. Choose the reading column.`);
        } else setMapping((m) => ({ ...m, readingColumn: header.includes(m.readingColumn) ? m.readingColumn : "" }));
      },
      error: (err) => setCsvProblem(`The file could not be read: ${err.message}`),
    }), () => setCsvProblem("The file reader could not be loaded; check the connection and choose the file again."));
  }
  async function applyCsv() {
    if (!rows) return;
    if (!mapping.readingColumn) {
      setCsvProblem("Choose the column that holds the readings.");
      return;
    }
    const r = readMappedCsv(rows, mapping);
    setCsvProblem(r.columnError);
    setCsvErrors(r.errors);
    if (r.columnError || r.errors.length || !r.valuesUm.length) return;
    onChange([...readingsUm, ...r.valuesUm]);
    setCsvNote(`${r.valuesUm.length} readings taken from ${fileName}.`);
    setRows(null);
    if (remember && gauge) {
      await sendJson(`/api/gauges/${gauge.id}`, "PUT", { mapping }).catch(() => undefined);
      onGaugeSaved();
    }
  }
  const header = rows?.[0]?.map((h) => h.trim()) ?? [];

  const tab = (m: Mode, label: string) => (
    <button type="button" role="tab" aria-selected={mode === m} className={mode === m ? "btn-primary" : "btn-quiet"} onClick={() => setMode(m)}>
      {label}
    </button>
  );

  return (
    <div className="space-y-3">
      <div role="tablist" aria-label="How to enter readings" className="flex flex-wrap gap-2">
        {tab("keys", "Key in")}
        {tab("paste", "Paste a column")}
        {tab("csv", "Import gauge CSV")}
      </div>

      {mode === "keys" && (
        <div>
          <label htmlFor="dft-key" className="label">{`Reading (${unit}) — ${nextLabel}`}</label>
          <div className="flex gap-2">
            <input
              id="dft-key"
              ref={keyRef}
              className="field max-w-40 num"
              inputMode="decimal"
              autoComplete="off"
              value={key}
              aria-invalid={keyError ? true : undefined}
              aria-describedby={keyError ? "dft-key-err" : "dft-key-hint"}
              onChange={(e) => setKey(e.target.value)}
              onKeyDown={(e) => {
                if (e.key === "Enter") {
                  e.preventDefault();
                  addKey();
                }
              }}
            />
            <button type="button" className="btn-quiet" onClick={addKey}>Add</button>
            <button type="button" className="btn-quiet" disabled={!n} onClick={() => { onChange(readingsUm.slice(0, -1)); keyRef.current?.focus(); }}>
              Remove last
            </button>
          </div>
          <p id="dft-key-hint" className="mt-1 text-xs text-ink-faint">{flat ? "Press Enter after each reading." : `Press Enter after each reading; after ${readingsPerSpot} readings the next spot starts.`}</p>
          {keyError && <p id="dft-key-err" className="field-error">{keyError}</p>}
        </div>
      )}

      {mode === "paste" && (
        <div>
          <label htmlFor="dft-paste" className="label">{`Readings (${unit}), one per line — paste a spreadsheet column`}</label>
          <textarea id="dft-paste" className="field h-32 num" value={paste} onChange={(e) => setPaste(e.target.value)} />
          <button type="button" className="btn-quiet mt-2" onClick={applyPaste}>Use these readings</button>
          {pasteErrors.length > 0 && (
            <div role="alert" className="mt-2 text-sm text-oxide">
              <p>Nothing was added. Fix these cells and try again:</p>
              <ul className="list-disc pl-5">
                {pasteErrors.map((e) => <li key={e.index}>{`Line ${e.index + 1}: ${e.message}`}</li>)}
              </ul>
            </div>
          )}
        </div>
      )}

      {mode === "csv" && (
        <div className="space-y-2">
          {!gauge && <p className="text-sm text-caution">Choose the gauge above so its column mapping can be remembered.</p>}
          <div>
            <label htmlFor="dft-csv" className="label">Gauge CSV export</label>
            <input id="dft-csv" type="file" accept=".csv,text/csv,text/plain" className="text-sm" onChange={(e) => onFile(e.target.files?.[0])} />
          </div>
          {rows && (
            <div className="flex flex-wrap items-end gap-3">
              <div>
                <label htmlFor="dft-col" className="label">Reading column</label>
                <select id="dft-col" className="field" value={mapping.readingColumn} onChange={(e) => setMapping({ ...mapping, readingColumn: e.target.value })}>
                  <option value="">Choose…</option>
                  {header.map((h) => <option key={h} value={h}>{h}</option>)}
                </select>
              </div>
              <div>
                <label htmlFor="dft-unit" className="label">The gauge writes</label>
                <select id="dft-unit" className="field" value={mapping.unit} onChange={(e) => setMapping({ ...mapping, unit: e.target.value as "um" | "mil" })}>
                  <option value="um">µm</option>
                  <option value="mil">mil</option>
                </select>
              </div>
              {gauge && (
                <label className="flex items-center gap-2 text-sm">
                  <input type="checkbox" checked={remember} onChange={(e) => setRemember(e.target.checked)} />
                  Remember for {gauge.name}
                </label>
              )}
              <button type="button" className="btn-quiet" onClick={() => void applyCsv()}>Use {Math.max(0, rows.length - 1)} rows</button>
            </div>
          )}
          {csvProblem && <p role="alert" className="field-error">{csvProblem}</p>}
          {csvErrors.length > 0 && (
            <div role="alert" className="text-sm text-oxide">
              <p>Nothing was added. Fix these rows in the file and import it again:</p>
              <ul className="list-disc pl-5">{csvErrors.map((e) => <li key={e.index}>{e.message}</li>)}</ul>
            </div>
          )}
          {csvNote && <p className="text-sm text-pass">{csvNote}</p>}
        </div>
      )}

      <div>
        <p className="label">{`${n} reading${n === 1 ? "" : "s"} entered`}</p>
        {n > 0 && (
          <ol className="flex flex-wrap gap-2 text-sm" aria-label="Readings by spot">
            {Array.from({ length: Math.ceil(n / readingsPerSpot) }, (_, s) => (
              <li key={s} className="rounded border border-plate-line bg-plate-raised px-2 py-1">
                <span className="text-ink-faint">{flat ? "" : `A${Math.floor(s / spotsPerArea) + 1} S${(s % spotsPerArea) + 1}: `}</span>
                <span className="num">{readingsUm.slice(s * readingsPerSpot, (s + 1) * readingsPerSpot).map(show).join(", ")}</span>
              </li>
            ))}
          </ol>
        )}
      </div>
    </div>
  );
}
