/**
 * The inner (conservative) branch a sheet draws and the check's chart reading reads (issue: bar-entry steps
 * fold back into Z shapes). Outside references: the Z below is worked by hand; the circular section is the
 * demo's 8-bar ring (ACI 318-19 22.2, block with displaced concrete deducted), whose computed points fold
 * back in P at each bar-entry step (the step ΔP = block stress × the row's bar area, at one depth).
 */
import { describe, expect, it } from 'vitest';
import { innerBranch, selfCrossing } from '../../src/analysis/inner-branch.js';
import { computeFamily } from '../../src/analysis/family.js';
import { resolveBasis } from '../../src/codes/registry.js';
import { drawnScale } from '../../src/design/chart-reading.js';
import { expectClose } from '../helpers/tolerance.js';

describe('innerBranch', () => {
  it('keeps the least moment at each axial level through a Z fold (hand calculation)', () => {
    // up to (3, 1), a step back to (2.9, 0.2), on up through (2.5, 1.5), crossing the first branch.
    // First branch from (2, −1): M = 2 + (P + 1)/2; second: M = 2.9 − 0.4·(P − 0.2)/1.3. They cross where
    // 2.5 + 0.5·P = 2.9 − 0.30769·(P − 0.2), P = 0.46154/0.80769 = 0.57143, M = 2.78571; below that the
    // first is inner (at P = 0.2: 2.6 < 2.9), above it the second (at P = 1: 2.65385 < 3).
    const M = [0, 1, 2, 3, 2.9, 2.5, 3.4, 3, 0];
    const P = [-5, -3, -1, 1, 0.2, 1.5, 3, 5, 5];
    const b = innerBranch(M, P);
    for (let i = 1; i < b.P.length; i++) expect(b.P[i]!).toBeGreaterThanOrEqual(b.P[i - 1]!);
    expectClose(b.M[b.P.indexOf(0.2)]!, 2.6, 1e-12);
    const x = b.P.findIndex((p) => Math.abs(p - 0.57143) < 1e-4);
    expectClose(b.M[x]!, 2.78571, 1e-4);
    expectClose(b.M[b.P.indexOf(1)]!, 2.65385, 1e-4);
    expect(b.M.some((m, i) => m === 3 && b.P[i] === 1)).toBe(false);
    expect(selfCrossing(M, P)).not.toBeNull();
    expect(selfCrossing(b.M, b.P)).toBeNull();
  });

  it('keeps the flat top of a capped curve from its start to its least moment', () => {
    const b = innerBranch([0, 2, 3, 2, 1.5, 0.8, 0], [-4, -1, 1, 3, 3, 3, 3]);
    expect(b.P.slice(-2)).toEqual([3, 3]);
    expect(b.M.slice(-2)).toEqual([2, 0]);
  });

  // ACI 318-19, f′c 7 ksi, fy 80 ksi, circle γ 0.75, 8 bars in a ring, spiral (the demo's circular sheet)
  const basis = resolveBasis('aci318-19', { units: 'us', fc: 7, fy: 80, transverse: 'spiral' });
  const family = computeFamily({ basis, shape: { kind: 'circle', diameter: 1 }, arrangement: { kind: 'ring', bars: 8 }, gamma: 0.75, rhos: [0.01, 0.04, 0.08], basePoints: 240 });

  it('on the 8-bar ring: the computed points fold back, the inner branch never does, and lies on or inside every computed point at its level', () => {
    for (const c of family.curves) {
      const P = Array.from(c.phiPn);
      const M = Array.from(c.phiMn);
      let drops = 0;
      for (let i = 1; i < P.length; i++) if (P[i]! < P[i - 1]! - 1e-9) drops++;
      expect(drops).toBeGreaterThan(0);
      const b = innerBranch(M, P);
      for (let i = 1; i < b.P.length; i++) expect(b.P[i]!).toBeGreaterThanOrEqual(b.P[i - 1]!);
      expect(selfCrossing(b.M, b.P)).toBeNull();
      // conservative: at every computed point's level, the drawn moment is not larger
      const at = (p: number) => {
        let m = Infinity;
        for (let k = 0; k + 1 < b.P.length; k++) if (b.P[k]! <= p + 1e-12 && p <= b.P[k + 1]! + 1e-12) m = Math.min(m, b.P[k + 1] === b.P[k] ? Math.min(b.M[k]!, b.M[k + 1]!) : b.M[k]! + ((p - b.P[k]!) / (b.P[k + 1]! - b.P[k]!)) * (b.M[k + 1]! - b.M[k]!));
        return m;
      };
      for (let i = 0; i < P.length; i++) expect(at(P[i]!), `point ${i}`).toBeLessThanOrEqual(M[i]! + 1e-9);
    }
  });

  it('the chart reading meets the drawn inner branch: never outside the computed points along the load ray', () => {
    const c = family.curves[2]!;
    const P = Array.from(c.phiPn);
    const M = Array.from(c.phiMn);
    for (let e = 0.02; e < 3; e *= 1.15) {
      for (const sign of [1, -1]) {
        const load = sign > 0 ? { P: 1, M: e } : { P: -1, M: e };
        const s = drawnScale(c, load);
        expect(Number.isFinite(s)).toBe(true);
        // every crossing of the ray with a computed segment that is not a step lies at or beyond the reading
        for (let i = 0; i + 1 < P.length; i++) {
          if (P[i + 1]! < P[i]!) continue; // the step segment itself
          const d0 = P[i]! * load.M - M[i]! * load.P;
          const d1 = P[i + 1]! * load.M - M[i + 1]! * load.P;
          if (d0 * d1 > 0 || d0 === d1) continue;
          const t = d0 / (d0 - d1);
          const pm = M[i]! + t * (M[i + 1]! - M[i]!);
          const scale = pm / load.M;
          if (scale > 0) expect(s, `e ${e.toFixed(3)} sign ${sign}`).toBeLessThanOrEqual(scale + 1e-9);
        }
      }
    }
  });
});
