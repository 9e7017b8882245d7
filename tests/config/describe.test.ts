/** Sheet names and titles (issue 25): placeholders from own fields only; every parameter keeps the digits that tell sheets apart. */
import { describe, expect, it } from 'vitest';
import { fillPattern } from '../../src/config/describe.js';
import { readChartSetReport } from '../../src/config/read.js';

const minimal = {
  name: 'tiny',
  titleBlock: { office: 'Office', project: 'Project', date: '2026-01-05' },
  units: 'us',
  basis: { code: 'aci318-19' },
  sheets: [{ fc: 4, fy: 60, gamma: [0.3, 0.305], arrangement: { kind: 'two-faces', barsPerFace: 3 } }],
};

describe('fillPattern', () => {
  it('leaves {constructor} and {toString} as written (they printed native code)', () => {
    expect(fillPattern('{constructor} {toString} {index}', { index: '3' })).toBe('{constructor} {toString} 3');
  });
});

describe('sheet titles and names', () => {
  it('γ 0.305 is titled 0.305, not "0.30", with no false "repeats an earlier sheet" warning', () => {
    const { set, warnings } = readChartSetReport(JSON.stringify(minimal));
    expect(warnings).toEqual([]);
    expect(set.sheets.map((s) => s.title)).toEqual([expect.stringContaining('γ 0.30,'), expect.stringContaining('γ 0.305,')]);
    expect(set.sheets[1]!.fileStem).toContain('gamma-0.305-');
    expect(set.sheets[0]!.fileStem).toContain('gamma-0.30-');
  });
  it('f′c 4.0001 and 4 ksi are told apart too', () => {
    const { set, warnings } = readChartSetReport(JSON.stringify({ ...minimal, sheets: [{ ...minimal.sheets[0], gamma: 0.8, fc: [4, 4.0001] }] }));
    expect(warnings).toEqual([]);
    expect(new Set(set.sheets.map((s) => s.title)).size).toBe(2);
  });
});
