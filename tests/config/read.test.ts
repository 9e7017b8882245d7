/** Chart-set reading in stages: schema, resolution, rule checks with field paths, committed JSON Schema. */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readChartSet, readChartSetReport } from '../../src/config/read.js';
import { nodeFileAccess } from '../../src/io/read.js';
import { expandNumbers } from '../../src/config/expand.js';
import { schemaText } from '../../src/config/write-schema.js';

const demoPath = new URL('../../charts-config/demo.json', import.meta.url);
const demoText = readFileSync(demoPath, 'utf8');
/** the demo names an office file and, through it, a logo: read relative to charts-config/ */
const files = { files: nodeFileAccess, baseDir: 'charts-config' };
const demo = JSON.parse(demoText);
const withChange = (f: (d: any) => void): string => {
  const d = structuredClone(demo);
  f(d);
  return JSON.stringify(d);
};
const minimal = {
  name: 'tiny',
  titleBlock: { office: 'Office', project: 'Project', date: '2026-01-05' },
  units: 'us',
  basis: { code: 'aci318-19' },
  sheets: [{ fc: 4, fy: 60, gamma: 0.8, arrangement: { kind: 'two-faces', barsPerFace: 3 } }],
};

describe('readChartSet', () => {
  it('resolves the demo set (snapshot of the resolved set)', () => {
    const set = readChartSet(demoText, files);
    expect(set.sheets).toHaveLength(14);
    expect(set).toMatchSnapshot();
  });

  it('fills defaults: ρg 0.01–0.08, factored curves, tabloid landscape for US units, stress normalisation', () => {
    const set = readChartSet(JSON.stringify(minimal));
    expect(set.ratios).toEqual({ kind: 'rhoG', values: [0.01, 0.02, 0.03, 0.04, 0.05, 0.06, 0.07, 0.08] });
    expect(set.families).toBe('design');
    expect(set.normalisation).toBe('stress');
    expect(set.paper).toEqual({ size: 'tabloid', orientation: 'landscape', widthPt: 1224, heightPt: 792 });
    expect(set.sheets[0]!.shape).toEqual({ kind: 'rectangle', aspect: 1 });
    expect(set.sheets[0]!.transverse).toBe('tied');
    expect(set.referenceLines).toEqual({ strainStates: true, eccentricities: [0.1, 0.25, 0.5, 1], axialCap: true, barEntry: 'inner' });
  });

  it('converts units once: "48.26MPa" in a US set is 7 ksi (NIST SP 811 factor)', () => {
    const set = readChartSet(JSON.stringify({ ...minimal, sheets: [{ ...minimal.sheets[0], fc: '48.263301MPa', fy: '80000psi' }] }));
    expect(set.sheets[0]!.fc).toBeCloseTo(7, 5);
    expect(set.sheets[0]!.fy).toBe(80);
  });

  it('expands cross products in a fixed order: shape × fc × fy × γ × arrangement × transverse', () => {
    const set = readChartSet(
      JSON.stringify({ ...minimal, sheets: [{ fc: [4, 5], fy: 60, gamma: [0.7, 0.8], arrangement: [{ kind: 'two-faces', barsPerFace: 2 }, { kind: 'four-faces', barsPerFace: 3 }], transverse: ['tied', 'spiral'] }] }),
    );
    expect(set.sheets).toHaveLength(16);
    expect(set.sheets.map((s) => s.index)).toEqual(Array.from({ length: 16 }, (_, i) => i + 1));
    expect(set.sheets[1]!.transverse).toBe('spiral');
    expect(set.sheets[2]!.arrangement.kind).toBe('four-faces');
    expect(set.sheets[8]!.fc).toBe(5);
  });

  it('expands {from, to, step} without float drift: γ 0.70–0.90 in 0.05 steps', () => {
    expect(expandNumbers({ from: 0.7, to: 0.9, step: 0.05 }, 'g')).toEqual([0.7, 0.75, 0.8, 0.85, 0.9]);
  });

  it('names sheets with spelled-out parameters, or the office pattern', () => {
    const set = readChartSet(demoText, files);
    expect(set.sheets[0]!.fileStem).toBe('01-square-fc-7ksi-fy-80ksi-gamma-0.70-two-faces-3-per-face-tied');
    expect(set.sheets[0]!.title).toBe('Square column, f′c 7 ksi, Grade 80 bars (fy 80 ksi), γ 0.70, 3 bars on each of two faces, tied');
  });

  it('warns about repeated sheets', () => {
    const { warnings } = readChartSetReport(JSON.stringify({ ...minimal, sheets: [minimal.sheets[0], minimal.sheets[0]] }));
    expect(warnings[0]).toMatch(/sheets\[1\]: sheet 2 repeats an earlier sheet/);
  });
});

describe('readChartSet rejects bad sets with the field path', () => {
  const cases: [string, string, RegExp][] = [
    ['γ out of range', withChange((d) => (d.sheets[1].gamma = [0.75, 1.2])), /^sheets\[1\]\.gamma\[1\]: 1\.2 is outside 0\.3–0\.95$/],
    ['scalar γ out of range', withChange((d) => (d.sheets[1].gamma = 0.2)), /^sheets\[1\]\.gamma: 0\.2 is outside 0\.3–0\.95$/],
    ['unknown field', withChange((d) => (d.titleBlock.colour = 'red')), /^titleBlock: has unknown field "colour"$/],
    ['wrong type', withChange((d) => (d.sheets[0].arrangement[1].barsPerFace = 'four')), /^sheets\[0\]\.arrangement\[1\]\.barsPerFace: must be one count, or two counts \[nb, nh\]$/],
    ['wrong type, two-faces', withChange((d) => (d.sheets[0].arrangement[0].barsPerFace = 'four')), /^sheets\[0\]\.arrangement\[0\]\.barsPerFace: must be a number$/],
    ['bad enum', withChange((d) => (d.paper.size = 'b5')), /^paper\.size: must be one of "a4", "a3", "letter", "tabloid"$/],
    ['f′c beyond ACI 318-19 limits of this build', withChange((d) => (d.sheets[0].fc = '25ksi')), /^sheets\[0\]\.fc: 25 ksi is outside 2\.5–20 ksi$/],
    ['unit of the wrong kind', withChange((d) => (d.sheets[0].fy = '80in')), /^sheets\[0\]\.fy: "80in" is not a number with an optional stress unit \(ksi, psi, mpa/],
    ['ρg out of range', withChange((d) => (d.rhoG = [0.01, 0.2])), /^rhoG\[1\]: 0\.2 is outside 0\.001–0\.1$/],
    ['non-increasing ρg', withChange((d) => (d.rhoG = [0.02, 0.01])), /^rhoG\[1\]: 0\.01 must be larger than the value before it$/],
    ['circle with bars on faces', withChange((d) => (d.sheets[1].arrangement = { kind: 'two-faces', barsPerFace: 3 })), /^sheets\[1\]\.arrangement\.kind: two-faces cannot be used with a circular shape/],
    ['unknown code', withChange((d) => (d.basis.code = 'bs8110')), /^basis\.code: bs8110 is not a known design basis/],
    ['bad name', withChange((d) => (d.name = '../escape')), /^name: "\.\.\/escape" must be 1–80 letters/],
    ['bad date', withChange((d) => (d.titleBlock.date = '2 March 2026')), /^titleBlock\.date: "2 March 2026" is not a date/],
    ['missing sheets', withChange((d) => delete d.sheets), /^sheets: must be a list$/],
    ['not JSON', '{"name": ', /^chart set: is not valid JSON/],
  ];
  for (const [what, text, message] of cases) {
    it(what, () => {
      expect(() => readChartSet(text, files)).toThrow(message);
      try {
        readChartSet(text, files);
      } catch (e) {
        expect((e as { exitCode: number }).exitCode).toBe(2);
      }
    });
  }
});

describe('charts-config/chart-set.schema.json', () => {
  it('is current with the zod schema (regenerate with npm run build && npm run schema)', () => {
    const committed = readFileSync(new URL('../../charts-config/chart-set.schema.json', import.meta.url), 'utf8');
    expect(committed).toBe(schemaText());
  });
  it('is referenced by the demo through $schema', () => {
    expect(demo.$schema).toBe('./chart-set.schema.json');
  });
});

describe('chart-set text (issue 25)', () => {
  it('accepts a byte-order mark (an editor on Windows writes one); before, "Unexpected token" with an invisible character', () => {
    expect(readChartSet(`\uFEFF${JSON.stringify(minimal)}`).sheets).toHaveLength(1);
  });
  it('refuses a control character in a title-block field, so every SVG stays well-formed XML', () => {
    expect(() => readChartSet(JSON.stringify({ ...minimal, titleBlock: { ...minimal.titleBlock, office: 'Office\u0007' } }))).toThrow(
      'titleBlock.office: "Office\\u0007" has a control character (plain text only)',
    );
  });
  it('does not echo 1 MB of NUL bytes in the error', () => {
    let message = '';
    try {
      readChartSet('\u0000'.repeat(1 << 20), { source: 'set.json' });
    } catch (e) {
      message = (e as Error).message;
    }
    expect(message.startsWith('set.json: is not valid JSON')).toBe(true);
    expect(message.length).toBeLessThan(400);
    expect(message).not.toMatch(/\u0000/);
  });
});

describe('referenceLines.barEntry', () => {
  it('reads "inner", "steps", "chord", and its earlier booleans as "steps" (true) and "chord" (false)', async () => {
    const { barEntryDrawing } = await import('../../src/config/read.js');
    expect(barEntryDrawing(undefined)).toBe('inner');
    expect(barEntryDrawing('chord')).toBe('chord');
    expect(barEntryDrawing(true)).toBe('steps');
    expect(barEntryDrawing(false)).toBe('chord');
  });
});
