/**
 * Views of the checks about each axis alone (issue 19): the table names the axis and the clause of each check and
 * which governs, the text report lists the rule findings, and a check held as a ranking prints the same bytes.
 * Sections and loads are those of tests/design/axis-rules.test.ts, where the figures are checked by hand
 * (ACI 318-19 6.6.4.5.4 M2,min about y; 22.2.1, 22.2.2 exact search).
 */
import { describe, expect, it } from 'vitest';
import { resolveBasis } from '../../src/codes/registry.js';
import { checkColumn, describeCheck, prepareColumnCheck, rankColumnCheck, type ColumnCheckInput } from '../../src/design/column-check.js';
import { axisChecksView, checkReportText, checkText, checkTextPieces, textSizer, type CheckRows } from '../../src/report/check-view.js';

const aci = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
const input: ColumnCheckInput = {
  basis: aci,
  shape: { kind: 'rectangle', b: 12, h: 24 },
  arrangement: { kind: 'custom', bars: [{ x: 0, y: 0.4, share: 1 }, { x: 0, y: -0.4, share: 1 }] },
  gamma: 0.8,
  capContext: { depth: 24 },
  loads: [
    { id: 'A', Pu: 600, Mu: 60 },
    { id: 'B', Pu: 200, Mu: 60 },
  ],
  rho: 4 / 288,
  slenderness: { x: { effectiveLength: 126 } },
};

describe('each axis alone, in the views', () => {
  it('one row per load checked about y alone, with the clause 6.6.4.5.4, the governing load marked', () => {
    const c = checkColumn(input);
    const t = axisChecksView(c)!;
    expect(t.rows.map((r) => [r[0], r[1], r[6]])).toEqual([
      ['A', 'about y alone', '6.6.4.5.4'],
      ['B', 'about y alone', '6.6.4.5.4'],
    ]);
    expect(t.rows[0]![7]).toBe('yes');
    expect(t.marked).toEqual([true, false]);
    expect(checkReportText(c, 'test')).toContain('A: minimum moment about y [6.6.4.5.4] applied: 0 kip-ft against 48 kip-ft');
  });

  it('a check held as a ranking prints the same text, the axis table included', () => {
    const whole = checkText(checkColumn(input));
    const ctx = prepareColumnCheck(input);
    const sizer = textSizer(describeCheck(ctx));
    const ranked = rankColumnCheck(ctx, (r) => sizer.visit(r));
    const src: CheckRows = { check: ranked.check, governing: ranked.governing, results: () => ranked.results(), loadId: ranked.loadId };
    const streamed = [...checkTextPieces(src, sizer.finish(ranked.governing))].join('');
    expect(streamed).toBe(whole);
    expect(whole).toContain('Each axis alone');
  });
});
