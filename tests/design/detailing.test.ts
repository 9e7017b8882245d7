/**
 * Issue 19 U4: a given reinforcement (a ρg, a bar layout) is checked against the basis's detailing rules,
 * and breaking one is the load status `detailing` (exit 1) with the rule and clause as typed findings.
 * Before this, ρg 0.11, ρg 0.002 and #14 bars closer than 1.5·db all passed as "ok".
 */
import { describe, expect, it } from 'vitest';
import { resolveBasis } from '../../src/codes/registry.js';
import type { RuleFinding } from '../../src/codes/rules.js';
import { checkColumn, governingOrder, LOAD_STATUSES, type ColumnCheckInput } from '../../src/design/column-check.js';
import { gammaFromCover } from '../../src/section/geometry.js';
import { expectClose } from '../helpers/tolerance.js';

const aci = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
const en = resolveBasis('en1992-1-1', { units: 'si', fc: 30, fy: 500, transverse: 'tied' });
const as = resolveBasis('as3600-2018', { units: 'si', fc: 40, fy: 500, transverse: 'tied' });
const csa = resolveBasis('csa-a23.3-19', { units: 'si', fc: 35, fy: 400, transverse: 'tied' });

const find = (fs: readonly RuleFinding[] | undefined, rule: string) => (fs ?? []).find((f) => f.rule === rule);

describe('the status list and its ranking', () => {
  it('`detailing` is a status and ranks above (worse than) fails', () => {
    expect(LOAD_STATUSES).toContain('detailing');
    const row = (status: 'detailing' | 'fails', index: number) => ({ status, measureValue: 0.5, demandRatio: 0.5, index }) as const;
    // a detailing load with a low utilisation still governs a failing load
    expect(governingOrder(row('detailing', 1), { ...row('fails', 0), measureValue: 1.5 })).toBeLessThan(0);
  });
});

describe('ACI 318-19 10.6.1.1: 0.01·Ag ≤ Ast ≤ 0.08·Ag', () => {
  const base: ColumnCheckInput = {
    basis: aci,
    shape: { kind: 'rectangle', b: 16, h: 16 },
    arrangement: { kind: 'four-faces', barsPerFace: 3 },
    gamma: 0.7,
    capContext: { depth: 16, leastDimension: 16 },
    loads: [{ id: 'L1', Pu: 300, Mu: 300 }],
  };

  it('ρg 0.11 given (the issue\'s case): status detailing, steel-max violated at 0.08 [10.6.1.1]', () => {
    const c = checkColumn({ ...base, rho: 0.11 });
    const r = c.results[0]!;
    expect(r.status).toBe('detailing');
    expect(r.statusClause).toContain('10.6.1.1');
    const f = find(r.findings, 'steel-max')!;
    expect(f).toMatchObject({ rule: 'steel-max', clause: '10.6.1.1', outcome: 'violated', quantity: 'ratio' });
    expectClose(f.value!, 0.11, 1e-9);
    expectClose(f.limit!, 0.08, 1e-9);
    expect(c.exitCode).toBe(1);
    expect(c.summary.counts.detailing).toBe(1);
    // the section check still runs: the utilisation of the 0.11 is there beside the status
    expect(r.utilisation!).toBeLessThan(1);
  });

  it('a 12 × 12 in layout of 8 #11 (Ast = 8·1.56 = 12.48 in², ρg = 12.48/144 = 0.0867 > 0.08): detailing', () => {
    const c = checkColumn({
      ...base,
      shape: { kind: 'rectangle', b: 12, h: 12 },
      capContext: { depth: 12, leastDimension: 12 },
      layout: { arrangement: { kind: 'four-faces', barsPerFace: 3 }, area: 8 * 1.56, gamma: 0.6, description: '8 #11' },
      detailingInput: { bar: { name: '#11', diameter: 1.41 } },
    });
    const r = c.results[0]!;
    expect(r.status).toBe('detailing');
    expectClose(find(r.findings, 'steel-max')!.value!, 12.48 / 144, 1e-9);
  });

  it('ρg 0.002 given (Ast = 0.8 in² of 4 #4 in 20 × 20 in): steel-min violated; the reduced area Ast/0.01 = 80 in² < Ag/2 = 200 in² (10.3.1.2) cannot help', () => {
    const c = checkColumn({
      ...base,
      shape: { kind: 'rectangle', b: 20, h: 20 },
      capContext: { depth: 20, leastDimension: 20 },
      arrangement: { kind: 'four-faces', barsPerFace: 2 },
      loads: [{ id: 'L1', Pu: 50, Mu: 50 }],
      layout: { arrangement: { kind: 'four-faces', barsPerFace: 2 }, area: 0.8, gamma: 0.8, description: '4 #4' },
    });
    const r = c.results[0]!;
    expect(r.status).toBe('detailing');
    const f = find(r.findings, 'steel-min')!;
    expect(f.outcome).toBe('violated');
    expectClose(f.value!, 0.002, 1e-9);
    // the lightest load still needs 0.01·(Ag/2) = 0.005·Ag: the reduced area cannot go below half of Ag
    expectClose(f.limit!, 0.005, 1e-9);
  });

  it('reduced effective area (ACI 318-19 10.3.1.2, Ae ≥ Ag/2): ρg 0.0079 (4 #8 = 3.16 in² in 20 × 20) passes the minimum when the load needs no more than Ae = 316 in² of the 400', () => {
    // Ae = Ast/0.01 = 316 in² ≥ Ag/2 = 200 in²; with the proportional-strength reading (common practice)
    // the load is met by the reduced section when the full-section utilisation ≤ Ae/Ag = 0.79.
    const mk = (Pu: number, Mu: number) =>
      checkColumn({
        ...base,
        shape: { kind: 'rectangle', b: 20, h: 20 },
        capContext: { depth: 20, leastDimension: 20 },
        arrangement: { kind: 'four-faces', barsPerFace: 2 },
        loads: [{ id: 'L1', Pu, Mu }],
        layout: { arrangement: { kind: 'four-faces', barsPerFace: 2 }, area: 3.16, gamma: 0.75, description: '4 #8' },
      }).results[0]!;
    const light = mk(100, 100);
    expect(light.utilisation!).toBeLessThan(0.79);
    expect(find(light.findings, 'steel-min')!.outcome).toBe('met');
    expect(light.status).toBe('ok');
    // Po = 0.85·4·(400 − 3.16) + 60·3.16 = 1349.26 + 189.6 = 1538.9 kip; φPn,max = 0.52·Po = 800.2 kip (22.4.2.1)
    const heavy = mk(720, 0); // utilisation ≈ 720/800.2 = 0.90 > 0.79
    expect(heavy.utilisation!).toBeGreaterThan(0.79);
    expect(heavy.utilisation!).toBeLessThan(1);
    expect(heavy.status).toBe('detailing');
    expect(find(heavy.findings, 'steel-min')!.outcome).toBe('violated');
  });
});

describe('ACI 318-19 25.2.3: clear spacing of #14 bars', () => {
  // 16 × 24 in, 4 #14 per face on two faces, cover 1.5 in to a #4 tie (db 0.5 in):
  // clear = (b − 2·cover − 2·tie − n·db)/(n − 1) = (16 − 3 − 1 − 4·1.693)/3 = 5.228/3 = 1.7427 in;
  // required max(1.5 in, 1.5·1.693 = 2.5395 in, 4/3·0.75 = 1.0 in) = 2.5395 in (25.2.3): violated.
  // Ast = 8·2.25 = 18 in², ρg = 18/384 = 0.0469 (within 10.6.1.1, above the 0.04 suggested where bars are lapped, R10.6.1.1).
  const gamma = gammaFromCover(24, 1.5, 0.5, 1.693);
  const input = (perFace: number, bar: { name: string; diameter: number; area: number }): ColumnCheckInput => ({
    basis: aci,
    shape: { kind: 'rectangle', b: 16, h: 24 },
    arrangement: { kind: 'two-faces', barsPerFace: perFace },
    gamma,
    capContext: { depth: 24, leastDimension: 16 },
    loads: [{ id: 'L1', Pu: 400, Mu: 1200 }],
    layout: { arrangement: { kind: 'two-faces', barsPerFace: perFace }, area: 2 * perFace * bar.area, gamma: gammaFromCover(24, 1.5, 0.5, bar.diameter), description: '' },
    detailingInput: { bar: { name: bar.name, diameter: bar.diameter }, cover: 1.5, tieDiameter: 0.5 },
  });

  it('4 #14 per face: 1.74 in clear < 2.54 in: status detailing [25.2.3]', () => {
    const c = checkColumn(input(4, { name: '#14', diameter: 1.693, area: 2.25 }));
    const r = c.results[0]!;
    expect(r.utilisation!).toBeLessThan(1);
    expect(r.status).toBe('detailing');
    const f = find(r.findings, 'clear-spacing')!;
    expect(f).toMatchObject({ clause: '25.2.3', outcome: 'violated', quantity: 'length' });
    expectClose(f.value!, 5.228 / 3, 1e-6);
    expectClose(f.limit!, 1.5 * 1.693, 1e-9);
    expect(c.exitCode).toBe(1);
  });

  it('flags #14 as not lap-spliceable (ACI 318-19 25.5.1.1, from memory) and ρg 0.0469 above the 0.04 lap suggestion (R10.6.1.1): notes, not the status', () => {
    const r = checkColumn(input(4, { name: '#14', diameter: 1.693, area: 2.25 })).results[0]!;
    expect(find(r.findings, 'bar-size-lap')!.outcome).toBe('violated');
    expect(find(r.findings, 'steel-max-lap')!.outcome).toBe('violated');
    expectClose(find(r.findings, 'steel-max-lap')!.limit!, 0.04, 1e-9);
  });

  it('3 #8 per face: clear (16 − 3 − 1 − 3·1.0)/2 = 4.5 in ≥ 1.5 in; cover 1.5 in ≥ 1.5 in (Table 20.5.1.3.1): ok, every rule met', () => {
    const r = checkColumn(input(3, { name: '#8', diameter: 1.0, area: 0.79 })).results[0]!;
    expect(r.status).toBe('ok');
    expectClose(find(r.findings, 'clear-spacing')!.value!, 4.5, 1e-6);
    expect(find(r.findings, 'clear-spacing')!.outcome).toBe('met');
    expect(find(r.findings, 'cover')!.outcome).toBe('met');
    expect(find(r.findings, 'bar-size-lap')!.outcome).toBe('met');
  });

  it('γ given (no cover): the cover is said to be unchecked', () => {
    const i = input(3, { name: '#8', diameter: 1.0, area: 0.79 });
    const r = checkColumn({ ...i, detailingInput: { bar: { name: '#8', diameter: 1.0 } } }).results[0]!;
    expect(find(r.findings, 'cover')!.outcome).toBe('unchecked');
    expect(r.status).toBe('ok');
  });

  it('cover 1.0 in < 1.5 in (ACI 318-19 Table 20.5.1.3.1, columns not exposed to weather): detailing', () => {
    const i = input(3, { name: '#8', diameter: 1.0, area: 0.79 });
    const r = checkColumn({ ...i, detailingInput: { bar: { name: '#8', diameter: 1.0 }, cover: 1.0, tieDiameter: 0.5 } }).results[0]!;
    expect(find(r.findings, 'cover')!).toMatchObject({ outcome: 'violated', value: 1.0, limit: 1.5 });
    expect(r.status).toBe('detailing');
  });
});

describe('the issue\'s case: 1.2 in clear between #14 bars (custom layout)', () => {
  // 12 × 12 in, four #14 bars at x = ±1.4465 in, y = ±3.6 in (γ = 0.6): centres 2.893 in apart across b,
  // clear 2.893 − 1.693 = 1.2 in < max(1.5 in, 1.5·1.693 = 2.54 in, 4/3·0.75 = 1.0 in) (ACI 318-19 25.2.3).
  // Ast = 4·2.25 = 9 in², ρg = 9/144 = 0.0625 (within 10.6.1.1). Before issue 19 this passed as "ok".
  const x = 1.4465 / 12;
  const input: ColumnCheckInput = {
    basis: aci,
    shape: { kind: 'rectangle', b: 12, h: 12 },
    arrangement: { kind: 'custom', bars: [{ x, y: 0.3, share: 1 }, { x: -x, y: 0.3, share: 1 }, { x, y: -0.3, share: 1 }, { x: -x, y: -0.3, share: 1 }] },
    gamma: 0.6,
    capContext: { depth: 12, leastDimension: 12 },
    loads: [{ id: 'L1', Pu: 150, Mu: 300 }],
    rho: 9 / 144,
    detailingInput: { bar: { name: '#14', diameter: 1.693 } },
  };
  it('status detailing, clear spacing 1.2 in < 2.54 in [25.2.3]', () => {
    const r = checkColumn(input).results[0]!;
    expect(r.utilisation!).toBeLessThan(1);
    expect(r.status).toBe('detailing');
    const f = find(r.findings, 'clear-spacing')!;
    expectClose(f.value!, 1.2, 1e-9);
    expectClose(f.limit!, 2.5395, 1e-9);
  });
  it('without the bar size the spacing is said to be unchecked, and the load is ok', () => {
    const r = checkColumn({ ...input, detailingInput: {} }).results[0]!;
    expect(find(r.findings, 'clear-spacing')!.outcome).toBe('unchecked');
    expect(r.status).toBe('ok');
  });
});

describe('EN 1992-1-1 9.5.2', () => {
  const base: ColumnCheckInput = {
    basis: en,
    shape: { kind: 'rectangle', b: 400, h: 400 },
    arrangement: { kind: 'four-faces', barsPerFace: 2 },
    gamma: 0.8,
    capContext: { depth: 400, leastDimension: 400 },
    loads: [{ id: 'N', Pu: 2000e3, Mu: 40e6 }],
  };
  it('9.5.2(2): As,min = max(0.10·NEd/fyd, 0.002·Ac) = max(0.1·2e6/434.78 = 460 mm², 320 mm²); 4 × 12 mm = 452 mm² is short: detailing', () => {
    const r = checkColumn({ ...base, layout: { arrangement: base.arrangement, area: 4 * 113.1, gamma: 0.8, description: '4 × 12' } }).results[0]!;
    expect(r.status).toBe('detailing');
    const f = find(r.findings, 'steel-min')!;
    expect(f.clause).toBe('9.5.2(2)');
    expectClose(f.limit!, (0.1 * 2000e3) / (500 / 1.15) / 160000, 1e-6);
  });
  it('9.5.2(3): ρ 0.05 outside laps > 0.04: detailing', () => {
    const r = checkColumn({ ...base, rho: 0.05 }).results[0]!;
    expect(r.status).toBe('detailing');
    expect(find(r.findings, 'steel-max')!).toMatchObject({ clause: '9.5.2(3)', outcome: 'violated', limit: 0.04 });
  });
  it('8.2(2): clear spacing ≥ max(k1·φ, dg + k2, 20 mm) = max(32, 20 + 5, 20) = 32 mm for 32 mm bars at the 20 mm aggregate assumed', () => {
    // 300 × 300, 3 × 32 mm per face on two faces, cover 30 mm to a 10 mm link: (300 − 60 − 20 − 96)/2 = 62 mm clear: met
    const gamma = gammaFromCover(300, 30, 10, 32);
    const r = checkColumn({
      ...base,
      shape: { kind: 'rectangle', b: 300, h: 300 },
      capContext: { depth: 300, leastDimension: 300 },
      arrangement: { kind: 'two-faces', barsPerFace: 3 },
      gamma,
      loads: [{ id: 'N', Pu: 1000e3, Mu: 40e6 }],
      layout: { arrangement: { kind: 'two-faces', barsPerFace: 3 }, area: 6 * 804, gamma, description: '' },
      detailingInput: { bar: { name: '32', diameter: 32 }, cover: 30, tieDiameter: 10 },
    }).results[0]!;
    const f = find(r.findings, 'clear-spacing')!;
    expect(f.clause).toBe('8.2(2)');
    expectClose(f.value!, 62, 1e-6);
    expectClose(f.limit!, 32, 1e-9);
    expect(f.outcome).toBe('met');
  });
});

describe('AS 3600-2018 10.7.1 and CSA A23.3-19 10.9.2', () => {
  it('AS 3600: ρg 0.045 > 0.04: detailing', () => {
    const r = checkColumn({
      basis: as,
      shape: { kind: 'rectangle', b: 400, h: 400 },
      arrangement: { kind: 'four-faces', barsPerFace: 3 },
      gamma: 0.75,
      capContext: { depth: 400, leastDimension: 400 },
      loads: [{ id: 'N', Pu: 2000e3, Mu: 100e6 }],
      rho: 0.045,
    }).results[0]!;
    expect(r.status).toBe('detailing');
    expect(find(r.findings, 'steel-max')!).toMatchObject({ clause: '10.7.1', outcome: 'violated', limit: 0.04 });
  });
  it('CSA A23.3: ρg 0.085 > 0.08: detailing', () => {
    const r = checkColumn({
      basis: csa,
      shape: { kind: 'rectangle', b: 400, h: 400 },
      arrangement: { kind: 'four-faces', barsPerFace: 3 },
      gamma: 0.75,
      capContext: { depth: 400, leastDimension: 400 },
      loads: [{ id: 'N', Pu: 2000e3, Mu: 100e6 }],
      rho: 0.085,
    }).results[0]!;
    expect(r.status).toBe('detailing');
    expect(find(r.findings, 'steel-max')!).toMatchObject({ clause: '10.9.2', outcome: 'violated', limit: 0.08 });
  });
});
