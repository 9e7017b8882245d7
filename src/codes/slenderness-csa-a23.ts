/**
 * CSA A23.3-19 10.15 non-sway moment magnifier: the CSA rulebook for slender braced columns (from memory of
 * the standard; no published text of the clauses was found to confirm them). Pure: no I/O.
 */
import { ERROR_CODES, PmError } from '../errors.js';
import type { RuleDef } from './rules.js';
import {
  CSA_END_MOMENTS,
  depthOf,
  grossA,
  grossI,
  type SlendernessInput,
  type SlendernessMethod,
  type SlendernessResult,
  type SlendernessSection,
  type SlendernessStep,
} from './slenderness.js';
import { swayMagnifierMethod, type SwayMagnifierClauses } from './sway-magnifier.js';
import type { Basis } from './types.js';

export const CSA_A23_SLENDERNESS_RULES: readonly RuleDef[] = [
  { id: 'slenderness-limit', clause: '10.15.2', title: 'slenderness may be neglected when kℓu/r ≤ (25 − 10·M1/M2)/√(Pf/(f′c·Ag))', source: 'from memory' },
  { id: 'radius-of-gyration', clause: '10.14.2', title: 'r = 0.3h (rectangle), 0.25D (circle)', source: 'from memory' },
  { id: 'end-moment-convention', clause: '10.15.3.2', title: 'M1/M2 positive in single curvature; no end moment given or transverse loads: single curvature (conservative)', source: 'from memory' },
  { id: 'min-moment', clause: '10.15.3.1', title: 'M2 ≥ Pf·(15 + 0.03h) mm', source: 'from memory' },
  { id: 'magnifier', clause: '10.15.3.1', title: 'δ = Cm/(1 − Pf/(φm·Pc)) ≥ 1.0, φm = 0.75, EI = 0.4·Ec·Ig/(1 + βd)', source: 'from memory' },
  { id: 'cm-factor', clause: '10.15.3.2', title: 'Cm = 0.6 + 0.4·M1/M2 ≥ 0.4; 1.0 with transverse loads', source: 'from memory' },
  { id: 'stability-limit', clause: '10.15.3.1', title: 'Pf < 0.75·Pc, else unstable', source: 'from memory' },
];

/**
 * CSA A23.3-19 10.16 sway frames (from memory; no published text found): 10.16.2 M1 = M1ns + δs·M1s,
 * M2 = M2ns + δs·M2s; 10.16.3.1 δs = 1/(1 − ΣPf/(φm·ΣPc)) ≥ 1, φm = 0.75; 10.16.3.2 δs = 1/(1 − Q) while
 * δs ≤ 1.5; 10.16.4 the column checked along its length by 10.15.3 with those M1, M2 and k as braced.
 * No sway neglect limit is applied (pmchart's conservative reading); no 1.4 limit (CSA has none in 10.15).
 */
const CSA_SWAY_CLAUSES: SwayMagnifierClauses = {
  edition: 'CSA A23.3-19',
  title: 'CSA A23.3-19 10.16 moment magnifier (sway)',
  P: 'Pf',
  radius: '10.14.2',
  ends: '10.16.2',
  fromQ: { clause: '10.16.3.2', maxDelta: 1.5 },
  fromSums: '10.16.3.1',
  alongLength: '10.16.4',
  minMoment: '10.15.3.1',
  source: 'from memory',
};

const CSA_SWAY = swayMagnifierMethod(CSA_SWAY_CLAUSES, () => CSA_A23_SLENDERNESS);

/** The CSA A23.3-19 rulebook for slender columns, braced (10.15) and sway (10.16). */
export const CSA_A23_SLENDERNESS: SlendernessMethod = {
  id: 'moment-magnification-csa-a23',
  title: 'CSA A23.3-19 10.15.3 moment magnifier (non-sway)',
  convention: CSA_END_MOMENTS,
  needsSustainedLoadRatio: true,
  rules: [...CSA_A23_SLENDERNESS_RULES, ...CSA_SWAY.rules],
  check: (basis, section, input) => csaMomentMagnification(basis, section, input),
  sway: CSA_SWAY,
};

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
  // CSA sign: positive in single curvature; no end moment (M2 = 0): single curvature, +1 (conservative)
  // transverse loads between the ends: single curvature too (pmchart's conservative reading)
  const ratio = M2 > 0 && input.transverseLoads !== true ? -input.M1 / M2 : 1;
  const r = shape.kind === 'rectangle' ? 0.3 * h : 0.25 * h;
  steps.push({ key: 'r', clause: '10.14.2', label: `r = ${shape.kind === 'rectangle' ? '0.3·h' : '0.25·D'} (10.14.2)`, value: r, unit: 'mm' });
  const slenderness = klu / r;
  steps.push({ key: 'klu-over-r', clause: '10.15.2', label: 'kℓu/r (10.15.2)', value: slenderness });
  steps.push({ key: 'end-moment-ratio', clause: '10.15.2', label: 'M1/M2 (positive in single curvature, 10.15.2)', value: ratio });
  const limit = (25 - 10 * ratio) / Math.sqrt(Pf / (basis.fc * Ag));
  steps.push({ key: 'limit', clause: '10.15.2', label: 'limit (25 − 10·M1/M2)/√(Pf/(f′c·Ag)) (10.15.2)', value: limit });
  const neglected = slenderness <= limit * (1 + 1e-12);
  steps.push({ key: 'neglected', clause: '10.15.2', label: 'slenderness may be neglected (10.15.2)', value: neglected });
  if (neglected) return { method, neglected, delta: 1, magnifiedMoment: M2, firstOrderMoment: M2, ok: true, warnings, steps };

  const Ec = csaEc(basis.fc);
  steps.push({ key: 'Ec', clause: '8.6.2.3', label: 'Ec = 4500·√f′c (8.6.2.3)', value: Ec, unit: 'MPa' });
  steps.push({ key: 'Ig', clause: '10.15.3.1', label: 'Ig', value: Ig, unit: 'mm⁴' });
  const betaD = input.betaDns ?? 0;
  steps.push({ key: 'beta-d', clause: '10.15.3.1', label: 'βd, factored sustained ÷ total axial load (10.15.3.1)', value: betaD });
  const M2min = Pf * (15 + 0.03 * h);
  steps.push({ key: 'M2min', clause: '10.15.3.1', label: 'M2,min = Pf·(15 + 0.03h) (10.15.3.1)', value: M2min, unit: 'N·mm' });
  const minimumGoverns = M2min > M2;
  const M2c = Math.max(M2, M2min);
  steps.push({ key: 'M2-used', clause: '10.15.3.1', label: 'M2 used = max(M2, M2,min) (10.15.3.1)', value: M2c, unit: 'N·mm' });
  if (input.eiOption === 'c') throw new PmError(ERROR_CODES.invalidValue, 'eiOption', 'c is ACI 318 only; CSA A23.3-19 10.15.3.1 offers a or b', { value: 'c', allowed: 'a, b' });
  let EI: number;
  if ((input.eiOption ?? 'a') === 'b') {
    const Ist = bars.reduce((s, b) => s + b.area * b.y * b.y, 0);
    steps.push({ key: 'Ist', clause: '10.15.3.1', label: 'Ist = Σ As·y²', value: Ist, unit: 'mm⁴' });
    EI = (0.2 * Ec * Ig + basis.Es * Ist) / (1 + betaD);
    steps.push({ key: 'EI', clause: '10.15.3.1', label: 'EI = (0.2·Ec·Ig + Es·Ist)/(1 + βd) (10.15.3.1)', value: EI, unit: 'N·mm²' });
  } else {
    EI = (0.4 * Ec * Ig) / (1 + betaD);
    steps.push({ key: 'EI', clause: '10.15.3.1', label: 'EI = 0.4·Ec·Ig/(1 + βd) (10.15.3.1)', value: EI, unit: 'N·mm²' });
  }
  const Pc = (Math.PI ** 2 * EI) / (klu * klu);
  steps.push({ key: 'Pc', clause: '10.15.3.1', label: 'Pc = π²·EI/(kℓu)² (10.15.3.1)', value: Pc, unit: 'N' });
  let Cm: number;
  if (input.transverseLoads) {
    Cm = 1;
    steps.push({ key: 'Cm', clause: '10.15.3.2', label: 'Cm = 1.0, transverse loads between supports (10.15.3.2)', value: Cm });
  } else if (minimumGoverns) {
    Cm = 1;
    steps.push({ key: 'Cm', clause: '10.15.3.2', label: 'Cm = 1.0 since M2,min governs (common practice, as ACI 318-19 6.6.4.5.4)', value: Cm });
  } else {
    Cm = Math.max(0.4, 0.6 + 0.4 * ratio);
    steps.push({ key: 'Cm', clause: '10.15.3.2', label: 'Cm = 0.6 + 0.4·M1/M2 ≥ 0.4 (10.15.3.2)', value: Cm });
  }
  const stable = Pf < 0.75 * Pc;
  const delta = stable ? Math.max(1, Cm / (1 - Pf / (0.75 * Pc))) : Infinity;
  steps.push({ key: 'load-over-critical', clause: '10.15.3.1', label: 'Pf/(φm·Pc), φm = 0.75', value: Pf / (0.75 * Pc) });
  steps.push({ key: 'delta', clause: '10.15.3.1', label: 'δ = Cm/(1 − Pf/(φm·Pc)) ≥ 1.0 (10.15.3.1)', value: delta });
  if (!stable) warnings.push('Pf ≥ 0.75·Pc: the column is unstable by CSA A23.3-19 10.15.3.1; enlarge the section or brace it');
  const magnified = delta * M2c;
  steps.push({ key: 'Mc', clause: '10.15.3.1', label: 'Mc = δ·M2 (10.15.3.1)', value: magnified, unit: 'N·mm' });
  return { method, neglected: false, delta, magnifiedMoment: magnified, firstOrderMoment: M2c, ok: stable, ...(stable ? {} : { limitClause: 'CSA A23.3-19 10.15.3.1 (Pf ≥ 0.75·Pc)' }), warnings, steps };
}

