/**
 * Each basis is one rulebook (issue 19): its slenderness method is an object on the basis, its rules are
 * listed with clause and source, every slenderness step carries a stable key and its clause, and each
 * edition cites its own clauses. Bases are walked from the registry, never from a hand list.
 */
import { describe, expect, it } from 'vitest';
import { prepareBiaxial } from '../../src/analysis/biaxial.js';
import { runCheck } from '../../src/cli/check.js';
import { DESIGN_CODES, resolveBasis } from '../../src/codes/registry.js';
import { RULE_SOURCES } from '../../src/codes/rulebooks.js';
import type { Basis, DesignCode } from '../../src/codes/types.js';
import { checkBiaxial } from '../../src/design/biaxial.js';
import { slendernessCheck, type SlendernessInput, type SlendernessSection } from '../../src/design/slenderness.js';
import { layoutBars } from '../../src/section/arrangements.js';
import type { Shape } from '../../src/section/types.js';
import { expectClose } from '../helpers/tolerance.js';

const byKey = (r: { steps: { key: string; value: unknown }[] }, key: string) => {
  const s = r.steps.find((x) => x.key === key);
  if (!s) throw new Error(`no step ${key}`);
  return s.value as number;
};

/** A basis of each code with ordinary materials in its first unit system (common practice values). */
function sampleBasis(code: DesignCode): Basis {
  const units = code.unitSystems[0]!;
  return resolveBasis(code.id, units === 'us' ? { units, fc: 4, fy: 60, transverse: 'tied' } : { units, fc: 35, fy: 400, transverse: 'tied' });
}
const codes = Object.values(DESIGN_CODES) as DesignCode[];

describe('every basis in the registry carries its rulebook', () => {
  it('the registry is not empty (the walks below cover every basis it lists)', () => {
    expect(codes.length).toBeGreaterThanOrEqual(5);
  });
  for (const code of codes) {
    const basis = sampleBasis(code);
    it(`${code.title}: rules have unique ids, a clause, a title and a source; the slenderness method's rules are among them`, () => {
      const ids = basis.rules.map((r) => r.id);
      expect(new Set(ids).size).toBe(ids.length);
      for (const r of basis.rules) {
        expect(r.clause.length).toBeGreaterThan(0);
        expect(r.title.length).toBeGreaterThan(0);
        expect(RULE_SOURCES).toContain(r.source);
      }
      for (const r of basis.slenderness?.rules ?? []) expect(basis.rules).toContainEqual(r);
      for (const id of ['slenderness-limit', 'min-moment', 'end-moment-convention', 'biaxial-method']) expect(ids).toContain(id);
    });
    it(`${code.title}: every slenderness step of every path has a stable key and a clause`, () => {
      const sq = code.unitSystems[0] === 'us' ? 16 : 400;
      const shape: Shape = { kind: 'rectangle', b: sq, h: sq };
      const section: SlendernessSection = { shape, bars: layoutBars(shape, { kind: 'four-faces', barsPerFace: 3 }, 0.02 * sq * sq, { gamma: 0.7 }) };
      const P = code.unitSystems[0] === 'us' ? 400 : 2e6;
      const M = code.unitSystems[0] === 'us' ? 1200 : 80e6;
      const base: SlendernessInput = { effectiveLength: 15 * sq, M1: -M / 2, M2: M, Pu: P, betaDns: 0.5 };
      const runs = [
        slendernessCheck(basis, section, base),
        slendernessCheck(basis, section, { ...base, effectiveLength: 3 * sq }),
        slendernessCheck(basis, section, { ...base, transverseLoads: true }),
        slendernessCheck(basis, section, { ...base, M1: 0, M2: 0 }),
        slendernessCheck(basis, section, { ...base, Pu: 0 }),
        slendernessCheck(basis, { ...section, positionsOnly: true }, base),
      ];
      for (const r of runs) {
        for (const s of r.steps) {
          expect(s.key, s.label).toMatch(/^[A-Za-z0-9-]+$/);
          expect(s.clause.length, s.label).toBeGreaterThan(0);
        }
      }
      const [slender, short] = runs;
      for (const key of ['r', 'klu-over-r', 'limit', 'neglected', 'end-moment-ratio']) expect(slender!.steps.map((s) => s.key)).toContain(key);
      expect(short!.neglected).toBe(true);
      expect(slender!.neglected).toBe(false);
      // the magnifier's figure: δ for the moment magnifiers, e2 for nominal curvature
      expect(slender!.steps.some((s) => s.key === 'delta' || s.key === 'e2')).toBe(true);
    });
  }
});

describe('ACI 318-14 cites its own clauses around 6.6.4 (6.2.5, 6.2.5.1, 6.2.6; from memory of ACI 318-14)', () => {
  // The hand calculation of tests/design/slenderness.test.ts, option (a), on the 318-14 basis: 6.6.4 is the same
  // in both editions, so δ = 0.84/(1 − 400/(0.75·843.38)) = 2.2850 (6.6.4.5.2), Cm = 0.84 (6.6.4.5.3),
  // M2,min = 400·(0.6 + 0.03·16) = 432 kip·in (6.6.4.5.4); Mc/M2 = 2.285 > 1.4: beyond ACI 318-14 6.2.6.
  const basis = resolveBasis('aci318-14', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
  const shape: Shape = { kind: 'rectangle', b: 16, h: 16 };
  const section: SlendernessSection = { shape, bars: layoutBars(shape, { kind: 'four-faces', barsPerFace: 3 }, 6.32, { gamma: 11 / 16 }) };
  const input: SlendernessInput = { effectiveLength: 240, M1: -1440, M2: 2400, Pu: 400, betaDns: 0.6 };
  it('δ = 2.2850 and the 1.4 limit of 6.2.6 fails, cited as ACI 318-14 6.2.6', () => {
    const r = slendernessCheck(basis, section, input);
    expect(r.method).toMatch(/^ACI 318-14 /);
    expectClose(byKey(r, 'Cm'), 0.84, 1e-12);
    expectClose(byKey(r, 'M2min'), 432, 1e-12);
    expectClose(r.delta, 2.285, 1e-4);
    expect(r.ok).toBe(false);
    expect(r.limitClause).toBe('ACI 318-14 6.2.6 (second-order moment ≤ 1.4 × first-order)');
    expect(r.steps.find((s) => s.key === 'limit')!.clause).toBe('6.2.5(b)');
    expect(r.steps.find((s) => s.key === 'r')!.clause).toBe('6.2.5.1');
    expect(r.steps.find((s) => s.key === 'second-order-ratio')!.clause).toBe('6.2.6');
    const text = JSON.stringify(r);
    expect(text).not.toMatch(/6\.2\.5\.3|6\.2\.5\.2|318-19/);
  });
  it('Pu = 700 kips ≥ 0.75·Pc = 632.5 kips is unstable (6.6.4.5.2)', () => {
    const r = slendernessCheck(basis, section, { ...input, Pu: 700 });
    expect(r.delta).toBe(Infinity);
    expect(r.limitClause).toBe('ACI 318-14 6.6.4.5.2 (Pu ≥ 0.75·Pc)');
  });
  it('ACI 318-14: M1 = M2 = 0 is single curvature, M1/M2 = −1: limit 34 − 12 = 22 < kℓu/r = 144/4.8 = 30, slender', () => {
    const r = slendernessCheck(basis, section, { ...input, effectiveLength: 144, M1: 0, M2: 0 });
    expectClose(byKey(r, 'end-moment-ratio'), -1, 1e-12);
    expectClose(byKey(r, 'limit'), 22, 1e-12);
    expect(r.neglected).toBe(false);
  });
  it('ACI 318-14: Pn,max = 0.80·Po tied, 0.85·Po spiral (22.4.2.1); load contour α = 1.5 (Bresler, 1960, from memory)', () => {
    expect(basis.nominal.capFactor({})).toBe(0.8);
    expect(resolveBasis('aci318-14', { units: 'us', fc: 4, fy: 60, transverse: 'spiral' }).nominal.capFactor({})).toBe(0.85);
    expect(basis.biaxialExponent!(0.3, 'rectangle').alpha).toBe(1.5);
  });
  it('the 318-19 basis keeps 6.2.5.1(b), 6.2.5.2 and 6.2.5.3', () => {
    const r = slendernessCheck(resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' }), section, input);
    expect(r.steps.find((s) => s.key === 'limit')!.clause).toBe('6.2.5.1(b)');
    expect(r.steps.find((s) => s.key === 'r')!.clause).toBe('6.2.5.2');
    expect(r.limitClause).toMatch(/ACI 318-19 6\.2\.5\.3/);
  });
});

describe('ACI 318-19 Table 20.2.2.4(a) special-seismic grade message (from memory)', () => {
  it('names special moment frames and says special structural walls allow 100 ksi', () => {
    try {
      resolveBasis('aci318-19', { units: 'us', fc: 5, fy: 100, transverse: 'tied', options: { columnUse: 'special-seismic' } });
      expect.unreachable();
    } catch (e) {
      const m = (e as Error).message;
      expect(m).toMatch(/fy ≤ 80 ksi/);
      expect(m).toMatch(/special moment frames/);
      expect(m).toMatch(/special structural walls allow up to 100 ksi/);
    }
  });
});

describe('AS 3600-2018 10.4.2 stability and CSA A23.3-19 10.15.3.1 rules (from memory)', () => {
  it('AS: N* = 7000 kN ≥ Nc = 6,657,899 N (Le = 8 m, the section of slenderness-as-csa.test.ts) is unstable', () => {
    const basis = resolveBasis('as3600-2018', { units: 'si', fc: 40, fy: 500, transverse: 'tied' });
    const shape: Shape = { kind: 'rectangle', b: 400, h: 600 };
    const bars = layoutBars(shape, { kind: 'two-faces', barsPerFace: 2 }, 4800, { gamma: 0.8 });
    const r = slendernessCheck(basis, { shape, bars }, { effectiveLength: 8000, M1: -150e6, M2: 300e6, Pu: 7e6, betaDns: 0.5 });
    expectClose(byKey(r, 'Nc'), 6_657_899, 1e-5);
    expect(r.ok).toBe(false);
    expect(r.delta).toBe(Infinity);
    expect(r.limitClause).toMatch(/10\.4\.2/);
  });
  // CSA: 400 × 400 mm, f′c = 35 MPa, Pf = 2000 kN, kℓu = 6 m, βd = 0.5 (slenderness-as-csa.test.ts): Pc = 4,152,133 N.
  const csa = resolveBasis('csa-a23.3-19', { units: 'si', fc: 35, fy: 400, transverse: 'tied' });
  const shape: Shape = { kind: 'rectangle', b: 400, h: 400 };
  const bars = layoutBars(shape, { kind: 'four-faces', barsPerFace: 3 }, 8 * 500, { gamma: 0.7 });
  it('CSA: M2 = 40 kN·m < M2,min = 2e6·(15 + 0.03·400) = 54 kN·m governs, Cm = 1.0; δ = 1/(1 − 0.642240) = 2.795170', () => {
    const r = slendernessCheck(csa, { shape, bars }, { effectiveLength: 6000, M1: -20e6, M2: 40e6, Pu: 2e6, betaDns: 0.5 });
    expectClose(byKey(r, 'M2min'), 54e6, 1e-12);
    expectClose(byKey(r, 'M2-used'), 54e6, 1e-12);
    expectClose(byKey(r, 'Cm'), 1, 1e-12);
    expectClose(r.delta, 1 / (1 - 2e6 / (0.75 * 4_152_133)), 1e-6);
  });
  it('CSA: Pf = 3500 kN ≥ 0.75·Pc = 3114.1 kN is unstable', () => {
    const r = slendernessCheck(csa, { shape, bars }, { effectiveLength: 6000, M1: -50e6, M2: 100e6, Pu: 3.5e6, betaDns: 0.5 });
    expect(r.ok).toBe(false);
    expect(r.delta).toBe(Infinity);
    expect(r.limitClause).toMatch(/10\.15\.3\.1/);
  });
  it('CSA biaxial: load contour with Bresler’s α = 1.5 for a rectangle (Bresler, ACI Journal 57(5), 1960, from memory)', () => {
    const r = checkBiaxial(prepareBiaxial(csa, shape, bars), { Pu: 2e6, Mux: 80e6, Muy: 40e6 });
    expect(r.loadContour.alpha).toBe(1.5);
    expect(r.loadContour.alphaSource).toMatch(/Bresler/);
  });
});

describe('AS 3600-2018 output states its edition and uses AS words', () => {
  const o = { code: 'as3600-2018', fc: '40', fy: '500', b: '400', h: '600', arrangement: 'two-faces', barsPerFace: '2', gamma: '0.8', rho: '0.02', pu: '3000', mu: '300', proposals: '0' };
  it('the basis title and first note say Amendment 2’s φ is not applied', () => {
    const b = resolveBasis('as3600-2018', { units: 'si', fc: 40, fy: 500, transverse: 'tied' });
    expect(b.title).toBe('AS 3600-2018 (Amdt 2 φ not applied)');
    expect(b.notes[0]).toMatch(/Amendment 2 \(2021\).*Table 2\.2\.2.*not applied/);
  });
  it('the text check prints the edition, εs (not εt) and kuo classes (not "compression-controlled")', () => {
    const text = runCheck(o);
    expect(text).toMatch(/AS 3600-2018 \(Amdt 2 φ not applied\)/);
    expect(text).toMatch(/ εs /);
    expect(text).not.toMatch(/εt|compression-controlled/);
  });
  it('the JSON carries the edition in its title', () => {
    expect(runCheck({ ...o, json: true })).toMatch(/Amdt 2 φ not applied/);
  });
});
