"use client";
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { sendJson } from "@/lib/fetcher";

/** The signed-in user's display units, stored on the account; every page re-renders in them. */
export function UnitSwitch({ initial }: { initial: "metric" | "us" }) {
  const router = useRouter();
  const [value, setValue] = useState(initial);
  const [pending, start] = useTransition();
  return (
    <label className="flex items-center gap-1">
      <span className="sr-only">Display units</span>
      <select
        className="rounded border border-plate/30 bg-ink px-1.5 py-1 text-plate"
        value={value}
        disabled={pending}
        onChange={(e) => {
          const next = e.target.value as "metric" | "us";
          setValue(next);
          start(async () => {
            try {
              await sendJson("/api/me", "PATCH", { unitSystem: next });
              router.refresh();
            } catch {
              setValue(value);
            }
          });
        }}
      >
        <option value="metric">Metric (mm, µm, kg, °C)</option>
        <option value="us">US (in, mil, lb, °F)</option>
      </select>
    </label>
  );
}
