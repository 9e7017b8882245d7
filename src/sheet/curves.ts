/** Stage "resolved set → curves": the core's family for one sheet (pure). */
import { computeFamily, type CurveFamily } from '../analysis/family.js';
import { resolveBasis } from '../codes/registry.js';
import type { ResolvedChartSet, ResolvedSheet } from '../config/types.js';
import type { Shape } from '../section/types.js';

/**
 * Base points per curve for sheets. Key points are solved exactly whatever this is; it only sets how
 * finely the drawn polyline follows the curve (about 6 pt between samples on a Tabloid sheet, before
 * the drawing tolerance in src/chart/sheet-data.ts drops the points a straight segment covers).
 */
export const SHEET_BASE_POINTS = 240;

export function sheetShape(sheet: ResolvedSheet): Shape {
  return sheet.shape.kind === 'circle' ? { kind: 'circle', diameter: 1 } : { kind: 'rectangle', b: sheet.shape.aspect, h: 1 };
}

export function familyForSheet(set: ResolvedChartSet, sheet: ResolvedSheet): CurveFamily {
  const at = sheet.origin;
  const basis = resolveBasis(
    set.code,
    { units: set.units, fc: sheet.fc, fy: sheet.fy, transverse: sheet.transverse, options: set.basisOptions },
    { code: 'basis.code', fc: `${at}.fc`, fy: `${at}.fy` },
  );
  return computeFamily({ basis, shape: sheetShape(sheet), arrangement: sheet.arrangement, gamma: sheet.gamma, rhos: set.rhos, basePoints: SHEET_BASE_POINTS });
}
