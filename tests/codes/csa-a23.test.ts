import { describe, expect, it } from 'vitest';
import { computeFamily, type CurveFamily, type KeyPoint } from '../../src/analysis/index.js';
import { csaAlpha1, csaBeta1, csaCapRatio, resolveBasis, type Basis, type Transverse } from '../../src/codes/index.js';
import { PmError } from '../../src/errors.js';
import { barSet, findBar } from '../../src/section/bar-tables.js';
import { expectClose } from '../helpers/tolerance.js';

const csa = (fc: number, fy: number, transverse: Transverse = 'tied'): Basis =>
  resolveBasis('csa-a23.3-19', { units: 'si', fc, fy, transverse });

/** 400 × 400 mm, 2 bars per face on two faces, bar centres 60 mm from the faces (γ = 0.70). */
function column(basis: Basis, rho: number, depth: number | undefined = 400): CurveFamily {
  return computeFamily({
    basis,
    shape: { kind: 'rectangle', b: 400, h: 400 },
    arrangement: { kind: 'two-faces', barsPerFace: 2 },
    gamma: 0.7,
    rhos: [rho],
    capContext: depth === undefined ? {} : { depth },
  });
}
const key = (f: CurveFamily, id: string): KeyPoint => f.curves[0]!.keyPoints.find((k) => k.id === id)!;
const Ag = 400 * 400;

describe('CSA A23.3-19 column 400 × 400 mm, f′c = 35 MPa, fy = 400 MPa, Ast = 4000 mm² (source: hand calculation from the CSA A23.3-19 10.1.7 and 10.10.4 formulas)', () => {
  const basis = csa(35, 400);
  const rho = 4000 / Ag; // 0.025

  it('α1 = 0.85 − 0.0015·35 = 0.7975 and β1 = 0.97 − 0.0025·35 = 0.8825 (10.1.7)', () => {
    expectClose(basis.parameters['α1'] as number, 0.7975, 1e-12);
    expectClose(basis.parameters['β1'] as number, 0.8825, 1e-12);
  });

  it('Pro = α1·φc·f′c·(Ag − Ast) + φs·fy·Ast = 4190.3 kN', () => {
    // 0.7975·0.65·35 = 18.143125 MPa; ·(160 000 − 4000) = 2 830 327.5 N
    // 0.85·400·4000 = 1 360 000 N; Pro = 4 190 327.5 N
    const f = column(basis, rho);
    expectClose(f.section.squash('design', rho) * Ag, 4_190_327.5, 1e-9);
    expectClose(key(f, 'pure-compression').design!.P * Ag, 4_190_327.5, 1e-6);
  });

  it('tied, h = 400 mm: Pr,max = min(0.2 + 0.002·400, 0.80)·Pro = 0.80·4190.3275 = 3352.262 kN', () => {
    const f = column(basis, rho, 400);
    expectClose(f.section.cap('design', rho) * Ag, 3_352_262, 1e-9);
    // the factored curve is cut at the cap
    expectClose(Math.max(...f.curves[0]!.phiPn) * Ag, 3_352_262, 1e-9);
    expectClose(key(f, 'axial-cap').design!.P * Ag, 3_352_262, 1e-9);
  });

  it('tied, h = 250 mm: Pr,max = (0.2 + 0.002·250)·Pro = 0.70·4190.3275 = 2933.229 kN', () => {
    const f = column(basis, rho, 250);
    expectClose(f.section.cap('design', rho) * Ag, 2_933_229.25, 1e-9);
  });

  it('tied, no size known: h ≥ 300 mm assumed, 0.80·Pro, and the notes say so', () => {
    const f = column(basis, rho, undefined);
    expectClose(f.section.cap('design', rho) * Ag, 3_352_262, 1e-9);
    expect(basis.notes.join(' ')).toContain('assume h ≥ 300 mm');
  });

  it('spiral: Pr,max = 0.90·Pro = 3771.295 kN', () => {
    const f = column(csa(35, 400, 'spiral'), rho);
    expectClose(f.section.cap('design', rho) * Ag, 3_771_294.75, 1e-9);
  });

  it('balanced point by hand: Pr = 1349.4 kN, Mr = 330.2 kN·m (10.1.3, 10.1.7, 8.4)', () => {
    // d = 340 mm, εy = 400/200 000 = 0.002, c = 340·0.0035/(0.0035 + 0.002) = 216.364 mm, a = β1·c = 190.941 mm
    // concrete: 18.143125·190.941·400 = 1 385 705.9 N at 200 − a/2 = 104.530 mm from the centroid
    // top bars: ε = 0.0035·(216.364 − 60)/216.364 = 0.002529 > εy → 2000·(0.85·400 − 18.143125) = 643 713.75 N (displaced concrete deducted)
    // bottom bars: −2000·0.85·400 = −680 000 N
    // Pr = 1 385 705.9 + 643 713.75 − 680 000 = 1 349 419.7 N
    // Mr = 1 385 705.9·104.530 + 643 713.75·140 + 680 000·140 = 330 167 134 N·mm
    const f = column(basis, rho);
    const b = key(f, 'balanced').design!;
    expectClose(b.cOverH * 400, 216.3636, 1e-6);
    expectClose(b.P * Ag, 1_349_419.66, 1e-6);
    expectClose(b.M * Ag * 400, 330_167_134, 1e-6);
    expect(b.phi).toBe(1);
  });

  it('nominal family: φc = φs = 1, Po = 0.7975·35·156 000 + 400·4000 = 5954.3 kN', () => {
    const f = column(basis, rho);
    expectClose(f.section.squash('nominal', rho) * Ag, 0.7975 * 35 * 156_000 + 400 * 4000, 1e-12);
  });
});

describe('CSA A23.3-19 parameters', () => {
  it('α1 and β1 never drop below 0.67 (10.1.7)', () => {
    expectClose(csaAlpha1(80), 0.73, 1e-12);
    expectClose(csaBeta1(80), 0.77, 1e-12);
    expect(csaAlpha1(150)).toBe(0.67);
    expect(csaBeta1(150)).toBe(0.67);
  });
  it('tied cap ratio rises with h up to 0.80 at h = 300 mm (10.10.4)', () => {
    expectClose(csaCapRatio('tied', 200), 0.6, 1e-12);
    expect(csaCapRatio('tied', 300)).toBe(0.8);
    expect(csaCapRatio('tied', 600)).toBe(0.8);
    expect(csaCapRatio('spiral', 200)).toBe(0.9);
  });
  it('steel limits 1–8 % of Ag (10.9.1, 10.9.2) and no minimum moment for short columns', () => {
    const b = csa(35, 400);
    expect(b.rhoLimits).toEqual({ min: 0.01, max: 0.08 });
    expect(b.steelAreaLimits(1e6, Ag)).toEqual({ min: 1600, max: 12_800 });
    expect(b.minimumMoment(1e6, 400)).toBe(0);
  });
  it('uses the CSA G30.18 bar set 10M–55M (nominal areas, from memory)', () => {
    const set = barSet(csa(35, 400).barSet);
    expect(set.sizes.map((s) => s.name)).toEqual(['10M', '15M', '20M', '25M', '30M', '35M', '45M', '55M']);
    expect(findBar(set, '25M')?.area).toBe(500);
    expect(findBar(set, '35')?.area).toBe(1000);
  });
  it('rejects US units and f′c outside 20–80 MPa with one-line errors', () => {
    expect(() => resolveBasis('csa-a23.3-19', { units: 'us', fc: 5, fy: 60, transverse: 'tied' })).toThrowError(PmError);
    expect(() => resolveBasis('csa-a23.3-19', { units: 'us', fc: 5, fy: 60, transverse: 'tied' })).toThrowError(/^units: us is not available/);
    expect(() => csa(90, 400)).toThrowError(/fc: 90 MPa is outside 20–80 MPa/);
  });
});

describe('CSA A23.3-19 cap with a known size (10.10.4, from memory)', () => {
  it('takes the least overall dimension: a 250 × 600 mm tied column gets (0.2 + 0.002·250) = 0.70', async () => {
    const { resolveSectionFlags } = await import('../../src/cli/section-flags.js');
    const s = resolveSectionFlags({ code: 'csa-a23.3-19', fc: '35', fy: '400', b: '250', h: '600', gamma: '0.8' });
    expectClose(s.basis.design.capFactor(s.capContext), 0.7, 1e-12);
  });
});
