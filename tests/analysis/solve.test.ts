/**
 * Root finding and quadrature used by the biaxial solver (issue 12), against closed forms:
 * Anderson–Björck on functions with known roots (Anderson & Björck, BIT 13 (1973) 253–264, the
 * method; the roots are elementary), and Gauss–Legendre n-point rules, exact to degree 2n − 1
 * (Abramowitz & Stegun 25.4.29), on ∫₋₁¹ x^k dx = 2/(k + 1) for even k, 0 for odd k.
 */
import { describe, expect, it } from 'vitest';
import { findRoot, findRootAB } from '../../src/analysis/solve.js';
import { GAUSS_10, gaussExactFor } from '../../src/analysis/gauss.js';
import { expectClose } from '../helpers/tolerance.js';

const integrate = (rule: { nodes: Float64Array; weights: Float64Array }, f: (x: number) => number): number =>
  rule.nodes.reduce((s, x, i) => s + rule.weights[i]! * f(x), 0);

describe('findRootAB', () => {
  it('finds the cube root of 2 from a bracket with known end values', () => {
    const f = (x: number) => x ** 3 - 2;
    expectClose(findRootAB(f, 0, 2, f(0), f(2), 1e-14), Math.cbrt(2), 1e-13);
  });

  it('finds ln 3 of exp(x) − 3 over [−10, 10], where plain Anderson–Björck crawls, within the iteration limit', () => {
    let n = 0;
    const x = findRootAB((t) => (n++, Math.exp(t) - 3), -10, 10, Math.exp(-10) - 3, Math.exp(10) - 3, 1e-12);
    expectClose(x, Math.log(3), 1e-11);
    expect(n).toBeLessThan(200);
  });

  it('needs fewer evaluations than Illinois (findRoot) on a smooth root, to the same tolerance', () => {
    let nAB = 0;
    let nIl = 0;
    const g = (t: number) => Math.cos(t) - t; // Dottie number 0.7390851332151607 (root of cos x = x)
    const x = findRootAB((t) => (nAB++, g(t)), 0, 1, g(0), g(1), 1e-13);
    const y = findRoot((t) => (nIl++, g(t)), 0, 1, 1e-13);
    expectClose(x, 0.7390851332151607, 1e-12);
    expectClose(y, 0.7390851332151607, 1e-12);
    expect(nAB + 2).toBeLessThan(nIl); // findRoot also evaluates both ends itself
  });

  it('returns NaN when the ends do not bracket a root', () => {
    const f = (x: number) => x * x + 1;
    expect(findRootAB(f, -1, 1, f(-1), f(1))).toBeNaN();
  });
});

describe('gaussExactFor', () => {
  it('picks the smallest rule that is exact for the degree (n points: degree 2n − 1)', () => {
    expect(gaussExactFor(0).nodes.length).toBe(1);
    expect(gaussExactFor(2).nodes.length).toBe(2);
    expect(gaussExactFor(3).nodes.length).toBe(2);
    expect(gaussExactFor(4).nodes.length).toBe(3);
    expect(gaussExactFor(undefined)).toBe(GAUSS_10);
    expect(gaussExactFor(40)).toBe(GAUSS_10);
  });

  it('integrates x^k on [−1, 1] exactly up to its degree, and not beyond', () => {
    for (let degree = 0; degree <= 9; degree++) {
      const rule = gaussExactFor(degree);
      for (let k = 0; k <= degree; k++) expectClose(integrate(rule, (x) => x ** k), k % 2 === 0 ? 2 / (k + 1) : 0, 1e-13, 1e-14);
    }
    // 2 points are not exact for x⁴ (2/5): the rule is the smallest, not a larger one
    expect(Math.abs(integrate(gaussExactFor(3), (x) => x ** 4) - 2 / 5)).toBeGreaterThan(1e-3);
  });
});
