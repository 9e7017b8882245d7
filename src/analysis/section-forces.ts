/**
 * Section resultants for a plane strain profile (strain compatibility, ACI 318-19 22.2.1;
 * EN 1992-1-1 6.1(2)). Forces are compression-positive; moments are about the gross-section
 * centroid, positive when the compression face is the "top" (y > 0).
 */
import type { StrainProfile } from '../codes/types.js';
import type { ConcreteLaw, SteelLaw } from '../materials/types.js';
import type { Bar, Shape } from '../section/types.js';
import { sectionDepth } from '../section/geometry.js';
import { GAUSS_10, gaussForDegree } from './gauss.js';

export interface Resultant {
  P: number;
  M: number;
}

/** Strain at a depth below the compression face. */
export const strainAt = (p: StrainProfile, depth: number): number => p.top - p.curvature * depth;

/** Depth at which the profile reaches strain ε (Infinity when the curvature is zero). */
const depthOfStrain = (p: StrainProfile, eps: number): number => (p.curvature === 0 ? Infinity : (p.top - eps) / p.curvature);

/** Split depths in (lo, hi) where the law changes branch, plus the ends, sorted (by insertion: a comparator sort of these few values cost more than the integration). */
function splitDepths(law: ConcreteLaw, p: StrainProfile, lo: number, hi: number): number[] {
  const cuts = [lo, hi];
  for (const e of law.breakpoints) {
    const d = depthOfStrain(p, e);
    if (d > lo && d < hi) {
      let i = cuts.length;
      cuts.push(d);
      while (i > 0 && cuts[i - 1]! > d) {
        cuts[i] = cuts[i - 1]!;
        i--;
      }
      cuts[i] = d;
    }
  }
  return cuts;
}

/**
 * Concrete resultant by Gauss–Legendre integration between the law's breakpoints, so each piece is smooth.
 * Rectangles integrate in depth; circles in the angle θ with depth = r(1 − cos θ), which keeps the
 * integrand smooth at the edges.
 */
export function concreteResultant(shape: Shape, law: ConcreteLaw, p: StrainProfile): Resultant {
  let { nodes, weights } = GAUSS_10;
  let n = nodes.length;
  let P = 0;
  let M = 0;
  if (shape.kind === 'rectangle') {
    // constant width: stress of degree k in depth (a polynomial law between breakpoints) times the arm gives
    // degree k + 1, which the fewest exact points integrate to rounding (issue 21: 1 point for a block)
    ({ nodes, weights } = gaussForDegree(law.polynomialDegree === undefined ? undefined : law.polynomialDegree + 1));
    n = nodes.length;
    const h = shape.h;
    if (p.curvature === 0) return { P: law.stress(p.top) * shape.b * h, M: 0 };
    const cuts = splitDepths(law, p, 0, h);
    for (let k = 0; k + 1 < cuts.length; k++) {
      const a = cuts[k]!;
      const b = cuts[k + 1]!;
      const half = (b - a) / 2;
      const mid = (a + b) / 2;
      if (strainAt(p, mid) <= 0) continue;
      for (let i = 0; i < n; i++) {
        const d = mid + half * nodes[i]!;
        const f = law.stress(strainAt(p, d)) * shape.b * half * weights[i]!;
        P += f;
        M += f * (h / 2 - d);
      }
    }
    return { P, M };
  }
  const r = shape.diameter / 2;
  if (p.curvature === 0) return { P: law.stress(p.top) * Math.PI * r * r, M: 0 };
  const cuts = splitDepths(law, p, 0, 2 * r).map((d) => Math.acos(Math.max(-1, Math.min(1, 1 - d / r))));
  for (let k = 0; k + 1 < cuts.length; k++) {
    const a = cuts[k]!;
    const b = cuts[k + 1]!;
    const half = (b - a) / 2;
    const mid = (a + b) / 2;
    if (strainAt(p, r * (1 - Math.cos(mid))) <= 0) continue;
    for (let i = 0; i < n; i++) {
      const t = mid + half * nodes[i]!;
      const s = Math.sin(t);
      const c = Math.cos(t);
      const f = law.stress(strainAt(p, r * (1 - c))) * 2 * r * r * s * s * half * weights[i]!;
      P += f;
      M += f * r * c;
    }
  }
  return { P, M };
}

/**
 * Bar resultant with the displaced concrete deducted where a bar sits in compressed concrete
 * (common practice; Nilson, Darwin & Dolan, Design of Concrete Structures, 14th ed., Example 8.1 deducts it).
 */
export function barResultant(bars: readonly Bar[], depth: number, steel: SteelLaw, concrete: ConcreteLaw, p: StrainProfile): Resultant {
  let P = 0;
  let M = 0;
  for (const bar of bars) {
    const eps = strainAt(p, depth / 2 - bar.y);
    const f = bar.area * (steel.stress(eps) - concrete.stress(eps));
    P += f;
    M += f * bar.y;
  }
  return { P, M };
}

/** Depth of the extreme tension bar below the compression face, dt. */
export function extremeTensionDepth(shape: Shape, bars: readonly Bar[]): number {
  let minY = Infinity;
  for (const b of bars) minY = Math.min(minY, b.y);
  return sectionDepth(shape) / 2 - minY;
}

/** Net tensile strain in the extreme tension bar, tension positive (ACI 318-19 2.2, εt). */
export const tensionStrain = (p: StrainProfile, dt: number): number => -strainAt(p, dt);
