/**
 * Biaxial sheets lay out without clipping on every paper size and orientation: all text of a rendered
 * sheet lies inside the page and no two texts overlap (read from the SVG), for an ACI 318-19 (US) and an
 * EN 1992-1-1 (SI, dimensionless) sheet of six levels. Layout checks are common practice for drawing
 * sheets; the values are the sheet's own geometry, not computed results. Also: the library's
 * renderSheet draws a biaxial sheet of a set.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildBiaxialSheet } from '../../src/chart/biaxial-sheet.js';
import { readChartSet } from '../../src/config/read.js';
import { SheetRenderer } from '../../src/render/renderer.js';
import { biaxialFamilyForSheet } from '../../src/sheet/curves.js';
import { renderSheet } from '../../src/sheet/render-sheet.js';
import { overlappingPairs, svgTextBoxes } from '../helpers/svg-text.js';

let renderer: SheetRenderer;
beforeAll(async () => {
  renderer = await SheetRenderer.create();
});
afterAll(() => renderer.finalize());

const setOf = (over: Record<string, unknown>) =>
  readChartSet(
    JSON.stringify({
      name: 'corner',
      titleBlock: { office: 'Halden Reach Engineers (invented)', project: 'Millrace Depot, corner columns (invented)', date: '2026-01-05' },
      units: 'us',
      basis: { code: 'aci318-19' },
      sheets: [{ fc: 5, fy: 60, gamma: 0.75, arrangement: { kind: 'four-faces', barsPerFace: 3 }, chart: 'biaxial', axialLevels: { from: 0, to: 0.5, step: 0.1 } }],
      ...over,
    }),
  );
const EN = {
  units: 'si',
  basis: { code: 'en1992-1-1' },
  normalisation: 'dimensionless',
  sheets: [{ shape: { kind: 'rectangle', aspect: 0.6 }, fc: 40, fy: 500, gamma: 0.8, arrangement: { kind: 'two-faces', barsPerFace: 4 }, chart: 'biaxial', axialLevels: [0.1, 0.2, 0.3, 0.4, 0.5, 0.6] }],
};

describe.each([
  ['US', {}],
  ['EN', EN],
])('%s biaxial sheet on every paper', (_name, base) => {
  for (const size of ['a4', 'a3', 'letter', 'tabloid'])
    for (const orientation of ['portrait', 'landscape'])
      it(`${size} ${orientation}: text inside the page, nothing overlapping`, async () => {
        const set = setOf({ ...base, paper: { size, orientation } });
        const sheet = set.sheets[0]!;
        const built = buildBiaxialSheet({ set, sheet, family: biaxialFamilyForSheet(set, sheet), sheetNumber: 1, sheetCount: 1, generator: 'pmchart 0.1.0', measureText: renderer.measureText });
        const svg = await renderer.svg({ template: built.template, data: built.data });
        const { w, h } = built.template.layout.page;
        const boxes = svgTextBoxes(svg, renderer.measureText).filter((b) => !b.mark.includes('halo'));
        expect(boxes.length).toBeGreaterThan(100);
        const outside = boxes.filter((b) => b.x0 < -0.1 || b.y0 < -0.1 || b.x1 > w + 0.1 || b.y1 > h + 0.1).map((b) => b.text);
        expect(outside).toEqual([]);
        const pairs = overlappingPairs(boxes).map(([a, b]) => `${a.text} | ${b.text}`);
        expect(pairs).toEqual([]);
      }, 30_000);
});

describe('renderSheet', () => {
  it('draws a biaxial sheet of a set as SVG with its levels', async () => {
    const svg = (await renderSheet(setOf({ paper: { size: 'letter' } }), 1, 'svg')) as string;
    expect(svg).toContain('P/(f′c·Ag) = 0.50');
    expect(svg).toContain('Bresler 1960');
  }, 30_000);
});
