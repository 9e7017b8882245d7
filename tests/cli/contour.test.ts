/** `pmchart contour`: the runner and the CLI in-process. */
import { mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runContour } from '../../src/cli/contour.js';
import { expectClose } from '../helpers/tolerance.js';
import { cli as inProcess } from '../helpers/run-cli.js';

const cli = (args: string[]) => inProcess(args);
const flags = { fc: '4', fy: '60', b: '20', h: '20', arrangement: 'four-faces', barsPerFace: '4', gamma: '0.75', rho: '0.02', pu: '300' };

describe('runContour', () => {
  it('CSV: fixed columns, one row per angle, symmetric about 45° for a square with four-face bars (first principles)', () => {
    const lines = runContour({ ...flags, points: '8' }).trim().split('\n');
    expect(lines[0]).toBe('na_angle_deg,na_depth,eps_t,phi,P,Mx,My');
    const rows = lines.slice(1).map((l) => l.split(',').map(Number));
    expect(rows.length).toBe(8);
    for (const r of rows) expectClose(r[4]!, 300, 1e-6);
    expectClose(rows[0]![5]!, rows[2]![6]!, 1e-6); // θ = 0° Mx equals θ = 90° My
    expectClose(rows[1]![5]!, rows[1]![6]!, 1e-6); // θ = 45°: Mx = My
  });
  it('JSON carries units, conventions, the basis notes and the caution', () => {
    const out = JSON.parse(runContour({ ...flags, format: 'json', points: '12' }));
    expect(out.unitsOf).toEqual({ P: 'kip', Mx: 'kip-ft', My: 'kip-ft', na_depth: 'in' });
    expect(out.points.length).toBe(12);
    expect(out.caution).toMatch(/qualified engineers/);
    expect(out.inputs.steel).toBe('ρg = 0.02');
  });
  it('named bars: --bar #9 with 12 bars on four faces gives Ast = 12 in²', () => {
    const out = JSON.parse(runContour({ ...flags, rho: undefined, bar: '#9', format: 'json' }));
    expectClose(out.inputs.steelArea, 12, 1e-12);
  });
  it('--out writes the file whole (no temp file left behind)', () => {
    const dir = mkdtempSync(join(tmpdir(), 'pmchart-contour-'));
    const file = join(dir, 'c.csv');
    expect(runContour({ ...flags, out: file })).toBe('');
    expect(readFileSync(file, 'utf8').split('\n')[0]).toBe('na_angle_deg,na_depth,eps_t,phi,P,Mx,My');
    expect(readdirSync(dir)).toEqual(['c.csv']);
  });
});

describe('pmchart contour (CLI)', () => {
  it('exits 0 and prints CSV', async () => {
    const r = await cli(['contour', '--fc', '4', '--fy', '60', '--b', '16', '--h', '24', '--gamma', '0.75', '--rho', '0.02', '--pu', '250', '--points', '16']);
    expect(r.status).toBe(0);
    expect(r.stdout.trim().split('\n').length).toBe(17);
  });
  it('a load above the cap: one line naming --pu and the range, exit 2', async () => {
    const r = await cli(['contour', '--fc', '4', '--fy', '60', '--b', '20', '--h', '20', '--gamma', '0.75', '--rho', '0.02', '--pu', '3000']);
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n').length).toBe(1);
    expect(r.stderr).toMatch(/--pu: 3000 is outside .* kip/);
  });
  it('without a size or a ρg: exit 2 naming the flag', async () => {
    expect((await cli(['contour', '--fc', '4', '--fy', '60', '--gamma', '0.75', '--rho', '0.02', '--pu', '300'])).stderr).toMatch(/--b\/--h/);
    const r = await cli(['contour', '--fc', '4', '--fy', '60', '--b', '20', '--h', '20', '--gamma', '0.75', '--pu', '300']);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/--rho/);
  });
});
