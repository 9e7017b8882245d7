/**
 * The end-moment defaults and scope rules around each slenderness method (issue 19), each a hand
 * calculation with its clause beside the check. These cases were unconservative before the fix:
 *   - ACI 318-19: M2 = 0 took M1/M2 = 0 (limit 34, Cm 0.6) instead of the single-curvature default −1;
 *   - AS 3600-2018: M1* ÷ M2* was not taken as −1 when |M2*| ≤ 0.05·D·N*, and Le/r > 120 was accepted;
 *   - EN 1992-1-1: c = 10 was used for a constant first-order moment, where 5.8.8.2(4) takes 8.
 */
import { describe, expect, it } from 'vitest';
import { prepareBiaxial } from '../../src/analysis/biaxial.js';
import { runCheck } from '../../src/cli/check.js';
import { DESIGN_CODE_LIST, resolveBasis } from '../../src/codes/registry.js';
import { checkBiaxial } from '../../src/design/biaxial.js';
import { magnifyLoad } from '../../src/design/column-effects.js';
import { slendernessCheck, type SlendernessSection } from '../../src/design/slenderness.js';
import { layoutBars } from '../../src/section/arrangements.js';
import type { Shape } from '../../src/section/types.js';
import { expectClose } from '../helpers/tolerance.js';

type Steps = { steps: { label: string; value: unknown; key?: string }[] };
const step = (r: Steps, start: string) => {
  const s = r.steps.find((x) => x.label.startsWith(start));
  if (!s) throw new Error(`no step ${start}`);
  return s.value as number;
};

describe('ACI 318-19 6.2.5.1 / 6.6.4.5.4: a zero moment is single curvature (U1)', () => {
  // 16 × 16 in tied column, f′c = 4 ksi, fy = 60 ksi, 8 #8 (6.32 in²) at γ = 11/16; kℓu = 144 in, Pu = 400 kips,
  // Mu = 0, βdns = 0.6. README default: M1 = −M2 (single curvature), so M1/M2 = −1 (6.2.5.1 sign convention).
  //   r = 0.30·16 = 4.8 in (6.2.5.2); kℓu/r = 144/4.8 = 30 > 34 + 12·(−1) = 22 (6.2.5.1(b)): slender
  //   (the old M1/M2 = 0 gave a limit of 34 ≥ 30: "short", with no M2,min at all)
  //   M2,min = 400·(0.6 + 0.03·16) = 432 kip·in (6.6.4.5.4), so Cm = 1.0 (6.6.4.5.4)
  //   (EI)eff = 0.4·3605.00·5461.33/1.6 = 4,922,022 kip·in² (6.6.4.4.4(a)); Pc = π²·4,922,022/144² = 2342.709 kips
  //   δ = 1.0/(1 − 400/(0.75·2342.709)) = 1.294761 (6.6.4.5.2); Mc = 1.294761·432 = 559.337 kip·in
  const basis = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
  const shape: Shape = { kind: 'rectangle', b: 16, h: 16 };
  const section: SlendernessSection = { shape, bars: layoutBars(shape, { kind: 'four-faces', barsPerFace: 3 }, 6.32, { gamma: 11 / 16 }) };
  it('M1 = M2 = 0: limit 22, slender, Cm = 1.0, δ = 1.2948, Mc = 559.34 kip·in', () => {
    const r = slendernessCheck(basis, section, { effectiveLength: 144, M1: 0, M2: 0, Pu: 400, betaDns: 0.6 });
    expectClose(step(r, 'M1/M2'), -1, 1e-12);
    expectClose(step(r, 'limit'), 22, 1e-12);
    expect(r.neglected).toBe(false);
    expectClose(step(r, 'M2,min'), 432, 1e-12);
    expectClose(step(r, 'Cm'), 1, 1e-12);
    expectClose(r.delta, 1.294761, 1e-6);
    expectClose(r.magnifiedMoment, 559.3368, 1e-6);
  });
  it('through magnifyLoad with Mux = 0 (the --mu 0 path)', () => {
    const m = magnifyLoad(basis, shape, section.bars, { Pu: 400, Mux: 0, Muy: 0 }, { x: { effectiveLength: 144, betaDns: 0.6 } });
    expect(m.x.neglected).toBe(false);
    expectClose(m.x.magnifiedMoment, 559.3368, 1e-6);
  });
  it('the CLI with --mu 0 checks the magnified M2,min, not a short column', () => {
    const o = { code: 'aci318-19', fc: '4', fy: '60', b: '16', h: '16', arrangement: 'four-faces', barsPerFace: '3', gamma: String(11 / 16), rho: String(6.32 / 256), pu: '400', mu: '0', klu: '144in', betaDns: '0.6', proposals: '0', json: true };
    const out = JSON.parse(runCheck(o));
    const s = JSON.stringify(out.results[0]);
    expect(s).toMatch(/1\.29476/);
  });
});

describe('AS 3600-2018 10.3.1 / 10.4.2: M1*/M2* = −1 when |M2*| ≤ 0.05·D·N* (from memory)', () => {
  // 400 × 600 mm (D = 600), f′c = 40 MPa, fsy = 500 MPa, As = 4800 mm² on two faces at γ = 0.8, N* = 3000 kN,
  // Le = 8.0 m, βd = 0.5 (the section of tests/design/slenderness-as-csa.test.ts):
  //   0.05·D·N* = 0.05·600·3e6 = 90 kN·m (10.1.2); Le/r = 8000/180 = 44.44 (10.5.2)
  //   αc = 1.023576 (10.3.1); Nc = 6,657,899 N (10.4.4)
  // (a) M2* = 60 ≤ 90 kN·m with M1* = +60 (double curvature as given): M1*/M2* is taken as −1 (10.3.1), so
  //     limit = max(25, αc·(38 − 40/15)·0) = 25 < 44.44: slender (the old +1 gave 72.33: "short")
  //     km = 0.6 − 0.4·(−1) = 1.0 (10.4.2); δb = 1.0/(1 − 3e6/6,657,899) = 1.820143; M* = 1.820143·90 = 163.813 kN·m
  // (b) M2* = 60, M1* = 0: old km = 0.6, δb = 1.092086 (M* 40 % low); now km = 1.0, δb = 1.820143.
  const basis = resolveBasis('as3600-2018', { units: 'si', fc: 40, fy: 500, transverse: 'tied' });
  const shape: Shape = { kind: 'rectangle', b: 400, h: 600 };
  const bars = layoutBars(shape, { kind: 'two-faces', barsPerFace: 2 }, 4800, { gamma: 0.8 });
  for (const M1 of [60e6, 0]) {
    it(`M2* = 60 kN·m ≤ 0.05·D·N*, M1* = ${M1 / 1e6} kN·m: M1*/M2* = −1, km = 1.0, δb = 1.8201, M* = 163.81 kN·m`, () => {
      const r = slendernessCheck(basis, { shape, bars }, { effectiveLength: 8000, M1, M2: 60e6, Pu: 3e6, betaDns: 0.5 });
      expectClose(step(r, 'M1*/M2*'), -1, 1e-12);
      expectClose(step(r, 'limit'), 25, 1e-12);
      expect(r.neglected).toBe(false);
      expectClose(step(r, 'km'), 1, 1e-12);
      expectClose(r.delta, 1.820143, 1e-6);
      expectClose(r.magnifiedMoment, 163.8129e6, 1e-6);
    });
  }
  it('every km step label starts with "km"', () => {
    for (const transverseLoads of [false, true]) {
      const r = slendernessCheck(basis, { shape, bars }, { effectiveLength: 8000, M1: -150e6, M2: 300e6, Pu: 3e6, betaDns: 0.5, transverseLoads });
      const km = r.steps.filter((s) => /\bkm\b/.test(s.label.split('=')[0] ?? ''));
      expect(km.length).toBe(1);
      expect(km[0]!.label.startsWith('km')).toBe(true);
    }
  });
  it('Le/r = 121 > 120 is outside the moment-magnifier method (10.5.1, from memory): not ok, with the clause', () => {
    // Le = 121·180 = 21,780 mm; N* = 500 kN keeps N* < Nc, so the scope limit (not stability) is what fails
    const r = slendernessCheck(basis, { shape, bars }, { effectiveLength: 21_780, M1: -100e6, M2: 200e6, Pu: 5e5, betaDns: 0.5 });
    expectClose(step(r, 'Le/r'), 121, 1e-12);
    expect(r.ok).toBe(false);
    expect(Number.isFinite(r.delta)).toBe(true);
    expect(r.limitClause).toMatch(/10\.5\.1/);
  });
  it('Le/r = 120 is within the method', () => {
    const r = slendernessCheck(basis, { shape, bars }, { effectiveLength: 21_600, M1: -100e6, M2: 200e6, Pu: 5e5, betaDns: 0.5 });
    expect(r.ok).toBe(true);
  });
});

describe('AS 3600-2018 10.6.4: load-contour exponent αn = 0.7 + 1.7·N*/(0.6·Nuo), 1 ≤ αn ≤ 2 (from memory)', () => {
  // Same 400 × 600 section: Nuo = 0.85·40·(240,000 − 4800) + 500·4800 = 10,396,800 N (10.6.2.2); 0.6·Nuo = 6,238,080 N
  //   N* = 2000 kN: 2e6/6,238,080 = 0.320611 → αn = 0.7 + 1.7·0.320611 = 1.245039 (was 1.5: the figure 40 % off)
  //   N* = 5000 kN: 0.801529 → 2.0626 → αn = 2 (upper bound); N* = 500 kN: 0.080153 → 0.836 → αn = 1 (lower bound)
  const basis = resolveBasis('as3600-2018', { units: 'si', fc: 40, fy: 500, transverse: 'tied' });
  const shape: Shape = { kind: 'rectangle', b: 400, h: 600 };
  const bars = layoutBars(shape, { kind: 'two-faces', barsPerFace: 2 }, 4800, { gamma: 0.8 });
  const sec = prepareBiaxial(basis, shape, bars);
  for (const [N, alpha] of [[2e6, 1.245039], [5e6, 2], [5e5, 1]] as const) {
    it(`N* = ${N / 1e3} kN: αn = ${alpha}`, () => {
      const r = checkBiaxial(sec, { Pu: N, Mux: 100e6, Muy: 50e6 });
      expectClose(r.loadContour.alpha, alpha, 1e-6);
      expect(r.loadContour.alphaSource).toMatch(/10\.6\.4/);
    });
  }
});

describe('EN 1992-1-1 5.8.8.2(4): c = 8 for a constant first-order moment, else 10', () => {
  // Published text (5.8.8.2(3)–(4)): "c is a factor depending on the curvature distribution … For constant cross
  // section, c = 10 (≈ π²) is normally used. If the first order moment is constant, a lower value should be
  // considered (8 is a lower limit, corresponding to constant total moment)."
  // C30/37, B500: fcd = 20, fyd = 434.78 MPa; 400 × 400 mm, 8 Ø20 at γ = 0.75; l0 = 6 m, NEd = 1500 kN, φef = 1.0
  // (the hand calculation of tests/design/slenderness.test.ts): 1/r = 1.56589e-5 /mm.
  //   M01 = M02 = 60 kN·m (rm = 1): λlim = 20·(1/1.2)·1.297288·0.7/√0.46875 = 22.106 < λ = 51.96: slender
  //   M0e = 60 kN·m, M0Ed = 60 + 1500·0.015 = 82.5 kN·m (Eq. 5.32)
  //   e2 = 1.56589e-5·6000²/8 = 70.465 mm; M2 = 1500·0.070465 = 105.698 kN·m; MEd = 188.198 kN·m
  //   (c = 10 gave e2 = 56.372 mm and MEd = 167.058 kN·m: 11 % low)
  const basis = resolveBasis('en1992-1-1', { units: 'si', fc: 30, fy: 500, transverse: 'tied' });
  const shape: Shape = { kind: 'rectangle', b: 400, h: 400 };
  const section: SlendernessSection = { shape, bars: layoutBars(shape, { kind: 'four-faces', barsPerFace: 3 }, 8 * 314.159, { gamma: 0.75 }) };
  it('M01 = M02 (constant first-order moment): c = 8, e2 = 70.47 mm, MEd = 188.20 kN·m', () => {
    const r = slendernessCheck(basis, section, { effectiveLength: 6000, M1: -60e6, M2: 60e6, Pu: 1.5e6, creepRatio: 1 });
    expectClose(step(r, 'λlim'), 22.1061, 1e-5);
    const e2 = r.steps.find((s) => s.label.startsWith('e2'))!;
    expect(e2.label).toContain('c = 8 (5.8.8.2(4), constant first-order moment)');
    expectClose(e2.value as number, 70.4652, 1e-5);
    expectClose(r.magnifiedMoment, 188.1977e6, 1e-5);
    expect(r.steps.some((s) => s.label.startsWith('1/r = Kr·Kφ·1/r0'))).toBe(true);
  });
  it('no end moments given (magnifyLoad default M01 = M02): c = 8', () => {
    const m = magnifyLoad(basis, shape, section.bars, { Pu: 1.5e6, Mux: 60e6, Muy: 0 }, { x: { effectiveLength: 6000, creepRatio: 1 } });
    expect(m.x.steps.find((s) => s.label.startsWith('e2'))!.label).toContain('c = 8');
    expectClose(m.x.magnifiedMoment, 188.1977e6, 1e-5);
  });
  it('M01 = 30, M02 = 60 kN·m (rm = 0.5, not constant): c = 10, e2 = 56.37 mm', () => {
    const r = slendernessCheck(basis, section, { effectiveLength: 6000, M1: -30e6, M2: 60e6, Pu: 1.5e6, creepRatio: 1 });
    const e2 = r.steps.find((s) => s.label.startsWith('e2'))!;
    expect(e2.label).toContain('c = 10');
    expectClose(e2.value as number, 56.3722, 1e-5);
  });
});

describe('transverse loads between the ends: the single-curvature end-moment ratio in every basis (conservative)', () => {
  // With loads between the ends the largest first-order moment is not at an end, so the end-moment ratio says
  // nothing about curvature. EN 1992-1-1 5.8.3.1(1) (from memory of the published text): rm = 1 (C = 0.7) for braced
  // members whose first-order moments arise predominantly from imperfections or transverse loading; pmchart takes the
  // same single-curvature ratio in every basis (M1/M2 = −1; +1 in the same-sign convention), and M0e = M02 for EN.
  // Given here: end moments in double curvature, M1 = +M2/2, which without the rule would raise the neglect limit.
  for (const code of DESIGN_CODE_LIST) {
    it(`${code.id}: the end-moment-ratio step is the single-curvature value`, () => {
      const units = code.unitSystems[0]!;
      const basis = resolveBasis(code.id, units === 'us' ? { units, fc: 4, fy: 60, transverse: 'tied' } : { units, fc: 35, fy: 400, transverse: 'tied' });
      const sq = basis.units === 'us' ? 16 : 400;
      const shape: Shape = { kind: 'rectangle', b: sq, h: sq };
      const bars = layoutBars(shape, { kind: 'four-faces', barsPerFace: 3 }, 0.02 * sq * sq, { gamma: 0.7 });
      const M2 = basis.units === 'us' ? 2400 : 200e6;
      const P = basis.units === 'us' ? 400 : 2e6;
      const r = slendernessCheck(basis, { shape, bars }, { effectiveLength: 15 * sq, M1: M2 / 2, M2, Pu: P, betaDns: 0.5, transverseLoads: true, creepRatio: 1 });
      const single = basis.slenderness!.convention.singleCurvature === 'same-sign' ? 1 : -1;
      expectClose(r.steps.find((s) => s.key === 'end-moment-ratio')!.value as number, single, 1e-12);
    });
  }
  it('en1992-1-1: M0e = M02 with transverse loads (the given M01 does not lower it)', () => {
    const basis = resolveBasis('en1992-1-1', { units: 'si', fc: 30, fy: 500, transverse: 'tied' });
    const shape: Shape = { kind: 'rectangle', b: 400, h: 400 };
    const bars = layoutBars(shape, { kind: 'four-faces', barsPerFace: 3 }, 8 * 314.159, { gamma: 0.75 });
    const r = slendernessCheck(basis, { shape, bars }, { effectiveLength: 6000, M1: 30e6, M2: 60e6, Pu: 1.5e6, creepRatio: 1, transverseLoads: true });
    expectClose(r.steps.find((s) => s.key === 'M0e')!.value as number, 60, 1e-12);
  });
});
