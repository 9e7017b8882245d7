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
import { aboutYAxis, endMomentConvention, fromSameSign, slendernessCheck, type EiOption, type SlendernessInput, type SlendernessResult, type SwayInput } from './slenderness.js';

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
  /** sway parts of the end moments (a sway column): M2s, M1s in the sign of M1, M2 (ACI 318-19 6.6.4.6.1); M02s, M01s in the sign of M01, M02 */
  M2s?: number;
  M1s?: number;
  M2sy?: number;
  M1sy?: number;
  M02s?: number;
  M01s?: number;
  M02sy?: number;
  M01sy?: number;
  /** this load's storey data (a sway column), replacing the member's: stability index Q, or ΣPu with ΣPc */
  Q?: number;
  storeyPu?: number;
  storeyPc?: number;
}

/**
 * A sway column's member data (the same for both axes unless `y` gives its own): the storey and restraint data
 * of `SwayInput` without the sway moments, which come per load. A load's Q or storey sums replace the member's.
 */
export type SwayMember = Omit<SwayInput, 'M2s' | 'M1s'>;

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
  /** a sway (unbraced) column: `effectiveLength` is then the unbraced kℓu; absent: braced */
  sway?: SwayMember;
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
  const memberY = req.y ?? req.x;
  const swayX = swayOf(basis, req.x, load, load.M2s, load.M1s, load.M02s, load.M01s, load.M02, '', true);
  const swayY = swayOf(basis, memberY, load, load.M2sy, load.M1sy, load.M02sy, load.M01sy, load.M02y, 'Y', load.Muy !== 0);
  const x = slendernessCheck(basis, sec, { ...member(req.x, swayX), ...beta, Pu: load.Pu, M2: m2x, M1: ex.M1 ?? -m2x });
  const sign = (m: number) => (m < 0 ? -1 : 1);
  const m2y = ey.M2 ?? Math.abs(load.Muy);
  const y = slendernessCheck(basis, secY, { ...member(memberY, swayY), ...beta, Pu: load.Pu, M2: m2y, M1: ey.M1 ?? -m2y });
  // the accidental part alone: the same method with no end moments (M1 = M2 = 0)
  const accidental = (r: SlendernessResult, m2: number, run: () => SlendernessResult): AxisMinimum => {
    const z = m2 === 0 ? r : run();
    const firstOrder = z.neglected ? 0 : z.firstOrderMoment;
    const moment = z.neglected ? 0 : z.magnifiedMoment;
    return { given: m2, firstOrder, moment, governs: moment > 0 && Number.isFinite(r.magnifiedMoment) && moment >= r.magnifiedMoment * (1 - 1e-9) };
  };
  // the accidental part of a sway column: no end moments at all, neither non-sway nor sway
  const still = (w: SwayInput | undefined): SwayInput | undefined => (w ? { ...w, M2s: 0, M1s: 0 } : undefined);
  const minimum = {
    x: accidental(x, m2x + Math.abs(swayX?.M2s ?? 0), () => slendernessCheck(basis, sec, { ...member(req.x, still(swayX)), ...beta, Pu: load.Pu, M2: 0, M1: -0 })),
    y: accidental(y, m2y + Math.abs(swayY?.M2s ?? 0), () => slendernessCheck(basis, secY, { ...member(memberY, still(swayY)), ...beta, Pu: load.Pu, M2: 0, M1: -0 })),
  };
  return { Mux: sign(load.Mux) * x.magnifiedMoment, Muy: sign(load.Muy) * y.magnifiedMoment, x, y, minimum };
}

/** The member data of one axis as the method's input (the sway data replaced by this load's). */
function member(m: AxisMember, sway: SwayInput | undefined): Omit<SlendernessInput, 'Pu' | 'M1' | 'M2'> {
  const { sway: _member, ...rest } = m;
  return { ...rest, ...(sway ? { sway } : {}) };
}

/**
 * One axis's sway data for one load: the sway parts in the internal sign and the storey data, the load's
 * replacing the member's. Sway parts in the same-sign convention (M02s, M01s) are turned with the sign of the
 * non-sway M02, as `fromSameSign` turns the non-sway pair. Not given, M1s defaults to equal moments in reverse
 * curvature (M1s = M2s in the internal sign, M01s = −M02s): the shape a storey's sway bends its columns in.
 * A method that takes the sway parts ('split' or 'summed') needs M2s (about y only where the load has a moment about y:
 * bending about y with no Muy has no sway part); one that has no split takes none.
 */
function swayOf(
  basis: Basis,
  m: AxisMember,
  load: EndMoments,
  M2s: number | undefined,
  M1s: number | undefined,
  M02s: number | undefined,
  M01s: number | undefined,
  M02: number | undefined,
  axis: '' | 'Y',
  required: boolean,
): SwayInput | undefined {
  const w = m.sway;
  if (!w) {
    const given = [M2s, M1s, M02s, M01s].some((v) => v !== undefined) || load.Q !== undefined || load.storeyPu !== undefined || load.storeyPc !== undefined;
    if (given) throw new PmError(ERROR_CODES.conflict, 'sway', 'is required for sway moments or storey data (M2s, M02s, Q, storeyPu, storeyPc): the column is braced without it');
    return undefined;
  }
  const conv = endMomentConvention(basis);
  let m2s: number | undefined;
  let m1s: number | undefined;
  if (M02s !== undefined || M01s !== undefined) {
    if (M02s === undefined) throw new PmError(ERROR_CODES.missing, `m02Sway${axis}`, 'is required with M01s (the sway part at the end of M02)');
    const s = M02 !== undefined && M02 < 0 ? -1 : 1;
    m2s = M02s * s;
    m1s = -(M01s ?? -M02s) * s || 0;
  } else if (M2s !== undefined || M1s !== undefined) {
    if (M2s === undefined) throw new PmError(ERROR_CODES.missing, `m2Sway${axis}`, 'is required with M1s (the sway part at the end of M2)');
    m2s = M2s;
    m1s = M1s ?? M2s;
  }
  const needs = basis.slenderness?.sway?.inputs.moments;
  // 'summed' too: the flags say --mu is the non-sway part, so a sway part left out is a wind moment forgotten, not 0
  if (m2s === undefined && needs !== undefined && needs !== 'none' && required) {
    throw new PmError(ERROR_CODES.missing, `${conv.largerFlag}Sway${axis}`, `is required with --sway (the sway part of the end moment, 0 where the load has none; a ${conv.largerFlag === 'm2' ? 'M2s' : 'M02s'}${axis === 'Y' ? 'y' : ''} column in --loads)`);
  }
  const storey = load.Q !== undefined || load.storeyPu !== undefined || load.storeyPc !== undefined;
  return {
    M2s: m2s ?? 0,
    M1s: m1s ?? 0,
    ...(storey
      ? { ...(load.Q !== undefined ? { stabilityIndex: load.Q } : {}), ...(load.storeyPu !== undefined ? { storeyPu: load.storeyPu } : {}), ...(load.storeyPc !== undefined ? { storeyPc: load.storeyPc } : {}) }
      : { ...(w.stabilityIndex !== undefined ? { stabilityIndex: w.stabilityIndex } : {}), ...(w.storeyPu !== undefined ? { storeyPu: w.storeyPu } : {}), ...(w.storeyPc !== undefined ? { storeyPc: w.storeyPc } : {}) }),
    ...(w.bracedEffectiveLength !== undefined ? { bracedEffectiveLength: w.bracedEffectiveLength } : {}),
    ...(w.k1 !== undefined ? { k1: w.k1 } : {}),
    ...(w.k2 !== undefined ? { k2: w.k2 } : {}),
  };
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
