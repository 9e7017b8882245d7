/**
 * The views' tables carry typed columns (issue 23): key, heading, unit and alignment are given where the
 * table is made, and the text header is the heading then the unit, so the drawn sheet and the page never
 * read a unit back out of header text. Section: the issue-4 hand-check (common practice, worked by hand:
 * 24 × 24 in, f′c 4 ksi, fy 60 ksi, γ 0.75, Pu 900 kip, Mu 600 kip-ft), and an EN 1992-1-1 column in SI.
 */
import { describe, expect, it } from 'vitest';
import { resolveBasis } from '../../src/codes/registry.js';
import { checkColumn } from '../../src/design/column-check.js';
import { biaxialView, headerText, resultsHeaders, resultsView } from '../../src/report/check-view.js';

describe('typed table columns', () => {
  const aci = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
  const c = checkColumn({ basis: aci, shape: { kind: 'rectangle', b: 24, h: 24 }, arrangement: { kind: 'two-faces', barsPerFace: 2 }, gamma: 0.75, loads: [{ id: 'C-1', Pu: 900, Mu: 600 * 12 }] });

  it('the results table: units only on forces, moments and areas; words left, figures right', () => {
    const t = resultsView(c);
    const by = (key: string) => t.columns.find((x) => x.key === key)!;
    expect(by('Pu')).toMatchObject({ unit: 'kip', align: 'right' });
    expect(by('Mu')).toMatchObject({ unit: 'kip-ft', align: 'right' });
    expect(by('extraSteelRoundedDown')).toMatchObject({ heading: 'extra', unit: 'in²' });
    // headings with a space that are no unit stay whole
    expect(by('rhoRoundedDown')).toMatchObject({ heading: 'ρg rounded', unit: null });
    expect(by('strainClass')).toMatchObject({ heading: 'strain state', align: 'left' });
    expect(by('id').align).toBe('left');
    expect(t.rows[0]).toHaveLength(t.columns.length);
  });

  it('the text headers are the heading then the unit, as before', () => {
    expect(resultsHeaders(c).slice(0, 3)).toEqual(['id', 'Pu kip', 'Mu kip-ft']);
    expect(resultsView(c).headers).toEqual(resultsView(c).columns.map(headerText));
  });

  it('EN 1992-1-1 in SI: the basis symbols head the columns and the SI units sit apart', () => {
    const en = resolveBasis('en1992-1-1', { units: 'si', fc: 30, fy: 500, transverse: 'tied' });
    const e = checkColumn({ basis: en, shape: { kind: 'rectangle', b: 400, h: 400 }, arrangement: { kind: 'four-faces', barsPerFace: 3 }, gamma: 0.75, rho: 0.02, loads: [{ id: 'E1', Pu: 1500e3, Mu: 60e6, Muy: 30e6 }] });
    const t = resultsView(e);
    const pu = t.columns.find((x) => x.key === 'Pu')!;
    expect(pu.heading).not.toContain('kN');
    expect(pu.unit).toBe('kN');
    const bx = biaxialView(e)!;
    expect(bx.columns.find((x) => x.key === 'Mux')!.unit).toBe(t.columns.find((x) => x.key === 'Mu')!.unit);
    expect(bx.columns.find((x) => x.key === 'method')!.align).toBe('left');
  });
});
