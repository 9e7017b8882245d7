/**
 * A four-faces layout with unequal counts, [3, 5], against hand calculations by strain compatibility
 * (ACI 318-19 22.2: plane sections, εcu = 0.003 (22.2.2.1), rectangular block 0.85·f′c over a = β1·c
 * (22.2.2.4.1), β1 = 0.85 for f′c = 4 ksi (Table 22.2.2.4.3); steel elastic–perfectly plastic with
 * Es = 29,000 ksi (20.2.2.1, 20.2.2.2); displaced concrete deducted for bars inside the block, common practice).
 *
 * Section (invented): b = 16 in, h = 24 in, γ = 0.75, 12 #8 bars (0.79 in² each, ASTM A615 Table 1), Ast = 9.48 in².
 * Bars: halfY = 0.75·24/2 = 9 in; equal cover 3 in gives halfX = 16/2 − 3 = 5 in.
 *   b faces (y = ±9): 3 bars each at x = −5, 0, 5;  h faces (x = ±5): 5 bars each at y = 9, 4.5, 0, −4.5, −9.
 * f′c = 4 ksi, fy = 60 ksi, εy = 60/29000 = 0.0020690.
 */
import { describe, expect, it } from 'vitest';
import { biaxialResultant, prepareBiaxial, surfacePoint, uniaxialMomentAt } from '../../src/analysis/biaxial.js';
import { nominalAt, prepareSection } from '../../src/analysis/prepared-section.js';
import { ACI_318_19 } from '../../src/codes/aci318.js';
import { layoutBars } from '../../src/section/arrangements.js';
import type { Shape } from '../../src/section/types.js';
import { expectClose } from '../helpers/tolerance.js';

const basis = ACI_318_19.resolve({ units: 'us', fc: 4, fy: 60, transverse: 'tied' });
const shape: Shape = { kind: 'rectangle', b: 16, h: 24 };
const ast = 12 * 0.79;
const ag = 16 * 24;
const bars = layoutBars(shape, { kind: 'four-faces', barsPerFace: [3, 5] }, ast, { gamma: 0.75 });

describe('four-faces [3, 5] about x (bending plane along h): the uniaxial chart core', () => {
  const section = prepareSection(basis, shape, bars);
  const at = (c: number) => {
    const [p, m] = nominalAt(section.respond(c / 24), ast / ag);
    return { P: p * ag, M: m * ag * 24 };
  };
  it('c = 12 in: Pn = 541.45 kips, Mn = 6755.5035 in·kips (hand calculation, strain compatibility per ACI 318-19 22.2)', () => {
    // a = 0.85·12 = 10.2 in; Cc = 0.85·4·10.2·16 = 554.88 kips at y = 12 − 5.1 = 6.9 in → 3828.672 in·kips
    // rows (depth d, bars): εs = 0.003·(c − d)/c, fs = Es·εs within ±60, less 3.4 ksi inside the block (d < a)
    //   d = 3    (3): εs = 0.00225  → 60 − 3.4  = 56.6    F = 3·0.79·56.6    = 134.142   M = ·9    = 1207.278
    //   d = 7.5  (2): εs = 0.001125 → 32.625 − 3.4 = 29.225 F = 2·0.79·29.225 = 46.1755   M = ·4.5  = 207.78975
    //   d = 12   (2): εs = 0                              F = 0
    //   d = 16.5 (2): εs = −0.001125 → −32.625             F = −51.5475      M = ·(−4.5) = 231.96375
    //   d = 21   (3): εs = −0.00225 → −60                  F = −142.2        M = ·(−9)   = 1279.8
    // Pn = 554.88 + 134.142 + 46.1755 − 51.5475 − 142.2 = 541.45; Mn = 6755.5035
    const r = at(12);
    expectClose(r.P, 541.45, 1e-6);
    expectClose(r.M, 6755.5035, 1e-6);
  });
  it('c = 6 in: Pn = 6.312 kips, Mn = 5028.8985 in·kips (hand calculation, strain compatibility per ACI 318-19 22.2)', () => {
    // a = 5.1 in; Cc = 0.85·4·5.1·16 = 277.44 kips at y = 12 − 2.55 = 9.45 in → 2621.808 in·kips
    //   d = 3    (3): εs = 0.0015 → 43.5 − 3.4 = 40.1   F = 95.037   M = 855.333
    //   d = 7.5  (2): εs = −0.00075 → −21.75           F = −34.365  M = −154.6425
    //   d = 12   (2): εs = −0.003 → −60                F = −94.8    M = 0
    //   d = 16.5 (2): −60                              F = −94.8    M = 426.6
    //   d = 21   (3): −60                              F = −142.2   M = 1279.8
    const r = at(6);
    expectClose(r.P, 6.312, 1e-6);
    expectClose(r.M, 5028.8985, 1e-6);
  });
});

describe('four-faces [3, 5] about y (θ = π/2, compression on the +x face): the exact biaxial analysis', () => {
  const sec = prepareBiaxial(basis, shape, bars);
  // About y the section is 16 in deep and 24 in wide; bar columns at depth 8 − x from the +x face:
  //   x = 5: 5 bars (an h face) at d = 3;  x = 0: 2 bars (middles of the b faces) at d = 8;  x = −5: 5 bars at d = 13.
  it('c = 8 in: Pn = 541.45 kips, My = 4633.1105 in·kips, Mx = 0 (hand calculation, strain compatibility per ACI 318-19 22.2)', () => {
    // a = 6.8 in; Cc = 0.85·4·6.8·24 = 554.88 kips at x = 8 − 3.4 = 4.6 in → 2552.448 in·kips
    //   d = 3  (5): εs = 0.001875 → 54.375 − 3.4 = 50.975  F = 5·0.79·50.975 = 201.35125   M = ·5    = 1006.75625
    //   d = 8  (2): εs = 0                                F = 0
    //   d = 13 (5): εs = −0.001875 → −54.375              F = −214.78125               M = ·(−5) = 1073.90625
    const r = biaxialResultant(sec, Math.PI / 2, 8, 'nominal');
    expectClose(r.P, 541.45, 1e-6);
    expectClose(r.My, 4633.1105, 1e-6);
    expectClose(r.Mx, 0, 0, 1e-9);
    // εt = 0.001875 < εy: compression-controlled, φ = 0.65 (ACI 318-19 Table 21.2.2)
    const s = surfacePoint(sec, Math.PI / 2, 8);
    expectClose(s.phi, 0.65, 1e-12);
    expectClose(s.My, 0.65 * 4633.1105, 1e-6);
  });
  it('c = 4 in: Pn = 18.1225 kips, My = 3295.2845 in·kips, φ = 0.90 (hand calculation, strain compatibility per ACI 318-19 22.2)', () => {
    // a = 3.4 in; Cc = 0.85·4·3.4·24 = 277.44 kips at x = 8 − 1.7 = 6.3 in → 1747.872 in·kips
    //   d = 3  (5): εs = 0.00075 → 21.75 − 3.4 = 18.35  F = 72.4825   M = 362.4125
    //   d = 8  (2): εs = −0.003 → −60                  F = −94.8     M = 0
    //   d = 13 (5): εs = −0.00675 → −60                F = −237      M = 1185
    // εt = 0.00675 ≥ εy + 0.003 = 0.005069: tension-controlled, φ = 0.90 (ACI 318-19 Table 21.2.2)
    const r = biaxialResultant(sec, Math.PI / 2, 4, 'nominal');
    expectClose(r.P, 18.1225, 1e-6);
    expectClose(r.My, 3295.2845, 1e-6);
    const s = surfacePoint(sec, Math.PI / 2, 4);
    expectClose(s.phi, 0.9, 1e-12);
  });
  it('uniaxialMomentAt about y at φPn = 0.65·541.45 kips gives φMny = 0.65·4633.1105 in·kips (the c = 8 in hand sum)', () => {
    const { moment, point } = uniaxialMomentAt(sec, 'y', 0.65 * 541.45);
    expectClose(moment, 0.65 * 4633.1105, 1e-6);
    expectClose(point!.c, 8, 1e-6);
  });
});

describe('four-faces [3, 5] with γB = 0.5 (h faces at x = ±4 in)', () => {
  const narrow = layoutBars(shape, { kind: 'four-faces', barsPerFace: [3, 5] }, ast, { gamma: 0.75, gammaX: 0.5 });
  it('about y at c = 8 in: Pn = 541.45 kips, My = 3873.328 in·kips (hand calculation, strain compatibility per ACI 318-19 22.2)', () => {
    // columns at d = 4 (5 bars), 8 (2), 12 (5) from the +x face; a = 6.8 in, Cc = 554.88 kips → 2552.448 in·kips
    //   d = 4:  εs = 0.0015 → 43.5 − 3.4 = 40.1 ksi, F = 3.95·40.1 = 158.395, M = ·4 = 633.58
    //   d = 12: εs = −0.0015 → −43.5 ksi,          F = −171.825,         M = ·(−4) = 687.3
    const r = biaxialResultant(prepareBiaxial(basis, shape, narrow), Math.PI / 2, 8, 'nominal');
    expectClose(r.P, 541.45, 1e-6);
    expectClose(r.My, 3873.328, 1e-6);
  });
  it('about x γB moves no bar row: Pn and Mn at c = 12 in stay 541.45 kips and 6755.5035 in·kips (the hand sum above)', () => {
    const [p, m] = nominalAt(prepareSection(basis, shape, narrow).respond(12 / 24), ast / ag);
    expectClose(p * ag, 541.45, 1e-6);
    expectClose(m * ag * 24, 6755.5035, 1e-6);
  });
});
