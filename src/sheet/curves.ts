/** Stage "resolved set → curves": the core's family for one sheet (pure). */
import { computeBiaxialFamily, type BiaxialFamily } from '../analysis/biaxial-family.js';
import { computeFamily, type CurveFamily } from '../analysis/family.js';
import { biaxialExtent } from '../chart/biaxial-sheet.js';
import { rhoFromOmega } from '../codes/mechanical-ratio.js';
import { resolveBasis } from '../codes/registry.js';
import type { Basis } from '../codes/types.js';
import type { ResolvedChartSet, ResolvedSheet } from '../config/types.js';
import type { Shape } from '../section/types.js';
import { envelope, familyExtent, type AxisExtent } from '../chart/axes.js';
import { primaryFamily } from '../chart/sheet-data.js';

/**
 * Base points per curve for sheets. Key points are solved exactly whatever this is; it only sets how
 * finely the drawn polyline follows the curve (about 6 pt between samples on a Tabloid sheet, before
 * the drawing tolerance in src/chart/sheet-data.ts drops the points a straight segment covers).
 */
export const SHEET_BASE_POINTS = 240;

export function sheetShape(sheet: ResolvedSheet): Shape {
  return sheet.shape.kind === 'circle' ? { kind: 'circle', diameter: 1 } : { kind: 'rectangle', b: sheet.shape.aspect, h: 1 };
}

/** The basis of one sheet: the set's code with the sheet's materials and basis options. */
export function basisForSheet(set: ResolvedChartSet, sheet: ResolvedSheet): Basis {
  const at = sheet.origin;
  return resolveBasis(
    set.code,
    { units: set.units, fc: sheet.fc, fy: sheet.fy, transverse: sheet.transverse, options: sheet.basisOptions },
    { code: 'basis.code', fc: `${at}.fc`, fy: `${at}.fy`, columnUse: 'basis.options.columnUse (or the sheet group’s basisOptions.columnUse)' },
  );
}

/** ρg of each curve: the set's ρg values, or its ω values through this basis (ρ = ω·fcd/fyd). */
export function sheetRhos(set: ResolvedChartSet, basis: Basis): number[] {
  const { kind, values } = set.ratios;
  return kind === 'omega' ? values.map((w) => Number(rhoFromOmega(basis, w).toPrecision(12))) : values;
}

export function familyForSheet(set: ResolvedChartSet, sheet: ResolvedSheet): CurveFamily {
  const basis = basisForSheet(set, sheet);
  return computeFamily({ basis, shape: sheetShape(sheet), arrangement: sheet.arrangement, gamma: sheet.gamma, ...(sheet.gammaB !== undefined ? { gammaX: sheet.gammaB } : {}), rhos: sheetRhos(set, basis), basePoints: SHEET_BASE_POINTS });
}

/** The Mx–My contour family of a biaxial sheet: the sheet's axial levels × the set's ρg (or ω) family, factored. */
export function biaxialFamilyForSheet(set: ResolvedChartSet, sheet: ResolvedSheet, rhos?: readonly number[]): BiaxialFamily {
  const basis = basisForSheet(set, sheet);
  return computeBiaxialFamily({
    basis,
    shape: sheetShape(sheet),
    arrangement: sheet.arrangement,
    gamma: sheet.gamma,
    ...(sheet.gammaB !== undefined ? { gammaX: sheet.gammaB } : {}),
    rhos: rhos ?? sheetRhos(set, basis),
    levels: sheet.axialLevels ?? [],
    model: 'design',
  });
}

/**
 * One extent per sheet group (keyed by ResolvedSheet.origin): the envelope of its sheets' outermost
 * curves (the largest ratio), so every sheet of a group is drawn to the same scale.
 */
export function groupExtents(set: ResolvedChartSet): Record<string, AxisExtent> {
  const families = set.families === 'both' ? (['nominal', 'design'] as const) : [primaryFamily(set)];
  const byGroup = new Map<string, AxisExtent[]>();
  for (const sheet of set.sheets) {
    const basis = basisForSheet(set, sheet);
    const rhos = sheetRhos(set, basis);
    const outer = Math.max(...rhos);
    const d = set.normalisation === 'dimensionless' ? basis.normalisingStress : 1;
    if (sheet.chart === 'biaxial') {
      // the largest ratio's contour encloses the others at every level
      const list = byGroup.get(sheet.origin) ?? [];
      list.push(biaxialExtent(biaxialFamilyForSheet(set, sheet, [outer]), d));
      byGroup.set(sheet.origin, list);
      continue;
    }
    const f = computeFamily({ basis, shape: sheetShape(sheet), arrangement: sheet.arrangement, gamma: sheet.gamma, ...(sheet.gammaB !== undefined ? { gammaX: sheet.gammaB } : {}), rhos: [outer], basePoints: SHEET_BASE_POINTS });
    const list = byGroup.get(sheet.origin) ?? [];
    list.push(familyExtent(f, families, d));
    byGroup.set(sheet.origin, list);
  }
  return Object.fromEntries([...byGroup].map(([k, v]) => [k, envelope(v)]));
}
