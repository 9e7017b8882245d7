import type { ConcreteLaw } from './types.js';

/**
 * Parabola–rectangle law (EN 1992-1-1 3.1.7(1), Eq. 3.17–3.18):
 * σ = fcd·[1 − (1 − ε/εc2)^n] for 0 ≤ ε < εc2, σ = fcd for εc2 ≤ ε ≤ εcu2.
 */
export function parabolaRectangle(fcd: number, epsC2: number, n: number, label?: string): ConcreteLaw {
  return {
    label: label ?? `parabola–rectangle fcd = ${fcd.toPrecision(4)}, εc2 = ${epsC2}, n = ${n}`,
    stress: (strain: number) => {
      if (strain <= 0) return 0;
      if (strain >= epsC2) return fcd;
      return fcd * (1 - Math.pow(1 - strain / epsC2, n));
    },
    breakpoints: [0, epsC2],
    peakStress: fcd,
    // 1 − (1 − ε/εc2)^n is a polynomial of degree n only for a whole n (n = 2 up to fck 50 MPa, EN 1992-1-1 Table 3.1)
    ...(Number.isInteger(n) && n >= 0 ? { polynomialDegree: n } : {}),
  };
}
