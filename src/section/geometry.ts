import type { Shape } from './types.js';

/** Depth of the section in the bending plane: h, or D for a circle. */
export const sectionDepth = (s: Shape): number => (s.kind === 'rectangle' ? s.h : s.diameter);

/** Width across the bending plane: b, or D. */
export const sectionWidth = (s: Shape): number => (s.kind === 'rectangle' ? s.b : s.diameter);

/** Gross area Ag. */
export const grossArea = (s: Shape): number => (s.kind === 'rectangle' ? s.b * s.h : (Math.PI * s.diameter * s.diameter) / 4);

/** A shape of unit depth with the same aspect, for normalised (size-free) curves. */
export function unitShape(s: Shape): Shape {
  return s.kind === 'rectangle' ? { kind: 'rectangle', b: s.b / s.h, h: 1 } : { kind: 'circle', diameter: 1 };
}

/**
 * γ from detailing: centre-to-centre distance of the outer bar rows over h (common practice):
 * γ = (h − 2·(cover + tie + db/2)) / h, with cover to the tie.
 */
export function gammaFromCover(depth: number, cover: number, tieDiameter: number, barDiameter: number): number {
  return (depth - 2 * (cover + tieDiameter + barDiameter / 2)) / depth;
}
