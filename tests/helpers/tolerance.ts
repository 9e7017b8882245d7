import { expect } from 'vitest';

/**
 * Asserts |actual − expected| ≤ max(relTol·|expected|, absTol).
 * The message names both values so a failing reference check reads on one line.
 */
export function expectClose(actual: number, expected: number, relTol: number, absTol = 0): void {
  const allowed = Math.max(relTol * Math.abs(expected), absTol);
  const diff = Math.abs(actual - expected);
  if (!(diff <= allowed)) {
    expect.fail(`expected ${actual} to be within ${allowed} of ${expected} (off by ${diff})`);
  }
}
