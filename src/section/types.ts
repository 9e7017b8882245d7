/**
 * Sections in the bending plane. Coordinates are centroidal: x across the width, y toward the
 * compression face (the "top"), so depth from the compression face is h/2 − y.
 */
export const SHAPES = ['rectangle', 'circle'] as const;
export type ShapeKind = (typeof SHAPES)[number];
export const isShapeKind = (s: unknown): s is ShapeKind => SHAPES.includes(s as ShapeKind);

export type Shape = { kind: 'rectangle'; b: number; h: number } | { kind: 'circle'; diameter: number };

export interface Bar {
  /** across the width, from the centroid */
  x: number;
  /** toward the compression face, from the centroid */
  y: number;
  area: number;
}

export interface Section {
  shape: Shape;
  bars: readonly Bar[];
}

export const ARRANGEMENTS = ['two-faces', 'four-faces', 'side-faces', 'ring', 'custom'] as const;
export type ArrangementKind = (typeof ARRANGEMENTS)[number];
export const isArrangementKind = (s: unknown): s is ArrangementKind => ARRANGEMENTS.includes(s as ArrangementKind);

/** A custom bar: position as a fraction of the section (x/b or x/D, y/h or y/D, centroidal) and its share of Ast. */
export interface CustomBar {
  x: number;
  y: number;
  share: number;
}

/**
 * Bars per face of a four-faces layout: one count for all four faces, or `[nb, nh]`: nb bars across each
 * face of width b (the two faces perpendicular to the bending plane, at y = ±γ·h/2) and nh bars along each
 * face of depth h (at x = ±γB·b/2). Corners count on both faces: 2·nb + 2·nh − 4 bars in all.
 */
export type FaceCounts = number | readonly [nb: number, nh: number];

/** [nb, nh] of a four-faces count: a single count is the same on every face. */
export const faceCounts = (c: FaceCounts): [nb: number, nh: number] => (typeof c === 'number' ? [c, c] : [c[0], c[1]]);

export type Arrangement =
  | { kind: 'two-faces'; barsPerFace: number }
  | { kind: 'four-faces'; barsPerFace: FaceCounts }
  | { kind: 'side-faces'; barsPerFace: number }
  | { kind: 'ring'; bars: number }
  | { kind: 'custom'; bars: readonly CustomBar[] };
