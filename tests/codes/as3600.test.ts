/**
 * AS 3600-2018 basis: hand-worked points and an independent strip-loop strain-compatibility evaluation.
 * Formulas from memory of AS 3600-2018 (8.1.3 stress block, 10.6.2.2 squash load, 10.6.2.3 straight
 * line from decompression to squash, Table 2.2.2 φ for Class N bars); each check names the clause.
 */
import { describe, expect, it } from 'vitest';
import { computeFamily, type CurveFamily, type KeyPoint } from '../../src/analysis/index.js';
import { asAlpha1, asAlpha2, asBlockDepthFactor, asPhi, resolveBasis, type Basis } from '../../src/codes/index.js';
import { PmError } from '../../src/errors.js';
import { barSet, findBar } from '../../src/section/bar-tables.js';
import type { Arrangement } from '../../src/section/types.js';
import { expectClose } from '../helpers/tolerance.js';

const as = (fc: number, fsy = 500): Basis => resolveBasis('as3600-2018', { units: 'si', fc, fy: fsy, transverse: 'tied' });

// 400 × 600 mm, bars on two faces at γ = 0.8 (centres 0.1·D from each face), ρ = 0.02, f′c = 40 MPa, fsy = 500 MPa.
// Normalised: P/(b·D) in MPa, M/(b·D²) in MPa.
const family = (basis: Basis, rhos: number[], arrangement: Arrangement = { kind: 'two-faces', barsPerFace: 2 }, gamma = 0.8): CurveFamily =>
  computeFamily({ basis, shape: { kind: 'rectangle', b: 400, h: 600 }, arrangement, gamma, rhos });
const key = (f: CurveFamily, id: string, j = 0): KeyPoint => f.curves[j]!.keyPoints.find((k) => k.id === id)!;

describe('AS 3600-2018 parameters (8.1.3, 10.6.2.2, from memory)', () => {
  it('α2 = 0.85 − 0.0015·f′c and γ₂ = 0.97 − 0.0025·f′c within 0.67–0.85; α1 = 1.0 − 0.003·f′c within 0.72–0.85', () => {
    expectClose(asAlpha2(40), 0.79, 1e-12);
    expectClose(asAlpha2(20), 0.82, 1e-12);
    expectClose(asAlpha2(150), 0.67, 1e-12);
    expectClose(asBlockDepthFactor(40), 0.85, 1e-12); // 0.87 capped at 0.85
    expectClose(asBlockDepthFactor(80), 0.77, 1e-12);
    expectClose(asBlockDepthFactor(120), 0.67, 1e-12);
    expectClose(asAlpha1(40), 0.85, 1e-12); // 0.88 capped
    expectClose(asAlpha1(80), 0.76, 1e-12);
    expectClose(asAlpha1(100), 0.72, 1e-12);
  });
  it('the stress-block depth factor is labelled γ₂, never plain γ', () => {
    const b = as(40);
    expect(Object.keys(b.parameters)).toContain('γ₂ (block depth)');
    expect(Object.keys(b.parameters)).not.toContain('γ');
  });
  it('SI only; f′c outside 20–100 MPa and fsy above 500 MPa are refused', () => {
    expect(() => resolveBasis('as3600-2018', { units: 'us', fc: 4, fy: 60, transverse: 'tied' })).toThrow(PmError);
    expect(() => as(110)).toThrow(/^fc: /);
    expect(() => as(40, 550)).toThrow(/^fy: /);
  });
});

describe('AS 3600-2018 hand-worked points, 400 × 600, f′c = 40, fsy = 500, ρ = 0.02, γ = 0.8', () => {
  const basis = as(40);
  const f = family(basis, [0.02]);

  it('squash load (10.6.2.2): Nuo/(b·D) = 0.85·40·0.98 + 500·0.02 = 43.32 MPa; φNuo = 0.65·Nuo = 28.158', () => {
    const k = key(f, 'pure-compression');
    expectClose(k.nominal!.P, 43.32, 1e-9);
    expectClose(k.design!.P, 0.65 * 43.32, 1e-9);
    // 10.6.2.3: the curve's end is Nuo itself (straight line from decompression), not α2·f′c
    const n = f.curves[0]!.Pn.length;
    expectClose(f.curves[0]!.Pn[n - 1]!, 43.32, 1e-4);
  });

  it('balanced point kuo = 0.003/(0.003 + 0.0025) = 0.54545 (Table 2.2.2 transition, εsy = 500/200,000)', () => {
    // c = 0.54545·0.9·D = 0.490909·D; a = γ₂·c = 0.85·0.490909 = 0.417273·D
    // concrete 0.79·40·0.417273 = 13.18582; top steel ε = 0.003·(0.390909/0.490909) = 0.0023889 → 477.78 MPa,
    // inside the block: (477.78 − 31.6)·0.01 = 4.46178; bottom steel −500·0.01 = −5.0
    // P = 13.18582 + 4.46178 − 5.0 = 12.64760; M = 13.18582·(0.5 − 0.208636) + 4.46178·0.4 + 5.0·0.4 = 7.62658
    // φ = 1.24 − 13·0.54545/12 = 0.64909 → 0.65
    const k = key(f, 'balanced');
    expectClose(k.nominal!.cOverH, 0.490909, 1e-5);
    expectClose(k.nominal!.P, 12.64760, 1e-5);
    expectClose(k.nominal!.M, 7.62658, 1e-5);
    expectClose(k.design!.phi, 0.65, 1e-9);
  });

  it('pure bending of the doubly reinforced section (top bars in compression, elastic, inside the block)', () => {
    // equilibrium: 0.79·40·0.85·c + 0.01·(600·(c − 0.1)/c − 31.6) − 0.01·500 = 0
    //   → 26.86·c² + 0.684·c − 0.6 = 0 → c = 0.137268·D (kuo = 0.152520 < 0.36, φ = 0.85)
    // Cc = 26.86·0.137268 = 3.68702; σs' = 600 − 60/0.137268 − 31.6 = 131.298 MPa
    // M = 3.68702·(0.5 − 0.85·0.137268/2) + 1.31298·0.4 + 5.0·0.4 = 4.15361; φMu = 0.85·4.15361 = 3.53057
    const k = key(f, 'pure-bending');
    expectClose(k.nominal!.cOverH, 0.137268, 1e-5);
    expectClose(k.nominal!.M, 4.15361, 1e-5);
    expectClose(k.design!.phi, 0.85, 1e-9);
    expectClose(k.design!.M, 0.85 * 4.15361, 1e-5);
  });

  it('φ in the transition (Table 2.2.2): kuo = 0.45 → φ = 1.24 − 13·0.45/12 = 0.7525; ends 0.85 and 0.65', () => {
    expectClose(asPhi(0.45), 0.7525, 1e-12);
    expectClose(asPhi(0.3), 0.85, 1e-12);
    expectClose(asPhi(0.6), 0.65, 1e-12);
    // through the basis: εt at kuo = 0.45 is 0.003·(1/0.45 − 1) = 0.0036667
    expectClose(basis.design.factor(0.003 * (1 / 0.45 - 1)), 0.7525, 1e-12);
    expectClose(basis.design.factor(-0.001), 0.65, 1e-12);
  });

  it('minimum eccentricity 0.05·D (10.1.2) and steel limits 1–4 % (10.7.1)', () => {
    expectClose(basis.minimumMoment(1e6, 600), 1e6 * 30, 1e-12);
    expect(basis.rhoLimits).toEqual({ min: 0.01, max: 0.04 });
  });
});

/**
 * Independent strain-compatibility evaluation (plain strip loop, written for this test): concrete in
 * 4000 strips under the α2·f′c block over γ₂·c, bars with displaced concrete deducted, the straight line
 * to Nuo beyond the decompression point, and φ from kuo. Compared with the whole family within 0.1 % of Nuo.
 */
function stripLoop(fc: number, fsy: number, rho: number, bars: { d: number; share: number }[], cOverH: number, bOverH: number) {
  const a2 = Math.min(0.85, Math.max(0.67, 0.85 - 0.0015 * fc));
  const g2 = Math.min(0.85, Math.max(0.67, 0.97 - 0.0025 * fc));
  const a1 = Math.min(0.85, Math.max(0.72, 1 - 0.003 * fc));
  const dO = Math.max(...bars.map((b) => b.d));
  const area = bOverH;
  const at = (c: number) => {
    let P = 0;
    let M = 0;
    const n = 4000;
    for (let i = 0; i < n; i++) {
      const y = (i + 0.5) / n; // depth from the compression face
      if (y <= g2 * c) {
        const F = a2 * fc * bOverH / n;
        P += F;
        M += F * (0.5 - y);
      }
    }
    for (const b of bars) {
      const eps = (0.003 * (c - b.d)) / c;
      let s = Math.max(-fsy, Math.min(fsy, 200_000 * eps));
      if (b.d <= g2 * c && eps > 0) s -= a2 * fc;
      const F = s * rho * area * b.share;
      P += F;
      M += F * (0.5 - b.d);
    }
    return { P: P / area, M: M / area };
  };
  const Nuo = a1 * fc * (1 - rho) + fsy * rho;
  let P: number;
  let M: number;
  if (cOverH > dO) {
    const dec = at(dO);
    const t = 1 - dO / cOverH;
    P = (1 - t) * dec.P + t * Nuo;
    M = (1 - t) * dec.M;
  } else ({ P, M } = at(cOverH));
  const kuo = cOverH / dO;
  const phi = Math.min(0.85, Math.max(0.65, 1.24 - (13 * kuo) / 12));
  return { P, M, phi, Nuo };
}

describe('AS 3600-2018 whole curves against an independent strip loop (within 0.1 % of Nuo)', () => {
  const cases = [
    { fc: 40, rho: 0.02, arrangement: { kind: 'two-faces', barsPerFace: 2 } as Arrangement, bars: [{ d: 0.1, share: 0.5 }, { d: 0.9, share: 0.5 }] },
    { fc: 65, rho: 0.035, arrangement: { kind: 'two-faces', barsPerFace: 3 } as Arrangement, bars: [{ d: 0.1, share: 0.5 }, { d: 0.9, share: 0.5 }] },
    // four faces, 3 per face: rows at 0.1 (3 bars), 0.5 (2 bars), 0.9 (3 bars) of 8
    { fc: 32, rho: 0.015, arrangement: { kind: 'four-faces', barsPerFace: 3 } as Arrangement, bars: [{ d: 0.1, share: 3 / 8 }, { d: 0.5, share: 2 / 8 }, { d: 0.9, share: 3 / 8 }] },
  ];
  for (const cs of cases) {
    it(`f′c = ${cs.fc}, ρ = ${cs.rho}, ${cs.arrangement.kind}`, () => {
      const f = family(as(cs.fc), [cs.rho], cs.arrangement);
      const curve = f.curves[0]!;
      const c = f.sweep.cOverH;
      let checked = 0;
      for (let i = 0; i < c.length; i += 7) {
        const ref = stripLoop(cs.fc, 500, cs.rho, cs.bars, c[i]!, 400 / 600);
        const tol = 0.001 * ref.Nuo;
        expectClose(curve.Pn[i]!, ref.P, 0, tol);
        expectClose(curve.Mn[i]!, ref.M, 0, tol);
        expectClose(curve.phiPn[i]!, ref.phi * ref.P, 0, tol);
        expectClose(curve.phiMn[i]!, ref.phi * ref.M, 0, tol);
        checked++;
      }
      expect(checked).toBeGreaterThan(40);
    });
  }
});

describe('AS/NZS 4671 D500N bars (from memory of the standard table)', () => {
  it('N12 110, N16 200, N20 310, N24 450, N28 620, N32 800, N36 1020, N40 1260 mm²', () => {
    const set = barSet(as(40).barSet);
    const want: [string, number][] = [['N12', 110], ['N16', 200], ['N20', 310], ['N24', 450], ['N28', 620], ['N32', 800], ['N36', 1020], ['N40', 1260]];
    expect(set.sizes.map((s) => s.name)).toEqual(want.map((w) => w[0]));
    for (const [name, area] of want) expect(findBar(set, name)!.area).toBe(area);
  });
});
