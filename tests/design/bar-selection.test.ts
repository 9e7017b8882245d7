/**
 * Bar proposals. Spacing rule: ACI 318-19 25.2.3 (max(1.5 in, 1.5·db, 4/3·aggregate)); steel limits
 * ACI 318-19 10.6.1.1; bar sizes ASTM A615/A615M Table 1; γ from cover + tie + db/2 (common practice).
 */
import { describe, expect, it } from 'vitest';
import { resolveBasis } from '../../src/codes/registry.js';
import { barsForArea, clearSpacing, perFaceFor, proposeBars, requiredClearSpacing } from '../../src/design/bar-selection.js';
import { barSet } from '../../src/section/bar-tables.js';
import type { Basis } from '../../src/codes/types.js';
import { layoutVerifier } from '../../src/design/column-check.js';
import { grossArea, sectionDepth } from '../../src/section/geometry.js';
import type { Shape } from '../../src/section/types.js';

const aciUs = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
const aciSi = resolveBasis('aci318-19', { units: 'si', fc: 28, fy: 420, transverse: 'tied' });
const ec2 = resolveBasis('en1992-1-1', { units: 'si', fc: 30, fy: 500, transverse: 'tied' });
const csa = resolveBasis('csa-a23.3-19', { units: 'si', fc: 35, fy: 400, transverse: 'tied' });

describe('requiredClearSpacing (ACI 318-19 25.2.3)', () => {
  it('is 1.5 in for small bars, 1.5·db for large, 4/3 of the aggregate when that is larger', () => {
    expect(requiredClearSpacing(aciUs, 0.75)).toBe(1.5);
    expect(requiredClearSpacing(aciUs, 1.41)).toBeCloseTo(2.115, 12);
    expect(requiredClearSpacing(aciUs, 0.75, 1.5)).toBeCloseTo(2, 12);
    expect(requiredClearSpacing(aciSi, 20)).toBe(40); // ACI 318M-19 25.2.3: 40 mm (from memory)
    expect(requiredClearSpacing(aciSi, 32)).toBe(48);
  });
});

describe('requiredClearSpacing of the other bases', () => {
  it('EN 1992-1-1 8.2(2): max(k1·φ, dg + k2, 20 mm), recommended k1 = 1, k2 = 5 mm', () => {
    expect(requiredClearSpacing(ec2, 16)).toBe(20); // 20 mm floor
    expect(requiredClearSpacing(ec2, 32)).toBe(32); // k1·φ = 32
    expect(requiredClearSpacing(ec2, 16, 32)).toBe(37); // dg + k2 = 32 + 5
  });
  it('CSA A23.1-19 6.6.5.2 (from memory): max(1.4·db, 1.4·aggregate, 30 mm)', () => {
    expect(requiredClearSpacing(csa, 19.5)).toBe(30); // 1.4·19.5 = 27.3 < 30
    expect(requiredClearSpacing(csa, 35.7)).toBeCloseTo(49.98, 10); // 35M: 1.4·35.7
    expect(requiredClearSpacing(csa, 20, 28)).toBeCloseTo(39.2, 10); // 1.4·28
  });
});

describe('counts per face', () => {
  it('follow the arrangement and the 4-bar (tied) / 6-bar (spiral) minimum', () => {
    expect(perFaceFor('two-faces', 11, 4)).toBe(6);
    expect(perFaceFor('four-faces', 12, 4)).toBe(4); // 4·(4 − 1) = 12
    expect(perFaceFor('ring', 3, 6)).toBe(6);
    expect(barsForArea(0.5, { area: 1 }, 'two-faces')).toEqual({ count: 4, perFace: 2 });
  });
  it('clear spacing of 6 #11 per face across 24 in with 2 in to centres is 20/5 − 1.41 in', () => {
    expect(clearSpacing({ kind: 'rectangle', b: 24, h: 24 }, 'two-faces', 6, 20 / 24, 1.41)).toBeCloseTo(4 - 1.41, 12);
  });
});

/** The engine's re-verification for normalised uniaxial loads (P/Ag, M/(Ag·h)). */
function verifierFor(basis: Basis, shape: Shape, kind: 'two-faces' | 'ring', loads: { P: number; M: number }[]) {
  const ag = grossArea(shape);
  const h = sectionDepth(shape);
  const arrangement = kind === 'ring' ? { kind, bars: 8 } : { kind, barsPerFace: 2 };
  return layoutVerifier({ basis, shape, arrangement, gamma: 0.8, loads: loads.map((l, i) => ({ id: `L${i}`, Pu: l.P * ag, Mu: l.M * ag * h })) });
}

describe('proposeBars', () => {
  const basis = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
  const shape = { kind: 'rectangle', b: 24, h: 24 } as const;
  const sizes = barSet('astm-a615').sizes.filter((s) => s.diameter >= 0.625);
  const loads = [{ P: 900 / 576, M: 7200 / (576 * 24) }];
  const props = proposeBars({
    basis,
    shape,
    kind: 'two-faces',
    detailing: { kind: 'cover', cover: 1.5, tieDiameter: 0.5 },
    sizes,
    requiredArea: 0.024 * 576,
    areaLimits: { min: 5.76, max: 46.08 },
    verify: verifierFor(basis, shape, 'two-faces', loads),
    aggregate: 1,
  });

  it('returns layouts sorted by steel area that pass every limit and the re-verification', () => {
    expect(props.length).toBeGreaterThan(0);
    for (let i = 1; i < props.length; i++) expect(props[i]!.area).toBeGreaterThanOrEqual(props[i - 1]!.area);
    for (const p of props) {
      expect(p.utilisation).toBeLessThanOrEqual(1);
      expect(p.clearSpacing).toBeGreaterThanOrEqual(p.clearSpacingRequired);
      expect(p.count).toBeGreaterThanOrEqual(4);
      expect(p.rho).toBeGreaterThanOrEqual(0.01);
      expect(p.rho).toBeLessThanOrEqual(0.08);
      // γ from 1.5 in cover + 0.5 in tie + db/2 on each side
      expect(p.gamma).toBeCloseTo((24 - 2 * (2 + p.barDiameter / 2)) / 24, 12);
    }
  });

  it('fails re-verification for a layout one bar pair lighter than the lightest proposal', () => {
    const best = props[0]!;
    const lighter = proposeBars({
      basis, shape, kind: 'two-faces', detailing: { kind: 'cover', cover: 1.5, tieDiameter: 0.5 },
      sizes: sizes.filter((s) => s.name === best.size), requiredArea: best.area - 2 * best.barArea, areaLimits: { min: 5.76, max: 46.08 },
      verify: verifierFor(basis, shape, 'two-faces', loads), aggregate: 1, extraCounts: 0,
    });
    expect(lighter).toEqual([]);
  });
});

describe('minimum bar count by basis', () => {
  it('ACI 318-19 10.7.3.1 (from memory): 4 bars within ties, 6 within a spiral', () => {
    expect(resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' }).minimumBarCount('circle')).toBe(4);
    expect(resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'spiral' }).minimumBarCount('circle')).toBe(6);
  });
  it('EN 1992-1-1 9.5.2(4): at least 4 bars in a circular column, whatever the transverse steel', () => {
    expect(resolveBasis('en1992-1-1', { units: 'si', fc: 30, fy: 500, transverse: 'spiral' }).minimumBarCount('circle')).toBe(4);
  });
  it('proposals for a small spiral column with a light demand stop at the basis minimum', () => {
    const run = (code: string, fc: number, fy: number) => {
      const basis = resolveBasis(code, { units: 'si', fc, fy, transverse: 'spiral' });
      return proposeBars({
        basis,
        shape: { kind: 'circle', diameter: 300 },
        kind: 'ring',
        detailing: { kind: 'cover', cover: 40, tieDiameter: 10 },
        sizes: barSet('metric').sizes.filter((s) => s.diameter >= 12),
        requiredArea: 0,
        areaLimits: { min: 0.01 * Math.PI * 150 * 150, max: 0.04 * Math.PI * 150 * 150 },
        verify: verifierFor(basis, { kind: 'circle', diameter: 300 }, 'ring', [{ P: 1, M: 0.1 }]),
        aggregate: 20,
      });
    };
    expect(Math.min(...run('aci318-19', 30, 420).map((p) => p.count))).toBe(6);
    expect(Math.min(...run('en1992-1-1', 30, 500).map((p) => p.count))).toBe(4);
  });
});
