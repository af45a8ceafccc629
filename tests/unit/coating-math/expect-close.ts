import { expect } from "vitest";

/** |actual − expected| ≤ rel · max(|expected|, 1e-300): floating results against exact figures. */
export function expectRelClose(actual: number, expected: number, rel = 1e-12): void {
  const scale = Math.max(Math.abs(expected), 1e-300);
  const error = Math.abs(actual - expected) / scale;
  if (!(error <= rel)) {
    expect.fail(`expected ${actual} to be within ${rel} (relative) of ${expected}; relative error ${error}`);
  }
  expect(Number.isFinite(actual)).toBe(true);
}

/** Settings shared by the fast-check properties: fixed seed, so every run checks the same cases. */
export const propertyRuns = { seed: 20261201, numRuns: 300 } as const;
