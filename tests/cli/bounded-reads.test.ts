/**
 * Every input file is read through one bounded reader (issue 25). Before, limits looked only at the size a
 * file reports: a pipe reports 0, so a 2 MB chart set (limit 1 MB) or a 40 MB load file (limit 32 MB)
 * through a FIFO was read whole (and /dev/zero without end). A finite writer keeps this test safe on the
 * old code; `tests/io/read.test.ts` reads /dev/zero and an endless pipe. Run from /tmp; needs `npm run build`.
 */
import { execFileSync, spawn, spawnSync } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { bin, requireFreshBuild } from '../helpers/built.js';

const section = ['--fc', '4', '--fy', '60', '--b', '24', '--h', '24', '--gamma', '0.75'];

/** A FIFO fed with `bytes` spaces by a shell (finite), the CLI run on it. */
async function throughFifo(bytes: number, args: (fifo: string) => string[]) {
  const dir = mkdtempSync(join(tmpdir(), 'pmchart-bounded-'));
  const fifo = join(dir, 'input');
  execFileSync('mkfifo', [fifo]);
  const writer = spawn('sh', ['-c', `head -c ${bytes} /dev/zero | tr '\\0' ' ' > '${fifo}'`], { stdio: 'ignore' });
  try {
    return spawnSync(process.execPath, [bin, ...args(fifo)], { encoding: 'utf8', cwd: tmpdir(), timeout: 60_000 });
  } finally {
    writer.kill();
  }
}

describe('inputs through a pipe stop at their limit', () => {
  beforeAll(requireFreshBuild);
  it('set: a 2 MB chart set through a FIFO', async () => {
    const r = await throughFifo(2 << 20, (f) => ['set', f, '--out', join(tmpdir(), 'pmchart-bounded-out')]);
    expect(r.status).toBe(2);
    expect(r.stderr.trim()).toMatch(/^pmchart: .*input: .*input is larger than 1048576 bytes$/);
  });
  it('check --custom-bars: 2 MB through a FIFO', async () => {
    const r = await throughFifo(2 << 20, (f) => ['check', ...section, '--arrangement', 'custom', '--custom-bars', f, '--rho', '0.02', '--pu', '1', '--mu', '1']);
    expect(r.status).toBe(2);
    expect(r.stderr.trim()).toMatch(/^pmchart: --custom-bars: .*input is larger than 1048576 bytes$/);
  });
  it('check --loads: 33 MB through a FIFO', async () => {
    const r = await throughFifo(33 << 20, (f) => ['check', ...section, '--rho', '0.02', '--loads', f]);
    expect(r.status).toBe(2);
    expect(r.stderr.trim()).toMatch(/^pmchart: --loads: .*input is larger than 33554432 bytes$/);
  });
});
