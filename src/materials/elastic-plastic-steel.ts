import type { SteelLaw } from './types.js';

/** Elastic–perfectly-plastic reinforcement (ACI 318-19 20.2.2.1; EN 1992-1-1 3.2.7(2)b horizontal branch). */
export function elasticPlasticSteel(yieldStress: number, modulus: number, label?: string): SteelLaw {
  return {
    label: label ?? `elastic–plastic fy = ${yieldStress.toPrecision(4)}, Es = ${modulus}`,
    stress: (strain: number) => Math.max(-yieldStress, Math.min(yieldStress, modulus * strain)),
    yieldStrain: yieldStress / modulus,
    yieldStress,
    modulus,
  };
}
