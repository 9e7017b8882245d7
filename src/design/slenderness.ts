/**
 * Slender columns braced against sidesway: the second-order moment for one bending axis, by the method the
 * basis carries as its rulebook (`Basis.slenderness`, src/codes/slenderness-*.ts):
 *   - ACI 318-19 / 318-14 6.6.4 moment magnification (non-sway);
 *   - EN 1992-1-1 5.8.8 nominal curvature;
 *   - AS 3600-2018 10.4 braced moment magnifier; CSA A23.3-19 10.15.3 non-sway magnifier.
 * This module validates the input, handles no axial compression, and hands the method the section
 * analysis it needs (`SlendernessContext`); nothing here branches on a code's name or a method's id.
 * Every step is kept in the result for the report, with a stable `key` and its `clause`. Pure: no I/O.
 */
import { biaxialResultant, prepareBiaxial } from '../analysis/biaxial.js';
import {
  OPPOSITE_SIGN_END_MOMENTS,
  type EndMomentConvention,
  type SlendernessContext,
  type SlendernessInput,
  type SlendernessResult,
  type SlendernessSection,
  type SwayInput,
  type SwayInputs,
} from '../codes/slenderness.js';
import type { Basis } from '../codes/types.js';
import { ERROR_CODES, PmError } from '../errors.js';

export * from '../codes/slenderness.js';
export { aciEc, aciMomentMagnification } from '../codes/slenderness-aci318.js';
export { enNominalCurvature, enUnbraced, enUnbracedLengthFactor } from '../codes/slenderness-en1992.js';
export { as3600Unbraced } from '../codes/slenderness-as3600.js';
export { swayMagnification } from '../codes/sway-magnifier.js';
export { as3600MomentMagnification } from '../codes/slenderness-as3600.js';
export { csaEc, csaMomentMagnification } from '../codes/slenderness-csa-a23.js';

/** The end-moment convention of the basis's slenderness method (opposite-sign where it declares none). */
export function endMomentConvention(basis: Basis): EndMomentConvention {
  return basis.slenderness?.convention ?? OPPOSITE_SIGN_END_MOMENTS;
}

/** The section analysis a method may ask for (codes/ may not import analysis/). */
export const SLENDERNESS_CONTEXT: SlendernessContext = {
  sectionMoment: (basis, shape, bars, c) => Math.abs(biaxialResultant(prepareBiaxial(basis, shape, bars), 0, c, 'nominal').Mx),
};

/** Runs the method the basis carries. */
export function slendernessCheck(basis: Basis, section: SlendernessSection, input: SlendernessInput): SlendernessResult {
  const method = basis.slenderness;
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
      steps: [{ key: 'no-compression', clause: method?.rules.find((r) => r.id === 'slenderness-limit')?.clause ?? '', label: 'Pu ≤ 0: no axial compression, so no member second-order moment', value: input.Pu }],
    };
  }
  if (!method) throw new PmError(ERROR_CODES.notPossible, 'klu', `is not supported: ${basis.title} declares no slenderness method in pmchart`);
  const { sway } = input;
  if (sway) {
    // a basis whose rulebook has no sway method: a typed "not covered" finding (outside the scope), not a guess
    if (!method.sway) return notCovered(basis, input);
    validateSway(sway, method.sway.inputs);
    return method.sway.check(basis, section, { ...input, sway }, SLENDERNESS_CONTEXT);
  }
  return method.check(basis, section, input, SLENDERNESS_CONTEXT);
}

/** A sway column on a basis whose rulebook has no sway method: outside what pmchart covers (status outside-scope). */
function notCovered(basis: Basis, input: SlendernessInput): SlendernessResult {
  return {
    method: 'no sway method',
    neglected: false,
    delta: 1,
    magnifiedMoment: input.M2,
    firstOrderMoment: input.M2,
    ok: false,
    limitClause: `${basis.title}: no sway (unbraced) method in pmchart`,
    warnings: [`${basis.title} has no sway (unbraced) column method in pmchart: check the column by a second-order analysis`],
    steps: [{ key: 'sway-not-covered', clause: '', label: 'sway column: not covered by this basis in pmchart', value: false }],
  };
}

/** What the basis's sway method needs is there and in range (field keys map to flags: stabilityIndex → --stability-index). */
function validateSway(s: SwayInput, needs: SwayInputs): void {
  if (!Number.isFinite(s.M2s) || !Number.isFinite(s.M1s)) throw new PmError(ERROR_CODES.invalidValue, 'm2Sway', 'is not a finite moment');
  if (needs.moments === 'none' && (s.M2s !== 0 || s.M1s !== 0)) throw new PmError(ERROR_CODES.conflict, 'm2Sway', 'does not apply: this basis does not split the end moments into non-sway and sway parts; give the whole moment in --mu/--m2');
  const sums = s.storeyPu !== undefined || s.storeyPc !== undefined;
  if (s.stabilityIndex !== undefined && !needs.stabilityIndex) throw new PmError(ERROR_CODES.conflict, 'stabilityIndex', 'does not apply to this basis\'s sway method' + (needs.storeySums ? ': give --storey-pu and --storey-pc' : ''));
  if (sums && !needs.storeySums) throw new PmError(ERROR_CODES.conflict, s.storeyPu !== undefined ? 'storeyPu' : 'storeyPc', 'does not apply to this basis\'s sway method');
  if (sums && (s.storeyPu === undefined || s.storeyPc === undefined)) throw new PmError(ERROR_CODES.missing, s.storeyPu === undefined ? 'storeyPu' : 'storeyPc', 'is required with the other storey sum (ΣPu and ΣPc together)');
  if (s.storeyPu !== undefined && !(s.storeyPu > 0)) throw new PmError(ERROR_CODES.outOfRange, 'storeyPu', 'must be greater than 0', { value: s.storeyPu });
  if (s.storeyPc !== undefined && !(s.storeyPc > 0)) throw new PmError(ERROR_CODES.outOfRange, 'storeyPc', 'must be greater than 0', { value: s.storeyPc });
  if (s.stabilityIndex !== undefined && !(s.stabilityIndex >= 0 && Number.isFinite(s.stabilityIndex))) throw new PmError(ERROR_CODES.outOfRange, 'stabilityIndex', 'must be ≥ 0', { value: s.stabilityIndex });
  if (needs.needsStorey && s.stabilityIndex === undefined && !sums) {
    throw new PmError(ERROR_CODES.missing, needs.stabilityIndex ? 'stabilityIndex' : 'storeyPu', needs.stabilityIndex ? 'or --storey-pu with --storey-pc is required with --sway (the storey\'s δs)' : 'and --storey-pc are required with --sway (the storey\'s δs)');
  }
  if ((s.k1 !== undefined || s.k2 !== undefined) && !needs.restraint) throw new PmError(ERROR_CODES.conflict, s.k1 !== undefined ? 'k1' : 'k2', 'does not apply to this basis\'s sway method: give the unbraced --klu');
  if ((s.k1 === undefined) !== (s.k2 === undefined)) throw new PmError(ERROR_CODES.missing, s.k1 === undefined ? 'k1' : 'k2', 'is required with the other end\'s flexibility (k1 and k2 together)');
  if (s.bracedEffectiveLength !== undefined && !needs.bracedLength) throw new PmError(ERROR_CODES.conflict, 'kluBraced', 'does not apply to this basis\'s sway method');
  if (s.bracedEffectiveLength !== undefined && !(s.bracedEffectiveLength > 0)) throw new PmError(ERROR_CODES.outOfRange, 'kluBraced', 'must be greater than 0', { value: s.bracedEffectiveLength });
}

function validate(i: SlendernessInput, conv: EndMomentConvention): void {
  if (!(i.effectiveLength > 0)) throw new PmError(ERROR_CODES.outOfRange, 'klu', 'must be greater than 0', { value: i.effectiveLength });
  if (!(i.M2 >= 0)) throw new PmError(ERROR_CODES.outOfRange, conv.largerFlag, 'must be ≥ 0 (the larger end moment, given positive)', { value: i.M2 });
  if (Math.abs(i.M1) > i.M2 * (1 + 1e-9)) throw new PmError(ERROR_CODES.outOfRange, conv.smallerFlag, `must not exceed ${conv.columns[1]} in magnitude`, { value: i.M1 });
  if (i.betaDns !== undefined && !(i.betaDns >= 0 && i.betaDns <= 1)) throw new PmError(ERROR_CODES.outOfRange, 'betaDns', 'is outside 0–1', { value: i.betaDns, allowed: '0–1' });
  if (i.creepRatio !== undefined && !(i.creepRatio >= 0 && i.creepRatio <= 5)) throw new PmError(ERROR_CODES.outOfRange, 'creep', 'is outside 0–5', { value: i.creepRatio, allowed: '0–5' });
}

