"use client";
import { useState } from "react";
import { FetchError, sendJson } from "@/lib/fetcher";
import type { PlantSettingsView } from "@/lib/server/plant";
import { TextField } from "@/components/ui/text-field";

export function PlantSettingsForm({ initial }: { initial: PlantSettingsView }) {
  const [v, setV] = useState(initial);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  return (
    <form
      className="mt-3 grid gap-3 sm:grid-cols-2"
      onSubmit={async (e) => {
        e.preventDefault();
        setBusy(true);
        setMessage(null);
        try {
          await sendJson("/api/admin/settings", "PUT", v);
          setErrors({});
          setMessage("Saved.");
        } catch (err) {
          setErrors(err instanceof FetchError ? err.fields : {});
          setMessage(err instanceof Error ? err.message : "Not saved.");
        } finally {
          setBusy(false);
        }
      }}
    >
      <TextField label="Plant name" name="plantName" value={v.plantName} error={errors.plantName} onChange={(s) => setV({ ...v, plantName: s })} />
      <TextField label="Currency (ISO code)" name="currency" value={v.currency} error={errors.currency} onChange={(s) => setV({ ...v, currency: s.toUpperCase() })} />
      <TextField
        label="Shift length (h)"
        name="shiftHours"
        inputMode="decimal"
        value={String(v.shiftHours)}
        error={errors.shiftHours}
        onChange={(s) => setV({ ...v, shiftHours: Number(s) })}
      />
      <label className="block">
        <span className="label">Default units for new users</span>
        <select className="field" value={v.defaultUnitSystem} onChange={(e) => setV({ ...v, defaultUnitSystem: e.target.value as "metric" | "us" })}>
          <option value="metric">Metric</option>
          <option value="us">US customary</option>
        </select>
      </label>
      <div className="flex items-center gap-3 sm:col-span-2">
        <button className="btn-primary" disabled={busy}>Save plant settings</button>
        <p aria-live="polite" className="text-sm text-ink-soft">{message}</p>
      </div>
    </form>
  );
}
