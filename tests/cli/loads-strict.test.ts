/**
 * `check --loads` accounts for every cell (issue 25). Before, a header "My" (meant as Muy) was ignored and
 * the load checked about one axis only, exiting 0: unconservative. Run from /tmp so that nothing depends on
 * the working folder. Needs `npm run build`.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { cli as inProcess } from '../helpers/run-cli.js';

const dir = mkdtempSync(join(tmpdir(), 'pmchart-loads-'));
const run = (args: string[]) => inProcess(['check', ...args], { cwd: tmpdir() });
const section = ['--fc', '4', '--fy', '60', '--b', '24', '--h', '24', '--gamma', '0.75', '--bars-per-face', '3', '--rho', '0.02', '--proposals', '0'];
const file = (name: string, text: string) => {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
};

describe('check --loads strictness', () => {
  it('refuses an unknown column "My" (exit 2, naming line and column) instead of skipping the biaxial check', async () => {
    const r = await run([...section, '--loads', file('my.csv', 'id,Pu,Mu,My\nA,900,400,400\n')]);
    expect(r.status).toBe(2);
    expect(r.stderr.trim()).toMatch(/^pmchart: --loads line 1 column 4: "My" is not a column pmchart reads .*--ignore-columns/);
  });
  it('skips the column when --ignore-columns names it, and checks Muy when the header says Muy', async () => {
    const skipped = await run([...section, '--loads', file('my2.csv', 'id,Pu,Mu,My\nA,900,400,400\n'), '--ignore-columns', 'My']);
    expect(skipped.status, skipped.stderr).toBe(0);
    const biaxial = await run([...section, '--loads', file('muy.csv', 'id,Pu,Mu,Muy\nA,900,400,400\n')]);
    expect(biaxial.status, biaxial.stderr).toBe(1);
  });
  it('refuses a shifted row (exit 2) and a thousands dot without --thousands', async () => {
    const shifted = await run([...section, '--loads', file('shift.csv', 'id,Pu,Mu\nC2,3,500,250\n')]);
    expect(shifted.status).toBe(2);
    expect(shifted.stderr).toMatch(/^pmchart: --loads line 2 column 4: 250 is a cell beyond the 3 columns/);
    const dots = file('dots.csv', 'id;Pu;Mu\nA;1.500;2,5\n');
    expect((await run([...section, '--loads', dots])).status).toBe(2);
    const read = await run([...section, '--loads', dots, '--thousands', 'dot', '--json']);
    expect(read.status, read.stderr).toBeLessThan(2);
    expect(JSON.parse(read.stdout).results[0].Pu).toBe(1500);
    expect((await run([...section, '--loads', dots, '--thousands', 'comma'])).stderr).toMatch(/^pmchart: --thousands: "comma" is not one of the allowed values/);
    expect((await run([...section, '--pu', '1', '--mu', '1', '--thousands', 'dot'])).stderr).toMatch(/^pmchart: --thousands: reads a load file; give it with --loads/);
  });
});
