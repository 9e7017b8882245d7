/**
 * Emulates reading printed chart sheets. A sheet is a curve family at one γ of a grid (default step 0.05)
 * with curves at fixed ρg steps (0.01). On a sheet, the reading is the linear interpolation along the
 * load ray between the two curves that bracket the point; between sheets, linear in γ (common practice).
 * The traditional reading takes the sheet with the next lower γ and rounds ρg up to the next curve.
 * Curves are read as drawn: the inner (conservative) branch of the family's points, axial cap included
 * (src/analysis/inner-branch.ts), the line a chart sheet draws by default (`referenceLines.barEntry`).
 */
import { computeFamily, type Curve, type CurveFamily } from '../analysis/family.js';
import { innerBranch, type Polyline } from '../analysis/inner-branch.js';
import type { Basis, CapContext } from '../codes/types.js';
import type { Arrangement, Shape } from '../section/types.js';
import type { NormalisedLoad } from './ray.js';

export const DEFAULT_CHART_GAMMA_STEP = 0.05;
export const CHART_RHO_STEP = 0.01;

export interface ChartSheet {
  gamma: number;
  family: CurveFamily;
}

export interface ChartSet {
  /** sheets bracketing the actual γ: one when γ sits on the grid or the upper sheet would reach γ ≥ 1 */
  lower: ChartSheet;
  upper: ChartSheet | null;
  gamma: number;
  gammaStep: number;
  rhos: readonly number[];
}

export interface ChartSetRequest {
  basis: Basis;
  shape: Shape;
  arrangement: Arrangement;
  gamma: number;
  /** γB of the sheets (outer-column spacing ÷ b), when the section has one; sheets are drawn at the actual γB */
  gammaB?: number;
  gammaStep?: number;
  capContext?: CapContext;
  rhoLimits: { min: number; max: number };
}

/** ρg values printed on a sheet: the minimum, then every 0.01 up to the maximum. */
export function chartRhos(limits: { min: number; max: number }): number[] {
  const out = [limits.min];
  for (let k = Math.floor(limits.min / CHART_RHO_STEP + 1e-9) + 1; k * CHART_RHO_STEP <= limits.max + 1e-12; k++) {
    out.push(Number((k * CHART_RHO_STEP).toFixed(10)));
  }
  return out;
}

/** Sheet γ values bracketing γ on a grid of `step`. */
export function bracketingGammas(gamma: number, step: number): { lower: number; upper: number | null } {
  const k = Math.floor(gamma / step + 1e-9);
  const lower = Number((k * step).toFixed(10));
  if (Math.abs(gamma - lower) < 1e-9) return { lower, upper: null };
  const upper = Number(((k + 1) * step).toFixed(10));
  return { lower, upper: upper < 1 ? upper : null };
}

export function buildChartSet(req: ChartSetRequest): ChartSet {
  const gammaStep = req.gammaStep ?? DEFAULT_CHART_GAMMA_STEP;
  const rhos = chartRhos(req.rhoLimits);
  const { lower, upper } = bracketingGammas(req.gamma, gammaStep);
  const sheet = (gamma: number): ChartSheet => ({
    gamma,
    family: computeFamily({ basis: req.basis, shape: req.shape, arrangement: req.arrangement, gamma, ...(req.gammaB !== undefined ? { gammaX: req.gammaB } : {}), rhos, capContext: req.capContext ?? {} }),
  });
  return { lower: sheet(lower), upper: upper === null ? null : sheet(upper), gamma: req.gamma, gammaStep, rhos };
}

const drawnLines = new WeakMap<Curve, Polyline>();

/** The factored curve as a sheet draws it: its inner branch (computed once per curve). */
export function drawnLine(curve: Curve, negativeStart?: number): Polyline {
  let line = drawnLines.get(curve);
  if (!line) drawnLines.set(curve, (line = innerBranch(curve.phiMn, curve.phiPn, negativeStart)));
  return line;
}

/** Where the ray through the load meets a drawn curve, as a multiple of the load (polyline intersection). */
export function drawnScale(curve: Curve, load: NormalisedLoad, negativeStart?: number): number {
  const { P: p, M: m } = load;
  const { P, M } = drawnLine(curve, negativeStart);
  const n = P.length;
  if (p === 0 && m === 0) return Infinity;
  if (m === 0) return p > 0 ? P[n - 1]! / p : P[0]! / p;
  // h = P·m − M·p rises from pure tension to pure compression
  let prev = P[0]! * m - M[0]! * p;
  for (let i = 1; i < n; i++) {
    const h = P[i]! * m - M[i]! * p;
    if (prev <= 0 && h > 0) {
      const w = -prev / (h - prev);
      const Pi = P[i - 1]! + w * (P[i]! - P[i - 1]!);
      const Mi = M[i - 1]! + w * (M[i]! - M[i - 1]!);
      return Math.abs(p) >= Math.abs(m) ? Pi / p : Mi / m;
    }
    prev = h;
  }
  return NaN;
}

export interface SheetReading {
  gamma: number;
  /** interpolated reading; the lowest curve when the point lies inside it; null when outside the highest */
  rho: number | null;
  /** ρg of the next curve out (the rounded-up reading); null when outside the highest */
  roundedUp: number | null;
  position: 'inside-lowest' | 'between' | 'outside-highest';
}

/** Reads one sheet along the load ray. */
export function readSheet(sheet: ChartSheet, load: NormalisedLoad): SheetReading {
  const curves = sheet.family.curves;
  if (curves.length === 0) return { gamma: sheet.gamma, rho: null, roundedUp: null, position: 'outside-highest' };
  // curve by curve, outward, stopping at the bracket (most loads need a few of the curves)
  const neg = sheet.family.negativeBranchStart;
  let b = drawnScale(curves[0]!, load, neg);
  if (b >= 1) return { gamma: sheet.gamma, rho: curves[0]!.rho, roundedUp: curves[0]!.rho, position: 'inside-lowest' };
  for (let k = 0; k + 1 < curves.length; k++) {
    const a = b;
    b = drawnScale(curves[k + 1]!, load, neg);
    if (a < 1 && b >= 1) {
      const rho = curves[k]!.rho + ((1 - a) / (b - a)) * (curves[k + 1]!.rho - curves[k]!.rho);
      return { gamma: sheet.gamma, rho, roundedUp: curves[k + 1]!.rho, position: 'between' };
    }
  }
  return { gamma: sheet.gamma, rho: null, roundedUp: null, position: 'outside-highest' };
}

export interface ChartReading {
  /** the reading interpolated between sheets; null when the point is off a sheet */
  rhoFromChart: number | null;
  /** the next-lower sheet, rounded up to the next curve; null when off that sheet */
  rhoRoundedDown: number | null;
  sheets: SheetReading[];
}

export function readCharts(set: ChartSet, load: NormalisedLoad): ChartReading {
  const lo = readSheet(set.lower, load);
  const sheets = [lo];
  let rhoFromChart = lo.rho;
  if (set.upper) {
    const hi = readSheet(set.upper, load);
    sheets.push(hi);
    rhoFromChart =
      lo.rho === null || hi.rho === null ? null : lo.rho + ((set.gamma - lo.gamma) / (hi.gamma - lo.gamma)) * (hi.rho - lo.rho);
  }
  return { rhoFromChart, rhoRoundedDown: lo.roundedUp, sheets };
}
