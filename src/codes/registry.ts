import { ERROR_CODES, PmError, requireInRange } from '../errors.js';
import { DISPLAY_UNITS, parseQuantity, type UnitSystem } from '../units/index.js';
import { ACI_318_14, ACI_318_19 } from './aci318.js';
import { AS_3600_2018 } from './as3600.js';
import { CSA_A23_3_19 } from './csa-a23.js';
import { EN_1992_1_1 } from './en1992.js';
import type { Basis, BasisInput, CodeId, DesignCode } from './types.js';

/**
 * Every design basis pmchart knows, keyed by the `--code` value: the one list every other list of bases
 * (flag help, the page's select, the chart-set schema, error messages) is derived from. Typed as a full
 * record so a code id without an entry does not compile.
 */
export const DESIGN_CODES: Readonly<Record<CodeId, DesignCode>> = {
  'aci318-19': ACI_318_19,
  'aci318-14': ACI_318_14,
  'en1992-1-1': EN_1992_1_1,
  'csa-a23.3-19': CSA_A23_3_19,
  'as3600-2018': AS_3600_2018,
};

/** The design bases in registry order. */
export const DESIGN_CODE_LIST: readonly DesignCode[] = Object.values(DESIGN_CODES);
/** The `--code` values in registry order. */
export const BASIS_IDS: readonly CodeId[] = DESIGN_CODE_LIST.map((c) => c.id);

export function designCode(id: string, path = 'code'): DesignCode {
  const code = (DESIGN_CODES as Partial<Record<string, DesignCode>>)[id];
  if (!code) {
    throw new PmError(ERROR_CODES.invalidValue, path, 'is not a known design basis', {
      value: id,
      allowed: Object.keys(DESIGN_CODES).join(', '),
    });
  }
  return code;
}

/** Checks material strengths against the code's limits, then resolves the basis. */
export function resolveBasis(
  id: string,
  input: BasisInput,
  paths: { code: string; fc: string; fy: string; columnUse?: string } = { code: 'code', fc: 'fc', fy: 'fy', columnUse: 'columnUse' },
): Basis {
  const code = designCode(id, paths.code);
  if (!code.unitSystems.includes(input.units)) {
    throw new PmError(ERROR_CODES.invalidValue, 'units', `is not available for ${code.title}`, {
      value: input.units,
      allowed: code.unitSystems.join(', '),
    });
  }
  const lim = code.limits(input.units);
  const su = DISPLAY_UNITS[input.units].stress;
  requireInRange(paths.fc, input.fc, lim.fc[0], lim.fc[1], su);
  requireInRange(paths.fy, input.fy, lim.fy[0], lim.fy[1], su);
  const use = input.options?.columnUse ?? 'gravity';
  const edition = code.yieldLimit?.(input.units, use);
  if (edition && input.fy > edition.max) {
    throw new PmError(ERROR_CODES.outOfRange, paths.fy, `exceeds ${edition.rule} (${paths.columnUse ?? 'columnUse'} ${use})`, {
      value: `${input.fy} ${su}`,
      allowed: `≤ ${edition.max} ${su}`,
    });
  }
  return code.resolve(input);
}

/** A strength from a flag or config value: the code's class names first ("C50/60", "B500B"), else a quantity. */
export function parseStrength(code: DesignCode, text: string | number, kind: 'concrete' | 'steel', units: UnitSystem, path: string): number {
  if (typeof text === 'string') {
    const named = code.namedStrength?.(text.trim(), kind);
    if (named !== undefined && Number.isNaN(named)) {
      throw new PmError(ERROR_CODES.invalidValue, path, `is not a ${kind === 'concrete' ? 'strength' : 'steel'} class of ${code.title}`, { value: text });
    }
    if (named !== undefined) return named;
  }
  return parseQuantity(text, 'stress', units, path);
}
