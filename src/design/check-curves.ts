/**
 * The curves a check's views draw, made from the check's own facts in one place: the ρg family of its
 * chart (basis, section, γ, γB, the chart's ρg list, cap context), the actual section of its checked bars
 * under an inclined neutral axis, and the Mx–My contour family at chosen axial levels. The drawn calculation
 * sheet (src/sheet/check-report.ts) and the page (src/page/engine.ts) call these; no view rebuilds a
 * section or a family from the check's parts.
 */
import { computeBiaxialFamily, type BiaxialFamily } from '../analysis/biaxial-family.js';
import { prepareBiaxial, squashPoint, type BiaxialSection } from '../analysis/biaxial.js';
import { computeFamily, type CurveFamily } from '../analysis/family.js';
import type { Shape } from '../section/types.js';
import type { ColumnCheckFrame } from './column-check.js';

/** The check's chart family (or one curve per ρg of `rhos`), with `basePoints` points per curve as the sheet draws them. */
export function checkFamily(c: ColumnCheckFrame, basePoints: number, rhos: readonly number[] = c.chart.rhos): CurveFamily {
  return computeFamily({ basis: c.basis, shape: c.shape, arrangement: c.arrangement, gamma: c.gamma, ...(c.gammaB !== null ? { gammaX: c.gammaB } : {}), rhos, capContext: c.capContext, basePoints });
}

/** The section of the checked bars under an inclined neutral axis, and the axial range a contour exists in (tension yield to the smaller of cap and squash); null with no bars checked. */
export function checkedSection(c: ColumnCheckFrame): { section: BiaxialSection; minP: number; maxP: number } | null {
  if (!c.checked) return null;
  const section = prepareBiaxial(c.basis, c.shape, c.checked.bars, c.capContext);
  return { section, minP: -section.basis.design.factor(1) * section.basis.design.steel.yieldStress * section.steelArea, maxP: Math.min(section.cap.design, squashPoint(section)) };
}

/**
 * The Mx–My contour family of the check's ρg family of biaxial sheets (`biaxialChart.rhos`) at the axial
 * levels `levels`, on a section of unit depth as the sheets are drawn (same basis, arrangement, γ, γB); null
 * when the check has no biaxial chart.
 */
export function checkBiaxialFamily(c: ColumnCheckFrame, levels: readonly number[]): BiaxialFamily | null {
  const bc = c.biaxialChart;
  if (!bc) return null;
  const unit: Shape = c.shape.kind === 'circle' ? { kind: 'circle', diameter: 1 } : { kind: 'rectangle', b: c.shape.b / c.shape.h, h: 1 };
  return computeBiaxialFamily({
    basis: c.basis,
    shape: unit,
    arrangement: c.arrangement,
    gamma: c.gamma,
    ...(c.gammaB !== null ? { gammaX: c.gammaB } : {}),
    rhos: bc.rhos,
    levels: [...levels],
    capContext: c.capContext,
    angleStepDeg: bc.angleStepDeg,
  });
}
