/**
 * The page's state in the URL fragment and its loads as CSV (pure, src/page/state.ts): a round trip keeps
 * every input, the fragment stays within its cap by leaving pasted loads out (and says it did), only known
 * fields are read back, and the CSV is one `pmchart check --loads` reads (checked through the CLI's reader).
 */
import { describe, expect, it } from 'vitest';
import { parseLoadsCsv } from '../../src/cli/check.js';
import { decodeState, encodeState, FRAGMENT_CAP, loadsCsv } from '../../src/page/state.js';

const known = new Set(['fc', 'fy', 'gamma', 'dimensionless', 'loads', 'pu', 'mu']);
const boxes = new Set(['dimensionless']);

describe('page state in the URL fragment', () => {
  it('round-trips the inputs and the γ grid; empty and unchecked fields are left out', () => {
    const values = { fc: '5ksi', fy: '60 ksi', gamma: '0.8', dimensionless: true, pu: '', mu: '', loads: 'id,Pu,Mu\nA,500,200\n' };
    const { fragment, loadsLeftOut } = encodeState({ values, grid: 0.1 });
    expect(loadsLeftOut).toBe(false);
    expect(fragment).not.toContain('pu=');
    const back = decodeState(`#${fragment}`, known, boxes)!;
    expect(back.grid).toBe(0.1);
    expect(back.values).toEqual({ fc: '5ksi', fy: '60 ksi', gamma: '0.8', dimensionless: true, loads: 'id,Pu,Mu\nA,500,200\n' });
  });

  it('keeps pasted loads out of a fragment that would pass the cap, and says so; the rest stays', () => {
    const rows = Array.from({ length: 200 }, (_, i) => `C${i},${500 + i},${100 + i}`).join('\n');
    const { fragment, loadsLeftOut } = encodeState({ values: { fc: '5ksi', loads: `id,Pu,Mu\n${rows}` } });
    expect(loadsLeftOut).toBe(true);
    expect(fragment.length).toBeLessThanOrEqual(FRAGMENT_CAP);
    expect(decodeState(fragment, known, boxes)!.values).toEqual({ fc: '5ksi' });
  });

  it('reads known fields only, ignores a grid off the list, and ignores a fragment past the cap', () => {
    const back = decodeState('#fc=4&evil=1&grid=0.3', known, boxes)!;
    expect(back.values).toEqual({ fc: '4' });
    expect(back.grid).toBeUndefined();
    expect(decodeState(`#fc=${'9'.repeat(FRAGMENT_CAP)}`, known, boxes)).toBeNull();
    expect(decodeState('', known, boxes)).toBeNull();
  });
});

describe('loads saved as CSV', () => {
  it('a typed load becomes one row the check reads back, units and all', () => {
    const csv = loadsCsv({ kind: 'typed', pu: '500kip', mu: '200kip-ft', muy: '50' });
    expect(csv).toBe('id,Pu,Mu,Muy\nload,500kip,200kip-ft,50\n');
    const loads = parseLoadsCsv(csv, 'us');
    expect(loads).toHaveLength(1);
    // 200 kip-ft = 200 × 12 = 2400 kip-in (the internal moment unit; hand conversion)
    expect(loads[0]).toMatchObject({ id: 'load', Pu: 500, Mu: 2400 });
  });

  it('pasted loads are saved as pasted', () => {
    expect(loadsCsv({ kind: 'csv', text: 'id,Pu,Mu\nA,1,2\n\n  ' })).toBe('id,Pu,Mu\nA,1,2\n');
  });
});
