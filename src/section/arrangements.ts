import { ERROR_CODES, PmError } from '../errors.js';
import { sectionDepth, sectionWidth } from './geometry.js';
import { faceCounts, type Arrangement, type Bar, type Shape } from './types.js';

export interface LayoutOptions {
  /** outer-row spacing over depth in the bending plane */
  gamma: number;
  /** γB: outer-column spacing over width b; defaults to the cover implied by gamma on the depth (equal cover) */
  gammaX?: number;
}

/** Number of bars an arrangement places. */
export function barCount(a: Arrangement): number {
  switch (a.kind) {
    case 'two-faces':
      return 2 * a.barsPerFace;
    case 'four-faces': {
      const [nb, nh] = faceCounts(a.barsPerFace);
      return 2 * nb + 2 * nh - 4;
    }
    case 'side-faces':
      return 2 * a.barsPerFace;
    case 'ring':
      return a.bars;
    case 'custom':
      return a.bars.length;
  }
}

/**
 * Places bars of total area `totalArea` (all bars equal, custom bars by share) in centroidal coordinates.
 * Definitions of the arrangements are pmchart's own (README, "Bar arrangements").
 */
export function layoutBars(shape: Shape, arrangement: Arrangement, totalArea: number, opts: LayoutOptions): Bar[] {
  const h = sectionDepth(shape);
  const w = sectionWidth(shape);
  const halfY = (opts.gamma * h) / 2;
  const cover = (h - 2 * halfY) / 2;
  const halfX = opts.gammaX !== undefined ? (opts.gammaX * w) / 2 : Math.max(0, w / 2 - cover);
  const n = barCount(arrangement);
  const each = totalArea / n;
  const bars: Bar[] = [];
  const spread = (count: number, half: number): number[] =>
    count === 1 ? [0] : Array.from({ length: count }, (_, i) => -half + (2 * half * i) / (count - 1));

  switch (arrangement.kind) {
    case 'two-faces': {
      for (const y of [halfY, -halfY]) for (const x of spread(arrangement.barsPerFace, halfX)) bars.push({ x, y, area: each });
      break;
    }
    case 'four-faces': {
      // nh rows down the h faces; the first and last are the b faces with nb bars each
      const [nb, nh] = faceCounts(arrangement.barsPerFace);
      const rows = spread(nh, halfY).reverse();
      rows.forEach((y, i) => {
        const xs = i === 0 || i === rows.length - 1 ? spread(nb, halfX) : [-halfX, halfX];
        for (const x of xs) bars.push({ x, y, area: each });
      });
      break;
    }
    case 'side-faces': {
      for (const y of spread(arrangement.barsPerFace, halfY).reverse()) for (const x of [-halfX, halfX]) bars.push({ x, y, area: each });
      break;
    }
    case 'ring': {
      for (let i = 0; i < arrangement.bars; i++) {
        const t = (2 * Math.PI * i) / arrangement.bars; // bar 0 at the compression-side extreme
        bars.push({ x: halfY * Math.sin(t), y: halfY * Math.cos(t), area: each });
      }
      break;
    }
    case 'custom': {
      const total = arrangement.bars.reduce((s, b) => s + b.share, 0);
      if (!(total > 0)) throw new PmError(ERROR_CODES.invalidValue, 'bars', 'shares must add up to more than 0', { value: total });
      for (const b of arrangement.bars) bars.push({ x: b.x * w, y: b.y * h, area: (totalArea * b.share) / total });
      break;
    }
  }
  return bars;
}

/** γ actually realised by a bar set: outer-row spacing over depth (for custom layouts and checks). */
export function realisedGamma(shape: Shape, bars: readonly Bar[]): number {
  const ys = bars.map((b) => b.y);
  return (Math.max(...ys) - Math.min(...ys)) / sectionDepth(shape);
}

/** True when mirroring the bars about the bending axis (y → −y) gives the same layout (tolerance 1e-9 of the depth and of Ast). */
export function symmetricAboutBendingAxis(bars: readonly Bar[], depth: number): boolean {
  const tol = 1e-9 * depth;
  const total = bars.reduce((s, b) => s + b.area, 0);
  return bars.every((b) => bars.some((o) => Math.abs(o.x - b.x) <= tol && Math.abs(o.y + b.y) <= tol && Math.abs(o.area - b.area) <= 1e-9 * total));
}

/** The bars mirrored about the bending axis: what a negative moment sees. */
export const mirroredBars = (bars: readonly Bar[]): Bar[] => bars.map((b) => ({ x: b.x, y: -b.y, area: b.area }));
