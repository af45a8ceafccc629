import { finiteResult, numberIssues, withDefaults, type InputIssue, type NumberRules, type RuleValues } from "@/lib/coating-math/calc-inputs";
import { DomainError } from "@/lib/coating-math/errors";
import type { UnitSystem } from "@/lib/coating-math/display-units";
import { fieldMessages, type FieldSpec } from "./use-unit-fields";

export interface CalculatorRun<K extends string, R> {
  result: R | null;
  errors: Partial<Record<K, string>>;
}

/**
 * Checks the typed values against the API's own input rules (lib/coating-math/calc-inputs.ts,
 * the limits POST /api/calc/* validates with) and runs the pure calculation in the browser: the
 * same answer as the API, without a round trip and without zod on the page.
 */
export function runCalculator<K extends string, T extends NumberRules, R extends object>(opts: {
  rules: T;
  specs: Record<K, FieldSpec>;
  system: UnitSystem;
  values: Record<K, number | string | undefined>;
  /** the checks; the number ranges of `rules` unless a calculator has rules between fields */
  check?: (values: Record<K, number | string | undefined>) => InputIssue[];
  custom?: Partial<Record<K, string>>;
  compute: (input: RuleValues<T>) => R;
  /** output field → the input to name when it is not a finite number */
  blame: Readonly<Record<string, string>>;
}): CalculatorRun<K, R> {
  const issues = opts.check ? opts.check(opts.values) : numberIssues(opts.rules, opts.values);
  if (issues.length > 0) {
    return { result: null, errors: fieldMessages<K>(issues, { ...opts, rules: opts.rules as Partial<Record<K, T[keyof T]>> }) };
  }
  try {
    return { result: finiteResult(opts.compute(withDefaults(opts.rules, opts.values)), opts.blame), errors: {} };
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
