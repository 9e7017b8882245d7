/**
 * Slender columns braced against sidesway: the second-order moment for one bending axis.
 *   - ACI 318-19 6.6.4 moment magnification (non-sway), with the neglect test of 6.2.5.1 and the
 *     1.4 × first-order limit of 6.2.5.3;
 *   - EN 1992-1-1 5.8.8 nominal curvature, with the slenderness limit of 5.8.3.1.
 * The basis names its method (`Basis.slendernessMethod`); nothing here branches on a code's name.
 * Every step is kept in the result for the report. Pure: no I/O.
 */
import { biaxialResultant, prepareBiaxial } from '../analysis/biaxial.js';
import type { Basis } from '../codes/types.js';
import { ERROR_CODES, PmError } from '../errors.js';
import type { Bar, Shape } from '../section/types.js';
import { lengthToMm, stressToMPa, systemFactor, type UnitSystem } from '../units/index.js';

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

/** The end-moment convention of the basis's slenderness method (opposite-sign where it declares none). */
export function endMomentConvention(basis: Basis): EndMomentConvention {
  switch (basis.slendernessMethod) {
    case 'nominal-curvature-en1992':
      return SAME_SIGN_END_MOMENTS;
    case 'moment-magnification-csa-a23':
      return CSA_END_MOMENTS;
    case 'moment-magnification-as3600':
      return AS_END_MOMENTS;
    default:
      return OPPOSITE_SIGN_END_MOMENTS;
  }
}

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
  /** what was computed, with its clause */
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

/** Runs the method the basis declares. */
export function slendernessCheck(basis: Basis, section: SlendernessSection, input: SlendernessInput): SlendernessResult {
  validate(input, endMomentConvention(basis));
  if (!(input.Pu > 0)) {
    return {
      method: 'no axial compression',
      neglected: true,
      delta: 1,
      magnifiedMoment: input.M2,
      firstOrderMoment: input.M2,
      ok: true,
      warnings: [],
      steps: [{ label: 'Pu ≤ 0: no axial compression, so no member second-order moment', value: input.Pu }],
    };
  }
  switch (basis.slendernessMethod) {
    case 'moment-magnification-aci318':
      return aciMomentMagnification(basis, section, input);
    case 'nominal-curvature-en1992':
      return enNominalCurvature(basis, section, input);
    case 'moment-magnification-as3600':
      return as3600MomentMagnification(basis, section, input);
    case 'moment-magnification-csa-a23':
      return csaMomentMagnification(basis, section, input);
    default:
      throw new PmError(ERROR_CODES.notPossible, 'klu', `is not supported: ${basis.title} declares no slenderness method in pmchart`);
  }
}

function validate(i: SlendernessInput, conv: EndMomentConvention): void {
  if (!(i.effectiveLength > 0)) throw new PmError(ERROR_CODES.outOfRange, 'klu', 'must be greater than 0', { value: i.effectiveLength });
  if (!(i.M2 >= 0)) throw new PmError(ERROR_CODES.outOfRange, conv.largerFlag, 'must be ≥ 0 (the larger end moment, given positive)', { value: i.M2 });
  if (Math.abs(i.M1) > i.M2 * (1 + 1e-9)) throw new PmError(ERROR_CODES.outOfRange, conv.smallerFlag, `must not exceed ${conv.columns[1]} in magnitude`, { value: i.M1 });
  if (i.betaDns !== undefined && !(i.betaDns >= 0 && i.betaDns <= 1)) throw new PmError(ERROR_CODES.outOfRange, 'betaDns', 'is outside 0–1', { value: i.betaDns, allowed: '0–1' });
  if (i.creepRatio !== undefined && !(i.creepRatio >= 0 && i.creepRatio <= 5)) throw new PmError(ERROR_CODES.outOfRange, 'creep', 'is outside 0–5', { value: i.creepRatio, allowed: '0–5' });
}

const depthOf = (s: Shape): number => (s.kind === 'rectangle' ? s.h : s.diameter);
const grossI = (s: Shape): number => (s.kind === 'rectangle' ? (s.b * s.h ** 3) / 12 : (Math.PI * s.diameter ** 4) / 64);
const grossA = (s: Shape): number => (s.kind === 'rectangle' ? s.b * s.h : (Math.PI * s.diameter ** 2) / 4);

/** ACI 318-19 19.2.2.1(b): Ec = 57,000·√f′c psi, or 4700·√f′c MPa (normalweight concrete). */
export function aciEc(fc: number, units: UnitSystem): number {
  return units === 'us' ? (57_000 * Math.sqrt(fc * 1000)) / 1000 : 4700 * Math.sqrt(fc);
}

/**
 * ACI 318-19 6.6.4 non-sway moment magnification for one axis.
 * 6.2.5.1(b): neglect when kℓu/r ≤ 34 + 12(M1/M2) ≤ 40; 6.2.5.2: r = 0.30h (rectangle), 0.25D (circle);
 * 6.6.4.4.4 (EI)eff (a) 0.4EcIg/(1+βdns), (b) (0.2EcIg + EsIse)/(1+βdns), (c) EcI/(1+βdns) with I from
 * Table 6.6.3.1.1(b); 6.6.4.4.2 Pc = π²(EI)eff/(kℓu)²; 6.6.4.5.3 Cm = 0.6 − 0.4(M1/M2) (1.0 with
 * transverse loads); 6.6.4.5.2 δ = Cm/(1 − Pu/(0.75Pc)) ≥ 1; 6.6.4.5.4 M2,min = Pu(0.6 + 0.03h) in.
 * (15 + 0.03h mm); 6.2.5.3 second-order Mu ≤ 1.4 × first-order Mu.
 */
export function aciMomentMagnification(basis: Basis, section: SlendernessSection, input: SlendernessInput): SlendernessResult {
  const { units } = basis;
  const lu = units === 'us' ? 'in' : 'mm';
  const fu = units === 'us' ? 'kip' : 'N';
  const mu = units === 'us' ? 'kip·in' : 'N·mm';
  const su = units === 'us' ? 'ksi' : 'MPa';
  const steps: SlendernessStep[] = [];
  const warnings: string[] = [];
  const { shape, bars } = section;
  const h = depthOf(shape);
  const { effectiveLength: klu, M1, M2, Pu } = input;
  // no end moment (M2 = 0): the single-curvature default M1/M2 = −1 (README; the most severe case, conservative)
  const ratio = M2 > 0 ? M1 / M2 : -1;

  const r = shape.kind === 'rectangle' ? 0.3 * h : 0.25 * h;
  steps.push({ label: `r = ${shape.kind === 'rectangle' ? '0.30·h' : '0.25·D'} (6.2.5.2)`, value: r, unit: lu });
  const slenderness = klu / r;
  steps.push({ label: 'kℓu/r', value: slenderness });
  steps.push({ label: 'M1/M2 (negative in single curvature, 6.2.5.1)', value: ratio });
  const limit = Math.min(34 + 12 * ratio, 40);
  steps.push({ label: 'limit 34 + 12(M1/M2) ≤ 40 (6.2.5.1(b))', value: limit });
  const neglected = slenderness <= limit * (1 + 1e-12); // equal counts as within (floating-point rounding)
  steps.push({ label: 'slenderness may be neglected (6.2.5.1)', value: neglected });
  if (neglected) {
    return { method: 'ACI 318-19 6.6.4 moment magnification (non-sway)', neglected, delta: 1, magnifiedMoment: M2, firstOrderMoment: M2, ok: true, warnings, steps };
  }

  const Ec = aciEc(basis.fc, units);
  const Es = basis.Es;
  const Ig = grossI(shape);
  const Ag = grossA(shape);
  const Ast = bars.reduce((s, b) => s + b.area, 0);
  const Ise = bars.reduce((s, b) => s + b.area * b.y * b.y, 0);
  const beta = input.betaDns ?? 0;
  const option = input.eiOption ?? 'a';
  steps.push({ label: 'Ec = 57,000√f′c psi / 4700√f′c MPa (19.2.2.1(b))', value: Ec, unit: su });
  steps.push({ label: 'Ig', value: Ig, unit: `${lu}⁴` });
  steps.push({ label: 'βdns (6.6.4.4.4)', value: beta });

  // M2,min (6.6.4.5.4) and the moment the magnifier acts on
  const hIn = units === 'us' ? h : h / 25.4;
  const M2min = units === 'us' ? Pu * (0.6 + 0.03 * hIn) : Pu * (15 + 0.03 * h);
  steps.push({ label: units === 'us' ? 'M2,min = Pu(0.6 + 0.03h), h in in. (6.6.4.5.4)' : 'M2,min = Pu(15 + 0.03h), h in mm (6.6.4.5.4)', value: M2min, unit: mu });
  const minimumGoverns = M2min > M2;
  const M2c = Math.max(M2, M2min);
  steps.push({ label: 'M2 used = max(M2, M2,min)', value: M2c, unit: mu });

  let EI: number;
  if (option === 'a') {
    EI = (0.4 * Ec * Ig) / (1 + beta);
    steps.push({ label: '(EI)eff = 0.4·Ec·Ig/(1 + βdns) (6.6.4.4.4(a))', value: EI, unit: `${fu}·${lu}²` });
  } else if (option === 'b') {
    steps.push({ label: 'Ise = Σ As·y² about the centroidal axis', value: Ise, unit: `${lu}⁴` });
    steps.push({ label: 'Es', value: Es, unit: su });
    EI = (0.2 * Ec * Ig + Es * Ise) / (1 + beta);
    steps.push({ label: '(EI)eff = (0.2·Ec·Ig + Es·Ise)/(1 + βdns) (6.6.4.4.4(b))', value: EI, unit: `${fu}·${lu}²` });
  } else {
    const Po = basis.nominal.squash.concreteStress * (Ag - Ast) + basis.nominal.squash.steelStress * Ast;
    steps.push({ label: 'Po = 0.85f′c(Ag − Ast) + fy·Ast (22.4.2.2)', value: Po, unit: fu });
    steps.push({ label: 'Ast/Ag', value: Ast / Ag });
    const raw = (0.8 + (25 * Ast) / Ag) * (1 - M2c / (Pu * h) - (0.5 * Pu) / Po) * Ig;
    const I = Math.min(0.875 * Ig, Math.max(0.35 * Ig, raw));
    steps.push({ label: 'I = (0.80 + 25Ast/Ag)(1 − Mu/(Pu·h) − 0.5Pu/Po)·Ig, Mu = M2 used (Table 6.6.3.1.1(b))', value: raw, unit: `${lu}⁴` });
    steps.push({ label: 'I within 0.35Ig ≤ I ≤ 0.875Ig', value: I, unit: `${lu}⁴` });
    EI = (Ec * I) / (1 + beta);
    steps.push({ label: '(EI)eff = Ec·I/(1 + βdns) (6.6.4.4.4(c))', value: EI, unit: `${fu}·${lu}²` });
  }
  const Pc = (Math.PI ** 2 * EI) / (klu * klu);
  steps.push({ label: 'Pc = π²(EI)eff/(kℓu)² (6.6.4.4.2)', value: Pc, unit: fu });

  let Cm: number;
  if (input.transverseLoads) {
    Cm = 1;
    steps.push({ label: 'Cm = 1.0, transverse loads between supports (6.6.4.5.3(b))', value: Cm });
  } else if (minimumGoverns) {
    Cm = 1;
    steps.push({ label: 'Cm = 1.0 since M2,min governs (6.6.4.5.4)', value: Cm });
  } else {
    Cm = 0.6 - 0.4 * ratio;
    steps.push({ label: 'Cm = 0.6 − 0.4(M1/M2) (6.6.4.5.3(a))', value: Cm });
  }

  const stable = Pu < 0.75 * Pc;
  const raw = stable ? Cm / (1 - Pu / (0.75 * Pc)) : Infinity;
  const delta = Math.max(1, raw);
  steps.push({ label: 'Pu/(0.75·Pc)', value: Pu / (0.75 * Pc) });
  steps.push({ label: 'δ = Cm/(1 − Pu/(0.75Pc)) ≥ 1.0 (6.6.4.5.2)', value: delta });
  if (!stable) warnings.push('Pu ≥ 0.75·Pc: the column is unstable by 6.6.4.5.2; enlarge the section or brace it');
  const magnified = delta * M2c;
  steps.push({ label: 'Mc = δ·M2 (6.6.4.5.1)', value: magnified, unit: mu });
  const secondOrderRatio = magnified / M2c;
  const within = secondOrderRatio <= 1.4;
  steps.push({ label: 'Mc ÷ first-order M2 ≤ 1.4 (6.2.5.3)', value: secondOrderRatio });
  if (stable && !within) warnings.push('second-order moment exceeds 1.4 × the first-order moment (6.2.5.3); the column is too slender for this method');
  return {
    method: 'ACI 318-19 6.6.4 moment magnification (non-sway)',
    neglected: false,
    delta,
    magnifiedMoment: magnified,
    firstOrderMoment: M2c,
    ok: stable && within,
    ...(!stable ? { limitClause: 'ACI 318-19 6.6.4.5.2 (Pu ≥ 0.75·Pc)' } : !within ? { limitClause: 'ACI 318-19 6.2.5.3 (second-order moment ≤ 1.4 × first-order)' } : {}),
    warnings,
    steps,
  };
}

/**
 * EN 1992-1-1 5.8.8 nominal curvature for one axis (SI internal units N, mm; formulas in MPa and mm).
 * 5.8.3.1 Eq. 5.13N λlim = 20·A·B·C/√n with A = 1/(1 + 0.2φef) (0.7 when φef is not known), B = √(1 + 2ω), C = 1.7 − rm;
 * 5.2(7) imperfection ei = l0/400 (5.2(9) Note, recommended θi); 6.1(4) e0 = max(h/30, 20 mm);
 * 5.8.8.2(2) Eq. 5.32 M0e = 0.6M02 + 0.4M01 ≥ 0.4M02; 5.8.8.3 Eq. 5.34–5.37: 1/r = Kr·Kφ·εyd/(0.45d),
 * Kr = (nu − n)/(nu − nbal) ≤ 1, nbal = 0.4, Kφ = 1 + β·φef ≥ 1, β = 0.35 + fck/200 − λ/150;
 * Eq. 5.33 e2 = (1/r)·l0²/c with c = 10; Eq. 5.31 MEd = M0Ed + NEd·e2.
 */
export function enNominalCurvature(basis: Basis, section: SlendernessSection, input: SlendernessInput): SlendernessResult {
  const units = basis.units;
  const L = (x: number) => lengthToMm(x, units);
  const F = (x: number) => x * systemFactor('force', units, 'si');
  const Mback = (x: number) => x / systemFactor('moment', units, 'si');
  const steps: SlendernessStep[] = [];
  const warnings: string[] = [];
  const { shape, bars } = section;
  const h = L(depthOf(shape));
  const Ac = grossA(shape) * systemFactor('length', units, 'si') ** 2;
  const reinforcementKnown = section.positionsOnly !== true;
  const As = reinforcementKnown ? bars.reduce((s, b) => s + b.area, 0) * systemFactor('length', units, 'si') ** 2 : 0;
  const fcd = stressToMPa(basis.normalisingStress, units);
  const fyd = stressToMPa(basis.design.steel.yieldStress, units);
  const fck = stressToMPa(basis.fc, units);
  const Es = stressToMPa(basis.Es, units);
  const l0 = L(input.effectiveLength);
  const NEd = F(input.Pu);
  const M02 = input.M2 * systemFactor('moment', units, 'si');
  const M01 = -input.M1 * systemFactor('moment', units, 'si'); // EN: same sign in single curvature
  const creepKnown = input.creepRatio !== undefined;
  const phiEf = input.creepRatio ?? EN_CREEP_FOR_A_UNKNOWN;

  const i = shape.kind === 'rectangle' ? h / Math.sqrt(12) : h / 4;
  const lambda = l0 / i;
  steps.push({ label: 'i = h/√12 (rectangle) or D/4 (circle), uncracked gross section (5.8.3.2(1))', value: i, unit: 'mm' });
  steps.push({ label: 'λ = l0/i (5.8.3.2(1))', value: lambda });
  const n = NEd / (Ac * fcd);
  const omega = (As * fyd) / (Ac * fcd);
  steps.push({ label: 'n = NEd/(Ac·fcd)', value: n });
  steps.push({
    label: reinforcementKnown
      ? 'ω = As·fyd/(Ac·fcd)'
      : 'ω = 0: no reinforcement given, so B = 1 (5.8.3.1(1) allows B = 1.1 when ω is not known; B = 1 is the lower bound, conservative)',
    value: omega,
  });
  const rm = M02 > 0 ? M01 / M02 : 1;
  const A = creepKnown ? 1 / (1 + 0.2 * phiEf) : EN_A_UNKNOWN_CREEP;
  const B = Math.sqrt(1 + 2 * omega);
  const C = 1.7 - rm;
  const lambdaLim = n > 0 ? (20 * A * B * C) / Math.sqrt(n) : Infinity;
  steps.push({
    label: `rm = M01/M02, positive when both end moments have the same sign (5.8.3.1(1)): ${rm > 0 ? 'single' : rm < 0 ? 'double' : 'no'} curvature`,
    value: rm,
  });
  steps.push({
    label: creepKnown ? 'A = 1/(1 + 0.2·φef) (5.8.3.1(1))' : 'A = 0.7: φef not given (--creep), the value 5.8.3.1(1) takes when φef is not known',
    value: A,
  });
  steps.push({ label: 'λlim = 20·A·B·C/√n, B = √(1 + 2ω), C = 1.7 − rm (5.8.3.1 Eq. 5.13N)', value: lambdaLim });
  const neglected = lambda < lambdaLim;
  steps.push({ label: 'second-order effects may be ignored: λ < λlim (5.8.3.1(1))', value: neglected });

  const ei = l0 / 400;
  const e0 = Math.max(h / 30, 20);
  steps.push({ label: 'ei = l0/400 (5.2(7), 5.2(9) Note)', value: ei, unit: 'mm' });
  steps.push({ label: 'e0 = max(h/30, 20 mm) (6.1(4))', value: e0, unit: 'mm' });
  const M0e = Math.max(0.6 * M02 + 0.4 * M01, 0.4 * M02);
  steps.push({ label: 'M0e = 0.6·M02 + 0.4·M01 ≥ 0.4·M02 (5.8.8.2(2) Eq. 5.32)', value: M0e / 1e6, unit: 'kN·m' });
  const M0Ed = Math.max(M0e + NEd * ei, NEd * e0);
  steps.push({ label: 'M0Ed = max(M0e + NEd·ei, NEd·e0)', value: M0Ed / 1e6, unit: 'kN·m' });
  if (neglected) {
    const mEnd = Math.max(M02 + NEd * ei, NEd * e0);
    return { method: 'EN 1992-1-1 5.8.8 nominal curvature', neglected, delta: 1, magnifiedMoment: Mback(mEnd), firstOrderMoment: Mback(mEnd), ok: true, warnings, steps };
  }

  const barArea = bars.reduce((s, b) => s + b.area, 0);
  const is = barArea > 0 ? Math.sqrt(bars.reduce((s, b) => s + b.area * b.y * b.y, 0) / barArea) * systemFactor('length', units, 'si') : 0;
  const d = h / 2 + is;
  steps.push({
    label: `d = h/2 + is, is = radius of gyration of the reinforcement (5.8.8.3(2))${reinforcementKnown ? '' : ', from the bar positions of γ and the arrangement'}`,
    value: d,
    unit: 'mm',
  });
  const epsYd = fyd / Es;
  const invR0 = epsYd / (0.45 * d);
  steps.push({ label: '1/r0 = εyd/(0.45·d) (5.8.8.3(1))', value: invR0, unit: '1/mm' });
  const nu = 1 + omega;
  const Kr = reinforcementKnown ? Math.min(1, (nu - n) / (nu - 0.4)) : 1;
  steps.push({
    label: reinforcementKnown
      ? 'Kr = (nu − n)/(nu − nbal) ≤ 1, nu = 1 + ω, nbal = 0.4 (5.8.8.3(3) Eq. 5.36)'
      : 'Kr = 1: no reinforcement given, the upper bound of Eq. 5.36 (5.8.8.3(3), conservative)',
    value: Kr,
  });
  const beta = 0.35 + fck / 200 - lambda / 150;
  const Kphi = Math.max(1, 1 + beta * phiEf);
  steps.push({
    label: creepKnown
      ? 'Kφ = 1 + β·φef ≥ 1, β = 0.35 + fck/200 − λ/150 (5.8.8.3(4) Eq. 5.37)'
      : `Kφ = 1 + β·φef ≥ 1, β = 0.35 + fck/200 − λ/150 (5.8.8.3(4) Eq. 5.37), φef = ${EN_CREEP_FOR_A_UNKNOWN.toFixed(3)} (the value A = 0.7 stands for; φef not given)`,
    value: Kphi,
  });
  const invR = Math.max(0, Kr) * Kphi * invR0;
  steps.push({ label: '1/r = Kr·Kφ·1/r0 (Eq. 5.34)', value: invR, unit: '1/mm' });
  // 5.8.8.2(4): c = 10 normally; a constant first-order moment (rm = 1, M01 = M02) takes the lower limit 8
  const constantMoment = rm >= 1 - 1e-9;
  const c = constantMoment ? 8 : 10;
  const e2 = (invR * l0 * l0) / c;
  steps.push({
    label: constantMoment ? 'e2 = (1/r)·l0²/c, c = 8 (5.8.8.2(4), constant first-order moment)' : 'e2 = (1/r)·l0²/c, c = 10 (5.8.8.2(4), Eq. 5.33)',
    value: e2,
    unit: 'mm',
  });
  const M2nd = NEd * e2;
  const MEd = M0Ed + M2nd;
  steps.push({ label: 'M2 = NEd·e2 (5.8.8.2(3))', value: M2nd / 1e6, unit: 'kN·m' });
  steps.push({ label: 'MEd = M0Ed + M2 (Eq. 5.31)', value: MEd / 1e6, unit: 'kN·m' });
  const mDesign = Math.max(MEd, M02 + NEd * ei);
  steps.push({ label: 'design moment = max(MEd, M02 + NEd·ei) (end section, 5.8.8.2(2))', value: mDesign / 1e6, unit: 'kN·m' });
  return {
    method: 'EN 1992-1-1 5.8.8 nominal curvature',
    neglected: false,
    delta: mDesign / M0Ed,
    magnifiedMoment: Mback(mDesign),
    firstOrderMoment: Mback(M0Ed),
    ok: true,
    warnings,
    steps,
  };
}

/**
 * AS 3600-2018 braced column moment magnifier for one axis (SI: N, mm, N·mm). From memory of the standard:
 * 10.5.2 r = 0.3D (rectangle), 0.25D (circle); 10.3.1(b) short braced column when Le/r ≤ 25 or
 * Le/r ≤ αc(38 − f′c/15)(1 + M1* ÷ M2*), αc = √(2.25 − 2.5·N* ÷ (0.6Nuo)) for N* ÷ (0.6Nuo) ≥ 0.15, else
 * √(1/(3.5·N* ÷ (0.6Nuo))); 10.1.2 M2* ≥ N*·0.05D; 10.4.2 km = 0.6 − 0.4·M1* ÷ M2* ≥ 0.4 (1.0 with transverse
 * loads); 10.4.4 Nc = (π²/Le²)·182·do·(φ·Mub)/(1 + βd) with φ = 0.6 and Mub the balanced moment;
 * 10.4.2 δb = km/(1 − N* ÷ Nc) ≥ 1.
 */
export function as3600MomentMagnification(basis: Basis, section: SlendernessSection, input: SlendernessInput): SlendernessResult {
  const method = 'AS 3600-2018 10.4 moment magnifier (braced)';
  const steps: SlendernessStep[] = [];
  const warnings: string[] = [];
  const { shape } = section;
  const D = depthOf(shape);
  const Ag = grossA(shape);
  const { effectiveLength: Le, M1, M2, Pu: N } = input;
  // 10.3.1, 10.4.2 (from memory): M1*/M2* is taken as −1 when |M2*| ≤ 0.05·D·N* (and with no end moment)
  const smallM2 = !(M2 > 0.05 * D * N);
  const ratio = smallM2 ? -1 : M1 / M2;
  const knownBars = section.positionsOnly ? section.bars.map((b) => ({ ...b, area: 0 })) : section.bars;
  const As = knownBars.reduce((s, b) => s + b.area, 0);
  const Nuo = basis.nominal.squash.concreteStress * (Ag - As) + basis.nominal.squash.steelStress * As;

  const r = shape.kind === 'rectangle' ? 0.3 * D : 0.25 * D;
  steps.push({ label: `r = ${shape.kind === 'rectangle' ? '0.3·D' : '0.25·D'} (10.5.2)`, value: r, unit: 'mm' });
  const slenderness = Le / r;
  steps.push({ label: 'Le/r', value: slenderness });
  steps.push({
    label: smallM2 ? 'M1*/M2* = −1: |M2*| ≤ 0.05·D·N* (10.3.1, from memory)' : 'M1*/M2* (negative in single curvature, 10.3.1)',
    value: ratio,
  });
  steps.push({ label: `Nuo = α1·f′c·(Ag − As) + fsy·As (10.6.2.2)${section.positionsOnly ? ', bars not given: As = 0' : ''}`, value: Nuo, unit: 'N' });
  const q = N / (0.6 * Nuo);
  const alphaC = q >= 0.15 ? Math.sqrt(Math.max(0, 2.25 - 2.5 * q)) : Math.sqrt(1 / (3.5 * q));
  steps.push({ label: 'αc = √(2.25 − 2.5·N*/(0.6Nuo)) for N*/(0.6Nuo) ≥ 0.15, else √(1/(3.5·N*/(0.6Nuo))) (10.3.1)', value: alphaC });
  const limit = Math.max(25, alphaC * (38 - basis.fc / 15) * (1 + ratio));
  steps.push({ label: 'limit max(25, αc·(38 − f′c/15)·(1 + M1*/M2*)) (10.3.1(b))', value: limit });
  const neglected = slenderness <= limit * (1 + 1e-12);
  steps.push({ label: 'short column: slenderness may be neglected (10.3.1)', value: neglected });
  const Mmin = N * 0.05 * D;
  steps.push({ label: 'M*min = N*·0.05·D (10.1.2)', value: Mmin, unit: 'N·mm' });
  const M2c = Math.max(M2, Mmin);
  steps.push({ label: 'M2* used = max(M2*, N*·0.05·D)', value: M2c, unit: 'N·mm' });
  // 10.5.1 (from memory): the simplified column rules apply up to Le/r = 120; beyond, a rigorous analysis is needed
  const withinScope = slenderness <= 120 * (1 + 1e-12);
  steps.push({ label: 'Le/r ≤ 120, the scope of the moment magnifier (10.5.1, from memory)', value: withinScope });
  if (!withinScope) warnings.push('Le/r exceeds 120 (AS 3600-2018 10.5.1, from memory): outside the moment-magnifier method; a rigorous analysis is needed');
  const scopeClause = withinScope ? {} : { limitClause: 'AS 3600-2018 10.5.1 (Le/r ≤ 120, from memory)' };
  if (neglected) return { method, neglected, delta: 1, magnifiedMoment: M2c, firstOrderMoment: M2c, ok: withinScope, ...scopeClause, warnings, steps };

  // balanced moment Mub at kuo = εcu/(εcu + εsy) about the bending axis (bars y toward the compression face)
  const sec = prepareBiaxial(basis, shape, knownBars);
  const yMin = section.bars.length > 0 ? Math.min(...section.bars.map((b) => b.y)) : -0.4 * D;
  const dO = D / 2 - yMin;
  steps.push({ label: `do = depth of the extreme tension bar${section.positionsOnly ? ' (bar positions from γ)' : ''}`, value: dO, unit: 'mm' });
  const epsCu = basis.profile(1, 1).top;
  const epsSy = basis.nominal.steel.yieldStress / basis.Es;
  const kuoB = epsCu / (epsCu + epsSy);
  steps.push({ label: 'kuo balanced = εcu/(εcu + εsy)', value: kuoB });
  const Mub = Math.abs(biaxialResultant(sec, 0, kuoB * dO, 'nominal').Mx);
  steps.push({ label: `Mub, balanced moment${section.positionsOnly ? ' of the concrete alone (bars not given, conservative)' : ''}`, value: Mub, unit: 'N·mm' });
  const betaD = input.betaDns ?? 0;
  steps.push({ label: 'βd, sustained ÷ total axial load (10.4.4)', value: betaD });
  const Nc = ((Math.PI ** 2) / (Le * Le)) * ((182 * dO * 0.6 * Mub) / (1 + betaD));
  steps.push({ label: 'Nc = (π²/Le²)·182·do·(φ·Mub)/(1 + βd), φ = 0.6 (10.4.4)', value: Nc, unit: 'N' });
  let km: number;
  if (input.transverseLoads) {
    km = 1;
    steps.push({ label: 'km = 1.0, transverse loads between the ends (10.4.2)', value: km });
  } else {
    km = Math.max(0.4, 0.6 - 0.4 * ratio);
    steps.push({ label: smallM2 ? 'km = 0.6 − 0.4·(−1) = 1.0, M1*/M2* taken as −1 (10.4.2, from memory)' : 'km = 0.6 − 0.4·M1*/M2* ≥ 0.4 (10.4.2)', value: km });
  }
  const stable = N < Nc;
  const delta = stable ? Math.max(1, km / (1 - N / Nc)) : Infinity;
  steps.push({ label: 'N*/Nc', value: N / Nc });
  steps.push({ label: 'δb = km/(1 − N*/Nc) ≥ 1 (10.4.2)', value: delta });
  if (!stable) warnings.push('N* ≥ Nc: the column is unstable by AS 3600-2018 10.4.2; enlarge the section or brace it');
  const magnified = delta * M2c;
  steps.push({ label: 'M* = δb·M2* (10.4.2)', value: magnified, unit: 'N·mm' });
  return {
    method,
    neglected: false,
    delta,
    magnifiedMoment: magnified,
    firstOrderMoment: M2c,
    ok: stable && withinScope,
    ...(!stable ? { limitClause: 'AS 3600-2018 10.4.2 (N* ≥ Nc)' } : scopeClause),
    warnings,
    steps,
  };
}

/** CSA A23.3-19 8.6.2.3 (from memory): Ec = 4500·√f′c MPa for normal-density concrete. */
export const csaEc = (fc: number): number => 4500 * Math.sqrt(fc);

/**
 * CSA A23.3-19 non-sway magnifier for one axis (SI: N, mm, N·mm). From memory of the standard:
 * 10.14.2 r = 0.3h (rectangle), 0.25D (circle); 10.15.2 neglect when kℓu/r ≤ (25 − 10·M1/M2)/√(Pf/(f′c·Ag)),
 * M1/M2 positive in single curvature; 10.15.3.1 EI = 0.4·Ec·Ig/(1 + βd) (option b: (0.2·Ec·Ig + Es·Ist)/(1 + βd)),
 * Pc = π²EI/(kℓu)², M2 ≥ Pf·(15 + 0.03h); 10.15.3.2 Cm = 0.6 + 0.4·M1/M2 ≥ 0.4 (1.0 with transverse loads);
 * δ = Cm/(1 − Pf/(φm·Pc)) ≥ 1.0 with φm = 0.75.
 */
export function csaMomentMagnification(basis: Basis, section: SlendernessSection, input: SlendernessInput): SlendernessResult {
  const method = 'CSA A23.3-19 10.15.3 moment magnifier (non-sway)';
  const steps: SlendernessStep[] = [];
  const warnings: string[] = [];
  const { shape, bars } = section;
  const h = depthOf(shape);
  const Ag = grossA(shape);
  const Ig = grossI(shape);
  const { effectiveLength: klu, Pu: Pf, M2 } = input;
  const ratio = M2 > 0 ? -input.M1 / M2 : 1; // CSA sign: positive in single curvature
  const r = shape.kind === 'rectangle' ? 0.3 * h : 0.25 * h;
  steps.push({ label: `r = ${shape.kind === 'rectangle' ? '0.3·h' : '0.25·D'} (10.14.2)`, value: r, unit: 'mm' });
  const slenderness = klu / r;
  steps.push({ label: 'kℓu/r', value: slenderness });
  steps.push({ label: 'M1/M2 (positive in single curvature, 10.15.2)', value: ratio });
  const limit = (25 - 10 * ratio) / Math.sqrt(Pf / (basis.fc * Ag));
  steps.push({ label: 'limit (25 − 10·M1/M2)/√(Pf/(f′c·Ag)) (10.15.2)', value: limit });
  const neglected = slenderness <= limit * (1 + 1e-12);
  steps.push({ label: 'slenderness may be neglected (10.15.2)', value: neglected });
  if (neglected) return { method, neglected, delta: 1, magnifiedMoment: M2, firstOrderMoment: M2, ok: true, warnings, steps };

  const Ec = csaEc(basis.fc);
  steps.push({ label: 'Ec = 4500·√f′c (8.6.2.3)', value: Ec, unit: 'MPa' });
  steps.push({ label: 'Ig', value: Ig, unit: 'mm⁴' });
  const betaD = input.betaDns ?? 0;
  steps.push({ label: 'βd, factored sustained ÷ total axial load (10.15.3.1)', value: betaD });
  const M2min = Pf * (15 + 0.03 * h);
  steps.push({ label: 'M2,min = Pf·(15 + 0.03h) (10.15.3.1)', value: M2min, unit: 'N·mm' });
  const minimumGoverns = M2min > M2;
  const M2c = Math.max(M2, M2min);
  steps.push({ label: 'M2 used = max(M2, M2,min)', value: M2c, unit: 'N·mm' });
  if (input.eiOption === 'c') throw new PmError(ERROR_CODES.invalidValue, 'eiOption', 'c is ACI 318 only; CSA A23.3-19 10.15.3.1 offers a or b', { value: 'c', allowed: 'a, b' });
  let EI: number;
  if ((input.eiOption ?? 'a') === 'b') {
    const Ist = bars.reduce((s, b) => s + b.area * b.y * b.y, 0);
    steps.push({ label: 'Ist = Σ As·y²', value: Ist, unit: 'mm⁴' });
    EI = (0.2 * Ec * Ig + basis.Es * Ist) / (1 + betaD);
    steps.push({ label: 'EI = (0.2·Ec·Ig + Es·Ist)/(1 + βd) (10.15.3.1)', value: EI, unit: 'N·mm²' });
  } else {
    EI = (0.4 * Ec * Ig) / (1 + betaD);
    steps.push({ label: 'EI = 0.4·Ec·Ig/(1 + βd) (10.15.3.1)', value: EI, unit: 'N·mm²' });
  }
  const Pc = (Math.PI ** 2 * EI) / (klu * klu);
  steps.push({ label: 'Pc = π²·EI/(kℓu)² (10.15.3.1)', value: Pc, unit: 'N' });
  let Cm: number;
  if (input.transverseLoads) {
    Cm = 1;
    steps.push({ label: 'Cm = 1.0, transverse loads between supports (10.15.3.2)', value: Cm });
  } else if (minimumGoverns) {
    Cm = 1;
    steps.push({ label: 'Cm = 1.0 since M2,min governs (common practice, as ACI 318-19 6.6.4.5.4)', value: Cm });
  } else {
    Cm = Math.max(0.4, 0.6 + 0.4 * ratio);
    steps.push({ label: 'Cm = 0.6 + 0.4·M1/M2 ≥ 0.4 (10.15.3.2)', value: Cm });
  }
  const stable = Pf < 0.75 * Pc;
  const delta = stable ? Math.max(1, Cm / (1 - Pf / (0.75 * Pc))) : Infinity;
  steps.push({ label: 'Pf/(φm·Pc), φm = 0.75', value: Pf / (0.75 * Pc) });
  steps.push({ label: 'δ = Cm/(1 − Pf/(φm·Pc)) ≥ 1.0 (10.15.3.1)', value: delta });
  if (!stable) warnings.push('Pf ≥ 0.75·Pc: the column is unstable by CSA A23.3-19 10.15.3.1; enlarge the section or brace it');
  const magnified = delta * M2c;
  steps.push({ label: 'Mc = δ·M2 (10.15.3.1)', value: magnified, unit: 'N·mm' });
  return { method, neglected: false, delta, magnifiedMoment: magnified, firstOrderMoment: M2c, ok: stable, ...(stable ? {} : { limitClause: 'CSA A23.3-19 10.15.3.1 (Pf ≥ 0.75·Pc)' }), warnings, steps };
}
