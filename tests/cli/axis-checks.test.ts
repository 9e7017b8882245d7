/**
 * `pmchart check` end to end (the CLI in-process, run from another folder): the minimum moment about y checked alone
 * (ACI 318-19 6.6.4.5.4, one axis at a time per R6.6.4.5.4) and the exact search of a layout not symmetric about
 * the bending plane (ACI 318-19 22.2.1, 22.2.2) make a load fail that the x check alone passed; exit status 1,
 * the JSON carries yAxis, exactUniaxial, measureFrom and findings. The hand calculations of both cases are in
 * tests/design/axis-rules.test.ts (same sections and loads).
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { expectClose } from '../helpers/tolerance.js';
import { cli as inProcess } from '../helpers/run-cli.js';

const dir = mkdtempSync(join(tmpdir(), 'pmchart-axes-'));
const cli = (args: string[]) => inProcess([...args], { cwd: dir });

describe('check: each axis alone, from the command line', () => {
  it('U1: kℓu = 126 in, no --muy: the y minimum moment (M2,min = 600·0.96 = 576 kip·in, δ = 1.3481) fails alone, exit 1', async () => {
    writeFileSync(join(dir, 'u1.json'), JSON.stringify([{ x: 0, y: 0.4, share: 1 }, { x: 0, y: -0.4, share: 1 }]));
    const args = ['check', '--fc', '4', '--fy', '60', '--b', '12', '--h', '24', '--gamma', '0.8', '--arrangement', 'custom', '--custom-bars', 'u1.json', '--rho', String(4 / 288), '--pu', '600', '--mu', '5', '--klu', '126', '--beta-dns', '0', '--proposals', '0'];
    const r = await cli([...args, '--json']);
    expect(r.status).toBe(1);
    const res = JSON.parse(r.stdout).results[0];
    expect(res.status).toBe('fails');
    expect(res.measureFrom).toBe('y');
    // 776.51 kip·in = 64.709 kip-ft, the magnified M2,min about y (display unit kip-ft)
    expectClose(res.yAxis.Mdesign, (1.34811 * 576) / 12, 1e-4);
    expect(res.yAxis.utilisation).toBeGreaterThan(1);
    expect(res.findings).toContainEqual({ rule: 'min-moment', clause: '6.6.4.5.4', axis: 'y', outcome: 'applied', value: 0, limit: 48, quantity: 'moment' });
    // the text names the axis of the check that governs
    const t = await cli(args);
    expect(t.status).toBe(1);
    expect(t.stdout).toContain('about y alone governs');
    expect(t.stdout).toMatch(/\* load\s+about y alone/);
  });

  it('U3: bars not symmetric about the bending plane, no --muy: uniaxial 0.962 but the exact search 1.011 fails, exit 1', async () => {
    writeFileSync(join(dir, 'u3.json'), JSON.stringify([{ x: -0.3, y: 0.375, share: 2 }, { x: -0.3, y: -0.375, share: 2 }, { x: 0.3, y: -0.375, share: 1 }]));
    const r = await cli(['check', '--fc', '4', '--fy', '60', '--b', '12', '--h', '20', '--gamma', '0.75', '--arrangement', 'custom', '--custom-bars', 'u3.json', '--rho', String(5 / 240), '--pu', '300', '--mu', String(2200 / 12), '--proposals', '0', '--json']);
    expect(r.status).toBe(1);
    const res = JSON.parse(r.stdout).results[0];
    expect(res.utilisation).toBeLessThan(1);
    expect(res.exactUniaxial.utilisation).toBeGreaterThan(1);
    expect(res.measure).toBe(res.exactUniaxial.utilisation);
    expect(res.measureFrom).toBe('x-exact');
    expect(res.findings.map((f: { rule: string }) => f.rule)).toContain('exact-section');
  });
});
