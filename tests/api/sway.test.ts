/**
 * The library API takes a sway column typed (issue 24): `SlendernessRequest.x.sway` (`SwayMember`) and the
 * load fields M2s, M1s, Q, storeyPu, storeyPc (`EndMoments`), checked with the limits the CLI uses.
 * Figures: the ACI 318-19 6.6.4.6 hand calculation of tests/design/slenderness-sway.test.ts, restated:
 *   16 × 16 in, 8 #8 at γ = 11/16, Pu = 400 kips, kℓu = 240 in, βdns = 0.6, M2ns = 600, M1ns = −300, M2s = 1200 kip·in,
 *   Q = 0.2: δs = 1.25 (6.6.4.6.2(a)); M2 = 600 + 1.25·1200 = 2100 kip·in (6.6.4.6.1);
 *   kℓu as braced 144 in: kℓu/r = 30 ≤ 40, short along the length (6.6.4.6.4, 6.2.5.1(b)): design moment 2100 kip·in.
 */
import { describe, expect, it } from 'vitest';
import { checkColumn, PmError, resolveBasis, type ColumnCheckInput, type SwayMember } from '../../src/index.js';
import { expectClose } from '../helpers/tolerance.js';

const basis = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
const sway: SwayMember = { stabilityIndex: 0.2, bracedEffectiveLength: 144 };
const input: ColumnCheckInput = {
  basis,
  shape: { kind: 'rectangle', b: 16, h: 16 },
  arrangement: { kind: 'four-faces', barsPerFace: 3 },
  gamma: 11 / 16,
  rho: 6.32 / 256,
  loads: [{ id: 'W', Pu: 400, Mu: 600, M2: 600, M1: -300, M2s: 1200 }],
  slenderness: { x: { effectiveLength: 240, betaDns: 0.6, sway } },
};
const refusal = (fn: () => unknown): string => {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(PmError);
    return (e as PmError).path;
  }
  return 'accepted';
};

describe('checkColumn with a sway column', () => {
  it('design moment 2100 kip·in by ACI 318-19 6.6.4.6 (hand calculation)', () => {
    const r = checkColumn(input).results[0]!;
    expect(r.slenderness?.x.method).toBe('ACI 318-19 6.6.4.6 moment magnification (sway)');
    expectClose(r.slenderness!.x.magnifiedMoment, 2100, 1e-12);
  });
  it('a load\'s Q replaces the member\'s: Q = 1/3 gives δs = 1.5 and M2 = 600 + 1800 = 2400 kip·in', () => {
    const r = checkColumn({ ...input, loads: [{ ...input.loads[0]!, Q: 1 / 3 }] }).results[0]!;
    expectClose(r.slenderness!.x.magnifiedMoment, 2400, 1e-9);
  });
  it('refuses a bad per-load Q or storey sum with its field path, and a missing sway part', () => {
    expect(refusal(() => checkColumn({ ...input, loads: [{ ...input.loads[0]!, Q: -0.1 }] }))).toBe('loads[0].Q');
    expect(refusal(() => checkColumn({ ...input, loads: [{ ...input.loads[0]!, storeyPu: -5, storeyPc: 100 }] }))).toBe('loads[0].storeyPu');
    expect(refusal(() => checkColumn({ ...input, loads: [{ id: 'W', Pu: 400, Mu: 600 }] }))).toBe('m2Sway');
    expect(refusal(() => checkColumn({ ...input, slenderness: { x: { effectiveLength: 240, betaDns: 0.6, sway: {} } } }))).toBe('stabilityIndex');
  });
});
