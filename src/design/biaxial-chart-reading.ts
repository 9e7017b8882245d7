/**
 * Emulates reading a load with Mux and Muy off biaxial chart sheets (src/analysis/biaxial-family.ts): one
 * panel per axial level on a grid of `step` (default 0.1 of P/(normalising stress·Ag)), each with the ρg
 * family of factored Mx–My contours drawn as polylines through points 5° apart in moment direction.
 *
 *   load ─▶ 1. ν = Pu/(stress·Ag), mx = Mux/(Ag·h), my = Muy/(Ag·b)
 *        ─▶ 2. the two levels bracketing ν (one when ν sits on the grid)
 *        ─▶ 3. on each level: along the ray from the origin through (mx, my), linear between the two drawn
 *              contours that bracket the point (the lowest drawn ρg when inside it)
 *        ─▶ 4. between levels: linear in ν (common practice, as between γ sheets)
 *
 * A contour whose level is above that ρg's axial cap is not drawn, so a panel starts at the lowest ρg that
 * reaches it. Sheets are at the column's own γ and γB: the reading differs from the exact answer only by
 * the interpolation between levels and curves, and by the polyline between tabulated directions.
 */
import { computeBiaxialFamily, type BiaxialContour, type BiaxialFamily } from '../analysis/biaxial-family.js';
import type { Basis, CapContext } from '../codes/types.js';
import { grossArea, sectionDepth, sectionWidth } from '../section/geometry.js';
import type { Arrangement, Shape } from '../section/types.js';
import { chartRhos } from './chart-reading.js';

export const DEFAULT_CHART_AXIAL_STEP = 0.1;

export interface BiaxialChartRequest {
  basis: Basis;
  /** the column's actual shape (internal units) */
  shape: Shape;
  arrangement: Arrangement;
  gamma: number;
  gammaX?: number;
  capContext?: CapContext;
  rhoLimits: { min: number; max: number };
  /** axial-level step of the printed sheets (default 0.1) */
  axialStep?: number;
}

export interface BiaxialLevelReading {
  /** the sheet's axial level */
  level: number;
  /** interpolated reading; the lowest drawn curve when the point lies inside it; null when outside the highest or nothing is drawn */
  rho: number | null;
  position: 'inside-lowest' | 'between' | 'outside-highest';
}

export interface BiaxialChartReading {
  /** ν of the load: Pu/(normalising stress·Ag) */
  level: number;
  /** the reading interpolated between the bracketing levels; null when off a sheet */
  rhoFromChart: number | null;
  levels: readonly BiaxialLevelReading[];
}

/** Sheet levels bracketing ν on a grid of `step`. */
export function bracketingLevels(nu: number, step: number): { lower: number; upper: number | null } {
  const k = Math.floor(nu / step + 1e-9);
  const lower = Number((k * step).toFixed(10));
  if (Math.abs(nu - lower) < 1e-9) return { lower, upper: null };
  return { lower, upper: Number(((k + 1) * step).toFixed(10)) };
}

/**
 * Where the ray from the origin through (mx, my) meets a drawn contour, as a multiple of the load's
 * distance (polyline intersection). A first-quadrant contour is read with |mx|, |my|.
 */
export function contourScale(c: BiaxialContour, quadrants: 'first' | 'all', mx: number, my: number): number {
  const x = quadrants === 'first' ? Math.abs(mx) : mx;
  const y = quadrants === 'first' ? Math.abs(my) : my;
  const r = Math.hypot(x, y);
  if (r === 0) return Infinity;
  const n = c.mx.length;
  const segments = quadrants === 'first' ? n - 1 : n;
  for (let i = 0; i < segments; i++) {
    const j = (i + 1) % n;
    const ax = c.mx[i]!;
    const ay = c.my[i]!;
    const bx = c.mx[j]!;
    const by = c.my[j]!;
    // the ray t·(x, y), t ≥ 0, against the segment a + s·(b − a), 0 ≤ s ≤ 1
    const den = x * (by - ay) - y * (bx - ax);
    if (den === 0) continue;
    const t = (ax * (by - ay) - ay * (bx - ax)) / den;
    const s = (ax * y - ay * x) / den;
    if (t > 0 && s >= -1e-12 && s <= 1 + 1e-12) return t;
  }
  return NaN;
}

/** Reads one level's panel along the load's moment direction. */
export function readLevel(family: BiaxialFamily, levelIndex: number, mx: number, my: number): BiaxialLevelReading {
  const level = family.levels[levelIndex]!;
  const drawn = family.contours[levelIndex]!.filter((c) => c.reachable);
  if (drawn.length === 0) return { level, rho: null, position: 'outside-highest' };
  let b = contourScale(drawn[0]!, family.quadrants, mx, my);
  if (b >= 1) return { level, rho: drawn[0]!.rho, position: 'inside-lowest' };
  for (let k = 0; k + 1 < drawn.length; k++) {
    const a = b;
    b = contourScale(drawn[k + 1]!, family.quadrants, mx, my);
    if (a < 1 && b >= 1) {
      const rho = drawn[k]!.rho + ((1 - a) / (b - a)) * (drawn[k + 1]!.rho - drawn[k]!.rho);
      return { level, rho, position: 'between' };
    }
  }
  return { level, rho: null, position: 'outside-highest' };
}

/** Biaxial sheets of one column, computed a level at a time as loads ask for them. */
export class BiaxialCharts {
  readonly step: number;
  readonly rhos: readonly number[];
  private readonly sheets = new Map<number, BiaxialFamily>();
  private readonly unitShape: Shape;
  private readonly area: number;
  private readonly depth: number;
  private readonly width: number;

  constructor(private readonly req: BiaxialChartRequest) {
    this.step = req.axialStep ?? DEFAULT_CHART_AXIAL_STEP;
    this.rhos = chartRhos(req.rhoLimits);
    this.area = grossArea(req.shape);
    this.depth = sectionDepth(req.shape);
    this.width = sectionWidth(req.shape);
    // the sheets are normalised: a unit-depth section of the same proportions
    this.unitShape = req.shape.kind === 'circle' ? { kind: 'circle', diameter: 1 } : { kind: 'rectangle', b: req.shape.b / req.shape.h, h: 1 };
  }

  /** The sheet at one level (cached). */
  sheet(level: number): BiaxialFamily {
    let f = this.sheets.get(level);
    if (!f) {
      const r = this.req;
      f = computeBiaxialFamily({
        basis: r.basis,
        shape: this.unitShape,
        arrangement: r.arrangement,
        gamma: r.gamma,
        ...(r.gammaX !== undefined ? { gammaX: r.gammaX } : {}),
        rhos: this.rhos,
        levels: [level],
        capContext: r.capContext ?? {},
      });
      this.sheets.set(level, f);
    }
    return f;
  }

  /** The reading of a load (internal units): bracketing levels, then linear in ν. */
  read(Pu: number, Mux: number, Muy: number): BiaxialChartReading {
    const nu = Pu / (this.req.basis.normalisingStress * this.area);
    const mx = Mux / (this.area * this.depth);
    const my = Muy / (this.area * this.width);
    const { lower, upper } = bracketingLevels(nu, this.step);
    const lo = readLevel(this.sheet(lower), 0, mx, my);
    if (upper === null) return { level: nu, rhoFromChart: lo.rho, levels: [lo] };
    const hi = readLevel(this.sheet(upper), 0, mx, my);
    const rho = lo.rho === null || hi.rho === null ? null : lo.rho + ((nu - lower) / (upper - lower)) * (hi.rho - lo.rho);
    return { level: nu, rhoFromChart: rho, levels: [lo, hi] };
  }
}
