"use client";
import { useActionState } from "react";
import { saveUnitSystem, type ActionState } from "./actions";

export function UnitPreferenceForm({ current }: { current: "metric" | "us" }) {
  const [state, action, pending] = useActionState<ActionState, FormData>(saveUnitSystem, { message: null, errors: {} });
  return (
    <form action={action} className="space-y-3">
      <fieldset aria-describedby={state.errors.unitSystem ? "unit-err" : undefined}>
        <legend className="label">Show numbers in</legend>
        <label className="mr-4 inline-flex items-center gap-2 text-sm">
          <input type="radio" name="unitSystem" value="metric" defaultChecked={current === "metric"} /> Metric (mm, µm, m², kg, °C)
        </label>
        <label className="inline-flex items-center gap-2 text-sm">
          <input type="radio" name="unitSystem" value="us" defaultChecked={current === "us"} /> US customary (in, mil, ft², lb, °F)
        </label>
      </fieldset>
      {state.errors.unitSystem && <p id="unit-err" className="field-error">{state.errors.unitSystem}</p>}
      <div className="flex items-center gap-3">
        <button className="btn-primary" disabled={pending}>Save</button>
        <p aria-live="polite" className="text-sm text-ink-soft">{state.message}</p>
      </div>
    </form>
  );
}
