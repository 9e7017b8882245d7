/**
 * The detailing rules of every rulebook (Basis.detailing, issue 19): each rule with its clause and source,
 * and a row below for every rule a rulebook registers (a rule without a row fails the matrix test).
 * Sources: ACI 318-19 10.6.1.1, 10.3.1.2, 25.2.3, Table 20.6.1.3.1 (318-14 Table 20.5.1.3.1), R10.6.1.1 and
 * 25.5.1.1 (from memory); EN 1992-1-1 9.5.2(2), 9.5.2(3), 8.2(2) (recommended values), 4.4.1.2(3) and 8.8
 * (from memory); AS 3600-2018 10.7.1 and 4.10.3 (from memory); CSA A23.3-19 10.9.1, 10.9.2, 10.10.5,
 * 12.14.2.1 and CSA A23.1-19 6.6.5.2, Table 17 (from memory).
 */
import { describe, expect, it } from 'vitest';
import { DESIGN_CODES, resolveBasis } from '../../src/codes/registry.js';
import type { Basis, CodeId } from '../../src/codes/types.js';
import { loadSteelDetailing } from '../../src/design/detailing.js';
import { expectClose } from '../helpers/tolerance.js';

const basisOf = (code: CodeId): Basis =>
  code.startsWith('aci')
    ? resolveBasis(code, { units: 'us', fc: 4, fy: 60, transverse: 'tied' })
    : code === 'en1992-1-1'
      ? resolveBasis(code, { units: 'si', fc: 30, fy: 500, transverse: 'tied' })
      : code === 'csa-a23.3-19'
        ? resolveBasis(code, { units: 'si', fc: 35, fy: 400, transverse: 'tied' })
        : resolveBasis(code, { units: 'si', fc: 40, fy: 500, transverse: 'tied' });

/** One row per rule of every rulebook: clause, binding, and a check of the figure the rule uses. */
type Row = { clause: string; binding: boolean; check: (b: Basis) => void };
const ratio = (b: Basis, Pu = 0) => {
  const l = b.steelAreaLimits(Pu, 1);
  return { min: l.min, max: l.max };
};
const MATRIX: Record<CodeId, Record<string, Row>> = {
  'aci318-19': {
    // 10.6.1.1: 0.01·Ag ≤ Ast ≤ 0.08·Ag
    'steel-min': { clause: '10.6.1.1', binding: true, check: (b) => expect(ratio(b).min).toBe(0.01) },
    'steel-max': { clause: '10.6.1.1', binding: true, check: (b) => expect(ratio(b).max).toBe(0.08) },
    // R10.6.1.1 (from memory): about 0.04 where bars are lapped
    'steel-max-lap': { clause: 'R10.6.1.1', binding: false, check: (b) => expect(b.detailing.lapZoneRho).toBe(0.04) },
    // 25.2.3: max(1.5 in, 1.5·db, 4/3·dagg): #8 at 3/4 in aggregate → 1.5 in; #11 → 1.5·1.41 = 2.115 in
    'clear-spacing': { clause: '25.2.3', binding: true, check: (b) => (expect(b.minimumClearSpacing(1.0, 0.75)).toBe(1.5), expectClose(b.minimumClearSpacing(1.41, 0.75), 2.115, 1e-12)) },
    // Table 20.6.1.3.1: columns not exposed to weather or in contact with ground, 1.5 in to ties
    cover: { clause: 'Table 20.6.1.3.1', binding: true, check: (b) => expect(b.detailing.minimumCover(0.5, 1.41)).toBe(1.5) },
    // 25.5.1.1 (from memory): no lap splices of bars larger than No. 11 (1.41 in)
    'bar-size-lap': { clause: '25.5.1.1', binding: false, check: (b) => expect(b.detailing.maxLappedBar).toBe(1.41) },
  },
  'aci318-14': {
    'steel-min': { clause: '10.6.1.1', binding: true, check: (b) => expect(ratio(b).min).toBe(0.01) },
    'steel-max': { clause: '10.6.1.1', binding: true, check: (b) => expect(ratio(b).max).toBe(0.08) },
    'steel-max-lap': { clause: 'R10.6.1.1', binding: false, check: (b) => expect(b.detailing.lapZoneRho).toBe(0.04) },
    'clear-spacing': { clause: '25.2.3', binding: true, check: (b) => expect(b.minimumClearSpacing(1.0, 0.75)).toBe(1.5) },
    // ACI 318-14 Table 20.5.1.3.1: the same 1.5 in
    cover: { clause: 'Table 20.5.1.3.1', binding: true, check: (b) => expect(b.detailing.minimumCover(0.5, 1.0)).toBe(1.5) },
    'bar-size-lap': { clause: '25.5.1.1', binding: false, check: (b) => expect(b.detailing.maxLappedBar).toBe(1.41) },
  },
  'en1992-1-1': {
    // 9.5.2(2): As,min = max(0.10·NEd/fyd, 0.002·Ac); NEd = 2000 kN on Ac = 160 000 mm²: 0.1·2e6/434.78 = 460 mm² → 0.002875
    'steel-min': { clause: '9.5.2(2)', binding: true, check: (b) => (expect(ratio(b).min).toBe(0.002), expectClose(b.steelAreaLimits(2000e3, 160000).min / 160000, (0.1 * 2e6) / (500 / 1.15) / 160000, 1e-9)) },
    // 9.5.2(3): 0.04·Ac outside laps
    'steel-max': { clause: '9.5.2(3)', binding: true, check: (b) => expect(ratio(b).max).toBe(0.04) },
    // 9.5.2(3): 0.08·Ac at laps, so bars lapped at one level flag above 0.04 between laps
    'steel-max-lap': { clause: '9.5.2(3)', binding: false, check: (b) => expect(b.detailing.lapZoneRho).toBe(0.04) },
    // 8.2(2): max(k1·φ, dg + k2, 20 mm), k1 = 1, k2 = 5 mm: 16 mm bars at 20 mm aggregate → 25 mm
    'clear-spacing': { clause: '8.2(2)', binding: true, check: (b) => expect(b.minimumClearSpacing(16, 20)).toBe(25) },
    // 4.4.1.2(3) Table 4.2 (from memory): cmin,b = φ: 8 mm link, 32 mm bar → max(8, 32 − 8, 10) = 24 mm
    cover: { clause: '4.4.1.2(3)', binding: true, check: (b) => (expect(b.detailing.minimumCover(8, 32)).toBe(24), expect(b.detailing.minimumCover(6, 12)).toBe(10)) },
    // 8.8 (from memory): φlarge = 32 mm recommended
    'bar-size-lap': { clause: '8.8', binding: false, check: (b) => expect(b.detailing.maxLappedBar).toBe(32) },
  },
  'as3600-2018': {
    // 10.7.1 (from memory): 0.01·Ag ≤ As ≤ 0.04·Ag
    'steel-min': { clause: '10.7.1', binding: true, check: (b) => expect(ratio(b).min).toBe(0.01) },
    'steel-max': { clause: '10.7.1', binding: true, check: (b) => expect(ratio(b).max).toBe(0.04) },
    'steel-max-lap': { clause: '10.7.1', binding: false, check: (b) => expect(b.detailing.lapZoneRho).toBe(0.04) },
    // (from memory): max(db, 1.5·aggregate, 25 mm): 20 mm bars at 20 mm aggregate → 30 mm
    'clear-spacing': { clause: 'not verified', binding: true, check: (b) => expect(b.minimumClearSpacing(20, 20)).toBe(30) },
    // 4.10.3 (from memory): at least the bar diameter for placing: 10 mm tie, 32 mm bar → 22 mm
    cover: { clause: '4.10.3', binding: true, check: (b) => expect(b.detailing.minimumCover(10, 32)).toBe(22) },
  },
  'csa-a23.3-19': {
    // 10.9.1, 10.9.2 (from memory): 0.01·Ag ≤ As ≤ 0.08·Ag; 10.10.5 reduced effective area ≥ Ag/2
    'steel-min': { clause: '10.9.1', binding: true, check: (b) => (expect(ratio(b).min).toBe(0.01), expect(b.detailing.reducedAreaShare).toBe(0.5)) },
    'steel-max': { clause: '10.9.2', binding: true, check: (b) => expect(ratio(b).max).toBe(0.08) },
    'steel-max-lap': { clause: '10.9.2', binding: false, check: (b) => expect(b.detailing.lapZoneRho).toBe(0.04) },
    // CSA A23.1-19 6.6.5.2 (from memory): max(1.4·db, 1.4·aggregate, 30 mm): 25M at 20 mm aggregate → 1.4·25.2 = 35.28 mm
    'clear-spacing': { clause: 'CSA A23.1-19 6.6.5.2', binding: true, check: (b) => expectClose(b.minimumClearSpacing(25.2, 20), 35.28, 1e-12) },
    // CSA A23.1-19 Table 17 (from memory): 30 mm, columns at exposure N
    cover: { clause: 'CSA A23.1-19 Table 17', binding: true, check: (b) => expect(b.detailing.minimumCover(11.3, 25.2)).toBe(30) },
    // 12.14.2.1 (from memory): 45M and 55M are not lapped: 35M (35.7 mm) is the largest lapped
    'bar-size-lap': { clause: '12.14.2.1', binding: false, check: (b) => expect(b.detailing.maxLappedBar).toBe(35.7) },
  },
};

describe('the clause matrix of the detailing rules', () => {
  for (const code of Object.keys(DESIGN_CODES) as CodeId[]) {
    const basis = basisOf(code);
    it(`${code}: every registered detailing rule has a row, and every row a registered rule`, () => {
      expect(basis.detailing.rules.map((r) => r.id).sort()).toEqual(Object.keys(MATRIX[code]).sort());
    });
    for (const rule of basis.detailing.rules) {
      const row = MATRIX[code]?.[rule.id];
      it(`${code} ${rule.id} [${rule.clause}]`, () => {
        expect(row, `no test row for ${code} ${rule.id}`).toBeDefined();
        expect(rule.clause).toBe(row!.clause);
        expect(rule.binding).toBe(row!.binding);
        row!.check(basis);
      });
    }
  }
});

describe('the reduced effective area for the minimum steel', () => {
  const aci = basisOf('aci318-19');
  it('ACI 318-19 10.3.1.2: Ae ≥ Ag/2 — at a utilisation of 0.3 the minimum is 0.01·0.5 = 0.005 of Ag; at 0.7, 0.007; at 1.2 the full 0.01', () => {
    const min = (u: number) => loadSteelDetailing(aci, 100, 400, 0.02, u).find((f) => f.rule === 'steel-min')!.limit!;
    expectClose(min(0.3), 0.005, 1e-12);
    expectClose(min(0.7), 0.007, 1e-12);
    expectClose(min(1.2), 0.01, 1e-12);
  });
  it('ACI 318-19 10.3.1.2 does not apply to special moment frames: the full 0.01', () => {
    const seismic = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied', options: { columnUse: 'special-seismic' } });
    expect(seismic.detailing.reducedAreaShare).toBeUndefined();
    expectClose(loadSteelDetailing(seismic, 100, 400, 0.02, 0.3).find((f) => f.rule === 'steel-min')!.limit!, 0.01, 1e-12);
  });
  it('EN 1992-1-1 and AS 3600 have no such provision here: the minimum stays whole', () => {
    expect(basisOf('en1992-1-1').detailing.reducedAreaShare).toBeUndefined();
    expect(basisOf('as3600-2018').detailing.reducedAreaShare).toBeUndefined();
  });
});

describe('ACI 318 in SI units: the clear-spacing floor', () => {
  it('is 40 mm (ACI 318M-19 25.2.3, from memory), not the plain conversion of 1.5 in (38.1 mm)', () => {
    const si = resolveBasis('aci318-19', { units: 'si', fc: 28, fy: 420, transverse: 'tied' });
    // small bars, small aggregate: the floor governs; 1.5·20 = 30 mm and 4/3·19 = 25.3 mm are both below it
    expect(si.minimumClearSpacing(20, 19)).toBe(40);
    // 1.5·32.3 = 48.45 mm governs for a 32 mm bar
    expectClose(si.minimumClearSpacing(32.3, 19), 48.45, 1e-12);
  });
});
