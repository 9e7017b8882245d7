import { describe, expect, it } from 'vitest';
import { computeFamily, type CurveFamily, type KeyPoint } from '../../src/analysis/index.js';
import { ec2ConcreteParameters, ec2Profile, EN_1992_1_1, resolveBasis, type Basis, type BasisOptions } from '../../src/codes/index.js';
import { PmError } from '../../src/errors.js';
import { barSet } from '../../src/section/bar-tables.js';
import { expectClose } from '../helpers/tolerance.js';

const ec2 = (fck: number, options: BasisOptions = {}, fyk = 500): Basis =>
  resolveBasis('en1992-1-1', { units: 'si', fc: fck, fy: fyk, transverse: 'tied', options });

/** Two faces, γ = 0.80 (d2/h = 0.10), unit square; values come back divided by the basis's fcd. */
function family(basis: Basis, rhos: number[]): CurveFamily {
  return computeFamily({
    basis,
    shape: { kind: 'rectangle', b: 1, h: 1 },
    arrangement: { kind: 'two-faces', barsPerFace: 2 },
    gamma: 0.8,
    rhos,
  });
}
const key = (f: CurveFamily, j: number, id: string): KeyPoint => f.curves[j]!.keyPoints.find((k) => k.id === id)!;
/** ν, μ of the design family at neutral-axis depth x/h. */
function designAtDepth(f: CurveFamily, rho: number, xOverH: number): { nu: number; mu: number } {
  const r = f.section.respond(xOverH);
  const fcd = f.basis.normalisingStress;
  return { nu: (r[6]! + rho * r[8]!) / fcd, mu: (r[7]! + rho * r[9]!) / fcd };
}

describe('EN 1992-1-1 normalised points, C30/37, B500, γ = 0.80 (source: EN 1992-1-1:2004, first principles)', () => {
  // ρ, ν at pure compression, balanced ν/μ (parabola–rectangle), balanced ν/μ (block), x = h ν/μ (parabola–rectangle)
  const rows = [
    { rho: 0.01, nu0: 1.19, pr: [0.4444, 0.2059], rb: [0.4391, 0.2084], xh: [0.9291, 0.1031] },
    { rho: 0.02, nu0: 1.38, pr: [0.4394, 0.2908], rb: [0.4341, 0.2934], xh: [1.0487, 0.1383] },
    { rho: 0.04, nu0: 1.76, pr: [0.4294, 0.4608], rb: [0.4241, 0.4633], xh: [1.2879, 0.2085] },
  ];
  const rhos = rows.map((r) => r.rho);
  const pr = family(ec2(30), rhos);
  const rb = family(ec2(30, { concreteLaw: 'rectangular-block' }), rhos);

  it('uses fcd = 20 MPa and fyd = 434.8 MPa (3.1.6(1), 3.2.7(2))', () => {
    expectClose(pr.basis.normalisingStress, 20, 1e-12);
    expectClose(pr.basis.design.steel.yieldStress, 434.78, 1e-4);
  });

  rows.forEach((row, j) => {
    it(`ρ = ${row.rho}: pure compression is the uniform εc2 state, steel at 400 MPa (6.1, Fig. 6.1)`, () => {
      for (const f of [pr, rb]) expectClose(key(f, j, 'pure-compression').design!.P / 20, row.nu0, 1e-3);
    });
    it(`ρ = ${row.rho}: balanced point, parabola–rectangle`, () => {
      const b = key(pr, j, 'balanced').design!;
      expectClose(b.cOverH, 0.5552, 0, 0.0005);
      expectClose(b.P / 20, row.pr[0]!, 1e-3);
      expectClose(b.M / 20, row.pr[1]!, 1e-3);
    });
    it(`ρ = ${row.rho}: balanced point, rectangular block`, () => {
      const b = key(rb, j, 'balanced').design!;
      expectClose(b.cOverH, 0.5552, 0, 0.0005);
      expectClose(b.P / 20, row.rb[0]!, 1e-3);
      expectClose(b.M / 20, row.rb[1]!, 1e-3);
    });
    it(`ρ = ${row.rho}: x = h, parabola–rectangle`, () => {
      const p = designAtDepth(pr, row.rho, 1);
      expectClose(p.nu, row.xh[0]!, 1e-3);
      expectClose(p.mu, row.xh[1]!, 1e-3);
    });
  });

  it('has no axial cap and no strain-dependent factor', () => {
    expect(pr.basis.design.capFactor({})).toBe(Infinity);
    expect(pr.basis.design.factor(0.01)).toBe(1);
    expect(key(pr, 0, 'axial-cap')).toBeUndefined();
  });
});

describe('EN 1992-1-1 hand-calculated points', () => {
  it('x = h, ρ = 0, parabola–rectangle: ν = 17/21, μ = 17/21·(1/2 − 99/238) (3.1.7(1) integrated by hand)', () => {
    // Parabola–rectangle with n = 2 over the full depth (εcu2 = 3.5 ‰ at the top, 0 at the bottom):
    // mean stress 17/21·fcd, resultant 99/238·x below the top, so μ = 0.809524·0.084034 = 0.068027.
    const p = designAtDepth(family(ec2(30), [0]), 0, 1);
    expectClose(p.nu, 17 / 21, 1e-6);
    expectClose(p.mu, (17 / 21) * (0.5 - 99 / 238), 1e-6);
  });

  it('x = h, ρ = 0, rectangular block: ν = λ = 0.8, μ = 0.8·(0.5 − 0.4) = 0.08 (3.1.7(3))', () => {
    const p = designAtDepth(family(ec2(30, { concreteLaw: 'rectangular-block' }), [0]), 0, 1);
    expectClose(p.nu, 0.8, 1e-9);
    expectClose(p.mu, 0.08, 1e-9);
  });

  it('C90/105 pure compression: εc2 = 2.6 ‰ strains B500 past εyd, so σs = fyd (Table 3.1, Fig. 6.1)', () => {
    // εc2 = 2.0 + 0.085·40^0.53 = 2.6005 ‰ > εyd = 2.174 ‰; fcd = 90/1.5 = 60 MPa.
    // ν = (1 − 0.02)·1 + 0.02·434.783/60 = 0.98 + 0.144928 = 1.124928
    const f = family(ec2(90), [0.02]);
    expectClose(f.basis.normalisingStress, 60, 1e-12);
    expectClose(key(f, 0, 'pure-compression').design!.P / 60, 1.124928, 1e-5);
  });

  it('pivots about εc2 at (1 − εc2/εcu2)·h once x > h (6.1(5), Fig. 6.1)', () => {
    const lim = { epsC2: 0.002, epsCu2: 0.0035, epsUd: Infinity };
    // x = 2h: pivot at 3/7·h, κ = 0.002/(2 − 3/7) = 0.00127273, top strain κ·2 = 0.00254545
    const p = ec2Profile(2, 1, lim);
    expectClose(p.curvature, 0.002 / (2 - 3 / 7), 1e-12);
    expectClose(p.top, (2 * 0.002) / (2 - 3 / 7), 1e-12); // 0.00254545
    expectClose(p.top - p.curvature * (3 / 7), 0.002, 1e-12);
    // continuous at x = h and uniform εc2 at x = ∞
    const atH = ec2Profile(1, 1, lim);
    expectClose(atH.top, 0.0035, 1e-12);
    expectClose(ec2Profile(1 + 1e-9, 1, lim).top, 0.0035, 1e-6);
    expect(ec2Profile(Infinity, 1, lim)).toEqual({ top: 0.002, curvature: 0 });
  });

  it('inclined branch: tension steel held at εud = 0.9·εuk (pivot A), pure tension at σs(εud) (3.2.7(2)a, Fig. 6.1)', () => {
    // Class B defaults k = 1.08, εuk = 5 % (Annex C Table C.1), εud = 4.5 %.
    // σs(εud) = fyd·[1 + (k − 1)·(εud − εyd)/(εuk − εyd)] = 434.783·[1 + 0.08·0.042826/0.047826] = 465.929 MPa
    const basis = ec2(30, { steelBranch: 'inclined' });
    expectClose(basis.design.steel.stress(0.045), 465.929, 1e-5);
    expectClose(basis.design.steel.stress(-0.045), -465.929, 1e-5);
    const f = family(basis, [0.02]);
    // pure tension: ν = −0.02·465.929/20 = −0.465929
    expectClose(key(f, 0, 'pure-tension').design!.P / 20, -0.465929, 1e-3);
    // region 2 of Fig. 6.1: below x = 0.9h·3.5/(3.5 + 45) = 0.0649h the bar at d = 0.9h sits at εud, the face below εcu2
    const p = basis.profile(0.05, 1, 0.9);
    expectClose(p.top - p.curvature * 0.9, -0.045, 1e-9);
    expect(p.top).toBeLessThan(0.0035);
    // and the sweep never strains the tension bar past εud
    for (const c of f.sweep.cOverH) expect(basis.profile(c, 1, 0.9).curvature * 0.9 - basis.profile(c, 1, 0.9).top).toBeLessThanOrEqual(0.045 + 1e-12);
  });

  it('horizontal branch (default) sets no steel strain limit (3.2.7(2)b)', () => {
    const p = ec2(30).profile(0.05, 1, 0.9);
    expect(p.top).toBe(0.0035);
  });
});

describe('EN 1992-1-1 Table 3.1 and 3.1.7(3) parameters', () => {
  // Tabulated values of EN 1992-1-1:2004 Table 3.1 (from memory), to the table's rounding: εc2 ‰, εcu2 ‰, n.
  const table: [number, number, number, number][] = [
    [50, 2.0, 3.5, 2.0],
    [55, 2.2, 3.1, 1.75],
    [60, 2.3, 2.9, 1.6],
    [70, 2.4, 2.7, 1.45],
    [80, 2.5, 2.6, 1.4],
    [90, 2.6, 2.6, 1.4],
  ];
  for (const [fck, ec2v, ecu2, n] of table) {
    it(`C${fck}: εc2 = ${ec2v} ‰, εcu2 = ${ecu2} ‰, n = ${n}`, () => {
      const t = ec2ConcreteParameters(fck);
      expectClose(t.epsC2 * 1000, ec2v, 0, 0.05);
      expectClose(t.epsCu2 * 1000, ecu2, 0, 0.05);
      expectClose(t.n, n, 0, 0.026);
      expect(t.epsCu3).toBe(t.epsCu2);
    });
  }

  it('λ and η follow Eq. 3.19–3.22: C90 gives λ = 0.7, η = 0.8', () => {
    const t = ec2ConcreteParameters(90);
    expectClose(t.lambda, 0.7, 1e-12);
    expectClose(t.eta, 0.8, 1e-12);
  });

  it('is continuous at fck = 50 (property; the fck > 50 formulas give 3.496 ‰ and n = 1.999 there)', () => {
    const below = ec2ConcreteParameters(50);
    const above = ec2ConcreteParameters(50 + 1e-9);
    expectClose(above.epsC2, below.epsC2, 1e-6);
    expectClose(above.epsCu2, below.epsCu2, 2e-3); // Table 3.1's own rounding: 3.496 vs 3.5
    expectClose(above.n, below.n, 2e-3);
    expectClose(above.lambda, below.lambda, 1e-9);
    expectClose(above.eta, below.eta, 1e-9);
    expectClose(above.epsC3, below.epsC3, 1e-9);
  });

  it('changes monotonically across C50–C90 (property)', () => {
    let prev = ec2ConcreteParameters(50);
    for (let fck = 51; fck <= 90; fck++) {
      const t = ec2ConcreteParameters(fck);
      expect(t.epsC2).toBeGreaterThan(prev.epsC2);
      expect(t.epsCu2).toBeLessThan(prev.epsCu2);
      expect(t.n).toBeLessThan(prev.n);
      expect(t.lambda).toBeLessThan(prev.lambda);
      prev = t;
    }
  });
});

describe('EN 1992-1-1 rectangular block against parabola–rectangle (property)', () => {
  for (const fck of [20, 30, 40, 50]) {
    it(`C${fck}: balanced ν and μ within 3 % for ρ = 0.01–0.04`, () => {
      const rhos = [0.01, 0.02, 0.04];
      const a = family(ec2(fck), rhos);
      const b = family(ec2(fck, { concreteLaw: 'rectangular-block' }), rhos);
      rhos.forEach((_, j) => {
        const pa = key(a, j, 'balanced').design!;
        const pb = key(b, j, 'balanced').design!;
        expectClose(pb.P, pa.P, 0.03);
        expectClose(pb.M, pa.M, 0.03);
      });
    });
  }
});

describe('EN 1992-1-1 check rules', () => {
  const basis = ec2(30);
  it('As,min = max(0.10·NEd/fyd, 0.002·Ac), As,max = 0.04·Ac (9.5.2(2), (3))', () => {
    // 400 × 400 mm, NEd = 2000 kN: 0.10·2 000 000/434.783 = 460.0 mm² > 0.002·160 000 = 320 mm²
    const a = basis.steelAreaLimits(2_000_000, 160_000);
    expectClose(a.min, 460, 1e-9);
    expectClose(a.max, 6400, 1e-12);
    // NEd = 500 kN: 115 mm² < 320 mm²
    expectClose(basis.steelAreaLimits(500_000, 160_000).min, 320, 1e-12);
  });
  it('minimum moment NEd·e0 with e0 = max(h/30, 20 mm) (6.1(4))', () => {
    expectClose(basis.minimumMoment(2_000_000, 400), 2_000_000 * 20, 1e-12); // h/30 = 13.3 mm < 20 mm
    expectClose(basis.minimumMoment(2_000_000, 900), 2_000_000 * 30, 1e-12); // h/30 = 30 mm
    expect(basis.minimumMoment(-100_000, 900)).toBe(0);
  });
  it('offers the common European diameters 12–40 mm', () => {
    expect(basis.barSet).toBe('en-common');
    const set = barSet('en-common');
    expect(set.sizes.map((s) => s.diameter)).toEqual([12, 14, 16, 20, 25, 28, 32, 40]);
    expectClose(set.sizes.find((s) => s.diameter === 20)!.area, 314.2, 1e-9);
  });
  it('classifies by whether the tension steel has yielded', () => {
    expect(basis.classify(0.002)).toBe('compression-controlled');
    expect(basis.classify(0.0022)).toBe('tension-controlled');
    expect(basis.strainStates.map((s) => s.id)).toEqual(['decompression', 'balanced']);
  });
});

describe('EN 1992-1-1 parameters and input', () => {
  it('prints non-recommended partial factors in notes and parameters', () => {
    const b = ec2(30, { alphaCc: 0.85, gammaC: 1.5, gammaS: 1.15 });
    expectClose(b.normalisingStress, 17, 1e-12);
    expect(b.parameters['αcc']).toBe(0.85);
    expect(b.notes.join(' ')).toContain('αcc = 0.85');
    expect(ec2(30).notes.join(' ')).toContain('Recommended partial factors');
  });
  it('rejects US units with a one-line PmError naming the field key units (the CLI shows --units)', () => {
    expect(() => resolveBasis('en1992-1-1', { units: 'us', fc: 4, fy: 60, transverse: 'tied' })).toThrowError(PmError);
    expect(() => resolveBasis('en1992-1-1', { units: 'us', fc: 4, fy: 60, transverse: 'tied' })).toThrowError(/^units: us is not available for EN 1992-1-1:2004 \(allowed: si\)$/);
    expect(() => EN_1992_1_1.resolve({ units: 'us', fc: 30, fy: 500, transverse: 'tied' })).toThrowError(/^units: /);
  });
  it('rejects fck outside C12–C90 and αcc outside 0.8–1.0', () => {
    expect(() => ec2(100)).toThrowError(/fc: 100 MPa is outside 12–90 MPa/);
    expect(() => ec2(30, { alphaCc: 0.7 })).toThrowError(/^alphaCc: 0.7 is outside 0.8–1/);
  });
});

describe('EN 1992-1-1 class names and lap zones (issue 13)', () => {
  it('"C50/60" is fck = 50 MPa and "C70/85" 70 MPa (Table 3.1); "B500B" is fyk = 500 MPa', async () => {
    const { parseStrength } = await import('../../src/codes/registry.js');
    expect(parseStrength(EN_1992_1_1, 'C50/60', 'concrete', 'si', '--fc')).toBe(50);
    expect(parseStrength(EN_1992_1_1, 'c70/85', 'concrete', 'si', '--fc')).toBe(70);
    expect(parseStrength(EN_1992_1_1, 'B500B', 'steel', 'si', '--fy')).toBe(500);
    expect(parseStrength(EN_1992_1_1, '45MPa', 'concrete', 'si', '--fc')).toBe(45);
    // a pair Table 3.1 does not list is refused, naming the path
    expect(() => parseStrength(EN_1992_1_1, 'C33/40', 'concrete', 'si', 'sheets[0].fc')).toThrow(/sheets\[0\]\.fc: C33\/40 is not a strength class/);
  });
  it('9.5.2(3): a lap zone raises As,max to 0.08·Ac (recommended); outside laps 0.04·Ac', () => {
    const outside = resolveBasis('en1992-1-1', { units: 'si', fc: 30, fy: 500, transverse: 'tied' });
    const lap = resolveBasis('en1992-1-1', { units: 'si', fc: 30, fy: 500, transverse: 'tied', options: { lapZoneRhoMax: 0.08 } });
    expect(outside.rhoLimits.max).toBe(0.04);
    expect(lap.rhoLimits.max).toBe(0.08);
    expect(lap.steelAreaLimits(0, 160_000).max).toBeCloseTo(12_800, 9);
    expect(() => resolveBasis('en1992-1-1', { units: 'si', fc: 30, fy: 500, transverse: 'tied', options: { lapZoneRhoMax: 0.1 } })).toThrow(/^lapZoneRhoMax: /);
  });
});
