/**
 * The European demo set (charts-config/demo-eu.json, EN 1992-1-1): symbols, ω families and a basis
 * option variant, resolved and checked. Expected values are worked by hand from EN 1992-1-1 clauses.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { lookupTable, tableCsv } from '../../src/chart/lookup-table.js';
import { buildSheet } from '../../src/chart/sheet-data.js';
import { readChartSet } from '../../src/config/read.js';
import { basisForSheet, familyForSheet, sheetRhos } from '../../src/sheet/curves.js';

const text = readFileSync(new URL('../../charts-config/demo-eu.json', import.meta.url), 'utf8');
const set = readChartSet(text);
const change = (f: (d: any) => void): string => {
  const d = JSON.parse(text);
  f(d);
  return JSON.stringify(d);
};

describe('demo-eu.json resolved', () => {
  it('has ten recommended-factor sheets and one αcc 0.85 variant named in its title and file', () => {
    expect(set.sheets).toHaveLength(11);
    expect(set.ratios).toEqual({ kind: 'omega', values: [0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8] });
    expect(set.sheets[0]!.title).toBe('Square, fck 60 MPa, fyk 500 MPa, γ 0.70, 3 bars on each of two faces');
    const v = set.sheets[10]!;
    expect(v.basisOptions).toEqual({ alphaCc: 0.85 });
    expect(v.title).toBe('Square, fck 60 MPa, fyk 500 MPa, γ 0.80, 3 bars per face on four faces (8 bars), αcc 0.85');
    expect(v.fileStem).toMatch(/-alphacc-0\.85$/);
  });

  it('uses f′c and fy in default titles of ACI and CSA sets, fck and fyk for EN 1992-1-1', () => {
    const en = readChartSet(change((d) => delete d.sheetTitle));
    expect(en.sheets[0]!.title).toMatch(/^Square column, fck 60 MPa, fyk 500 MPa, γ 0\.70/);
    const csa = readChartSet(readFileSync(new URL('../fixtures/csa-set.json', import.meta.url), 'utf8'));
    expect(csa.sheets[0]!.title).toMatch(/^Square column, f′c 35 MPa, fy 400 MPa, γ 0\.75/);
  });

  it('converts ω to ρg per sheet with that sheet’s fyd/fcd', () => {
    // fcd = αcc·fck/γc = 60/1.5 = 40 MPa (3.1.6(1)); fyd = 500/1.15 = 434.78 MPa (3.2.7(2)); ρ = ω·fcd/fyd
    expect(sheetRhos(set, basisForSheet(set, set.sheets[0]!))[0]).toBeCloseTo((0.1 * 40) / (500 / 1.15), 12);
    // αcc = 0.85: fcd = 0.85·60/1.5 = 34 MPa
    expect(sheetRhos(set, basisForSheet(set, set.sheets[10]!))[0]).toBeCloseTo((0.1 * 34) / (500 / 1.15), 12);
  });

  it('puts the hand-checked ν at pure compression and at the balanced point in the lookup table, keyed by ω', () => {
    // Sheet 11 (αcc 0.85, fcd = 34 MPa), C60/75: εc2 = 2.0 + 0.085·(60 − 50)^0.53 = 2.288 ‰ (Table 3.1) > εyd = 2.174 ‰,
    // so at the uniform εc2 of Fig. 6.1 the bars are at fyd and ν0 = (1 − ρ) + ρ·fyd/fcd = (1 − ρ) + ω.
    // ω = 0.1: ρ = 0.1·34/434.78 = 0.0078200 → ν0 = 0.99218 + 0.1 = 1.09218.
    const sheet = set.sheets[10]!;
    const family = familyForSheet(set, sheet);
    const t = lookupTable(family, family.basis.normalisingStress, set.ratios.values);
    const row = t.rows[0]!;
    expect(row.omega).toBe(0.1);
    expect(row.points.find((p) => p.id === 'pure-compression')!.design!.P).toBeCloseTo(1.09218, 4);
    // Balanced (εs = εyd at the extreme bar row, d = 0.9h): x/h = 0.9·εcu2/(εcu2 + εyd), εcu2 = 2.6 + 35·0.3^4 = 2.8835 ‰,
    // x/h = 0.9·2.8835/(2.8835 + 2.1739) = 0.5131. Parabola–rectangle fill factor with n = 1.4 + 23.4·0.3^4 = 1.5895:
    // αR = 1 − (εc2/εcu2)/(n + 1) = 1 − 0.7935/2.5895 = 0.69357 → concrete ν = 0.69357·0.5131 = 0.35587.
    // Bars (3 + 3 at the faces, 2 at mid-depth, 8 in all): outer rows both yield and cancel; the top row displaces
    // concrete: −(3/8)·ρ·1 = −0.00293; the mid-depth pair at ε = 2.8835·(0.5131 − 0.5)/0.5131 = 0.074 ‰
    // adds (2/8)·ρ·(200 000·0.000074 − σc)/fcd ≈ +0.0007 → ν ≈ 0.3537 (hand value, ±0.002).
    const bal = row.points.find((p) => p.id === 'balanced')!.design!;
    expect(bal.cOverH).toBeCloseTo(0.5131, 3);
    expect(bal.P).toBeCloseTo(0.3537, 2);
    expect(Math.abs(bal.P - 0.3537)).toBeLessThan(0.002);
    // pure tension: −ρ·fyd/fcd = −ω
    expect(row.points.find((p) => p.id === 'pure-tension')!.design!.P).toBeCloseTo(-0.1, 5);
    expect(tableCsv(t).split('\n')[0]).toBe('rho_g,c_over_h,eps_t,phi,Pn_norm,Mn_norm,phiPn_norm,phiMn_norm,point,point_label,omega');
  });

  it('draws ω labels, ν/μ axes, fck/fyk, the partial factors and the normalisation on the sheet', () => {
    const sheet = set.sheets[10]!;
    const built = buildSheet({ set, sheet, family: familyForSheet(set, sheet), sheetNumber: 11, sheetCount: 11, generator: 'pmchart test' });
    // each label gives ω and the sheet's ρg = ω·fcd/fyd (EN 1992-1-1 3.1.6, 3.2.7: fcd = 0.85·60/1.5 = 34 MPa,
    // fyd = 500/1.15 = 434.8 MPa; ω 0.1 → ρg = 0.1·34/434.8 = 0.00782 by hand)
    expect(built.data.curveLabels[0]!.text).toBe('ω 0.1 · ρg 0.00782');
    expect(built.data.curveLabels.slice(0, 8).map((l) => l.text.split(' · ')[0])).toEqual(['ω 0.1', 'ω 0.2', 'ω 0.3', 'ω 0.4', 'ω 0.5', 'ω 0.6', 'ω 0.7', 'ω 0.8']);
    expect(built.template.yTitle).toMatch(/^ν = NRd \/ \(fcd · Ag\)/);
    expect(built.template.xTitle).toMatch(/^μ = MRd \/ \(fcd · Ag · h\)/);
    const texts = built.data.texts.map((t) => t.text);
    expect(texts).toContain('fck 60 MPa · fyk 500 MPa');
    expect(texts).toContain('αcc 0.85 · γc 1.5 · γs 1.15 (not all recommended: check the NA)');
    expect(texts).toContain('ν = NRd/(fcd·Ag), μ = MRd/(fcd·Ag·h), fcd = 34 MPa');
    expect(texts).toContain('εs = εyd');
    expect(texts.some((t) => t.includes('f′c'))).toBe(false);
  });
});

describe('ω families and basis options: errors name the field', () => {
  it('rejects rhoG and omega together', () => {
    expect(() => readChartSet(change((d) => (d.rhoG = [0.01])))).toThrow(/^omega: and rhoG both set the curves; give one of them$/);
  });
  it('rejects an ω that gives ρg beyond 0.1 on a sheet', () => {
    // ω = 1.2: ρ = 1.2·40/434.78 = 0.110 > 0.1
    expect(() => readChartSet(change((d) => (d.omega = [0.5, 1.2])))).toThrow(/^omega\[1\]: 1\.2 gives ρg 0\.11 on sheet 1 \(sheets\[0\]\), outside 0\.001–0\.1$/);
  });
  it('names the group option that is out of range', () => {
    expect(() => readChartSet(change((d) => (d.sheets[1].basisOptions.alphaCc = 0.7)))).toThrow(/^sheets\[1\]\.basisOptions\.alphaCc: 0\.7 is outside 0\.8–1$/);
    expect(() => readChartSet(change((d) => (d.basis.options = { gammaC: 3 })))).toThrow(/^basis\.options\.gammaC: 3 is outside 1–2$/);
  });
});
