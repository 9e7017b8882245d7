/**
 * `pmchart check` with EN 1992-1-1 and CSA A23.3-19 end to end (runCheck, no parser, and the CLI in-process).
 * Every expected number is worked by hand below from the clause it cites.
 */
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCheck, type CheckOptions } from '../../src/cli/check.js';
import { cli as inProcess } from '../helpers/run-cli.js';

const en: CheckOptions = { code: 'en1992-1-1', fc: '30', fy: '500', arrangement: 'four-faces', barsPerFace: '3', gamma: '0.8', json: true };

describe('check --code en1992-1-1', () => {
  // 750 × 750 mm, NEd = 8000 kN, MEd = 0 (hand-worked):
  //   6.1(4): e0 = max(h/30, 20 mm) = max(25, 20) = 25 mm → MEd,min = 8000 kN · 0.025 m = 200 kN·m
  //           normalised M = 200e6 N·mm / (750 · 750²) = 0.474074 MPa; P = 8e6 / 562 500 = 14.2222 MPa
  //   9.5.2(2): fyd = 500/1.15 = 434.783 MPa; 0.10·NEd/fyd = 8e6·0.1/434.783 = 1840.0 mm² > 0.002·Ac = 1125 mm²
  //           → ρmin = 1840.0/562 500 = 0.0032711. Concrete alone carries the load here (ν = 14.22/20 = 0.711
  //           at e/h = 0.033, against ν = 1 at pure compression), so the minimum governs.
  const out = JSON.parse(runCheck({ ...en, b: '750', h: '750', pu: '8000kN', mu: '0' }));
  const r = out.results[0];

  it('raises MEd to NEd·e0 with e0 = h/30 when h/30 > 20 mm (6.1(4))', () => {
    expect(r.normalised.P).toBeCloseTo(14.2222, 3);
    expect(r.normalised.M).toBeCloseTo(0.474074, 5);
    expect(r.normalised.eOverH).toBeCloseTo(1 / 30, 6);
    expect(r.notes).toContain('moment raised to the basis minimum');
  });

  it('takes As,min = 0.10·NEd/fyd where it exceeds 0.002·Ac (9.5.2(2)), in the exact ρg and the chart readings', () => {
    expect(r.rhoStatus).toBe('minimum-governs');
    expect(r.rhoRequired).toBeCloseTo(0.0032711, 6);
    expect(r.steelRequired).toBeCloseTo(1840.0, 0);
    expect(r.rhoFromChart).toBeGreaterThanOrEqual(r.rhoRequired - 1e-12);
    expect(r.rhoRoundedDown).toBeGreaterThanOrEqual(r.rhoRequired);
    expect(r.extraSteelRoundedDown).toBeGreaterThanOrEqual(0);
  });

  it('uses 20 mm for e0 on a small column (h/30 = 13.3 mm < 20 mm)', () => {
    // 400 × 400 mm, NEd = 2000 kN, MEd = 10 kN·m < 2000 · 0.020 = 40 kN·m → M/(b·h²) = 40e6/64e6 = 0.625 MPa
    const small = JSON.parse(runCheck({ ...en, b: '400', h: '400', pu: '2000kN', mu: '10kN-m' })).results[0];
    expect(small.normalised.M).toBeCloseTo(0.625, 6);
    // 9.5.2(2): 0.1·2e6/434.783 = 460.0 mm² > 320 mm² → ρmin = 0.002875
    expect(small.rhoRequired).toBeCloseTo(0.002875, 6);
  });

  it('keeps a larger given moment and the 0.002·Ac floor at small NEd', () => {
    // NEd = 500 kN: 0.1·5e5/434.783 = 115 mm² < 0.002·160 000 = 320 mm² → floor 0.002 (if it governs)
    const low = JSON.parse(runCheck({ ...en, b: '400', h: '400', pu: '500kN', mu: '100kN-m' })).results[0];
    expect(low.normalised.M).toBeCloseTo(100e6 / 64e6, 6); // 100 kN·m > 500 · 0.02 = 10 kN·m: unchanged
    expect(low.rhoRequired).toBeGreaterThanOrEqual(0.002);
    expect(low.notes).not.toContain('moment raised to the basis minimum');
  });

  it('proposes metric bars with the 8.2(2) spacing rule and prints fck/fyk', () => {
    const withCover = JSON.parse(runCheck({ ...en, gamma: undefined, cover: '35', tie: '10', bar: '25', b: '400', h: '400', pu: '2000kN', mu: '150kN-m', aggregate: '20' }));
    expect(withCover.bars.length).toBeGreaterThan(0);
    for (const p of withCover.bars) {
      expect(p.layout).toMatch(/× (12|14|16|20|25|28|32|40) mm/);
      // 8.2(2): max(φ, dg + 5 mm, 20 mm) with dg = 20 mm → max(φ, 25)
      expect(p.clearSpacingRequired).toBeCloseTo(Math.max(Number(p.size), 25), 9);
    }
    expect(withCover.assumptions.join(' ')).toContain('8.2(2)');
    const text = runCheck({ ...en, json: false, b: '400', h: '400', pu: '2000kN', mu: '10kN-m' });
    expect(text).toContain('fck = 30 MPa, fyk = 500 MPa');
    expect(text).not.toContain('f′c');
    expect(text).toContain('MEd raised to minimum');
  });
});

describe('check --code csa-a23.3-19', () => {
  const csa: CheckOptions = { code: 'csa-a23.3-19', fc: '35', fy: '400', b: '400', h: '400', gamma: '0.75', arrangement: 'four-faces', barsPerFace: '3', json: true };

  it('meets Pr,max = 0.80·Pro for a tied 400 × 400 column with Ast = 4000 mm² (10.10.4)', () => {
    // α1 = 0.85 − 0.0015·35 = 0.7975 (10.1.7); Pro = α1·φc·f′c·(Ag − Ast) + φs·fy·Ast
    //    = 0.7975·0.65·35·(160 000 − 4000) + 0.85·400·4000 = 2 830 327.5 + 1 360 000 = 4 190 327.5 N;
    // (0.2 + 0.002·400) = 1.0 > 0.80 → Pr,max = 0.80·Pro = 3 352 262 N. ρg = 4000/160 000 = 0.025.
    // Pu = 3400 kN with no moment (CSA sets no minimum eccentricity for short columns): utilisation 3400/3352.262.
    const r = JSON.parse(runCheck({ ...csa, pu: '3400kN', mu: '0', rho: '0.025' })).results[0];
    expect(r.utilisation).toBeCloseTo(3400 / 3352.262, 4);
    expect(r.capacity.Pu).toBeCloseTo(3352.262, 1);
    expect(r.strain.capGoverns).toBe(true);
    expect(r.normalised.M).toBe(0);
  });

  it('keeps 0.01·Ag as the minimum, proposes CSA bar designations with the A23.1 spacing rule and prints f′c/fy', () => {
    const out = JSON.parse(runCheck({ ...csa, pu: '1000kN', mu: '50kN-m' }));
    const r = out.results[0];
    expect(r.rhoStatus).toBe('minimum-governs');
    expect(r.rhoRequired).toBeCloseTo(0.01, 9); // 10.9.1
    expect(out.bars.length).toBeGreaterThan(0);
    for (const p of out.bars) {
      expect(p.layout).toMatch(/× \d+M \(/);
      expect(p.clearSpacingRequired).toBeGreaterThanOrEqual(30); // max(1.4·db, 1.4·aggregate, 30 mm)
    }
    const text = runCheck({ ...csa, json: false, pu: '1000kN', mu: '50kN-m' });
    expect(text).toContain('CSA A23.3-19, 400 × 400 mm tied, four-faces, f′c = 35 MPa, fy = 400 MPa');
  });
});

describe('the CLI', () => {
  it('runs check with both codes', async () => {
    const a = JSON.parse((await inProcess(['check', '--code', 'en1992-1-1', '--fc', '30', '--fy', '500', '--b', '400', '--h', '400', '--gamma', '0.8', '--pu', '2000kN', '--mu', '10kN-m', '--json'])).stdout);
    expect(a.code).toBe('en1992-1-1');
    expect(a.results[0].normalised.M).toBeCloseTo(0.625, 6);
    const b = JSON.parse((await inProcess(['check', '--code', 'csa-a23.3-19', '--fc', '35', '--fy', '400', '--b', '400', '--h', '400', '--gamma', '0.75', '--pu', '3000kN', '--mu', '150kN-m', '--json'])).stdout);
    expect(b.code).toBe('csa-a23.3-19');
    expect(b.results[0].normalised.M).toBeCloseTo(150e6 / 64e6, 6);
  });
});
