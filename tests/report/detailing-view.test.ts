/**
 * Views of the detailing status (issue 19): the text table, the JSON and the words of a finding name the rule
 * and its clause. Figures from ACI 318-19 25.2.3 (clear spacing) and 10.6.1.1 (steel limits), by hand.
 */
import { describe, expect, it } from 'vitest';
import { resolveBasis } from '../../src/codes/registry.js';
import { checkColumn, type ColumnCheckInput } from '../../src/design/column-check.js';
import { checkJson, checkReportText, checkText, findingWords } from '../../src/report/check-view.js';
import { barSet } from '../../src/section/bar-tables.js';
import { gammaFromCover } from '../../src/section/geometry.js';

const aci = resolveBasis('aci318-19', { units: 'us', fc: 4, fy: 60, transverse: 'tied' });

// 16 × 24 in, 4 #14 per face, cover 1.5 in to #4 ties: clear (16 − 3 − 1 − 6.772)/3 = 1.743 in < 2.540 in (25.2.3)
const gamma = gammaFromCover(24, 1.5, 0.5, 1.693);
const input: ColumnCheckInput = {
  basis: aci,
  shape: { kind: 'rectangle', b: 16, h: 24 },
  arrangement: { kind: 'two-faces', barsPerFace: 4 },
  gamma,
  gammaSource: 'bars',
  capContext: { depth: 24, leastDimension: 16 },
  loads: [{ id: 'C-1', Pu: 400, Mu: 1200 }],
  layout: { arrangement: { kind: 'two-faces', barsPerFace: 4 }, area: 18, gamma, description: '8 #14' },
  detailingInput: { bar: { name: '#14', diameter: 1.693 }, cover: 1.5, tieDiameter: 0.5 },
};

describe('the detailing status in the views', () => {
  const c = checkColumn(input);

  it('a finding in words: title, clause, figures with units, outcome', () => {
    const f = c.results[0]!.findings.find((x) => x.rule === 'clear-spacing')!;
    expect(findingWords(aci, f)).toBe('clear spacing ≥ max(1.5 in, 1.5·db, 4/3·dagg) [25.2.3]: 1.743 in < 2.54 in BROKEN');
    const lap = c.results[0]!.findings.find((x) => x.rule === 'steel-max-lap')!;
    expect(findingWords(aci, lap)).toMatch(/\[R10\.6\.1\.1, from memory\]: 0\.04688 > 0\.04 NOTE$/);
  });

  it('the text table: DETAILING with the reason and clause, the detailing lines and the aggregate assumed', () => {
    const t = checkText(c);
    expect(t).toMatch(/DETAILING +clear spacing ≥ max\(1\.5 in, 1\.5·db, 4\/3·dagg\): 1\.743 < 2\.54 \[25\.2\.3\]/);
    expect(t).toMatch(/γ = 0\.7628 \(from the bars\)/);
    expect(t).toMatch(/maximum aggregate size of 0\.75 in \(assumed; --aggregate to change\)/);
    expect(t).toMatch(/Summary: 1 of 1 load does not pass \(1 detailing\)/);
  });

  it('the engine gives the broken rule as a fact, the views put it in words: JSON statusReason and governingWhy, and the findings list names detailing rules by title (they were shown as raw ids)', () => {
    const r = c.results[0]!;
    expect(r.statusFinding).toMatchObject({ rule: 'clear-spacing', clause: '25.2.3', outcome: 'violated' });
    expect(r.statusCause).toEqual({ kind: 'detailing' });
    const j = JSON.parse(checkJson(c, 'test'));
    expect(j.results[0].statusReason).toBe('clear spacing ≥ max(1.5 in, 1.5·db, 4/3·dagg): 1.743 < 2.54');
    expect(j.governingWhy).toBe('detailing clear spacing ≥ max(1.5 in, 1.5·db, 4/3·dagg): 1.743 < 2.54 [25.2.3]');
    const findings = checkReportText(c, 'test').split('RULE FINDINGS')[1]!;
    expect(findings).toContain('C-1: clear spacing ≥ max(1.5 in, 1.5·db, 4/3·dagg) [25.2.3]: 1.743 in < 2.54 in BROKEN');
    expect(findings).not.toMatch(/C-1: (clear-spacing|steel-min|steel-max|cover|bar-size-lap) /);
  });

  it('the JSON: status, findings, summary count, section-level detailing and gammaSource "bars"', () => {
    const j = JSON.parse(checkJson(c, 'test'));
    expect(j.results[0]).toMatchObject({ status: 'detailing', statusClause: '25.2.3' });
    expect(j.results[0].findings.map((f: { rule: string }) => f.rule).sort()).toEqual(['bar-size-lap', 'clear-spacing', 'cover', 'steel-max', 'steel-max-lap', 'steel-min']);
    expect(j.summary.detailing).toBe(1);
    expect(j.section.gammaSource).toBe('bars');
    expect(j.detailing).toMatchObject({ aggregate: 0.75, aggregateAssumed: true });
    expect(j.detailing.rules.map((r: { id: string }) => r.id)).toContain('clear-spacing');
    expect(j.barsUnmet).toEqual([]);
  });

  it('flagged proposals get a flags column: #14 cannot be lap spliced (25.5.1.1, from memory)', () => {
    const sizes = barSet('astm-a615').sizes.filter((s) => s.name === '#14');
    const p = checkColumn({ ...input, layout: undefined, detailingInput: undefined, barSelection: { detailing: { kind: 'cover', cover: 1.5, tieDiameter: 0.5 }, sizes } });
    expect(p.bars.length).toBeGreaterThan(0);
    const t = checkText(p);
    expect(t).toMatch(/flags/);
    expect(t).toMatch(/not lap spliced \[25\.5\.1\.1\]/);
  });
});
