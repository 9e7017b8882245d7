import type { StrainClass } from './types.js';

/**
 * Strain classes for bases without a strain-dependent φ (EN 1992-1-1, CSA A23.3): they only say
 * whether the extreme tension steel has yielded.
 */
export const yieldClass =
  (yieldStrain: number) =>
  (epsT: number): StrainClass =>
    epsT < yieldStrain ? 'compression-controlled' : 'tension-controlled';
