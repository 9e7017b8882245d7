/** Bar arrangements as pmchart defines them (README, "Bar arrangements"); γ from detailing is common practice. */
import { describe, expect, it } from 'vitest';
import { barCount, layoutBars, realisedGamma } from '../../src/section/arrangements.js';
import { gammaFromCover } from '../../src/section/geometry.js';
import { findBar, barSet } from '../../src/section/bar-tables.js';
import type { Shape } from '../../src/section/types.js';
import { expectClose } from '../helpers/tolerance.js';

const sq: Shape = { kind: 'rectangle', b: 24, h: 24 };

describe('layoutBars', () => {
  it('four-faces with n per face places 4(n−1) equal bars on the perimeter', () => {
    const bars = layoutBars(sq, { kind: 'four-faces', barsPerFace: 4 }, 12, { gamma: 0.75 });
    expect(bars).toHaveLength(12);
    expect(barCount({ kind: 'four-faces', barsPerFace: 4 })).toBe(12);
    for (const b of bars) expect(b.area).toBeCloseTo(1, 12);
    for (const b of bars) expect(Math.max(Math.abs(b.x), Math.abs(b.y))).toBeCloseTo(9, 12);
    expect(realisedGamma(sq, bars)).toBeCloseTo(0.75, 12);
  });
  it('four-faces [3, 5] on 16 × 24 in, γ 0.75: 3 bars on each b face, 5 on each h face, 12 bars (hand count: 2·3 + 2·5 − 4)', () => {
    // hand calculation: halfY = 0.75·24/2 = 9 in; equal cover 3 in, so halfX = 16/2 − 3 = 5 in
    const r: Shape = { kind: 'rectangle', b: 16, h: 24 };
    const a = { kind: 'four-faces', barsPerFace: [3, 5] } as const;
    const bars = layoutBars(r, a, 12 * 0.79, { gamma: 0.75 });
    expect(barCount(a)).toBe(12);
    expect(bars).toHaveLength(12);
    for (const b of bars) expectClose(b.area, 0.79, 1e-12);
    const at = (x: number, y: number) => bars.filter((b) => Math.abs(b.x - x) < 1e-9 && Math.abs(b.y - y) < 1e-9).length;
    for (const y of [9, -9]) for (const x of [-5, 0, 5]) expect(at(x, y)).toBe(1);
    for (const y of [4.5, 0, -4.5]) for (const x of [-5, 5]) expect(at(x, y)).toBe(1);
  });
  it('four-faces [3, 5] with γB 0.5 puts the h faces at x = ±0.5·16/2 = ±4 in', () => {
    const r: Shape = { kind: 'rectangle', b: 16, h: 24 };
    const bars = layoutBars(r, { kind: 'four-faces', barsPerFace: [3, 5] }, 12, { gamma: 0.75, gammaX: 0.5 });
    expect([...new Set(bars.map((b) => Math.abs(b.x)))].sort()).toEqual([0, 4]);
  });
  it('four-faces [nb, nh] for every pair 2–8: 2·nb + 2·nh − 4 distinct bars, all on the perimeter at γ and γB', () => {
    const r: Shape = { kind: 'rectangle', b: 16, h: 24 };
    for (let nb = 2; nb <= 8; nb++) {
      for (let nh = 2; nh <= 8; nh++) {
        const bars = layoutBars(r, { kind: 'four-faces', barsPerFace: [nb, nh] }, 1, { gamma: 0.75, gammaX: 0.6 });
        expect(bars).toHaveLength(2 * nb + 2 * nh - 4);
        expect(new Set(bars.map((b) => `${b.x.toFixed(9)},${b.y.toFixed(9)}`)).size).toBe(bars.length);
        for (const b of bars) expect(Math.abs(Math.abs(b.x) - 4.8) < 1e-9 || Math.abs(Math.abs(b.y) - 9) < 1e-9).toBe(true);
        expect(bars.filter((b) => Math.abs(b.y - 9) < 1e-9)).toHaveLength(nb);
        expect(bars.filter((b) => Math.abs(b.x - 4.8) < 1e-9)).toHaveLength(nh);
      }
    }
  });
  it('four-faces [4, 4] is the same layout as a single count 4', () => {
    expect(layoutBars(sq, { kind: 'four-faces', barsPerFace: [4, 4] }, 12, { gamma: 0.75 })).toEqual(layoutBars(sq, { kind: 'four-faces', barsPerFace: 4 }, 12, { gamma: 0.75 }));
  });
  it('two-faces puts half of Ast in each outer row', () => {
    const bars = layoutBars(sq, { kind: 'two-faces', barsPerFace: 3 }, 6, { gamma: 0.8 });
    expect(bars.filter((b) => b.y > 0).reduce((s, b) => s + b.area, 0)).toBeCloseTo(3, 12);
    expect(new Set(bars.map((b) => b.y)).size).toBe(2);
  });
  it('side-faces spreads n bars per side face evenly over γ·h', () => {
    const bars = layoutBars(sq, { kind: 'side-faces', barsPerFace: 4 }, 8, { gamma: 0.75 });
    const ys = [...new Set(bars.map((b) => b.y))].sort((a, b) => a - b);
    expect(ys.map((y) => Number(y.toFixed(9)))).toEqual([-9, -3, 3, 9]);
  });
  it('ring puts one bar at the compression-side extreme on a circle of diameter γ·D', () => {
    const bars = layoutBars({ kind: 'circle', diameter: 20 }, { kind: 'ring', bars: 8 }, 6.32, { gamma: 0.7625 });
    expect(bars[0]!.y).toBeCloseTo(7.625, 12);
    for (const b of bars) expect(Math.hypot(b.x, b.y)).toBeCloseTo(7.625, 12);
  });
});

describe('gammaFromCover (common practice)', () => {
  it('24 in column, 1.5 in cover, #4 ties, #11 bars: γ = (24 − 2·(1.5 + 0.5 + 0.705))/24 = 0.7746', () => {
    expectClose(gammaFromCover(24, 1.5, 0.5, 1.41), 0.774583, 1e-6);
  });
});

describe('bar tables (ASTM A615 Table 1)', () => {
  it('finds #11 as 1.41 in / 1.56 in² and #18 as 2.257 in / 4.00 in²', () => {
    const set = barSet('astm-a615');
    expect(findBar(set, '#11')).toMatchObject({ diameter: 1.41, area: 1.56 });
    expect(findBar(set, '18')).toMatchObject({ diameter: 2.257, area: 4.0 });
    expect(findBar(set, '#12')).toBeUndefined();
  });
});
