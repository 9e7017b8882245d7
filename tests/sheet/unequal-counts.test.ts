/** A chart-set sheet with four-faces [3, 5] and γB draws the layout those give (issue 15; pmchart's own arrangement definitions, README "Bar arrangements"). */
import { describe, expect, it } from 'vitest';
import { readChartSet } from '../../src/config/read.js';
import { familyForSheet } from '../../src/sheet/curves.js';
import { expectClose } from '../helpers/tolerance.js';

const set = (gammaB?: number) =>
  readChartSet(
    JSON.stringify({
      name: 'corner',
      titleBlock: { office: 'Invented office', project: 'Invented project', date: '2026-01-05' },
      units: 'us',
      basis: { code: 'aci318-19' },
      rhoG: [0.02],
      sheets: [{ shape: { kind: 'rectangle', aspect: 0.5 }, fc: 5, fy: 60, gamma: 0.8, ...(gammaB !== undefined ? { gammaB } : {}), arrangement: { kind: 'four-faces', barsPerFace: [3, 5] } }],
    }),
  );

describe('four-faces [3, 5] sheets', () => {
  it('place 12 bars: rows at y = ±0.4 h, 0.2 h, 0; the h faces at x = ±γB·b/2 = ±0.4·0.5 h/2 = ±0.1 h', () => {
    const s = set(0.4);
    const bars = familyForSheet(s, s.sheets[0]!).bars;
    expect(bars).toHaveLength(12);
    expect([...new Set(bars.map((b) => Number(b.y.toFixed(9))))].sort((a, b) => a - b)).toEqual([-0.4, -0.2, 0, 0.2, 0.4]);
    for (const b of bars) if (Math.abs(b.x) > 1e-9) expectClose(Math.abs(b.x), 0.1, 1e-12);
  });
  it('without γB keep the cover of γ across b: x = ±(0.5 h/2 − 0.1 h) = ±0.15 h', () => {
    // cover to the bar centres (1 − 0.8)·h/2 = 0.1 h on every face
    const s = set();
    for (const b of familyForSheet(s, s.sheets[0]!).bars) if (Math.abs(b.x) > 1e-9) expectClose(Math.abs(b.x), 0.15, 1e-12);
  });
});
