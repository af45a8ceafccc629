"use client";
import { useState } from "react";
import { FetchError, sendJson } from "@/lib/fetcher";
import type { CoatingView } from "@/lib/server/coatings";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { CHEMISTRY_LABELS, ECOAT_CHEMISTRIES, POWDER_CHEMISTRIES } from "@/lib/coatings/chemistries";
import { TextField } from "@/components/ui/text-field";
import { draft, parse, parsePlain, unitOf, type UnitKind } from "@/components/lines/unit-draft";

interface Props {
  initial?: CoatingView;
  unitSystem: UnitSystem;
  currency: string;
  onSaved: (coating: CoatingView) => void;
  onCancel?: () => void;
}

type PointDraft = { temp: string; hold: string; origTempC?: number };

/** Create or edit a coating; numbers are typed in the user's units and stored metric. */
export function CoatingEditor({ initial, unitSystem: sys, currency, onSaved, onCancel }: Props) {
  const d = (kind: UnitKind, v: number | null | undefined) => draft(kind, v, sys);
  const [v, setV] = useState({
    code: initial?.code ?? "",
    name: initial?.name ?? "",
    kind: initial?.kind ?? ("powder" as "powder" | "e-coat"),
    chemistry: initial?.chemistry ?? "polyester",
    colourName: initial?.colourName ?? "",
    swatchHex: initial?.swatchHex ?? "#777777",
    specificGravity: initial?.specificGravity?.toString() ?? "",
    volumeSolidsPct: initial?.volumeSolidsFraction != null ? String(round(initial.volumeSolidsFraction * 100)) : "",
    weightSolidsPct: initial?.weightSolidsFraction != null ? String(round(initial.weightSolidsFraction * 100)) : "",
    filmDensity: initial?.filmDensityGPerCm3?.toString() ?? "",
    filmMin: d("filmUm", initial?.filmMinUm),
    filmMax: d("filmUm", initial?.filmMaxUm),
    price: d("pricePerKg", initial?.pricePerKg),
    containerKind: initial?.containerKind ?? ("box" as "box" | "drum"),
    containerMass: d("massKg", initial?.containerKg),
    supplierName: initial?.supplierName ?? "",
    supplierEmail: initial?.supplierEmail ?? "",
    leadTimeDays: initial?.leadTimeDays?.toString() ?? "",
    shelfLifeMonths: initial?.shelfLifeMonths?.toString() ?? "",
    reorderPoint: d("massKg", initial?.reorderPointKg ?? 0),
  });
  const [points, setPoints] = useState<PointDraft[]>(
    initial?.cureSchedule.map((p) => ({ temp: d("temperatureC", p.metalTempC), hold: String(p.holdMin), origTempC: p.metalTempC })) ?? [{ temp: "", hold: "" }],
  );
  const [fields, setFields] = useState<Record<string, string>>({});
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const set = (k: keyof typeof v) => (s: string) => setV({ ...v, [k]: s });
  const powder = v.kind === "powder";
  const chemistries = powder ? POWDER_CHEMISTRIES : ECOAT_CHEMISTRIES;

  function body(local: Record<string, string>) {
    const num = (key: string, value: number | undefined) => {
      if (value !== undefined && Number.isNaN(value)) local[key] = "Enter a number.";
      return value;
    };
    const pct = (key: string, text: string) => {
      const n = num(key, parsePlain(text));
      return n === undefined || Number.isNaN(n) ? n : n / 100;
    };
    return {
      code: v.code,
      name: v.name,
      kind: v.kind,
      chemistry: v.chemistry,
      colourName: v.colourName,
      swatchHex: v.swatchHex,
      ...(powder
        ? { specificGravity: num("specificGravity", parsePlain(v.specificGravity)) }
        : {
            volumeSolidsFraction: pct("volumeSolidsFraction", v.volumeSolidsPct),
            weightSolidsFraction: pct("weightSolidsFraction", v.weightSolidsPct),
            filmDensityGPerCm3: num("filmDensityGPerCm3", parsePlain(v.filmDensity)),
          }),
      filmMinUm: num("filmMinUm", parse("filmUm", v.filmMin, sys, initial?.filmMinUm)),
      filmMaxUm: num("filmMaxUm", parse("filmUm", v.filmMax, sys, initial?.filmMaxUm)),
      cureSchedule: points.map((p, i) => ({
        metalTempC: num(`cureSchedule.${i}.metalTempC`, parse("temperatureC", p.temp, sys, p.origTempC)),
        holdMin: num(`cureSchedule.${i}.holdMin`, parsePlain(p.hold)),
      })),
      pricePerKg: num("pricePerKg", parse("pricePerKg", v.price, sys, initial?.pricePerKg)),
      containerKind: v.containerKind,
      containerKg: num("containerKg", parse("massKg", v.containerMass, sys, initial?.containerKg)),
      supplierName: v.supplierName,
      supplierEmail: v.supplierEmail,
      leadTimeDays: num("leadTimeDays", parsePlain(v.leadTimeDays)),
      shelfLifeMonths: num("shelfLifeMonths", parsePlain(v.shelfLifeMonths)),
      reorderPointKg: num("reorderPointKg", parse("massKg", v.reorderPoint, sys, initial?.reorderPointKg)),
    };
  }

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const local: Record<string, string> = {};
    const payload = body(local);
    if (Object.keys(local).length) {
      setFields(local);
      setError("Some numbers could not be read; see the marked fields.");
      return;
    }
    setBusy(true);
    setError(null);
    try {
      const res = initial
        ? await sendJson<{ coating: CoatingView }>(`/api/coatings/${initial.id}`, "PUT", payload)
        : await sendJson<{ coating: CoatingView }>("/api/coatings", "POST", payload);
      setFields({});
      onSaved(res.coating);
    } catch (err) {
      setFields(err instanceof FetchError ? err.fields : {});
      setError(err instanceof Error ? err.message : "Not saved.");
    } finally {
      setBusy(false);
    }
  }

  const f = fields;
  return (
    <form className="space-y-5" noValidate onSubmit={submit} aria-label={initial ? `Edit ${initial.code}` : "New coating"}>
      <fieldset className="grid gap-3 sm:grid-cols-3">
        <legend className="mb-2 font-semibold">Identity</legend>
        <TextField label="Code" name="code" value={v.code} onChange={set("code")} error={f.code} />
        <TextField label="Name" name="name" value={v.name} onChange={set("name")} error={f.name} />
        <div>
          <label className="label" htmlFor="coating-kind-field">Kind</label>
          <select
            id="coating-kind-field"
            className="field"
            value={v.kind}
            onChange={(e) => {
              const kind = e.target.value as "powder" | "e-coat";
              setV({ ...v, kind, chemistry: kind === "powder" ? "polyester" : "cathodic-epoxy" });
            }}
          >
            <option value="powder">Powder</option>
            <option value="e-coat">E-coat paint</option>
          </select>
        </div>
        <div>
          <label className="label" htmlFor="coating-chem-field">Chemistry</label>
          <select id="coating-chem-field" className="field" value={v.chemistry} aria-invalid={f.chemistry ? true : undefined} onChange={(e) => setV({ ...v, chemistry: e.target.value as typeof v.chemistry })}>
            {chemistries.map((c) => <option key={c} value={c}>{CHEMISTRY_LABELS[c]}</option>)}
          </select>
          {f.chemistry && <p className="field-error">{f.chemistry}</p>}
        </div>
        <TextField label="Colour name" name="colourName" value={v.colourName} onChange={set("colourName")} error={f.colourName} />
        <div>
          <label className="label" htmlFor="coating-swatch">Swatch</label>
          <div className="flex gap-2">
            <input id="coating-swatch" type="color" className="h-9 w-12 rounded border border-plate-line" value={v.swatchHex} onChange={(e) => setV({ ...v, swatchHex: e.target.value })} />
            <input aria-label="Swatch hex value" className="field" value={v.swatchHex} onChange={(e) => setV({ ...v, swatchHex: e.target.value })} />
          </div>
          {f.swatchHex && <p className="field-error">{f.swatchHex}</p>}
        </div>
      </fieldset>

      <fieldset className="grid gap-3 sm:grid-cols-3">
        <legend className="mb-2 font-semibold">Material and film</legend>
        {powder ? (
          <TextField label="Specific gravity" name="specificGravity" inputMode="decimal" value={v.specificGravity} onChange={set("specificGravity")} error={f.specificGravity} hint="ASTM D5965; ordinary powders ~1.2–1.8, zinc-rich up to ~2.8" />
        ) : (
          <>
            <TextField label="Volume solids as supplied (%)" name="volumeSolids" inputMode="decimal" value={v.volumeSolidsPct} onChange={set("volumeSolidsPct")} error={f.volumeSolidsFraction} hint="Of the paint bought, not the film deposited" />
            <TextField label="Weight solids as supplied (%)" name="weightSolids" inputMode="decimal" value={v.weightSolidsPct} onChange={set("weightSolidsPct")} error={f.weightSolidsFraction} />
            <TextField label="Deposited film density (g/cm³)" name="filmDensity" inputMode="decimal" value={v.filmDensity} onChange={set("filmDensity")} error={f.filmDensityGPerCm3} hint="Cured e-coat films are ~1.3–1.5 (from memory): check the data sheet" />
          </>
        )}
        <TextField label={`Film build, minimum (${unitOf("filmUm", sys)})`} name="filmMin" inputMode="decimal" value={v.filmMin} onChange={set("filmMin")} error={f.filmMinUm} />
        <TextField label={`Film build, maximum (${unitOf("filmUm", sys)})`} name="filmMax" inputMode="decimal" value={v.filmMax} onChange={set("filmMax")} error={f.filmMaxUm} />
      </fieldset>

      <fieldset>
        <legend className="mb-1 font-semibold">Cure schedule (metal temperature × hold)</legend>
        <p className="mb-2 text-sm text-ink-soft">Points from the data sheet. Holds between points are read on straight lines; outside them the schedule says nothing and Coatwright will not guess.</p>
        {f.cureSchedule && <p className="field-error">{f.cureSchedule}</p>}
        <ol className="space-y-2">
          {points.map((p, i) => (
            <li key={i} className="flex flex-wrap items-end gap-2">
              <div className="w-44">
                <TextField label={`Point ${i + 1} metal temperature (${unitOf("temperatureC", sys)})`} name={`cure-temp-${i}`} inputMode="decimal" value={p.temp} error={f[`cureSchedule.${i}.metalTempC`]} onChange={(s) => setPoints(points.map((q, j) => (j === i ? { ...q, temp: s } : q)))} />
              </div>
              <div className="w-36">
                <TextField label={`Point ${i + 1} hold (min)`} name={`cure-hold-${i}`} inputMode="decimal" value={p.hold} error={f[`cureSchedule.${i}.holdMin`]} onChange={(s) => setPoints(points.map((q, j) => (j === i ? { ...q, hold: s } : q)))} />
              </div>
              <button type="button" className="btn-quiet mb-0.5" disabled={points.length === 1} onClick={() => setPoints(points.filter((_, j) => j !== i))} aria-label={`Remove point ${i + 1}`}>
                Remove
              </button>
            </li>
          ))}
        </ol>
        <button type="button" className="btn-quiet mt-2" onClick={() => setPoints([...points, { temp: "", hold: "" }])} disabled={points.length >= 20}>
          Add a cure point
        </button>
      </fieldset>

      <fieldset className="grid gap-3 sm:grid-cols-3">
        <legend className="mb-2 font-semibold">Buying</legend>
        <TextField label={`Price (${currency} per ${unitOf("pricePerKg", sys)})`} name="price" inputMode="decimal" value={v.price} onChange={set("price")} error={f.pricePerKg} />
        <div>
          <label className="label" htmlFor="coating-container">Container</label>
          <select id="coating-container" className="field" value={v.containerKind} onChange={(e) => setV({ ...v, containerKind: e.target.value as "box" | "drum" })}>
            <option value="box">Box</option>
            <option value="drum">Drum</option>
          </select>
        </div>
        <TextField label={`Container size (${unitOf("massKg", sys)})`} name="containerMass" inputMode="decimal" value={v.containerMass} onChange={set("containerMass")} error={f.containerKg} />
        <TextField label="Supplier" name="supplierName" value={v.supplierName} onChange={set("supplierName")} error={f.supplierName} />
        <TextField label="Supplier contact e-mail" name="supplierEmail" type="email" value={v.supplierEmail} onChange={set("supplierEmail")} error={f.supplierEmail} />
        <TextField label="Lead time (days)" name="leadTimeDays" inputMode="numeric" value={v.leadTimeDays} onChange={set("leadTimeDays")} error={f.leadTimeDays} />
        <TextField label="Shelf life (months)" name="shelfLifeMonths" inputMode="numeric" value={v.shelfLifeMonths} onChange={set("shelfLifeMonths")} error={f.shelfLifeMonths} />
        <TextField label={`Reorder point (${unitOf("massKg", sys)})`} name="reorderPoint" inputMode="decimal" value={v.reorderPoint} onChange={set("reorderPoint")} error={f.reorderPointKg} hint="Marked low stock at or below this" />
      </fieldset>

      {error && <p role="alert" className="field-error">{error}</p>}
      <div className="flex gap-2">
        <button className="btn-primary" disabled={busy}>{initial ? "Save changes" : "Add coating"}</button>
        {onCancel && <button type="button" className="btn-quiet" onClick={onCancel}>Cancel</button>}
      </div>
    </form>
  );
}

function round(v: number): number {
  return Number(v.toPrecision(6));
}
