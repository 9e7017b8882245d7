/**
 * Sway (unbraced) columns by moment magnification, shared by the rulebooks whose method splits the end
 * moments into non-sway and sway parts (ACI 318-19 / 318-14 6.6.4.6; CSA A23.3-19 10.16, from memory):
 *
 *   kℓu/r ≤ limit? ─no─▶ δs (stability index Q, or storey sums) ─▶ M1 = M1ns + δs·M1s, M2 = M2ns + δs·M2s
 *        │                                                         ─▶ end moment (≥ the minimum)
 *        yes: the first-order end moments                          ─▶ along the length: the basis's braced
 *                                                                      method with M1, M2 and kℓu as braced
 *   design moment = the larger of the end moment and the moment along the length.
 *
 * Each basis gives its clause numbers (`SwayMagnifierClauses`); nothing here knows a code's name. Pure: no I/O.
 */
import type { RuleDef } from './rules.js';
import {
  asEndPair,
  depthOf,
  nestedSteps,
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

/** Where a basis puts the clauses of its sway magnifier, and its limits. */
export interface SwayMagnifierClauses {
  /** e.g. 'ACI 318-19' */
  edition: string;
  /** method title */
  title: string;
  /** the symbol of the factored axial load in labels: 'Pu' (ACI) or 'Pf' (CSA) */
  P: string;
  /** r = 0.30h / 0.25D */
  radius: string;
  /** slenderness may be neglected when kℓu/r ≤ limit; absent: never neglected (pmchart's conservative reading) */
  neglect?: { clause: string; limit: number };
  /** M1 = M1ns + δs·M1s, M2 = M2ns + δs·M2s */
  ends: string;
  /** δs = 1/(1 − Q), and the largest δs it may give */
  fromQ: { clause: string; maxDelta: number };
  /** δs = 1/(1 − ΣP/(0.75·ΣPc)) */
  fromSums: string;
  /** the check along the length by the braced method */
  alongLength: string;
  /** the minimum moment on the end moment: Pu(0.6 + 0.03h) in. or (15 + 0.03h) mm */
  minMoment: string;
  /** second-order moment ≤ 1.4 × first-order; absent where the basis has no such limit */
  secondOrderLimit?: string;
  source: RuleDef['source'];
}

/** The rules of a sway magnifier, for the basis's rulebook. */
export function swayMagnifierRules(c: SwayMagnifierClauses): RuleDef[] {
  const src = c.source;
  return [
    ...(c.neglect
      ? [{ id: 'sway-slenderness-limit', clause: c.neglect.clause, title: `sway column: slenderness may be neglected when kℓu/r ≤ ${c.neglect.limit}`, source: src }]
      : [{ id: 'sway-slenderness-limit', clause: c.ends, title: 'sway column: no neglect limit applied (pmchart: always magnified, conservative)', source: src }]),
    { id: 'sway-end-moments', clause: c.ends, title: 'M1 = M1ns + δs·M1s, M2 = M2ns + δs·M2s; the sway parts default to equal moments in reverse curvature', source: src },
    { id: 'sway-magnifier', clause: `${c.fromQ.clause}, ${c.fromSums}`, title: `δs = 1/(1 − Q) ≥ 1 (only while δs ≤ ${c.fromQ.maxDelta}), or δs = 1/(1 − Σ${c.P}/(0.75·ΣPc)) ≥ 1`, source: src },
    { id: 'sway-stability-limit', clause: `${c.fromQ.clause}, ${c.fromSums}`, title: `Q ≥ 1 or Σ${c.P} ≥ 0.75·ΣPc: unstable; δs from Q above ${c.fromQ.maxDelta}: outside the scope of the Q method`, source: src },
    { id: 'sway-along-length', clause: c.alongLength, title: 'along the length: the braced magnifier with the sway-magnified M1, M2 and kℓu as braced (k ≤ 1; not given: the sway kℓu, conservative)', source: src },
  ];
}

/** A sway method by moment magnification over a basis's braced method. */
export function swayMagnifierMethod(c: SwayMagnifierClauses, braced: () => SlendernessMethod): SwayMethod {
  return {
    title: c.title,
    inputs: { moments: 'split', stabilityIndex: true, storeySums: true, needsStorey: true, bracedLength: true, restraint: false },
    rules: swayMagnifierRules(c),
    check: (basis, section, input, ctx) => swayMagnification(basis, section, input, ctx, c, braced()),
  };
}

/** One axis of a sway column by moment magnification (internal units; M1 and M2 the non-sway parts). */
export function swayMagnification(
  basis: Basis,
  section: SlendernessSection,
  input: SlendernessInput & { sway: SwayInput },
  ctx: SlendernessContext,
  cl: SwayMagnifierClauses,
  braced: SlendernessMethod,
): SlendernessResult {
  const method = cl.title;
  const us = basis.units === 'us';
  const lu = us ? 'in' : 'mm';
  const fu = us ? 'kip' : 'N';
  const mu = us ? 'kip·in' : 'N·mm';
  const steps: SlendernessStep[] = [];
  const warnings: string[] = [];
  const { shape } = section;
  const h = depthOf(shape);
  const { effectiveLength: klu, Pu, sway } = input;
  const P = cl.P;

  const r = shape.kind === 'rectangle' ? 0.3 * h : 0.25 * h;
  steps.push({ key: 'r', clause: cl.radius, label: `r = ${shape.kind === 'rectangle' ? '0.30·h' : '0.25·D'} (${cl.radius})`, value: r, unit: lu });
  const slenderness = klu / r;
  steps.push({ key: 'klu-over-r', clause: cl.neglect?.clause ?? cl.ends, label: 'kℓu/r, kℓu unbraced (sway)', value: slenderness });
  // first-order end moments: non-sway and sway parts added at each end (the internal sign of M1, M2)
  const first = asEndPair(input.M2 + sway.M2s, input.M1 + sway.M1s);
  steps.push({ key: 'M2ns', clause: cl.ends, label: 'M2ns, non-sway part at the end of M2', value: input.M2, unit: mu });
  steps.push({ key: 'M2s', clause: cl.ends, label: 'M2s, sway part at the end of M2', value: sway.M2s, unit: mu });
  steps.push({ key: 'M1ns', clause: cl.ends, label: 'M1ns, non-sway part at the end of M1 (negative in single curvature)', value: input.M1, unit: mu });
  steps.push({ key: 'M1s', clause: cl.ends, label: 'M1s, sway part at the end of M1 (of the sign of M2s in reverse curvature)', value: sway.M1s, unit: mu });
  if (cl.neglect) {
    steps.push({ key: 'limit', clause: cl.neglect.clause, label: `limit for a sway column (${cl.neglect.clause})`, value: cl.neglect.limit });
    const neglected = slenderness <= cl.neglect.limit * (1 + 1e-12);
    steps.push({ key: 'neglected', clause: cl.neglect.clause, label: `slenderness may be neglected (${cl.neglect.clause})`, value: neglected });
    if (neglected) {
      steps.push({ key: 'M-first-order', clause: cl.ends, label: 'first-order end moment = the larger |Mns + Ms| of the two ends', value: first.M2, unit: mu });
      return { method, neglected: true, delta: 1, magnifiedMoment: first.M2, firstOrderMoment: first.M2, ok: true, warnings, steps };
    }
  } else {
    steps.push({ key: 'neglected', clause: cl.ends, label: `no neglect limit for a sway column applied (${cl.edition} ${cl.ends}, pmchart: conservative)`, value: false });
  }

  // δs: the storey sums where given (6.6.4.6.2(b)), else the stability index (6.6.4.6.2(a))
  let deltaS: number;
  let stable: boolean;
  let withinQ = true;
  let limitClause: string | undefined;
  if (sway.storeyPu !== undefined && sway.storeyPc !== undefined) {
    steps.push({ key: 'storey-Pu', clause: cl.fromSums, label: `Σ${P} of the storey`, value: sway.storeyPu, unit: fu });
    steps.push({ key: 'storey-Pc', clause: cl.fromSums, label: 'ΣPc of the storey', value: sway.storeyPc, unit: fu });
    const ratio = sway.storeyPu / (0.75 * sway.storeyPc);
    steps.push({ key: 'storey-ratio', clause: cl.fromSums, label: `Σ${P}/(0.75·ΣPc) (${cl.fromSums})`, value: ratio });
    stable = ratio < 1;
    deltaS = stable ? Math.max(1, 1 / (1 - ratio)) : Infinity;
    steps.push({ key: 'delta-s', clause: cl.fromSums, label: `δs = 1/(1 − Σ${P}/(0.75·ΣPc)) ≥ 1 (${cl.fromSums})`, value: deltaS });
    if (!stable) {
      warnings.push(`Σ${P} ≥ 0.75·ΣPc: the storey is unstable by ${cl.edition} ${cl.fromSums}; stiffen the frame`);
      limitClause = `${cl.edition} ${cl.fromSums} (Σ${P} ≥ 0.75·ΣPc)`;
    }
  } else {
    const Q = sway.stabilityIndex ?? NaN;
    steps.push({ key: 'Q', clause: cl.fromQ.clause, label: 'stability index Q of the storey', value: Q });
    stable = Q < 1;
    deltaS = stable ? Math.max(1, 1 / (1 - Q)) : Infinity;
    steps.push({ key: 'delta-s', clause: cl.fromQ.clause, label: `δs = 1/(1 − Q) ≥ 1 (${cl.fromQ.clause})`, value: deltaS });
    if (!stable) {
      warnings.push(`Q ≥ 1: the storey is unstable by ${cl.edition} ${cl.fromQ.clause}; stiffen the frame`);
      limitClause = `${cl.edition} ${cl.fromQ.clause} (Q ≥ 1)`;
    } else {
      withinQ = deltaS <= cl.fromQ.maxDelta * (1 + 1e-12);
      steps.push({ key: 'delta-s-within-Q', clause: cl.fromQ.clause, label: `δs ≤ ${cl.fromQ.maxDelta}, the scope of δs from Q (${cl.fromQ.clause})`, value: withinQ });
      if (!withinQ) {
        warnings.push(`δs = ${deltaS.toFixed(3)} from Q exceeds ${cl.fromQ.maxDelta} (${cl.edition} ${cl.fromQ.clause}): give the storey sums (--storey-pu, --storey-pc) or use a second-order analysis`);
        limitClause = `${cl.edition} ${cl.fromQ.clause} (δs from Q > ${cl.fromQ.maxDelta})`;
      }
    }
  }
  if (!stable) return { method, neglected: false, delta: Infinity, magnifiedMoment: Infinity, firstOrderMoment: first.M2, ok: false, ...(limitClause ? { limitClause } : {}), warnings, steps };

  const end2 = input.M2 + deltaS * sway.M2s;
  const end1 = input.M1 + deltaS * sway.M1s;
  steps.push({ key: 'M2-sway', clause: cl.ends, label: `M2 = M2ns + δs·M2s (${cl.ends})`, value: end2, unit: mu });
  steps.push({ key: 'M1-sway', clause: cl.ends, label: `M1 = M1ns + δs·M1s (${cl.ends})`, value: end1, unit: mu });
  const ends = asEndPair(end2, end1);
  const hIn = us ? h : h / 25.4;
  const minimum = us ? Pu * (0.6 + 0.03 * hIn) : Pu * (15 + 0.03 * h);
  steps.push({ key: 'M2min', clause: cl.minMoment, label: us ? `M2,min = ${P}(0.6 + 0.03h), h in in. (${cl.minMoment})` : `M2,min = ${P}(15 + 0.03h), h in mm (${cl.minMoment})`, value: minimum, unit: mu });
  const endMoment = Math.max(ends.M2, minimum);
  steps.push({ key: 'M-end', clause: cl.ends, label: `end moment = max(larger |M1|, |M2|, M2,min) (${cl.ends}, ${cl.minMoment})`, value: endMoment, unit: mu });

  // along the length: the braced method with the sway-magnified end moments and kℓu as braced (k ≤ 1)
  const kluBraced = sway.bracedEffectiveLength ?? klu;
  steps.push({
    key: 'klu-braced',
    clause: cl.alongLength,
    label: sway.bracedEffectiveLength !== undefined ? `kℓu as braced, k ≤ 1 (${cl.alongLength})` : `kℓu as braced not given: the sway kℓu (${cl.alongLength}, conservative)`,
    value: kluBraced,
    unit: lu,
  });
  const { sway: _omit, ...bracedInput } = input;
  const along = braced.check(basis, section, { ...bracedInput, effectiveLength: kluBraced, M1: ends.M1, M2: ends.M2 }, ctx);
  steps.push(...nestedSteps(along.steps, 'along-', `along the length (${cl.alongLength}): `));
  if (!along.ok && !(along.delta < Infinity)) {
    warnings.push(...along.warnings);
    return { method, neglected: false, delta: Infinity, magnifiedMoment: Infinity, firstOrderMoment: first.M2, ok: false, limitClause: along.limitClause ?? `${cl.edition} ${cl.alongLength}`, warnings, steps };
  }
  steps.push({ key: 'M-along', clause: cl.alongLength, label: `moment along the length (${cl.alongLength})`, value: along.magnifiedMoment, unit: mu });
  const design = Math.max(endMoment, along.magnifiedMoment);
  steps.push({ key: 'Mc', clause: cl.alongLength, label: `design moment = max(end moment, moment along the length) (${cl.ends}, ${cl.alongLength})`, value: design, unit: mu });
  const firstOrder = Math.max(first.M2, minimum);
  steps.push({ key: 'M-first-order', clause: cl.ends, label: 'first-order moment = max(larger |Mns + Ms| of the two ends, M2,min)', value: firstOrder, unit: mu });
  let within = true;
  if (cl.secondOrderLimit) {
    const ratio = design / firstOrder;
    within = ratio <= 1.4 * (1 + 1e-12);
    steps.push({ key: 'second-order-ratio', clause: cl.secondOrderLimit, label: `design moment ÷ first-order moment ≤ 1.4 (${cl.secondOrderLimit})`, value: ratio });
    if (!within) {
      warnings.push(`second-order moment exceeds 1.4 × the first-order moment (${cl.edition} ${cl.secondOrderLimit}); the column is too slender for this method`);
      limitClause ??= `${cl.edition} ${cl.secondOrderLimit} (second-order moment ≤ 1.4 × first-order)`;
    }
  }
  return {
    method,
    neglected: false,
    delta: design / firstOrder,
    magnifiedMoment: design,
    firstOrderMoment: firstOrder,
    ok: withinQ && within,
    ...(limitClause ? { limitClause } : {}),
    warnings,
    steps,
  };
}
