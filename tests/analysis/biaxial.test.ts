/**
 * Exact biaxial surface of the actual section (src/analysis/biaxial.ts): it reduces to the uniaxial
 * results about each axis, is symmetric for a square with four-face bars, and matches a point with the
 * neutral axis at 45° whose forces were summed by hand (first principles).
 */
import { describe, expect, it } from 'vitest';
import {
  biaxialResultant,
  capacityAlongRay,
  contourAtAxial,
  prepareBiaxial,
  surfacePoint,
  momentUtilisationAtAxial,
  uniaxialMomentAt,
} from '../../src/analysis/biaxial.js';
import { designAt, nominalAt, prepareSection } from '../../src/analysis/prepared-section.js';
import { findRoot } from '../../src/analysis/solve.js';
import { ACI_318_19 } from '../../src/codes/aci318.js';
import { layoutBars } from '../../src/section/arrangements.js';
import type { Bar, Shape } from '../../src/section/types.js';
import { expectClose } from '../helpers/tolerance.js';

const basis = ACI_318_19.resolve({ units: 'us', fc: 4, fy: 60, transverse: 'tied' });
const swap = (bars: readonly Bar[]): Bar[] => bars.map((b) => ({ x: b.y, y: b.x, area: b.area }));

describe('biaxialResultant reduces to the uniaxial section', () => {
  // Nilson, Darwin & Dolan, Design of Concrete Structures, 14th ed., Example 8.1 (inputs from memory),
  // recomputed from first principles: 12 × 20 in, 2 #11 per face at 2.5 in from each face.
  const shape: Shape = { kind: 'rectangle', b: 12, h: 20 };
  const bars = layoutBars(shape, { kind: 'two-faces', barsPerFace: 2 }, 6.24, { gamma: 0.75 });
  const sec = prepareBiaxial(basis, shape, bars);
  const turned = prepareBiaxial(basis, { kind: 'rectangle', b: 20, h: 12 }, swap(bars));
  const table: [number, number, number][] = [
    [10.36, 348.6, 4739],
    [5.0, 111.3, 3708],
    [18.0, 808.4, 2735],
  ];
  for (const [c, P, M] of table) {
    it(`θ = 0 at c = ${c} in: Pn = ${P} kips, Mn = ${M} in·kips, My = 0 (Nilson et al. Ex. 8.1, first principles)`, () => {
      const r = biaxialResultant(sec, 0, c, 'nominal');
      expectClose(r.P, P, 0.001);
      expectClose(r.Mx, M, 0.001);
      expectClose(r.My, 0, 0, 1e-9);
    });
    it(`θ = 90° on the same section turned (b = 20, h = 12) gives the same Pn, and My = ${M}`, () => {
      const r = biaxialResultant(turned, Math.PI / 2, c, 'nominal');
      expectClose(r.P, P, 0.001);
      expectClose(r.My, M, 0.001);
      expectClose(r.Mx, 0, 0, 1e-9);
    });
  }
  it('Po = 1169.2 kips and φPn,max = 608.0 kips (reference values, ACI 318-19 22.4.2)', () => {
    expectClose(sec.squash.nominal, 1169.2, 0.001);
    expectClose(sec.cap.design, 608.0, 0.001);
  });

  it('agrees with prepareSection (the chart core) at any c/h about both axes', () => {
    const ps = prepareSection(basis, shape, bars);
    const rho = 6.24 / 240;
    for (const cOverH of [0.05, 0.2, 0.45, 0.7, 1.1, 3]) {
      const [Pn, Mn] = nominalAt(ps.respond(cOverH), rho);
      const r = biaxialResultant(sec, 0, cOverH * 20, 'nominal');
      expectClose(r.P, Pn * 240, 1e-9, 1e-9);
      expectClose(r.Mx, Mn * 240 * 20, 1e-9, 1e-9);
    }
  });

  it('circle at θ = 0°, 45°, 90°, 225° (a bar at the pole each time): balanced Pn = 466.1, Mn = 3663 (first principles: hand strain compatibility, ACI 318-19 22.2)', () => {
    const circle: Shape = { kind: 'circle', diameter: 20 };
    const ring = layoutBars(circle, { kind: 'ring', bars: 8 }, 6.32, { gamma: 0.7625 });
    const cs = prepareBiaxial(basis, circle, ring);
    for (const theta of [0, Math.PI / 4, Math.PI / 2, (5 * Math.PI) / 4]) {
      const r = biaxialResultant(cs, theta, 10.431, 'nominal');
      expectClose(r.P, 466.1, 0.001);
      expectClose(Math.hypot(r.Mx, r.My), 3663, 0.001);
      expectClose(Math.cos(Math.atan2(r.My, r.Mx) - theta), 1, 0, 1e-12);
    }
  });
});

describe('capacityAlongRay with one moment equals the uniaxial ray capacity', () => {
  // Hand check, common practice: 24 × 24 in, two faces, γ = 0.75, e = 8 in; independent
  // strain-compatibility values φPn ≈ 825 kips at ρg = 0.02 and ≈ 954 kips at ρg = 0.03.
  const shape: Shape = { kind: 'rectangle', b: 24, h: 24 };
  for (const [rho, expected] of [
    [0.02, 825],
    [0.03, 954],
  ] as const) {
    it(`ρg = ${rho}: φPn along e = 8 in ≈ ${expected} kips, about x and about y`, () => {
      const bars = layoutBars(shape, { kind: 'two-faces', barsPerFace: 3 }, rho * 576, { gamma: 0.75 });
      const sec = prepareBiaxial(basis, shape, bars);
      const rx = capacityAlongRay(sec, 900, 7200, 0);
      expectClose(rx.capacity.P, expected, 0.01);
      // the same ray against the normalised chart core: solve c/h where φMn/φPn = e/h
      const ps = prepareSection(basis, shape, bars);
      const f = (lc: number) => {
        const [p, m] = designAt(ps.respond(Math.exp(lc)), rho);
        return Math.atan2(p, m) - Math.atan2(900 / 576, 7200 / (576 * 24));
      };
      const c = Math.exp(findRoot(f, Math.log(1e-4), Math.log(1e4), 1e-13));
      const [pChart] = designAt(ps.respond(c), rho);
      expectClose(rx.capacity.P, pChart * 576, 1e-6);
      const turned = prepareBiaxial(basis, shape, swap(bars));
      expectClose(capacityAlongRay(turned, 900, 0, 7200).capacity.P, rx.capacity.P, 1e-6);
    });
  }
});

describe('square section with four-face bars', () => {
  const shape: Shape = { kind: 'rectangle', b: 20, h: 20 };
  const bars = layoutBars(shape, { kind: 'four-faces', barsPerFace: 4 }, 8, { gamma: 0.75 });
  const sec = prepareBiaxial(basis, shape, bars);
  it('the contour at P = 300 kips is symmetric about the 45° line: (Mx, My) at θ mirrors (My, Mx) at 90° − θ (first principles)', () => {
    const pts = contourAtAxial(sec, 300, 72);
    expect(pts.length).toBe(72);
    for (let i = 0; i <= 18; i++) {
      const a = pts[i]!;
      const b = pts[18 - i]!;
      expectClose(a.P, 300, 1e-9);
      expectClose(a.Mx, b.My, 1e-7, 1e-6);
      expectClose(a.My, b.Mx, 1e-7, 1e-6);
    }
  });
  it('swapping Mux and Muy leaves the utilisation unchanged', () => {
    const a = capacityAlongRay(sec, 250, 2400, 900);
    const b = capacityAlongRay(sec, 250, 900, 2400);
    expectClose(a.utilisation, b.utilisation, 1e-7);
    expect(a.directionError).toBeLessThan(1e-8);
  });
  it('the capacity point lies on the load ray and on the surface', () => {
    const r = capacityAlongRay(sec, 250, 2400, 900);
    const k = r.capacity.P / 250;
    expectClose(r.capacity.Mx, 2400 * k, 1e-9);
    expectClose(r.capacity.My, 900 * k, 1e-9);
    const s = surfacePoint(sec, r.point.theta, r.point.c);
    expectClose(s.P, r.capacity.P, 1e-7);
    expectClose(Math.hypot(s.Mx, s.My), Math.hypot(r.capacity.Mx, r.capacity.My), 1e-7);
  });
  it('the axial cap governs a nearly concentric load: utilisation = Pu / φPn,max', () => {
    const r = capacityAlongRay(sec, 600, 10, 10);
    expect(r.capGoverns).toBe(true);
    expectClose(r.utilisation, 600 / sec.cap.design, 1e-12);
  });
  it('moment utilisation at fixed P along 45° is |Mu| over the contour point at θ = 45° (symmetry)', () => {
    const p45 = contourAtAxial(sec, 300, 8)[1]!;
    expectClose(momentUtilisationAtAxial(sec, 300, 1000, 1000), Math.hypot(1000, 1000) / Math.hypot(p45.Mx, p45.My), 1e-7);
    expectClose(momentUtilisationAtAxial(sec, 300, 1000, 0), 1000 / uniaxialMomentAt(sec, 'x', 300).moment, 1e-7);
  });
  it('contour end points equal the uniaxial moment capacities at the same P', () => {
    const pts = contourAtAxial(sec, 300, 4);
    expectClose(pts[0]!.Mx, uniaxialMomentAt(sec, 'x', 300).moment, 1e-9);
    expectClose(pts[1]!.My, uniaxialMomentAt(sec, 'y', 300).moment, 1e-9);
  });
});

describe('hand-worked point, neutral axis at 45° (first principles)', () => {
  // 20 × 20 in, f′c = 4 ksi, fy = 60 ksi, Es = 29,000 ksi, εcu = 0.003, β1 = 0.85 (ACI 318-19 22.2),
  // four #9 corner bars (1.00 in² each) at (±7.5, ±7.5) in. Neutral axis at 45°, c = 12 in from the
  // compressed corner (10, 10), measured along the diagonal.
  //   Depth of the section normal to the axis hθ = 20·(sin 45° + cos 45°) = 28.284 in; sMax = 14.142 in.
  //   a = β1·c = 10.2 in < 14.142 in, so the block is the corner triangle with legs a·√2 = 14.425 in:
  //   area = a² = 104.04 in², centroid 14.425/3 = 4.808 in in from each edge → x̄ = ȳ = 5.1917 in.
  //   Cc = 0.85·4·104.04 = 353.736 kips; Cc·ȳ = 1836.48 in·kips about each axis.
  //   Bars, ε = 0.003(1 − d/12):
  //     (7.5, 7.5):   d = 3.5355, ε = +0.0021161 > εy → +60 ksi, inside the block: 1.00·(60 − 3.4) = +56.6
  //     (7.5, −7.5), (−7.5, 7.5): d = 14.142, ε = −0.00053553 → −15.530 ksi, outside the block: −15.530 each
  //     (−7.5, −7.5): d = 24.749, ε = −0.0031872 → −60 ksi: −60.0
  //   Pn = 353.736 + 56.6 − 2·15.530 − 60.0 = 319.275 kips
  //   Mnx = 1836.48 + 56.6·7.5 + (−15.530)(−7.5) + (−15.530)(7.5) + (−60)(−7.5) = 2710.98 in·kips = Mny
  //   εt = 0.0031872: φ = 0.65 + 0.25·(0.0031872 − 0.0020690)/0.003 = 0.7432 (Table 21.2.2)
  const shape: Shape = { kind: 'rectangle', b: 20, h: 20 };
  const bars: Bar[] = [
    { x: 7.5, y: 7.5, area: 1 },
    { x: 7.5, y: -7.5, area: 1 },
    { x: -7.5, y: 7.5, area: 1 },
    { x: -7.5, y: -7.5, area: 1 },
  ];
  const sec = prepareBiaxial(basis, shape, bars);
  it('Pn = 319.275 kips, Mnx = Mny = 2710.98 in·kips, εt = 0.0031872, φ = 0.7432', () => {
    const r = biaxialResultant(sec, Math.PI / 4, 12, 'nominal');
    expectClose(r.P, 319.275, 1e-5);
    expectClose(r.Mx, 2710.98, 1e-5);
    expectClose(r.My, 2710.98, 1e-5);
    expectClose(r.epsT, 0.0031872, 1e-4);
    expectClose(surfacePoint(sec, Math.PI / 4, 12).phi, 0.7432, 1e-4);
  });
  it('the ray through that point has utilisation 1 and finds θ = 45°, c = 12 in', () => {
    const r = capacityAlongRay(sec, 319.275 * 0.743185, 2710.98 * 0.743185, 2710.98 * 0.743185);
    expectClose(r.utilisation, 1, 1e-5);
    expectClose(r.point.theta, Math.PI / 4, 0, 1e-6);
    expectClose(r.point.c, 12, 1e-5);
  });
});
