/**
 * A section reduced to unit depth with bars for ρg = 1, ready for fast normalised evaluation.
 *
 * Speed lever: at a fixed neutral-axis depth c, P and M are affine in ρg —
 *   P(ρg, c) = Pc(c) + ρg·Ps(c),  M(ρg, c) = Mc(c) + ρg·Ms(c)
 * (concrete part plus ρg times the unit-steel part), and φ depends on c alone.
 * So one sweep in c serves a whole family of ρg curves.
 */
import type { Basis, CapContext, ResistanceModel } from '../codes/types.js';
import { grossArea, sectionDepth, unitShape } from '../section/geometry.js';
import type { Bar, Shape } from '../section/types.js';
import { barResultant, concreteResultant, extremeTensionDepth, tensionStrain } from './section-forces.js';

/** Slots of a response vector. */
export const R = {
  epsT: 0,
  factor: 1,
  PcN: 2,
  McN: 3,
  PsN: 4,
  MsN: 5,
  PcD: 6,
  McD: 7,
  PsD: 8,
  MsD: 9,
} as const;
export const RESPONSE_SIZE = 10;

export type ModelKind = 'nominal' | 'design';

export interface PreparedSection {
  readonly basis: Basis;
  /** the shape at unit depth */
  readonly shape: Shape;
  /** bars at unit depth whose areas add up to Ag (ρg = 1) */
  readonly bars: readonly Bar[];
  /** extreme-tension-bar depth over h */
  readonly dt: number;
  /** gross area of the unit shape (1·b/h for rectangles, π/4 for circles) */
  readonly area: number;
  /** fills `out` with the normalised response at neutral-axis depth c/h */
  respond(cOverH: number, out?: Float64Array): Float64Array;
  /** Po/Ag of a model at ρg */
  squash(kind: ModelKind, rho: number): number;
  /** axial cap /Ag of a model at ρg (Infinity where none) */
  cap(kind: ModelKind, rho: number): number;
}

/**
 * Prepares a section. `bars` may be at any scale: they are rescaled to unit depth and to a total
 * area equal to Ag, keeping their pattern.
 */
export function prepareSection(basis: Basis, shape: Shape, bars: readonly Bar[], capContext: CapContext = {}): PreparedSection {
  const depth = sectionDepth(shape);
  const u = unitShape(shape);
  const area = grossArea(u);
  const totalBarArea = bars.reduce((s, b) => s + b.area, 0);
  const unitBars: Bar[] = bars.map((b) => ({ x: b.x / depth, y: b.y / depth, area: (b.area / totalBarArea) * area }));
  const dt = extremeTensionDepth(u, unitBars);
  const { nominal, design } = basis;
  const sameLaws = nominal.concrete === design.concrete && nominal.steel === design.steel;
  const capFactor = { nominal: nominal.capFactor(capContext), design: design.capFactor(capContext) };

  const partial = (model: ResistanceModel, cOverH: number, out: Float64Array, at: number): void => {
    const p = basis.profile(cOverH, 1, dt);
    const c = concreteResultant(u, model.concrete, p);
    const s = barResultant(unitBars, 1, model.steel, model.concrete, p);
    out[at] = c.P / area;
    out[at + 1] = c.M / area;
    out[at + 2] = s.P / area;
    out[at + 3] = s.M / area;
  };

  const modelOf = (kind: ModelKind): ResistanceModel => (kind === 'nominal' ? nominal : design);

  return {
    basis,
    shape: u,
    bars: unitBars,
    dt,
    area,
    respond(cOverH: number, out = new Float64Array(RESPONSE_SIZE)): Float64Array {
      const epsT = tensionStrain(basis.profile(cOverH, 1, dt), dt);
      if (basis.linearTransitionToSquash && cOverH > dt) {
        // AS 3600-2018 10.6.2.3: straight line from the decompression point (c = dt) to the squash load
        this.respond(dt, out);
        const t = Number.isFinite(cOverH) ? 1 - dt / cOverH : 1;
        blendToSquash(out, R.PcN, t, nominal);
        blendToSquash(out, R.PcD, t, design);
        out[R.epsT] = epsT;
        out[R.factor] = design.factor(epsT);
        return out;
      }
      out[R.epsT] = epsT;
      out[R.factor] = design.factor(epsT);
      partial(nominal, cOverH, out, R.PcN);
      if (sameLaws) {
        out[R.PcD] = out[R.PcN]!;
        out[R.McD] = out[R.McN]!;
        out[R.PsD] = out[R.PsN]!;
        out[R.MsD] = out[R.MsN]!;
      } else {
        partial(design, cOverH, out, R.PcD);
      }
      return out;
    },
    squash(kind: ModelKind, rho: number): number {
      const sq = modelOf(kind).squash;
      return sq.concreteStress * (1 - rho) + sq.steelStress * rho;
    },
    cap(kind: ModelKind, rho: number): number {
      const f = capFactor[kind];
      return Number.isFinite(f) ? f * this.squash(kind, rho) : Infinity;
    },
  };
}

/**
 * Moves the four slots (Pc, Mc, Ps, Ms) at `at` a fraction t of the way to the model's squash load,
 * Po/Ag = concreteStress + ρ·(steelStress − concreteStress) with no moment.
 */
function blendToSquash(out: Float64Array, at: number, t: number, model: ResistanceModel): void {
  const sq = model.squash;
  out[at] = (1 - t) * out[at]! + t * sq.concreteStress;
  out[at + 1] = (1 - t) * out[at + 1]!;
  out[at + 2] = (1 - t) * out[at + 2]! + t * (sq.steelStress - sq.concreteStress);
  out[at + 3] = (1 - t) * out[at + 3]!;
}

/** Nominal (Pn, Mn) at ρg from a response vector. */
export const nominalAt = (r: Float64Array, rho: number): [number, number] => [r[R.PcN]! + rho * r[R.PsN]!, r[R.McN]! + rho * r[R.MsN]!];

/** Factored (φPn, φMn) at ρg from a response vector, before the axial cap. */
export function designAt(r: Float64Array, rho: number): [number, number] {
  const f = r[R.factor]!;
  return [f * (r[R.PcD]! + rho * r[R.PsD]!), f * (r[R.McD]! + rho * r[R.MsD]!)];
}
