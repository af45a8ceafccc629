"use client";
// Form texts typed in the user's units. When the header's unit switch re-renders the page with
// another unit table, every text is re-typed in the new units (its stored value unchanged).

import { useState } from "react";
import { fieldText, storedFrom, type ShownKind, type UnitTable } from "./shown-units";

export type FieldKinds = Record<string, ShownKind | null>;

export function useUnitTexts<K extends FieldKinds>(kinds: K, units: UnitTable, initial: () => Record<keyof K, string>) {
  const [texts, setTexts] = useState(initial);
  const [typedIn, setTypedIn] = useState(units);
  if (typedIn.system !== units.system) {
    setTypedIn(units);
    setTexts((t) => {
      const next = { ...t };
      for (const f of Object.keys(kinds) as (keyof K)[]) {
        const stored = storedFrom(typedIn, kinds[f], t[f]);
        if (stored !== null) next[f] = fieldText(units, kinds[f], stored);
      }
      return next;
    });
  }
  const set = (f: keyof K) => (text: string) => setTexts((t) => ({ ...t, [f]: text }));
  /** the stored (metric) value of a field, or null when empty or not a number */
  const stored = (f: keyof K) => storedFrom(units, kinds[f], texts[f]);
  return { texts, setTexts, set, stored };
}
