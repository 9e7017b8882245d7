import { ERROR_CODES, PmError } from '../errors.js';

/** `findRoot` was given an interval over which f does not change sign (or is NaN at an end): a fault of the caller (exit 3). */
export class NoSignChangeError extends PmError {
  constructor(a: number, b: number, fa: number, fb: number) {
    super(ERROR_CODES.notPossible, 'findRoot', 'was given an interval over which the function does not change sign', { interval: [a, b], ends: [fa, fb] }, 3);
    this.name = 'NoSignChangeError';
  }
}

/**
 * Bracketed root finding by bisection with a secant step where it helps (Illinois variant of
 * regula falsi; Dowell & Jarratt, BIT 11 (1971) 168–174). Throws NoSignChangeError when [a, b] does not
 * bracket a root (f(a), f(b) of one sign, or NaN); `findRootOrNaN` is for callers that look for a crossing
 * that may not be there.
 */
export function findRoot(f: (x: number) => number, a: number, b: number, tol = 1e-12, maxIter = 200): number {
  const x = findRootOrNaN(f, a, b, tol, maxIter);
  if (Number.isNaN(x)) throw new NoSignChangeError(a, b, f(a), f(b));
  return x;
}

/** As `findRoot`, but NaN when [a, b] does not bracket a root. */
export function findRootOrNaN(f: (x: number) => number, a: number, b: number, tol = 1e-12, maxIter = 200): number {
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (Number.isNaN(fa) || Number.isNaN(fb) || fa * fb > 0) return NaN;
  let side = 0;
  let x = a;
  for (let i = 0; i < maxIter; i++) {
    x = (a * fb - b * fa) / (fb - fa);
    if (!(x > Math.min(a, b) && x < Math.max(a, b))) x = (a + b) / 2;
    const fx = f(x);
    if (fx === 0 || Math.abs(b - a) < tol * (1 + Math.abs(x))) return x;
    if (fx * fb > 0) {
      b = x;
      fb = fx;
      if (side === -1) fa /= 2;
      side = -1;
    } else {
      a = x;
      fa = fx;
      if (side === 1) fb /= 2;
      side = 1;
    }
  }
  return x;
}

/**
 * Finds x in a sorted grid where f changes sign, then refines; scans from the high end when `fromHigh`.
 * Returns NaN when f keeps one sign on the grid.
 */
export function findRootOnGrid(f: (x: number) => number, grid: ArrayLike<number>, fromHigh = false, tol = 1e-12): number {
  const n = grid.length;
  if (n === 0) return NaN;
  let prevX = grid[fromHigh ? n - 1 : 0]!;
  let prevF = f(prevX);
  if (prevF === 0) return prevX;
  for (let k = 1; k < n; k++) {
    const x = grid[fromHigh ? n - 1 - k : k]!;
    const fx = f(x);
    if (fx === 0) return x;
    if (prevF * fx < 0) return findRoot(f, Math.min(prevX, x), Math.max(prevX, x), tol);
    prevX = x;
    prevF = fx;
  }
  return NaN;
}

/**
 * Golden-section search for a minimum of f on [lo, hi] (Press et al., Numerical Recipes, 3rd ed., 10.2): the
 * bracket shrinks by 0.618 per evaluation until `done(lo, hi, step)`; returns the final bracket. f is assumed
 * unimodal on the bracket; a caller that cannot assume so keeps the best value it saw.
 */
export function goldenSection(f: (x: number) => number, lo: number, hi: number, done: (lo: number, hi: number, step: number) => boolean): { lo: number; hi: number } {
  const g = (Math.sqrt(5) - 1) / 2;
  let x1 = hi - g * (hi - lo);
  let x2 = lo + g * (hi - lo);
  let f1 = f(x1);
  let f2 = f(x2);
  for (let step = 0; !done(lo, hi, step); step++) {
    if (f1 <= f2) {
      hi = x2;
      x2 = x1;
      f2 = f1;
      x1 = hi - g * (hi - lo);
      f1 = f(x1);
    } else {
      lo = x1;
      x1 = x2;
      f1 = f2;
      x2 = lo + g * (hi - lo);
      f2 = f(x2);
    }
  }
  return { lo, hi };
}
