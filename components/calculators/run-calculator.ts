import type { z } from "zod";
import { DomainError } from "@/lib/coating-math/errors";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { fieldMessages, presentValues, type FieldSpec } from "./use-unit-fields";

export interface CalculatorRun<K extends string, R> {
  result: R | null;
  errors: Partial<Record<K, string>>;
}

/**
 * Validates the typed values with the API's own input schema and runs the pure calculation in
 * the browser: the same answer as POST /api/calc/*, without a round trip.
 */
export function runCalculator<K extends string, S extends z.ZodType, R>(opts: {
  schema: S;
  shape: Partial<Record<K, z.ZodType>>;
  specs: Record<K, FieldSpec>;
  system: UnitSystem;
  values: Record<K, number | string | undefined>;
  custom?: Partial<Record<K, string>>;
  compute: (input: z.output<S>) => R;
}): CalculatorRun<K, R> {
  const parsed = opts.schema.safeParse(presentValues(opts.values));
  if (!parsed.success) return { result: null, errors: fieldMessages<K>(parsed.error, opts) };
  try {
    return { result: opts.compute(parsed.data), errors: {} };
  } catch (e) {
    // Inputs in range that together overflow (or a rule only the calculation knows).
    if (e instanceof DomainError && e.field in opts.specs) {
      return {
        result: null,
        errors: { [e.field]: "With this value the result is not a finite number: enter a realistic value." } as Partial<Record<K, string>>,
      };
    }
    throw e;
  }
}

/** Money in the plant's currency; an unknown code still shows the number. */
export function formatMoney(amount: number, currency: string): string {
  try {
    return new Intl.NumberFormat("en-US", { style: "currency", currency }).format(amount);
  } catch {
    return `${amount.toFixed(2)} ${currency}`;
  }
}
