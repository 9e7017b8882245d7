/**
 * Slender braced columns for AS 3600-2018 (10.3, 10.4) and CSA A23.3-19 (10.15), hand calculations.
 * Both standards' formulas are from memory (see src/design/slenderness.ts); each step names its clause.
 */
import { describe, expect, it } from 'vitest';
import { runCheck } from '../../src/cli/check.js';
import { resolveBasis } from '../../src/codes/registry.js';
import { magnifyLoad } from '../../src/design/column-effects.js';
import { slendernessCheck } from '../../src/design/slenderness.js';
import { layoutBars } from '../../src/section/arrangements.js';
import type { Shape } from '../../src/section/types.js';
import { expectClose } from '../helpers/tolerance.js';

const step = (r: { steps: { label: string; value: unknown }[] }, start: string) => {
  const s = r.steps.find((x) => x.label.startsWith(start));
  if (!s) throw new Error(`no step ${start}`);
  return s.value as number;
};

describe('CSA A23.3-19 10.15.3 non-sway magnifier — hand calculation', () => {
  // 400 × 400 mm, f′c = 35 MPa, fy = 400 MPa, Pf = 2000 kN, kℓu = 6.0 m, M2 = 100 kN·m, M1 = 50 kN·m with the
  // same sign (single curvature: M1/M2 = +0.5 in CSA's sign), βd = 0.5.
  //   r = 0.3·400 = 120 mm, kℓu/r = 50 (10.14.2)
  //   limit (25 − 10·0.5)/√(2e6/(35·160,000)) = 20/0.597614 = 33.466 < 50: slender (10.15.2)
  //   Ec = 4500·√35 = 26,622.4 MPa (8.6.2.3); Ig = 400⁴/12 = 2.13333e9 mm⁴
  //   EI = 0.4·Ec·Ig/(1 + βd) = 1.51452e13 N·mm² (10.15.3.1); Pc = π²·EI/6000² = 4,152,133 N
  //   M2,min = 2e6·(15 + 0.03·400) = 54 kN·m < 100; Cm = 0.6 + 0.4·0.5 = 0.8 (10.15.3.2)
  //   Pf/(0.75·Pc) = 0.642240; δ = 0.8/(1 − 0.642240) = 2.23614; Mc = 223.614 kN·m
  const basis = resolveBasis('csa-a23.3-19', { units: 'si', fc: 35, fy: 400, transverse: 'tied' });
  const shape: Shape = { kind: 'rectangle', b: 400, h: 400 };
  const bars = layoutBars(shape, { kind: 'four-faces', barsPerFace: 3 }, 8 * 500, { gamma: 0.7 });
  const load = { Pu: 2e6, Mux: 100e6, Muy: 0 };
  it('single curvature: δ = 2.2361, Mc = 223.61 kN·m', () => {
    const m = magnifyLoad(basis, shape, bars, { ...load, M01: 50e6, M02: 100e6 }, { x: { effectiveLength: 6000, betaDns: 0.5 } });
    const r = m.x;
    expect(r.method).toMatch(/CSA A23\.3-19 10\.15\.3/);
    expectClose(step(r, 'kℓu/r'), 50, 1e-12);
    expectClose(step(r, 'M1/M2'), 0.5, 1e-12);
    expectClose(step(r, 'limit'), 33.46640, 1e-6);
    expect(r.neglected).toBe(false);
    expectClose(step(r, 'Ec'), 26622.36, 1e-6);
    expectClose(step(r, 'EI = 0.4'), 1.514516e13, 1e-6);
    expectClose(step(r, 'Pc'), 4152133, 1e-6);
    expectClose(step(r, 'Cm'), 0.8, 1e-12);
    expectClose(r.delta, 2.236137, 1e-6);
    expectClose(r.magnifiedMoment, 223.6137e6, 1e-6);
  });
  it('double curvature (M1 = −50): limit (25 + 5)/0.597614 = 50.20 ≥ 50, neglected', () => {
    const r = magnifyLoad(basis, shape, bars, { ...load, M01: -50e6, M02: 100e6 }, { x: { effectiveLength: 6000, betaDns: 0.5 } }).x;
    expectClose(step(r, 'limit'), 50.19960, 1e-6);
    expect(r.neglected).toBe(true);
  });
  it('check on CSA refuses the ACI-signed --m1 and takes --m01/--m02', () => {
    const o = { code: 'csa-a23.3-19', fc: '35', fy: '400', b: '400', h: '400', gamma: '0.7', pu: '2000', mu: '100', klu: '6000mm', betaDns: '0.5', proposals: '0', json: true };
    expect(() => runCheck({ ...o, m1: '50' })).toThrow(/--m01/);
    const out = JSON.parse(runCheck({ ...o, m01: '50', m02: '100' }));
    expectClose(out.results[0].slenderness.delta, 2.236137, 1e-5);
  });
});

describe('AS 3600-2018 10.4 braced moment magnifier — hand calculation', () => {
  // 400 × 600 mm (D = 600 in the bending plane), f′c = 40 MPa, fsy = 500 MPa, bars on two faces at γ = 0.8,
  // As = 0.02·Ag = 4800 mm²; N* = 3000 kN, Le = 8.0 m, M2* = 300 kN·m, M1* = −150 kN·m (single curvature), βd = 0.5.
  //   r = 0.3·600 = 180 mm, Le/r = 44.44 (10.5.2)
  //   Nuo = 0.85·40·(240,000 − 4800) + 500·4800 = 10,396,800 N (10.6.2.2)
  //   N*/(0.6Nuo) = 0.480917 → αc = √(2.25 − 2.5·0.480917) = 1.023576; αc·(38 − 40/15)·(1 − 0.5) = 18.08 → limit 25 (10.3.1)
  //   Mub: balanced kuo = 0.54545, c = 0.54545·540 = 294.5 mm; Mub = 7.62658·b·D² = 1.098227e9 N·mm (the
  //   hand-worked balanced point of tests/codes/as3600.test.ts)
  //   Nc = (π²/8000²)·182·540·0.6·1.098227e9/1.5 = 6,657,899 N (10.4.4); km = 0.6 + 0.4·0.5 = 0.8 (10.4.2)
  //   δb = 0.8/(1 − 3e6/6,657,899) = 1.456114; M* = 436.834 kN·m
  const basis = resolveBasis('as3600-2018', { units: 'si', fc: 40, fy: 500, transverse: 'tied' });
  const shape: Shape = { kind: 'rectangle', b: 400, h: 600 };
  const bars = layoutBars(shape, { kind: 'two-faces', barsPerFace: 2 }, 4800, { gamma: 0.8 });
  it('δb = 1.4561, M* = 436.83 kN·m', () => {
    const r = slendernessCheck(basis, { shape, bars }, { effectiveLength: 8000, M1: -150e6, M2: 300e6, Pu: 3e6, betaDns: 0.5 });
    expectClose(step(r, 'Le/r'), 44.4444, 1e-5);
    expectClose(step(r, 'Nuo'), 10_396_800, 1e-9);
    expectClose(step(r, 'αc'), 1.0235756, 1e-6);
    expectClose(step(r, 'limit'), 25, 1e-12);
    expect(r.neglected).toBe(false);
    expectClose(step(r, 'do'), 540, 1e-12);
    expectClose(step(r, 'Mub'), 1.098227e9, 1e-5);
    expectClose(step(r, 'Nc'), 6_657_899, 1e-5);
    expectClose(step(r, 'km'), 0.8, 1e-12);
    expectClose(r.delta, 1.456114, 1e-5);
    expectClose(r.magnifiedMoment, 436.8343e6, 1e-5);
  });
  it('a short column (Le = 4 m, Le/r = 22.2 ≤ 25) keeps M2* ≥ N*·0.05·D', () => {
    const r = slendernessCheck(basis, { shape, bars }, { effectiveLength: 4000, M1: -10e6, M2: 20e6, Pu: 3e6, betaDns: 0.5 });
    expect(r.neglected).toBe(true);
    expectClose(r.magnifiedMoment, 3e6 * 30, 1e-12); // 0.05·600 = 30 mm (10.1.2)
  });
});
