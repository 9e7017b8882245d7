/**
 * Four-faces with unequal counts [nb, nh] and γB in chart-set files (issue 15): parsed, named in titles
 * and file names, refused with the field path; single counts keep today's names exactly.
 */
import { describe, expect, it } from 'vitest';
import { readChartSet } from '../../src/config/read.js';
import { isPmError } from '../../src/errors.js';

const minimal = {
  name: 'tiny',
  titleBlock: { office: 'Office', project: 'Project', date: '2026-01-05' },
  units: 'us',
  basis: { code: 'aci318-19' },
  sheets: [{ shape: { kind: 'rectangle', aspect: 0.6 }, fc: 5, fy: 60, gamma: 0.8, arrangement: { kind: 'four-faces', barsPerFace: [3, 5] } }],
};
const variant = (f: (d: any) => void) => {
  const d = structuredClone(minimal) as any;
  f(d);
  return JSON.stringify(d);
};
const problem = (text: string): string => {
  try {
    readChartSet(text);
  } catch (e) {
    if (isPmError(e)) return `${e.message} [exit ${e.exitCode}]`;
    throw e;
  }
  return 'accepted';
};

describe('four-faces [nb, nh] in a chart set', () => {
  it('reads [3, 5] and spells the counts out in the title and the file name', () => {
    const s = readChartSet(variant(() => {})).sheets[0]!;
    expect(s.arrangement).toEqual({ kind: 'four-faces', barsPerFace: [3, 5] });
    expect(s.title).toContain('3 bars on each b face, 5 on each h face (12 bars)');
    expect(s.fileStem).toBe('1-rectangular-aspect-0.6-fc-5ksi-fy-60ksi-gamma-0.80-four-faces-3-on-b-5-on-h-tied');
  });
  it('keeps today’s names for a single count', () => {
    const s = readChartSet(variant((d) => (d.sheets[0].arrangement.barsPerFace = 4))).sheets[0]!;
    expect(s.title).toContain('4 bars per face on four faces (12 bars)');
    expect(s.fileStem).toBe('1-rectangular-aspect-0.6-fc-5ksi-fy-60ksi-gamma-0.80-four-faces-4-per-face-tied');
  });
  it('names γB in the title and the file name when given', () => {
    const s = readChartSet(variant((d) => (d.sheets[0].gammaB = 0.7))).sheets[0]!;
    expect(s.gammaB).toBe(0.7);
    expect(s.title).toContain('γ 0.80 (γB 0.70)');
    expect(s.fileStem).toContain('-gamma-0.80-gammab-0.70-four-faces-3-on-b-5-on-h-');
  });
  const refusals: [string, (d: any) => void, string][] = [
    ['one count in a list', (d) => (d.sheets[0].arrangement.barsPerFace = [3]), 'sheets[0].arrangement.barsPerFace: must be one count, or two counts [nb, nh] [exit 2]'],
    ['three counts', (d) => (d.sheets[0].arrangement.barsPerFace = [3, 5, 7]), 'sheets[0].arrangement.barsPerFace: must be one count, or two counts [nb, nh] [exit 2]'],
    ['nb below 2', (d) => (d.sheets[0].arrangement.barsPerFace = [1, 5]), 'sheets[0].arrangement.barsPerFace[0]: 1 is outside 2–20 [exit 2]'],
    ['nh above 20', (d) => (d.sheets[0].arrangement.barsPerFace = [3, 21]), 'sheets[0].arrangement.barsPerFace[1]: 21 is outside 2–20 [exit 2]'],
    ['a pair for two-faces', (d) => (d.sheets[0].arrangement = { kind: 'two-faces', barsPerFace: [3, 5] }), 'sheets[0].arrangement.barsPerFace: must be a number [exit 2]'],
    ['γB outside the γ range', (d) => (d.sheets[0].gammaB = 0.99), 'sheets[0].gammaB: 0.99 is outside 0.3–0.95 [exit 2]'],
    ['γB on a circle', (d) => (d.sheets[0] = { ...d.sheets[0], shape: 'circle', arrangement: { kind: 'ring', bars: 8 }, gammaB: 0.7 }), 'sheets[0].gammaB: 0.7 applies to rectangles only (a ring takes its diameter from γ) [exit 2]'],
  ];
  for (const [what, change, message] of refusals) it(`refuses ${what}`, () => expect(problem(variant(change))).toBe(message));
});
