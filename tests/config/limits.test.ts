/**
 * Chart-set limits (issue 14): work bounded before it starts, empty lists and impossible dates
 * refused, SOURCE_DATE_EPOCH checked, and the committed JSON Schema carrying the unit-free limits,
 * checked with a standard validator (ajv, JSON Schema draft 2020-12).
 */
import { readFileSync } from 'node:fs';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { describe, expect, it } from 'vitest';
import { readChartSet } from '../../src/config/read.js';
import { isPmError } from '../../src/errors.js';

const schema = JSON.parse(readFileSync(new URL('../../charts-config/chart-set.schema.json', import.meta.url), 'utf8'));
const demos = ['demo.json', 'demo-eu.json'].map((f) => readFileSync(new URL(`../../charts-config/${f}`, import.meta.url), 'utf8'));
const minimal = {
  name: 'tiny',
  titleBlock: { office: 'Office', project: 'Project', date: '2026-01-05' },
  units: 'us',
  basis: { code: 'aci318-19' },
  sheets: [{ fc: 4, fy: 60, gamma: 0.8, arrangement: { kind: 'two-faces', barsPerFace: 3 } }],
};
const variant = (f: (d: any) => void) => {
  const d = structuredClone(minimal) as any;
  f(d);
  return d;
};
const pmPath = (doc: unknown, opts = {}): string => {
  try {
    readChartSet(JSON.stringify(doc), opts);
  } catch (e) {
    if (isPmError(e)) return e.message;
    throw e;
  }
  return 'accepted';
};

describe('work is bounded before it starts', () => {
  it('refuses 1000 × 1000 × 1000 sheets from the list lengths, before expanding', () => {
    const many = (n: number, f: (i: number) => unknown) => Array.from({ length: n }, (_, i) => f(i));
    const d = variant((x) => {
      x.sheets[0].fc = many(1000, (i) => 3 + i / 1000);
      x.sheets[0].fy = many(1000, (i) => 40 + i / 100);
      x.sheets[0].gamma = { from: 0.3, to: 0.95, step: 0.00065 };
    });
    expect(pmPath(d)).toBe('sheets: describe more than a million sheets, beyond 5000 (allowed: 1–5000 sheets)');
  });
  it('names the group that takes the count past the cap', () => {
    const d = variant((x) => {
      x.sheets = [x.sheets[0], { ...x.sheets[0], fc: Array.from({ length: 1000 }, (_, i) => 3 + i / 1000), fy: [40, 50, 60, 70, 80, 90] }];
    });
    expect(pmPath(d)).toMatch(/^sheets\[1\]: describe 6001 sheets, beyond 5000/);
  });
  it('caps title-block text before any sheet is made', () => {
    expect(pmPath(variant((x) => (x.titleBlock.office = 'x'.repeat(1_000_000))))).toBe('titleBlock.office: is longer than 200 characters');
  });
  it('caps list lengths', () => {
    expect(pmPath(variant((x) => (x.sheets[0].fc = Array.from({ length: 1001 }, () => 4))))).toBe('sheets[0].fc: holds more than 1000 values');
  });
});

describe('silent surprises are refused', () => {
  it('empty lists', () => {
    expect(pmPath(variant((x) => (x.sheets[0].fc = [])))).toBe('sheets[0].fc: must hold at least one value');
    expect(pmPath(variant((x) => (x.sheets[0].arrangement = [])))).toBe('sheets[0].arrangement: must hold at least one value');
    expect(pmPath(variant((x) => (x.rhoG = [])))).toBe('rhoG: must hold at least one value');
    expect(pmPath(variant((x) => (x.sheets = [])))).toBe('sheets: must hold at least one value');
  });
  it('impossible calendar dates (2026-13-01, 2026-02-30) but not 2028-02-29', () => {
    expect(pmPath(variant((x) => (x.titleBlock.date = '2026-13-01')))).toBe('titleBlock.date: "2026-13-01" is not a calendar date');
    expect(pmPath(variant((x) => (x.titleBlock.date = '2026-02-30')))).toBe('titleBlock.date: "2026-02-30" is not a calendar date');
    expect(readChartSet(JSON.stringify(variant((x) => (x.titleBlock.date = '2028-02-29')))).titleBlock.date).toBe('2028-02-29');
  });
  it('SOURCE_DATE_EPOCH that is not a count of seconds', () => {
    const noDate = variant((x) => delete x.titleBlock.date);
    expect(pmPath(noDate, { sourceDateEpoch: 'abc' })).toBe('SOURCE_DATE_EPOCH: "abc" is not a count of seconds since 1970-01-01 (UTC) up to year 9999');
    expect(pmPath(noDate, { sourceDateEpoch: '1e9' })).toMatch(/^SOURCE_DATE_EPOCH: "1e9" is not/);
    // 1767225600 s = 2026-01-01T00:00:00Z (reproducible-builds.org SOURCE_DATE_EPOCH specification)
    expect(readChartSet(JSON.stringify(noDate), { sourceDateEpoch: '1767225600' }).titleBlock.date).toBe('2026-01-01');
  });
  it('a basis in units it does not use is named at units, not at every strength', () => {
    const d = variant((x) => {
      x.basis.code = 'en1992-1-1';
      x.sheets[0].fc = '60MPa';
      x.sheets[0].fy = '500MPa';
    });
    expect(pmPath(d)).toMatch(/^units: us is not a unit system of EN 1992-1-1.* \(allowed: si\)$/);
  });
  it('the same bar limits as the command line', () => {
    expect(pmPath(variant((x) => (x.sheets[0].arrangement.barsPerFace = 21)))).toBe('sheets[0].arrangement.barsPerFace: 21 is outside 1–20');
    expect(pmPath(variant((x) => (x.sheets[0] = { ...x.sheets[0], shape: 'circle', arrangement: { kind: 'ring', bars: 49 } })))).toBe('sheets[0].arrangement.bars: 49 is outside 4–48');
  });
});

describe('charts-config/chart-set.schema.json with a standard validator (ajv)', () => {
  const ajv = new Ajv2020({ allErrors: true, strict: false });
  const validate = ajv.compile(schema);
  /** ajv's deepest error as a pmchart path: /sheets/0/gamma/1 → sheets[0].gamma[1] */
  const ajvPath = (doc: unknown): string | undefined => {
    if (validate(doc)) return undefined;
    // deepest error; at equal depth one about the value (minimum, pattern …) rather than a union branch's type or tag
    const rank = (e: { instancePath: string; keyword: string }) => e.instancePath.split('/').length * 2 + (['type', 'const', 'anyOf', 'oneOf', 'required', 'additionalProperties'].includes(e.keyword) ? 0 : 1);
    const deepest = validate.errors!.reduce((a, b) => (rank(b) > rank(a) ? b : a));
    const parts = deepest.instancePath.split('/').slice(1);
    return parts.map((p, i) => (/^\d+$/.test(p) ? `[${p}]` : i === 0 ? p : `.${p}`)).join('');
  };

  it('takes a four-faces pair [3, 5] and γB 0.7, as pmchart does', () => {
    const doc = variant((d) => {
      d.sheets[0].arrangement = { kind: 'four-faces', barsPerFace: [3, 5] };
      d.sheets[0].gammaB = 0.7;
    });
    expect(validate(doc), JSON.stringify(validate.errors)).toBe(true);
    expect(pmPath(doc)).toBe('accepted');
  });

  it('passes the demo sets', () => {
    for (const text of demos) {
      const doc = JSON.parse(text);
      expect(validate(doc), JSON.stringify(validate.errors)).toBe(true);
    }
  });

  const cases: [string, (d: any) => void][] = [
    ['γ 1.5', (d) => (d.sheets[0].gamma = 1.5)],
    ['γ list entry', (d) => (d.sheets[0].gamma = [0.75, 1.2])],
    ['γ range end', (d) => (d.sheets[0].gamma = { from: 0.5, to: 1.1, step: 0.1 })],
    ['ρg', (d) => (d.rhoG = [0.01, 0.2])],
    ['ω', (d) => (d.omega = [0.1, 9])],
    ['bars per face', (d) => (d.sheets[0].arrangement.barsPerFace = 25)],
    ['four-faces one bar', (d) => (d.sheets[0].arrangement = { kind: 'four-faces', barsPerFace: 1 })],
    ['four-faces pair with nb 1', (d) => (d.sheets[0].arrangement = { kind: 'four-faces', barsPerFace: [1, 5] })],
    ['four-faces pair with nh 21', (d) => (d.sheets[0].arrangement = { kind: 'four-faces', barsPerFace: [3, 21] })],
    ['four-faces list of one', (d) => (d.sheets[0].arrangement = { kind: 'four-faces', barsPerFace: [3] })],
    ['four-faces list of three', (d) => (d.sheets[0].arrangement = { kind: 'four-faces', barsPerFace: [3, 5, 7] })],
    ['two-faces pair', (d) => (d.sheets[0].arrangement = { kind: 'two-faces', barsPerFace: [3, 5] })],
    ['γB', (d) => (d.sheets[0].gammaB = 1.2)],
    ['PNG scale', (d) => (d.outputs = { pngScale: 20 })],
    ['aspect', (d) => (d.sheets[0].shape = { kind: 'rectangle', aspect: 9 })],
    ['γc', (d) => (d.basis.options = { gammaC: 3 })],
    ['eccentricity', (d) => (d.referenceLines = { eccentricities: [0.5, 20] })],
    ['empty fc list', (d) => (d.sheets[0].fc = [])],
    ['hex quantity', (d) => (d.sheets[0].fc = '0x10')],
    ['date form', (d) => (d.titleBlock.date = '2026-3-1')],
    ['paper size', (d) => (d.paper = { size: 'b5' })],
    ['name', (d) => (d.name = '../up')],
    ['office length', (d) => (d.titleBlock.office = 'o'.repeat(201))],
  ];
  for (const [what, change] of cases) {
    it(`refuses ${what} at the field pmchart names`, () => {
      const doc = variant(change);
      const at = ajvPath(doc);
      expect(at).toBeDefined();
      expect(pmPath(doc).startsWith(`${at}: `), `${pmPath(doc)} vs ${at}`).toBe(true);
    });
  }
});
