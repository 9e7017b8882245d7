/** renderSheet numbers sheets from 1, as the sheets do ("sheet 1 of N"); 0 drew sheet 1 before (issue 25). */
import { describe, expect, it } from 'vitest';
import { readChartSet } from '../../src/config/read.js';
import { renderSheet } from '../../src/sheet/render-sheet.js';

const set = readChartSet(
  JSON.stringify({
    name: 'tiny',
    titleBlock: { office: 'Invented Office', project: 'Invented Project', date: '2026-01-05' },
    units: 'us',
    basis: { code: 'aci318-19' },
    sheets: [{ fc: 4, fy: 60, gamma: 0.8, arrangement: { kind: 'two-faces', barsPerFace: 3 } }],
  }),
);

describe('renderSheet', () => {
  it('refuses sheet 0, sheet 2 of 1, 1.5 and NaN with a PmError naming sheet', async () => {
    for (const n of [0, 2, 1.5, NaN]) await expect(renderSheet(set, n, 'svg')).rejects.toThrow(/^sheet: .* is not a sheet of the set \(sheets are numbered 1–1\)$/);
    await expect(renderSheet(set, 1, 'gif' as 'svg')).rejects.toThrow('format: gif is not one of the allowed values (allowed: svg, png, pdf)');
  });
});
