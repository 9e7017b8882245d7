/**
 * ACI 318 non-sway moment magnification, one rulebook per edition (318-19 and 318-14). The two editions
 * share 6.6.4 and differ in where the neglect test, r and the 1.4 limit sit (318-14 numbers from memory).
 * Pure: no I/O.
 */
import type { RuleDef } from './rules.js';
import {
  depthOf,
  grossA,
  grossI,
  OPPOSITE_SIGN_END_MOMENTS,
  type SlendernessInput,
  type SlendernessMethod,
  type SlendernessResult,
  type SlendernessSection,
  type SlendernessStep,
} from './slenderness.js';
import { swayMagnifierMethod, type SwayMagnifierClauses } from './sway-magnifier.js';
import type { Basis } from './types.js';
import type { UnitSystem } from '../units/index.js';

/** ACI 318-19 19.2.2.1(b): Ec = 57,000·√f′c psi, or 4700·√f′c MPa (normalweight concrete). */
export function aciEc(fc: number, units: UnitSystem): number {
  return units === 'us' ? (57_000 * Math.sqrt(fc * 1000)) / 1000 : 4700 * Math.sqrt(fc);
}

/** Where an edition puts the clauses around 6.6.4 (which both editions share). */
interface AciSlendernessClauses {
  edition: string;
  /** neglect test kℓu/r ≤ 34 + 12(M1/M2) ≤ 40 and the sign of M1/M2 */
  neglect: string;
  /** r = 0.30h, 0.25D */
  radius: string;
  /** second-order moment ≤ 1.4 × first-order */
  secondOrderLimit: string;
  /** the sway neglect test kℓu/r ≤ 22 */
  swayNeglect: string;
  /** where the clause numbers come from */
  source: RuleDef['source'];
}

/** ACI 318-19 6.2.5.1(b), 6.2.5.2, 6.2.5.3. */
const ACI_318_19_CLAUSES: AciSlendernessClauses = { edition: 'ACI 318-19', neglect: '6.2.5.1', radius: '6.2.5.2', secondOrderLimit: '6.2.5.3', swayNeglect: '6.2.5.1(a)', source: 'from memory' };
/** ACI 318-14 6.2.5(b), 6.2.5.1, 6.2.6 (from memory; 6.2.6 for the 1.4 limit as the reviewer cites it). */
const ACI_318_14_CLAUSES: AciSlendernessClauses = { edition: 'ACI 318-14', neglect: '6.2.5', radius: '6.2.5.1', secondOrderLimit: '6.2.6', swayNeglect: '6.2.5(a)', source: 'from memory' };

/**
 * ACI 318 6.6.4.6 sway magnification. 318-19: 6.6.4.6.1 M1 = M1ns + δs·M1s, M2 = M2ns + δs·M2s and 6.6.4.6.2
 * δs by (a) Q, (b) storey sums, only (b) or (c) above 1.5, read against the published text (up.codes, ACI 318-19
 * 6.6.4.6); 6.2.5.1(a) kℓu/r ≤ 22, 6.6.4.6.4 the check along the length, from memory. 318-14 shares the 6.6.4.6
 * numbers (from memory), with its neglect test at 6.2.5(a) and the 1.4 limit at 6.2.6.
 */
function aciSwayClauses(c: AciSlendernessClauses): SwayMagnifierClauses {
  return {
    edition: c.edition,
    title: `${c.edition} 6.6.4.6 moment magnification (sway)`,
    P: 'Pu',
    radius: c.radius,
    neglect: { clause: c.swayNeglect, limit: 22 },
    ends: '6.6.4.6.1',
    fromQ: { clause: '6.6.4.6.2(a)', maxDelta: 1.5 },
    fromSums: '6.6.4.6.2(b)',
    alongLength: '6.6.4.6.4',
    minMoment: '6.6.4.5.4',
    secondOrderLimit: c.secondOrderLimit,
    source: 'from memory',
  };
}

function aciRules(c: AciSlendernessClauses): RuleDef[] {
  const src = c.source;
  return [
    { id: 'slenderness-limit', clause: `${c.neglect}(b)`, title: 'slenderness may be neglected when kℓu/r ≤ 34 + 12(M1/M2) ≤ 40', source: src },
    { id: 'radius-of-gyration', clause: c.radius, title: 'r = 0.30h (rectangle), 0.25D (circle)', source: src },
    { id: 'end-moment-convention', clause: c.neglect, title: 'M1/M2 negative in single curvature; no end moment given or transverse loads: M1/M2 = −1 (single curvature, conservative)', source: src },
    { id: 'magnifier', clause: '6.6.4.5.2', title: 'δ = Cm/(1 − Pu/(0.75·Pc)) ≥ 1.0, Pc = π²(EI)eff/(kℓu)², (EI)eff by 6.6.4.4.4 (a), (b) or (c)', source: 'from memory' },
    { id: 'cm-factor', clause: '6.6.4.5.3', title: 'Cm = 0.6 − 0.4(M1/M2); 1.0 with transverse loads', source: 'from memory' },
    { id: 'min-moment', clause: '6.6.4.5.4', title: 'M2,min = Pu(0.6 + 0.03h) in. (15 + 0.03h mm); Cm = 1.0 where it governs', source: 'from memory' },
    { id: 'stability-limit', clause: '6.6.4.5.2', title: 'Pu < 0.75·Pc, else unstable', source: 'from memory' },
    { id: 'second-order-limit', clause: c.secondOrderLimit, title: 'second-order moment ≤ 1.4 × first-order moment', source: src },
  ];
}

function aciMethod(c: AciSlendernessClauses): SlendernessMethod {
  const sway = swayMagnifierMethod(aciSwayClauses(c), () => method);
  const method: SlendernessMethod = {
    id: 'moment-magnification-aci318',
    title: `${c.edition} 6.6.4 moment magnification (non-sway)`,
    convention: { ...OPPOSITE_SIGN_END_MOMENTS, rule: `M1 negative in single curvature (${c.edition} ${c.neglect})` },
    needsSustainedLoadRatio: true,
    rules: [...aciRules(c), ...sway.rules],
    check: (basis, section, input) => aciMomentMagnification(basis, section, input, c),
    sway,
  };
  return method;
}

/** The ACI 318-19 rulebook for slender braced columns. */
export const ACI_318_19_SLENDERNESS: SlendernessMethod = aciMethod(ACI_318_19_CLAUSES);
/** The ACI 318-14 rulebook for slender braced columns (same 6.6.4, its own clause numbers around it). */
export const ACI_318_14_SLENDERNESS: SlendernessMethod = aciMethod(ACI_318_14_CLAUSES);

/**
 * ACI 318-19 6.6.4 non-sway moment magnification for one axis.
 * 6.2.5.1(b): neglect when kℓu/r ≤ 34 + 12(M1/M2) ≤ 40; 6.2.5.2: r = 0.30h (rectangle), 0.25D (circle);
 * 6.6.4.4.4 (EI)eff (a) 0.4EcIg/(1+βdns), (b) (0.2EcIg + EsIse)/(1+βdns), (c) EcI/(1+βdns) with I from
 * Table 6.6.3.1.1(b); 6.6.4.4.2 Pc = π²(EI)eff/(kℓu)²; 6.6.4.5.3 Cm = 0.6 − 0.4(M1/M2) (1.0 with
 * transverse loads); 6.6.4.5.2 δ = Cm/(1 − Pu/(0.75Pc)) ≥ 1; 6.6.4.5.4 M2,min = Pu(0.6 + 0.03h) in.
 * (15 + 0.03h mm); 6.2.5.3 second-order Mu ≤ 1.4 × first-order Mu.
 */
export function aciMomentMagnification(basis: Basis, section: SlendernessSection, input: SlendernessInput, cl: AciSlendernessClauses = ACI_318_19_CLAUSES): SlendernessResult {
  const method = `${cl.edition} 6.6.4 moment magnification (non-sway)`;
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
  // transverse loads between the ends: the end moments say nothing of the curvature, so −1 too (pmchart's
  // conservative reading, as EN 1992-1-1 5.8.3.1(1) takes rm = 1 for transverse loading)
  const singleTaken = !(M2 > 0) || input.transverseLoads === true;
  const ratio = singleTaken ? -1 : M1 / M2;

  const r = shape.kind === 'rectangle' ? 0.3 * h : 0.25 * h;
  steps.push({ key: 'r', clause: cl.radius, label: `r = ${shape.kind === 'rectangle' ? '0.30·h' : '0.25·D'} (${cl.radius})`, value: r, unit: lu });
  const slenderness = klu / r;
  steps.push({ key: 'klu-over-r', clause: cl.neglect, label: 'kℓu/r', value: slenderness });
  steps.push({
    key: 'end-moment-ratio',
    clause: cl.neglect,
    label: !singleTaken
      ? `M1/M2 (negative in single curvature, ${cl.neglect})`
      : `M1/M2 = −1: ${M2 > 0 ? 'transverse loads between the ends' : 'no end moment'}, single curvature taken (${cl.neglect}, conservative)`,
    value: ratio,
  });
  const limit = Math.min(34 + 12 * ratio, 40);
  steps.push({ key: 'limit', clause: `${cl.neglect}(b)`, label: `limit 34 + 12(M1/M2) ≤ 40 (${cl.neglect}(b))`, value: limit });
  const neglected = slenderness <= limit * (1 + 1e-12); // equal counts as within (floating-point rounding)
  steps.push({ key: 'neglected', clause: cl.neglect, label: `slenderness may be neglected (${cl.neglect})`, value: neglected });
  if (neglected) {
    return { method, neglected, delta: 1, magnifiedMoment: M2, firstOrderMoment: M2, ok: true, warnings, steps };
  }

  const Ec = aciEc(basis.fc, units);
  const Es = basis.Es;
  const Ig = grossI(shape);
  const Ag = grossA(shape);
  const Ast = bars.reduce((s, b) => s + b.area, 0);
  const Ise = bars.reduce((s, b) => s + b.area * b.y * b.y, 0);
  const beta = input.betaDns ?? 0;
  const option = input.eiOption ?? 'a';
  steps.push({ key: 'Ec', clause: '19.2.2.1(b)', label: 'Ec = 57,000√f′c psi / 4700√f′c MPa (19.2.2.1(b))', value: Ec, unit: su });
  steps.push({ key: 'Ig', clause: '6.6.4.4.4', label: 'Ig', value: Ig, unit: `${lu}⁴` });
  steps.push({ key: 'beta-dns', clause: '6.6.4.4.4', label: 'βdns (6.6.4.4.4)', value: beta });

  // M2,min (6.6.4.5.4) and the moment the magnifier acts on
  const hIn = units === 'us' ? h : h / 25.4;
  const M2min = units === 'us' ? Pu * (0.6 + 0.03 * hIn) : Pu * (15 + 0.03 * h);
  steps.push({ key: 'M2min', clause: '6.6.4.5.4', label: units === 'us' ? 'M2,min = Pu(0.6 + 0.03h), h in in. (6.6.4.5.4)' : 'M2,min = Pu(15 + 0.03h), h in mm (6.6.4.5.4)', value: M2min, unit: mu });
  const minimumGoverns = M2min > M2;
  const M2c = Math.max(M2, M2min);
  steps.push({ key: 'M2-used', clause: '6.6.4.5.4', label: 'M2 used = max(M2, M2,min) (6.6.4.5.4)', value: M2c, unit: mu });

  let EI: number;
  if (option === 'a') {
    EI = (0.4 * Ec * Ig) / (1 + beta);
    steps.push({ key: 'EI', clause: '6.6.4.4.4(a)', label: '(EI)eff = 0.4·Ec·Ig/(1 + βdns) (6.6.4.4.4(a))', value: EI, unit: `${fu}·${lu}²` });
  } else if (option === 'b') {
    steps.push({ key: 'Ise', clause: '6.6.4.4.4(b)', label: 'Ise = Σ As·y² about the centroidal axis', value: Ise, unit: `${lu}⁴` });
    steps.push({ key: 'Es', clause: '20.2.2.2', label: 'Es', value: Es, unit: su });
    EI = (0.2 * Ec * Ig + Es * Ise) / (1 + beta);
    steps.push({ key: 'EI', clause: '6.6.4.4.4(b)', label: '(EI)eff = (0.2·Ec·Ig + Es·Ise)/(1 + βdns) (6.6.4.4.4(b))', value: EI, unit: `${fu}·${lu}²` });
  } else {
    const Po = basis.nominal.squash.concreteStress * (Ag - Ast) + basis.nominal.squash.steelStress * Ast;
    steps.push({ key: 'Po', clause: '22.4.2.2', label: 'Po = 0.85f′c(Ag − Ast) + fy·Ast (22.4.2.2)', value: Po, unit: fu });
    steps.push({ key: 'Ast-over-Ag', clause: 'Table 6.6.3.1.1(b)', label: 'Ast/Ag', value: Ast / Ag });
    const raw = (0.8 + (25 * Ast) / Ag) * (1 - M2c / (Pu * h) - (0.5 * Pu) / Po) * Ig;
    const I = Math.min(0.875 * Ig, Math.max(0.35 * Ig, raw));
    steps.push({ key: 'I-formula', clause: 'Table 6.6.3.1.1(b)', label: 'I = (0.80 + 25Ast/Ag)(1 − Mu/(Pu·h) − 0.5Pu/Po)·Ig, Mu = M2 used (Table 6.6.3.1.1(b))', value: raw, unit: `${lu}⁴` });
    steps.push({ key: 'I', clause: 'Table 6.6.3.1.1(b)', label: 'I within 0.35Ig ≤ I ≤ 0.875Ig', value: I, unit: `${lu}⁴` });
    EI = (Ec * I) / (1 + beta);
    steps.push({ key: 'EI', clause: '6.6.4.4.4(c)', label: '(EI)eff = Ec·I/(1 + βdns) (6.6.4.4.4(c))', value: EI, unit: `${fu}·${lu}²` });
  }
  const Pc = (Math.PI ** 2 * EI) / (klu * klu);
  steps.push({ key: 'Pc', clause: '6.6.4.4.2', label: 'Pc = π²(EI)eff/(kℓu)² (6.6.4.4.2)', value: Pc, unit: fu });

  let Cm: number;
  if (input.transverseLoads) {
    Cm = 1;
    steps.push({ key: 'Cm', clause: '6.6.4.5.3(b)', label: 'Cm = 1.0, transverse loads between supports (6.6.4.5.3(b))', value: Cm });
  } else if (minimumGoverns) {
    Cm = 1;
    steps.push({ key: 'Cm', clause: '6.6.4.5.4', label: 'Cm = 1.0 since M2,min governs (6.6.4.5.4)', value: Cm });
  } else {
    Cm = 0.6 - 0.4 * ratio;
    steps.push({ key: 'Cm', clause: '6.6.4.5.3(a)', label: 'Cm = 0.6 − 0.4(M1/M2) (6.6.4.5.3(a))', value: Cm });
  }

  const stable = Pu < 0.75 * Pc;
  const raw = stable ? Cm / (1 - Pu / (0.75 * Pc)) : Infinity;
  const delta = Math.max(1, raw);
  steps.push({ key: 'load-over-critical', clause: '6.6.4.5.2', label: 'Pu/(0.75·Pc)', value: Pu / (0.75 * Pc) });
  steps.push({ key: 'delta', clause: '6.6.4.5.2', label: 'δ = Cm/(1 − Pu/(0.75Pc)) ≥ 1.0 (6.6.4.5.2)', value: delta });
  if (!stable) warnings.push(`Pu ≥ 0.75·Pc: the column is unstable by ${cl.edition} 6.6.4.5.2; enlarge the section or brace it`);
  const magnified = delta * M2c;
  steps.push({ key: 'Mc', clause: '6.6.4.5.1', label: 'Mc = δ·M2 (6.6.4.5.1)', value: magnified, unit: mu });
  const secondOrderRatio = magnified / M2c;
  const within = secondOrderRatio <= 1.4;
  steps.push({ key: 'second-order-ratio', clause: cl.secondOrderLimit, label: `Mc ÷ first-order M2 ≤ 1.4 (${cl.secondOrderLimit})`, value: secondOrderRatio });
  if (stable && !within) warnings.push(`second-order moment exceeds 1.4 × the first-order moment (${cl.edition} ${cl.secondOrderLimit}); the column is too slender for this method`);
  return {
    method,
    neglected: false,
    delta,
    magnifiedMoment: magnified,
    firstOrderMoment: M2c,
    ok: stable && within,
    ...(!stable ? { limitClause: `${cl.edition} 6.6.4.5.2 (Pu ≥ 0.75·Pc)` } : !within ? { limitClause: `${cl.edition} ${cl.secondOrderLimit} (second-order moment ≤ 1.4 × first-order)` } : {}),
    warnings,
    steps,
  };
}
