import { expect } from 'vitest';

/** Asserts |actual − expected| ≤ max(relTol·|expected|, absTol). */
export function expectClose(actual: number, expected: number, relTol = 1e-3, absTol = 0): void {
  const allowed = Math.max(relTol * Math.abs(expected), absTol);
  const diff = Math.abs(actual - expected);
  if (!(diff <= allowed)) {
    expect.fail(`expected ${actual} to be within ${allowed.toPrecision(3)} of ${expected} (difference ${diff.toPrecision(3)})`);
  }
}
