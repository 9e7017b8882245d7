/**
 * Bar proposals with unequal four-faces counts [nb, nh] (issue 15) for a corner column with Mux and Muy,
 * each proposal re-verified by the check engine with its discrete bars. Limits as in bar-selection.test.ts:
 * clear spacing ACI 318-19 25.2.3, steel limits ACI 318-19 10.6.1.1, bar sizes ASTM A615 Table 1,
 * bar centres at cover + tie + db/2 (common practice). The section and loads are invented.
 */
import { describe, expect, it } from 'vitest';
import { resolveBasis } from '../../src/codes/registry.js';
import { clearSpacing } from '../../src/design/bar-selection.js';
import { checkColumn, type ColumnCheckInput } from '../../src/design/column-check.js';
import { barCount } from '../../src/section/arrangements.js';
import { barSet } from '../../src/section/bar-tables.js';
import { gammaFromCover } from '../../src/section/geometry.js';
import { faceCounts, type Arrangement, type FaceCounts } from '../../src/section/types.js';
import { expectClose } from '../helpers/tolerance.js';

const basis = resolveBasis('aci318-19', { units: 'us', fc: 5, fy: 60, transverse: 'tied' });
const shape = { kind: 'rectangle', b: 16, h: 24 } as const;
const sizes = barSet('astm-a615').sizes.filter((s) => s.diameter >= 0.625);
// 400 kips with 300 kip·ft about x and 150 kip·ft about y (kip·in inside)
const loads = [{ id: 'C3', Pu: 400, Mu: 300 * 12, Muy: 150 * 12 }];
const base: ColumnCheckInput = { basis, shape, arrangement: { kind: 'four-faces', barsPerFace: 3 }, gamma: gammaFromCover(24, 1.5, 0.5, 1), loads };
const check = checkColumn({ ...base, barSelection: { detailing: { kind: 'cover', cover: 1.5, tieDiameter: 0.5 }, sizes } });

/** The engine's check of a given layout of one bar size at the γ that size gives. */
function recheck(size: string, perFace: FaceCounts) {
  const bar = sizes.find((s) => s.name === size)!;
  const gamma = gammaFromCover(24, 1.5, 0.5, bar.diameter);
  const arrangement: Arrangement = { kind: 'four-faces', barsPerFace: perFace };
  const area = barCount(arrangement) * bar.area;
  return checkColumn({ ...base, arrangement, gamma, layout: { arrangement, area, gamma, description: '' } }).results[0]!;
}

describe('proposals for a corner column with Mux and Muy', () => {
  it('include unequal layouts, lightest first, each passing every limit', () => {
    expect(check.bars.length).toBeGreaterThan(0);
    expect(check.bars.some((p) => typeof p.perFace !== 'number')).toBe(true);
    for (let i = 1; i < check.bars.length; i++) expect(check.bars[i]!.area).toBeGreaterThanOrEqual(check.bars[i - 1]!.area);
    for (const p of check.bars) {
      const [nb, nh] = faceCounts(p.perFace);
      expect(p.count).toBe(2 * nb + 2 * nh - 4);
      expect(p.count).toBeGreaterThanOrEqual(4); // ACI 318-19 10.7.3.1 (from memory): 4 bars within ties
      expect(p.rho).toBeGreaterThanOrEqual(0.01);
      expect(p.rho).toBeLessThanOrEqual(0.08);
      // ACI 318-19 25.2.3: clear spacing ≥ max(1.5 in, 1.5·db); no aggregate given
      expect(p.clearSpacing).toBeGreaterThanOrEqual(Math.max(1.5, 1.5 * p.barDiameter) - 1e-9);
      expectClose(p.clearSpacing, clearSpacing(shape, 'four-faces', p.perFace, p.gamma, p.barDiameter), 1e-12);
      if (nb !== nh) expect(p.layout).toContain(`${nb} on each b face, ${nh} on each h face`);
    }
  });

  it('each unequal proposal re-verified with its discrete bars: status ok, exact biaxial utilisation ≤ 1', () => {
    for (const p of check.bars.filter((q) => typeof q.perFace !== 'number')) {
      const r = recheck(p.size, p.perFace);
      expect(r.status).toBe('ok');
      expect(r.biaxial!.exact!.utilisation).toBeLessThanOrEqual(1);
      expectClose(Math.max(r.utilisation!, r.biaxial!.exact!.utilisation), p.utilisation, 1e-9);
    }
  });

  it('no layout of the same bar size with two bars fewer passes: the proposal is the lightest of its size', () => {
    const p = check.bars.find((q) => typeof q.perFace !== 'number')!;
    const sum = p.count / 2 + 2 - 1; // nb + nh of a total two bars lighter
    for (let nb = 2; nb <= sum - 2; nb++) {
      const r = recheck(p.size, [nb, sum - nb]);
      expect(r.status, `${p.size} [${nb}, ${sum - nb}]`).toBe('fails');
    }
  });
});

describe('clearSpacing of a four-faces pair', () => {
  it('16 × 24 in, γ 0.75, γB 0.5, [3, 5], 1 in bars: min(0.5·16/2, 0.75·24/4) − 1 = 3 in (hand calculation)', () => {
    // b faces: 3 bars over γB·b = 8 in → 4 in centres; h faces: 5 bars over γ·h = 18 in → 4.5 in centres
    expectClose(clearSpacing(shape, 'four-faces', [3, 5], 0.75, 1, 0.5), 3, 1e-12);
    // equal cover: across b = 16 − (1 − 0.75)·24 = 10 in → 5 in centres; the h faces govern, 4.5 − 1
    expectClose(clearSpacing(shape, 'four-faces', [3, 5], 0.75, 1), 3.5, 1e-12);
  });
});
