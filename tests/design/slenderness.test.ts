/**
 * Slender columns (src/design/slenderness.ts), hand-calculated examples with each formula cited by clause.
 */
import { describe, expect, it } from 'vitest';
import { ACI_318_19 } from '../../src/codes/aci318.js';
import { EN_1992_SLENDERNESS } from '../../src/codes/slenderness-en1992.js';
import type { Basis } from '../../src/codes/types.js';
import { isPmError } from '../../src/errors.js';
import { elasticPlasticSteel } from '../../src/materials/elastic-plastic-steel.js';
import { aboutYAxis, aciEc, slendernessCheck, type SlendernessSection } from '../../src/design/slenderness.js';
import { layoutBars } from '../../src/section/arrangements.js';
import type { Shape } from '../../src/section/types.js';
import { expectClose } from '../helpers/tolerance.js';

const basis = ACI_318_19.resolve({ units: 'us', fc: 4, fy: 60, transverse: 'tied' });
const step = (r: { steps: { label: string; value: unknown }[] }, start: string) => r.steps.find((s) => s.label.startsWith(start))!.value as number;

describe('ACI 318-19 6.6.4 non-sway moment magnification — hand calculation', () => {
  // 16 × 16 in tied column, f′c = 4 ksi, fy = 60 ksi, 8 #8 (0.79 in²) on four faces, centres 2.5 in from
  // the faces: 3 bars at y = +5.5, 2 at y = 0, 3 at y = −5.5 in. kℓu = 240 in, Pu = 400 kips,
  // M2 = 2400 in·kips, M1 = −1440 in·kips (single curvature, M1/M2 = −0.6), βdns = 0.6.
  //   r = 0.30·16 = 4.8 in (6.2.5.2); kℓu/r = 50 > 34 + 12(−0.6) = 26.8 (6.2.5.1(b)): slender.
  //   Ec = 57,000·√4000 = 3,604,997 psi = 3605.00 ksi (19.2.2.1(b)); Ig = 16⁴/12 = 5461.33 in⁴.
  //   Cm = 0.6 − 0.4(−0.6) = 0.84 (6.6.4.5.3(a)); M2,min = 400(0.6 + 0.03·16) = 432 < 2400 (6.6.4.5.4).
  //   (a) (EI)eff = 0.4·3605.00·5461.33/1.6 = 4,922,022 kip·in²              (6.6.4.4.4(a))
  //       Pc = π²·4,922,022/240² = 843.38 kips (6.6.4.4.2); δ = 0.84/(1 − 400/(0.75·843.38)) = 2.2850
  //   (b) Ise = 6·0.79·5.5² = 143.385 in⁴; (EI)eff = (0.2·3605.00·5461.33 + 29,000·143.385)/1.6
  //       = 5,059,864 kip·in² (6.6.4.4.4(b)); Pc = 866.99 kips; δ = 2.1827
  //   (c) Ast/Ag = 6.32/256 = 0.0246875; Po = 0.85·4·(256 − 6.32) + 60·6.32 = 1228.112 kips (22.4.2.2);
  //       I = (0.80 + 25·0.0246875)(1 − 2400/(400·16) − 0.5·400/1228.112)·Ig = 0.654951·Ig = 3576.9 in⁴
  //       (Table 6.6.3.1.1(b), within 0.35Ig–0.875Ig); (EI)eff = 3605.00·3576.9/1.6 = 8,059,207 kip·in²
  //       (6.6.4.4.4(c)); Pc = 1380.92 kips; δ = 0.84/(1 − 400/1035.69) = 1.3686
  //   Mc = δ·M2 (6.6.4.5.1); (a) and (b) exceed 1.4 × the first-order moment (6.2.5.3), (c) does not.
  const shape: Shape = { kind: 'rectangle', b: 16, h: 16 };
  const section: SlendernessSection = { shape, bars: layoutBars(shape, { kind: 'four-faces', barsPerFace: 3 }, 6.32, { gamma: 11 / 16 }) };
  const input = { effectiveLength: 240, M1: -1440, M2: 2400, Pu: 400, betaDns: 0.6 };
  const cases = [
    ['a', 4_922_022, 843.38, 2.2850, false],
    ['b', 5_059_864, 866.99, 2.1827, false],
    ['c', 8_059_207, 1380.92, 1.3686, true],
  ] as const;
  for (const [option, EI, Pc, delta, within] of cases) {
    it(`option (${option}): (EI)eff = ${EI}, Pc = ${Pc} kips, δ = ${delta}, Mc = δ·2400`, () => {
      const r = slendernessCheck(basis, section, { ...input, eiOption: option });
      expect(r.neglected).toBe(false);
      expectClose(step(r, 'r = 0.30·h'), 4.8, 1e-12);
      expectClose(step(r, 'kℓu/r'), 50, 1e-12);
      expectClose(step(r, 'limit 34 + 12'), 26.8, 1e-12);
      expectClose(step(r, 'Ec ='), 3605.0, 1e-5);
      expectClose(step(r, 'Cm ='), 0.84, 1e-12);
      expectClose(step(r, 'M2,min'), 432, 1e-12);
      expectClose(step(r, '(EI)eff'), EI, 1e-6);
      expectClose(step(r, 'Pc ='), Pc, 1e-5);
      expectClose(r.delta, delta, 1e-4);
      expectClose(r.magnifiedMoment, delta * 2400, 1e-4);
      expect(r.ok).toBe(within);
    });
  }
  it('option (c) bounds I at 0.875·Ig when the formula gives more (Table 6.6.3.1.1(b))', () => {
    // M2 = 1200: 1.4171875·(1 − 0.1875 − 0.162852) = 0.92067 > 0.875
    const r = slendernessCheck(basis, section, { ...input, M1: -720, M2: 1200, eiOption: 'c' });
    expectClose(step(r, 'I within'), 0.875 * 5461.3333, 1e-6);
  });
  it('slenderness neglected: kℓu = 100 in → kℓu/r = 20.8 ≤ 26.8; δ = 1 and Mc = M2', () => {
    const r = slendernessCheck(basis, section, { ...input, effectiveLength: 100 });
    expect(r.neglected).toBe(true);
    expect(r.delta).toBe(1);
    expect(r.magnifiedMoment).toBe(2400);
  });
  it('double curvature raises the limit and caps it at 40: M1/M2 = +0.75 → min(43, 40)', () => {
    const r = slendernessCheck(basis, section, { ...input, M1: 1800, effectiveLength: 190 });
    expectClose(step(r, 'limit 34 + 12'), 40, 1e-12);
    expect(r.neglected).toBe(true); // 190/4.8 = 39.6
  });
  it('the minimum moment governs a small M2 and sets Cm = 1.0 (6.6.4.5.4)', () => {
    const r = slendernessCheck(basis, section, { ...input, M1: -100, M2: 200 });
    expectClose(r.firstOrderMoment, 432, 1e-12);
    expectClose(step(r, 'Cm ='), 1, 1e-12);
  });
  it('Pu ≥ 0.75·Pc is unstable: not ok, δ infinite', () => {
    const r = slendernessCheck(basis, section, { ...input, Pu: 700, eiOption: 'a' });
    expect(r.ok).toBe(false);
    expect(r.delta).toBe(Infinity);
    expect(r.warnings[0]).toMatch(/unstable/);
  });
  it('SI: M2,min = Pu(15 + 0.03h) mm and Ec = 4700√f′c MPa (19.2.2.1(b))', () => {
    const si = ACI_318_19.resolve({ units: 'si', fc: 28, fy: 420, transverse: 'tied' });
    expectClose(aciEc(28, 'si'), 24870.06, 1e-6);
    const sh: Shape = { kind: 'rectangle', b: 400, h: 400 };
    const r = slendernessCheck(si, { shape: sh, bars: layoutBars(sh, { kind: 'four-faces', barsPerFace: 3 }, 4000, { gamma: 0.7 }) }, { effectiveLength: 6000, M1: -50e6, M2: 60e6, Pu: 2e6 });
    expectClose(step(r, 'M2,min'), 2e6 * (15 + 12), 1e-12);
  });
  it('bad input is a one-line PmError naming the flag', () => {
    try {
      slendernessCheck(basis, section, { ...input, betaDns: 1.5 });
      expect.unreachable();
    } catch (e) {
      expect(isPmError(e) && e.path).toBe('betaDns'); // a field key; the CLI names --beta-dns
    }
    expect(() => slendernessCheck(basis, section, { ...input, M1: -3000 })).toThrow(/^m1: /);
  });
  it('aboutYAxis swaps b and h and the bar coordinates', () => {
    const s = aboutYAxis({ shape: { kind: 'rectangle', b: 12, h: 20 }, bars: [{ x: 3, y: 7, area: 1 }] });
    expect(s.shape).toEqual({ kind: 'rectangle', b: 20, h: 12 });
    expect(s.bars[0]).toEqual({ x: 7, y: 3, area: 1 });
  });
});

describe('EN 1992-1-1 5.8.8 nominal curvature — hand calculation', () => {
  // A basis declaring the nominal-curvature method, with EN design values: fck = 30 MPa, fcd = 20 MPa
  // (αcc = 1.0, γc = 1.5), fyd = 500/1.15 = 434.78 MPa, Es = 200 GPa (test double of the Basis interface).
  const aci = ACI_318_19.resolve({ units: 'si', fc: 30, fy: 500, transverse: 'tied' });
  const en: Basis = {
    ...aci,
    fc: 30,
    normalisingStress: 20,
    Es: 200_000,
    design: { ...aci.design, steel: elasticPlasticSteel(500 / 1.15, 200_000) },
    slenderness: EN_1992_SLENDERNESS,
  };
  // 400 × 400 mm, 8 Ø20 (314.159 mm² each) on four faces, 3 bars at y = ±150 and 2 at y = 0; l0 = 6 m,
  // NEd = 1500 kN, M02 = 60 kN·m, M01 = 30 kN·m same side (single curvature; M1 = −30 in pmchart's sign), φef = 1.0.
  //   i = 400/√12 = 115.47 mm, λ = 6000/115.47 = 51.96 (5.8.3.2)
  //   n = 1.5e6/(160,000·20) = 0.46875; ω = 2513.27·434.78/(160,000·20) = 0.34148
  //   A = 1/1.2 = 0.8333, B = √(1.68296) = 1.29729, C = 1.7 − 0.5 = 1.2; λlim = 20·A·B·C/√n = 37.896 (Eq. 5.13N)
  //   λ > λlim: second-order effects count.
  //   ei = 6000/400 = 15 mm (5.2(7)); e0 = max(13.3, 20) = 20 mm (6.1(4))
  //   M0e = 0.6·60 + 0.4·30 = 48 kN·m (Eq. 5.32); M0Ed = 48 + 1500·0.015 = 70.5 kN·m
  //   is = √(6·314.159·150²/2513.27) = 129.904 mm; d = 200 + 129.904 = 329.904 mm (5.8.8.3(2))
  //   1/r0 = (434.78/200,000)/(0.45·329.904) = 1.46434e-5 /mm
  //   Kr = (1.34148 − 0.46875)/(1.34148 − 0.4) = 0.92698 (Eq. 5.36)
  //   β = 0.35 + 30/200 − 51.96/150 = 0.15359; Kφ = 1.15359 (Eq. 5.37)
  //   1/r = 0.92698·1.15359·1.46434e-5 = 1.56589e-5 /mm (Eq. 5.34); e2 = 1.56589e-5·6000²/10 = 56.372 mm (Eq. 5.33)
  //   M2 = 1500·0.056372 = 84.558 kN·m; MEd = 70.5 + 84.558 = 155.058 kN·m (Eq. 5.31)
  const shape: Shape = { kind: 'rectangle', b: 400, h: 400 };
  const section: SlendernessSection = { shape, bars: layoutBars(shape, { kind: 'four-faces', barsPerFace: 3 }, 8 * 314.159, { gamma: 0.75 }) };
  it('λ = 51.96 > λlim = 37.90; e2 = 56.37 mm; MEd = 155.06 kN·m', () => {
    const r = slendernessCheck(en, section, { effectiveLength: 6000, M1: -30e6, M2: 60e6, Pu: 1.5e6, creepRatio: 1 });
    expect(r.neglected).toBe(false);
    expectClose(step(r, 'λ = l0/i'), 51.9615, 1e-5);
    expectClose(step(r, 'λlim'), 37.8962, 1e-5);
    expectClose(step(r, 'M0Ed'), 70.5, 1e-9);
    expectClose(step(r, 'd = h/2'), 329.904, 1e-5);
    expectClose(step(r, 'Kr'), 0.926976, 1e-5);
    expectClose(step(r, 'Kφ'), 1.15359, 1e-5);
    expectClose(step(r, 'e2'), 56.3722, 1e-5);
    expectClose(r.magnifiedMoment, 155.0583e6, 1e-5);
    expectClose(r.delta, 155.0583 / 70.5, 1e-5);
  });
  it('a short column (l0 = 3 m, λ = 25.98 < λlim) is not magnified: the end moment M02 + NEd·ei', () => {
    const r = slendernessCheck(en, section, { effectiveLength: 3000, M1: -30e6, M2: 60e6, Pu: 1.5e6, creepRatio: 1 });
    expect(r.neglected).toBe(true);
    expectClose(r.magnifiedMoment, 60e6 + 1.5e6 * 7.5, 1e-12);
  });
  it('a basis without a declared method refuses with a one-line error', () => {
    const { slenderness: _dropped, ...rest } = basis;
    const bare: Basis = rest;
    expect(() => slendernessCheck(bare, { shape: { kind: 'rectangle', b: 16, h: 16 }, bars: [] }, { effectiveLength: 200, M1: 0, M2: 100, Pu: 100 })).toThrow(/declares no slenderness method/);
  });
});
