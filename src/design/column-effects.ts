/**
 * What `pmchart check` adds beyond the uniaxial short-column check, pure (no I/O):
 *
 *   loads ─▶ slenderness (per axis, the basis's method) ─▶ magnified Mux, Muy ─▶ uniaxial check (check.ts)
 *                                                                     └──────▶ biaxial check, three methods
 *
 * Loads are in internal units (kip, kip·in or N, N·mm).
 */
import { prepareBiaxial, type BiaxialSection } from '../analysis/biaxial.js';
import type { Basis, CapContext } from '../codes/types.js';
import { ERROR_CODES, PmError } from '../errors.js';
import type { Bar, Shape } from '../section/types.js';
import { checkBiaxial, type BiaxialResult } from './biaxial.js';
import { aboutYAxis, fromSameSign, slendernessCheck, type EiOption, type SlendernessResult } from './slenderness.js';

/**
 * End moments of one load for the slenderness check; each defaults as described in `magnifyLoad`.
 * M1, M2 follow ACI 318-19 6.2.5.1 (M1 negative in single curvature); M01, M02 follow EN 1992-1-1
 * 5.8.3.1 (same sign in single curvature). A load gives one pair per axis, in its basis's convention.
 */
export interface EndMoments {
  M1?: number;
  M2?: number;
  M1y?: number;
  M2y?: number;
  M01?: number;
  M02?: number;
  M01y?: number;
  M02y?: number;
}

/** One axis's end moments in the internal (opposite-sign) convention, or undefined where not given. */
function endPair(M1: number | undefined, M2: number | undefined, M01: number | undefined, M02: number | undefined): { M1?: number; M2?: number } {
  if (M01 !== undefined || M02 !== undefined) {
    if (M02 === undefined) throw new PmError(ERROR_CODES.missing, 'm02', 'is required with M01 (the larger end moment, with its sign)');
    return fromSameSign(M01 ?? M02, M02);
  }
  return { ...(M1 !== undefined ? { M1 } : {}), ...(M2 !== undefined ? { M2 } : {}) };
}

/** Member data for one bending axis. */
export interface AxisMember {
  effectiveLength: number;
  betaDns?: number;
  eiOption?: EiOption;
  transverseLoads?: boolean;
  creepRatio?: number;
}

export interface SlendernessRequest {
  /** bending about x (the depth h) */
  x: AxisMember;
  /** bending about y (the width b); defaults to x's member data */
  y?: AxisMember;
}

export interface MagnifiedLoad {
  Mux: number;
  Muy: number;
  x: SlendernessResult;
  /** bending about y: always checked (klu-y defaults to klu), with Muy = 0 when the load has none */
  y: SlendernessResult | null;
  /** the accidental part of each axis's moment: what the method gives with no end moments (the minimum moment, magnified) */
  minimum: { readonly x: AxisMinimum; readonly y: AxisMinimum };
}

/** The minimum (accidental) moment of one axis, as the slenderness method applies it. */
export interface AxisMinimum {
  /** the larger first-order end moment the method took from the load (M2 given, or |Mu|) */
  given: number;
  /** the first-order moment the method takes with no end moments given (ACI 318-19 6.6.4.5.4 M2,min; EN 1992-1-1 NEd·max(ei, e0)); 0 where slenderness is neglected */
  firstOrder: number;
  /** the same after the method (magnified) */
  moment: number;
  /** the minimum governs the axis's moment (it is at least the moment from the given end moments): its sign is free */
  governs: boolean;
}

/**
 * Second-order moments about each axis separately (ACI 318-19 6.6.4: each axis magnified for its own
 * conditions, common practice). Both axes are always checked: bending about y with Muy = 0 when the load
 * has none, with y member data defaulting to x's (a minimum moment acts about one axis at a time,
 * ACI 318-19 R6.6.4.5.4, EN 1992-1-1 5.8.9). M2 defaults to |Mu| about that axis; M1 defaults to −M2
 * (equal end moments in single curvature, M1/M2 = −1, the most severe case: Cm = 1.0). Signs of Mux and
 * Muy are kept. M01 without M02 is refused; M02 alone means equal end moments in single curvature (M01 = M02).
 * `positionsOnly`: the bars mark positions from γ and the arrangement, not a chosen reinforcement.
 */
export function magnifyLoad(
  basis: Basis,
  shape: Shape,
  bars: readonly Bar[],
  load: { Pu: number; Mux: number; Muy: number; betaDns?: number } & EndMoments,
  req: SlendernessRequest,
  positionsOnly = false,
): MagnifiedLoad {
  const sec = { shape, bars, positionsOnly };
  const secY = aboutYAxis(sec);
  // a load's own sustained-load ratio replaces the member's (a schedule's loads file may give it per combination)
  const beta = load.betaDns !== undefined ? { betaDns: load.betaDns } : {};
  const ex = endPair(load.M1, load.M2, load.M01, load.M02);
  const ey = endPair(load.M1y, load.M2y, load.M01y, load.M02y);
  const m2x = ex.M2 ?? Math.abs(load.Mux);
  const x = slendernessCheck(basis, sec, { ...req.x, ...beta, Pu: load.Pu, M2: m2x, M1: ex.M1 ?? -m2x });
  const sign = (m: number) => (m < 0 ? -1 : 1);
  const m2y = ey.M2 ?? Math.abs(load.Muy);
  const memberY = req.y ?? req.x;
  const y = slendernessCheck(basis, secY, { ...memberY, ...beta, Pu: load.Pu, M2: m2y, M1: ey.M1 ?? -m2y });
  // the accidental part alone: the same method with no end moments (M1 = M2 = 0)
  const accidental = (r: SlendernessResult, m2: number, run: () => SlendernessResult): AxisMinimum => {
    const z = m2 === 0 ? r : run();
    const firstOrder = z.neglected ? 0 : z.firstOrderMoment;
    const moment = z.neglected ? 0 : z.magnifiedMoment;
    return { given: m2, firstOrder, moment, governs: moment > 0 && Number.isFinite(r.magnifiedMoment) && moment >= r.magnifiedMoment * (1 - 1e-9) };
  };
  const minimum = {
    x: accidental(x, m2x, () => slendernessCheck(basis, sec, { ...req.x, ...beta, Pu: load.Pu, M2: 0, M1: -0 })),
    y: accidental(y, m2y, () => slendernessCheck(basis, secY, { ...memberY, ...beta, Pu: load.Pu, M2: 0, M1: -0 })),
  };
  return { Mux: sign(load.Mux) * x.magnifiedMoment, Muy: sign(load.Muy) * y.magnifiedMoment, x, y, minimum };
}

/** The actual bars of a checked reinforcement, ready for the biaxial surface. */
export function biaxialSectionFor(basis: Basis, shape: Shape, bars: readonly Bar[], capContext: CapContext = {}): BiaxialSection {
  if (bars.length === 0) throw new PmError(ERROR_CODES.missing, 'rho', 'or a bar layout is required for the biaxial check');
  return prepareBiaxial(basis, shape, bars, capContext);
}

/** Biaxial check of one load (moments already magnified where asked). */
export function biaxialFor(sec: BiaxialSection, Pu: number, Mux: number, Muy: number): BiaxialResult {
  return checkBiaxial(sec, { Pu, Mux, Muy });
}
