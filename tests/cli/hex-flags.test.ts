/** Number flags take decimal digits only (issue 25): Number("0x2") is 2, so `--jobs 0x2` and `--proposals 0x3` were accepted. */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runSet } from '../../src/cli/set.js';
import { resolveCheckOptions } from '../../src/flags/check-flags.js';

const demo = new URL('../../charts-config/demo.json', import.meta.url).pathname;
const section = { fc: '4', fy: '60', b: '24', h: '24', gamma: '0.75', pu: '1', mu: '1' };

describe('decimal number flags', () => {
  it('set --jobs 0x2 is refused before any work', async () => {
    await expect(runSet(demo, { jobs: '0x2', out: join(mkdtempSync(join(tmpdir(), 'pmchart-jobs-')), 'out'), progress: false })).rejects.toThrow(/^--jobs: 0x2 is outside 1–64/);
  });
  it('check --proposals 0x3, --rho 0x0 and --chart-gamma-step 1e-1x are refused', () => {
    expect(() => resolveCheckOptions({ ...section, proposals: '0x3' })).toThrow(/^--proposals: /);
    expect(() => resolveCheckOptions({ ...section, rho: '0x0' })).toThrow(/^--rho: /);
    expect(() => resolveCheckOptions({ ...section, chartGammaStep: '0x1' })).toThrow(/^--chart-gamma-step: /);
  });
});
