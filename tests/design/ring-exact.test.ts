/**
 * Rings of bars in a circle, turned off their symmetric orientations: the neutral axis inclines (ACI 318-19 22.2.1,
 * EN 1992-1-1 6.1(2)–(3): plane sections, strain compatibility, equilibrium in both moments). Each case failed
 * (passed as "ok", or took the lower ρg) before the fix.
 *
 * A ring turned so that neither a bar nor a mid-gap lies on the bending plane is not symmetric about that plane: a
 * neutral axis held parallel to the bending axis leaves a moment about the other axis, so its uniaxial point is not
 * the capacity under a moment about one axis alone. The independent method: the exact surface of
 * src/analysis/biaxial.ts (itself tested against ACI 318-19 22.2 hand calculations in tests/analysis) on the bars
 * turned by that orientation, loaded by Mux alone; its neutral axis angle is searched for Muy = 0.
 */
import { describe, expect, it } from 'vitest';
import { capacityAlongRay as biaxialRay, prepareBiaxial } from '../../src/analysis/biaxial.js';
import { resolveBasis } from '../../src/codes/registry.js';
import { checkColumn } from '../../src/design/column-check.js';
import { layoutBars } from '../../src/section/arrangements.js';
import type { Bar } from '../../src/section/types.js';
import { expectClose } from '../helpers/tolerance.js';

// EN 1992-1-1 (parabola-rectangle, 3.1.7(1)), C30/37, fyk 500, γc 1.5, γs 1.15; ∅500 mm, 5 bars in a ring at γ = 0.75, ρg 0.01
const en = resolveBasis('en1992-1-1', { units: 'si', fc: 30, fy: 500, transverse: 'tied' });
const shape = { kind: 'circle' as const, diameter: 500 };
const area = Math.PI * 250 ** 2;
const ring = { kind: 'ring' as const, bars: 5 };
const turned = (bars: readonly Bar[], deg: number): Bar[] => {
  const t = (deg * Math.PI) / 180;
  return bars.map((b) => ({ x: b.x * Math.cos(t) - b.y * Math.sin(t), y: b.x * Math.sin(t) + b.y * Math.cos(t), area: b.area }));
};
// the engine samples 5 orientations over half the 72° pitch: 0 (bar on the plane), 9, 18, 27, 36° (mid-gap on the plane)
const TURNS = [9, 18, 27];
/** exact utilisation of the turned ring under Mux alone, the worst turn (the independent method above) */
const exactOverTurns = (rhoBars: number, Pu: number, Mu: number) =>
  Math.max(...TURNS.map((deg) => biaxialRay(prepareBiaxial(en, shape, turned(layoutBars(shape, ring, rhoBars * area, { gamma: 0.75 }), deg), { depth: 500 }), Pu, Mu, 0).utilisation));

describe('a ring turned off a bar or a mid-gap goes through the exact search (EN 1992-1-1 6.1)', () => {
  // ray through Pu = 1000 kN, Mu = 200 kN·m: scaling both keeps the ray, and the utilisation scales with them
  const base = { basis: en, shape, arrangement: ring, gamma: 0.75, capContext: { depth: 500 } };
  const probe = checkColumn({ ...base, rho: 0.01, loads: [{ id: 'probe', Pu: 1000e3, Mu: 200e6 }] }).results[0]!;
  const exact1 = exactOverTurns(0.01, 1000e3, 200e6);

  it('the exact capacity at a turned orientation is below the uniaxial one (tiny: about 0.01 %)', () => {
    const uniaxial = probe.utilisation!;
    expect(exact1 / uniaxial - 1).toBeGreaterThan(5e-5);
    expect(exact1 / uniaxial - 1).toBeLessThan(1e-3);
  });

  it('a load at uniaxial utilisation 0.99995 is ok uniaxially but fails the exact search: the measure is the larger', () => {
    const s = 0.99995 / probe.utilisation!;
    const r = checkColumn({ ...base, rho: 0.01, loads: [{ id: 'R', Pu: s * 1000e3, Mu: s * 200e6 }] }).results[0]!;
    expectClose(r.utilisation!, 0.99995, 1e-9);
    const exact = exactOverTurns(0.01, s * 1000e3, s * 200e6);
    expect(exact).toBeGreaterThan(1);
    expect(r.status).toBe('fails');
    expectClose(r.exactUniaxial!.utilisation!, exact, 1e-6);
    expectClose(r.measureValue!, exact, 1e-6);
    expect(r.measureFrom).toBe('x-exact');
    // the neutral axis inclines a little from the turned bending axis
    expect(Math.abs(r.exactUniaxial!.neutralAxisAngleDeg!)).toBeGreaterThan(0.01);
    expect(Math.abs(r.exactUniaxial!.neutralAxisAngleDeg!)).toBeLessThan(5);
    const f = r.findings.find((x) => x.rule === 'exact-section' && x.axis === 'x');
    expect(f).toMatchObject({ outcome: 'applied', quantity: 'ratio' });
    expectClose(f!.value!, exact, 1e-6);
    expectClose(f!.limit!, r.utilisation!, 1e-12);
  });

  it('about y alone (the EN 1992-1-1 6.1(4) minimum e0 = max(h/30, 20 mm) about y) the turned ring is searched too', () => {
    // e0 = max(500/30, 20) = 20 mm: M0,y = 1000 kN · 0.020 m = 20 kN·m about y; a circle turned about y is the same ring
    const r = probe;
    expectClose(r.yAxis!.Mdesign, 1000e3 * 20, 1e-9);
    expectClose(r.yAxis!.exact!.utilisation!, exactOverTurns(0.01, 1000e3, 20e6), 1e-6);
  });

  it('with no reinforcement given, the ρg required is not below the exact one', () => {
    const r = checkColumn({ ...base, loads: [{ id: 'R', Pu: 1000e3 / probe.utilisation!, Mu: 200e6 / probe.utilisation! }] }).results[0]!;
    // the uniaxial ρg required is 0.01 (the load sits on the ρg 0.01 curve); the exact one is higher
    expectClose(r.rhoRequired!, 0.01, 1e-5);
    expect(r.measureValue!).toBeGreaterThan(r.rhoRequired!);
    const exactRho = r.exactUniaxial!.rhoRequired!;
    expect(exactRho).toBeGreaterThan(r.rhoRequired!);
    expect(r.measureValue).toBe(exactRho);
    expect(r.measureFrom).toBe('x-exact');
    // at that ρg the worst turned ring is exactly at capacity
    expectClose(exactOverTurns(exactRho, 1000e3 / probe.utilisation!, 200e6 / probe.utilisation!), 1, 1e-6);
  });

  it('a ring at a symmetric orientation only (bar on the plane governs) gets the same figure from both methods', () => {
    // 6 bars, the orientation with a bar on the bending plane: the exact search (Muy = 0) equals the uniaxial point
    const sec = prepareBiaxial(en, shape, layoutBars(shape, { kind: 'ring', bars: 6 }, 0.01 * area, { gamma: 0.75 }), { depth: 500 });
    const r = checkColumn({ ...base, arrangement: { kind: 'ring', bars: 6 }, rho: 0.01, loads: [{ id: 'S', Pu: 1000e3, Mu: 200e6 }] }).results[0]!;
    const atBar = biaxialRay(sec, 1000e3, 200e6, 0).utilisation;
    const atGap = biaxialRay(sec, 1000e3, 200e6 * Math.cos(Math.PI / 6), 200e6 * Math.sin(Math.PI / 6)).utilisation;
    expectClose(r.utilisation!, Math.max(atBar, atGap), 1e-6);
  });
});
