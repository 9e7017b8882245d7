/**
 * The worked hand-check of issue 4: 24 × 24 in tied column, bars on two faces, f′c = 4 ksi, fy = 60 ksi,
 * ACI 318-19, Pu = 900 kip, Mu = 600 kip-ft (e = 8 in). Source: common practice, worked by hand.
 * Bar areas: ASTM A615/A615M Table 1. Steel limits: ACI 318-19 10.6.1.1.
 */
import { describe, expect, it } from 'vitest';
import { resolveBasis } from '../../src/codes/registry.js';
import { barsForArea } from '../../src/design/bar-selection.js';
import { capacityAlongRay } from '../../src/design/ray.js';
import { checkOneLoad as checkLoad, prepareColumnCheck as prepareCheck } from '../../src/design/column-check.js';
import { barSet, findBar } from '../../src/section/bar-tables.js';

const basis = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
const shape = { kind: 'rectangle', b: 24, h: 24 } as const;
const arrangement = { kind: 'two-faces', barsPerFace: 2 } as const;
const load = { id: 'hand', Pu: 900, Mu: 600 * 12 };
const ag = 576;

const close = (actual: number, expected: number, rel: number) => expect(Math.abs(actual - expected)).toBeLessThanOrEqual(rel * Math.abs(expected));

describe('hand-check at γ = 0.75 (common practice, worked by hand)', () => {
  const ctx = prepareCheck({ basis, shape, arrangement, gamma: 0.75, capContext: { depth: 24 }, loads: [load] });
  const n = { P: 900 / ag, M: 7200 / (ag * 24) };

  it('normalises to Pu/(b·h) = 1.56 ksi and Mu/(b·h²) = 0.52 ksi', () => {
    const r = checkLoad(ctx, load, 0);
    close(r.normalised.P, 1.5625, 1e-9);
    close(r.normalised.M, 0.5208, 1e-3);
    close(r.normalised.eOverH!, 8 / 24, 1e-9);
  });

  it('φPn along the load ray is about 825 kip at ρg = 0.02 and 954 kip at ρg = 0.03', () => {
    close(capacityAlongRay(ctx.variants[0]!.table, 0.02, n).P * ag, 825, 0.002);
    close(capacityAlongRay(ctx.variants[0]!.table, 0.03, n).P * ag, 954, 0.002);
  });

  it('ρg = 0.03 is the smallest 0.01-step curve enclosing the point; 0.02 is not enough', () => {
    expect(capacityAlongRay(ctx.variants[0]!.table, 0.02, n).utilisation).toBeGreaterThan(1);
    expect(capacityAlongRay(ctx.variants[0]!.table, 0.03, n).utilisation).toBeLessThan(1);
    const r = checkLoad(ctx, load, 0);
    expect(r.rhoRoundedDown).toBe(0.03);
    expect(r.rhoRequired!).toBeGreaterThan(0.02);
    expect(r.rhoRequired!).toBeLessThan(0.03);
  });
});

describe('steel and bars (common practice, worked by hand; ASTM A615 Table 1)', () => {
  it('17.28 in² with #11 bars (1.56 in²) is 11.07, so 12 bars, 6 per face', () => {
    const bar = findBar(barSet('astm-a615'), '#11')!;
    expect(bar.area).toBe(1.56);
    close(0.03 * ag, 17.28, 1e-12);
    close((0.03 * ag) / bar.area, 11.07, 1e-3);
    expect(barsForArea(0.03 * ag, bar, 'two-faces')).toEqual({ count: 12, perFace: 6 });
  });
});

describe('exact answer at γ = 20/24 = 0.833 (common practice, worked by hand)', () => {
  const gamma = 20 / 24;
  const ctx = prepareCheck({ basis, shape, arrangement, gamma, capContext: { depth: 24 }, loads: [load] });
  const r = checkLoad(ctx, load, 0);

  it('reads the 0.80 sheet for the traditional answer and rounds up to 0.03', () => {
    expect(r.chartSheets.map((s) => s.gamma)).toEqual([0.8, 0.85]);
    expect(r.rhoRoundedDown).toBe(0.03);
  });

  it('the exact ρg is lower than the rounded-down reading, and the steel saved is shown', () => {
    expect(r.rhoStatus).toBe('ok');
    expect(r.rhoRequired!).toBeLessThan(0.03);
    expect(r.extraSteelRoundedDown!).toBeCloseTo((0.03 - r.rhoRequired!) * ag, 9);
    expect(r.extraSteelRoundedDown!).toBeGreaterThan(2); // more than one #9 bar of steel saved
  });

  it('the capacity at the exact ρg equals the demand', () => {
    const cap = capacityAlongRay(ctx.variants[0]!.table, r.rhoRequired!, { P: 900 / ag, M: 7200 / (ag * 24) });
    close(cap.utilisation, 1, 1e-6);
    expect(r.strain.class).toBe('compression-controlled');
    expect(r.strain.phi).toBe(0.65);
  });
});

describe('bar table and limits (ASTM A615/A615M Table 1; ACI 318-19 10.6.1.1)', () => {
  const expected: [string, number, number][] = [
    ['#3', 0.375, 0.11], ['#4', 0.5, 0.2], ['#5', 0.625, 0.31], ['#6', 0.75, 0.44], ['#7', 0.875, 0.6],
    ['#8', 1.0, 0.79], ['#9', 1.128, 1.0], ['#10', 1.27, 1.27], ['#11', 1.41, 1.56], ['#14', 1.693, 2.25], ['#18', 2.257, 4.0],
  ];
  it.each(expected)('%s is %f in, %f in²', (name, d, a) => {
    const bar = findBar(barSet('astm-a615'), name)!;
    expect(bar.diameter).toBe(d);
    expect(bar.area).toBe(a);
  });
  it('ρg limits are 0.01–0.08', () => {
    expect(basis.rhoLimits).toEqual({ min: 0.01, max: 0.08 });
  });
});
