/** ACI 318-19 / 318-14 basis parameters against the code tables (ACI 318-19 Tables 21.2.2 and 22.2.2.4.3, 22.4.2.1; ACI 318-14 21.2.2). */
import { describe, expect, it } from 'vitest';
import { ACI_318_14, ACI_318_19, aciBeta1, aciPhi } from '../../src/codes/aci318.js';
import { resolveBasis } from '../../src/codes/registry.js';
import { PmError } from '../../src/errors.js';
import { barSet, findBar } from '../../src/section/bar-tables.js';
import { expectClose } from '../helpers/tolerance.js';

describe('aciBeta1 (ACI 318-19 Table 22.2.2.4.3)', () => {
  it('is 0.85 up to 4000 psi, falls 0.05 per 1000 psi, and stops at 0.65 from 8000 psi', () => {
    expect(aciBeta1(2.5, 'us')).toBe(0.85);
    expect(aciBeta1(4, 'us')).toBe(0.85);
    expectClose(aciBeta1(5, 'us'), 0.8, 1e-12);
    expectClose(aciBeta1(7, 'us'), 0.7, 1e-12);
    expect(aciBeta1(8, 'us')).toBeCloseTo(0.65, 12);
    expect(aciBeta1(12, 'us')).toBe(0.65);
  });
  it('in MPa: 0.85 up to 28, then 0.85 − 0.05(f′c − 28)/7, 0.65 from 55', () => {
    expect(aciBeta1(28, 'si')).toBe(0.85);
    expectClose(aciBeta1(35, 'si'), 0.8, 1e-12);
    expectClose(aciBeta1(55, 'si'), 0.65714, 1e-4);
    expect(aciBeta1(56, 'si')).toBe(0.65);
  });
});

describe('aciPhi (ACI 318-19 Table 21.2.2)', () => {
  const epsTy = 60 / 29000;
  it('is 0.65 (tied) at εt ≤ εty, 0.90 at εt ≥ εty + 0.003 and linear between', () => {
    expect(aciPhi(0, epsTy, epsTy + 0.003, 0.65)).toBe(0.65);
    expect(aciPhi(epsTy, epsTy, epsTy + 0.003, 0.65)).toBe(0.65);
    expect(aciPhi(epsTy + 0.003, epsTy, epsTy + 0.003, 0.65)).toBe(0.9);
    expectClose(aciPhi(epsTy + 0.0015, epsTy, epsTy + 0.003, 0.65), 0.775, 1e-12);
    expectClose(aciPhi(epsTy + 0.0015, epsTy, epsTy + 0.003, 0.75), 0.825, 1e-12);
  });
  it('318-19 ends the transition at εty + 0.003, 318-14 at 0.005', () => {
    const b19 = ACI_318_19.resolve({ units: 'us', fc: 4, fy: 80, transverse: 'tied' });
    const b14 = ACI_318_14.resolve({ units: 'us', fc: 4, fy: 80, transverse: 'tied' });
    expectClose(b19.design.factor(80 / 29000 + 0.003), 0.9, 1e-12);
    expect(b19.design.factor(0.005)).toBeLessThan(0.9);
    expectClose(b14.design.factor(0.005), 0.9, 1e-12);
    expect(b14.strainStates.find((s) => s.id === 'tension-controlled')!.epsT).toBe(0.005);
  });
  it('spiral columns use 0.75 and a cap of 0.85·Po (22.4.2.1)', () => {
    const s = ACI_318_19.resolve({ units: 'us', fc: 4, fy: 60, transverse: 'spiral' });
    expect(s.design.factor(0)).toBe(0.75);
    expect(s.nominal.capFactor({})).toBe(0.85);
    expectClose(s.design.capFactor({}), 0.75 * 0.85, 1e-12);
  });
});

describe('ACI basis', () => {
  it('caps fy in Po at 80 ksi / 550 MPa (22.4.2.1) but keeps the full fy in strain compatibility', () => {
    const b = ACI_318_19.resolve({ units: 'us', fc: 6, fy: 100, transverse: 'tied' });
    expect(b.nominal.squash.steelStress).toBe(80);
    expect(b.nominal.steel.stress(0.01)).toBe(100);
    expect(ACI_318_19.resolve({ units: 'si', fc: 40, fy: 690, transverse: 'tied' }).nominal.squash.steelStress).toBe(550);
  });
  it('limits Ast to 1–8 % of Ag (10.6.1.1)', () => {
    const b = ACI_318_19.resolve({ units: 'us', fc: 4, fy: 60, transverse: 'tied' });
    expect(b.steelAreaLimits(0, 576)).toEqual({ min: 5.76, max: 46.08 });
  });
  it('rejects strengths outside its range with the flag and range named', () => {
    expect(() => resolveBasis('aci318-19', { units: 'us', fc: 30, fy: 60, transverse: 'tied' })).toThrow('fc: 30 ksi is outside 2.5–20 ksi'); // the core names its field key; the CLI shows --fc
    expect(() => resolveBasis('aci318-19', { units: 'si', fc: 30, fy: 1000, transverse: 'tied' })).toThrow('fy: 1000 MPa is outside 280–690 MPa');
    expect(() => resolveBasis('nope', { units: 'si', fc: 30, fy: 400, transverse: 'tied' })).toThrow('code: nope is not a known design basis');
  });
});

describe('edition limits on the bar grade (Table 20.2.2.4(a), from memory of ACI 318-14 and 318-19)', () => {
  const fail = (code: string, fy: number, units: 'us' | 'si', columnUse?: 'gravity' | 'special-seismic') => {
    try {
      resolveBasis(code, { units, fc: units === 'us' ? 5 : 35, fy, transverse: 'tied', ...(columnUse ? { options: { columnUse } } : {}) });
      return null;
    } catch (e) {
      return e as PmError;
    }
  };
  it('ACI 318-14: fy = 100 ksi is refused (80 ksi for longitudinal column bars), naming --fy, the limit and the use', () => {
    const e = fail('aci318-14', 100, 'us')!;
    expect(e).toBeInstanceOf(PmError);
    expect(e.path).toBe('fy');
    expect(e.exitCode).toBe(2);
    expect(e.message).toMatch(/fy ≤ 80 ksi/);
    expect(e.message).toMatch(/columnUse gravity/); // field keys in the core; the CLI names --fy and --column-use
    expect(fail('aci318-14', 80, 'us')).toBeNull();
    expect(fail('aci318-14', 690, 'si')!.message).toMatch(/fy ≤ 550 MPa/);
  });
  it('ACI 318-19: 100 ksi allowed in gravity columns (the default), 80 ksi in special seismic systems', () => {
    expect(fail('aci318-19', 100, 'us')).toBeNull();
    expect(fail('aci318-19', 100, 'us', 'gravity')).toBeNull();
    const e = fail('aci318-19', 100, 'us', 'special-seismic')!;
    expect(e.message).toMatch(/fy ≤ 80 ksi/);
    expect(fail('aci318-19', 80, 'us', 'special-seismic')).toBeNull();
    expect(fail('aci318-19', 550, 'si', 'special-seismic')).toBeNull();
  });
  it('ACI 318-14 special seismic systems: Grade 60 (20.2.2.5, from memory)', () => {
    expect(fail('aci318-14', 80, 'us', 'special-seismic')!.message).toMatch(/fy ≤ 60 ksi/);
  });
  it('the sheet notes say which limit applies', () => {
    const b = resolveBasis('aci318-19', { units: 'us', fc: 5, fy: 60, transverse: 'tied' });
    expect(b.notes.some((n) => /fy ≤ 100 ksi/.test(n) && /gravity/.test(n))).toBe(true);
  });
});

describe('ASTM A615M soft-metric bars for ACI in SI (areas from memory of ASTM A615M Table 1, as listed beside each)', () => {
  it('#10 71, #13 129, #16 199, #19 284, #22 387, #25 510, #29 645, #32 819, #36 1006, #43 1452, #57 2581 mm², labelled (A615M)', () => {
    const b = resolveBasis('aci318-19', { units: 'si', fc: 35, fy: 420, transverse: 'tied' });
    const set = barSet(b.barSet);
    const want: [string, number][] = [['#10', 71], ['#13', 129], ['#16', 199], ['#19', 284], ['#22', 387], ['#25', 510], ['#29', 645], ['#32', 819], ['#36', 1006], ['#43', 1452], ['#57', 2581]];
    for (const [n, area] of want) {
      const bar = findBar(set, n)!;
      expect(bar.name).toBe(`${n} (A615M)`);
      expect(bar.area).toBe(area);
    }
    // a US #10 is 1.27 in²; the inch-pound table is untouched
    expect(findBar(barSet('astm-a615'), '#10')!.area).toBe(1.27);
  });
});
