"use client";
// Create or edit a part. The area comes from one of four methods (STL upload, shape template,
// formula, typed area); every number is typed in the user's units and sent metric. The server
// works the figures out live (POST /api/parts/measure) so the form shows exactly what will be saved.

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useEffect, useId, useMemo, useRef, useState } from "react";
import useSWR from "swr";
import type { PartMeasureResult } from "@/app/api/parts/measure/route";
import { TextField } from "@/components/ui/text-field";
import { FetchError, sendJson } from "@/lib/fetcher";
import type { MeshView } from "@/lib/server/meshes";
import type { PartView, TemplateInfo } from "@/lib/server/parts";
import { DIMENSION_NAME, type AreaOrigin, type PartMaterial } from "@/lib/parts/part-fields";
import { MASS_ORIGIN_LABELS, MATERIAL_LABELS } from "./part-labels";
import { browserOnly } from "@/components/ui/browser-only";
import {
  convertText,
  densityFrom,
  densityText,
  densityUnit,
  inputText,
  label,
  metricFrom,
  showArea,
  showBox,
  showDensity,
  showLength,
  showMass,
  showVolume,
  type UnitSystem,
} from "./part-units";

// The STL upload (and its 3D preview) loads in the browser after the form: it stays out of the
// form's first load.
const MeshUpload = browserOnly(
  () => import("./mesh-upload").then((m) => m.MeshUpload),
  <p role="status" className="text-sm text-ink-soft">Loading the STL upload…</p>,
);

type Densities = Record<Exclude<PartMaterial, "other">, number>;

interface Props {
  unitSystem: UnitSystem;
  maxBytes: number;
  templates: TemplateInfo[];
  densities: Densities;
  /** editing: the part and its mesh */
  initial?: { part: PartView; mesh: MeshView | null };
}

interface FormulaDim {
  key: number;
  name: string;
  value: string;
}

const METHODS: { id: AreaOrigin; label: string; hint: string }[] = [
  { id: "mesh", label: "Upload an STL file", hint: "Exact area, volume and size from the CAD model." },
  { id: "template", label: "Shape template", hint: "Plate, tube, bar, angle, channel, drum or open box from a few dimensions." },
  { id: "formula", label: "Formula", hint: "Your own area formula over named dimensions." },
  { id: "manual", label: "Enter the area", hint: "An area you already know (from a drawing or the customer)." },
];

const THICKNESS_DIMS = ["thicknessMm", "wallMm"];

function useDebounced<T>(value: T, ms: number): T {
  const [shown, setShown] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setShown(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return shown;
}

/** Key: [url, body, mesh version]; a mesh whose unit was changed keeps its id but not its figures. */
/** Plain names of the fields the figures wait for. */
const FIELD_WORDS: Record<string, string> = {
  thicknessMm: "section thickness",
  densityKgPerM3: "density",
  massKg: "mass",
  lengthMm: "length",
  widthMm: "width",
  heightMm: "height",
  formula: "area formula",
  areaM2: "outside area",
};
function missingWords(missing: ReadonlySet<string>): string {
  const words = [...missing].map((k) => FIELD_WORDS[k] ?? (k.startsWith("dimensionsMm.") ? k.slice(13).replace(/Mm$/, "").replace(/([A-Z])/g, " $1").toLowerCase() : k.startsWith("dim-value-") ? "a dimension's value" : k));
  return [...new Set(words)].join(", ");
}

async function measureFetcher([url, body]: [string, string, string]): Promise<PartMeasureResult> {
  return sendJson<PartMeasureResult>(url, "POST", JSON.parse(body));
}

export function PartForm({ unitSystem, maxBytes, templates, densities, initial }: Props) {
  const router = useRouter();
  const ids = useId();
  const part = initial?.part;
  const L = (mm: number | null | undefined) => inputText("lengthMm", mm, unitSystem);

  const [system, setSystem] = useState(unitSystem);
  const [method, setMethod] = useState<AreaOrigin>(part?.areaOrigin ?? "mesh");
  const [number, setNumber] = useState(part?.number ?? "");
  const [name, setName] = useState(part?.name ?? "");
  const [customer, setCustomer] = useState(part?.customer ?? "");
  const [notes, setNotes] = useState(part?.notes ?? "");
  const [material, setMaterial] = useState<PartMaterial>(part?.material ?? "steel");
  const ownDensity = part && (part.material === "other" || part.densityKgPerM3 !== densities[part.material as keyof Densities]);
  const [density, setDensity] = useState(ownDensity ? densityText(part.densityKgPerM3, unitSystem) : "");
  const [thickness, setThickness] = useState(L(part?.thicknessMm));
  const thicknessTouched = useRef(Boolean(part));
  const [masked, setMasked] = useState(part?.maskedAreaM2 ? inputText("areaM2", part.maskedAreaM2, unitSystem) : "");
  const [inside, setInside] = useState(part && part.areaOrigin !== "template" && part.insideAreaM2 ? inputText("areaM2", part.insideAreaM2, unitSystem) : "");
  const [massEntered, setMassEntered] = useState(part?.massOrigin === "entered");
  const [mass, setMass] = useState(part?.massOrigin === "entered" ? inputText("massKg", part.massKg, unitSystem) : "");

  const [templateId, setTemplateId] = useState(part?.templateId ?? templates[0]?.id ?? "");
  const [templateDims, setTemplateDims] = useState<Record<string, string>>(() =>
    part?.areaOrigin === "template" && part.dimensionsMm ? Object.fromEntries(Object.entries(part.dimensionsMm).map(([k, v]) => [k, L(v)])) : {},
  );
  const [formula, setFormula] = useState(part?.formula ?? "2*(L*W + L*H + W*H)");
  const nextKey = useRef(10);
  const [formulaDims, setFormulaDims] = useState<FormulaDim[]>(() =>
    part?.areaOrigin === "formula" && part.dimensionsMm
      ? Object.entries(part.dimensionsMm).map(([n, v], i) => ({ key: i, name: n, value: L(v) }))
      : [
          { key: 0, name: "L", value: "" },
          { key: 1, name: "W", value: "" },
          { key: 2, name: "H", value: "" },
        ],
  );
  const [area, setArea] = useState(part?.areaOrigin === "manual" ? inputText("areaM2", part.areaM2, unitSystem) : "");
  const [box, setBox] = useState({ length: L(part?.lengthMm), width: L(part?.widthMm), height: L(part?.heightMm) });
  // A template part's own box (a formed part measured flat); editing decides it below.
  const [formedBox, setFormedBox] = useState(false);
  const [mesh, setMesh] = useState<MeshView | null>(initial?.mesh ?? null);
  const [meshConfirmed, setMeshConfirmed] = useState(true);

  const [saving, setSaving] = useState(false);
  const [saveError, setSaveError] = useState<FetchError | null>(null);
  const [attempted, setAttempted] = useState(false);

  // The header's unit switch re-renders the page in the other system: re-type what was entered.
  if (system !== unitSystem) {
    const c = (kind: Parameters<typeof convertText>[0], t: string) => convertText(kind, t, system, unitSystem);
    setSystem(unitSystem);
    setThickness(c("lengthMm", thickness));
    setMasked(c("areaM2", masked));
    setInside(c("areaM2", inside));
    setMass(c("massKg", mass));
    setArea(c("areaM2", area));
    const d = densityFrom(density, system);
    setDensity(d === null ? density : densityText(d, unitSystem));
    setBox({ length: c("lengthMm", box.length), width: c("lengthMm", box.width), height: c("lengthMm", box.height) });
    setTemplateDims(Object.fromEntries(Object.entries(templateDims).map(([k, v]) => [k, c("lengthMm", v)])));
    setFormulaDims(formulaDims.map((f) => ({ ...f, value: c("lengthMm", f.value) })));
  }

  const template = templates.find((t) => t.id === templateId) ?? null;

  // Local checks (numbers, required fields); the server checks the rest and names the field.
  const local = useMemo(() => {
    const errors: Record<string, string> = {};
    // Empty required fields: shown once the user tries to save, not while the form is filled in.
    const missing = new Set<string>();
    const num = (key: string, kind: Parameters<typeof metricFrom>[0], text: string, opts: { required?: boolean; zeroOk?: boolean } = {}) => {
      if (text.trim() === "") {
        if (opts.required) {
          errors[key] = "Enter a value.";
          missing.add(key);
        }
        return undefined;
      }
      const v = metricFrom(kind, text, unitSystem);
      if (v === null) errors[key] = "Enter a number.";
      else if (opts.zeroOk ? v < 0 : v <= 0) errors[key] = opts.zeroOk ? "Enter 0 or more." : "Enter a value above 0.";
      else return v;
      return undefined;
    };
    const body: Record<string, unknown> = { material, areaOrigin: method };
    if (density.trim() !== "" || material === "other") {
      const d = densityFrom(density, unitSystem);
      if (density.trim() === "") {
        errors.densityKgPerM3 = "Enter the density of this material.";
        missing.add("densityKgPerM3");
      }
      else if (d === null || d <= 0) errors.densityKgPerM3 = "Enter a number above 0.";
      else body.densityKgPerM3 = d;
    }
    body.thicknessMm = num("thicknessMm", "lengthMm", thickness, { required: true });
    body.maskedAreaM2 = num("maskedAreaM2", "areaM2", masked, { zeroOk: true });
    if (massEntered) body.massKg = num("massKg", "massKg", mass, { required: true });
    const needBox = method === "formula" || method === "manual" || (method === "template" && formedBox);
    if (needBox) {
      body.lengthMm = num("lengthMm", "lengthMm", box.length, { required: true });
      body.widthMm = num("widthMm", "lengthMm", box.width, { required: true });
      body.heightMm = num("heightMm", "lengthMm", box.height, { required: true });
    }
    if (method !== "template") body.insideAreaM2 = num("insideAreaM2", "areaM2", inside, { zeroOk: true });
    if (method === "mesh") {
      if (!mesh) {
        errors.meshId = "Upload an STL file first.";
        missing.add("meshId");
      }
      else body.meshId = mesh.id;
    } else if (mesh) {
      body.meshId = mesh.id; // kept for the 3D view
    }
    if (method === "template") {
      body.templateId = templateId;
      const dims: Record<string, number> = {};
      for (const d of template?.dimensions ?? []) {
        const v = num(`dimensionsMm.${d.name}`, "lengthMm", templateDims[d.name] ?? "", { required: true });
        if (v !== undefined) dims[d.name] = v;
      }
      body.dimensionsMm = dims;
    }
    if (method === "formula") {
      const dims: Record<string, number> = {};
      formulaDims.forEach((f) => {
        const n = f.name.trim();
        if (!DIMENSION_NAME.test(n)) errors[`dim-name-${f.key}`] = "A name starts with a letter: letters, digits and _ only.";
        else if (n in dims) errors[`dim-name-${f.key}`] = `"${n}" is used twice.`;
        const v = num(`dim-value-${f.key}`, "lengthMm", f.value, { required: true });
        if (v !== undefined && DIMENSION_NAME.test(n)) dims[n] = v;
      });
      body.dimensionsMm = dims;
      if (formula.trim() === "") {
        errors.formula = "Enter the area formula.";
        missing.add("formula");
      }
      body.formula = formula;
    }
    if (method === "manual") body.areaM2 = num("areaM2", "areaM2", area, { required: true });
    for (const k of Object.keys(body)) if (body[k] === undefined) delete body[k];
    return { errors, missing, body };
  }, [material, method, density, thickness, masked, massEntered, mass, box, inside, mesh, templateId, template, templateDims, formulaDims, formula, area, formedBox, unitSystem]);

  const measureKey = Object.keys(local.errors).length === 0 ? JSON.stringify(local.body) : null;
  const debounced = useDebounced(measureKey, 300);
  const { data: measured, error: measureError, isValidating } = useSWR<PartMeasureResult, FetchError>(
    debounced ? ["/api/parts/measure", debounced, mesh ? `${mesh.id}:${mesh.unit}:${mesh.areaM2}` : ""] : null,
    measureFetcher,
    { keepPreviousData: true, shouldRetryOnError: false, revalidateOnFocus: false },
  );

  // Editing a template part: its box is its own when it differs from the template's.
  const checkedFormed = useRef(false);
  useEffect(() => {
    if (checkedFormed.current || !part || part.areaOrigin !== "template" || !part.dimensionsMm || !part.templateId) return;
    checkedFormed.current = true;
    sendJson<PartMeasureResult>("/api/parts/measure", "POST", {
      material: part.material,
      densityKgPerM3: part.densityKgPerM3,
      thicknessMm: part.thicknessMm,
      areaOrigin: "template",
      templateId: part.templateId,
      dimensionsMm: part.dimensionsMm,
    })
      .then((m) => {
        const same = (a: number, b: number) => Math.abs(a - b) <= 1e-6 * Math.max(1, Math.abs(b));
        if (!(same(m.lengthMm, part.lengthMm) && same(m.widthMm, part.widthMm) && same(m.heightMm, part.heightMm))) setFormedBox(true);
      })
      .catch(() => undefined);
  }, [part]);

  const fresh = measureKey !== null && debounced === measureKey && !measureError;
  const shown = measureKey !== null && !measureError ? measured : undefined;
  const stale = shown !== undefined && (!fresh || isValidating);

  const serverFields: Record<string, string> = { ...(measureKey !== null && debounced === measureKey ? measureError?.fields : undefined), ...saveError?.fields };
  const err = (key: string) => (attempted || !local.missing.has(key) ? local.errors[key] : undefined) ?? serverFields[key];

  async function save(e: React.FormEvent) {
    e.preventDefault();
    setSaveError(null);
    setAttempted(true);
    const identity = { number: number.trim(), name: name.trim(), customer: customer.trim(), notes };
    const problems: Record<string, string> = {};
    if (!identity.number) problems.number = "Enter a part number.";
    if (!identity.name) problems.name = "Enter a name.";
    if (Object.keys(local.errors).length || Object.keys(problems).length) {
      setSaveError(new FetchError(400, "invalid_input", "Some fields need attention: see the messages beside them.", problems));
      return;
    }
    if (method === "mesh" && !meshConfirmed) {
      setSaveError(new FetchError(400, "invalid_input", "Confirm the unit the STL file was drawn in first."));
      return;
    }
    setSaving(true);
    try {
      const payload = { ...identity, ...local.body };
      const res = part
        ? await sendJson<{ part: PartView }>(`/api/parts/${part.id}`, "PUT", payload)
        : await sendJson<{ part: PartView }>("/api/parts", "POST", payload);
      router.push(`/parts/${res.part.id}`);
      router.refresh();
    } catch (error) {
      setSaveError(error as FetchError);
      setSaving(false);
    }
  }

  const defaultDensity = material === "other" ? null : densities[material];
  const areaLabel = (text: string) => label(text, "areaM2", unitSystem);
  const lenLabel = (text: string) => label(text, "lengthMm", unitSystem);

  const setDim = (n: string, v: string) => {
    setTemplateDims((d) => ({ ...d, [n]: v }));
    if (THICKNESS_DIMS.includes(n) && !thicknessTouched.current) setThickness(v);
  };

  const boxFields = (
    <div className="grid gap-3 sm:grid-cols-3">
      <TextField label={lenLabel("Length (x)")} name="lengthMm" inputMode="decimal" value={box.length} onChange={(v) => setBox((b) => ({ ...b, length: v }))} error={err("lengthMm")} />
      <TextField label={lenLabel("Width (y)")} name="widthMm" inputMode="decimal" value={box.width} onChange={(v) => setBox((b) => ({ ...b, width: v }))} error={err("widthMm")} />
      <TextField label={lenLabel("Height (z)")} name="heightMm" inputMode="decimal" value={box.height} onChange={(v) => setBox((b) => ({ ...b, height: v }))} error={err("heightMm")} hint="Kept vertical when hung upright." />
    </div>
  );

  const insideField = (hint: string) => (
    <TextField label={areaLabel("Inside area")} name="insideAreaM2" inputMode="decimal" value={inside} onChange={setInside} error={err("insideAreaM2")} hint={hint} />
  );

  return (
    <form className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]" onSubmit={save} noValidate aria-label={part ? "Edit part" : "Create part"}>
      <div className="space-y-4">
        <fieldset className="card space-y-3">
          <legend className="px-1 font-semibold">Part</legend>
          <div className="grid gap-3 sm:grid-cols-2">
            <TextField label="Part number" name="number" value={number} onChange={setNumber} error={err("number")} required hint="Unique in the catalogue, e.g. BC-1042." />
            <TextField label="Name" name="name" value={name} onChange={setName} error={err("name")} required />
            <TextField label="Customer" name="customer" value={customer} onChange={setCustomer} error={err("customer")} />
          </div>
        </fieldset>

        <fieldset className="card space-y-3">
          <legend className="px-1 font-semibold">Where the area comes from</legend>
          <div role="radiogroup" aria-label="Area method" className="grid gap-2 sm:grid-cols-2">
            {METHODS.map((m) => (
              <label
                key={m.id}
                className={`flex cursor-pointer gap-2 rounded-md border p-2.5 text-sm ${method === m.id ? "border-phosphate bg-phosphate-light" : "border-plate-line bg-white"}`}
              >
                <input type="radio" name="areaOrigin" value={m.id} checked={method === m.id} onChange={() => setMethod(m.id)} className="mt-0.5" />
                <span>
                  <span className="font-medium">{m.label}</span>
                  <span className="block text-xs text-ink-soft">{m.hint}</span>
                </span>
              </label>
            ))}
          </div>

          {method === "mesh" && (
            <div className="space-y-3">
              <MeshUpload
                unitSystem={unitSystem}
                maxBytes={maxBytes}
                mesh={mesh}
                error={err("meshId")}
                onMesh={(m, confirmed) => {
                  setMesh(m);
                  setMeshConfirmed(confirmed);
                }}
              />
              {insideField("Inside surfaces of tubes and boxes within the mesh's area; e-coat reaches them, powder mostly does not. Leave empty for none.")}
            </div>
          )}

          {method === "template" && (
            <div className="space-y-3">
              <div>
                <label htmlFor={`${ids}-template`} className="label">Shape</label>
                <select id={`${ids}-template`} className="field" value={templateId} onChange={(e) => setTemplateId(e.target.value)} aria-invalid={err("templateId") ? true : undefined}>
                  {templates.map((t) => (
                    <option key={t.id} value={t.id}>{t.name}</option>
                  ))}
                </select>
                {template && <p className="mt-1 text-xs text-ink-faint">{template.description} Corners are sharp and welds ignored.</p>}
                {err("templateId") && <p className="field-error">{err("templateId")}</p>}
              </div>
              <div className="grid gap-3 sm:grid-cols-2">
                {template?.dimensions.map((d) => (
                  <TextField
                    key={`${template.id}-${d.name}`}
                    label={lenLabel(d.label)}
                    name={`dim-${d.name}`}
                    inputMode="decimal"
                    value={templateDims[d.name] ?? ""}
                    onChange={(v) => setDim(d.name, v)}
                    error={err(`dimensionsMm.${d.name}`)}
                  />
                ))}
              </div>
              <label className="flex items-center gap-2 text-sm">
                <input type="checkbox" checked={formedBox} onChange={(e) => setFormedBox(e.target.checked)} />
                The part is bent or rolled after cutting: give the box it hangs in
              </label>
              {formedBox && boxFields}
            </div>
          )}

          {method === "formula" && (
            <div className="space-y-3">
              <fieldset>
                <legend className="label">Named dimensions</legend>
                <ul className="space-y-2">
                  {formulaDims.map((f) => (
                    <li key={f.key} className="grid grid-cols-[8rem_minmax(0,1fr)_auto] items-start gap-2">
                      <div>
                        <label className="sr-only" htmlFor={`${ids}-dn-${f.key}`}>Dimension name</label>
                        <input
                          id={`${ids}-dn-${f.key}`}
                          className="field font-mono"
                          value={f.name}
                          aria-invalid={err(`dim-name-${f.key}`) ? true : undefined}
                          onChange={(e) => setFormulaDims((ds) => ds.map((x) => (x.key === f.key ? { ...x, name: e.target.value } : x)))}
                        />
                        {err(`dim-name-${f.key}`) && <p className="field-error">{err(`dim-name-${f.key}`)}</p>}
                      </div>
                      <div>
                        <label className="sr-only" htmlFor={`${ids}-dv-${f.key}`}>{`Value of ${f.name || "this dimension"} (${unitSystem === "us" ? "in" : "mm"})`}</label>
                        <input
                          id={`${ids}-dv-${f.key}`}
                          className="field"
                          inputMode="decimal"
                          placeholder={unitSystem === "us" ? "in" : "mm"}
                          value={f.value}
                          aria-invalid={err(`dim-value-${f.key}`) || err(`dimensionsMm.${f.name.trim()}`) ? true : undefined}
                          onChange={(e) => setFormulaDims((ds) => ds.map((x) => (x.key === f.key ? { ...x, value: e.target.value } : x)))}
                        />
                        {(err(`dim-value-${f.key}`) || err(`dimensionsMm.${f.name.trim()}`)) && (
                          <p className="field-error">{err(`dim-value-${f.key}`) || err(`dimensionsMm.${f.name.trim()}`)}</p>
                        )}
                      </div>
                      <button
                        type="button"
                        className="btn-quiet"
                        aria-label={`Remove ${f.name || "this dimension"}`}
                        onClick={() => setFormulaDims((ds) => ds.filter((x) => x.key !== f.key))}
                      >
                        ✕
                      </button>
                    </li>
                  ))}
                </ul>
                <button
                  type="button"
                  className="btn-quiet mt-2"
                  disabled={formulaDims.length >= 12}
                  onClick={() => setFormulaDims((ds) => [...ds, { key: nextKey.current++, name: "", value: "" }])}
                >
                  Add a dimension
                </button>
              </fieldset>
              <div>
                <label htmlFor={`${ids}-formula`} className="label">Area formula</label>
                <input
                  id={`${ids}-formula`}
                  className="field font-mono"
                  value={formula}
                  onChange={(e) => setFormula(e.target.value)}
                  aria-invalid={err("formula") ? true : undefined}
                  aria-describedby={`${ids}-formula-hint${err("formula") ? ` ${ids}-formula-err` : ""}`}
                />
                <p id={`${ids}-formula-hint`} className="mt-1 text-xs text-ink-faint">
                  Use the names above, numbers, pi, + − * / ^, parentheses and sqrt, abs, min, max, hypot, sin, cos, tan. Dimensions count in
                  millimetres whatever you type them in, so a number added on its own is mm².
                </p>
                {err("formula") && (
                  <p id={`${ids}-formula-err`} className="field-error" role="alert">
                    {err("formula")}
                  </p>
                )}
              </div>
              {insideField("Inside surfaces of tubes and boxes; e-coat reaches them, powder mostly does not.")}
              <p className="text-sm font-medium">Bounding box</p>
              {boxFields}
            </div>
          )}

          {method === "manual" && (
            <div className="space-y-3">
              <div className="grid gap-3 sm:grid-cols-2">
                <TextField label={areaLabel("Outside area")} name="areaM2" inputMode="decimal" value={area} onChange={setArea} error={err("areaM2")} />
                {insideField("Kept apart from the outside area; e-coat reaches it, powder mostly does not.")}
              </div>
              <p className="text-sm font-medium">Bounding box</p>
              {boxFields}
            </div>
          )}
        </fieldset>

        <fieldset className="card space-y-3">
          <legend className="px-1 font-semibold">Material, masking and mass</legend>
          <div className="grid gap-3 sm:grid-cols-2">
            <div>
              <label htmlFor={`${ids}-material`} className="label">Material</label>
              <select id={`${ids}-material`} className="field" value={material} onChange={(e) => setMaterial(e.target.value as PartMaterial)}>
                {(Object.keys(MATERIAL_LABELS) as PartMaterial[]).map((m) => (
                  <option key={m} value={m}>{MATERIAL_LABELS[m]}</option>
                ))}
              </select>
            </div>
            <TextField
              label={`Density (${densityUnit(unitSystem)})`}
              name="densityKgPerM3"
              inputMode="decimal"
              value={density}
              onChange={setDensity}
              error={err("densityKgPerM3")}
              hint={defaultDensity ? `Leave empty for ${showDensity(defaultDensity, unitSystem)} (handbook value).` : "Required for another material."}
            />
            <TextField
              label={lenLabel("Section thickness")}
              name="thicknessMm"
              inputMode="decimal"
              value={thickness}
              onChange={(v) => {
                thicknessTouched.current = true;
                setThickness(v);
              }}
              error={err("thicknessMm")}
              hint="The wall or plate thickness: it sets heat-up in the oven."
            />
            <TextField
              label={areaLabel("Masked area")}
              name="maskedAreaM2"
              inputMode="decimal"
              value={masked}
              onChange={setMasked}
              error={err("maskedAreaM2")}
              hint="Threads, bores and contact points left bare; subtracted from the outside area."
            />
          </div>
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" checked={massEntered} onChange={(e) => setMassEntered(e.target.checked)} />
            Enter the mass myself (weighed, or from the drawing)
          </label>
          {massEntered && (
            <div className="max-w-xs">
              <TextField label={label("Mass", "massKg", unitSystem)} name="massKg" inputMode="decimal" value={mass} onChange={setMass} error={err("massKg")} />
            </div>
          )}
          <div>
            <label htmlFor={`${ids}-notes`} className="label">Notes</label>
            <textarea id={`${ids}-notes`} className="field min-h-20" value={notes} onChange={(e) => setNotes(e.target.value)} maxLength={2000} />
          </div>
        </fieldset>
      </div>

      <aside className="space-y-4 lg:sticky lg:top-4 lg:self-start">
        <section className="card space-y-2" aria-labelledby={`${ids}-live`} aria-live="polite" aria-busy={stale}>
          <div className="flex items-baseline justify-between gap-2">
            <h2 id={`${ids}-live`}>Figures</h2>
            {stale && <span className="text-xs text-ink-faint" role="status">Updating…</span>}
          </div>
          {measureError && measureKey !== null && debounced === measureKey ? (
            <p className="field-error" role="alert" data-testid="measure-error">{measureError.message}</p>
          ) : !shown ? (
            <p className="text-sm text-ink-soft">
              {method === "mesh" && !mesh
                ? `Upload the STL file${local.missing.size > 1 ? ` and fill in ${missingWords(new Set([...local.missing].filter((k) => k !== "meshId")))}` : ""} to see its figures.`
                : local.missing.size > 0
                  ? `Still to fill in: ${missingWords(local.missing)}. The area and mass appear then.`
                  : "Fill in the fields to see the area and mass."}
            </p>
          ) : (
            <dl className={`space-y-1.5 text-sm ${stale ? "opacity-70" : ""}`} data-testid="live-figures">
              <Row term="Outside area" value={showArea(shown.areaM2, unitSystem)} testId="live-area" />
              {shown.edgeAreaM2 !== null && shown.edgeAreaM2 > 0 && <Row term="of which edges and ends" value={showArea(shown.edgeAreaM2, unitSystem, 3)} soft />}
              <Row term="Masked" value={showArea(shown.maskedAreaM2, unitSystem, 3)} soft />
              <Row term="Coated area" value={showArea(shown.coatedAreaM2, unitSystem)} strong testId="live-coated" />
              <Row term="Inside area (kept apart)" value={showArea(shown.insideAreaM2, unitSystem)} />
              {shown.volumeM3 !== null && <Row term="Metal volume" value={showVolume(shown.volumeM3, unitSystem)} />}
              <Row term="Mass" value={showMass(shown.massKg, unitSystem)} strong testId="live-mass" />
              <p className="text-xs text-ink-soft" data-testid="live-mass-basis">
                {shown.massOrigin === "entered"
                  ? "Mass as entered."
                  : shown.massOrigin === "volume" && shown.volumeM3 !== null
                    ? `Mass from ${MASS_ORIGIN_LABELS.volume}: ${showVolume(shown.volumeM3, unitSystem)} × ${showDensity(shown.densityKgPerM3, unitSystem)}.`
                    : `No metal volume is known, so the mass is a ${MASS_ORIGIN_LABELS.sheet}: half the surface × ${showLength(Number(local.body.thicknessMm ?? 0), unitSystem)} × ${showDensity(shown.densityKgPerM3, unitSystem)}.`}
              </p>
              <Row term="Box (L × W × H)" value={showBox(shown.lengthMm, shown.widthMm, shown.heightMm, unitSystem)} />
              {shown.massKg > shown.solidBoxMassKg * (1 + 1e-9) && (
                <p role="status" className="rounded border border-caution-edge bg-caution-light p-2 text-xs" data-testid="mass-implausible">
                  This mass is more than a solid block of this metal the size of the box would weigh ({showMass(shown.solidBoxMassKg, unitSystem)}): check the
                  area, the section thickness, the mass or the box.
                </p>
              )}
            </dl>
          )}
        </section>
        {saveError && (
          <p role="alert" className="rounded-md border border-oxide bg-oxide-light p-3 text-sm" data-testid="save-error">
            {saveError.message}
          </p>
        )}
        <div className="flex flex-wrap gap-2">
          <button type="submit" className="btn-primary" disabled={saving || (method === "mesh" && (!mesh || !meshConfirmed))}>
            {saving ? "Saving…" : part ? "Save changes" : "Save part"}
          </button>
          <Link className="btn-quiet" href={part ? `/parts/${part.id}` : "/parts"}>Cancel</Link>
        </div>
        {method === "mesh" && mesh && !meshConfirmed && <p className="text-sm text-caution">Confirm the unit above before saving.</p>}
      </aside>
    </form>
  );
}

function Row({ term, value, strong, soft, testId }: { term: string; value: string; strong?: boolean; soft?: boolean; testId?: string }) {
  return (
    <div className="flex items-baseline justify-between gap-3">
      <dt className={soft ? "text-ink-faint" : "text-ink-soft"}>{term}</dt>
      <dd className={`num text-right ${strong ? "font-semibold" : ""}`} data-testid={testId}>{value}</dd>
    </div>
  );
}
