"use client";
// Other tests of a run: cure (ASTM D5402 solvent rub), adhesion (ASTM D3359), appearance, coverage.

import { useState } from "react";
import { FetchError, sendJson } from "@/lib/fetcher";
import type { FilmTestView } from "@/lib/server/film-checks";

interface Props {
  runId: number;
  tests: FilmTestView[];
  writable: boolean;
  onSaved: () => void;
}

type Kind = FilmTestView["kind"];

export function FilmTestsPanel({ runId, tests, writable, onSaved }: Props) {
  const [kind, setKind] = useState<Kind>("cure");
  const [solvent, setSolvent] = useState("MEK");
  const [rubs, setRubs] = useState("50");
  const [result, setResult] = useState("pass");
  const [method, setMethod] = useState<"A" | "B">("B");
  const [rating, setRating] = useState("5");
  const [gloss, setGloss] = useState("");
  const [colour, setColour] = useState("");
  const [coverage, setCoverage] = useState("pass");
  const [notes, setNotes] = useState("");
  const [err, setErr] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function save() {
    const body =
      kind === "cure"
        ? { kind, solvent, rubCount: Number(rubs), result, notes }
        : kind === "adhesion"
          ? { kind, method, rating: Number(rating), notes }
          : kind === "appearance"
            ? { kind, gloss60Gu: gloss.trim() === "" ? null : Number(gloss), colourNote: colour, notes }
            : { kind, result: coverage, notes };
    setBusy(true);
    setErr(null);
    try {
      await sendJson(`/api/runs/${runId}/tests`, "POST", body);
      setNotes("");
      onSaved();
    } catch (e) {
      setErr(e instanceof FetchError ? e.message : "Could not save the test.");
    } finally {
      setBusy(false);
    }
  }

  return (
    <section aria-labelledby="tests-h" className="card space-y-3">
      <h2 id="tests-h" className="text-lg font-semibold">Other tests</h2>
      {tests.length === 0 ? (
        <p className="text-ink-faint">No cure, adhesion, appearance or coverage tests recorded yet.</p>
      ) : (
        <ul className="space-y-1 text-sm">
          {tests.map((t) => (
            <li key={t.id}>
              {t.summary}
              <span className="text-ink-faint">{` — ${t.recordedBy ?? "—"}, ${new Date(t.recordedAt * 1000).toISOString().slice(0, 16).replace("T", " ")} UTC`}</span>
              {typeof t.data.notes === "string" && t.data.notes && <span className="text-ink-soft">{` · ${t.data.notes}`}</span>}
            </li>
          ))}
        </ul>
      )}
      {writable && (
        <div className="space-y-2">
          <div className="flex flex-wrap items-end gap-3">
            <div>
              <label htmlFor="t-kind" className="label">Test</label>
              <select id="t-kind" className="field" value={kind} onChange={(e) => setKind(e.target.value as Kind)}>
                <option value="cure">Cure — solvent rub (ASTM D5402)</option>
                <option value="adhesion">Adhesion — tape test (ASTM D3359)</option>
                <option value="appearance">Gloss and colour</option>
                <option value="coverage">Coverage after e-coat</option>
              </select>
            </div>
            {kind === "cure" && (
              <>
                <div><label htmlFor="t-solvent" className="label">Solvent</label><input id="t-solvent" className="field w-32" value={solvent} onChange={(e) => setSolvent(e.target.value)} /></div>
                <div><label htmlFor="t-rubs" className="label">Double rubs</label><input id="t-rubs" className="field w-24 num" inputMode="numeric" value={rubs} onChange={(e) => setRubs(e.target.value)} /></div>
                <div><label htmlFor="t-result" className="label">Result</label><select id="t-result" className="field" value={result} onChange={(e) => setResult(e.target.value)}><option value="pass">Pass</option><option value="fail">Fail</option></select></div>
              </>
            )}
            {kind === "adhesion" && (
              <>
                <div><label htmlFor="t-method" className="label">Method</label><select id="t-method" className="field" value={method} onChange={(e) => setMethod(e.target.value as "A" | "B")}><option value="A">A — X-cut</option><option value="B">B — cross-cut</option></select></div>
                <div><label htmlFor="t-class" className="label">Class</label><select id="t-class" className="field" value={rating} onChange={(e) => setRating(e.target.value)}>{[5, 4, 3, 2, 1, 0].map((r) => <option key={r} value={r}>{`${r}${method}`}</option>)}</select></div>
              </>
            )}
            {kind === "appearance" && (
              <>
                <div><label htmlFor="t-gloss" className="label">Gloss at 60° (GU)</label><input id="t-gloss" className="field w-24 num" inputMode="decimal" value={gloss} onChange={(e) => setGloss(e.target.value)} /></div>
                <div><label htmlFor="t-colour" className="label">Colour note</label><input id="t-colour" className="field w-64" value={colour} onChange={(e) => setColour(e.target.value)} /></div>
              </>
            )}
            {kind === "coverage" && (
              <div><label htmlFor="t-cov" className="label">Result</label><select id="t-cov" className="field" value={coverage} onChange={(e) => setCoverage(e.target.value)}><option value="pass">Pass</option><option value="touch-up">Touch-up</option><option value="strip">Strip and recoat</option></select></div>
            )}
            <div><label htmlFor="t-notes" className="label">Notes</label><input id="t-notes" className="field w-64" value={notes} onChange={(e) => setNotes(e.target.value)} /></div>
            <button type="button" className="btn-primary" disabled={busy} onClick={() => void save()}>Record test</button>
          </div>
          {kind === "cure" && <p className="text-xs text-ink-faint">Solvent rubs: wear solvent-resistant gloves and eye protection, ventilate, keep ignition sources away; follow the plant&apos;s procedures and local codes.</p>}
          {err && <p role="alert" className="field-error">{err}</p>}
        </div>
      )}
    </section>
  );
}
