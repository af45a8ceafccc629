"use client";
import { useState } from "react";
import type { InputIssue, NumberRule } from "@/lib/coating-math/calc-inputs";
import type { NumericRange } from "@/lib/coating-math/errors";
import { formatSignificant, type UnitSystem } from "@/lib/coating-math/display-units";
import { apiToShown, inputText, parseDecimal, shownToApi, unitText, type DisplayKind } from "./display-units";

export interface FieldSpec {
  kind: DisplayKind;
  /** what the box holds at first, in each system's own units (blank when absent) */
  initial?: Partial<Record<UnitSystem, number>>;
}

export interface FieldState {
  text: string;
  /** the API value; the typed text when it is not a number (the check then names it); undefined when blank */
  value: number | string | undefined;
}

function parse(kind: DisplayKind, text: string, system: UnitSystem): FieldState {
  if (text.trim() === "") return { text, value: undefined };
  const n = parseDecimal(text);
  if (n === null) return { text, value: text };
  try {
    return { text, value: shownToApi(kind, n, system) };
  } catch {
    return { text, value: text };
  }
}

function initialFields<K extends string>(specs: Record<K, FieldSpec>, system: UnitSystem): Record<K, FieldState> {
  const out = {} as Record<K, FieldState>;
  for (const name of Object.keys(specs) as K[]) {
    const v = specs[name].initial?.[system];
    out[name] = v === undefined ? { text: "", value: undefined } : parse(specs[name].kind, String(v), system);
  }
  return out;
}

/** Same API values, shown in the other system; text that is not a number stays as typed. */
function converted<K extends string>(
  fields: Record<K, FieldState>,
  specs: Record<K, FieldSpec>,
  system: UnitSystem,
): Record<K, FieldState> {
  const out = { ...fields };
  for (const name of Object.keys(specs) as K[]) {
    const f = fields[name];
    if (typeof f.value === "number") out[name] = { text: inputText(specs[name].kind, f.value, system), value: f.value };
  }
  return out;
}

/**
 * Form state for a calculator: each box keeps the text as typed and the API value it means.
 * When the page's unit system changes, every number is re-shown in the new units; the API values
 * do not move, so flipping back and forth never drifts.
 */
export function useUnitFields<K extends string>(specs: Record<K, FieldSpec>, system: UnitSystem) {
  const [state, setState] = useState(() => ({ system, fields: initialFields(specs, system) }));
  let current = state;
  if (state.system !== system) {
    // React's "adjust state while rendering" pattern: no effect, no flash of stale units.
    current = { system, fields: converted(state.fields, specs, system) };
    setState(current);
  }
  const setText = (name: K, text: string) =>
    setState((s) => ({ ...s, fields: { ...s.fields, [name]: parse(specs[name].kind, text, s.system) } }));
  const values = {} as Record<K, number | string | undefined>;
  for (const name of Object.keys(specs) as K[]) values[name] = current.fields[name].value;
  return { fields: current.fields, values, setText };
}

// ---------------------------------------------------------------------------------------------
// Field messages: the API's input rules (lib/coating-math/calc-inputs.ts) decide what is wrong;
// the message says what to enter in the units the user is looking at.

/** "a number greater than 0 and at most 196.85 mil": the API range, in the shown unit. */
export function rangeText(range: NumericRange | undefined, kind: DisplayKind, system: UnitSystem): string {
  const unit = unitText(kind, system);
  const suffix = unit ? ` ${unit}` : "";
  if (!range) return `a number${suffix ? ` in${suffix}` : ""}`;
  const show = (apiValue: number) => formatSignificant(apiToShown(kind, apiValue, system), 5);
  const parts: string[] = [];
  if (range.gte !== undefined) parts.push(`at least ${show(range.gte)}`);
  else if (range.gt !== undefined) parts.push(`greater than ${show(range.gt)}`);
  if (range.lte !== undefined) parts.push(`at most ${show(range.lte)}`);
  else if (range.lt !== undefined) parts.push(`less than ${show(range.lt)}`);
  return `${range.integer ? "a whole number" : "a number"}${parts.length ? ` ${parts.join(" and ")}` : ""}${suffix}`;
}

export interface MessageContext<K extends string> {
  rules: Partial<Record<K, NumberRule>>;
  specs: Record<K, FieldSpec>;
  system: UnitSystem;
  values: Record<K, number | string | undefined>;
  /** plain-words text for cross-field rules, by field */
  custom?: Partial<Record<K, string>>;
}

/** Input problems → one message per top-level field, in the displayed units. */
export function fieldMessages<K extends string>(issues: readonly InputIssue[], ctx: MessageContext<K>): Partial<Record<K, string>> {
  const out: Partial<Record<K, string>> = {};
  for (const issue of issues) {
    const name = issue.path[0] as K | undefined;
    if (name === undefined || issue.path.length > 1 || out[name] || !ctx.specs[name]) continue;
    const range = rangeText(ctx.rules[name]?.range, ctx.specs[name].kind, ctx.system);
    const value = ctx.values[name];
    if (issue.code === "rule") out[name] = ctx.custom?.[name] ?? issue.message;
    else if (value === undefined) out[name] = `Required: enter ${range}.`;
    else if (typeof value === "string") out[name] = `“${value.trim()}” is not a number: enter ${range}.`;
    else out[name] = `Enter ${range}.`;
  }
  return out;
}
