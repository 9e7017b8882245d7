/**
 * Biaxial contour families (src/analysis/biaxial-family.ts), the data of the biaxial sheets: every
 * contour point lies on the exact biaxial surface, the contours meet the uniaxial chart curves about
 * each axis, square sections give symmetric contours, the fitted load-contour exponent falls where
 * Bresler (1960) put it on nominal contours, and one corner-column point matches a hand calculation.
 */
import { describe, expect, it } from 'vitest';
import { capacityAlongRay, prepareBiaxial, surfacePoint } from '../../src/analysis/biaxial.js';
import { computeBiaxialFamily, contourAngles, doublySymmetric, fitLoadContour, loadContourRadius } from '../../src/analysis/biaxial-family.js';
import { computeFamily } from '../../src/analysis/family.js';
import { designAt, nominalAt, prepareSection } from '../../src/analysis/prepared-section.js';
import { findRoot } from '../../src/analysis/solve.js';
import { ACI_318_19 } from '../../src/codes/aci318.js';
import { EN_1992_1_1 } from '../../src/codes/en1992.js';
import { layoutBars } from '../../src/section/arrangements.js';
import type { Arrangement, Bar, Shape } from '../../src/section/types.js';
import { expectClose } from '../helpers/tolerance.js';

const aci = ACI_318_19.resolve({ units: 'us', fc: 5, fy: 60, transverse: 'tied' });
const square: Shape = { kind: 'rectangle', b: 1, h: 1 };
/** a rectangle, b/h = 0.6, with bars on the two b faces only: different capacities about x and y */
const narrow: Shape = { kind: 'rectangle', b: 0.6, h: 1 };
const swap = (bars: readonly Bar[]): Bar[] => bars.map((b) => ({ x: b.y, y: b.x, area: b.area }));

describe('contour points lie on the exact biaxial surface', () => {
  // Definition of the contour (common practice): the moment pair at P whose ray has utilisation 1 in the
  // exact search (capacityAlongRay), at the same P and moment direction.
  const cases: [string, Shape, Arrangement, number][] = [
    ['square, 3 bars per face on four faces', square, { kind: 'four-faces', barsPerFace: 3 }, 0.75],
    ['b/h 0.6, 4 bars on each of two faces', narrow, { kind: 'two-faces', barsPerFace: 4 }, 0.8],
  ];
  for (const [what, shape, arrangement, gamma] of cases) {
    it(`${what}: utilisation 1 to 1e-6 on the ray through every third point`, () => {
      const rhos = [0.01, 0.04];
      const levels = [0, 0.3, 0.6];
      const f = computeBiaxialFamily({ basis: aci, shape, arrangement, gamma, rhos, levels });
      const ag = shape.kind === 'rectangle' ? shape.b * shape.h : NaN;
      const b = shape.kind === 'rectangle' ? shape.b : NaN;
      let checked = 0;
      rhos.forEach((rho, k) => {
        const sec = prepareBiaxial(aci, shape, layoutBars(shape, arrangement, rho * ag, { gamma }));
        levels.forEach((level, i) => {
          const c = f.contours[i]![k]!;
          if (!c.reachable) return;
          for (let j = 1; j < c.angleDeg.length; j += 3) {
            const r = capacityAlongRay(sec, level * aci.normalisingStress * ag, c.mx[j]! * ag * 1, c.my[j]! * ag * b);
            expectClose(r.utilisation, 1, 1e-6);
            checked++;
          }
        });
      });
      expect(checked).toBeGreaterThan(20);
    });
  }
});

describe('contours meet the uniaxial chart curves (computeFamily) at the same P', () => {
  // At My = 0 the contour is the uniaxial capacity about x; at Mx = 0 that of the section turned, bending
  // about y (first principles: the same strain-compatibility section with the neutral axis parallel to an axis).
  /** the uniaxial chart's normalised moment at normalised axial load p (P/Ag), exact: solved on the chart core */
  const chartMoment = (ps: ReturnType<typeof prepareSection>, rho: number, p: number, model: 'design' | 'nominal'): number => {
    const at = (c: number) => (model === 'design' ? designAt(ps.respond(c), rho) : nominalAt(ps.respond(c), rho));
    const c = Math.exp(findRoot((lc) => at(Math.exp(lc))[0] - p, Math.log(1e-5), Math.log(1e5), 1e-14));
    return at(c)[1];
  };
  for (const model of ['design', 'nominal'] as const) {
    it(`${model}: b/h 0.6, two faces: Mxo from the chart curve, Myo from the turned section's curve, 1e-6 relative`, () => {
      const arrangement: Arrangement = { kind: 'two-faces', barsPerFace: 4 };
      const rhos = [0.01, 0.03, 0.06];
      // levels clear of a bar-row entry into the stress block, where P(c) steps and one P has two depths
      const levels = [0, 0.1, 0.35, 0.55];
      const f = computeBiaxialFamily({ basis: aci, shape: narrow, arrangement, gamma: 0.8, rhos, levels, model });
      const chart = computeFamily({ basis: aci, shape: narrow, arrangement, gamma: 0.8, rhos, basePoints: 60 });
      const turned = prepareSection(aci, { kind: 'rectangle', b: 1, h: 0.6 }, swap(chart.bars));
      let checked = 0;
      rhos.forEach((rho, k) =>
        levels.forEach((level, i) => {
          const c = f.contours[i]![k]!;
          if (!c.reachable) return;
          const p = level * aci.normalisingStress;
          expectClose(c.mxo, chartMoment(chart.section, rho, p, model), 1e-6);
          expectClose(c.myo, chartMoment(turned, rho, p, model), 1e-6);
          expect(c.mx[0]).toBe(c.mxo);
          expect(c.my[c.my.length - 1]).toBe(c.myo);
          checked++;
        }),
      );
      expect(checked).toBeGreaterThanOrEqual(10);
      // the narrow section is weaker about y: Myo (per Ag·b) below Mxo (per Ag·h) with bars on the b faces only
      expect(f.contours[1]![1]!.myo).toBeLessThan(f.contours[1]![1]!.mxo);
    });
  }
});

describe('unequal counts: a [3, 5] rectangle (issue 15)', () => {
  // 3 bars on each b face, 5 on each h face, b/h 0.75, γ 0.75 and γB 0.6: the contour meets the uniaxial chart
  // curve about x at My = 0 and the turned section's curve at Mx = 0 (first principles, as above), 1e-6 relative.
  const shape: Shape = { kind: 'rectangle', b: 0.75, h: 1 };
  const arrangement: Arrangement = { kind: 'four-faces', barsPerFace: [3, 5] };
  const at = (ps: ReturnType<typeof prepareSection>, rho: number, p: number): number => {
    const c = Math.exp(findRoot((lc) => designAt(ps.respond(Math.exp(lc)), rho)[0] - p, Math.log(1e-5), Math.log(1e5), 1e-14));
    return designAt(ps.respond(c), rho)[1];
  };
  it('Mxo and Myo equal the uniaxial curves about x and about y at the same P; one quadrant (symmetric about both axes)', () => {
    const rhos = [0.01, 0.04];
    const levels = [0, 0.15, 0.4];
    const f = computeBiaxialFamily({ basis: aci, shape, arrangement, gamma: 0.75, gammaX: 0.6, rhos, levels });
    expect(f.quadrants).toBe('first');
    expect(f.bars).toHaveLength(12);
    const chart = computeFamily({ basis: aci, shape, arrangement, gamma: 0.75, gammaX: 0.6, rhos, basePoints: 60 });
    const turned = prepareSection(aci, { kind: 'rectangle', b: 1, h: 0.75 }, swap(chart.bars));
    rhos.forEach((rho, k) =>
      levels.forEach((level, i) => {
        const c = f.contours[i]![k]!;
        expect(c.reachable).toBe(true);
        expectClose(c.mxo, at(chart.section, rho, level * aci.normalisingStress), 1e-6);
        expectClose(c.myo, at(turned, rho, level * aci.normalisingStress), 1e-6);
      }),
    );
    // γB 0.6 below γ 0.75 puts the outer columns nearer the centre (for My) than the outer rows (for Mx): Mxo per Ag·h
    // exceeds Myo per Ag·b here although the outer columns hold five bars each and the outer rows three
    expect(f.contours[1]![1]!.mxo).toBeGreaterThan(f.contours[1]![1]!.myo);
  });
});

describe('Mxo against outside chart points at the balanced axial load', () => {
  // First principles (hand strain compatibility, ACI 318-19 22.2): ACI 318-19, f′c 4 ksi, fy 60 ksi, γ 0.80, bars on two faces; the
  // nominal contour at the balanced Pn/(b·h) meets My = 0 at the balanced Mn/(b·h²). Tolerance 0.1 % (its digits).
  const basis = ACI_318_19.resolve({ units: 'us', fc: 4, fy: 60, transverse: 'tied' });
  const rows: [number, number, number][] = [
    [0.01, 1.522, 0.6544],
    [0.02, 1.505, 0.8876],
    [0.04, 1.471, 1.354],
    [0.08, 1.404, 2.287],
  ];
  for (const [rho, P, M] of rows)
    it(`ρg ${rho}: at P/(f′c·Ag) = ${P}/4, Mxo = ${M} ksi (nominal)`, () => {
      const f = computeBiaxialFamily({ basis, shape: square, arrangement: { kind: 'two-faces', barsPerFace: 3 }, gamma: 0.8, rhos: [rho], levels: [P / 4], model: 'nominal' });
      expectClose(f.contours[0]![0]!.mxo, M, 0.001);
    });
  // First principles (hand strain compatibility, EN 1992-1-1:2004 6.1 and 3.1.7 parabola–rectangle): EN 1992-1-1, C30/37 (fcd 20 MPa), B500 (fyd 434.8 MPa, horizontal
  // branch), parabola–rectangle, γ 0.80, bars on two faces: balanced ν 0.4444 / μ 0.2059 at ρ 0.01, 0.4394 / 0.2908 at 0.02.
  const en = EN_1992_1_1.resolve({ units: 'si', fc: 30, fy: 500, transverse: 'tied' });
  for (const [rho, nu, mu] of [
    [0.01, 0.4444, 0.2059],
    [0.02, 0.4394, 0.2908],
  ] as const)
    it(`EN 1992-1-1, ρ ${rho}: at ν = ${nu}, Mxo/(fcd·Ag·h) = μ = ${mu} (design)`, () => {
      const f = computeBiaxialFamily({ basis: en, shape: square, arrangement: { kind: 'two-faces', barsPerFace: 3 }, gamma: 0.8, rhos: [rho], levels: [nu] });
      expectClose(f.contours[0]![0]!.mxo / en.normalisingStress, mu, 0.001);
    });
});

describe('symmetry of square sections with equal counts', () => {
  it('mx(ψ) = my(90° − ψ) to 1e-7 relative, one quadrant drawn (common practice: a doubly symmetric section gives a contour symmetric about both axes)', () => {
    const f = computeBiaxialFamily({ basis: aci, shape: square, arrangement: { kind: 'four-faces', barsPerFace: 4 }, gamma: 0.7, rhos: [0.02, 0.05], levels: [0, 0.25, 0.5] });
    expect(f.quadrants).toBe('first');
    for (const row of f.contours)
      for (const c of row) {
        expect(c.angleDeg).toEqual(contourAngles('first', 5));
        const n = c.angleDeg.length;
        for (let j = 0; j < n; j++) expectClose(c.mx[j]!, c.my[n - 1 - j]!, 1e-7, 1e-12);
        expectClose(c.mxo, c.myo, 1e-9);
      }
  });
  it('the layout helper: four-faces bars map onto themselves under x → −x and y → −y; a shifted bar breaks it', () => {
    const bars = layoutBars(square, { kind: 'four-faces', barsPerFace: 3 }, 1, { gamma: 0.75 });
    expect(doublySymmetric(bars, 1)).toBe(true);
    expect(doublySymmetric([...bars.slice(1), { ...bars[0]!, x: bars[0]!.x + 0.05 }], 1)).toBe(false);
  });
  it('bars of the family add up to Ag at ρg = 1 (the pictogram scales them by ρg)', () => {
    const f = computeBiaxialFamily({ basis: aci, shape: narrow, arrangement: { kind: 'four-faces', barsPerFace: 3 }, gamma: 0.75, rhos: [0.02], levels: [0.2] });
    expectClose(f.bars.reduce((s, b) => s + b.area, 0), 0.6, 1e-12);
    expect(f.bars).toHaveLength(8);
  });
});

describe('fitted load-contour exponent α', () => {
  it('recovers the exponent of an exact load contour (Bresler 1960, (Mx/Mxo)^α + (My/Myo)^α = 1) with zero misfit', () => {
    for (const alpha of [1, 1.5, 2.3]) {
      const pts = contourAngles('first', 5).map((deg) => {
        const phi = (deg * Math.PI) / 180;
        const r = loadContourRadius(phi, alpha);
        return { u: r * Math.cos(phi), v: r * Math.sin(phi) };
      });
      const fit = fitLoadContour(pts);
      expectClose(fit.alpha, alpha, 1e-6);
      expect(fit.misfit).toBeLessThan(1e-6);
    }
  });
  it('nominal contours at moderate levels (P/(f′c·Ag) 0.3 and 0.4): α within about 1.15–1.55 (Bresler 1960, ACI Journal 57, from memory)', () => {
    const f = computeBiaxialFamily({ basis: aci, shape: square, arrangement: { kind: 'four-faces', barsPerFace: 3 }, gamma: 0.75, rhos: [0.01, 0.02, 0.03, 0.04], levels: [0.3, 0.4], model: 'nominal' });
    for (const row of f.contours)
      for (const c of row) {
        expect(c.reachable).toBe(true);
        expect(c.alpha).toBeGreaterThanOrEqual(1.15);
        expect(c.alpha).toBeLessThanOrEqual(1.55);
        // the fitted curve stays within a few per cent of the exact contour there
        expect(c.misfit).toBeLessThan(0.03);
      }
  });
  it('unreachable levels (above a ρg’s axial cap) give no points and NaN fit, never a made-up contour', () => {
    const f = computeBiaxialFamily({ basis: aci, shape: square, arrangement: { kind: 'four-faces', barsPerFace: 3 }, gamma: 0.75, rhos: [0.01], levels: [0.7] });
    const c = f.contours[0]![0]!;
    expect(c.reachable).toBe(false);
    expect(c.mx).toHaveLength(0);
    expect(Number.isNaN(c.alpha)).toBe(true);
  });
  it('EN 1992-1-1: the level is ν = NEd/(fcd·Ac): a level at the design squash load ν = 1 + ρ·fyd/fcd − ρ is just out of reach, 0.9 of it is reachable (EN 1992-1-1 6.1, Fig. 6.1 pivot C)', () => {
    const en = EN_1992_1_1.resolve({ units: 'si', fc: 30, fy: 500, transverse: 'tied' });
    expect(en.normalisingStress).toBeCloseTo(20, 9);
    const f = computeBiaxialFamily({ basis: en, shape: square, arrangement: { kind: 'four-faces', barsPerFace: 3 }, gamma: 0.8, rhos: [0.02], levels: [0.9, 1.5] });
    expect(f.contours[0]![0]!.reachable).toBe(true);
    expect(f.contours[1]![0]!.reachable).toBe(false);
  });
});

describe('hand-worked corner column, neutral axis at 45° (ACI 318-19 22.2, first principles)', () => {
  // 20 × 20 in, f′c = 4 ksi, fy = 60 ksi, Es = 29,000 ksi, εcu = 0.003, β1 = 0.85 (22.2.2.4.3); four
  // #9 corner bars (1.00 in² each, ASTM A615) at (±7.5, ±7.5) in, so γ = 15/20 = 0.75 and ρg = 4/400 = 0.01.
  // Neutral axis at 45°, c = 8 in from the compressed corner (10, 10) along the diagonal; sMax = 14.142 in.
  //   a = β1·c = 6.8 in: the block is the corner triangle with legs a·√2 = 9.6167 in, area a² = 46.24 in²,
  //   centroid leg/3 = 3.2056 in in from each face → x̄ = ȳ = 6.7944 in.
  //   Cc = 0.85·4·46.24 = 157.216 kips; Cc·ȳ = 1068.196 in·kips about each axis.
  //   Bars, d = 14.142 − (x + y)/√2, ε = 0.003·(1 − d/c):
  //     (7.5, 7.5):  d = 3.5355, ε = +0.0016742 → 48.551 ksi, inside the block: 1.00·(48.551 − 3.4) = +45.151
  //     (7.5, −7.5), (−7.5, 7.5): d = 14.142, ε = −0.0023033 → −60 ksi (yielded): −60.0 each
  //     (−7.5, −7.5): d = 24.749, ε = −0.0062808 → −60.0
  //   Pn = 157.216 + 45.151 − 3·60 = 22.367 kips
  //   Mnx = 1068.196 + 45.151·7.5 − 60·(−7.5) − 60·(7.5) − 60·(−7.5) = 1856.83 in·kips = Mny
  //   εt = 0.0062808 ≥ εty + 0.003 = 0.005069: φ = 0.90 (Table 21.2.2).
  const basis = ACI_318_19.resolve({ units: 'us', fc: 4, fy: 60, transverse: 'tied' });
  const Ag = 400;
  const h = 20;
  it('surfacePoint at θ = 45°, c = 8 in: Pn = 22.367 kips, Mnx = Mny = 1856.83 in·kips, φ = 0.90', () => {
    const shape: Shape = { kind: 'rectangle', b: 20, h: 20 };
    const bars: Bar[] = [7.5, -7.5].flatMap((x) => [7.5, -7.5].map((y) => ({ x, y, area: 1 })));
    const sec = prepareBiaxial(basis, shape, bars);
    const nominal = surfacePoint(sec, Math.PI / 4, 8, 'nominal');
    expectClose(nominal.P, 22.367, 1e-4);
    expectClose(nominal.Mx, 1856.83, 1e-5);
    expectClose(nominal.My, 1856.83, 1e-5);
    expectClose(surfacePoint(sec, Math.PI / 4, 8).phi, 0.9, 1e-12);
  });
  for (const model of ['nominal', 'design'] as const) {
    const phi = model === 'design' ? 0.9 : 1;
    it(`the ${model} family's contour at that level passes through the hand point at ψ = 45°: mx = my = ${phi}·1856.83/(Ag·h)`, () => {
      const level = (phi * 22.36707) / (basis.normalisingStress * Ag);
      const f = computeBiaxialFamily({ basis, shape: square, arrangement: { kind: 'four-faces', barsPerFace: 2 }, gamma: 0.75, rhos: [0.01], levels: [level], model });
      const c = f.contours[0]![0]!;
      const j = c.angleDeg.indexOf(45);
      expectClose(c.mx[j]!, (phi * 1856.83) / (Ag * h), 1e-5);
      expectClose(c.my[j]!, (phi * 1856.83) / (Ag * h), 1e-5);
    });
  }
});
