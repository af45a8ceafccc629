"use client";
import { useState } from "react";
import type { z } from "zod";
import { formatSignificant, type UnitSystem } from "@/lib/coating-math/display-units";
import { apiToShown, inputText, parseDecimal, shownToApi, unitText, type DisplayKind } from "./display-units";

export interface FieldSpec {
  kind: DisplayKind;
  /** what the box holds at first, in each system's own units (blank when absent) */
  initial?: Partial<Record<UnitSystem, number>>;
}

export interface FieldState {
  text: string;
  /** the API value; the typed text when it is not a number (zod then names it); undefined when blank */
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

/** Drops blank fields so zod applies its defaults and treats optional fields as absent. */
export function presentValues<K extends string>(values: Record<K, number | string | undefined>): Partial<Record<K, number | string>> {
  const out: Partial<Record<K, number | string>> = {};
  for (const [k, v] of Object.entries(values) as [K, number | string | undefined][]) if (v !== undefined) out[k] = v;
  return out;
}

// ---------------------------------------------------------------------------------------------
// Field messages: the zod schemas of the API decide what is wrong; the message says what to
// enter in the units the user is looking at.

interface NumberSchemaInfo {
  minValue: number | null;
  maxValue: number | null;
  isInt?: boolean;
  safeParse(v: unknown): { success: boolean };
}

function unwrapNumber(schema: z.ZodType): NumberSchemaInfo | null {
  let s = schema as unknown as { _zod: { def: { type: string; innerType?: unknown } } };
  while (s._zod.def.innerType && (s._zod.def.type === "default" || s._zod.def.type === "optional")) {
    s = s._zod.def.innerType as typeof s;
  }
  return s._zod.def.type === "number" ? (s as unknown as NumberSchemaInfo) : null;
}

/** "a number greater than 0 and at most 196.85 mil" from the API schema's bounds, in the shown unit. */
export function rangeText(schema: z.ZodType, kind: DisplayKind, system: UnitSystem): string {
  const s = unwrapNumber(schema);
  const unit = unitText(kind, system);
  const show = (apiValue: number) => formatSignificant(apiToShown(kind, apiValue, system), 5);
  const suffix = unit ? ` ${unit}` : "";
  if (!s) return `a number${suffix ? ` in${suffix}` : ""}`;
  const parts: string[] = [];
  if (s.minValue !== null && Number.isFinite(s.minValue)) {
    parts.push(`${s.safeParse(s.minValue).success ? "at least" : "greater than"} ${show(s.minValue)}`);
  }
  if (s.maxValue !== null && Number.isFinite(s.maxValue)) {
    parts.push(`${s.safeParse(s.maxValue).success ? "at most" : "less than"} ${show(s.maxValue)}`);
  }
  return `${s.isInt ? "a whole number" : "a number"}${parts.length ? ` ${parts.join(" and ")}` : ""}${suffix}`;
}

export interface MessageContext<K extends string> {
  shape: Partial<Record<K, z.ZodType>>;
  specs: Record<K, FieldSpec>;
  system: UnitSystem;
  values: Record<K, number | string | undefined>;
  /** plain-words text for cross-field rules (refinements), by field */
  custom?: Partial<Record<K, string>>;
}

/** zod issues → one message per top-level field, in the displayed units. */
export function fieldMessages<K extends string>(error: z.ZodError, ctx: MessageContext<K>): Partial<Record<K, string>> {
  const out: Partial<Record<K, string>> = {};
  for (const issue of error.issues) {
    const name = issue.path[0] as K | undefined;
    if (name === undefined || out[name] || !ctx.specs[name]) continue;
    const schema = ctx.shape[name];
    const range = schema ? rangeText(schema, ctx.specs[name].kind, ctx.system) : "a number";
    const value = ctx.values[name];
    if (issue.code === "custom") out[name] = ctx.custom?.[name] ?? issue.message;
    else if (value === undefined) out[name] = `Required: enter ${range}.`;
    else if (typeof value === "string") out[name] = `“${value.trim()}” is not a number: enter ${range}.`;
    else out[name] = `Enter ${range}.`;
  }
  return out;
}
