/**
 * The fast exact biaxial search (issue 21) against the reference search it replaced, over 10,000 random
 * loads on random sections of every design basis: the fast path integrates the concrete with as few
 * Gauss–Legendre points as are exact for the law's polynomial degree (2 for a rectangular block, 3 for the
 * parabola with n = 2; Abramowitz & Stegun 25.4.29: m points are exact to degree 2m − 1) and sorts its
 * cut depths by insertion; the reference keeps 10 points per piece. The rule of the issue: the fast
 * utilisation is never lower than the reference one (fast ≥ exact − 1e-9), and agrees within 0.1 % on at
 * least 99 % of the cases. Outside values for the surface itself are in biaxial.test.ts (hand sums), which
 * runs on the fast path.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { biaxialResultant, capacityAlongRay, prepareBiaxial } from '../../src/analysis/biaxial.js';
import { gaussLegendre } from '../../src/analysis/gauss.js';
import { DESIGN_CODE_LIST } from '../../src/codes/registry.js';
import type { Basis } from '../../src/codes/types.js';
import { rectangularBlock } from '../../src/materials/rectangular-block.js';
import { parabolaRectangle } from '../../src/materials/parabola-rectangle.js';
import { layoutBars } from '../../src/section/arrangements.js';
import type { Arrangement, Shape } from '../../src/section/types.js';

/** Every basis in the registry at a low and a high concrete strength (the EN parabola's n is whole only up to 50 MPa). */
const bases: Basis[] = DESIGN_CODE_LIST.flatMap((code) => {
  const units = code.unitSystems.includes('us') ? 'us' : 'si';
  const lim = code.limits(units);
  const fyMax = Math.min(lim.fy[1], code.yieldLimit?.(units, 'gravity').max ?? Infinity);
  const fy = lim.fy[0] + 0.5 * (fyMax - lim.fy[0]);
  return [0.15, 0.85].map((t) => code.resolve({ units, fc: lim.fc[0] + t * (lim.fc[1] - lim.fc[0]), fy, transverse: 'tied' }));
});

const arrangements: Arrangement[] = [
  { kind: 'two-faces', barsPerFace: 3 },
  { kind: 'four-faces', barsPerFace: 3 },
  { kind: 'four-faces', barsPerFace: [2, 5] },
  { kind: 'side-faces', barsPerFace: 4 },
];

describe('the law degrees the fast integration relies on', () => {
  it('a rectangular block is constant and a parabola with n = 2 a quadratic between breakpoints; n = 1.75 is no polynomial (EN 1992-1-1 3.1.7 Eq. 3.17)', () => {
    expect(rectangularBlock(0.85 * 4, 0.85, 0.003).polynomialDegree).toBe(0);
    expect(parabolaRectangle(20, 0.002, 2).polynomialDegree).toBe(2);
    expect(parabolaRectangle(40, 0.0022, 1.75).polynomialDegree).toBeUndefined();
  });
  it('3 Gauss–Legendre points integrate a degree-5 polynomial exactly: ∫₋₁¹ (x⁵ + x⁴ + 1) dx = 2/5 + 2 = 2.4 (hand integration)', () => {
    const { nodes, weights } = gaussLegendre(3);
    let s = 0;
    for (let i = 0; i < 3; i++) s += weights[i]! * (nodes[i]! ** 5 + nodes[i]! ** 4 + 1);
    expect(Math.abs(s - 2.4)).toBeLessThan(1e-14);
  });
});

describe('fast exact biaxial search against the reference search', () => {
  it('a resultant at an inclined neutral axis is the same with 2 and 10 Gauss points on a rectangular block (both exact)', () => {
    const basis = bases[0]!;
    const shape: Shape = { kind: 'rectangle', b: 16, h: 24 };
    const bars = layoutBars(shape, { kind: 'four-faces', barsPerFace: 4 }, 0.025 * 16 * 24, { gamma: 0.8 });
    const fast = biaxialResultant(prepareBiaxial(basis, shape, bars), 0.7, 11);
    const ref = biaxialResultant(prepareBiaxial(basis, shape, bars, {}, { reference: true }), 0.7, 11);
    for (const k of ['P', 'Mx', 'My'] as const) expect(Math.abs(fast[k] - ref[k])).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(ref[k])));
  });

  it('10,000 random loads: the fast utilisation is never lower (≥ exact − 1e-9) and agrees within 0.1 % on ≥ 99 %', () => {
    let cases = 0;
    let outside = 0;
    let lower = 0;
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: bases.length - 1 }),
        fc.integer({ min: 0, max: arrangements.length - 1 }),
        fc.double({ min: 0.5, max: 2, noNaN: true }), // b/h
        fc.double({ min: 0.01, max: 0.06, noNaN: true }), // ρg
        fc.double({ min: 0.6, max: 0.9, noNaN: true }), // γ
        fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }), // moment direction
        fc.double({ min: -0.2, max: 0.9, noNaN: true }), // Pu ÷ squash load
        fc.double({ min: 0.01, max: 0.4, noNaN: true }), // |Mu| ÷ (squash load · h)
        (bi, ai, aspect, rho, gamma, psi, pRatio, mRatio) => {
          const basis = bases[bi]!;
          const h = basis.units === 'us' ? 24 : 600;
          const shape: Shape = { kind: 'rectangle', b: aspect * h, h };
          const bars = layoutBars(shape, arrangements[ai]!, rho * shape.b * h, { gamma });
          const fast = prepareBiaxial(basis, shape, bars);
          const ref = prepareBiaxial(basis, shape, bars, {}, { reference: true });
          const po = fast.squash.design;
          const Pu = pRatio * po;
          const Mu = mRatio * po * h;
          const uf = capacityAlongRay(fast, Pu, Mu * Math.cos(psi), Mu * Math.sin(psi)).utilisation;
          const ur = capacityAlongRay(ref, Pu, Mu * Math.cos(psi), Mu * Math.sin(psi)).utilisation;
          cases++;
          if (uf < ur - 1e-9) lower++;
          if (Math.abs(uf - ur) > 1e-3 * Math.abs(ur)) outside++;
          if (Math.abs(uf - ur) > 1e-3 * Math.abs(ur) || uf < ur - 1e-9) console.log('fast-vs-reference', JSON.stringify({ code: basis.code, ai, aspect, rho, gamma, psi, pRatio, mRatio, uf, ur }));
          expect(uf).toBeGreaterThanOrEqual(ur - 1e-9);
        },
      ),
      { numRuns: 10_000 },
    );
    expect(cases).toBe(10_000);
    expect(lower).toBe(0);
    expect(outside).toBeLessThanOrEqual(100);
  }, 600_000);
});
