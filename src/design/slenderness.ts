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
} from '../codes/slenderness.js';
import type { Basis } from '../codes/types.js';
import { ERROR_CODES, PmError } from '../errors.js';

export * from '../codes/slenderness.js';
export { aciEc, aciMomentMagnification } from '../codes/slenderness-aci318.js';
export { enNominalCurvature } from '../codes/slenderness-en1992.js';
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
  return method.check(basis, section, input, SLENDERNESS_CONTEXT);
}

function validate(i: SlendernessInput, conv: EndMomentConvention): void {
  if (!(i.effectiveLength > 0)) throw new PmError(ERROR_CODES.outOfRange, 'klu', 'must be greater than 0', { value: i.effectiveLength });
  if (!(i.M2 >= 0)) throw new PmError(ERROR_CODES.outOfRange, conv.largerFlag, 'must be ≥ 0 (the larger end moment, given positive)', { value: i.M2 });
  if (Math.abs(i.M1) > i.M2 * (1 + 1e-9)) throw new PmError(ERROR_CODES.outOfRange, conv.smallerFlag, `must not exceed ${conv.columns[1]} in magnitude`, { value: i.M1 });
  if (i.betaDns !== undefined && !(i.betaDns >= 0 && i.betaDns <= 1)) throw new PmError(ERROR_CODES.outOfRange, 'betaDns', 'is outside 0–1', { value: i.betaDns, allowed: '0–1' });
  if (i.creepRatio !== undefined && !(i.creepRatio >= 0 && i.creepRatio <= 5)) throw new PmError(ERROR_CODES.outOfRange, 'creep', 'is outside 0–5', { value: i.creepRatio, allowed: '0–5' });
}

