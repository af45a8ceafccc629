"use client";
// Per line: what one carrier's count means for a conveyor hour or a batch-oven shift.

import { useEffect, useState } from "react";
import { TextField } from "@/components/ui/text-field";
import { formatSignificant, type QuantityKind, type UnitSystem } from "@/lib/coating-math/display-units";
import { batchOvenRackingThroughput, conveyorRackingThroughput } from "@/lib/rack/throughput";
import { convertText, fieldText, metricFrom, withUnit } from "./form-units";
import type { LineOption } from "./line-options";

type Mode = "conveyor" | "batch";

const FIELDS = {
  lineSpeedMPerMin: "speedMPerMin",
  carrierPitchM: "lengthM",
  loadedPercent: null,
  racksPerLoad: null,
  loadMin: null,
  heatUpMin: null,
  holdMin: null,
  unloadMin: null,
  shiftHours: null,
} as const satisfies Record<string, QuantityKind | null>;

type FieldName = keyof typeof FIELDS;
type Values = Record<FieldName, string>;

const whole = (n: number) => Math.round(n).toLocaleString("en-US");

interface Props {
  partsPerCarrier: number;
  unitSystem: UnitSystem;
  shiftHours: number;
  line: LineOption | null;
}

export function PerLine({ partsPerCarrier, unitSystem, shiftHours, line }: Props) {
  const [mode, setMode] = useState<Mode>("conveyor");
  const [system, setSystem] = useState(unitSystem);
  const [values, setValues] = useState<Values>(() => ({
    lineSpeedMPerMin: "",
    carrierPitchM: "",
    loadedPercent: "100",
    racksPerLoad: "",
    loadMin: "",
    heatUpMin: "",
    holdMin: "",
    unloadMin: "",
    shiftHours: String(shiftHours),
  }));

  // A line picked above fills what it knows; the rest stays as typed.
  useEffect(() => {
    if (!line) return;
    setMode(line.kind);
    setValues((v) =>
      line.kind === "conveyor"
        ? {
            ...v,
            lineSpeedMPerMin: fieldText("speedMPerMin", line.lineSpeedMPerMin, unitSystem),
            carrierPitchM: fieldText("lengthM", line.carrierPitchM, unitSystem),
          }
        : { ...v, racksPerLoad: String(line.racksPerLoad), loadMin: String(line.loadMin), unloadMin: String(line.unloadMin) },
    );
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [line]);

  // The header's unit switch: re-type what was entered in the new units.
  if (system !== unitSystem) {
    setSystem(unitSystem);
    setValues((v) => {
      const next = { ...v };
      for (const f of Object.keys(FIELDS) as FieldName[]) next[f] = convertText(FIELDS[f], v[f], system, unitSystem);
      return next;
    });
  }

  const set = (f: FieldName) => (text: string) => setValues((v) => ({ ...v, [f]: text }));
  const num = (f: FieldName) => metricFrom(FIELDS[f], values[f], unitSystem);
  const field = (f: FieldName, label: string, unitless?: string, hint?: string) => (
    <TextField
      label={withUnit(label, FIELDS[f], unitSystem, unitless)}
      name={f}
      value={values[f]}
      onChange={set(f)}
      inputMode="decimal"
      hint={hint}
      error={values[f].trim() !== "" && num(f) === null ? "Enter a number." : undefined}
    />
  );

  let result: React.ReactNode = <p className="text-sm text-ink-faint">Enter the figures above to see the output.</p>;
  try {
    if (mode === "conveyor") {
      const speed = num("lineSpeedMPerMin");
      const pitch = num("carrierPitchM");
      const loaded = num("loadedPercent");
      if (speed !== null && pitch !== null && loaded !== null) {
        const r = conveyorRackingThroughput({
          lineSpeedMPerMin: speed,
          carrierPitchM: pitch,
          partsPerCarrier,
          loadedFraction: loaded / 100,
        });
        result = (
          <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm" data-testid="per-line-result">
            <dt className="text-ink-soft">Carriers per hour</dt>
            <dd className="num">{formatSignificant(r.carriersPerHour, 4)}</dd>
            <dt className="text-ink-soft">Parts per hour</dt>
            <dd className="num">{whole(r.partsPerHour)}</dd>
            <dt className="text-ink-soft">Parts per shift ({formatSignificant(num("shiftHours") ?? shiftHours, 3)} h)</dt>
            <dd className="num">{whole(r.partsPerHour * (num("shiftHours") ?? shiftHours))}</dd>
          </dl>
        );
      }
    } else {
      const racks = num("racksPerLoad");
      const load = num("loadMin");
      const heat = num("heatUpMin");
      const hold = num("holdMin");
      const unload = num("unloadMin");
      const shift = num("shiftHours");
      if (racks !== null && load !== null && heat !== null && hold !== null && unload !== null && shift !== null) {
        const r = batchOvenRackingThroughput({
          racksPerLoad: racks,
          partsPerRack: partsPerCarrier,
          loadMin: load,
          heatUpMin: heat,
          holdMin: hold,
          unloadMin: unload,
          shiftLengthH: shift,
        });
        result = (
          <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm" data-testid="per-line-result">
            <dt className="text-ink-soft">Parts per load</dt>
            <dd className="num">{whole(r.partsPerLoad)} ({formatSignificant(racks, 3)} racks × {partsPerCarrier})</dd>
            <dt className="text-ink-soft">Cycle</dt>
            <dd className="num">{formatSignificant(r.cycleMin, 4)} min</dd>
            <dt className="text-ink-soft">Loads per shift</dt>
            <dd className="num">{r.loadsPerShift} (whole cycles in {formatSignificant(shift, 3)} h)</dd>
            <dt className="text-ink-soft">Parts per shift</dt>
            <dd className="num">{whole(r.partsPerShift)}</dd>
          </dl>
        );
      }
    }
  } catch (e) {
    result = <p className="field-error">{e instanceof Error ? e.message : "These figures do not add up."}</p>;
  }

  return (
    <section className="card" aria-labelledby="per-line-h">
      <h2 id="per-line-h">Per line</h2>
      <fieldset className="mt-2 flex gap-4 text-sm">
        <legend className="sr-only">Kind of line</legend>
        <label className="flex items-center gap-1.5">
          <input type="radio" name="per-line-mode" checked={mode === "conveyor"} onChange={() => setMode("conveyor")} />
          Conveyor line
        </label>
        <label className="flex items-center gap-1.5">
          <input type="radio" name="per-line-mode" checked={mode === "batch"} onChange={() => setMode("batch")} />
          Batch oven
        </label>
      </fieldset>
      <div className="mt-3 grid gap-3 sm:grid-cols-3">
        {mode === "conveyor" ? (
          <>
            {field("lineSpeedMPerMin", "Line speed")}
            {field("carrierPitchM", "Carrier pitch")}
            {field("loadedPercent", "Carriers loaded", "%", "Share of carriers that carry parts.")}
          </>
        ) : (
          <>
            {field("racksPerLoad", "Racks per load")}
            {field("loadMin", "Loading", "min")}
            {field("heatUpMin", "Heat-up", "min", "Until the metal reaches cure temperature.")}
            {field("holdMin", "Hold at cure", "min")}
            {field("unloadMin", "Unloading", "min")}
          </>
        )}
        {field("shiftHours", "Shift", "h")}
      </div>
      <div className="mt-3">{result}</div>
      <p className="mt-2 text-xs text-ink-faint">
        {mode === "conveyor"
          ? `Carriers per hour = line speed × 60 / carrier pitch; parts per hour = carriers per hour × ${partsPerCarrier} per carrier × share loaded.`
          : "One cycle = loading + heat-up + hold + unloading; only whole cycles that finish within the shift count."}
      </p>
    </section>
  );
}
