/**
 * The exact smallest ρg whose φ-factored curve (axial cap included) encloses a normalised demand.
 *
 * At a fixed neutral-axis depth c the factored curve is affine in ρg (see prepared-section.ts):
 *   φP = φ(c)·(Pc + ρ·Ps),  φM = φ(c)·(Mc + ρ·Ms).
 * The curve of ρ passes through (p, m) at depth c when both equations hold, so
 *   ρ(c) = (p/φ − Pc)/Ps = (m/φ − Mc)/Ms,
 * i.e. c is a root of g(c) = (p − φ·Pc)·Ms − (m − φ·Mc)·Ps (cross-multiplied to stay finite).
 * The cap p ≤ cap(ρ) = a + b·ρ (ACI 318-19 22.4.2.1) gives ρ ≥ (p − a)/b in closed form.
 * The answer is the largest of the curve requirement, the cap requirement and the basis minimum.
 */
import { C_OVER_H_MAX, C_OVER_H_MIN } from '../analysis/family.js';
import { R } from '../analysis/prepared-section.js';
import { findRoot, findRootOrNaN } from '../analysis/solve.js';
import { capacityAlongRay, isNegligibleLoad, type NormalisedLoad, type RayTable } from './ray.js';

export type RhoStatus = 'ok' | 'minimum-governs' | 'not-possible';

export interface RhoRequirement {
  /** ρg to provide: the requirement, raised to the minimum; null when not possible within the maximum */
  rho: number | null;
  status: RhoStatus;
  /** what sets the requirement before the minimum: the curve or the axial cap */
  governedBy: 'curve' | 'cap' | 'minimum';
  /** requirement of the uncapped curve alone (−Infinity when even ρg = 0 encloses the point; NaN if beyond the search) */
  rhoCurve: number;
  /** requirement of the axial cap alone (−Infinity when none) */
  rhoCap: number;
}

export interface RhoLimits {
  min: number;
  max: number;
}

/** ρ of the curve passing through (p, m) at a depth, least squares over both equations (well-conditioned). */
function rhoThrough(phi: number, Pc: number, Mc: number, Ps: number, Ms: number, p: number, m: number): number {
  const a = p / phi - Pc;
  const b = m / phi - Mc;
  return (a * Ps + b * Ms) / (Ps * Ps + Ms * Ms);
}

/** Curve requirement for an axial-only demand: the curve meets the P axis at c → ∞ (p > 0) or c → 0 (p < 0). */
function rhoAxial(t: RayTable, p: number): number {
  const r = t.section.respond(p >= 0 ? C_OVER_H_MAX : C_OVER_H_MIN, t.scratch);
  return (p / r[R.factor]! - r[R.PcD]!) / r[R.PsD]!;
}

/**
 * Curve requirement: roots of g on the table, refined on the exact section; the root whose ρ lies in the
 * window is the one (curves nest there). Outside the window, the enclosure at the window's ends decides.
 */
export function rhoCurve(t: RayTable, load: NormalisedLoad, window: RhoLimits): number {
  const { P: p, M: m } = load;
  if (m === 0) return p === 0 ? -Infinity : rhoAxial(t, p);
  const { c, phi, Pc, Mc, Ps, Ms } = t;
  const n = c.length;
  const g = (i: number) => (p - phi[i]! * Pc[i]!) * Ms[i]! - (m - phi[i]! * Mc[i]!) * Ps[i]!;
  const lo = window.min - 1e-9;
  const hi = window.max + 1e-9;
  let prev = g(0);
  for (let i = 1; i < n; i++) {
    const gi = g(i);
    if (prev === 0 || prev * gi < 0) {
      // a cheap estimate first: skip brackets whose ρ is far outside the window
      const r0 = rhoThrough(phi[i - 1]!, Pc[i - 1]!, Mc[i - 1]!, Ps[i - 1]!, Ms[i - 1]!, p, m);
      const r1 = rhoThrough(phi[i]!, Pc[i]!, Mc[i]!, Ps[i]!, Ms[i]!, p, m);
      const spread = Math.abs(r1 - r0) + 0.01;
      if (Math.min(r0, r1) <= hi + spread && Math.max(r0, r1) >= lo - spread) {
        const rho = refine(t, c[i - 1]!, c[i]!, p, m);
        if (rho >= lo && rho <= hi) return rho;
      }
    }
    prev = gi;
  }
  // no crossing inside the window: the point lies inside the smallest curve or outside the largest
  if (capacityAlongRay(t, window.min, load).curveScale >= 1) return -Infinity;
  if (capacityAlongRay(t, window.max, load).curveScale < 1) return Infinity;
  // a crossing the table scan missed (should not happen): bisection on ρ, the uncapped capacity rises with ρ
  return findRoot((x) => capacityAlongRay(t, x, load).curveScale - 1, window.min, window.max, 1e-12);
}

function refine(t: RayTable, a: number, b: number, p: number, m: number): number {
  const r = t.scratch;
  const g = (c: number) => {
    t.section.respond(c, r);
    const f = r[R.factor]!;
    return (p - f * r[R.PcD]!) * r[R.MsD]! - (m - f * r[R.McD]!) * r[R.PsD]!;
  };
  const c = findRootOrNaN(g, a, b, 1e-11);
  if (Number.isNaN(c)) return NaN;
  t.section.respond(c, r);
  return rhoThrough(r[R.factor]!, r[R.PcD]!, r[R.McD]!, r[R.PsD]!, r[R.MsD]!, p, m);
}

/** Cap requirement p ≤ a + b·ρ in closed form. */
export function rhoForCap(t: RayTable, p: number): number {
  if (!Number.isFinite(t.capA) || p <= t.capA) return -Infinity;
  return t.capB > 0 ? (p - t.capA) / t.capB : Infinity;
}

/** The exact required ρg at the table's section, within `limits` (basis.rhoLimits or steelAreaLimits/Ag). */
export function rhoRequired(t: RayTable, load: NormalisedLoad, limits: RhoLimits): RhoRequirement {
  if (isNegligibleLoad(load)) return { rho: limits.min, status: 'minimum-governs', governedBy: 'minimum', rhoCurve: -Infinity, rhoCap: -Infinity };
  const curve = rhoCurve(t, load, limits);
  const cap = load.P > 0 ? rhoForCap(t, load.P) : -Infinity;
  const need = Math.max(curve, cap);
  const governedBy = need <= limits.min ? 'minimum' : cap > curve ? 'cap' : 'curve';
  if (Number.isNaN(curve) || need > limits.max) return { rho: null, status: 'not-possible', governedBy, rhoCurve: curve, rhoCap: cap };
  if (need <= limits.min) return { rho: limits.min, status: 'minimum-governs', governedBy, rhoCurve: curve, rhoCap: cap };
  return { rho: need, status: 'ok', governedBy, rhoCurve: curve, rhoCap: cap };
}
