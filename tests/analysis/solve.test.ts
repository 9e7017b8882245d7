/** Root finding (issue 25): no sign change is a typed error, not a NaN that flows on. */
import { describe, expect, it } from 'vitest';
import { findRoot, findRootOrNaN, NoSignChangeError } from '../../src/analysis/solve.js';
import { PmError } from '../../src/errors.js';
import { expectClose } from '../helpers/tolerance.js';

describe('findRoot', () => {
  it('finds √2 as the root of x² − 2 on [0, 2] (hand calculation: √2 = 1.41421356237…)', () => {
    expectClose(findRoot((x) => x * x - 2, 0, 2), Math.SQRT2, 1e-12);
  });
  it('throws NoSignChangeError (a PmError, exit 3) without a sign change or with NaN at an end', () => {
    expect(() => findRoot((x) => x * x + 1, -1, 1)).toThrow(NoSignChangeError);
    let err: unknown;
    try {
      findRoot(() => NaN, 0, 1);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(PmError);
    expect((err as PmError).path).toBe('findRoot');
    expect((err as PmError).exitCode).toBe(3);
  });
  it('findRootOrNaN keeps NaN for callers that look for a crossing that may be absent', () => {
    expect(findRootOrNaN((x) => x * x + 1, -1, 1)).toBeNaN();
  });
});
