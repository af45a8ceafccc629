"use client";
// Import a CSV part list: the server checks every row first (nothing written) and marks each bad
// row with its number and reason. "Import all" is refused while any row is bad; importing only
// the valid rows is a separate, explicit button. Either way it is one transaction. A row whose
// part number is already in the catalogue is marked, unless the user chooses to update those parts.

import Link from "next/link";
import { useId, useState } from "react";
import { useSWRConfig } from "swr";
import type { PartsImportResult } from "@/app/api/parts/import/route";
import { showArea, showMass, type UnitSystem } from "./part-units";

type Refusal = { message: string; problems?: string[]; rows?: PartsImportResult["rows"] };

async function post(
  file: File,
  mode: "preview" | "all" | "valid-only",
  update: boolean,
): Promise<{ ok: true; result: PartsImportResult } | { ok: false; refusal: Refusal }> {
  const form = new FormData();
  form.append("mode", mode);
  form.append("existing", update ? "update" : "refuse");
  form.append("file", file);
  const res = await fetch("/api/parts/import", { method: "POST", body: form, headers: { accept: "application/json" } });
  const body = (await res.json().catch(() => null)) as (PartsImportResult & { error?: Refusal }) | null;
  if (res.ok && body) return { ok: true, result: body };
  return { ok: false, refusal: body?.error ?? { message: `The import failed (${res.status}).` } };
}

export function PartsImport({ unitSystem, columns }: { unitSystem: UnitSystem; columns: readonly string[] }) {
  const id = useId();
  const { mutate } = useSWRConfig();
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<PartsImportResult | null>(null);
  const [refusal, setRefusal] = useState<Refusal | null>(null);
  const [done, setDone] = useState<PartsImportResult | null>(null);
  const [busy, setBusy] = useState<null | "preview" | "all" | "valid-only">(null);
  const [update, setUpdate] = useState(false);

  async function check(f: File, updating = update) {
    setFile(f);
    setPreview(null);
    setRefusal(null);
    setDone(null);
    setBusy("preview");
    const r = await post(f, "preview", updating).catch((e: Error) => ({ ok: false as const, refusal: { message: e.message } }));
    setBusy(null);
    if (r.ok) setPreview(r.result);
    else setRefusal(r.refusal);
  }

  async function run(mode: "all" | "valid-only") {
    if (!file) return;
    setRefusal(null);
    setBusy(mode);
    const r = await post(file, mode, update).catch((e: Error) => ({ ok: false as const, refusal: { message: e.message } }));
    setBusy(null);
    if (r.ok) {
      setDone(r.result);
      setPreview(null);
      await mutate((key) => typeof key === "string" && key.startsWith("/api/parts"));
    } else {
      setRefusal(r.refusal);
    }
  }

  const bad = preview ? preview.rows.filter((r) => !r.valid) : [];
  const blocked = Boolean(preview && preview.problems.length > 0);

  return (
    <div className="space-y-4">
      <section className="card space-y-3">
        <div>
          <label htmlFor={`${id}-file`} className="label">CSV file</label>
          <input
            id={`${id}-file`}
            type="file"
            accept=".csv,text/csv"
            className="field"
            disabled={busy !== null}
            onChange={(e) => {
              const f = e.target.files?.[0];
              if (f) void check(f);
            }}
          />
          <p className="mt-1 text-xs text-ink-faint">
            The first line names the columns: {columns.join(", ")}. Values are metric (mm, m², kg, kg/m³). Template dimensions go in one cell as
            name=mm pairs, e.g. <code>lengthMm=1200;widthMm=50;thicknessMm=3</code>. An exported catalogue is a ready example.
          </p>
        </div>
        <div className="flex items-start gap-2">
          <input
            id={`${id}-update`}
            type="checkbox"
            className="mt-1"
            checked={update}
            disabled={busy !== null}
            aria-describedby={`${id}-update-help`}
            onChange={(e) => {
              setUpdate(e.target.checked);
              if (file) void check(file, e.target.checked);
            }}
          />
          <div>
            <label htmlFor={`${id}-update`} className="text-sm font-medium">Update parts already in the catalogue</label>
            <p id={`${id}-update-help`} className="text-xs text-ink-faint">
              Rows are matched by part number. A matched part takes the row&rsquo;s values; runs and racking plans keep pointing at it, and runs that
              have started keep the figures they started with. Unticked, such rows are marked as problems.
            </p>
          </div>
        </div>
        {busy === "preview" && <p role="status" className="text-sm text-ink-soft">Checking every row…</p>}
      </section>

      {refusal && (
        <div role="alert" className="rounded-md border border-oxide bg-oxide-light p-3 text-sm" data-testid="import-refused">
          <p className="font-semibold">{refusal.message}</p>
          {refusal.problems?.map((p) => <p key={p} className="mt-1">{p}</p>)}
        </div>
      )}

      {done && (
        <p role="status" className="rounded-md border border-pass bg-pass-light p-3 text-sm" data-testid="import-done">
          Imported {done.importedCount} part{done.importedCount === 1 ? "" : "s"}
          {done.updateCount > 0 ? ` (${done.createCount} new, ${done.updateCount} updated)` : ""}
          {done.invalidCount > 0 ? `; ${done.invalidCount} row${done.invalidCount === 1 ? " was" : "s were"} left out` : ""}.{" "}
          <Link className="text-phosphate-dark underline" href="/parts">Back to the catalogue</Link>
        </p>
      )}

      {preview && (
        <section className="card space-y-3" aria-labelledby={`${id}-preview`}>
          <div className="flex flex-wrap items-baseline justify-between gap-2">
            <h2 id={`${id}-preview`}>Preview of {file?.name}</h2>
            <p className="text-sm" data-testid="import-summary">
              {preview.rows.length} row{preview.rows.length === 1 ? "" : "s"}: <span className="text-pass">{preview.validCount} valid</span>
              {preview.updateCount > 0 && ` (${preview.createCount} new, ${preview.updateCount} updating a part)`}
              {preview.invalidCount > 0 && (
                <>
                  , <span className="text-oxide">{preview.invalidCount} with problems</span>
                </>
              )}
              . Nothing is saved yet.
            </p>
          </div>
          {preview.problems.length > 0 && (
            <div role="alert" className="rounded-md border border-oxide bg-oxide-light p-3 text-sm">
              {preview.problems.map((p) => <p key={p}>{p}</p>)}
            </div>
          )}
          <div className="overflow-x-auto">
            <table className="w-full text-left text-sm" data-testid="import-rows">
              <caption className="mb-1 text-left text-xs text-ink-faint">Row numbers count the header line as row 1, as a spreadsheet shows them.</caption>
              <thead>
                <tr className="border-b border-plate-line">
                  <th scope="col" className="py-1.5 pr-3 font-medium">Row</th>
                  <th scope="col" className="py-1.5 pr-3 font-medium">Number</th>
                  <th scope="col" className="py-1.5 pr-3 font-medium">Name</th>
                  <th scope="col" className="py-1.5 pr-3 font-medium">Coated area</th>
                  <th scope="col" className="py-1.5 pr-3 font-medium">Mass</th>
                  <th scope="col" className="py-1.5 pr-3 font-medium">Check</th>
                </tr>
              </thead>
              <tbody>
                {preview.rows.map((r) => (
                  <tr key={r.row} className={`border-b border-plate-line/60 align-top ${r.valid ? "" : "bg-oxide-light/60"}`} data-row={r.row} data-valid={r.valid}>
                    <td className="num py-1.5 pr-3">{r.row}</td>
                    <td className="py-1.5 pr-3">{r.number || "—"}</td>
                    <td className="py-1.5 pr-3">{r.name || "—"}</td>
                    <td className="num py-1.5 pr-3 whitespace-nowrap">{r.coatedAreaM2 !== null ? showArea(r.coatedAreaM2, unitSystem) : "—"}</td>
                    <td className="num py-1.5 pr-3 whitespace-nowrap">{r.massKg !== null ? showMass(r.massKg, unitSystem, 3) : "—"}</td>
                    <td className="py-1.5 pr-3">
                      {r.valid ? (
                        <span className="text-pass">{r.action === "update" ? "OK, updates this part" : "OK, new part"}</span>
                      ) : (
                        <ul className="text-oxide">
                          {Object.entries(r.errors).map(([field, message]) => (
                            <li key={field}>
                              Row {r.row}, <code>{field}</code>: {message}
                            </li>
                          ))}
                        </ul>
                      )}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <div className="flex flex-wrap items-center gap-2">
            <button type="button" className="btn-primary" disabled={busy !== null || blocked} onClick={() => run("all")}>
              {busy === "all" ? "Importing…" : `Import all ${preview.rows.length} rows`}
            </button>
            {bad.length > 0 && preview.validCount > 0 && (
              <button type="button" className="btn-quiet" disabled={busy !== null || blocked} onClick={() => run("valid-only")}>
                {busy === "valid-only" ? "Importing…" : `Import only the ${preview.validCount} valid row${preview.validCount === 1 ? "" : "s"}`}
              </button>
            )}
          </div>
          {bad.length > 0 && (
            <p className="text-xs text-ink-soft">
              &ldquo;Import all&rdquo; is refused while any row has a problem: fix the file and choose it again, or import only the valid rows and leave
              the rest out.
            </p>
          )}
        </section>
      )}
    </div>
  );
}
