/**
 * Slender columns braced against sidesway: the shared shapes of one basis's second-order method.
 * Each basis carries its method as `Basis.slenderness` (a `SlendernessMethod` object, its own rulebook:
 * codes/slenderness-*.ts); src/design/slenderness.ts runs it. Nothing branches on a code's name.
 * Pure: no I/O. Depends on section/ and units/ only.
 */
import type { RuleDef } from './rules.js';
import type { Basis } from './types.js';
import type { Bar, Shape } from '../section/types.js';

export const EI_OPTIONS = ['a', 'b', 'c'] as const;
export type EiOption = (typeof EI_OPTIONS)[number];
export const isEiOption = (s: unknown): s is EiOption => EI_OPTIONS.includes(s as EiOption);

/** One bending axis of the column, in the basis's internal units (kip, in, kip·in or N, mm, N·mm). */
export interface SlendernessInput {
  /** effective length kℓu (ACI) or l0 (EN 1992-1-1 5.8.3.2) */
  effectiveLength: number;
  /**
   * Factored end moments. M2 is the larger in magnitude, given positive; M1 the smaller, signed:
   * negative when the column is bent in single curvature, positive in double curvature
   * (ACI 318-19 6.2.5.1 sign convention; M1/M2 = −rm of EN 1992-1-1 5.8.3.1).
   */
  M1: number;
  M2: number;
  /** factored axial load, compression positive */
  Pu: number;
  /** ACI 318-19 6.6.4.4.4: sustained factored axial load ÷ factored axial load, 0–1 */
  betaDns?: number;
  /** ACI 318-19 6.6.4.4.4 (EI)eff option (default a) */
  eiOption?: EiOption;
  /** transverse loads between supports: Cm = 1.0 (ACI 318-19 6.6.4.5.3(b)) */
  transverseLoads?: boolean;
  /**
   * EN 1992-1-1 5.8.4 effective creep ratio φef. When not given, 5.8.3.1(1) takes A = 0.7, and the
   * curvature factor Kφ (5.8.8.3(4)) uses the φef that A = 0.7 stands for, (1/0.7 − 1)/0.2 = 2.14.
   */
  creepRatio?: number;
  /** a sway (unbraced) column: the sway parts of the end moments and the storey data; absent: braced */
  sway?: SwayInput;
}

/**
 * A sway (unbraced) column's data for one axis, internal units. The end moments of `SlendernessInput` are
 * then the non-sway parts (M1ns, M2ns); `effectiveLength` is the unbraced kℓu (EN: l0, or the clear length ℓ
 * when k1 and k2 are given). Which fields a basis reads is its `SwayMethod`'s business.
 */
export interface SwayInput {
  /**
   * Sway parts of the end moments at the ends of M2 and M1, in the internal sign of M1 and M2 (ACI 318-19
   * 6.2.5.1: a moment of the same sign at both ends bends the column in double curvature, as sway does).
   */
  M2s: number;
  M1s: number;
  /** stability index Q of the storey (ACI 318-19 6.6.4.4.1; CSA A23.3-19 10.16.3, from memory) */
  stabilityIndex?: number;
  /** ΣPu (ΣPf, ΣN*) of the storey, with `storeyPc` */
  storeyPu?: number;
  /** ΣPc (ΣNc) of the storey */
  storeyPc?: number;
  /** effective length for the check along the length as if braced, k ≤ 1 (ACI 318-19 6.6.4.6.4); absent: `effectiveLength` (conservative) */
  bracedEffectiveLength?: number;
  /** EN 1992-1-1 5.8.3.2(3) relative flexibilities of the end restraints; with both, `effectiveLength` is the clear length ℓ */
  k1?: number;
  k2?: number;
}

/** What a sway method reads beyond the braced input, for the front ends' checks of what applies. */
export interface SwayInputs {
  /** 'split': M = Mns + δs·Ms (the sway parts are required); 'summed': the first-order moment is Mns + Ms; 'none': no split (sway parts refused) */
  readonly moments: 'split' | 'summed' | 'none';
  /** the stability index Q is read */
  readonly stabilityIndex: boolean;
  /** the storey sums ΣPu, ΣPc are read */
  readonly storeySums: boolean;
  /** one of Q or the storey sums is required */
  readonly needsStorey: boolean;
  /** an effective length as braced is read (the check along the length, or δb) */
  readonly bracedLength: boolean;
  /** the restraint flexibilities k1, k2 with the clear length are read */
  readonly restraint: boolean;
}

/** One basis's method for sway (unbraced) columns: part of its slenderness rulebook. */
export interface SwayMethod {
  /** e.g. 'ACI 318-19 6.6.4.6 moment magnification (sway)' */
  readonly title: string;
  readonly inputs: SwayInputs;
  /** the rules the method applies, with clause and source (part of the basis's `rules`) */
  readonly rules: readonly RuleDef[];
  /** one axis; Pu > 0, `input.sway` present and the input validated */
  check(basis: Basis, section: SlendernessSection, input: SlendernessInput & { sway: SwayInput }, ctx: SlendernessContext): SlendernessResult;
}

/**
 * How the end moments of a method are signed and which flags and load-file columns carry them.
 * ACI 318-19 6.2.5.1: M1/M2 negative in single curvature. EN 1992-1-1 5.8.3.1(1): rm = M01/M02
 * positive when both end moments have the same sign (single curvature).
 */
export interface EndMomentConvention {
  /** flag of the smaller end moment about x, e.g. "--m1" */
  /** field keys of the end moments (front ends map them to flags: m1 → --m1, m01Y → --m01-y) */
  smallerFlag: string;
  largerFlag: string;
  smallerFlagY: string;
  largerFlagY: string;
  /** load-file columns, e.g. "M1", "M2", "M1y", "M2y" */
  columns: readonly [string, string, string, string];
  /** sign of the smaller moment relative to the larger in single curvature */
  singleCurvature: 'opposite-sign' | 'same-sign';
  /** the rule as text with its clause, for help and errors */
  rule: string;
}

export const OPPOSITE_SIGN_END_MOMENTS: EndMomentConvention = {
  smallerFlag: 'm1',
  largerFlag: 'm2',
  smallerFlagY: 'm1Y',
  largerFlagY: 'm2Y',
  columns: ['M1', 'M2', 'M1y', 'M2y'],
  singleCurvature: 'opposite-sign',
  rule: 'M1 negative in single curvature (ACI 318-19 6.2.5.1)',
};

export const SAME_SIGN_END_MOMENTS: EndMomentConvention = {
  smallerFlag: 'm01',
  largerFlag: 'm02',
  smallerFlagY: 'm01Y',
  largerFlagY: 'm02Y',
  columns: ['M01', 'M02', 'M01y', 'M02y'],
  singleCurvature: 'same-sign',
  rule: 'M01 and M02 of the same sign in single curvature, rm = M01/M02 > 0 (EN 1992-1-1 5.8.3.1(1))',
};

/** CSA A23.3-19 10.15.3.2 (from memory): M1/M2 positive in single curvature, the same-sign convention. */
export const CSA_END_MOMENTS: EndMomentConvention = {
  ...SAME_SIGN_END_MOMENTS,
  rule: 'end moments of the same sign in single curvature, M1/M2 > 0 (CSA A23.3-19 10.15.3.2, from memory)',
};

/** AS 3600-2018 10.3.1, 10.4.2 (from memory): M1* ÷ M2* negative in single curvature, as in ACI 318. */
export const AS_END_MOMENTS: EndMomentConvention = {
  ...OPPOSITE_SIGN_END_MOMENTS,
  rule: 'M1* negative in single curvature (AS 3600-2018 10.4.2, from memory)',
};

/**
 * The smaller end moment in pmchart's internal sign (ACI 318-19 6.2.5.1: negative in single curvature)
 * from end moments given in the same-sign convention (EN 1992-1-1 5.8.3.1: M01, M02 with |M02| ≥ |M01|).
 */
export function fromSameSign(M01: number, M02: number): { M1: number; M2: number } {
  const s = M02 < 0 ? -1 : 1;
  return { M1: -M01 * s, M2: Math.abs(M02) };
}

/**
 * EN 1992-1-1 5.8.3.1(1): "if φef is not known, A = 0,7 may be used" (checked against the published
 * text of the clause; the same clause takes rm positive when M01 and M02 give tension on the same side).
 */
export const EN_A_UNKNOWN_CREEP = 0.7;
/** The φef for which A = 1/(1 + 0.2φef) = 0.7, used for Kφ when φef is not given (pmchart's conservative choice). */
export const EN_CREEP_FOR_A_UNKNOWN = (1 / EN_A_UNKNOWN_CREEP - 1) / 0.2;

/** The section seen from the bending axis: depth h in the bending plane, width, bars (centroidal; y toward the compression face). */
export interface SlendernessSection {
  shape: Shape;
  bars: readonly Bar[];
  /**
   * true when the bars only mark positions (no reinforcement chosen yet): their areas give the radius of
   * gyration of the steel (EN 1992-1-1 5.8.8.3(2)) but not its amount, so ω is taken as unknown.
   */
  positionsOnly?: boolean;
}

export interface SlendernessStep {
  /**
   * stable machine key of the figure, the same across methods where the figure means the same:
   * 'r' (radius of gyration, EN i), 'klu-over-r' (the slenderness ratio: kℓu/r, Le/r, EN λ), 'limit' (its limit),
   * 'neglected', 'end-moment-ratio', 'M2min', 'M2-used', 'Cm' / 'km', 'Pc' / 'Nc', 'delta', 'Mc', 'c', 'e2' …
   */
  key: string;
  /** clause of the basis's edition the step applies, e.g. '6.6.4.5.4' */
  clause: string;
  /** what was computed, in words with its clause (for reports; never parsed back) */
  label: string;
  value: number | string | boolean;
  unit?: string;
}

export interface SlendernessResult {
  method: string;
  /** true where the code allows slenderness to be neglected */
  neglected: boolean;
  /** moment magnifier δ (ACI), or MEd ÷ first-order moment (EN) */
  delta: number;
  /** the moment the section check uses, internal units */
  magnifiedMoment: number;
  /** first-order moment M2 the magnifier acts on (after the minimum), internal units */
  firstOrderMoment: number;
  /** false where the column is unstable (Pu ≥ 0.75·Pc) or beyond the 1.4 × first-order limit */
  ok: boolean;
  /** where `ok` is false: the clause of the limit that failed (stability, or the method's own scope) */
  limitClause?: string;
  warnings: string[];
  steps: SlendernessStep[];
}

/** The same section seen for bending about the y axis: b and h swapped, bar x and y swapped. */
export function aboutYAxis(section: SlendernessSection): SlendernessSection {
  const shape: Shape = section.shape.kind === 'rectangle' ? { kind: 'rectangle', b: section.shape.h, h: section.shape.b } : section.shape;
  return { ...section, shape, bars: section.bars.map((b) => ({ x: b.y, y: b.x, area: b.area })) };
}


/**
 * What a method needs from the section analysis that codes/ may not import (analysis/ sits above codes/):
 * the design engine (src/design/slenderness.ts) supplies it.
 */
export interface SlendernessContext {
  /**
   * Nominal moment of the section about the bending axis with the neutral axis at depth c from the
   * compression face (bars y toward the compression face), internal units; magnitude.
   */
  sectionMoment(basis: Basis, shape: Shape, bars: readonly Bar[], c: number): number;
}

/** One basis's second-order method for braced columns, with its end-moment convention and its rules. */
export interface SlendernessMethod {
  /** stable id of the method, e.g. 'moment-magnification-aci318' */
  readonly id: SlendernessMethodId;
  /** e.g. 'ACI 318-19 6.6.4 moment magnification (non-sway)' */
  readonly title: string;
  /** how the end moments are signed and which flags and columns carry them */
  readonly convention: EndMomentConvention;
  /** true where the method needs the sustained-load ratio (βdns, βd) */
  readonly needsSustainedLoadRatio: boolean;
  /** the rules the method applies, with clause and source (part of the basis's `rules`) */
  readonly rules: readonly RuleDef[];
  /** one axis; Pu > 0 and the input already validated */
  check(basis: Basis, section: SlendernessSection, input: SlendernessInput, ctx: SlendernessContext): SlendernessResult;
  /** the method for sway (unbraced) columns; absent: a sway column is outside what pmchart covers for the basis */
  readonly sway?: SwayMethod;
}

/**
 * End moments of one axis as two signed end values (the internal sign of M1, M2) put back in the form the
 * braced methods take: M2 the larger in magnitude, given positive, M1 signed relative to it.
 */
export function asEndPair(a: number, b: number): { M1: number; M2: number } {
  const [big, small] = Math.abs(a) >= Math.abs(b) ? [a, b] : [b, a];
  const s = big < 0 ? -1 : 1;
  return { M2: Math.abs(big), M1: small * s || 0 };
}

/** A copy of the steps of an inner run (the check along the length, δb) with keys and labels marked. */
export function nestedSteps(steps: readonly SlendernessStep[], keyPrefix: string, labelPrefix: string): SlendernessStep[] {
  return steps.map((st) => ({ ...st, key: `${keyPrefix}${st.key}`, label: `${labelPrefix}${st.label}` }));
}

export const SLENDERNESS_METHODS = ['moment-magnification-aci318', 'nominal-curvature-en1992', 'moment-magnification-as3600', 'moment-magnification-csa-a23'] as const;
export type SlendernessMethodId = (typeof SLENDERNESS_METHODS)[number];

export const depthOf = (s: Shape): number => (s.kind === 'rectangle' ? s.h : s.diameter);
export const grossI = (s: Shape): number => (s.kind === 'rectangle' ? (s.b * s.h ** 3) / 12 : (Math.PI * s.diameter ** 4) / 64);
export const grossA = (s: Shape): number => (s.kind === 'rectangle' ? s.b * s.h : (Math.PI * s.diameter ** 2) / 4);
