/**
 * Biaxial sheet groups in chart sets (issue 15): `"chart": "biaxial"` with `axialLevels`, split into
 * sheets of at most six levels, counted before anything is expanded, and refused with the field path
 * (exit 2) where the fields do not fit the group; the committed JSON Schema refuses the same fields (ajv).
 */
import { readFileSync } from 'node:fs';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { describe, expect, it } from 'vitest';
import { levelSheets, readChartSet } from '../../src/config/read.js';
import { isPmError } from '../../src/errors.js';

const schema = JSON.parse(readFileSync(new URL('../../charts-config/chart-set.schema.json', import.meta.url), 'utf8'));
const base = {
  name: 'corner',
  titleBlock: { office: 'Halden Reach Engineers (invented)', project: 'Millrace Depot (invented)', date: '2026-01-05' },
  units: 'us',
  basis: { code: 'aci318-19' },
  sheets: [{ fc: 5, fy: 60, gamma: 0.75, arrangement: { kind: 'four-faces', barsPerFace: 3 }, chart: 'biaxial', axialLevels: { from: 0, to: 0.6, step: 0.1 } }],
};
const variant = (f: (d: any) => void) => {
  const d = structuredClone(base) as any;
  f(d);
  return d;
};
/** the one-line message and exit code of a refused set */
const refusal = (doc: unknown): { message: string; exitCode: number } => {
  try {
    readChartSet(JSON.stringify(doc));
  } catch (e) {
    if (isPmError(e)) return { message: e.message, exitCode: e.exitCode };
    throw e;
  }
  throw new Error('accepted');
};

describe('biaxial groups resolve into sheets of at most six levels', () => {
  it('levels shared evenly, earlier sheets taking the extra one (7 → 4 + 3; 12 → 6 + 6; 13 → 5 + 4 + 4)', () => {
    expect(levelSheets(1)).toEqual([1]);
    expect(levelSheets(6)).toEqual([6]);
    expect(levelSheets(7)).toEqual([4, 3]);
    expect(levelSheets(12)).toEqual([6, 6]);
    expect(levelSheets(13)).toEqual([5, 4, 4]);
    expect(levelSheets(24)).toEqual([6, 6, 6, 6]);
  });
  it('0 to 0.6 in 0.1 steps: two sheets, levels 0–0.3 and 0.4–0.6, named in the title and the file name', () => {
    const set = readChartSet(JSON.stringify(base));
    expect(set.sheets.map((s) => s.axialLevels)).toEqual([
      [0, 0.1, 0.2, 0.3],
      [0.4, 0.5, 0.6],
    ]);
    expect(set.sheets.map((s) => s.levelPart)).toEqual([
      [1, 2],
      [2, 2],
    ]);
    expect(set.sheets.every((s) => s.chart === 'biaxial')).toBe(true);
    expect(set.sheets[0]!.title).toMatch(/— Mx–My contours at P\/\(f′c·Ag\) 0–0\.3$/);
    expect(set.sheets[1]!.fileStem).toBe('2-square-fc-5ksi-fy-60ksi-gamma-0.75-four-faces-3-per-face-tied-biaxial-levels-0.4-to-0.6');
  });
  it('EN 1992-1-1 names the level ν', () => {
    const set = readChartSet(JSON.stringify(variant((d) => Object.assign(d, { units: 'si', basis: { code: 'en1992-1-1' }, sheets: [{ ...d.sheets[0], fc: 'C30/37', fy: 'B500B', axialLevels: [0.2, 0.5] }] }))));
    expect(set.sheets).toHaveLength(1);
    expect(set.sheets[0]!.title).toMatch(/Mx–My contours at ν 0\.2–0\.5$/);
  });
  it('a uniaxial group beside it is unchanged: no chart, levels or part fields', () => {
    const set = readChartSet(JSON.stringify(variant((d) => d.sheets.unshift({ fc: 5, fy: 60, gamma: 0.75, arrangement: { kind: 'four-faces', barsPerFace: 3 } }))));
    expect(set.sheets).toHaveLength(3);
    expect(Object.keys(set.sheets[0]!)).not.toContain('chart');
    expect(Object.keys(set.sheets[0]!)).not.toContain('axialLevels');
    expect(set.sheets[0]!.fileStem).toBe('1-square-fc-5ksi-fy-60ksi-gamma-0.75-four-faces-3-per-face-tied');
  });
  it('"chart": "uniaxial" is the same as no chart field', () => {
    const plain = variant((d) => (d.sheets = [{ fc: 5, fy: 60, gamma: 0.75, arrangement: { kind: 'four-faces', barsPerFace: 3 } }]));
    const named = variant((d) => (d.sheets = [{ fc: 5, fy: 60, gamma: 0.75, arrangement: { kind: 'four-faces', barsPerFace: 3 }, chart: 'uniaxial' }]));
    expect(readChartSet(JSON.stringify(named))).toEqual(readChartSet(JSON.stringify(plain)));
  });
});

describe('refusals name the field (exit 2)', () => {
  const cases: [string, (d: any) => void, string][] = [
    ['axialLevels on a uniaxial group', (d) => delete d.sheets[0].chart, 'sheets[0].axialLevels: is only for biaxial groups'],
    ['a biaxial group without levels', (d) => delete d.sheets[0].axialLevels, 'sheets[0].axialLevels: is required for a biaxial group'],
    ['a level above 1.2', (d) => (d.sheets[0].axialLevels = [0.2, 1.5]), 'sheets[0].axialLevels[1]: 1.5 is outside -0.5–1.2'],
    ['a range end below −0.5', (d) => (d.sheets[0].axialLevels = { from: -0.8, to: 0.2, step: 0.1 }), 'sheets[0].axialLevels.from: -0.8 is outside -0.5–1.2'],
    ['more than 24 levels from a range', (d) => (d.sheets[0].axialLevels = { from: 0, to: 1, step: 0.04 }), 'sheets[0].axialLevels: gives 26 levels, beyond 24'],
    ['more than 24 levels in a list', (d) => (d.sheets[0].axialLevels = Array.from({ length: 25 }, (_, i) => i / 25)), 'sheets[0].axialLevels: holds more than 24 values'],
    ['levels not increasing', (d) => (d.sheets[0].axialLevels = [0.1, 0.3, 0.3]), 'sheets[0].axialLevels[2]: 0.3 must be larger than the level before it'],
    ['a circular biaxial group', (d) => Object.assign(d.sheets[0], { shape: 'circle', arrangement: { kind: 'ring', bars: 8 } }), 'sheets[0].shape: circle has no biaxial sheets'],
    ['P–M axis limits on a biaxial group', (d) => (d.sheets[0].axes = { M: [0, 2] }), 'sheets[0].axes: is for P–M sheets'],
    ['an unknown chart kind', (d) => (d.sheets[0].chart = 'triaxial'), 'sheets[0].chart:'],
  ];
  for (const [what, change, message] of cases) {
    it(what, () => {
      const r = refusal(variant(change));
      expect(r.message.startsWith(message), r.message).toBe(true);
      expect(r.exitCode).toBe(2);
    });
  }
  it('the sheet count includes the level sheets, before anything is expanded (issue 14): 1000 f′c × 2 fy × 4 level sheets', () => {
    const doc = variant((d) => Object.assign(d.sheets[0], { fc: Array.from({ length: 1000 }, (_, i) => 3 + i / 1000), fy: [60, 75], axialLevels: { from: -0.4, to: 1.1, step: 0.075 } }));
    expect(refusal(doc).message).toMatch(/^sheets: describe 8000 sheets, beyond 5000/);
  });
});

describe('the committed JSON Schema (ajv) takes biaxial groups and refuses the same fields', () => {
  const validate = new Ajv2020({ allErrors: true, strict: false }).compile(schema);
  it('accepts a biaxial group with a list or a range of levels', () => {
    expect(validate(base), JSON.stringify(validate.errors)).toBe(true);
    expect(validate(variant((d) => (d.sheets[0].axialLevels = [0, 0.25, 0.5]))), JSON.stringify(validate.errors)).toBe(true);
  });
  for (const [what, change, at] of [
    ['a level above 1.2', (d: any) => (d.sheets[0].axialLevels = [0.2, 1.5]), '/sheets/0/axialLevels/1'],
    ['25 listed levels', (d: any) => (d.sheets[0].axialLevels = Array.from({ length: 25 }, (_, i) => i / 25)), '/sheets/0/axialLevels'],
    ['an unknown chart kind', (d: any) => (d.sheets[0].chart = 'triaxial'), '/sheets/0/chart'],
  ] as const) {
    it(`refuses ${what}`, () => {
      expect(validate(variant(change))).toBe(false);
      expect(validate.errors!.some((e) => e.instancePath === at), JSON.stringify(validate.errors)).toBe(true);
    });
  }
});
