import type { ConcreteLaw } from './types.js';

/**
 * Equivalent rectangular stress block written in strain space (ACI 318-19 22.2.2.4.1; EN 1992-1-1 3.1.7(3)):
 * stress `intensity` acts where depth ≤ depthFactor·c. With the extreme fibre at `ultimateStrain` that is
 * exactly where ε ≥ ultimateStrain·(1 − depthFactor).
 */
export function rectangularBlock(intensity: number, depthFactor: number, ultimateStrain: number, label?: string): ConcreteLaw {
  const threshold = ultimateStrain * (1 - depthFactor);
  return {
    label: label ?? `rectangular block ${intensity.toPrecision(4)} over ${depthFactor.toFixed(3)}·c`,
    stress: (strain: number) => (strain > 0 && strain >= threshold ? intensity : 0),
    breakpoints: threshold > 0 ? [threshold] : [0],
    peakStress: intensity,
    polynomialDegree: 0,
  };
}
