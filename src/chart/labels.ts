/**
 * Label placement on the plot: a greedy collision pass with real text widths. Labels are boxes in
 * page points from the plot origin; a label is placed at its first candidate that overlaps no placed
 * box and stays inside the plot, preferring candidates that cross fewer drawn lines. Labels are
 * offered in priority order, so those that cannot be placed are always the lowest ones.
 * chart/ stays browser-safe: text widths come from a `MeasureText` the caller passes in
 * (node-canvas in Node, a DOM canvas in the browser).
 */
import { AVG_CHAR_EM } from './style.js';

/** Advance width in points of `text` in the sheet typeface at `fontSize` points. */
export type MeasureText = (text: string, fontSize: number, bold: boolean) => number;

/** An estimate (AVG_CHAR_EM per character) for callers without a canvas. */
export const estimateText: MeasureText = (text, fontSize) => text.length * AVG_CHAR_EM * fontSize;

export interface LabelBox {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

export type Segment = [number, number, number, number];

export const overlaps = (a: LabelBox, b: LabelBox): boolean => a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1;

/** Whether segment s crosses box b (Liang–Barsky clipping). */
export function segmentHitsBox(s: Segment, b: LabelBox): boolean {
  const [x0, y0, x1, y1] = s;
  const dx = x1 - x0;
  const dy = y1 - y0;
  let t0 = 0;
  let t1 = 1;
  const edges: [number, number][] = [
    [-dx, x0 - b.x0],
    [dx, b.x1 - x0],
    [-dy, y0 - b.y0],
    [dy, b.y1 - y0],
  ];
  for (const [p, q] of edges) {
    if (p === 0) {
      if (q < 0) return false;
    } else {
      const r = q / p;
      if (p < 0) t0 = Math.max(t0, r);
      else t1 = Math.min(t1, r);
      if (t0 > t1) return false;
    }
  }
  return true;
}

/** Lines a label should rather not cover, grouped so a label's own curve can be left out. */
export interface Obstacle {
  group: string;
  segments: Segment[];
  /** cost of covering one segment */
  weight: number;
}

export class LabelPlacer {
  readonly placed: LabelBox[] = [];
  private readonly obstacles: Obstacle[] = [];

  constructor(readonly bounds: LabelBox) {}

  /** Reserves a box (a fixed label, a legend, a mark). */
  reserve(b: LabelBox): void {
    this.placed.push(b);
  }

  addObstacle(o: Obstacle): void {
    this.obstacles.push(o);
  }

  /** Whether a box may be placed: inside the bounds and clear of every placed box. */
  free(b: LabelBox): boolean {
    const B = this.bounds;
    if (b.x0 < B.x0 || b.y0 < B.y0 || b.x1 > B.x1 || b.y1 > B.y1) return false;
    return !this.placed.some((p) => overlaps(p, b));
  }

  /**
   * How many drawn segments a box covers, weighted, leaving out the group `own`; lines within `clear`
   * points of the box count half, so a label keeps a little air from the next curve (no ambiguity).
   */
  cost(b: LabelBox, own?: string, clear = 0): number {
    let c = 0;
    const wide = { x0: b.x0 - clear, y0: b.y0 - clear, x1: b.x1 + clear, y1: b.y1 + clear };
    for (const o of this.obstacles) {
      if (o.group === own) continue;
      for (const s of o.segments) {
        if (segmentHitsBox(s, b)) c += o.weight;
        else if (clear > 0 && segmentHitsBox(s, wide)) c += o.weight / 2;
      }
    }
    return c;
  }

  /**
   * Places a label at the cheapest free candidate; a candidate's own `penalty` (distance from its
   * preferred spot) adds to the cost of the lines it covers. Returns the index of the chosen one, or -1.
   */
  /**
   * Last resort for a label that must not be dropped: the candidate inside the bounds that overlaps placed
   * boxes least (by area), then the cheapest. Returns its index, or -1 when there is none.
   */
  force(candidates: readonly { box: LabelBox; penalty: number }[]): number {
    const B = this.bounds;
    let best = -1;
    let bestCost = Infinity;
    candidates.forEach((c, i) => {
      const b = c.box;
      if (b.x0 < B.x0 || b.y0 < B.y0 || b.x1 > B.x1 || b.y1 > B.y1) return;
      let area = 0;
      for (const p of this.placed) area += Math.max(0, Math.min(b.x1, p.x1) - Math.max(b.x0, p.x0)) * Math.max(0, Math.min(b.y1, p.y1) - Math.max(b.y0, p.y0));
      const cost = area * 100 + c.penalty;
      if (cost < bestCost) ((best = i), (bestCost = cost));
    });
    if (best >= 0) this.placed.push(candidates[best]!.box);
    return best;
  }

  place(candidates: readonly { box: LabelBox; penalty: number }[], own?: string, clear = 0): number {
    let best = -1;
    let bestCost = Infinity;
    candidates.forEach((c, i) => {
      if (c.penalty >= bestCost || !this.free(c.box)) return;
      const cost = c.penalty + this.cost(c.box, own, clear);
      if (cost < bestCost) ((best = i), (bestCost = cost));
    });
    if (best >= 0) this.placed.push(candidates[best]!.box);
    return best;
  }
}

/** A box of width w and height h centred on (x, y), with `pad` points around it. */
export const centredBox = (x: number, y: number, w: number, h: number, pad = 0): LabelBox => ({ x0: x - w / 2 - pad, y0: y - h / 2 - pad, x1: x + w / 2 + pad, y1: y + h / 2 + pad });
