/** `--office` and `--project` keep the chart-set file's 200-character limit and refuse control characters (issue 25). */
import { describe, expect, it } from 'vitest';
import { sheetSetFromFlags } from '../../src/flags/sheet-flags.js';
import { resolveCheckOptions } from '../../src/flags/check-flags.js';

const section = { fc: '4', fy: '60', b: '24', h: '24', gamma: '0.75' };

describe('title-block flags', () => {
  it('sheet: a 20,000-character --office is refused (it was drawn, and fitting it took 42 s)', async () => {
    await expect(sheetSetFromFlags({ ...section, office: 'x'.repeat(20_000) })).rejects.toThrow('--office: is longer than 200 characters');
    await expect(sheetSetFromFlags({ ...section, project: 'P\u001b[2J' })).rejects.toThrow('--project: "P\\u001b[2J" has a control character (plain text only)');
    await expect(sheetSetFromFlags({ ...section, office: 'O'.repeat(200) })).resolves.toBeDefined();
  });
  it('check: the same limit for a report title block', () => {
    expect(() => resolveCheckOptions({ ...section, pu: '1', mu: '1', rho: '0.02', project: 'x'.repeat(201) })).toThrow('--project: is longer than 200 characters');
  });
});
