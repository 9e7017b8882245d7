/**
 * EN 1992-1-1:2004 5.8.8 nominal curvature: the EN rulebook for slender braced columns. Pure: no I/O.
 */
import type { RuleDef } from './rules.js';
import {
  asEndPair,
  depthOf,
  EN_A_UNKNOWN_CREEP,
  EN_CREEP_FOR_A_UNKNOWN,
  grossA,
  SAME_SIGN_END_MOMENTS,
  type SlendernessInput,
  type SlendernessMethod,
  type SlendernessResult,
  type SlendernessSection,
  type SlendernessStep,
  type SwayInput,
  type SwayMethod,
} from './slenderness.js';
import type { Basis } from './types.js';
import { lengthToMm, stressToMPa, systemFactor } from '../units/index.js';

/**
 * The rules of the EN method. 'published': checked against published text of the clause (5.8.3.1(1) A = 0.7
 * and the sign of rm; 5.8.8.2(3)–(4) c, "8 is a lower limit, corresponding to constant total moment";
 * 5.8.8.3 Kr and Kφ, as quoted on usingeurocodes.com and in the test comments); the others from memory.
 */
export const EN_1992_SLENDERNESS_RULES: readonly RuleDef[] = [
  { id: 'slenderness-limit', clause: '5.8.3.1(1)', title: 'second-order effects may be ignored when λ < λlim = 20·A·B·C/√n (A = 0.7 when φef is not known)', source: 'published' },
  { id: 'radius-of-gyration', clause: '5.8.3.2(1)', title: 'λ = l0/i, i of the uncracked gross section', source: 'from memory' },
  { id: 'end-moment-convention', clause: '5.8.3.1(1)', title: 'rm = M01/M02 positive when both end moments give tension on the same side; no end moments given or transverse loads: rm = 1', source: 'published' },
  { id: 'imperfection', clause: '5.2(7)', title: 'ei = l0/400 (5.2(9) Note, recommended θi)', source: 'from memory' },
  { id: 'min-moment', clause: '6.1(4)', title: 'minimum eccentricity e0 = max(h/30, 20 mm), about each axis separately', source: 'from memory' },
  { id: 'equivalent-moment', clause: '5.8.8.2(2)', title: 'M0e = 0.6·M02 + 0.4·M01 ≥ 0.4·M02', source: 'from memory' },
  { id: 'nominal-curvature', clause: '5.8.8.3', title: '1/r = Kr·Kφ·εyd/(0.45·d), Kr = (nu − n)/(nu − nbal) ≤ 1, Kφ = 1 + β·φef ≥ 1', source: 'published' },
  { id: 'curvature-factor-c', clause: '5.8.8.2(4)', title: 'c = 10; c = 8 when the first-order moment is constant (rm = 1)', source: 'published' },
  { id: 'magnifier', clause: '5.8.8.2(1)', title: 'MEd = M0Ed + NEd·e2, e2 = (1/r)·l0²/c', source: 'from memory' },
];

/**
 * The rules of the EN method for unbraced members. 5.8.3.1(1) rm = 1 for unbraced members: published text
 * (usingeurocodes.com, 5.8.3.1(1)); Eq. 5.16, k ≥ 0.1 and θi from memory.
 */
export const EN_1992_SWAY_RULES: readonly RuleDef[] = [
  { id: 'sway-effective-length', clause: '5.8.3.2(3)', title: 'unbraced: l0 = ℓ·max{√(1 + 10·k1k2/(k1 + k2)); (1 + k1/(1 + k1))(1 + k2/(1 + k2))} (Eq. 5.16), k1, k2 ≥ 0.1; or l0 given', source: 'from memory' },
  { id: 'sway-slenderness-limit', clause: '5.8.3.1(1)', title: 'unbraced members: λlim with rm = 1 (C = 0.7)', source: 'published' },
  { id: 'sway-imperfection', clause: '5.2(7)', title: 'unbraced: ei = θi·l0/2, θi = θ0 = 1/200 (αh = αm = 1, their upper bound)', source: 'from memory' },
  { id: 'sway-end-moments', clause: '5.8.8.2', title: 'unbraced: the first-order moment is M02 = M02ns + M02s at the end (not the equivalent moment M0e); MEd = M0Ed + NEd·e2', source: 'from memory' },
];

/** The EN 1992-1-1 method for unbraced members: 5.8.8 nominal curvature with the unbraced l0 and rm = 1. */
export const EN_1992_SWAY: SwayMethod = {
  title: 'EN 1992-1-1 5.8.8 nominal curvature (unbraced)',
  inputs: { moments: 'summed', stabilityIndex: false, storeySums: false, needsStorey: false, bracedLength: false, restraint: true },
  rules: EN_1992_SWAY_RULES,
  check: (basis, section, input) => enUnbraced(basis, section, input),
};

/** The EN 1992-1-1 rulebook for slender columns, braced and unbraced. */
export const EN_1992_SLENDERNESS: SlendernessMethod = {
  id: 'nominal-curvature-en1992',
  title: 'EN 1992-1-1 5.8.8 nominal curvature',
  convention: SAME_SIGN_END_MOMENTS,
  needsSustainedLoadRatio: false,
  rules: [...EN_1992_SLENDERNESS_RULES, ...EN_1992_SWAY_RULES],
  check: (basis, section, input) => enNominalCurvature(basis, section, input),
  sway: EN_1992_SWAY,
};

/** EN 1992-1-1 5.8.3.2(3) Eq. 5.16 (from memory): the factor on the clear length ℓ of an unbraced member. */
export function enUnbracedLengthFactor(k1: number, k2: number): number {
  const a = Math.sqrt(1 + (10 * k1 * k2) / (k1 + k2));
  const b = (1 + k1 / (1 + k1)) * (1 + k2 / (1 + k2));
  return Math.max(a, b);
}

/**
 * EN 1992-1-1 unbraced member for one axis: l0 from k1, k2 (5.8.3.2(3) Eq. 5.16, k ≥ 0.1) or given; then the
 * nominal-curvature method with rm = 1 (5.8.3.1(1)), the end moment M02 = M02ns + M02s (no equivalent moment)
 * and ei = θi·l0/2 with θi = 1/200 (5.2(7)).
 */
export function enUnbraced(basis: Basis, section: SlendernessSection, input: SlendernessInput & { sway: SwayInput }): SlendernessResult {
  const { sway } = input;
  const pre: SlendernessStep[] = [];
  const lu = basis.units === 'us' ? 'in' : 'mm';
  const mu = basis.units === 'us' ? 'kip·in' : 'N·mm';
  let l0 = input.effectiveLength;
  if (sway.k1 !== undefined && sway.k2 !== undefined) {
    // 5.8.3.2(3) Note (from memory): rigid restraint is unlikely in practice, a minimum of 0.1 for k1 and k2
    const k1 = Math.max(0.1, sway.k1);
    const k2 = Math.max(0.1, sway.k2);
    pre.push({ key: 'lu', clause: '5.8.3.2(3)', label: 'ℓ, clear height of the member', value: input.effectiveLength, unit: lu });
    pre.push({ key: 'k1', clause: '5.8.3.2(3)', label: 'k1, relative flexibility of the restraint at end 1, ≥ 0.1', value: k1 });
    pre.push({ key: 'k2', clause: '5.8.3.2(3)', label: 'k2, relative flexibility of the restraint at end 2, ≥ 0.1', value: k2 });
    l0 = input.effectiveLength * enUnbracedLengthFactor(k1, k2);
    pre.push({ key: 'l0', clause: '5.8.3.2(3)', label: 'l0 = ℓ·max{√(1 + 10·k1k2/(k1 + k2)); (1 + k1/(1 + k1))(1 + k2/(1 + k2))} (Eq. 5.16)', value: l0, unit: lu });
  } else {
    pre.push({ key: 'l0', clause: '5.8.3.2(3)', label: 'l0 of the unbraced member, given', value: l0, unit: lu });
  }
  pre.push({ key: 'M02ns', clause: '5.8.8.2', label: 'non-sway part of the larger end moment', value: input.M2, unit: mu });
  pre.push({ key: 'M02s', clause: '5.8.8.2', label: 'sway part at the same end', value: sway.M2s, unit: mu });
  const ends = asEndPair(input.M2 + sway.M2s, input.M1 + sway.M1s);
  pre.push({ key: 'M02-total', clause: '5.8.8.2', label: 'M02 = the larger |M0ns + M0s| of the two ends (first order)', value: ends.M2, unit: mu });
  const { sway: _omit, ...rest } = input;
  const r = enNominalCurvature(basis, section, { ...rest, effectiveLength: l0, M1: ends.M1, M2: ends.M2 }, true);
  return { ...r, method: EN_1992_SWAY.title, steps: [...pre, ...r.steps] };
}

/**
 * EN 1992-1-1 5.8.8 nominal curvature for one axis (SI internal units N, mm; formulas in MPa and mm).
 * 5.8.3.1 Eq. 5.13N λlim = 20·A·B·C/√n with A = 1/(1 + 0.2φef) (0.7 when φef is not known), B = √(1 + 2ω), C = 1.7 − rm;
 * 5.2(7) imperfection ei = l0/400 (5.2(9) Note, recommended θi); 6.1(4) e0 = max(h/30, 20 mm);
 * 5.8.8.2(2) Eq. 5.32 M0e = 0.6M02 + 0.4M01 ≥ 0.4M02; 5.8.8.3 Eq. 5.34–5.37: 1/r = Kr·Kφ·εyd/(0.45d),
 * Kr = (nu − n)/(nu − nbal) ≤ 1, nbal = 0.4, Kφ = 1 + β·φef ≥ 1, β = 0.35 + fck/200 − λ/150;
 * Eq. 5.33 e2 = (1/r)·l0²/c with c = 10, or 8 for a constant first-order moment (5.8.8.2(4)); Eq. 5.31 MEd = M0Ed + NEd·e2.
 */
export function enNominalCurvature(basis: Basis, section: SlendernessSection, input: SlendernessInput, unbraced = false): SlendernessResult {
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
  steps.push({ key: 'r', clause: '5.8.3.2(1)', label: 'i = h/√12 (rectangle) or D/4 (circle), uncracked gross section (5.8.3.2(1))', value: i, unit: 'mm' });
  steps.push({ key: 'klu-over-r', clause: '5.8.3.2(1)', label: 'λ = l0/i (5.8.3.2(1))', value: lambda });
  const n = NEd / (Ac * fcd);
  const omega = (As * fyd) / (Ac * fcd);
  steps.push({ key: 'n', clause: '5.8.3.1(1)', label: 'n = NEd/(Ac·fcd) (5.8.3.1(1))', value: n });
  steps.push({ key: 'omega', clause: '5.8.3.1(1)',
    label: reinforcementKnown
      ? 'ω = As·fyd/(Ac·fcd)'
      : 'ω = 0: no reinforcement given, so B = 1 (5.8.3.1(1) allows B = 1.1 when ω is not known; B = 1 is the lower bound, conservative)',
    value: omega,
  });
  // no end moment (M02 = 0): equal end moments in single curvature, rm = 1 (the README's default; conservative)
  // 5.8.3.1(1) (from memory of the published text): rm = 1 for braced members whose first-order moments arise
  // predominantly from imperfections or transverse loading; then M0e = M02 as well (Eq. 5.32 is for end moments only)
  const transverse = input.transverseLoads === true;
  // the ratio of the given end moments (for c); 5.8.3.1(1): rm = 1 for unbraced members in general
  const rmGiven = M02 > 0 && !transverse ? M01 / M02 : 1;
  const rm = unbraced ? 1 : rmGiven;
  const A = creepKnown ? 1 / (1 + 0.2 * phiEf) : EN_A_UNKNOWN_CREEP;
  const B = Math.sqrt(1 + 2 * omega);
  const C = 1.7 - rm;
  const lambdaLim = n > 0 ? (20 * A * B * C) / Math.sqrt(n) : Infinity;
  steps.push({ key: 'end-moment-ratio', clause: '5.8.3.1(1)',
    label: unbraced
      ? 'rm = 1 (C = 0.7): unbraced member (5.8.3.1(1))'
      : transverse
      ? 'rm = 1: transverse loads between the ends (5.8.3.1(1))'
      : `rm = M01/M02, positive when both end moments have the same sign (5.8.3.1(1)): ${rm > 0 ? 'single' : rm < 0 ? 'double' : 'no'} curvature`,
    value: rm,
  });
  steps.push({ key: 'A', clause: '5.8.3.1(1)',
    label: creepKnown ? 'A = 1/(1 + 0.2·φef) (5.8.3.1(1))' : 'A = 0.7: φef not given (--creep), the value 5.8.3.1(1) takes when φef is not known',
    value: A,
  });
  steps.push({ key: 'limit', clause: '5.8.3.1(1)', label: 'λlim = 20·A·B·C/√n, B = √(1 + 2ω), C = 1.7 − rm (5.8.3.1 Eq. 5.13N)', value: lambdaLim });
  const neglected = lambda < lambdaLim;
  steps.push({ key: 'neglected', clause: '5.8.3.1(1)', label: 'second-order effects may be ignored: λ < λlim (5.8.3.1(1))', value: neglected });

  const ei = l0 / 400;
  const e0 = Math.max(h / 30, 20);
  steps.push({ key: 'ei', clause: '5.2(7)', label: unbraced ? 'ei = θi·l0/2, θi = θ0 = 1/200 (αh = αm = 1, upper bound; 5.2(5), 5.2(7))' : 'ei = l0/400 (5.2(7), 5.2(9) Note)', value: ei, unit: 'mm' });
  steps.push({ key: 'e0', clause: '6.1(4)', label: 'e0 = max(h/30, 20 mm) (6.1(4))', value: e0, unit: 'mm' });
  const M0e = transverse || unbraced ? M02 : Math.max(0.6 * M02 + 0.4 * M01, 0.4 * M02);
  steps.push({
    key: 'M0e',
    clause: '5.8.8.2(2)',
    label: unbraced ? 'M02 used, not the equivalent moment M0e: an unbraced member\'s largest moment is at its end' : transverse ? 'M0e = M02: transverse loads between the ends (Eq. 5.32 is for end moments; conservative)' : 'M0e = 0.6·M02 + 0.4·M01 ≥ 0.4·M02 (5.8.8.2(2) Eq. 5.32)',
    value: M0e / 1e6,
    unit: 'kN·m',
  });
  const M0Ed = Math.max(M0e + NEd * ei, NEd * e0);
  steps.push({ key: 'M0Ed', clause: '5.8.8.2(2)', label: 'M0Ed = max(M0e + NEd·ei, NEd·e0) (5.8.8.2(2), 6.1(4))', value: M0Ed / 1e6, unit: 'kN·m' });
  if (neglected) {
    const mEnd = Math.max(M02 + NEd * ei, NEd * e0);
    return { method: 'EN 1992-1-1 5.8.8 nominal curvature', neglected, delta: 1, magnifiedMoment: Mback(mEnd), firstOrderMoment: Mback(mEnd), ok: true, warnings, steps };
  }

  const barArea = bars.reduce((s, b) => s + b.area, 0);
  const is = barArea > 0 ? Math.sqrt(bars.reduce((s, b) => s + b.area * b.y * b.y, 0) / barArea) * systemFactor('length', units, 'si') : 0;
  const d = h / 2 + is;
  steps.push({ key: 'd', clause: '5.8.8.3(2)',
    label: `d = h/2 + is, is = radius of gyration of the reinforcement (5.8.8.3(2))${reinforcementKnown ? '' : ', from the bar positions of γ and the arrangement'}`,
    value: d,
    unit: 'mm',
  });
  const epsYd = fyd / Es;
  const invR0 = epsYd / (0.45 * d);
  steps.push({ key: 'inv-r0', clause: '5.8.8.3(1)', label: '1/r0 = εyd/(0.45·d) (5.8.8.3(1))', value: invR0, unit: '1/mm' });
  const nu = 1 + omega;
  const Kr = reinforcementKnown ? Math.min(1, (nu - n) / (nu - 0.4)) : 1;
  steps.push({ key: 'Kr', clause: '5.8.8.3(3)',
    label: reinforcementKnown
      ? 'Kr = (nu − n)/(nu − nbal) ≤ 1, nu = 1 + ω, nbal = 0.4 (5.8.8.3(3) Eq. 5.36)'
      : 'Kr = 1: no reinforcement given, the upper bound of Eq. 5.36 (5.8.8.3(3), conservative)',
    value: Kr,
  });
  const beta = 0.35 + fck / 200 - lambda / 150;
  const Kphi = Math.max(1, 1 + beta * phiEf);
  steps.push({ key: 'Kphi', clause: '5.8.8.3(4)',
    label: creepKnown
      ? 'Kφ = 1 + β·φef ≥ 1, β = 0.35 + fck/200 − λ/150 (5.8.8.3(4) Eq. 5.37)'
      : `Kφ = 1 + β·φef ≥ 1, β = 0.35 + fck/200 − λ/150 (5.8.8.3(4) Eq. 5.37), φef = ${EN_CREEP_FOR_A_UNKNOWN.toFixed(3)} (the value A = 0.7 stands for; φef not given)`,
    value: Kphi,
  });
  const invR = Math.max(0, Kr) * Kphi * invR0;
  steps.push({ key: 'inv-r', clause: '5.8.8.3(1)', label: '1/r = Kr·Kφ·1/r0 (Eq. 5.34)', value: invR, unit: '1/mm' });
  // 5.8.8.2(4): c = 10 normally; a constant first-order moment (rm = 1, M01 = M02) takes the lower limit 8
  const constantMoment = rmGiven >= 1 - 1e-9;
  const c = constantMoment ? 8 : 10;
  const e2 = (invR * l0 * l0) / c;
  steps.push({ key: 'c', clause: '5.8.8.2(4)', label: constantMoment ? 'c = 8, constant first-order moment (5.8.8.2(4))' : 'c = 10 (5.8.8.2(4))', value: c });
  steps.push({ key: 'e2', clause: '5.8.8.2(3)',
    label: constantMoment ? 'e2 = (1/r)·l0²/c, c = 8 (5.8.8.2(4), constant first-order moment)' : 'e2 = (1/r)·l0²/c, c = 10 (5.8.8.2(4), Eq. 5.33)',
    value: e2,
    unit: 'mm',
  });
  const M2nd = NEd * e2;
  const MEd = M0Ed + M2nd;
  steps.push({ key: 'M2', clause: '5.8.8.2(3)', label: 'M2 = NEd·e2 (5.8.8.2(3))', value: M2nd / 1e6, unit: 'kN·m' });
  steps.push({ key: 'MEd', clause: '5.8.8.2(1)', label: 'MEd = M0Ed + M2 (Eq. 5.31)', value: MEd / 1e6, unit: 'kN·m' });
  const mDesign = Math.max(MEd, M02 + NEd * ei);
  steps.push({ key: 'M-design', clause: '5.8.8.2(2)', label: 'design moment = max(MEd, M02 + NEd·ei) (end section, 5.8.8.2(2))', value: mDesign / 1e6, unit: 'kN·m' });
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
