/**
 * Biaxial contour families: for one (basis, shape, arrangement, γ, γB) and a list of axial levels, the
 * normalised Mx–My contours of each ρg, read off the exact biaxial surface (src/analysis/biaxial.ts).
 * Pure: no I/O.
 *
 *   request ─▶ 1. unit-depth section per ρg (bars smeared to ρg·Ag, layoutBars)
 *           ─▶ 2. per level: P = level · normalising stress · Ag (ν for EN 1992-1-1, P/(f′c·Ag) otherwise)
 *           ─▶ 3. per moment direction ψ: the exact contour point (contourPointAtAngle)
 *           ─▶ 4. Mxo, Myo and the fitted load-contour exponent α with its worst radial misfit
 *
 * Normalisation: Mx/(Ag·h) and My/(Ag·b) in the basis's stress unit. Strains are linear in x/b and y/h and
 * every law of a basis depends on strain alone, so these ratios do not depend on b/h once γ and γB are
 * fixed (an affine map of the section); the family is computed on the group's own aspect all the same.
 */
import type { Basis, CapContext } from '../codes/types.js';
import { layoutBars } from '../section/arrangements.js';
import { grossArea, sectionDepth, sectionWidth } from '../section/geometry.js';
import type { Arrangement, Bar, Shape } from '../section/types.js';
import { contourPointAtAngle, prepareBiaxial, type BiaxialSection, type ModelKind } from './biaxial.js';
import { goldenSection } from './solve.js';

/** Moment-direction step of the tabulated contours, degrees (common practice for drawn contours). */
export const DEFAULT_ANGLE_STEP_DEG = 5;

export interface BiaxialFamilyRequest {
  basis: Basis;
  /** unit-depth shape (h = 1, or D = 1) */
  shape: Shape;
  arrangement: Arrangement;
  /** outer-row spacing over h */
  gamma: number;
  /** outer-column spacing over b; default: equal cover (layoutBars) */
  gammaX?: number;
  rhos: readonly number[];
  /** axial levels: factored axial load over (normalising stress · Ag) */
  levels: readonly number[];
  /** 'design' (factored, default) or 'nominal' */
  model?: ModelKind;
  capContext?: CapContext;
  /** moment-direction step, degrees; must divide 90 (default 5) */
  angleStepDeg?: number;
}

export interface BiaxialContour {
  rho: number;
  level: number;
  /** false when the level is beyond this ρg's reach (above the axial cap or below pure tension): no points */
  reachable: boolean;
  /** moment directions atan2(My, Mx), degrees */
  angleDeg: readonly number[];
  /** Mx/(Ag·h), stress units */
  mx: readonly number[];
  /** My/(Ag·b), stress units */
  my: readonly number[];
  /** uniaxial capacities at this level: Mx at My = 0 and My at Mx = 0 (positive faces), normalised; NaN when unreachable */
  mxo: number;
  myo: number;
  /** least-squares load-contour exponent α, and the worst |radius ÷ fitted radius − 1|; NaN when unreachable */
  alpha: number;
  misfit: number;
}

export interface BiaxialFamily {
  basis: Basis;
  shape: Shape;
  arrangement: Arrangement;
  gamma: number;
  gammaX: number | undefined;
  model: ModelKind;
  /** the layout's bars on the unit-depth shape, areas adding to Ag (ρg = 1): scale by ρg for a section's bars */
  bars: readonly Bar[];
  /** 'first' for layouts symmetric about both axes (one quadrant tells all), else 'all' */
  quadrants: 'first' | 'all';
  levels: readonly number[];
  rhos: readonly number[];
  /** contours[i][k]: level i, ρg k */
  contours: readonly (readonly BiaxialContour[])[];
}

/** True when the bars map onto themselves under x → −x and under y → −y (tolerance 1e-9 of the size and of Ast). */
export function doublySymmetric(bars: readonly Bar[], size: number): boolean {
  const tol = 1e-9 * size;
  const total = bars.reduce((s, b) => s + b.area, 0);
  const has = (x: number, y: number, a: number) => bars.some((o) => Math.abs(o.x - x) <= tol && Math.abs(o.y - y) <= tol && Math.abs(o.area - a) <= 1e-9 * total);
  return bars.every((b) => has(-b.x, b.y, b.area) && has(b.x, -b.y, b.area));
}

/** Moment directions of a contour, degrees: 0…90 for one quadrant, else 0…360 (360 left out). */
export function contourAngles(quadrants: 'first' | 'all', stepDeg: number): number[] {
  const end = quadrants === 'first' ? 90 : 360 - stepDeg;
  const n = Math.round(end / stepDeg);
  return Array.from({ length: n + 1 }, (_, i) => Number((i * stepDeg).toFixed(10)));
}

/** Radius of the load contour (u^α + v^α = 1) in the direction φ of the first quadrant (Bresler 1960, eq. of the load contour). */
export const loadContourRadius = (phi: number, alpha: number): number =>
  (Math.abs(Math.cos(phi)) ** alpha + Math.abs(Math.sin(phi)) ** alpha) ** (-1 / alpha);

/** Ends of the search for α (a fit at the upper end means "at least this": a near-rectangular contour). */
export const ALPHA_SEARCH_MIN = 0.5;
export const ALPHA_SEARCH_MAX = 6;

/**
 * Least-squares α of (Mx/Mxo)^α + (My/Myo)^α = 1 over the points (u, v) = (Mx/Mxo, My/Myo), each quadrant
 * scaled by its own axis capacities: minimises Σ (r/rα − 1)² on the radius (golden section on α in
 * 0.5–6), and returns the worst |r/rα − 1|.
 */
export function fitLoadContour(points: readonly { u: number; v: number }[]): { alpha: number; misfit: number } {
  const pts = points.filter((p) => Number.isFinite(p.u) && Number.isFinite(p.v) && Math.hypot(p.u, p.v) > 0);
  if (pts.length === 0) return { alpha: NaN, misfit: NaN };
  const polar = pts.map((p) => ({ r: Math.hypot(p.u, p.v), phi: Math.atan2(Math.abs(p.v), Math.abs(p.u)) }));
  const sse = (a: number) => polar.reduce((s, q) => s + (q.r / loadContourRadius(q.phi, a) - 1) ** 2, 0);
  const { lo, hi } = goldenSection(sse, ALPHA_SEARCH_MIN, ALPHA_SEARCH_MAX, (l, h) => h - l <= 1e-9);
  const alpha = (lo + hi) / 2;
  const misfit = polar.reduce((m, q) => Math.max(m, Math.abs(q.r / loadContourRadius(q.phi, alpha) - 1)), 0);
  return { alpha, misfit };
}

/** One contour of one section at axial load P, normalised by Ag·h and Ag·b. */
export function biaxialContour(sec: BiaxialSection, P: number, anglesDeg: readonly number[], model: ModelKind, rho: number, level: number): BiaxialContour {
  const h = sectionDepth(sec.shape);
  const b = sectionWidth(sec.shape);
  const ag = sec.grossArea;
  const angleDeg: number[] = [];
  const mx: number[] = [];
  const my: number[] = [];
  for (const a of anglesDeg) {
    const q = contourPointAtAngle(sec, P, (a * Math.PI) / 180, model);
    if (q === null) continue;
    angleDeg.push(a);
    // exact zeros on the axes (the search leaves rounding-level residue there)
    mx.push(a % 180 === 90 ? 0 : q.Mx / (ag * h));
    my.push(a % 180 === 0 ? 0 : q.My / (ag * b));
  }
  const unreachable: BiaxialContour = { rho, level, reachable: false, angleDeg: [], mx: [], my: [], mxo: NaN, myo: NaN, alpha: NaN, misfit: NaN };
  if (angleDeg.length !== anglesDeg.length) return unreachable;
  const at = (deg: number) => angleDeg.findIndex((a) => Math.abs(a - deg) < 1e-9);
  const axis = (deg: number, v: readonly number[]) => {
    const i = at(deg);
    return i < 0 ? NaN : Math.abs(v[i]!);
  };
  const mxo = axis(0, mx);
  const myo = axis(90, my);
  // each quadrant scaled by its own axis capacities (the same values when the layout is doubly symmetric)
  const quadScale = (deg: number) => {
    const q = Math.floor((((deg % 360) + 360) % 360) / 90 + 1e-9) % 4;
    const xDeg = q === 0 || q === 3 ? 0 : 180;
    const yDeg = q <= 1 ? 90 : 270;
    const sx = axis(xDeg, mx);
    const sy = axis(yDeg, my);
    return { sx: Number.isFinite(sx) ? sx : mxo, sy: Number.isFinite(sy) ? sy : myo };
  };
  const fit = fitLoadContour(angleDeg.map((a, i) => {
    const { sx, sy } = quadScale(a);
    return { u: mx[i]! / sx, v: my[i]! / sy };
  }));
  return { rho, level, reachable: true, angleDeg, mx, my, mxo, myo, alpha: fit.alpha, misfit: fit.misfit };
}

/** The contour family of a request: every level × every ρg. */
export function computeBiaxialFamily(req: BiaxialFamilyRequest): BiaxialFamily {
  const model = req.model ?? 'design';
  const step = req.angleStepDeg ?? DEFAULT_ANGLE_STEP_DEG;
  const ag = grossArea(req.shape);
  const layout = (rho: number) => layoutBars(req.shape, req.arrangement, rho * ag, { gamma: req.gamma, ...(req.gammaX !== undefined ? { gammaX: req.gammaX } : {}) });
  const size = Math.max(sectionDepth(req.shape), sectionWidth(req.shape));
  const quadrants = doublySymmetric(layout(0.01), size) ? 'first' : 'all';
  const angles = contourAngles(quadrants, step);
  const sections = req.rhos.map((rho) => prepareBiaxial(req.basis, req.shape, layout(rho), req.capContext ?? {}));
  const stress = req.basis.normalisingStress;
  const contours = req.levels.map((level) => sections.map((sec, k) => biaxialContour(sec, level * stress * ag, angles, model, req.rhos[k]!, level)));
  return { basis: req.basis, shape: req.shape, arrangement: req.arrangement, gamma: req.gamma, gammaX: req.gammaX, model, bars: layout(1), quadrants, levels: req.levels, rhos: req.rhos, contours };
}
