"use client";
// The throughput comparison: pick lines and saved scenarios, a part and a powder → POST
// /api/throughput/compare → the side-by-side table, the limiting stage of each column in words,
// and bar charts (Recharts, loaded only once there is something to draw). The page loads this
// screen through throughput-screen-lazy.tsx, after its first paint.

import { useEffect, useRef, useState } from "react";
import useSWR from "swr";
import type { CoatingsList } from "@/app/api/coatings/route";
import type { LinesList } from "@/app/api/lines/route";
import type { ScenariosList } from "@/app/api/scenarios/route";
import type { ThroughputCompareResponse } from "@/app/api/throughput/compare/route";
import { TextField } from "@/components/ui/text-field";
import { FetchError, sendJson } from "@/lib/fetcher";
import type { ThroughputComparison } from "@/lib/server/throughput";
import type { PartRef } from "@/lib/validation/scenarios";
import { money, show, sig, toShown, unitOf, fieldText, type ShownKind, type UnitTable } from "./shown-units";
import { useUnitTexts } from "./use-unit-texts";
import { ComparisonResult } from "./comparison-result";
import { ScenarioEditor } from "./scenario-editor";

export interface ReferencePart {
  label: string;
  areaM2: number;
  insideAreaM2: number;
  massKg: number;
  thicknessMm: number;
  lengthMm: number;
  widthMm: number;
  heightMm: number;
}

const FIELDS = {
  areaM2: "areaM2",
  insideAreaM2: "areaM2",
  massKg: "massKg",
  thicknessMm: "lengthMm",
  lengthMm: "lengthMm",
  widthMm: "lengthMm",
  heightMm: "lengthMm",
  filmUm: "filmUm",
  firstPassPercent: null,
  reclaimPercent: null,
  clearanceMm: "lengthMm",
  partsPerCarrier: null,
} as const satisfies Record<string, ShownKind | null>;
type Field = keyof typeof FIELDS;

const PART_FIELDS: [Field, string, string?][] = [
  ["areaM2", "Coated outside area", "Outside area less masking: what takes powder."],
  ["insideAreaM2", "Inside area", "Only e-coat reaches it; 0 for open parts."],
  ["massKg", "Mass"],
  ["thicknessMm", "Section thickness", "The heaviest section: it sets the heat-up."],
  ["lengthMm", "Length (along travel)"],
  ["widthMm", "Width"],
  ["heightMm", "Height (hung upright)"],
];

/** A catalogue part as this screen needs it; anything else in /api/parts is ignored. */
interface CataloguePart {
  id: string;
  number: string;
  name: string;
  coatedAreaM2: number;
  massKg: number;
  thicknessMm: number;
  lengthMm: number;
  widthMm: number;
  heightMm: number;
}

const isNum = (v: unknown): v is number => typeof v === "number" && Number.isFinite(v);

/** The parts catalogue belongs to another part of the product: read its answer defensively. */
function catalogueParts(body: unknown): CataloguePart[] {
  const parts = (body as { parts?: unknown } | null)?.parts;
  if (!Array.isArray(parts)) return [];
  return parts.flatMap((p: Record<string, unknown>) => {
    const area = isNum(p.coatedAreaM2) ? p.coatedAreaM2 : isNum(p.areaM2) ? p.areaM2 - (isNum(p.maskedAreaM2) ? p.maskedAreaM2 : 0) : NaN;
    if (typeof p.id !== "string" || typeof p.number !== "string" || p.archived === true || !(area > 0)) return [];
    if (![p.massKg, p.thicknessMm, p.lengthMm, p.widthMm, p.heightMm].every(isNum)) return [];
    return [{ id: p.id, number: p.number, name: String(p.name ?? ""), coatedAreaM2: area, massKg: p.massKg as number, thicknessMm: p.thicknessMm as number, lengthMm: p.lengthMm as number, widthMm: p.widthMm as number, heightMm: p.heightMm as number }];
  });
}

interface Props {
  units: UnitTable;
  currency: string;
  canEdit: boolean;
  referencePart: ReferencePart;
}

type Failure = { message: string; fields: Record<string, string> };

export function ThroughputScreen({ units, currency, canEdit, referencePart }: Props) {
  const lines = useSWR<LinesList>("/api/lines");
  const scenarios = useSWR<ScenariosList>("/api/scenarios");
  const coatings = useSWR<CoatingsList>("/api/coatings?kind=powder");
  const parts = useSWR<unknown>("/api/parts", { shouldRetryOnError: false });
  const catalogue = parts.error ? [] : catalogueParts(parts.data);

  const [picked, setPicked] = useState<string[]>([]);
  const [partMode, setPartMode] = useState<"manual" | "catalogue">("manual");
  const [partId, setPartId] = useState("");
  const [coatingId, setCoatingId] = useState("");
  const { texts, set, stored, setTexts } = useUnitTexts(FIELDS, units, () => ({
    areaM2: fieldText(units, "areaM2", referencePart.areaM2),
    insideAreaM2: fieldText(units, "areaM2", referencePart.insideAreaM2),
    massKg: fieldText(units, "massKg", referencePart.massKg),
    thicknessMm: fieldText(units, "lengthMm", referencePart.thicknessMm),
    lengthMm: fieldText(units, "lengthMm", referencePart.lengthMm),
    widthMm: fieldText(units, "lengthMm", referencePart.widthMm),
    heightMm: fieldText(units, "lengthMm", referencePart.heightMm),
    filmUm: "",
    firstPassPercent: "50",
    reclaimPercent: "0",
    clearanceMm: fieldText(units, "lengthMm", 50),
    partsPerCarrier: "",
  }));
  const [result, setResult] = useState<ThroughputComparison | null>(null);
  const [failure, setFailure] = useState<Failure | null>(null);
  const [pending, setPending] = useState(false);
  const lastBody = useRef<unknown>(null);

  const powders = (coatings.data?.coatings ?? []).filter((c) => c.kind === "powder" && !c.archived);
  // The first powder is picked once the library answers.
  useEffect(() => {
    if (!coatingId && powders.length) setCoatingId(String(powders[0].id));
  }, [coatingId, powders]);
  const coating = powders.find((c) => String(c.id) === coatingId) ?? null;

  const liveLines = lines.data?.lines ?? [];
  const liveScenarios = scenarios.data?.scenarios ?? [];
  const keys = new Set([...liveLines.map((l) => `line:${l.id}`), ...liveScenarios.map((s) => `scenario:${s.id}`)]);
  const chosen = picked.filter((k) => keys.has(k));
  const toggle = (key: string, on: boolean) => setPicked((p) => (on ? [...p.filter((k) => k !== key), key] : p.filter((k) => k !== key)));

  // Client checks: numbers where numbers belong; the server checks everything again.
  const errors: Partial<Record<Field, string>> = {};
  for (const f of Object.keys(FIELDS) as Field[]) {
    const optional = f === "filmUm" || f === "partsPerCarrier" || f === "insideAreaM2";
    if (partMode === "catalogue" && PART_FIELDS.some(([p]) => p === f)) continue;
    if (texts[f].trim() === "") {
      if (!optional) errors[f] = "Enter a number.";
    } else if (stored(f) === null) errors[f] = "Enter a number.";
  }
  const serverField = (name: string) => failure?.fields[name];

  function partRef(): PartRef | null {
    if (partMode === "catalogue") return partId ? { partId } : null;
    if (PART_FIELDS.some(([f]) => errors[f])) return null;
    return {
      areaM2: stored("areaM2")!,
      insideAreaM2: stored("insideAreaM2") ?? 0,
      massKg: stored("massKg")!,
      thicknessMm: stored("thicknessMm")!,
      lengthMm: stored("lengthMm")!,
      widthMm: stored("widthMm")!,
      heightMm: stored("heightMm")!,
    };
  }

  async function run(body: unknown) {
    setPending(true);
    try {
      const r = await sendJson<ThroughputCompareResponse>("/api/throughput/compare", "POST", body);
      setResult(r.comparison);
      setFailure(null);
    } catch (e) {
      setFailure(e instanceof FetchError ? { message: e.message, fields: e.fields } : { message: "The comparison could not be worked out; try again.", fields: {} });
    } finally {
      setPending(false);
    }
  }

  function compare(e: React.FormEvent) {
    e.preventDefault();
    const part = partRef();
    if (!chosen.length) return setFailure({ message: "Pick at least one line or scenario (two or more to compare).", fields: {} });
    if (!part) return setFailure({ message: partMode === "catalogue" ? "Choose a part from the catalogue." : "Enter the part's figures.", fields: {} });
    if (!coating) return setFailure({ message: "Choose a powder.", fields: {} });
    if (Object.keys(errors).length) return setFailure({ message: "Some figures are not numbers; see the marked fields.", fields: {} });
    const pct = (f: Field) => stored(f)! / 100;
    const body = {
      items: chosen.map((k) => {
        const [kind, id] = k.split(":");
        return kind === "line" ? { lineId: Number(id) } : { scenarioId: Number(id) };
      }),
      part,
      coatingId: coating.id,
      ...(stored("filmUm") !== null ? { filmUm: stored("filmUm") } : {}),
      ...(stored("partsPerCarrier") !== null ? { partsPerCarrier: stored("partsPerCarrier") } : {}),
      firstPassEfficiency: pct("firstPassPercent"),
      reclaimEfficiency: pct("reclaimPercent"),
      clearanceMm: stored("clearanceMm"),
    };
    lastBody.current = body;
    void run(body);
  }

  // Sentences come back in the user's units: ask again after the unit switch.
  const system = useRef(units.system);
  useEffect(() => {
    if (system.current === units.system) return;
    system.current = units.system;
    if (lastBody.current) void run(lastBody.current);
  }, [units.system]);

  const field = (f: Field, label: string, hint?: string, unitless?: string) => {
    const kind = FIELDS[f];
    return (
      <TextField
        key={f}
        label={kind ? `${label} (${unitOf(units, kind)})` : unitless ? `${label} (${unitless})` : label}
        name={f}
        value={texts[f]}
        onChange={set(f)}
        inputMode="decimal"
        hint={hint}
        error={errors[f] ?? serverField(f === "firstPassPercent" ? "firstPassEfficiency" : f === "reclaimPercent" ? "reclaimEfficiency" : partMode === "manual" && PART_FIELDS.some(([p]) => p === f) ? `part.${f}` : f)}
      />
    );
  };

  const midFilm = coating ? (coating.filmMinUm + coating.filmMaxUm) / 2 : null;
  const catPart = catalogue.find((p) => p.id === partId) ?? null;
  const itemErrors = Object.entries(failure?.fields ?? {}).filter(([k]) => k.startsWith("items"));

  return (
    <div className="space-y-6">
      <form onSubmit={compare} className="grid gap-4 lg:grid-cols-3" noValidate aria-label="What to compare">
        <fieldset className="card space-y-2">
          <legend className="sr-only">Lines and scenarios</legend>
          <h2>Lines and scenarios</h2>
          <p className="text-xs text-ink-faint">Tick two or more to see them side by side.</p>
          {lines.isLoading ? (
            <p role="status" className="text-sm text-ink-soft">Loading lines…</p>
          ) : lines.error ? (
            <p role="alert" className="text-sm text-oxide">Could not load the lines: {lines.error.message}</p>
          ) : liveLines.length === 0 ? (
            <p className="text-sm text-ink-soft">No lines yet; a manager adds them under Lines.</p>
          ) : (
            <ul className="space-y-1 text-sm" aria-label="Lines">
              {liveLines.map((l) => (
                <li key={l.id}>
                  <label className="flex items-center gap-2">
                    <input type="checkbox" checked={chosen.includes(`line:${l.id}`)} onChange={(e) => toggle(`line:${l.id}`, e.target.checked)} />
                    {l.name}
                    <span className="text-xs text-ink-faint">{l.kind === "batch" ? "batch oven" : "conveyor"}</span>
                  </label>
                </li>
              ))}
            </ul>
          )}
          <h3 className="pt-2 text-sm font-semibold">Saved scenarios</h3>
          {scenarios.isLoading ? (
            <p role="status" className="text-sm text-ink-soft">Loading scenarios…</p>
          ) : scenarios.error ? (
            <p role="alert" className="text-sm text-oxide">Could not load the scenarios.</p>
          ) : liveScenarios.length === 0 ? (
            <p className="text-sm text-ink-soft">None saved yet{canEdit ? "; make one below." : "."}</p>
          ) : (
            <ul className="space-y-1 text-sm" aria-label="Saved scenarios">
              {liveScenarios.map((s) => (
                <li key={s.id}>
                  <label className="flex items-center gap-2">
                    <input type="checkbox" checked={chosen.includes(`scenario:${s.id}`)} onChange={(e) => toggle(`scenario:${s.id}`, e.target.checked)} />
                    {s.name}
                  </label>
                </li>
              ))}
            </ul>
          )}
          {itemErrors.map(([k, m]) => (
            <p key={k} className="field-error">{m}</p>
          ))}
        </fieldset>

        <fieldset className="card space-y-3">
          <legend className="sr-only">Part</legend>
          <h2>Part</h2>
          {catalogue.length > 0 && (
            <div className="flex gap-4 text-sm" role="radiogroup" aria-label="Where the part comes from">
              <label className="flex items-center gap-1.5">
                <input type="radio" name="part-mode" checked={partMode === "catalogue"} onChange={() => setPartMode("catalogue")} /> From the catalogue
              </label>
              <label className="flex items-center gap-1.5">
                <input type="radio" name="part-mode" checked={partMode === "manual"} onChange={() => setPartMode("manual")} /> Entered by hand
              </label>
            </div>
          )}
          {parts.error && <p className="text-xs text-ink-faint">The parts catalogue is not available here; enter the part&apos;s figures.</p>}
          {partMode === "catalogue" && catalogue.length > 0 ? (
            <div>
              <label htmlFor="tp-part" className="label">Catalogue part</label>
              <select id="tp-part" className="field" value={partId} onChange={(e) => setPartId(e.target.value)} aria-invalid={serverField("part.partId") ? true : undefined}>
                <option value="">— choose —</option>
                {catalogue.map((p) => (
                  <option key={p.id} value={p.id}>{p.number} · {p.name}</option>
                ))}
              </select>
              {serverField("part.partId") && <p className="field-error">{serverField("part.partId")}</p>}
              {catPart && (
                <p className="mt-1 text-xs text-ink-soft num">
                  {show(units, "areaM2", catPart.coatedAreaM2)} coated · {show(units, "massKg", catPart.massKg)} · {show(units, "lengthMm", catPart.thicknessMm)} section ·{" "}
                  {[catPart.lengthMm, catPart.widthMm, catPart.heightMm].map((v) => sig(toShown(units, "lengthMm", v), 4)).join(" × ")} {unitOf(units, "lengthMm")}
                </p>
              )}
            </div>
          ) : (
            <>
              <p className="text-xs text-ink-faint">Starts from the {referencePart.label.replace(/^Reference part: /, "reference ")}; type your own part&apos;s figures.</p>
              <div className="grid grid-cols-2 gap-3">{PART_FIELDS.map(([f, label, hint]) => field(f, label, hint))}</div>
            </>
          )}
          {serverField("part") && <p className="field-error">{serverField("part")}</p>}
        </fieldset>

        <fieldset className="card space-y-3">
          <legend className="sr-only">Powder and racking</legend>
          <h2>Powder and racking</h2>
          <div>
            <label htmlFor="tp-coating" className="label">Powder</label>
            <select id="tp-coating" className="field" value={coatingId} onChange={(e) => setCoatingId(e.target.value)} disabled={!powders.length} aria-invalid={serverField("coatingId") ? true : undefined}>
              {!powders.length && <option value="">{coatings.isLoading ? "Loading powders…" : "No powders in the library"}</option>}
              {powders.map((c) => (
                <option key={c.id} value={c.id}>
                  {c.code} · {c.name} · {c.colourName}
                </option>
              ))}
            </select>
            {coating && (
              <p className="mt-1 text-xs text-ink-soft num">
                SG {coating.specificGravity ?? "–"} · film {show(units, "filmUm", coating.filmMinUm)}–{show(units, "filmUm", coating.filmMaxUm)} ·{" "}
                {money(toShown(units, "perKg", coating.pricePerKg), currency)} per {unitOf(units, "perKg")}
              </p>
            )}
            {serverField("coatingId") && <p className="field-error">{serverField("coatingId")}</p>}
          </div>
          <div className="grid grid-cols-2 gap-3">
            {field("filmUm", "Film build", midFilm !== null ? `Empty: ${show(units, "filmUm", midFilm)}, the middle of the range.` : undefined)}
            {field("clearanceMm", "Clearance", "Gap between parts on a carrier.")}
            {field("firstPassPercent", "First-pass transfer", "Published figures: 40–60 %.", "%")}
            {field("reclaimPercent", "Reclaimed and resprayed", "Share of overspray recovered.", "%")}
            {field("partsPerCarrier", "Parts per carrier", "Empty: planned from the part's box and each line's window.", "by hand")}
          </div>
          <button type="submit" className="btn-primary" disabled={pending}>
            {pending ? "Working out…" : "Compare"}
          </button>
        </fieldset>
      </form>

      <section className="card space-y-4" aria-labelledby="tp-result-h" aria-live="polite" aria-busy={pending}>
        <h2 id="tp-result-h">Side by side</h2>
        {failure && (
          <div role="alert" className="text-sm text-oxide">
            <p>{failure.message}</p>
          </div>
        )}
        {!result ? (
          <p className="text-sm text-ink-soft">Tick lines or scenarios, check the part and powder, then Compare.</p>
        ) : (
          <ComparisonResult result={result} units={units} />
        )}
      </section>

      <ScenarioEditor
        units={units}
        lines={liveLines}
        scenarios={liveScenarios}
        canEdit={canEdit}
        currentPart={partRef()}
        currentCoatingId={coating?.id ?? null}
        onChanged={() => scenarios.mutate()}
        onSaved={(id) => toggle(`scenario:${id}`, true)}
        onUsePart={(p, cId) => {
          if ("partId" in p) {
            setPartMode("catalogue");
            setPartId(p.partId);
          } else {
            setPartMode("manual");
            setTexts((t) => ({
              ...t,
              areaM2: fieldText(units, "areaM2", p.areaM2),
              insideAreaM2: fieldText(units, "areaM2", p.insideAreaM2),
              massKg: fieldText(units, "massKg", p.massKg),
              thicknessMm: fieldText(units, "lengthMm", p.thicknessMm),
              lengthMm: fieldText(units, "lengthMm", p.lengthMm),
              widthMm: fieldText(units, "lengthMm", p.widthMm),
              heightMm: fieldText(units, "lengthMm", p.heightMm),
            }));
          }
          if (cId !== null) setCoatingId(String(cId));
        }}
      />
    </div>
  );
}
