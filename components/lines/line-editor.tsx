"use client";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { FetchError, sendJson } from "@/lib/fetcher";
import type { LineView, StageView } from "@/lib/server/lines";
import { HEATED_STAGE_KINDS, OVEN_STAGE_KINDS, STAGE_KIND_LABELS, STAGE_KINDS, type StageKind } from "@/lib/lines/stages";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { TextField } from "@/components/ui/text-field";
import { draft, parse, parsePlain, unitOf, type UnitKind } from "./unit-draft";

interface Props {
  initial?: LineView;
  unitSystem: UnitSystem;
  currency: string;
}

interface StageDraft {
  key: number;
  name: string;
  kind: StageKind;
  length: string;
  temp: string;
  h: string;
  colourChange: string;
  orig?: StageView;
}

type Dims = { width: string; height: string; depth: string };

let nextKey = 1;

/** Create or edit a conveyor line (with its ordered stages) or a batch oven, in the user's units. */
export function LineEditor({ initial, unitSystem: sys, currency }: Props) {
  const router = useRouter();
  const d = (kind: UnitKind, v: number | null | undefined) => draft(kind, v, sys);
  const conveyor = initial?.kind === "conveyor" ? initial : undefined;
  const oven = initial?.kind === "batch" ? initial : undefined;
  const dimsOf = (w?: { widthMm: number; heightMm: number; depthMm: number }): Dims => ({
    width: d("lengthMm", w?.widthMm),
    height: d("lengthMm", w?.heightMm),
    depth: d("lengthMm", w?.depthMm),
  });
  const [kind, setKind] = useState<"conveyor" | "batch">(initial?.kind ?? "conveyor");
  const [v, setV] = useState({
    name: initial?.name ?? "",
    notes: initial?.notes ?? "",
    hourlyCost: initial?.hourlyCost?.toString() ?? "",
    maxLoad: d("massKg", initial?.maxLoadKg),
    speedMin: d("speedMPerMin", conveyor?.lineSpeedMinMPerMin),
    speedMax: d("speedMPerMin", conveyor?.lineSpeedMaxMPerMin),
    speedNominal: d("speedMPerMin", conveyor?.lineSpeedNominalMPerMin),
    pitch: d("lengthM", conveyor?.carrierPitchM),
    racksPerLoad: oven?.racksPerLoad?.toString() ?? "",
    airTemp: d("temperatureC", oven?.airTempC),
    h: d("heatTransferWPerM2K", oven?.heatTransferCoefficientWPerM2K),
    loadMin: oven?.loadMin?.toString() ?? "",
    unloadMin: oven?.unloadMin?.toString() ?? "",
  });
  const [win, setWin] = useState<Dims>(dimsOf(initial?.windowMm));
  const [interior, setInterior] = useState<Dims>(dimsOf(oven?.interiorMm));
  const [stages, setStages] = useState<StageDraft[]>(
    conveyor?.stages.map((s) => ({
      key: nextKey++,
      name: s.name,
      kind: s.kind,
      length: d("lengthM", s.lengthM),
      temp: d("temperatureC", s.tempC),
      h: d("heatTransferWPerM2K", s.heatTransferCoefficientWPerM2K),
      colourChange: s.colourChangeMin?.toString() ?? "",
      orig: s,
    })) ?? [blankStage("cure-oven")],
  );
  const [fields, setFields] = useState<Record<string, string>>({});
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const set = (k: keyof typeof v) => (s: string) => setV({ ...v, [k]: s });

  function build(local: Record<string, string>) {
    const num = (key: string, value: number | undefined) => {
      if (value !== undefined && Number.isNaN(value)) local[key] = "Enter a number.";
      return value;
    };
    const dimsBody = (prefix: string, t: Dims, orig?: { widthMm: number; heightMm: number; depthMm: number }) => ({
      widthMm: num(`${prefix}.widthMm`, parse("lengthMm", t.width, sys, orig?.widthMm)),
      heightMm: num(`${prefix}.heightMm`, parse("lengthMm", t.height, sys, orig?.heightMm)),
      depthMm: num(`${prefix}.depthMm`, parse("lengthMm", t.depth, sys, orig?.depthMm)),
    });
    const common = {
      kind,
      name: v.name,
      notes: v.notes,
      hourlyCost: num("hourlyCost", parsePlain(v.hourlyCost)),
      windowMm: dimsBody("windowMm", win, initial?.windowMm),
      maxLoadKg: num("maxLoadKg", parse("massKg", v.maxLoad, sys, initial?.maxLoadKg)),
    };
    if (kind === "conveyor") {
      return {
        ...common,
        lineSpeedMinMPerMin: num("lineSpeedMinMPerMin", parse("speedMPerMin", v.speedMin, sys, conveyor?.lineSpeedMinMPerMin)),
        lineSpeedMaxMPerMin: num("lineSpeedMaxMPerMin", parse("speedMPerMin", v.speedMax, sys, conveyor?.lineSpeedMaxMPerMin)),
        lineSpeedNominalMPerMin: num("lineSpeedNominalMPerMin", parse("speedMPerMin", v.speedNominal, sys, conveyor?.lineSpeedNominalMPerMin)),
        carrierPitchM: num("carrierPitchM", parse("lengthM", v.pitch, sys, conveyor?.carrierPitchM)),
        stages: stages.map((s, i) => ({
          name: s.name,
          kind: s.kind,
          lengthM: num(`stages.${i}.lengthM`, parse("lengthM", s.length, sys, s.orig?.lengthM)),
          tempC: HEATED_STAGE_KINDS.includes(s.kind) ? (num(`stages.${i}.tempC`, parse("temperatureC", s.temp, sys, s.orig?.tempC)) ?? null) : null,
          heatTransferCoefficientWPerM2K: OVEN_STAGE_KINDS.includes(s.kind)
            ? (num(`stages.${i}.heatTransferCoefficientWPerM2K`, parse("heatTransferWPerM2K", s.h, sys, s.orig?.heatTransferCoefficientWPerM2K)) ?? null)
            : null,
          colourChangeMin: s.kind === "powder-booth" ? (num(`stages.${i}.colourChangeMin`, parsePlain(s.colourChange)) ?? null) : null,
        })),
      };
    }
    return {
      ...common,
      interiorMm: dimsBody("interiorMm", interior, oven?.interiorMm),
      racksPerLoad: num("racksPerLoad", parsePlain(v.racksPerLoad)),
      airTempC: num("airTempC", parse("temperatureC", v.airTemp, sys, oven?.airTempC)),
      heatTransferCoefficientWPerM2K: num("heatTransferCoefficientWPerM2K", parse("heatTransferWPerM2K", v.h, sys, oven?.heatTransferCoefficientWPerM2K)),
      loadMin: num("loadMin", parsePlain(v.loadMin)),
      unloadMin: num("unloadMin", parsePlain(v.unloadMin)),
    };
  }

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    const local: Record<string, string> = {};
    const body = build(local);
    if (Object.keys(local).length) {
      setFields(local);
      setError("Some numbers could not be read; see the marked fields.");
      return;
    }
    setBusy(true);
    setError(null);
    try {
      const res = initial
        ? await sendJson<{ line: LineView }>(`/api/lines/${initial.id}`, "PUT", body)
        : await sendJson<{ line: LineView }>("/api/lines", "POST", body);
      router.push(`/lines/${res.line.id}`);
      router.refresh();
    } catch (err) {
      setFields(err instanceof FetchError ? err.fields : {});
      setError(err instanceof Error ? err.message : "Not saved.");
    } finally {
      setBusy(false);
    }
  }

  const f = fields;
  const move = (i: number, by: number) => {
    const next = [...stages];
    const [s] = next.splice(i, 1);
    next.splice(i + by, 0, s);
    setStages(next);
  };
  const patchStage = (i: number, patch: Partial<StageDraft>) => setStages(stages.map((s, j) => (j === i ? { ...s, ...patch } : s)));
  const dimFields = (label: string, prefix: string, t: Dims, setT: (t: Dims) => void) => (
    <fieldset className="grid gap-3 sm:grid-cols-3 sm:col-span-3">
      <legend className="label">{label} ({unitOf("lengthMm", sys)})</legend>
      <TextField label="Width (along travel)" name={`${prefix}-w`} inputMode="decimal" value={t.width} onChange={(s) => setT({ ...t, width: s })} error={f[`${prefix}.widthMm`] ?? f[prefix]} />
      <TextField label="Height" name={`${prefix}-h`} inputMode="decimal" value={t.height} onChange={(s) => setT({ ...t, height: s })} error={f[`${prefix}.heightMm`]} />
      <TextField label="Depth (across)" name={`${prefix}-d`} inputMode="decimal" value={t.depth} onChange={(s) => setT({ ...t, depth: s })} error={f[`${prefix}.depthMm`]} />
    </fieldset>
  );

  return (
    <form className="space-y-6" noValidate onSubmit={submit} aria-label={initial ? `Edit ${initial.name}` : "New line"}>
      <section className="card grid gap-3 sm:grid-cols-3">
        <h2 className="sm:col-span-3">Line</h2>
        <TextField label="Name" name="name" value={v.name} onChange={set("name")} error={f.name} />
        <fieldset>
          <legend className="label">Kind</legend>
          <div className="flex gap-4 pt-1.5 text-sm">
            <label className="flex items-center gap-2">
              <input type="radio" name="kind" value="conveyor" checked={kind === "conveyor"} onChange={() => setKind("conveyor")} /> Conveyor line
            </label>
            <label className="flex items-center gap-2">
              <input type="radio" name="kind" value="batch" checked={kind === "batch"} onChange={() => setKind("batch")} /> Batch oven
            </label>
          </div>
          {f.kind && <p className="field-error">{f.kind}</p>}
        </fieldset>
        <TextField label={`Running cost (${currency} per hour)`} name="hourlyCost" inputMode="decimal" value={v.hourlyCost} onChange={set("hourlyCost")} error={f.hourlyCost} />
        <div className="sm:col-span-3">
          <label className="label" htmlFor="line-notes">Notes</label>
          <textarea id="line-notes" className="field" rows={2} value={v.notes} onChange={(e) => setV({ ...v, notes: e.target.value })} />
          {f.notes && <p className="field-error">{f.notes}</p>}
        </div>
      </section>

      {kind === "conveyor" ? (
        <>
          <section className="card grid gap-3 sm:grid-cols-3">
            <h2 className="sm:col-span-3">Conveyor and carriers</h2>
            <TextField label={`Slowest speed (${unitOf("speedMPerMin", sys)})`} name="speedMin" inputMode="decimal" value={v.speedMin} onChange={set("speedMin")} error={f.lineSpeedMinMPerMin} />
            <TextField label={`Fastest speed (${unitOf("speedMPerMin", sys)})`} name="speedMax" inputMode="decimal" value={v.speedMax} onChange={set("speedMax")} error={f.lineSpeedMaxMPerMin} />
            <TextField label={`Usual speed (${unitOf("speedMPerMin", sys)})`} name="speedNominal" inputMode="decimal" value={v.speedNominal} onChange={set("speedNominal")} error={f.lineSpeedNominalMPerMin} />
            <TextField label={`Carrier pitch (${unitOf("lengthM", sys)})`} name="pitch" inputMode="decimal" value={v.pitch} onChange={set("pitch")} error={f.carrierPitchM} hint="Centre to centre of carriers" />
            <TextField label={`Load limit per carrier (${unitOf("massKg", sys)})`} name="maxLoad" inputMode="decimal" value={v.maxLoad} onChange={set("maxLoad")} error={f.maxLoadKg} />
            <div />
            {dimFields("Usable carrier window", "windowMm", win, setWin)}
          </section>

          <section className="card space-y-3" aria-labelledby="stages-h">
            <h2 id="stages-h">Stages, in conveyor order</h2>
            <p className="text-sm text-ink-soft">
              Dwell in each stage follows from its conveyor length and the line speed. Ovens and heated tanks take an air or bath temperature;
              each oven its own heat-transfer coefficient (cure ovens are ~20–60 W/(m²·K), from memory; measure yours with a temperature recorder).
            </p>
            {f.stages && <p className="field-error" role="alert">{f.stages}</p>}
            <ol className="space-y-3">
              {stages.map((s, i) => (
                <li key={s.key} className="rounded-md border border-plate-line p-3">
                  <div className="grid items-end gap-2 sm:grid-cols-[2fr_1.5fr_1fr_1fr_1fr_1fr]">
                    <TextField label={`Stage ${i + 1} name`} name={`stage-${i}-name`} value={s.name} onChange={(x) => patchStage(i, { name: x })} error={f[`stages.${i}.name`]} />
                    <div>
                      <label className="label" htmlFor={`stage-${s.key}-kind`}>Kind</label>
                      <select id={`stage-${s.key}-kind`} className="field" value={s.kind} onChange={(e) => patchStage(i, { kind: e.target.value as StageKind })}>
                        {STAGE_KINDS.map((k) => <option key={k} value={k}>{STAGE_KIND_LABELS[k]}</option>)}
                      </select>
                    </div>
                    <TextField label={`Length (${unitOf("lengthM", sys)})`} name={`stage-${i}-length`} inputMode="decimal" value={s.length} onChange={(x) => patchStage(i, { length: x })} error={f[`stages.${i}.lengthM`]} />
                    {HEATED_STAGE_KINDS.includes(s.kind) ? (
                      <TextField label={`${OVEN_STAGE_KINDS.includes(s.kind) ? "Air" : "Bath"} (${unitOf("temperatureC", sys)})`} name={`stage-${i}-temp`} inputMode="decimal" value={s.temp} onChange={(x) => patchStage(i, { temp: x })} error={f[`stages.${i}.tempC`]} />
                    ) : <div />}
                    {OVEN_STAGE_KINDS.includes(s.kind) ? (
                      <TextField label={`h (${unitOf("heatTransferWPerM2K", sys)})`} name={`stage-${i}-h`} inputMode="decimal" value={s.h} onChange={(x) => patchStage(i, { h: x })} error={f[`stages.${i}.heatTransferCoefficientWPerM2K`]} />
                    ) : s.kind === "powder-booth" ? (
                      <TextField label="Colour change (min)" name={`stage-${i}-cc`} inputMode="decimal" value={s.colourChange} onChange={(x) => patchStage(i, { colourChange: x })} error={f[`stages.${i}.colourChangeMin`]} />
                    ) : <div />}
                    <div className="flex gap-1 pb-0.5">
                      <button type="button" className="btn-quiet px-2" aria-label={`Move stage ${i + 1} up`} disabled={i === 0} onClick={() => move(i, -1)}>↑</button>
                      <button type="button" className="btn-quiet px-2" aria-label={`Move stage ${i + 1} down`} disabled={i === stages.length - 1} onClick={() => move(i, 1)}>↓</button>
                      <button type="button" className="btn-quiet px-2" aria-label={`Remove stage ${i + 1}`} onClick={() => setStages(stages.filter((_, j) => j !== i))}>✕</button>
                    </div>
                  </div>
                  {f[`stages.${i}.kind`] && <p className="field-error">{f[`stages.${i}.kind`]}</p>}
                </li>
              ))}
            </ol>
            {stages.length === 0 && <p className="text-sm text-ink-soft">No stages: a conveyor line needs at least one.</p>}
            <button type="button" className="btn-quiet" onClick={() => setStages([...stages, blankStage("rinse")])}>Add a stage</button>
          </section>
        </>
      ) : (
        <section className="card grid gap-3 sm:grid-cols-3">
          <h2 className="sm:col-span-3">Batch oven</h2>
          {dimFields("Interior", "interiorMm", interior, setInterior)}
          <TextField label="Racks per load" name="racksPerLoad" inputMode="numeric" value={v.racksPerLoad} onChange={set("racksPerLoad")} error={f.racksPerLoad} />
          <TextField label={`Load limit per rack (${unitOf("massKg", sys)})`} name="maxLoad" inputMode="decimal" value={v.maxLoad} onChange={set("maxLoad")} error={f.maxLoadKg} />
          <div />
          {dimFields("Usable window of each rack", "windowMm", win, setWin)}
          <TextField label={`Air temperature (${unitOf("temperatureC", sys)})`} name="airTemp" inputMode="decimal" value={v.airTemp} onChange={set("airTemp")} error={f.airTempC} />
          <TextField label={`Heat-transfer coefficient (${unitOf("heatTransferWPerM2K", sys)})`} name="h" inputMode="decimal" value={v.h} onChange={set("h")} error={f.heatTransferCoefficientWPerM2K} />
          <div />
          <TextField label="Load time (min)" name="loadMin" inputMode="decimal" value={v.loadMin} onChange={set("loadMin")} error={f.loadMin} />
          <TextField label="Unload time (min)" name="unloadMin" inputMode="decimal" value={v.unloadMin} onChange={set("unloadMin")} error={f.unloadMin} />
        </section>
      )}

      {error && <p role="alert" className="field-error">{error}</p>}
      <div className="flex gap-2">
        <button className="btn-primary" disabled={busy}>{initial ? "Save line" : "Add line"}</button>
        <button type="button" className="btn-quiet" onClick={() => router.push(initial ? `/lines/${initial.id}` : "/lines")}>Cancel</button>
      </div>
    </form>
  );
}

function blankStage(kind: StageKind): StageDraft {
  return { key: nextKey++, name: "", kind, length: "", temp: "", h: "", colourChange: "" };
}
