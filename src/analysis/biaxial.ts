/**
 * Biaxial bending of the actual section under an inclined neutral axis (strain compatibility,
 * ACI 318-19 22.2.1 and 22.2.2; EN 1992-1-1 6.1(2)). Pure: no I/O.
 *
 * Geometry. Centroidal axes: x across the width b, y along the depth h (src/section/types.ts).
 * The neutral axis has angle θ: the unit vector n = (sin θ, cos θ) points from the neutral axis to
 * the compression side. θ = 0 is uniaxial bending about the x axis (compression face y = +h/2, the
 * chart's bending plane); θ = π/2 is uniaxial bending about the y axis (compression face x = +b/2).
 * Depth below the extreme compression fibre is d = sMax − (x·sin θ + y·cos θ), and the section depth
 * normal to the neutral axis is hθ = 2·sMax (b·|sin θ| + h·|cos θ| for a rectangle, D for a circle).
 *
 * Resultants. P compression-positive; Mx = ∫σ·y dA (positive when the +y face is compressed);
 * My = ∫σ·x dA (positive when the +x face is compressed). Moments are about the gross-section centroid.
 *
 * Concrete on a rectangle: the chord of the section at depth d is a segment whose ends move linearly
 * with d between the depths of the corners, so its width and first moment are piecewise polynomials
 * of degree ≤ 2. Integrating Gauss–Legendre between corner depths and the law's strain breakpoints is
 * exact for the rectangular block and accurate to rounding for the parabola–rectangle law.
 */
import type { Basis, CapContext, ResistanceModel } from '../codes/types.js';
import type { ConcreteLaw } from '../materials/types.js';
import { grossArea } from '../section/geometry.js';
import type { Bar, Shape } from '../section/types.js';
import { GAUSS_10, gaussForDegree } from './gauss.js';
import { concreteResultant, strainAt } from './section-forces.js';
import { findRootOrNaN } from './solve.js';
import type { StrainProfile } from '../codes/types.js';

export type ModelKind = 'nominal' | 'design';

/** Ends of the depth search, as multiples of hθ: c → 0 is pure tension, c → ∞ pure compression. */
const C_MIN = 1e-6;
const C_MAX = 1e6;

export interface BiaxialSection {
  readonly basis: Basis;
  /** actual shape, internal length units */
  readonly shape: Shape;
  /** actual bars, internal units, centroidal coordinates */
  readonly bars: readonly Bar[];
  readonly grossArea: number;
  readonly steelArea: number;
  /** Po of each model (22.4.2.2 form): concreteStress·(Ag − Ast) + steelStress·Ast */
  readonly squash: Readonly<Record<ModelKind, number>>;
  /** axial cap of each model (Infinity where none): capFactor·Po; the design cap includes φ */
  readonly cap: Readonly<Record<ModelKind, number>>;
  /**
   * 'reference': every depth search over the whole range and 10 Gauss points per piece, as before the fast path
   * (issue 21); kept so a property test can compare the fast search with it. Absent: the fast search.
   */
  readonly search?: 'reference';
}

/** Resultant of one model at (θ, c), before φ. */
export interface BiaxialResultant {
  P: number;
  Mx: number;
  My: number;
  /** net tensile strain in the extreme tension bar, tension positive */
  epsT: number;
}

/** A point of the (factored or nominal) surface with where it came from. */
export interface SurfacePoint extends BiaxialResultant {
  /** neutral-axis angle, rad */
  theta: number;
  /** neutral-axis depth from the extreme compression fibre, internal length units */
  c: number;
  /** section depth normal to the neutral axis */
  depth: number;
  /** factor applied (φ for ACI, 1 where factors sit in the materials) */
  phi: number;
}

export function prepareBiaxial(basis: Basis, shape: Shape, bars: readonly Bar[], capContext: CapContext = {}, opts: { reference?: boolean } = {}): BiaxialSection {
  const ag = grossArea(shape);
  const ast = bars.reduce((s, b) => s + b.area, 0);
  const po = (m: ResistanceModel) => m.squash.concreteStress * (ag - ast) + m.squash.steelStress * ast;
  const squash = { nominal: po(basis.nominal), design: po(basis.design) };
  const capOf = (m: ResistanceModel, p: number) => {
    const f = m.capFactor(capContext);
    return Number.isFinite(f) ? f * p : Infinity;
  };
  const cap = { nominal: capOf(basis.nominal, squash.nominal), design: capOf(basis.design, squash.design) };
  return { basis, shape, bars, grossArea: ag, steelArea: ast, squash, cap, ...(opts.reference ? { search: 'reference' as const } : {}) };
}

/** Scratch for rectangleConcrete's cut depths: 2 ends, 4 corners, and room for the laws' breakpoints (single-threaded, never re-entered). */
const CUTS = new Float64Array(16);

type Resultant3 = { P: number; Mx: number; My: number };
/** rectangleConcrete's answer, read at once by its one caller (no allocation per evaluation). */
const RESULT: Resultant3 = { P: 0, Mx: 0, My: 0 };

type Rule = { readonly nodes: Float64Array; readonly weights: Float64Array };

/**
 * The fewest Gauss–Legendre points exact for a law on a rectangle: between breakpoints and corner depths the
 * stress is a polynomial of degree k in depth (strain is linear in depth), the chord width and the moment arm
 * are linear, so the integrands have degree ≤ k + 2, which m points integrate exactly when 2m − 1 ≥ k + 2
 * (Abramowitz & Stegun 25.4.29). A law that is no polynomial keeps 10 points.
 */
function ruleFor(law: ConcreteLaw, reference: boolean): Rule {
  return reference || law.polynomialDegree === undefined ? GAUSS_10 : gaussForDegree(law.polynomialDegree + 2);
}

/** Half the section's extent along n = (sin θ, cos θ): the extreme compression fibre's coordinate. */
export function extremeCoordinate(shape: Shape, theta: number): number {
  if (shape.kind === 'circle') return shape.diameter / 2;
  return (shape.b / 2) * Math.abs(Math.sin(theta)) + (shape.h / 2) * Math.abs(Math.cos(theta));
}

const modelOf = (basis: Basis, kind: ModelKind): ResistanceModel => (kind === 'nominal' ? basis.nominal : basis.design);

/** Resultant of a model's laws at neutral-axis angle θ and depth c (c = Infinity: uniform compression). */
export function biaxialResultant(sec: BiaxialSection, theta: number, c: number, kind: ModelKind = 'design'): BiaxialResultant {
  return resultantInto(sec, theta, c, kind, { P: 0, Mx: 0, My: 0, epsT: 0 });
}

/** Scratch for the depth searches' inner evaluations (read at once; the searches never nest). */
const SCRATCH: BiaxialResultant = { P: 0, Mx: 0, My: 0, epsT: 0 };

/** biaxialResultant written into `out` (no allocation in the searches' inner loops). */
function resultantInto(sec: BiaxialSection, theta: number, c: number, kind: ModelKind, out: BiaxialResultant): BiaxialResultant {
  const model = modelOf(sec.basis, kind);
  const nx = Math.sin(theta);
  const ny = Math.cos(theta);
  const sMax = extremeCoordinate(sec.shape, theta);
  const depth = 2 * sMax;
  let sMin = Infinity;
  for (const bar of sec.bars) sMin = Math.min(sMin, bar.x * nx + bar.y * ny);
  const dt = sMax - sMin;
  const p = sec.basis.profile(c, depth, dt);
  if (sec.basis.linearTransitionToSquash && c > dt && dt > 0) {
    // AS 3600-2018 10.6.2.3: straight line from the decompression point (c = dt) to the squash load
    const dec = biaxialResultant(sec, theta, dt, kind);
    const t = Number.isFinite(c) ? 1 - dt / c : 1;
    out.P = (1 - t) * dec.P + t * sec.squash[kind];
    out.Mx = (1 - t) * dec.Mx;
    out.My = (1 - t) * dec.My;
    out.epsT = -strainAt(p, dt);
    return out;
  }

  let P = 0;
  let Mx = 0;
  let My = 0;
  if (sec.shape.kind === 'circle') {
    // A circle looks the same from every angle: the uniaxial integrator along n, turned into x and y.
    const r = concreteResultant(sec.shape, model.concrete, p);
    P = r.P;
    Mx = r.M * ny;
    My = r.M * nx;
  } else {
    const r = rectangleConcrete(sec.shape.b, sec.shape.h, nx, ny, sMax, model.concrete, p, ruleFor(model.concrete, sec.search === 'reference'));
    P = r.P;
    Mx = r.Mx;
    My = r.My;
  }

  for (const bar of sec.bars) {
    const s = bar.x * nx + bar.y * ny;
    const eps = strainAt(p, sMax - s);
    // displaced concrete deducted where the bar sits in compressed concrete (as barResultant does)
    const f = bar.area * (model.steel.stress(eps) - model.concrete.stress(eps));
    P += f;
    Mx += f * bar.y;
    My += f * bar.x;
  }
  out.P = P;
  out.Mx = Mx;
  out.My = My;
  out.epsT = -strainAt(p, sMax - sMin);
  return out;
}

/**
 * Concrete resultant of a b × h rectangle with the neutral axis normal to n = (nx, ny).
 * A point at depth d on the chord: (x, y) = s·n + t·τ with s = sMax − d and τ = (ny, −nx).
 */
function rectangleConcrete(b: number, h: number, nx: number, ny: number, sMax: number, law: ConcreteLaw, p: StrainProfile, rule: Rule): Resultant3 {
  const depth = 2 * sMax;
  const out = RESULT;
  if (p.curvature === 0) {
    out.P = law.stress(p.top) * b * h;
    out.Mx = 0;
    out.My = 0;
    return out;
  }
  // cut depths: the ends, the corners inside, the law's breakpoints; a few values, kept sorted by insertion
  // (Array.prototype.sort with a comparator cost more than the integration itself)
  const cuts = law.breakpoints.length + 6 <= CUTS.length ? CUTS : new Float64Array(law.breakpoints.length + 6);
  let n = 0;
  const add = (d: number): void => {
    let i = n++;
    while (i > 0 && cuts[i - 1]! > d) {
      cuts[i] = cuts[i - 1]!;
      i--;
    }
    cuts[i] = d;
  };
  add(0);
  add(depth);
  for (let corner = 0; corner < 4; corner++) {
    const cx = corner & 1 ? b / 2 : -b / 2;
    const cy = corner & 2 ? h / 2 : -h / 2;
    const d = sMax - (cx * nx + cy * ny);
    if (d > 1e-12 * depth && d < depth * (1 - 1e-12)) add(d);
  }
  for (const e of law.breakpoints) {
    const d = (p.top - e) / p.curvature;
    if (d > 0 && d < depth) add(d);
  }

  const { nodes, weights } = rule;
  const hb = b / 2;
  const hh = h / 2;
  const small = 1e-12;
  let P = 0;
  let Mx = 0;
  let My = 0;
  for (let k = 0; k + 1 < n; k++) {
    const lo = cuts[k]!;
    const hi = cuts[k + 1]!;
    if (hi - lo <= small * depth) continue;
    const half = (hi - lo) / 2;
    const mid = (lo + hi) / 2;
    if (strainAt(p, mid) <= 0 && strainAt(p, lo) <= 0) continue;
    for (let i = 0; i < nodes.length; i++) {
      const d = mid + half * nodes[i]!;
      const sigma = law.stress(strainAt(p, d));
      if (sigma === 0) continue;
      const s = sMax - d;
      // chord ends: |s·nx + t·ny| ≤ b/2 and |s·ny − t·nx| ≤ h/2
      let t1 = -Infinity;
      let t2 = Infinity;
      if (Math.abs(ny) > small) {
        const a = (-hb - s * nx) / ny;
        const z = (hb - s * nx) / ny;
        t1 = Math.max(t1, Math.min(a, z));
        t2 = Math.min(t2, Math.max(a, z));
      }
      if (Math.abs(nx) > small) {
        const a = (s * ny - hh) / nx;
        const z = (s * ny + hh) / nx;
        t1 = Math.max(t1, Math.min(a, z));
        t2 = Math.min(t2, Math.max(a, z));
      }
      const w = t2 - t1;
      if (!(w > 0)) continue;
      const tm = (t1 + t2) / 2;
      const f = sigma * w * half * weights[i]!;
      P += f;
      Mx += f * (s * ny - tm * nx);
      My += f * (s * nx + tm * ny);
    }
  }
  out.P = P;
  out.Mx = Mx;
  out.My = My;
  return out;
}

/** The factored (or nominal) point at (θ, c): φ·resultant, without the axial cap. */
export function surfacePoint(sec: BiaxialSection, theta: number, c: number, kind: ModelKind = 'design'): SurfacePoint {
  const r = biaxialResultant(sec, theta, c, kind);
  const phi = kind === 'design' ? sec.basis.design.factor(r.epsT) : 1;
  return { theta, c, depth: 2 * extremeCoordinate(sec.shape, theta), phi, P: phi * r.P, Mx: phi * r.Mx, My: phi * r.My, epsT: r.epsT };
}

/** Pure compression of a model, uncapped: the factor at uniform compression times Po. */
export function squashPoint(sec: BiaxialSection, kind: ModelKind = 'design'): number {
  const r = biaxialResultant(sec, 0, Infinity, kind);
  const phi = kind === 'design' ? sec.basis.design.factor(r.epsT) : 1;
  return phi * sec.squash[kind];
}

const wrap = (a: number): number => {
  let x = a % (2 * Math.PI);
  if (x > Math.PI) x -= 2 * Math.PI;
  if (x <= -Math.PI) x += 2 * Math.PI;
  return x;
};

/**
 * Neutral-axis depth at angle θ where the resultant's (P, |M|) direction matches atan2(P, |M|) = ω.
 * The factor φ scales P and M alike, so the nominal-law or design-law resultant decides the direction.
 */
function depthForDirection(sec: BiaxialSection, theta: number, omega: number, kind: ModelKind): number {
  const depth = 2 * extremeCoordinate(sec.shape, theta);
  const reference = sec.search === 'reference';
  const g = (logC: number) => {
    const r = resultantInto(sec, theta, Math.exp(logC) * depth, kind, SCRATCH);
    return Math.atan2(r.P, reference ? Math.hypot(r.Mx, r.My) : Math.sqrt(r.Mx * r.Mx + r.My * r.My)) - omega;
  };
  const lo = Math.log(C_MIN);
  const hi = Math.log(C_MAX);
  const x = findRootOrNaN(g, lo, hi, 1e-12, 200);
  return Number.isNaN(x) ? (g(hi) < 0 ? C_MAX * depth : C_MIN * depth) : Math.exp(x) * depth;
}

export interface RayCapacity {
  /** demand ÷ capacity along the load ray in (P, Mx, My); > 1 fails */
  utilisation: number;
  /** the capacity point on the ray (factored surface, axial cap included) */
  capacity: { P: number; Mx: number; My: number };
  /** the surface point before the cap: its strain state */
  point: SurfacePoint;
  /** true when the axial cap, not the surface, bounds the ray */
  capGoverns: boolean;
  /** |angle between the capacity moment and the load moment|, rad (solver residual) */
  directionError: number;
}

/**
 * Capacity along the load ray (Pu, Mux, Muy): search the neutral-axis angle θ and depth c so the
 * resultant moment points the way of the load and (P, |M|) lies on the ray, then scale.
 * Internal units of the basis (kip, kip·in or N, N·mm).
 */
export function capacityAlongRay(sec: BiaxialSection, Pu: number, Mux: number, Muy: number, kind: ModelKind = 'design'): RayCapacity {
  const Mu = Math.hypot(Mux, Muy);
  const cap = sec.cap[kind];
  const ag = sec.grossArea;
  const scaleP = Math.max(sec.squash[kind], 1e-300);
  const scaleM = scaleP * Math.sqrt(ag);
  let point: SurfacePoint;
  let directionError = 0;

  if (Mu <= 1e-12 * scaleM) {
    // pure axial load: uniform compression or pure tension, at any angle
    point = surfacePoint(sec, 0, Pu >= 0 ? Infinity : 0, kind);
    if (Pu >= 0) point = { ...point, P: squashPoint(sec, kind), Mx: 0, My: 0 };
  } else {
    const psi = Math.atan2(Muy, Mux);
    const omega = Math.atan2(Pu, Mu);
    const resid = (theta: number): { r: number; c: number } => {
      const c = depthForDirection(sec, theta, omega, kind);
      const q = biaxialResultant(sec, theta, c, kind);
      return { r: wrap(Math.atan2(q.My, q.Mx) - psi), c };
    };
    const theta = solveAngle(resid, psi);
    const c = depthForDirection(sec, theta, omega, kind);
    point = surfacePoint(sec, theta, c, kind);
    directionError = Math.abs(wrap(Math.atan2(point.My, point.Mx) - psi));
  }

  // scale along the ray in normalised coordinates (P/Po, M/(Po·√Ag)); the two vectors are parallel at the solution
  const lp = Pu / scaleP;
  const lm = Mu / scaleM;
  const cp = point.P / scaleP;
  const cm = Math.hypot(point.Mx, point.My) / scaleM;
  const uSurface = (lp * cp + lm * cm) / (cp * cp + cm * cm);
  const uCap = Pu > 0 && Number.isFinite(cap) ? Pu / cap : 0;
  const utilisation = Math.max(uSurface, uCap);
  const capGoverns = uCap > uSurface;
  const k = utilisation > 0 ? 1 / utilisation : Infinity;
  return { utilisation, capacity: { P: Pu * k, Mx: Mux * k, My: Muy * k }, point, capGoverns, directionError };
}

/**
 * Neutral-axis angle where the resultant moment direction matches the load: 16 angles over a full turn
 * around ψ, tried outward from ψ (the answer usually lies close to the load's own angle, so most checks
 * stop after a few), then bracketed refinement (Illinois regula falsi) on the wrapped direction residual.
 */
function solveAngle(resid: (theta: number) => { r: number }, psi: number): number {
  const N = 16;
  const mid = N / 2;
  const thetaAt = (i: number) => psi - Math.PI + (2 * Math.PI * i) / N;
  const rs = new Map<number, number>();
  const r = (i: number): number => {
    let v = rs.get(i);
    if (v === undefined) {
      v = resid(thetaAt(i)).r;
      rs.set(i, v);
    }
    return v;
  };
  // a bracket whose ends are both within a quarter turn (skips the ±π wrap)
  const brackets = (i: number): boolean => {
    const a = r(i);
    const z = r(i + 1);
    return a * z < 0 && Math.abs(a) < Math.PI / 2 && Math.abs(z) < Math.PI / 2;
  };
  if (r(mid) === 0) return psi;
  for (let d = 0; d < mid; d++) {
    for (const i of [mid - d - 1, mid + d]) {
      if (r(i) === 0) return thetaAt(i);
      if (brackets(i)) {
        const t = findRootOrNaN((x) => resid(x).r, thetaAt(i), thetaAt(i + 1), 1e-11, 100);
        return Number.isNaN(t) ? thetaAt(i) : t;
      }
    }
  }
  // no clean bracket: take the scanned angle with the smallest residual
  let k = 0;
  for (let i = 1; i <= N; i++) if (Math.abs(r(i)) < Math.abs(r(k))) k = i;
  return thetaAt(k);
}

/**
 * Neutral-axis depth at angle θ where the factored (or nominal) axial force equals P, uncapped.
 * NaN when P is outside the range the angle reaches.
 */
export function depthForAxial(sec: BiaxialSection, theta: number, P: number, kind: ModelKind = 'design'): number {
  const depth = 2 * extremeCoordinate(sec.shape, theta);
  const g = (logC: number) => {
    // surfacePoint(…).P without the point: the same product φ·P
    const r = resultantInto(sec, theta, Math.exp(logC) * depth, kind, SCRATCH);
    const phi = kind === 'design' ? sec.basis.design.factor(r.epsT) : 1;
    return phi * r.P - P;
  };
  const x = findRootOrNaN(g, Math.log(C_MIN), Math.log(C_MAX), 1e-12, 200);
  return Number.isNaN(x) ? NaN : Math.exp(x) * depth;
}

/**
 * The Mx–My contour at axial load P: one surface point per neutral-axis angle, θ evenly spaced over a
 * full turn starting at θ = 0 (uniaxial about x). Points with P outside the angle's range are skipped.
 */
export function contourAtAxial(sec: BiaxialSection, P: number, count = 72, kind: ModelKind = 'design'): SurfacePoint[] {
  const out: SurfacePoint[] = [];
  for (let i = 0; i < count; i++) {
    const theta = (2 * Math.PI * i) / count;
    const c = depthForAxial(sec, theta, P, kind);
    if (Number.isFinite(c)) out.push(surfacePoint(sec, theta, c, kind));
  }
  return out;
}

/**
 * Uniaxial moment capacity at axial load P about one axis (θ = 0 for x, π/2 for y; the sign of the
 * moment picks the face). Returns the moment about that axis; NaN when P is out of reach.
 */
export function uniaxialMomentAt(sec: BiaxialSection, axis: 'x' | 'y', P: number, negative = false, kind: ModelKind = 'design'): { moment: number; point: SurfacePoint | null } {
  const theta = (axis === 'x' ? 0 : Math.PI / 2) + (negative ? Math.PI : 0);
  const c = depthForAxial(sec, theta, P, kind);
  if (!Number.isFinite(c)) return { moment: NaN, point: null };
  const pt = surfacePoint(sec, theta, c, kind);
  return { moment: Math.abs(axis === 'x' ? pt.Mx : pt.My), point: pt };
}

/**
 * Uniaxial axial capacity at an eccentricity about one axis (the load ray (Pu, Mu) with the other
 * moment zero and the neutral axis held parallel to that axis), uncapped.
 */
export function uniaxialAxialAt(sec: BiaxialSection, axis: 'x' | 'y', Pu: number, Mu: number, kind: ModelKind = 'design'): { P: number; point: SurfacePoint } {
  if (Math.abs(Mu) <= 0) return { P: squashPoint(sec, kind), point: surfacePoint(sec, 0, Infinity, kind) };
  const theta = (axis === 'x' ? 0 : Math.PI / 2) + (Mu < 0 ? Math.PI : 0);
  const omega = Math.atan2(Pu, Math.abs(Mu));
  const c = depthForDirection(sec, theta, omega, kind);
  const pt = surfacePoint(sec, theta, c, kind);
  return { P: pt.P, point: pt };
}

/**
 * The point of the contour at axial load P whose moment vector points at ψ = atan2(My, Mx): the same
 * angle search as the ray capacity (solveAngle), with the depth held to the axial load. Null when P is
 * out of reach at the angle found.
 */
export function contourPointAtAngle(sec: BiaxialSection, P: number, psi: number, kind: ModelKind = 'design'): SurfacePoint | null {
  if (P > sec.cap[kind]) return null;
  const resid = (theta: number): { r: number } => {
    const c = depthForAxial(sec, theta, P, kind);
    if (!Number.isFinite(c)) return { r: NaN };
    const q = surfacePoint(sec, theta, c, kind);
    return { r: wrap(Math.atan2(q.My, q.Mx) - psi) };
  };
  const theta = solveAngle(resid, psi);
  const c = depthForAxial(sec, theta, P, kind);
  return Number.isFinite(c) ? surfacePoint(sec, theta, c, kind) : null;
}

/**
 * Moment utilisation at fixed axial load: |Mu| ÷ the capacity moment in the load's direction on the
 * contour at P = Pu (the measure the load-contour method approximates). NaN when Pu is out of reach.
 */
export function momentUtilisationAtAxial(sec: BiaxialSection, Pu: number, Mux: number, Muy: number, kind: ModelKind = 'design'): number {
  const q = contourPointAtAngle(sec, Pu, Math.atan2(Muy, Mux), kind);
  return q === null ? NaN : Math.hypot(Mux, Muy) / Math.hypot(q.Mx, q.My);
}
