/** Spec → SVG/PNG: SVG structure (one path per curve, labels and axis titles present) and determinism. */
import { describe, expect, it } from 'vitest';
import { buildSheet } from '../../src/chart/sheet-data.js';
import { SheetRenderer } from '../../src/render/renderer.js';
import { familyForSheet } from '../../src/sheet/curves.js';
import { referenceSet } from '../helpers/chart-set.js';
import { markGroup } from '../helpers/svg.js';

const page = (over: Record<string, unknown> = {}) => {
  const set = referenceSet(over);
  const sheet = set.sheets[0]!;
  const family = familyForSheet(set, sheet);
  const built = buildSheet({ set, sheet, family, sheetNumber: 1, sheetCount: 1, generator: 'pmchart 0.1.0' });
  return { template: built.template, data: built.data };
};


const LINE_PATH = /aria-roledescription="line mark" d="M/g;

describe('SheetRenderer', () => {
  it('writes one SVG path per curve, with ρg labels and axis titles', async () => {
    const r = await SheetRenderer.create();
    const svg = await r.svg(page());
    // vega-lite facets a line with `detail` into one group per curve, each holding one path
    const curves = markGroup(svg, 'curves_design_pathgroup');
    expect(curves).not.toBe('');
    expect(curves.match(LINE_PATH)).toHaveLength(4);
    for (const rho of ['0.01', '0.02', '0.04', '0.08']) expect(svg).toContain(`>ρg ${rho}</text>`);
    expect(svg).toContain('φPn / Ag   (ksi)');
    expect(svg).toContain('φMn / (Ag · h)');
    expect(svg).toContain('Fenwick Hollow Engineers (invented)');
    expect(svg).toContain('qualified engineers');
    // two curve families when both are asked for
    const both = await r.svg(page({ families: 'both' }));
    expect(markGroup(both, 'curves_nominal_pathgroup').match(LINE_PATH)).toHaveLength(4);
    expect(markGroup(both, 'curves_design_pathgroup').match(LINE_PATH)).toHaveLength(4);
    r.finalize();
  });

  it('gives identical SVG and PNG bytes for the same sheet, also after other sheets were shown', async () => {
    const r = await SheetRenderer.create();
    const a = page();
    const svg1 = await r.svg(a);
    const png1 = await r.png(a, 1);
    await r.svg(page({ rhoG: [0.03, 0.05] }));
    expect(await r.svg(page())).toBe(svg1);
    expect(Buffer.compare(await r.png(page(), 1), png1)).toBe(0);
    expect(png1.subarray(1, 4).toString()).toBe('PNG');
    r.finalize();
  });
});
