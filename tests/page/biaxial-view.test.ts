/**
 * The live page's biaxial view without a browser: engine.ts's `biaxialView` (the one library call behind the
 * panels) and the rows biaxial-spec.ts draws from it. The drawn contours must be the ones the check read its
 * ρg chart biax from, on the check's own section (γB included); load points are normalised by hand.
 */
import { describe, expect, it } from 'vitest';
import { readLevel } from '../../src/design/biaxial-chart-reading.js';
import { biaxialRows, panelTitle } from '../../src/page/biaxial-spec.js';
import { biaxialView, loadsView, type PageFields } from '../../src/page/engine.js';
import { expectClose } from '../helpers/tolerance.js';

const fields = { fc: '4', fy: '60', gamma: '0.8', arrangement: 'four-faces', barsPerFace: '3,5', b: '16', h: '24' } as PageFields;
const words = { levelName: 'P/(f′c·Ag)', x: 'x', y: 'y' };

async function viewOf(f: PageFields, pu: string, mu: string, muy: string) {
  const lv = await loadsView(f, { kind: 'typed', pu, mu, muy }, 0.05);
  if (!lv.ok) throw new Error(lv.problem.message);
  return { lv: lv.value, v: biaxialView(lv.value.check)! };
}

describe('biaxialView (engine.ts)', () => {
  it('draws the contours the check read: same levels, same ρg family, same reading on each level', async () => {
    const { lv, v } = await viewOf(fields, '600', '300', '150');
    const r = lv.json.results[0]!.biaxial as { chartLevels: { level: number; rho: number | null }[] };
    expect(v.family.levels).toEqual(r.chartLevels.map((l) => l.level));
    expect(v.family.rhos).toEqual((lv.json.biaxialChart as { rhos: number[] }).rhos);
    expect(v.family.gamma).toBe(0.8);
    // hand normalisation: ν = 600/(4·16·24) = 0.390625; Mux/(Ag·h) = 300·12/(384·24) = 0.390625 ksi;
    // Muy/(Ag·b) = 150·12/(384·16) = 0.29296875 ksi
    expectClose(v.level, 0.390625, 1e-12);
    expectClose(v.loads[0]!.mx, 0.390625, 1e-12);
    expectClose(v.loads[0]!.my, 0.29296875, 1e-12);
    v.family.levels.forEach((_, i) => expectClose(readLevel(v.family, i, v.loads[0]!.mx, v.loads[0]!.my).rho!, r.chartLevels[i]!.rho!, 1e-6));
  });

  it('takes γB from the check: a narrower outer-column spacing gives other contours, still the ones read', async () => {
    const { lv, v } = await viewOf({ ...fields, gammaB: '0.6' } as PageFields, '600', '300', '150');
    const base = (await viewOf(fields, '600', '300', '150')).v;
    expect(v.family.gammaX).toBe(0.6);
    expect(v.family.contours[0]![3]!.myo).toBeLessThan(base.family.contours[0]![3]!.myo);
    const r = lv.json.results[0]!.biaxial as { chartLevels: { rho: number | null }[] };
    v.family.levels.forEach((_, i) => expectClose(readLevel(v.family, i, v.loads[0]!.mx, v.loads[0]!.my).rho!, r.chartLevels[i]!.rho!, 1e-6));
  });

  it('is null without Muy', async () => {
    const lv = await loadsView(fields, { kind: 'typed', pu: '600', mu: '300' }, 0.05);
    expect(lv.ok && biaxialView(lv.value.check)).toBe(null);
  });
});

describe('biaxialRows (biaxial-spec.ts)', () => {
  it('carries the contour points unchanged, one panel per level, and folds loads into the first quadrant', async () => {
    const { v } = await viewOf(fields, '600', '-300', '150');
    const rows = biaxialRows(v, words, 1);
    const c = v.family.contours[0]![2]!;
    const drawn = rows.filter((r) => r.kind === 'contour' && r.rho === c.rho && r.level === v.family.levels[0]);
    expect(drawn.map((r) => [r.x, r.y])).toEqual(c.mx.map((x, i) => [Math.round(x * 1e5) / 1e5 + 0, Math.round(c.my[i]! * 1e5) / 1e5 + 0]));
    expect([...new Set(rows.map((r) => r.panel))]).toEqual(v.family.levels.map((l) => panelTitle(words.levelName, l)));
    const load = rows.find((r) => r.kind === 'load')!;
    expect(load.x).toBeCloseTo(0.390625, 5);
    expect(load.governing).toBe(1);
    // dimensionless: every value divided by the normalising stress (4 ksi)
    const dimless = biaxialRows(v, words, 4).find((r) => r.kind === 'load')!;
    expect(dimless.x).toBeCloseTo(0.390625 / 4, 5);
  });
});
