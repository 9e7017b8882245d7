/**
 * The library refuses nonsense (issue 25): each input below returned "ok", NaN, hung or threw a raw
 * TypeError before; now a PmError naming the field path, with the limits the CLI uses (src/input/limits.ts).
 */
import { describe, expect, it } from 'vitest';
import { checkColumn, computeBiaxialFamily, computeFamily, makeChartSet, PmError, readChartSet, resolveBasis, type ColumnCheckInput } from '../../src/index.js';

const basis = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
const good: ColumnCheckInput = {
  basis,
  shape: { kind: 'rectangle', b: 24, h: 24 },
  arrangement: { kind: 'two-faces', barsPerFace: 3 },
  gamma: 0.75,
  rho: 0.02,
  loads: [{ id: 'A', Pu: 500, Mu: 200 * 12 }],
};
const family = { basis, shape: { kind: 'rectangle', b: 1, h: 1 } as const, arrangement: { kind: 'two-faces', barsPerFace: 3 } as const, gamma: 0.75, rhos: [0.01, 0.02] };

const refusal = (fn: () => unknown): string => {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(PmError);
    return (e as PmError).path;
  }
  return 'accepted';
};

describe('checkColumn refuses nonsense with a field path', () => {
  it('a sound input still checks', () => {
    expect(checkColumn(good).results[0]!.status).toBe('ok');
  });
  it('Pu NaN, b −18, h NaN, ρ −1, γ 1.5, a load id with an escape', () => {
    expect(refusal(() => checkColumn({ ...good, loads: [{ id: 'A', Pu: NaN, Mu: 1 }] }))).toBe('loads[0].Pu');
    expect(refusal(() => checkColumn({ ...good, shape: { kind: 'rectangle', b: -18, h: 24 } }))).toBe('shape.b');
    expect(refusal(() => checkColumn({ ...good, shape: { kind: 'rectangle', b: 24, h: NaN } }))).toBe('shape.h');
    expect(refusal(() => checkColumn({ ...good, rho: -1 }))).toBe('rho');
    expect(refusal(() => checkColumn({ ...good, gamma: 1.5 }))).toBe('gamma');
    expect(refusal(() => checkColumn({ ...good, loads: [{ id: 'A\u001b[2J', Pu: 1, Mu: 1 }] }))).toBe('loads[0].id');
    expect(refusal(() => checkColumn({ ...good, loads: [] }))).toBe('loads');
  });
  it('null inputs give a PmError, not a TypeError', () => {
    expect(refusal(() => checkColumn(null as unknown as ColumnCheckInput))).toBe('input');
    expect(refusal(() => checkColumn({ ...good, shape: null as unknown as ColumnCheckInput['shape'] }))).toBe('shape');
    expect(refusal(() => checkColumn({ ...good, basis: null as unknown as ColumnCheckInput['basis'] }))).toBe('basis');
    expect(refusal(() => checkColumn({ ...good, loads: [null as unknown as ColumnCheckInput['loads'][number]] }))).toBe('loads[0]');
  });
});

describe('computeFamily and computeBiaxialFamily refuse nonsense', () => {
  it('γ NaN, barsPerFace 0, basePoints 10⁹, 10⁶ ρ values', () => {
    expect(refusal(() => computeFamily({ ...family, gamma: NaN }))).toBe('gamma');
    expect(refusal(() => computeFamily({ ...family, arrangement: { kind: 'two-faces', barsPerFace: 0 } }))).toBe('arrangement.barsPerFace');
    expect(refusal(() => computeFamily({ ...family, basePoints: 1e9 }))).toBe('basePoints');
    expect(refusal(() => computeFamily({ ...family, rhos: new Array(1e6).fill(0.01) }))).toBe('rhos');
    expect(refusal(() => computeFamily(null as unknown as Parameters<typeof computeFamily>[0]))).toBe('request');
    expect(computeFamily(family).curves).toHaveLength(2);
  });
  it('biaxial: levels beyond the range, a circle with two-faces bars', () => {
    const req = { ...family, levels: [0.2] };
    expect(refusal(() => computeBiaxialFamily({ ...req, levels: [5] }))).toBe('levels[0]');
    expect(refusal(() => computeBiaxialFamily({ ...req, shape: { kind: 'circle', diameter: 1 } }))).toBe('arrangement.kind');
  });
});

describe('makeChartSet options', () => {
  it('chunkSize 0 (looped forever) and jobs 0 are refused before any work', async () => {
    const set = readChartSet(
      JSON.stringify({ name: 'tiny', titleBlock: { office: 'Invented Office', project: 'Invented Project', date: '2026-01-05' }, units: 'us', basis: { code: 'aci318-19' }, sheets: [{ fc: 4, fy: 60, gamma: 0.8, arrangement: { kind: 'two-faces', barsPerFace: 3 } }] }),
    );
    await expect(makeChartSet(set, { generator: 'test', chunkSize: 0, outDir: '/nonexistent-never-written' })).rejects.toThrow(/^chunkSize: /);
    await expect(makeChartSet(set, { generator: 'test', jobs: 0, outDir: '/nonexistent-never-written' })).rejects.toThrow(/^jobs: /);
  });
});
