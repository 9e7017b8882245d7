/**
 * The one smoke test of the built binary (bin/pmchart.js → dist/bundle/): every other CLI test runs the
 * source in-process (tests/helpers/run-cli.ts). It fails, loudly and before anything runs, when dist/ is
 * missing or older than src/, so a test run after editing src/ never passes on a stale bundle.
 * Figures: the issue-4 hand-check section (common practice, worked by hand: 24 × 24 in, f′c 4 ksi,
 * fy 60 ksi) as in tests/cli/check.test.ts; here only that the bundle runs them and exits as the source does.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { bin, requireFreshBuild } from '../helpers/built.js';
import { runCli } from '../helpers/run-cli.js';

const elsewhere = mkdtempSync(join(tmpdir(), 'pmchart-smoke-'));
const run = (args: string[]) => spawnSync(process.execPath, [bin, ...args], { cwd: elsewhere, encoding: 'utf8', env: { ...process.env, PMCHART_DEBUG: '' } });
const section = ['--fc', '4', '--fy', '60', '--b', '24', '--h', '24', '--gamma', '0.75', '--bars-per-face', '2', '--proposals', '0'];

describe('the built binary, run from another folder', () => {
  beforeAll(requireFreshBuild);

  it('prints its version and help', () => {
    const v = run(['--version']);
    expect(v.status).toBe(0);
    expect(v.stdout).toMatch(/^\d+\.\d+\.\d+\n$/);
    expect(run(['--help']).stdout).toContain('check');
  });

  for (const [name, args, code] of [
    ['a passing check', [...section, '--pu', '900', '--mu', '600', '--rho', '0.04'], 0],
    ['a failing check', [...section, '--pu', '900', '--mu', '600', '--rho', '0.01'], 1],
    ['bad input', [...section, '--pu', '900', '--mu', 'abc'], 2],
  ] as const) {
    it(`${name}: exit ${code}, and the very bytes of the in-process run`, async () => {
      const built = run(['check', ...args]);
      const source = await runCli(['check', ...args]);
      expect(built.status).toBe(code);
      expect(built.stdout).toBe(source.stdout);
      expect(built.stderr).toBe(source.stderr);
    });
  }

  it('a table as JSON', () => {
    const r = run(['table', '--fc', '4', '--fy', '60', '--gamma', '0.8', '--rho', '0.02', '--format', 'json']);
    expect(r.status, r.stderr).toBe(0);
    expect(JSON.parse(r.stdout)).toBeTypeOf('object');
  });
});
