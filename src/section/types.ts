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

export type Arrangement =
  | { kind: 'two-faces'; barsPerFace: number }
  | { kind: 'four-faces'; barsPerFace: number }
  | { kind: 'side-faces'; barsPerFace: number }
  | { kind: 'ring'; bars: number }
  | { kind: 'custom'; bars: readonly CustomBar[] };
