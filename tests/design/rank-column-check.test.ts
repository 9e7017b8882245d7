/**
 * `rankColumnCheck` is `checkColumn` for load files too big to hold: the same ranking, summary and bar
 * proposals, with each result computed again in ranked order. Both are our engine; this compares
 * the two orderings of one computation (the figures are checked against published sources in
 * column-check.test.ts and hand-check.test.ts).
 */
import { describe, expect, it } from 'vitest';
import { resolveBasis } from '../../src/codes/registry.js';
import { checkColumn, prepareColumnCheck, rankColumnCheck, type ColumnCheckInput, type ColumnLoadResult } from '../../src/design/column-check.js';
import { barSet } from '../../src/section/bar-tables.js';

const basis = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
const sizes = barSet(basis.barSet).sizes.filter((s) => s.diameter >= 0.625);
// invented loads: ties (same load twice), tension, zero, and one beyond any ρg
const loads = [
  { id: 'A', Pu: 400, Mu: 150 * 12 },
  { id: 'B', Pu: 900, Mu: 600 * 12 },
  { id: 'A2', Pu: 400, Mu: 150 * 12 },
  { id: 'T', Pu: -100, Mu: 80 * 12 },
  { id: 'Z', Pu: 0, Mu: 0 },
  { id: 'X', Pu: 5000, Mu: 4000 * 12 },
  { id: 'B2', Pu: 900, Mu: 600 * 12 },
];
const input: ColumnCheckInput = {
  basis,
  shape: { kind: 'rectangle', b: 24, h: 24 },
  arrangement: { kind: 'two-faces', barsPerFace: 4 },
  gamma: 0.8,
  loads,
  barSelection: { detailing: { kind: 'gamma', gamma: 0.8 }, sizes, count: 3 },
};

describe('rankColumnCheck', () => {
  it('ranks as checkColumn: the same results in the same order, the governing load first and marked', () => {
    const held = checkColumn(input);
    const ranked = rankColumnCheck(prepareColumnCheck(input));
    const results = [...ranked.results()];
    expect(results[0]!.id).toBe('X');
    expect(results.slice(1, 3).map((r) => r.id)).toEqual(['B', 'B2']);
    expect(results).toEqual(held.results);
    expect(results.filter((r) => r.governing).map((r) => r.id)).toEqual(['X']);
    expect(ranked.governing).toEqual(held.results[0]);
  });

  it('carries the same summary, proposals and exit status, without holding the results', () => {
    const { results: _all, ...held } = checkColumn({ ...input, loads: loads.filter((l) => l.id !== 'X') });
    const ranked = rankColumnCheck(prepareColumnCheck({ ...input, loads: loads.filter((l) => l.id !== 'X') }));
    expect(ranked.check).toEqual(held);
    expect('results' in ranked.check).toBe(false);
    expect(ranked.check.bars.length).toBeGreaterThan(0);
  });

  it('shows every result to the visitor once, in input order', () => {
    const seen: ColumnLoadResult[] = [];
    rankColumnCheck(prepareColumnCheck(input), (r) => seen.push(r));
    expect(seen.map((r) => r.index)).toEqual(loads.map((_, i) => i));
  });

  it('no loads: no governing load, an empty ranking', () => {
    const ranked = rankColumnCheck(prepareColumnCheck({ ...input, loads: [] }));
    expect(ranked.governing).toBeUndefined();
    expect([...ranked.results()]).toEqual([]);
    expect(ranked.check.summary.text).toBe('no loads');
  });
});
