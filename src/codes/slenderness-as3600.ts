/**
 * AS 3600-2018 10.3–10.5 braced moment magnifier: the AS rulebook for slender braced columns. Clause numbers
 * and formulas from memory of AS 3600-2018 (no published text of the clauses was found to confirm them).
 * Pure: no I/O; the balanced moment comes from the section analysis through the `SlendernessContext`.
 */
import type { RuleDef } from './rules.js';
import {
  AS_END_MOMENTS,
  depthOf,
  nestedSteps,
  grossA,
  type SlendernessContext,
  type SlendernessInput,
  type SlendernessMethod,
  type SlendernessResult,
  type SlendernessSection,
  type SlendernessStep,
  type SwayInput,
  type SwayMethod,
} from './slenderness.js';
import type { Basis } from './types.js';

export const AS_3600_SLENDERNESS_RULES: readonly RuleDef[] = [
  { id: 'slenderness-limit', clause: '10.3.1(b)', title: 'short braced column: Le/r ≤ 25, or ≤ αc·(38 − f′c/15)·(1 + M1*/M2*)', source: 'from memory' },
  { id: 'radius-of-gyration', clause: '10.5.2', title: 'r = 0.3D (rectangle), 0.25D (circle)', source: 'from memory' },
  { id: 'end-moment-convention', clause: '10.3.1', title: 'M1*/M2* negative in single curvature; taken as −1 when |M2*| ≤ 0.05·D·N* (and with transverse loads, conservative)', source: 'from memory' },
  // the text found is AS 3600-2009's 10.1.2 (the same words are recalled for 2018, not confirmed)
  { id: 'min-moment', clause: '10.1.2', title: 'design moment about each principal axis not less than N*·0.05·D', source: 'from memory' },
  { id: 'magnifier', clause: '10.4.2', title: 'δb = km/(1 − N*/Nc) ≥ 1, km = 0.6 − 0.4·M1*/M2* ≥ 0.4 (1.0 with transverse loads)', source: 'from memory' },
  { id: 'buckling-load', clause: '10.4.4', title: 'Nc = (π²/Le²)·182·do·(φ·Mub)/(1 + βd), φ = 0.6', source: 'from memory' },
  { id: 'stability-limit', clause: '10.4.2', title: 'N* < Nc, else unstable', source: 'from memory' },
  { id: 'scope-slenderness', clause: '10.5.1', title: 'Le/r ≤ 120 for the simplified method', source: 'from memory' },
];

/** AS 3600-2018 unbraced columns, from memory throughout (no published text of 10.4.3 found). */
export const AS_3600_SWAY_RULES: readonly RuleDef[] = [
  { id: 'sway-slenderness-limit', clause: '10.3.1(a)', title: 'short unbraced column: Le/r ≤ 22', source: 'from memory' },
  { id: 'sway-magnifier', clause: '10.4.3', title: 'δs = 1/(1 − ΣN*/ΣNc) ≥ 1 over the storey; δ = the larger of δb and δs on M2* (no split into non-sway and sway moments)', source: 'from memory' },
  { id: 'sway-braced-magnifier', clause: '10.4.2', title: 'δb of an unbraced column with Le as braced (not given: the unbraced Le, conservative)', source: 'from memory' },
  { id: 'sway-stability-limit', clause: '10.4.3', title: 'ΣN* ≥ ΣNc: unstable', source: 'from memory' },
];

/** The AS 3600-2018 method for unbraced columns (10.4.3, from memory). */
export const AS_3600_SWAY: SwayMethod = {
  title: 'AS 3600-2018 10.4.3 moment magnifier (unbraced)',
  inputs: { moments: 'none', stabilityIndex: false, storeySums: true, needsStorey: true, bracedLength: true, restraint: false },
  rules: AS_3600_SWAY_RULES,
  check: (basis, section, input, ctx) => as3600Unbraced(basis, section, input, ctx),
};

/** The AS 3600-2018 rulebook for slender columns, braced (10.4.2) and unbraced (10.4.3). */
export const AS_3600_SLENDERNESS: SlendernessMethod = {
  id: 'moment-magnification-as3600',
  title: 'AS 3600-2018 10.4 moment magnifier (braced)',
  convention: AS_END_MOMENTS,
  needsSustainedLoadRatio: true,
  rules: [...AS_3600_SLENDERNESS_RULES, ...AS_3600_SWAY_RULES],
  check: (basis, section, input, ctx) => as3600MomentMagnification(basis, section, input, ctx),
  sway: AS_3600_SWAY,
};

/**
 * AS 3600-2018 unbraced column for one axis (SI), from memory: 10.3.1(a) short when Le/r ≤ 22 (Le unbraced);
 * 10.4.3 δs = 1/(1 − ΣN* ÷ ΣNc) over the storey; δb by 10.4.2 with Le as braced; δ = max(δb, δs) on
 * M2* ≥ N*·0.05D (10.1.2); 10.5.1 Le/r ≤ 120 (unbraced Le).
 */
export function as3600Unbraced(basis: Basis, section: SlendernessSection, input: SlendernessInput & { sway: SwayInput }, ctx: SlendernessContext): SlendernessResult {
  const method = AS_3600_SWAY.title;
  const steps: SlendernessStep[] = [];
  const warnings: string[] = [];
  const { shape } = section;
  const D = depthOf(shape);
  const { effectiveLength: Le, M2, Pu: N, sway } = input;
  const r = shape.kind === 'rectangle' ? 0.3 * D : 0.25 * D;
  steps.push({ key: 'r', clause: '10.5.2', label: `r = ${shape.kind === 'rectangle' ? '0.3·D' : '0.25·D'} (10.5.2)`, value: r, unit: 'mm' });
  const slenderness = Le / r;
  steps.push({ key: 'klu-over-r', clause: '10.3.1(a)', label: 'Le/r, Le unbraced (10.3.1(a))', value: slenderness });
  steps.push({ key: 'limit', clause: '10.3.1(a)', label: 'limit for an unbraced column (10.3.1(a), from memory)', value: 22 });
  const neglected = slenderness <= 22 * (1 + 1e-12);
  steps.push({ key: 'neglected', clause: '10.3.1(a)', label: 'short column: slenderness may be neglected (10.3.1(a))', value: neglected });
  const Mmin = N * 0.05 * D;
  steps.push({ key: 'M2min', clause: '10.1.2', label: 'M*min = N*·0.05·D (10.1.2)', value: Mmin, unit: 'N·mm' });
  const M2c = Math.max(M2, Mmin);
  steps.push({ key: 'M2-used', clause: '10.1.2', label: 'M2* used = max(M2*, N*·0.05·D) (10.1.2)', value: M2c, unit: 'N·mm' });
  const withinScope = slenderness <= 120 * (1 + 1e-12);
  steps.push({ key: 'scope', clause: '10.5.1', label: 'Le/r ≤ 120, the scope of the moment magnifier (10.5.1, from memory)', value: withinScope });
  const scope = withinScope ? {} : { limitClause: 'AS 3600-2018 10.5.1 (Le/r ≤ 120, from memory)' };
  if (!withinScope) warnings.push('Le/r exceeds 120 (AS 3600-2018 10.5.1, from memory): outside the moment-magnifier method; a rigorous analysis is needed');
  if (neglected) return { method, neglected, delta: 1, magnifiedMoment: M2c, firstOrderMoment: M2c, ok: withinScope, ...scope, warnings, steps };

  const sumN = sway.storeyPu ?? NaN;
  const sumNc = sway.storeyPc ?? NaN;
  steps.push({ key: 'storey-Pu', clause: '10.4.3', label: 'ΣN* of the storey', value: sumN, unit: 'N' });
  steps.push({ key: 'storey-Pc', clause: '10.4.3', label: 'ΣNc of the storey (each column with its unbraced Le)', value: sumNc, unit: 'N' });
  const ratio = sumN / sumNc;
  steps.push({ key: 'storey-ratio', clause: '10.4.3', label: 'ΣN*/ΣNc (10.4.3)', value: ratio });
  const stable = ratio < 1;
  const deltaS = stable ? Math.max(1, 1 / (1 - ratio)) : Infinity;
  steps.push({ key: 'delta-s', clause: '10.4.3', label: 'δs = 1/(1 − ΣN*/ΣNc) ≥ 1 (10.4.3, from memory)', value: deltaS });
  if (!stable) {
    warnings.push('ΣN* ≥ ΣNc: the storey is unstable by AS 3600-2018 10.4.3 (from memory); stiffen the frame');
    return { method, neglected: false, delta: Infinity, magnifiedMoment: Infinity, firstOrderMoment: M2c, ok: false, limitClause: 'AS 3600-2018 10.4.3 (ΣN* ≥ ΣNc)', warnings, steps };
  }
  const LeB = sway.bracedEffectiveLength ?? Le;
  steps.push({ key: 'klu-braced', clause: '10.4.2', label: sway.bracedEffectiveLength !== undefined ? 'Le as braced, for δb (10.4.2)' : 'Le as braced not given: the unbraced Le for δb (conservative)', value: LeB, unit: 'mm' });
  const { sway: _omit, ...bracedInput } = input;
  const b = as3600MomentMagnification(basis, section, { ...bracedInput, effectiveLength: LeB }, ctx);
  steps.push(...nestedSteps(b.steps, 'braced-', 'δb (10.4.2): '));
  if (!b.ok && !(b.delta < Infinity)) {
    warnings.push(...b.warnings);
    return { method, neglected: false, delta: Infinity, magnifiedMoment: Infinity, firstOrderMoment: M2c, ok: false, limitClause: b.limitClause ?? 'AS 3600-2018 10.4.2', warnings, steps };
  }
  const deltaB = b.delta;
  const delta = Math.max(deltaB, deltaS);
  steps.push({ key: 'delta', clause: '10.4.3', label: 'δ = the larger of δb and δs (10.4.3, from memory)', value: delta });
  const magnified = delta * M2c;
  steps.push({ key: 'Mc', clause: '10.4.3', label: 'M* = δ·M2* (10.4.3)', value: magnified, unit: 'N·mm' });
  return { method, neglected: false, delta, magnifiedMoment: magnified, firstOrderMoment: M2c, ok: withinScope, ...scope, warnings, steps };
}

/**
 * AS 3600-2018 braced column moment magnifier for one axis (SI: N, mm, N·mm). From memory of the standard:
 * 10.5.2 r = 0.3D (rectangle), 0.25D (circle); 10.3.1(b) short braced column when Le/r ≤ 25 or
 * Le/r ≤ αc(38 − f′c/15)(1 + M1* ÷ M2*), αc = √(2.25 − 2.5·N* ÷ (0.6Nuo)) for N* ÷ (0.6Nuo) ≥ 0.15, else
 * √(1/(3.5·N* ÷ (0.6Nuo))); 10.1.2 M2* ≥ N*·0.05D; 10.4.2 km = 0.6 − 0.4·M1* ÷ M2* ≥ 0.4 (1.0 with transverse
 * loads); 10.4.4 Nc = (π²/Le²)·182·do·(φ·Mub)/(1 + βd) with φ = 0.6 and Mub the balanced moment;
 * 10.4.2 δb = km/(1 − N* ÷ Nc) ≥ 1.
 */
export function as3600MomentMagnification(basis: Basis, section: SlendernessSection, input: SlendernessInput, ctx: SlendernessContext): SlendernessResult {
  const method = 'AS 3600-2018 10.4 moment magnifier (braced)';
  const steps: SlendernessStep[] = [];
  const warnings: string[] = [];
  const { shape } = section;
  const D = depthOf(shape);
  const Ag = grossA(shape);
  const { effectiveLength: Le, M1, M2, Pu: N } = input;
  // 10.3.1, 10.4.2 (from memory): M1*/M2* is taken as −1 when |M2*| ≤ 0.05·D·N* (and with no end moment)
  const smallM2 = !(M2 > 0.05 * D * N);
  // transverse loads between the ends: −1 as well (pmchart's conservative reading; km is 1.0 then anyway)
  const ratio = smallM2 || input.transverseLoads === true ? -1 : M1 / M2;
  const knownBars = section.positionsOnly ? section.bars.map((b) => ({ ...b, area: 0 })) : section.bars;
  const As = knownBars.reduce((s, b) => s + b.area, 0);
  const Nuo = basis.nominal.squash.concreteStress * (Ag - As) + basis.nominal.squash.steelStress * As;

  const r = shape.kind === 'rectangle' ? 0.3 * D : 0.25 * D;
  steps.push({ key: 'r', clause: '10.5.2', label: `r = ${shape.kind === 'rectangle' ? '0.3·D' : '0.25·D'} (10.5.2)`, value: r, unit: 'mm' });
  const slenderness = Le / r;
  steps.push({ key: 'klu-over-r', clause: '10.3.1', label: 'Le/r (10.3.1)', value: slenderness });
  steps.push({ key: 'end-moment-ratio', clause: '10.3.1',
    label: smallM2
      ? 'M1*/M2* = −1: |M2*| ≤ 0.05·D·N* (10.3.1, from memory)'
      : input.transverseLoads === true
        ? 'M1*/M2* = −1: transverse loads between the ends (conservative)'
        : 'M1*/M2* (negative in single curvature, 10.3.1)',
    value: ratio,
  });
  steps.push({ key: 'Nuo', clause: '10.6.2.2', label: `Nuo = α1·f′c·(Ag − As) + fsy·As (10.6.2.2)${section.positionsOnly ? ', bars not given: As = 0' : ''}`, value: Nuo, unit: 'N' });
  const q = N / (0.6 * Nuo);
  const alphaC = q >= 0.15 ? Math.sqrt(Math.max(0, 2.25 - 2.5 * q)) : Math.sqrt(1 / (3.5 * q));
  steps.push({ key: 'alpha-c', clause: '10.3.1', label: 'αc = √(2.25 − 2.5·N*/(0.6Nuo)) for N*/(0.6Nuo) ≥ 0.15, else √(1/(3.5·N*/(0.6Nuo))) (10.3.1)', value: alphaC });
  const limit = Math.max(25, alphaC * (38 - basis.fc / 15) * (1 + ratio));
  steps.push({ key: 'limit', clause: '10.3.1(b)', label: 'limit max(25, αc·(38 − f′c/15)·(1 + M1*/M2*)) (10.3.1(b))', value: limit });
  const neglected = slenderness <= limit * (1 + 1e-12);
  steps.push({ key: 'neglected', clause: '10.3.1', label: 'short column: slenderness may be neglected (10.3.1)', value: neglected });
  const Mmin = N * 0.05 * D;
  steps.push({ key: 'M2min', clause: '10.1.2', label: 'M*min = N*·0.05·D (10.1.2)', value: Mmin, unit: 'N·mm' });
  const M2c = Math.max(M2, Mmin);
  steps.push({ key: 'M2-used', clause: '10.1.2', label: 'M2* used = max(M2*, N*·0.05·D) (10.1.2)', value: M2c, unit: 'N·mm' });
  // 10.5.1 (from memory): the simplified column rules apply up to Le/r = 120; beyond, a rigorous analysis is needed
  const withinScope = slenderness <= 120 * (1 + 1e-12);
  steps.push({ key: 'scope', clause: '10.5.1', label: 'Le/r ≤ 120, the scope of the moment magnifier (10.5.1, from memory)', value: withinScope });
  if (!withinScope) warnings.push('Le/r exceeds 120 (AS 3600-2018 10.5.1, from memory): outside the moment-magnifier method; a rigorous analysis is needed');
  const scopeClause = withinScope ? {} : { limitClause: 'AS 3600-2018 10.5.1 (Le/r ≤ 120, from memory)' };
  if (neglected) return { method, neglected, delta: 1, magnifiedMoment: M2c, firstOrderMoment: M2c, ok: withinScope, ...scopeClause, warnings, steps };

  // balanced moment Mub at kuo = εcu/(εcu + εsy) about the bending axis (bars y toward the compression face)
  const yMin = section.bars.length > 0 ? Math.min(...section.bars.map((b) => b.y)) : -0.4 * D;
  const dO = D / 2 - yMin;
  steps.push({ key: 'do', clause: '10.4.4', label: `do = depth of the extreme tension bar${section.positionsOnly ? ' (bar positions from γ)' : ''}`, value: dO, unit: 'mm' });
  const epsCu = basis.profile(1, 1).top;
  const epsSy = basis.nominal.steel.yieldStress / basis.Es;
  const kuoB = epsCu / (epsCu + epsSy);
  steps.push({ key: 'kuo-balanced', clause: '10.4.4', label: 'kuo balanced = εcu/(εcu + εsy) (10.4.4, for Mub)', value: kuoB });
  const Mub = ctx.sectionMoment(basis, shape, knownBars, kuoB * dO);
  steps.push({ key: 'Mub', clause: '10.4.4', label: `Mub, balanced moment${section.positionsOnly ? ' of the concrete alone (bars not given, conservative)' : ''}`, value: Mub, unit: 'N·mm' });
  const betaD = input.betaDns ?? 0;
  steps.push({ key: 'beta-d', clause: '10.4.4', label: 'βd, sustained ÷ total axial load (10.4.4)', value: betaD });
  const Nc = ((Math.PI ** 2) / (Le * Le)) * ((182 * dO * 0.6 * Mub) / (1 + betaD));
  steps.push({ key: 'Nc', clause: '10.4.4', label: 'Nc = (π²/Le²)·182·do·(φ·Mub)/(1 + βd), φ = 0.6 (10.4.4)', value: Nc, unit: 'N' });
  let km: number;
  if (input.transverseLoads) {
    km = 1;
    steps.push({ key: 'km', clause: '10.4.2', label: 'km = 1.0, transverse loads between the ends (10.4.2)', value: km });
  } else {
    km = Math.max(0.4, 0.6 - 0.4 * ratio);
    steps.push({ key: 'km', clause: '10.4.2', label: smallM2 ? 'km = 0.6 − 0.4·(−1) = 1.0, M1*/M2* taken as −1 (10.4.2, from memory)' : 'km = 0.6 − 0.4·M1*/M2* ≥ 0.4 (10.4.2)', value: km });
  }
  const stable = N < Nc;
  const delta = stable ? Math.max(1, km / (1 - N / Nc)) : Infinity;
  steps.push({ key: 'load-over-critical', clause: '10.4.2', label: 'N*/Nc (10.4.2)', value: N / Nc });
  steps.push({ key: 'delta', clause: '10.4.2', label: 'δb = km/(1 − N*/Nc) ≥ 1 (10.4.2)', value: delta });
  if (!stable) warnings.push('N* ≥ Nc: the column is unstable by AS 3600-2018 10.4.2; enlarge the section or brace it');
  const magnified = delta * M2c;
  steps.push({ key: 'Mc', clause: '10.4.2', label: 'M* = δb·M2* (10.4.2)', value: magnified, unit: 'N·mm' });
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

