/**
 * Load-contour exponents for (Mx/Mxo)^α + (My/Myo)^α ≤ 1. Bases plug one in as `biaxialExponent`.
 */
import type { ShapeKind } from '../section/types.js';
import type { BiaxialExponent } from './types.js';

/**
 * EN 1992-1-1 5.8.9(4), Eq. 5.39: for rectangular sections a = 1.0, 1.5, 2.0 at NEd/NRd = 0.1, 0.7, 1.0,
 * linear between (and held at the end values outside); a = 2 for circular and elliptical sections.
 * NRd = Ac·fcd + As·fyd with the gross area Ac, as in the biaxial column check of Bond et al., Worked
 * Examples to Eurocode 2 (The Concrete Centre): 300²·0.85·30/1.5 + 1964·500/1.15 = 2383.9 kN.
 */
export function en1992BiaxialExponent(axialRatio: number, shape: ShapeKind): BiaxialExponent {
  if (shape === 'circle') return { alpha: 2, source: 'EN 1992-1-1 5.8.9(4): a = 2 for circular sections' };
  const r = Math.max(0.1, Math.min(1, axialRatio));
  const alpha = r <= 0.7 ? 1 + ((r - 0.1) / 0.6) * 0.5 : 1.5 + ((r - 0.7) / 0.3) * 0.5;
  return { alpha, source: `EN 1992-1-1 5.8.9(4) Eq. 5.39: a at NEd/NRd = ${r.toFixed(3)}, interpolated between 0.1/0.7/1.0 → 1.0/1.5/2.0` };
}

/**
 * Bresler's load-contour exponent (B. Bresler, "Design criteria for reinforced columns under axial
 * load and biaxial bending", ACI Journal 57(5), 1960, 481–490): his tests gave α between about 1.15
 * and 1.55 for rectangular sections (from memory); pmchart takes α = 1.5 for rectangles and α = 2 for
 * circles, whose contour is near-circular for a ring of bars (common practice).
 */
export function bresslerBiaxialExponent(_axialRatio: number, shape: ShapeKind): BiaxialExponent {
  if (shape === 'circle') return { alpha: 2, source: 'α = 2 for a circle with a ring of bars (common practice)' };
  return { alpha: 1.5, source: 'α = 1.5 for rectangles (Bresler, ACI Journal 57(5), 1960: α ≈ 1.15–1.55, from memory)' };
}

/**
 * AS 3600-2018 10.6.4 (from memory; no published text found to confirm): (Mx* ÷ φMux)^αn + (My* ÷ φMuy)^αn ≤ 1 with
 * αn = 0.7 + 1.7·N* ÷ (0.6·Nuo), 1 ≤ αn ≤ 2. The axial ratio passed in is N* ÷ (0.6·Nuo) (`biaxialReferenceLoad`
 * of the AS basis). Circles keep α = 2 (a ring of bars gives a near-circular contour, common practice).
 */
export function as3600BiaxialExponent(axialRatio: number, shape: ShapeKind): BiaxialExponent {
  if (shape === 'circle') return { alpha: 2, source: 'α = 2 for a circle with a ring of bars (common practice; AS 3600-2018 10.6.4 is written for rectangles)' };
  const raw = 0.7 + 1.7 * axialRatio;
  const alpha = Math.min(2, Math.max(1, raw));
  return { alpha, source: `AS 3600-2018 10.6.4 (from memory): αn = 0.7 + 1.7·N*/(0.6·Nuo) = 0.7 + 1.7·${axialRatio.toFixed(3)}, within 1–2` };
}
