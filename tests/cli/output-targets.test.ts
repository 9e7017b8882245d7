/**
 * Single-file outputs refuse a target that is neither absent nor a regular file (issue 25): before, each of
 * these commands renamed a regular file over a FIFO (or /dev/null when run as root) and exited 0. A FIFO in
 * a temporary folder stands for every such file (never /dev/null itself). Run from /tmp. Needs `npm run build`.
 */
import { execFileSync } from 'node:child_process';
import { lstatSync, mkdtempSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cli as inProcess } from '../helpers/run-cli.js';

const run = (args: string[]) => inProcess([...args], { cwd: tmpdir() });
const section = ['--fc', '4', '--fy', '60', '--b', '24', '--h', '24', '--gamma', '0.75'];

const cases: [string, (target: string) => string[]][] = [
  ['contour --out x.csv', (t) => ['contour', ...section, '--bars-per-face', '3', '--rho', '0.02', '--pu', '500', '--out', t]],
  ['contour --out x.svg', (t) => ['contour', ...section, '--bars-per-face', '3', '--rho', '0.02', '--pu', '500', '--out', t]],
  ['check --report x.txt', (t) => ['check', ...section, '--pu', '500', '--mu', '200', '--rho', '0.02', '--proposals', '0', '--report', t]],
  ['sheet --out x.svg', (t) => ['sheet', ...section, '--out', t]],
  ['page --out x.html', (t) => ['page', '--out', t]],
];

describe('outputs onto a FIFO', () => {
  for (const [name, args] of cases) {
    it(`${name}: exit 2, one line naming the flag, the FIFO untouched`, async () => {
      const dir = mkdtempSync(join(tmpdir(), 'pmchart-target-'));
      const ext = /x(\.\w+)$/.exec(name)![1]!;
      const target = join(dir, `target${ext}`);
      execFileSync('mkfifo', [target]);
      const r = await run(args(target));
      expect(r.status, r.stderr).toBe(2);
      expect(r.stderr.trim()).toMatch(/^pmchart: --(out|report): .* exists and is a FIFO, not a regular file; pmchart replaces only a regular file$/);
      expect(lstatSync(target).isFIFO()).toBe(true);
      expect(readdirSync(dir)).toEqual([`target${ext}`]);
    });
  }
});
