/**
 * The one error type of the pure calculation code: an input that cannot describe a real
 * situation (a negative area, a transfer efficiency above 1). `field` is the dot path of the
 * offending input (`firstPassEfficiency`, `areas.0.3`) so an API route can map it to `fields`.
 */
export class DomainError extends Error {
  readonly field: string;

  constructor(field: string, message: string) {
    super(message);
    this.name = "DomainError";
    this.field = field;
  }
}

/** Inclusive/exclusive numeric range; `message` names it for the user. */
export interface NumericRange {
  /** Exclusive lower bound. */
  gt?: number;
  /** Inclusive lower bound. */
  gte?: number;
  /** Exclusive upper bound. */
  lt?: number;
  /** Inclusive upper bound. */
  lte?: number;
  integer?: boolean;
}

/** Plain-words description of a range, e.g. "greater than 0 and at most 1". */
export function describeRange(range: NumericRange): string {
  const parts: string[] = [];
  if (range.gt !== undefined) parts.push(`greater than ${range.gt}`);
  if (range.gte !== undefined) parts.push(`at least ${range.gte}`);
  if (range.lt !== undefined) parts.push(`less than ${range.lt}`);
  if (range.lte !== undefined) parts.push(`at most ${range.lte}`);
  const bounds = parts.join(" and ");
  if (range.integer) return bounds ? `a whole number ${bounds}` : "a whole number";
  return bounds || "a finite number";
}

/** True when `value` is a finite number inside `range`. */
export function isInRange(value: unknown, range: NumericRange): boolean {
  return (
    typeof value === "number" &&
    Number.isFinite(value) &&
    (range.gt === undefined || value > range.gt) &&
    (range.gte === undefined || value >= range.gte) &&
    (range.lt === undefined || value < range.lt) &&
    (range.lte === undefined || value <= range.lte) &&
    (!range.integer || Number.isInteger(value))
  );
}

/**
 * Throws a DomainError unless `value` is a finite number inside `range`.
 * Returns the value so checks can be written inline.
 */
export function requireInRange(field: string, value: number, range: NumericRange): number {
  if (!isInRange(value, range)) {
    throw new DomainError(field, `${field} must be ${describeRange(range)} (got ${String(value)}).`);
  }
  return value;
}

/** Shorthand for the most common check: a finite number greater than zero. */
export function requirePositive(field: string, value: number): number {
  return requireInRange(field, value, { gt: 0 });
}

/** Shorthand: any finite number. */
export function requireFinite(field: string, value: number): number {
  return requireInRange(field, value, {});
}

/**
 * Guards a computed value: inputs that are each in range can still combine into an overflow
 * (a first-pass efficiency of 1e-300). `field` names the input most likely at fault.
 */
export function requireFiniteResult(field: string, value: number, what: string): number {
  if (!Number.isFinite(value)) {
    throw new DomainError(field, `${field} is too extreme: the ${what} cannot be computed as a finite number.`);
  }
  return value;
}
