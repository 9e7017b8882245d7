/**
 * Every paper size and orientation lays out without clipping: all text of a rendered sheet lies inside
 * the page and no two texts overlap (read from the SVG), for an ACI 318-19 (US) and an EN 1992-1-1 (SI)
 * sheet. Also: one ρg label per curve in the compression zone, axes within one round step of the data,
 * and the reading test. Layout checks are common practice for drawing sheets; the values are the
 * sheet's own geometry, not computed results.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildSheet, type SheetContext } from '../../src/chart/sheet-data.js';
import { familyExtent } from '../../src/chart/axes.js';
import { familyForSheet } from '../../src/sheet/curves.js';
import { SheetRenderer } from '../../src/render/renderer.js';
import { referenceSet } from '../helpers/chart-set.js';
import { overlappingPairs, svgTextBoxes } from '../helpers/svg-text.js';

let renderer: SheetRenderer;
beforeAll(async () => {
  renderer = await SheetRenderer.create();
});
afterAll(() => renderer.finalize());

const US = { rhoG: [0.001, 0.005, 0.01, 0.02, 0.03, 0.04, 0.05, 0.06, 0.07, 0.08] };
const EN = {
  units: 'si',
  basis: { code: 'en1992-1-1' },
  normalisation: 'dimensionless',
  omega: [0.1, 0.2, 0.3, 0.4, 0.6, 0.8, 1.0],
  rhoG: undefined,
  sheets: [{ fc: 40, fy: 500, gamma: 0.8, arrangement: { kind: 'four-faces', barsPerFace: 3 }, basisOptions: { alphaCc: 0.85 } }],
};

function sheetOf(over: Record<string, unknown>) {
  const set = referenceSet(over);
  const sheet = set.sheets[0]!;
  const family = familyForSheet(set, sheet);
  const ctx: SheetContext = { set, sheet, family, sheetNumber: 1, sheetCount: 1, generator: 'pmchart 0.1.0', measureText: renderer.measureText };
  return { set, family, built: buildSheet(ctx) };
}

describe.each([
  ['US', US],
  ['EN', EN],
])('%s sheet on every paper', (_name, base) => {
  for (const size of ['a4', 'a3', 'letter', 'tabloid'])
    for (const orientation of ['portrait', 'landscape'])
      it(`${size} ${orientation}: text inside the page, nothing overlapping`, async () => {
        const { built } = sheetOf({ ...base, paper: { size, orientation } });
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

describe('labels and axes', () => {
  it('gives every curve at least one label in the compression zone (P > 0)', () => {
    for (const over of [US, EN, { ...US, families: 'both' }, { ...US, paper: { size: 'a4', orientation: 'portrait' } }]) {
      const { built, set } = sheetOf(over);
      const n = set.ratios.values.length;
      // nominal curves of families: both carry their own labels ("ρg 0.02 n")
      const texts = new Set(built.data.curveLabels.filter((l) => l.P > 0 && !l.text.endsWith(' n')).map((l) => l.text));
      expect(texts.size).toBe(n);
    }
  });

  it('ends each axis within one round step beyond the curves', () => {
    for (const over of [US, EN, { ...US, families: 'both' }]) {
      const { built, family, set } = sheetOf(over);
      const d = set.normalisation === 'dimensionless' ? family.basis.normalisingStress : 1;
      const e = familyExtent(family, built.template.families, d);
      const a = built.template.axes!;
      expect(a.M.domain[1]).toBeGreaterThanOrEqual(e.M[1] - 1e-9);
      expect(a.M.domain[1] - e.M[1]).toBeLessThan(a.M.step);
      expect(a.P.domain[1]).toBeGreaterThanOrEqual(e.P[1] - 1e-9);
      expect(a.P.domain[1] - e.P[1]).toBeLessThan(a.P.step);
      expect(a.P.domain[0]).toBeLessThanOrEqual(e.P[0] + 1e-9);
      expect(e.P[0] - a.P.domain[0]).toBeLessThan(a.P.step);
    }
  });

  it('sets each compression-zone label on its own curve on every demo sheet, at the group scale (common practice)', async () => {
    const { readChartSet } = await import('../../src/config/read.js');
    const { groupExtents } = await import('../../src/sheet/curves.js');
    const { readFileSync } = await import('node:fs');
    const set = readChartSet(readFileSync('charts-config/demo.json', 'utf8'), { files: (await import('../../src/io/read.js')).nodeFileAccess, baseDir: 'charts-config' });
    const ext = groupExtents(set);
    for (const sheet of set.sheets.slice(0, 4)) {
      const family = familyForSheet(set, sheet);
      const built = buildSheet({ set, sheet, family, sheetNumber: sheet.index, sheetCount: set.sheets.length, generator: 'pmchart 0.1.0', measureText: renderer.measureText, extent: ext[sheet.origin]! });
      family.curves.forEach((c, k) => {
        const l = built.data.curveLabels[k]!;
        expect(l.text).toBe(`ρg ${c.rho}`);
        const rows = built.data.curves.filter((r) => r.curve === `design-${c.rho}`);
        const i = rows.findIndex((r) => r.P >= l.P - 1e-9);
        const [a, b] = [rows[Math.max(0, i - 1)]!, rows[i]!];
        // on the segment that spans the label's P (within 0.02 in M), or on the flat cap
        const onCap = Math.abs(l.P - Math.max(...rows.map((r) => r.P))) < 1e-4;
        expect(onCap || (l.M >= Math.min(a.M, b.M) - 0.02 && l.M <= Math.max(a.M, b.M) + 0.02), `sheet ${sheet.index} ${l.text}`).toBe(true);
      });
    }
  }, 60_000);

  // Reading test (common practice): a reader finds a curve by the label nearest to it.
  it('on the demo sheet, the label nearest to each curve at half its largest P names that curve', async () => {
    const { readChartSet } = await import('../../src/config/read.js');
    const { readFileSync } = await import('node:fs');
    const set = readChartSet(readFileSync('charts-config/demo.json', 'utf8'), { files: (await import('../../src/io/read.js')).nodeFileAccess, baseDir: 'charts-config' });
    const sheet = set.sheets[0]!;
    const family = familyForSheet(set, sheet);
    const built = buildSheet({ set, sheet, family, sheetNumber: 1, sheetCount: set.sheets.length, generator: 'pmchart 0.1.0', measureText: renderer.measureText });
    const a = built.template.axes!;
    const L = built.template.layout;
    const X = (M: number) => ((M - a.M.domain[0]) / (a.M.domain[1] - a.M.domain[0])) * L.plot.w;
    const Y = (P: number) => ((a.P.domain[1] - P) / (a.P.domain[1] - a.P.domain[0])) * L.plot.h;
    family.curves.forEach((c, k) => {
      const rows = built.data.curves.filter((r) => r.curve === `design-${c.rho}`);
      const pMax = Math.max(...rows.map((r) => r.P));
      const i = rows.findIndex((r) => r.P >= pMax / 2);
      const p0 = rows[i - 1]!;
      const p1 = rows[i]!;
      const t = (pMax / 2 - p0.P) / (p1.P - p0.P);
      const x = X(p0.M + t * (p1.M - p0.M));
      const y = Y(pMax / 2);
      const nearest = [...built.data.curveLabels].sort((l, m) => Math.hypot(X(l.M) - x, Y(l.P) - y) - Math.hypot(X(m.M) - x, Y(m.P) - y))[0]!;
      expect(nearest.text, `curve ${k}`).toBe(`ρg ${c.rho}`);
    });
  });
});
