/**
 * Bar proposals under the detailing rules (issue 19): one load that no layout can meet no longer removes the
 * proposals for the rest (they cover the loads that can be met and name the others); proposals are buildable
 * with the given cover and tie; above the lap-zone ratio, or with bars too large to lap, they are flagged.
 */
import { describe, expect, it } from 'vitest';
import { resolveBasis } from '../../src/codes/registry.js';
import { proposalFlags, proposeBars } from '../../src/design/bar-selection.js';
import { checkColumn, type ColumnCheckInput } from '../../src/design/column-check.js';
import { barSet } from '../../src/section/bar-tables.js';
import { expectClose } from '../helpers/tolerance.js';

const aci = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });
const en = resolveBasis('en1992-1-1', { units: 'si', fc: 30, fy: 500, transverse: 'tied' });
const sizes = barSet('astm-a615').sizes.filter((s) => s.diameter >= 0.625);

describe('one load beyond the maximum ρg no longer removes the proposals for the rest', () => {
  // 16 × 16 in, f′c 4 ksi, fy 60 ksi: Po at ρg 0.08 = 0.85·4·(256 − 20.48) + 60·20.48 = 800.8 + 1228.8 = 2029.6 kip;
  // φPn,max = 0.65·0.80·2029.6 = 1055.4 kip (ACI 318-19 22.4.2.1, Table 21.2.2): Pu = 1500 kip is not possible.
  const input: ColumnCheckInput = {
    basis: aci,
    shape: { kind: 'rectangle', b: 16, h: 16 },
    arrangement: { kind: 'four-faces', barsPerFace: 3 },
    gamma: 0.7,
    capContext: { depth: 16, leastDimension: 16 },
    loads: [
      { id: 'light', Pu: 300, Mu: 600 },
      { id: 'too-big', Pu: 1500, Mu: 0 },
    ],
    barSelection: { detailing: { kind: 'cover', cover: 1.5, tieDiameter: 0.5 }, sizes },
  };
  const c = checkColumn(input);

  it('the big load is not possible; proposals are still made, for the light load, and name the other', () => {
    expect(c.results.find((r) => r.id === 'too-big')!.status).toBe('not-possible');
    expect(c.bars.length).toBeGreaterThan(0);
    expect(c.barsUnmet).toEqual(['too-big']);
    for (const p of c.bars) {
      expect(p.utilisation).toBeLessThanOrEqual(1 + 1e-9);
      expect(input.loads[p.governingLoad]!.id).toBe('light');
    }
  });

  it('every proposal keeps the clear spacing of ACI 318-19 25.2.3 at the 3/4 in aggregate assumed', () => {
    for (const p of c.bars) expect(p.clearSpacing).toBeGreaterThanOrEqual(Math.max(1.5, 1.5 * p.barDiameter, (4 / 3) * 0.75) - 1e-9);
  });
});

describe('flags above the lap-zone ratio and for bars too large to lap', () => {
  it('ACI 318-19: ρg 0.045 > 0.04 (R10.6.1.1, from memory) and #14 (1.693 in > 1.41 in, 25.5.1.1, from memory) are flagged', () => {
    const f = proposalFlags(aci, 0.045, 1.693);
    expect(f.map((x) => x.rule)).toEqual(['steel-max-lap', 'bar-size-lap']);
    expectClose(f[0]!.limit!, 0.04, 1e-12);
    expect(f[1]!.clause).toBe('25.5.1.1');
  });
  it('ACI 318-19: ρg 0.03 with #11 is not flagged', () => {
    expect(proposalFlags(aci, 0.03, 1.41)).toEqual([]);
  });
  it('EN 1992-1-1 9.5.2(3): ρ 0.05 lapped at one level would be 0.10 > 0.08 at the lap: flagged at 0.04', () => {
    expect(proposalFlags(en, 0.05, 25)).toMatchObject([{ rule: 'steel-max-lap', clause: '9.5.2(3)', limit: 0.04 }]);
  });
});

describe('proposals are buildable with the given cover and tie', () => {
  it('EN 1992-1-1 4.4.1.2(3) (from memory): 20 mm cover to an 8 mm link cannot take 32 mm bars (needs max(8, 32 − 8, 10) = 24 mm); 16 mm bars (max(8, 8, 10) = 10 mm) are proposed', () => {
    const props = proposeBars({
      basis: en,
      shape: { kind: 'rectangle', b: 400, h: 400 },
      kind: 'two-faces',
      detailing: { kind: 'cover', cover: 20, tieDiameter: 8 },
      sizes: [
        { name: '16', diameter: 16, area: 201.1 },
        { name: '32', diameter: 32, area: 804.2 },
      ],
      requiredArea: 1600,
      areaLimits: { min: 320, max: 6400 },
      // this test is about which sizes are tried, not capacity: every candidate passes
      verify: () => ({ utilisation: 0.5, index: 0 }),
    });
    expect(props.map((p) => p.size)).toEqual(['16']);
  });
});
