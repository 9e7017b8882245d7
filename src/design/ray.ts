/**
 * Capacity along a load ray. A factored demand (p, m) = (Pu/Ag, Mu/(Ag·h)) defines the ray from the
 * origin through it; the capacity is where that ray leaves the φ-factored curve, axial cap included.
 * Utilisation = demand ÷ capacity along the ray = 1 / t, where t·(p, m) lies on the capped curve.
 *
 * A `RayTable` samples the prepared section's response once on a c/h grid; each query brackets its
 * root on the table and refines it on the exact section (findRoot), so a query costs a few exact
 * section evaluations.
 */
import { baseGrid, C_OVER_H_MAX, C_OVER_H_MIN, depthForTensionStrain } from '../analysis/family.js';
import { R, RESPONSE_SIZE, type PreparedSection } from '../analysis/prepared-section.js';
import { findRootOrNaN } from '../analysis/solve.js';
import type { StrainClass } from '../codes/types.js';

/** A normalised demand: axial Pu/Ag and moment Mu/(Ag·h) (Ag·D for circles), stress units; M < 0 only for a layout not symmetric about the bending axis. */
export interface NormalisedLoad {
  P: number;
  M: number;
}

/** The design-model response of a prepared section sampled on a c/h grid, in columns. */
export interface RayTable {
  readonly section: PreparedSection;
  readonly c: Float64Array;
  readonly epsT: Float64Array;
  readonly phi: Float64Array;
  readonly Pc: Float64Array;
  readonly Mc: Float64Array;
  readonly Ps: Float64Array;
  readonly Ms: Float64Array;
  /** design cap as a + b·ρ (a = Infinity where the basis sets none) */
  readonly capA: number;
  readonly capB: number;
  /** scratch vector for exact evaluations */
  readonly scratch: Float64Array;
}

/** Samples a prepared section; `points` base points plus the strain-state depths where φ has kinks. */
export function tabulate(section: PreparedSection, points = 192): RayTable {
  const cs = new Set<number>(baseGrid(points));
  for (const s of section.basis.strainStates) {
    const c = depthForTensionStrain(section, s.epsT);
    if (Number.isFinite(c) && c > C_OVER_H_MIN && c < C_OVER_H_MAX) cs.add(c);
  }
  const c = Float64Array.from([...cs].sort((a, b) => a - b));
  const n = c.length;
  const cols = { epsT: new Float64Array(n), phi: new Float64Array(n), Pc: new Float64Array(n), Mc: new Float64Array(n), Ps: new Float64Array(n), Ms: new Float64Array(n) };
  const r = new Float64Array(RESPONSE_SIZE);
  for (let i = 0; i < n; i++) {
    section.respond(c[i]!, r);
    cols.epsT[i] = r[R.epsT]!;
    cols.phi[i] = r[R.factor]!;
    cols.Pc[i] = r[R.PcD]!;
    cols.Mc[i] = r[R.McD]!;
    cols.Ps[i] = r[R.PsD]!;
    cols.Ms[i] = r[R.MsD]!;
  }
  const capA = section.cap('design', 0);
  const capB = section.cap('design', 1) - capA;
  return { section, c, ...cols, capA, capB: Number.isFinite(capB) ? capB : 0, scratch: new Float64Array(RESPONSE_SIZE) };
}

/** Design axial cap /Ag at ρg (Infinity where none). */
export const capAt = (t: RayTable, rho: number): number => (Number.isFinite(t.capA) ? t.capA + t.capB * rho : Infinity);

export interface RayCapacity {
  /** t such that t·(p, m) is the capacity point; Infinity for a zero load */
  scale: number;
  /** the same for the uncapped curve */
  curveScale: number;
  /** demand ÷ capacity along the ray */
  utilisation: number;
  /** capacity point, normalised */
  P: number;
  M: number;
  /** c/h where the ray meets the uncapped factored curve (the strain state reported) */
  cOverH: number;
  epsT: number;
  phi: number;
  /** true when the axial cap, not the curve, limits the capacity along this ray */
  capGoverns: boolean;
}

/**
 * Where the ray through the load meets the uncapped φ-curve of ρg: the root in c of
 * h(c) = P(c)·m − M(c)·p (φ cancels), where h rises through zero as the curve, swept from pure tension to
 * pure compression, passes the ray (a falling zero is the ray's opposite direction; a layout not symmetric
 * about the bending axis can show one). The first rising zero on the table is refined. NaN when the ray
 * misses this branch (it meets the mirrored one).
 */
function rayDepth(t: RayTable, rho: number, load: NormalisedLoad, exact: boolean): number {
  const { P: p, M: m } = load;
  const n = t.c.length;
  // an axial load, or a moment lost in round-off beside it (denormal m): the ray is the P axis
  if (Math.abs(m) <= 1e-12 * Math.abs(p)) return p >= 0 ? C_OVER_H_MAX : C_OVER_H_MIN;
  const hAt = (i: number) => (t.Pc[i]! + rho * t.Ps[i]!) * m - (t.Mc[i]! + rho * t.Ms[i]!) * p;
  const h0 = hAt(0);
  let prev = h0;
  let hi = -1;
  for (let i = 1; i < n; i++) {
    const h = hAt(i);
    if (prev <= 0 && h > 0) {
      hi = i;
      break;
    }
    prev = h;
  }
  if (hi < 0) {
    if (h0 >= 0 && prev >= 0) return t.c[0]!;
    if (h0 <= 0 && prev <= 0) return t.c[n - 1]!;
    return NaN;
  }
  const lo = hi - 1;
  if (!exact) {
    const hl = hAt(lo);
    const hh = hAt(hi);
    return t.c[lo]! + ((t.c[hi]! - t.c[lo]!) * -hl) / (hh - hl);
  }
  const r = t.scratch;
  const f = (c: number) => {
    t.section.respond(c, r);
    return (r[R.PcD]! + rho * r[R.PsD]!) * m - (r[R.McD]! + rho * r[R.MsD]!) * p;
  };
  const c = findRootOrNaN(f, t.c[lo]!, t.c[hi]!, 1e-11);
  return Number.isNaN(c) ? t.c[lo]! : c;
}

/** Response columns at c: exact, or linear between table nodes (for fast screening). */
function responseAt(t: RayTable, c: number, exact: boolean): [epsT: number, phi: number, Pc: number, Mc: number, Ps: number, Ms: number] {
  if (exact) {
    const r = t.section.respond(c, t.scratch);
    return [r[R.epsT]!, r[R.factor]!, r[R.PcD]!, r[R.McD]!, r[R.PsD]!, r[R.MsD]!];
  }
  const n = t.c.length;
  let lo = 0;
  let hi = n - 1;
  if (c <= t.c[0]!) hi = 0;
  else if (c >= t.c[n - 1]!) lo = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (t.c[mid]! <= c) lo = mid;
    else hi = mid;
  }
  const w = hi === lo ? 0 : (c - t.c[lo]!) / (t.c[hi]! - t.c[lo]!);
  const at = (col: Float64Array) => col[lo]! + w * (col[hi]! - col[lo]!);
  return [at(t.epsT), at(t.phi), at(t.Pc), at(t.Mc), at(t.Ps), at(t.Ms)];
}

/**
 * Capacity along the ray through `load` for ρg (smeared, or the discrete bars the table was built on
 * with ρg = Ast/Ag). `exact = false` interpolates the table instead of refining (screening only).
 */
export function capacityAlongRay(t: RayTable, rho: number, load: NormalisedLoad, exact = true): RayCapacity {
  const { P: p, M: m } = load;
  const found = rayDepth(t, rho, load, exact);
  // a negligible load has no direction to miss with (its ray is round-off): report the axial end state
  if (Number.isNaN(found) && !isNegligibleLoad(load)) return missedRay(t, rho, load);
  const c = Number.isNaN(found) ? (p >= 0 ? C_OVER_H_MAX : C_OVER_H_MIN) : found;
  const [epsT, phi, Pc, Mc, Ps, Ms] = responseAt(t, c, exact);
  const P = phi * (Pc + rho * Ps);
  const M = phi * (Mc + rho * Ms);
  if (isNegligibleLoad(load)) return { scale: Infinity, curveScale: Infinity, utilisation: 0, P, M, cOverH: c, epsT, phi, capGoverns: false };
  // component with the larger demand is the better-conditioned ratio
  const curveScale = Math.abs(p) >= Math.abs(m) ? P / p : M / m;
  let scale = curveScale;
  let capGoverns = false;
  const cap = capAt(t, rho);
  if (p > 0 && cap / p < scale) {
    scale = cap / p;
    capGoverns = true;
  }
  return {
    scale,
    curveScale,
    utilisation: 1 / scale,
    P: capGoverns ? cap : P,
    M: capGoverns ? scale * m : M,
    cOverH: c,
    epsT,
    phi,
    capGoverns,
  };
}

/** A ray this branch does not meet sets no limit of its own; the axial cap still does. */
function missedRay(t: RayTable, rho: number, load: NormalisedLoad): RayCapacity {
  const cap = capAt(t, rho);
  const capScale = load.P > 0 ? cap / load.P : Infinity;
  return {
    scale: capScale,
    curveScale: Infinity,
    utilisation: 1 / capScale,
    P: Number.isFinite(capScale) ? cap : NaN,
    M: Number.isFinite(capScale) ? load.M * capScale : NaN,
    cOverH: NaN,
    epsT: NaN,
    phi: NaN,
    capGoverns: Number.isFinite(capScale),
  };
}

/**
 * Demands below 1e-12 in normalised stress units (far under any real load) count as zero: their ray
 * direction is round-off, and denormal components overflow the ratios.
 */
export const isNegligibleLoad = (load: NormalisedLoad): boolean => Math.abs(load.P) < 1e-12 && Math.abs(load.M) < 1e-12;

/** The strain state at a capacity point, for reports. */
export interface StrainReport {
  cOverH: number;
  epsT: number;
  phi: number;
  class: StrainClass;
}

export function strainReport(t: RayTable, cap: RayCapacity): StrainReport {
  return { cOverH: cap.cOverH, epsT: cap.epsT, phi: cap.phi, class: t.section.basis.classify(cap.epsT) };
}
