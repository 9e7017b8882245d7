/**
 * Sway (unbraced) columns in the four bases (issue 24), through `slendernessCheck` with `sway` data.
 * No published worked example of these methods was found in the reference search; each case is a hand
 * calculation written out beside it, with each formula's clause. Clause facts marked "from memory" in the
 * rulebooks (src/codes/sway-magnifier.ts, slenderness-*.ts) are from memory here too; EN 1992-1-1
 * 5.8.3.1(1) "rm = 1 for unbraced members in general" and ACI 318-19 6.6.4.6.1, 6.6.4.6.2 (δs from Q, or
 * the storey sums, only (b) or (c) above δs = 1.5) are published text.
 */
import { describe, expect, it } from 'vitest';
import { resolveBasis } from '../../src/codes/registry.js';
import type { Basis } from '../../src/codes/types.js';
import { isPmError } from '../../src/errors.js';
import { enUnbracedLengthFactor, slendernessCheck, type SlendernessResult, type SlendernessSection } from '../../src/design/slenderness.js';
import { layoutBars } from '../../src/section/arrangements.js';
import type { Shape } from '../../src/section/types.js';
import { expectClose } from '../helpers/tolerance.js';

const step = (r: SlendernessResult, key: string): number | boolean => {
  const s = r.steps.find((x) => x.key === key);
  if (!s) throw new Error(`no step ${key}`);
  return s.value as number | boolean;
};
const clause = (r: SlendernessResult, key: string): string => r.steps.find((x) => x.key === key)!.clause;

describe('ACI 318-19 6.6.4.6 sway magnification — hand calculation', () => {
  // 16 × 16 in tied column, f′c = 4 ksi, fy = 60 ksi, 8 #8 on four faces at γ = 11/16 (the section of the
  // non-sway hand calculation in tests/design/slenderness.test.ts), Pu = 400 kips, βdns = 0.6, kℓu (sway) = 240 in.
  // Non-sway parts M2ns = 600, M1ns = −300 kip·in (single curvature); sway part M2s = 1200 kip·in, M1s not
  // given: equal, of the same sign (reverse curvature, ACI 318-19 6.2.5.1 sign).
  //   r = 0.30·16 = 4.8 in (6.2.5.2); kℓu/r = 240/4.8 = 50 > 22: slender (6.2.5.1(a))
  //   Q = 0.2: δs = 1/(1 − 0.2) = 1.25 ≤ 1.5 (6.6.4.6.2(a))
  //   M2 = 600 + 1.25·1200 = 2100; M1 = −300 + 1.25·1200 = 1200 kip·in (6.6.4.6.1(a), (b))
  //   M2,min = 400·(0.6 + 0.03·16) = 432 < 2100 (6.6.4.5.4): end moment 2100
  //   along the length (6.6.4.6.4) with kℓu as braced = 240 in (not given: the sway kℓu, conservative):
  //     limit 34 + 12·(1200/2100) = 40.86 → 40 < 50: slender (6.2.5.1(b))
  //     (EI)eff = 0.4·3605.00·5461.33/1.6 = 4,922,022 kip·in²; Pc = π²·4,922,022/240² = 843.375 kips
  //     Cm = 0.6 − 0.4·(1200/2100) = 0.371429; δ = 0.371429/(1 − 400/(0.75·843.375)) = 1.010359
  //     Mc = 1.010359·2100 = 2121.754 kip·in
  //   design moment = max(2100, 2121.754) = 2121.754; first order = max(|600 + 1200|, |−300 + 1200|) = 1800
  //   ratio 2121.754/1800 = 1.178752 ≤ 1.4 (6.2.5.3)
  const basis = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
  const shape: Shape = { kind: 'rectangle', b: 16, h: 16 };
  const section: SlendernessSection = { shape, bars: layoutBars(shape, { kind: 'four-faces', barsPerFace: 3 }, 6.32, { gamma: 11 / 16 }) };
  const input = { effectiveLength: 240, M1: -300, M2: 600, Pu: 400, betaDns: 0.6 };
  const sway = (extra: object) => ({ ...input, sway: { M2s: 1200, M1s: 1200, ...extra } });

  it('Q = 0.2: δs = 1.25, M2 = 2100, along the length δ = 1.0104, design moment 2121.75 kip·in', () => {
    const r = slendernessCheck(basis, section, sway({ stabilityIndex: 0.2 }));
    expect(r.method).toBe('ACI 318-19 6.6.4.6 moment magnification (sway)');
    expectClose(step(r, 'klu-over-r') as number, 50, 1e-12);
    expect(step(r, 'limit')).toBe(22);
    expect(clause(r, 'limit')).toBe('6.2.5.1(a)');
    expectClose(step(r, 'delta-s') as number, 1.25, 1e-12);
    expect(clause(r, 'delta-s')).toBe('6.6.4.6.2(a)');
    expectClose(step(r, 'M2-sway') as number, 2100, 1e-12);
    expectClose(step(r, 'M1-sway') as number, 1200, 1e-12);
    expect(clause(r, 'M2-sway')).toBe('6.6.4.6.1');
    expectClose(step(r, 'along-Pc') as number, 843.375, 1e-5);
    expectClose(step(r, 'along-Cm') as number, 0.371429, 1e-5);
    expectClose(step(r, 'along-delta') as number, 1.010359, 1e-5);
    expect(clause(r, 'M-along')).toBe('6.6.4.6.4');
    expectClose(r.magnifiedMoment, 2121.754, 1e-5);
    expectClose(r.firstOrderMoment, 1800, 1e-12);
    expectClose(r.delta, 1.178752, 1e-5);
    expect(r.ok).toBe(true);
  });
  it('storey sums ΣPu = 3000, ΣPc = 16,000 kips: δs = 1/(1 − 3000/12,000) = 1.3333 (6.6.4.6.2(b)); kℓu as braced 144 in is short along the length', () => {
    // M2 = 600 + 1.3333·1200 = 2200, M1 = −300 + 1600 = 1300; along the length kℓu/r = 144/4.8 = 30 ≤ 40 (6.2.5.1(b)): 2200
    const r = slendernessCheck(basis, section, sway({ storeyPu: 3000, storeyPc: 16000, bracedEffectiveLength: 144 }));
    expectClose(step(r, 'storey-ratio') as number, 0.25, 1e-12);
    expectClose(step(r, 'delta-s') as number, 4 / 3, 1e-12);
    expect(clause(r, 'delta-s')).toBe('6.6.4.6.2(b)');
    expect(step(r, 'along-neglected')).toBe(true);
    expectClose(r.magnifiedMoment, 2200, 1e-12);
    expectClose(r.delta, 2200 / 1800, 1e-12);
    expect(r.ok).toBe(true);
  });
  it('Q = 1/3 gives δs = 1.5, the edge of the Q method: within (M2 = 2400, ratio 1.333 ≤ 1.4)', () => {
    const r = slendernessCheck(basis, section, sway({ stabilityIndex: 1 / 3, bracedEffectiveLength: 144 }));
    expectClose(step(r, 'delta-s') as number, 1.5, 1e-12);
    expect(step(r, 'delta-s-within-Q')).toBe(true);
    expectClose(r.magnifiedMoment, 2400, 1e-9);
    expect(r.ok).toBe(true);
  });
  it('Q = 0.34 gives δs = 1.5152 > 1.5: outside the scope of the Q method (6.6.4.6.2), delta finite', () => {
    const r = slendernessCheck(basis, section, sway({ stabilityIndex: 0.34, bracedEffectiveLength: 144 }));
    expectClose(step(r, 'delta-s') as number, 1 / 0.66, 1e-12);
    expect(r.ok).toBe(false);
    expect(Number.isFinite(r.delta)).toBe(true);
    expect(r.limitClause).toBe('ACI 318-19 6.6.4.6.2(a) (δs from Q > 1.5)');
  });
  it('the storey sums allow δs above 1.5 (δs = 2.0); then the 1.4 limit (6.2.5.3) takes the column out of scope', () => {
    // ΣPu/(0.75·ΣPc) = 6000/12,000 = 0.5, δs = 2.0; M2 = 600 + 2400 = 3000; 3000/1800 = 1.667 > 1.4
    const r = slendernessCheck(basis, section, sway({ storeyPu: 6000, storeyPc: 16000, bracedEffectiveLength: 144 }));
    expectClose(step(r, 'delta-s') as number, 2, 1e-12);
    expectClose(step(r, 'second-order-ratio') as number, 3000 / 1800, 1e-12);
    expect(r.ok).toBe(false);
    expect(r.limitClause).toBe('ACI 318-19 6.2.5.3 (second-order moment ≤ 1.4 × first-order)');
  });
  it('Q = 1 and ΣPu = 0.75·ΣPc are unstable: δ infinite (6.6.4.6.2)', () => {
    const q = slendernessCheck(basis, section, sway({ stabilityIndex: 1 }));
    expect(q.ok).toBe(false);
    expect(q.delta).toBe(Infinity);
    expect(q.limitClause).toBe('ACI 318-19 6.6.4.6.2(a) (Q ≥ 1)');
    const s = slendernessCheck(basis, section, sway({ storeyPu: 9000, storeyPc: 12000 }));
    expectClose(step(s, 'storey-ratio') as number, 1, 1e-12);
    expect(s.delta).toBe(Infinity);
    expect(s.limitClause).toBe('ACI 318-19 6.6.4.6.2(b) (ΣPu ≥ 0.75·ΣPc)');
    // just below the limit: stable
    expect(slendernessCheck(basis, section, sway({ storeyPu: 8999, storeyPc: 12000, bracedEffectiveLength: 144 })).delta).toBeLessThan(Infinity);
  });
  it('kℓu/r = 22 exactly may be neglected (6.2.5.1(a)): the first-order end moment 1800, not magnified', () => {
    const r = slendernessCheck(basis, section, { ...sway({ stabilityIndex: 0.2 }), effectiveLength: 22 * 4.8 });
    expect(r.neglected).toBe(true);
    expectClose(r.magnifiedMoment, 1800, 1e-12);
    const over = slendernessCheck(basis, section, { ...sway({ stabilityIndex: 0.2 }), effectiveLength: 22.01 * 4.8 });
    expect(over.neglected).toBe(false);
  });
  it('sway parts 0 give the braced answer of the same kℓu: option (c), δ = 1.3686, Mc = 1.3686·2400 (the non-sway hand calculation)', () => {
    // ACI 318-19 6.6.4.6.1 with M1s = M2s = 0: M1 = M1ns, M2 = M2ns; the check along the length is 6.6.4.5 itself
    const braced = { effectiveLength: 240, M1: -1440, M2: 2400, Pu: 400, betaDns: 0.6, eiOption: 'c' as const };
    const r = slendernessCheck(basis, section, { ...braced, sway: { M2s: 0, M1s: 0, stabilityIndex: 0.1 } });
    expectClose(r.magnifiedMoment, 1.3686 * 2400, 1e-4);
    expect(r.ok).toBe(true);
  });
  it('ACI 318-14: the same figures under its own neglect clause 6.2.5(a) and 1.4 limit 6.2.6 (from memory)', () => {
    const b14 = resolveBasis('aci318-14', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
    const r = slendernessCheck(b14, section, sway({ stabilityIndex: 0.2 }));
    expect(r.method).toBe('ACI 318-14 6.6.4.6 moment magnification (sway)');
    expect(clause(r, 'limit')).toBe('6.2.5(a)');
    expect(clause(r, 'second-order-ratio')).toBe('6.2.6');
    expectClose(r.magnifiedMoment, 2121.754, 1e-5);
  });
  it('refuses a sway column with no storey data, naming the flag', () => {
    try {
      slendernessCheck(basis, section, { ...input, sway: { M2s: 1200, M1s: 1200 } });
      expect.unreachable();
    } catch (e) {
      expect(isPmError(e) && e.path).toBe('stabilityIndex');
    }
  });
});

describe('CSA A23.3-19 10.16 sway magnifier — hand calculation (from memory of the standard)', () => {
  // 400 × 400 mm, f′c = 35 MPa, fy = 400 MPa, 8 bars of 500 mm² at γ = 0.7 (the section of the non-sway hand
  // calculation in tests/design/slenderness-as-csa.test.ts), Pf = 2000 kN, βd = 0.5, kℓu (sway) = 6.0 m.
  // M02ns = 60, M01ns = 30 kN·m (same sign: single curvature), M02s = 80 kN·m, M01s not given: −80 (reverse curvature).
  //   no sway neglect limit (pmchart); Q = 0.1: δs = 1/0.9 = 1.11111 (10.16.3.2, ≤ 1.5)
  //   M2 = 60 + 1.11111·80 = 148.889; M1 (CSA sign) = 30 − 88.889 = −58.889 kN·m (10.16.2): M1/M2 = −0.395522
  //   along the length (10.16.4 by 10.15.3, kℓu as braced not given: 6.0 m):
  //     limit (25 + 3.95522)/√(2e6/(35·160,000)) = 48.451 < kℓu/r = 50: slender (10.15.2)
  //     Pc = 4,152,133 N (EI = 0.4·4500·√35·Ig/1.5); Cm = 0.6 + 0.4·(−0.395522) = 0.441791 (10.15.3.2)
  //     Pf/(0.75·Pc) = 0.642240; δ = 0.441791/0.357760 = 1.234882; Mc = 183.860 kN·m
  const basis = resolveBasis('csa-a23.3-19', { units: 'si', fc: 35, fy: 400, transverse: 'tied' });
  const shape: Shape = { kind: 'rectangle', b: 400, h: 400 };
  const section: SlendernessSection = { shape, bars: layoutBars(shape, { kind: 'four-faces', barsPerFace: 3 }, 8 * 500, { gamma: 0.7 }) };
  // internal sign: M1 = −M01 (fromSameSign); M1s = −M01s = +80e6
  const input = { effectiveLength: 6000, M1: -30e6, M2: 60e6, Pu: 2e6, betaDns: 0.5, sway: { M2s: 80e6, M1s: 80e6, stabilityIndex: 0.1 } };
  it('Q = 0.1: δs = 1.1111, M2 = 148.89 kN·m, along the length δ = 1.2349, Mc = 183.86 kN·m', () => {
    const r = slendernessCheck(basis, section, input);
    expect(r.method).toBe('CSA A23.3-19 10.16 moment magnifier (sway)');
    expectClose(step(r, 'delta-s') as number, 1 / 0.9, 1e-12);
    expect(clause(r, 'delta-s')).toBe('10.16.3.2');
    expectClose(step(r, 'M2-sway') as number, 148.8889e6, 1e-6);
    expectClose(step(r, 'along-limit') as number, 48.4514, 1e-5);
    expectClose(step(r, 'along-Pc') as number, 4_152_133, 1e-6);
    expectClose(step(r, 'along-Cm') as number, 0.441791, 1e-5);
    expectClose(step(r, 'along-delta') as number, 1.234882, 1e-5);
    expectClose(r.magnifiedMoment, 183.8602e6, 1e-5);
    expect(r.ok).toBe(true);
  });
  it('storey sums: ΣPf = 0.75·ΣPc is unstable (10.16.3.1); δs = 1.5 from Q is within, above is outside', () => {
    const u = slendernessCheck(basis, section, { ...input, sway: { M2s: 80e6, M1s: 80e6, storeyPu: 30e6, storeyPc: 40e6 } });
    expect(u.delta).toBe(Infinity);
    expect(u.limitClause).toBe('CSA A23.3-19 10.16.3.1 (ΣPf ≥ 0.75·ΣPc)');
    const edge = slendernessCheck(basis, section, { ...input, sway: { M2s: 80e6, M1s: 80e6, stabilityIndex: 1 / 3 } });
    expect(edge.ok).toBe(true);
    const beyond = slendernessCheck(basis, section, { ...input, sway: { M2s: 80e6, M1s: 80e6, stabilityIndex: 0.35 } });
    expect(beyond.ok).toBe(false);
    expect(beyond.limitClause).toBe('CSA A23.3-19 10.16.3.2 (δs from Q > 1.5)');
  });
  it('sway parts 0 give the braced answer of the same kℓu: δ = 2.2361, Mc = 223.61 kN·m (the non-sway hand calculation)', () => {
    const r = slendernessCheck(basis, section, { effectiveLength: 6000, M1: -50e6, M2: 100e6, Pu: 2e6, betaDns: 0.5, sway: { M2s: 0, M1s: 0, stabilityIndex: 0 } });
    expectClose(r.magnifiedMoment, 223.6137e6, 1e-6);
  });
});

describe('EN 1992-1-1 unbraced member: l0 by Eq. 5.16, rm = 1, nominal curvature — hand calculation', () => {
  // 400 × 400 mm, fck = 30 MPa (fcd = 20), fyk = 500 MPa (fyd = 434.78), 8 Ø20 at γ = 0.75 (the section of the
  // braced hand calculation in tests/design/slenderness.test.ts), NEd = 1500 kN, φef = 1.0.
  // Clear height ℓ = 4.0 m, k1 = 0.5, k2 = 1.0 (5.8.3.2(3), from memory):
  //   √(1 + 10·0.5·1/1.5) = √4.3333 = 2.081666; (1 + 0.5/1.5)(1 + 1/2) = 2.0; l0 = 4000·2.081666 = 8326.66 mm (Eq. 5.16)
  //   λ = 8326.66/115.470 = 72.111; λlim = 20·0.8333·1.29729·0.7/√0.46875 = 22.106 (rm = 1, C = 0.7, 5.8.3.1(1)): slender
  // First order: M02ns = 40, M02s = 50, M01ns = 20, M01s not given (−50): M02 = 90, M01 = −30 kN·m (reverse curvature)
  //   ei = θi·l0/2 = 8326.66/400 = 20.8167 mm (θi = 1/200, 5.2(7)); M0Ed = 90 + 1500·0.0208167 = 121.225 kN·m
  //   d = 329.904 mm; 1/r0 = 1.46434e-5; Kr = 0.926976; β = 0.35 + 0.15 − 72.111/150 = 0.019260; Kφ = 1.019260
  //   1/r = 1.383553e-5 /mm; c = 10 (the moment is not constant); e2 = 1.383553e-5·8326.66²/10 = 95.926 mm
  //   M2 = 1500·0.095926 = 143.890 kN·m; MEd = 121.225 + 143.890 = 265.115 kN·m
  const basis = resolveBasis('en1992-1-1', { units: 'si', fc: 30, fy: 500, transverse: 'tied' });
  const shape: Shape = { kind: 'rectangle', b: 400, h: 400 };
  const section: SlendernessSection = { shape, bars: layoutBars(shape, { kind: 'four-faces', barsPerFace: 3 }, 8 * 314.159, { gamma: 0.75 }) };
  it('Eq. 5.16 factor: 2.081666 for k1 = 0.5, k2 = 1.0; 2.0 from the second term for k1 = k2 = 1 (√6 = 2.449 is larger)', () => {
    expectClose(enUnbracedLengthFactor(0.5, 1), 2.081666, 1e-6);
    expectClose(enUnbracedLengthFactor(1, 1), Math.sqrt(6), 1e-12);
  });
  it('l0 = 8326.66 mm, λ = 72.11 > λlim = 22.11, e2 = 95.93 mm, MEd = 265.11 kN·m', () => {
    const r = slendernessCheck(basis, section, { effectiveLength: 4000, M1: -20e6, M2: 40e6, Pu: 1.5e6, creepRatio: 1, sway: { M2s: 50e6, M1s: 50e6, k1: 0.5, k2: 1 } });
    expect(r.method).toBe('EN 1992-1-1 5.8.8 nominal curvature (unbraced)');
    expectClose(step(r, 'l0') as number, 8326.664, 1e-6);
    expect(clause(r, 'l0')).toBe('5.8.3.2(3)');
    expectClose(step(r, 'n') as number, 0.46875, 1e-9);
    expectClose(step(r, 'end-moment-ratio') as number, 1, 1e-12);
    expectClose(step(r, 'limit') as number, 22.1061, 1e-5);
    expectClose(step(r, 'M02-total') as number, 90e6, 1e-12);
    expectClose(step(r, 'ei') as number, 20.81666, 1e-6);
    expectClose(step(r, 'M0Ed') as number, 121.22499, 1e-6);
    expectClose(step(r, 'Kphi') as number, 1.0192598, 1e-6);
    expect(step(r, 'c')).toBe(10);
    expectClose(step(r, 'e2') as number, 95.92637, 1e-5);
    expectClose(r.magnifiedMoment, 265.11455e6, 1e-5);
  });
  it('sway parts 0 with equal end moments in single curvature give the braced answer of the same l0 (rm = 1 both ways, M0e = M02)', () => {
    const braced = { effectiveLength: 6000, M1: -60e6, M2: 60e6, Pu: 1.5e6, creepRatio: 1 };
    const b = slendernessCheck(basis, section, braced);
    const s = slendernessCheck(basis, section, { ...braced, sway: { M2s: 0, M1s: 0 } });
    expectClose(s.magnifiedMoment, b.magnifiedMoment, 1e-12);
  });
});

describe('AS 3600-2018 10.4.3 unbraced column: δ = max(δb, δs) — hand calculation (from memory of the standard)', () => {
  // 400 × 600 mm, f′c = 40 MPa, fsy = 500 MPa, As = 4800 mm² on two faces at γ = 0.8, N* = 3000 kN, Le = 8.0 m,
  // M2* = 300, M1* = −150 kN·m, βd = 0.5 (the braced hand calculation in tests/design/slenderness-as-csa.test.ts):
  //   Le/r = 8000/180 = 44.44 > 22: slender (10.3.1(a)); δb with Le as braced 8.0 m = 1.456114 (10.4.2)
  //   ΣN* = 30,000 kN, ΣNc = 60,000 kN: δs = 1/(1 − 0.5) = 2.0 (10.4.3); δ = max(1.456114, 2.0) = 2.0; M* = 600 kN·m
  //   ΣNc = 120,000 kN: δs = 1/(1 − 0.25) = 1.3333 < δb: δ = 1.456114, M* = 436.834 kN·m (the braced answer)
  const basis: Basis = resolveBasis('as3600-2018', { units: 'si', fc: 40, fy: 500, transverse: 'tied' });
  const shape: Shape = { kind: 'rectangle', b: 400, h: 600 };
  const section: SlendernessSection = { shape, bars: layoutBars(shape, { kind: 'two-faces', barsPerFace: 2 }, 4800, { gamma: 0.8 }) };
  const input = { effectiveLength: 8000, M1: -150e6, M2: 300e6, Pu: 3e6, betaDns: 0.5 };
  it('δs = 2.0 governs: M* = 600 kN·m', () => {
    const r = slendernessCheck(basis, section, { ...input, sway: { M2s: 0, M1s: 0, storeyPu: 30e6, storeyPc: 60e6 } });
    expect(r.method).toBe('AS 3600-2018 10.4.3 moment magnifier (unbraced)');
    expectClose(step(r, 'braced-delta') as number, 1.456114, 1e-5);
    expectClose(step(r, 'delta-s') as number, 2, 1e-12);
    expect(clause(r, 'delta')).toBe('10.4.3');
    expectClose(r.magnifiedMoment, 600e6, 1e-12);
  });
  it('δb governs a stiff storey: M* = 436.83 kN·m, the braced answer', () => {
    const r = slendernessCheck(basis, section, { ...input, sway: { M2s: 0, M1s: 0, storeyPu: 30e6, storeyPc: 120e6 } });
    expectClose(r.magnifiedMoment, 436.8343e6, 1e-5);
  });
  it('ΣN* = ΣNc is unstable; Le/r = 22 is short (10.3.1(a))', () => {
    const u = slendernessCheck(basis, section, { ...input, sway: { M2s: 0, M1s: 0, storeyPu: 60e6, storeyPc: 60e6 } });
    expect(u.delta).toBe(Infinity);
    expect(u.limitClause).toBe('AS 3600-2018 10.4.3 (ΣN* ≥ ΣNc)');
    const s = slendernessCheck(basis, section, { ...input, effectiveLength: 22 * 180, sway: { M2s: 0, M1s: 0, storeyPu: 30e6, storeyPc: 60e6 } });
    expect(s.neglected).toBe(true);
    expectClose(s.magnifiedMoment, 300e6, 1e-12);
  });
  it('refuses sway parts and the stability index: AS 3600 has no split (from memory)', () => {
    expect(() => slendernessCheck(basis, section, { ...input, sway: { M2s: 10e6, M1s: 10e6, storeyPu: 30e6, storeyPc: 60e6 } })).toThrow(/does not split/);
    expect(() => slendernessCheck(basis, section, { ...input, sway: { M2s: 0, M1s: 0, stabilityIndex: 0.1 } })).toThrow(/does not apply/);
  });
});

describe('a basis whose rulebook has no sway method', () => {
  it('gives a typed not-covered finding (outside the scope), never a braced answer', () => {
    const aci = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
    const { sway: _drop, ...method } = aci.slenderness!;
    const bare: Basis = { ...aci, slenderness: method };
    const shape: Shape = { kind: 'rectangle', b: 16, h: 16 };
    const r = slendernessCheck(bare, { shape, bars: [] }, { effectiveLength: 240, M1: -300, M2: 600, Pu: 400, betaDns: 0.6, sway: { M2s: 1200, M1s: 1200, stabilityIndex: 0.2 } });
    expect(r.ok).toBe(false);
    expect(Number.isFinite(r.delta)).toBe(true);
    expect(r.limitClause).toMatch(/no sway \(unbraced\) method/);
    expect(r.steps[0]!.key).toBe('sway-not-covered');
  });
});
