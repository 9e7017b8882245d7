import type { SteelLaw } from './types.js';

/**
 * Bilinear reinforcement with an inclined top branch (EN 1992-1-1 3.2.7(2)a and Fig. 3.8):
 * elastic to the yield stress at ε = fy/Es, then a straight line that would reach k·fy at εuk,
 * used up to the strain limit εud (the section analysis keeps |ε| ≤ εud, pivot A of Fig. 6.1).
 * Symmetric in tension and compression. Beyond εud the stress is held at its εud value so the law
 * stays total; a profile that respects pivot A never reaches that part.
 */
export function inclinedBranchSteel(
  yieldStress: number,
  modulus: number,
  k: number,
  epsUk: number,
  epsUd: number,
  label?: string,
): SteelLaw {
  const epsY = yieldStress / modulus;
  const slope = ((k - 1) * yieldStress) / (epsUk - epsY);
  const branch = (e: number): number => (e <= epsY ? modulus * e : yieldStress + slope * (Math.min(e, epsUd) - epsY));
  return {
    label: label ?? `inclined branch fy = ${yieldStress.toPrecision(4)}, k = ${k}, εud = ${epsUd}, Es = ${modulus}`,
    stress: (strain: number) => Math.sign(strain) * branch(Math.abs(strain)),
    yieldStrain: epsY,
    yieldStress,
    modulus,
  };
}
