/**
 * checkSchedule (issue 22): each mark is the engine's own check of that column, anchored to hand
 * calculations of ACI 318-19's axial limits, and mark matching fails naming the mark.
 */
import { describe, expect, it } from 'vitest';
import { resolveBasis } from '../../src/codes/registry.js';
import { checkColumn, LOAD_STATUSES, type ColumnCheckInput } from '../../src/design/column-check.js';
import { checkSchedule, compareMarks, summariseSchedule, type ScheduleEntry } from '../../src/design/schedule.js';
import type { FactoredLoad } from '../../src/design/check.js';
import { expectClose } from '../helpers/tolerance.js';

// 16 × 16 in tied column, 8 #8 bars (four-faces, 3 per face), f′c = 4 ksi, fy = 60 ksi.
// #8 bar area 0.79 in² (ASTM A615/A615M Table 1): Ast = 8 × 0.79 = 6.32 in², Ag = 256 in², ρg = 6.32/256 = 0.0246875.
const basis = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
const shape = { kind: 'rectangle', b: 16, h: 16 } as const;
const arrangement = { kind: 'four-faces', barsPerFace: 3 } as const;
const section: Omit<ColumnCheckInput, 'loads'> = {
  basis,
  shape,
  arrangement,
  gamma: 0.7,
  capContext: { depth: 16, leastDimension: 16 },
  layout: { arrangement, area: 6.32, gamma: 0.7, description: '8 #8' },
};

describe('checkSchedule: hand calculations (ACI 318-19)', () => {
  const loads = new Map<string, FactoredLoad[]>([
    ['A1', [{ id: 'axial', Pu: 500, Mu: 0 }]],
    ['A2', [{ id: 'uplift', Pu: -100, Mu: 0 }]],
  ]);
  const schedule: ScheduleEntry[] = [
    { mark: 'A2', input: section },
    { mark: 'A1', input: section },
  ];
  const s = checkSchedule(schedule, loads);

  it('sorts the marks and gives the axial-cap utilisation of ACI 318-19 22.4.2.1', () => {
    expect(s.columns.map((c) => c.mark)).toEqual(['A1', 'A2']);
    // Po = 0.85·f′c·(Ag − Ast) + fy·Ast = 0.85·4·(256 − 6.32) + 60·6.32 = 848.912 + 379.2 = 1228.112 kip (22.4.2.2)
    // φPn,max = φ·0.80·Po = 0.65·0.80·1228.112 = 638.618 kip (Table 22.4.2.1 tied, φ = 0.65 Table 21.2.2)
    // utilisation = 500 / 638.618 = 0.782941
    expectClose(s.columns[0]!.utilisation!, 500 / (0.65 * 0.8 * 1228.112), 1e-6);
    expect(s.columns[0]!.status).toBe('ok');
    expectClose(s.columns[0]!.rhoProvided!, 0.0246875, 1e-9);
  });

  it('gives the pure-tension utilisation of ACI 318-19 22.4.3.1', () => {
    // φPnt = 0.90·fy·Ast = 0.9·60·6.32 = 341.28 kip (φ = 0.90 tension-controlled, Table 21.2.2); 100 / 341.28 = 0.293014
    expectClose(s.columns[1]!.utilisation!, 100 / 341.28, 1e-5); // the ray solver stops within ~2e-6 here
  });

  it('equals checkColumn of the same column and loads, mark by mark', () => {
    for (const c of s.columns) {
      const single = checkColumn({ ...section, loads: loads.get(c.mark)! });
      expect(c.utilisation).toBe(single.results[0]!.measureValue);
      expect(c.governing).toBe(single.governingId);
      expect(c.exitCode).toBe(single.exitCode);
    }
  });

  it('fails naming the mark when a mark is on one side only, unless allowed', () => {
    const extra = new Map([...loads, ['Z9', [{ id: 'x', Pu: 1, Mu: 0 }]]]);
    expect(() => checkSchedule(schedule, extra)).toThrow('loads mark: "Z9" is not in the schedule');
    const fewer = new Map([...loads].filter(([m]) => m !== 'A2'));
    expect(() => checkSchedule(schedule, fewer)).toThrow('schedule mark: "A2" has no loads');
    const allowed = checkSchedule(schedule, fewer, { allowMissing: true });
    expect(allowed.columns.map((c) => c.mark)).toEqual(['A1']);
    expect(allowed.missing.withoutLoads).toEqual(['A2']);
  });

  it('fails a mark whose load exceeds the cap, and counts by every status of the check', () => {
    const over = checkSchedule([{ mark: 'B1', input: section }], new Map([['B1', [{ id: 'big', Pu: 700, Mu: 0 }]]]));
    // 700 / 638.618 = 1.0961 > 1 (ACI 318-19 22.4.2.1)
    expect(over.columns[0]!.status).toBe('fails');
    expect(over.exitCode).toBe(1);
    expect(Object.keys(over.summary.counts)).toEqual([...LOAD_STATUSES]);
    expect(over.summary.text).toBe('1 mark: 1 fails');
  });
});

describe('compareMarks and summariseSchedule', () => {
  it('orders marks naturally (common practice: C2 before C10)', () => {
    expect(['C10', 'C2', 'B1', 'C1', 'C02'].sort(compareMarks)).toEqual(['B1', 'C1', 'C2', 'C02', 'C10']);
  });
  it('exits 1 when any mark does not pass', () => {
    expect(summariseSchedule([{ status: 'ok', exitCode: 0 }]).exitCode).toBe(0);
    expect(summariseSchedule([{ status: 'ok', exitCode: 0 }, { status: 'unstable', exitCode: 1 }]).exitCode).toBe(1);
  });
});

describe('a load’s own βdns (issue 22: beta_dns per load, the schedule’s value the default)', () => {
  // 16 × 16 in, 8 #8, klu = 20 ft: the magnifier of ACI 318-19 6.6.4.5 uses (EI)eff = 0.4·Ec·Ig/(1 + βdns) (6.6.4.4.4(a)),
  // so a larger βdns lowers Pc and raises δ: the load's own βdns must reach the engine.
  const slender = (beta: number) => ({ x: { effectiveLength: 240, betaDns: beta, eiOption: 'a' as const, transverseLoads: false } });
  const load = { id: 'L', Pu: 300, Mu: 60 * 12 };
  it('replaces the member’s βdns for that load', () => {
    const own = checkColumn({ ...section, slenderness: slender(0.2), loads: [{ ...load, betaDns: 0.9 }] });
    const member09 = checkColumn({ ...section, slenderness: slender(0.9), loads: [load] });
    const member02 = checkColumn({ ...section, slenderness: slender(0.2), loads: [load] });
    expect(own.results[0]!.Mu).toBe(member09.results[0]!.Mu);
    expect(own.results[0]!.measureValue).toBe(member09.results[0]!.measureValue);
    expect(member09.results[0]!.Mu).toBeGreaterThan(member02.results[0]!.Mu);
  });
});

describe('readings: false', () => {
  it('gives the same rows as the full check (the readings change no status, measure or ranking)', () => {
    const loads = new Map<string, FactoredLoad[]>([
      ['R1', [{ id: 'a', Pu: 300, Mu: 900, Muy: 400 }, { id: 'b', Pu: 150, Mu: -1200 }, { id: 'c', Pu: -50, Mu: 300, Muy: -200 }]],
    ]);
    const entry = [{ mark: 'R1', input: { ...section, slenderness: { x: { effectiveLength: 200, betaDns: 0.5, eiOption: 'a' as const, transverseLoads: false } } } }];
    const full = checkSchedule(entry, loads).columns[0]!;
    const bare = checkSchedule(entry, loads, { readings: false }).columns[0]!;
    const { check: _a, ...f } = full;
    const { check: _b, ...b } = bare;
    expect(b).toEqual(f);
    expect(full.check.results.some((r) => r.rhoFromChart !== null)).toBe(true);
    expect(bare.check.results.every((r) => r.rhoFromChart === null)).toBe(true);
  });
});
