/**
 * `pmchart check --sway` and `pmchart schedule` with sway columns (issue 24), end to end through `main`:
 * the flags and load-file columns of each basis's convention, every sway step with its clause in the JSON,
 * the text report and the drawn sheet, and exit 2 naming the flag or CSV column of a bad value.
 * Figures are the hand calculations of tests/design/slenderness-sway.test.ts (ACI 318-19 6.6.4.6,
 * EN 1992-1-1 5.8.3.2(3) Eq. 5.16 with 5.8.8), restated where used.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers/run-cli.js';
import { expectClose } from '../helpers/tolerance.js';

const dir = mkdtempSync(join(tmpdir(), 'pmchart-sway-'));
const file = (name: string, text: string): string => {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
};

// the 16 × 16 in column of the ACI 318-19 sway hand calculation: 8 #8 (ρg = 6.32/256) at γ = 11/16, kℓu = 240 in,
// βdns = 0.6, Pu = 400 kips, M2ns = 50 kip-ft (600 kip·in), M1ns = −25 kip-ft, M2s = 100 kip-ft (1200 kip·in), Q = 0.2:
// design moment about x 2121.754 kip·in = 176.813 kip-ft (δs = 1.25, along the length δ = 1.010359)
const ACI = ['check', '--code', 'aci318-19', '--fc', '4', '--fy', '60', '--b', '16', '--h', '16', '--arrangement', 'four-faces', '--bars-per-face', '3', '--gamma', String(11 / 16), '--rho', String(6.32 / 256), '--proposals', '0', '--klu', '240', '--beta-dns', '0.6'];
// kℓu as braced 144 in keeps the accidental moment about y within 1.4 (6.2.5.3) so the load passes about y
const ACI_LOAD = [...ACI, '--pu', '400', '--mu', '50', '--m2', '50', '--m1', '-25', '--sway', '--m2-sway', '100'];

describe('check --sway (ACI 318-19 6.6.4.6)', () => {
  it('--stability-index: the design moment 176.81 kip-ft, every sway step with its clause in the JSON', async () => {
    const r = await runCli([...ACI_LOAD, '--stability-index', '0.2', '--json']);
    const out = JSON.parse(r.stdout);
    const x = out.results[0].slenderness;
    expect(x.method).toBe('ACI 318-19 6.6.4.6 moment magnification (sway)');
    expectClose(x.magnifiedMoment, 2121.754 / 12, 1e-5);
    const byKey = new Map<string, { clause: string; value: unknown }>(x.steps.map((s: { key: string; clause: string; value: unknown }) => [s.key, s]));
    for (const [key, cl] of [
      ['limit', '6.2.5.1(a)'],
      ['Q', '6.6.4.6.2(a)'],
      ['delta-s', '6.6.4.6.2(a)'],
      ['M2-sway', '6.6.4.6.1'],
      ['M1-sway', '6.6.4.6.1'],
      ['klu-braced', '6.6.4.6.4'],
      ['M-along', '6.6.4.6.4'],
      ['second-order-ratio', '6.2.5.3'],
    ] as const) {
      expect(byKey.get(key)?.clause, key).toBe(cl);
    }
    expectClose(byKey.get('delta-s')!.value as number, 1.25, 1e-9);
    expect(out.results[0].Mdesign).toBeGreaterThanOrEqual(176.8);
  });
  it('the text report lists the sway steps with their clauses and the sway assumption', async () => {
    const r = await runCli([...ACI_LOAD, '--stability-index', '0.2', '--klu-braced', '144', '--report', join(dir, 'aci.txt')]);
    expect(r.code, r.stderr).toBeLessThan(2);
    const t = readFileSync(join(dir, 'aci.txt'), 'utf8');
    expect(t).toContain('δs = 1/(1 − Q) ≥ 1 (6.6.4.6.2(a)) = 1.25');
    expect(t).toContain('M2 = M2ns + δs·M2s (6.6.4.6.1) = 2100');
    expect(t).toContain('kℓu as braced, k ≤ 1 (6.6.4.6.4) = 144');
    expect(t).toContain('Slender sway (unbraced) column');
  });
  it('the drawn sheet carries the sway steps of the governing load', async () => {
    const svg = join(dir, 'aci.svg');
    const r = await runCli([...ACI_LOAD, '--stability-index', '0.2', '--klu-braced', '144', '--report', svg]);
    expect(r.code, r.stderr).toBeLessThan(2);
    const text = readFileSync(svg, 'utf8');
    expect(text).toContain('6.6.4.6.2(a)');
    expect(text).toContain('6.6.4.6.1');
    // some forty steps per axis: those that do not fit above the assumptions are counted, not drawn over them
    expect(/>\d+ more steps?: the \.txt and \.json reports/.test(text)).toBe(true);
  });
  it('Q = 0.34 (δs = 1.515 > 1.5) is OUTSIDE SCOPE and Q = 1 UNSTABLE, exit 1 with the clause', async () => {
    const o = JSON.parse((await runCli([...ACI_LOAD, '--stability-index', '0.34', '--klu-braced', '144', '--json'])).stdout);
    expect(o.results[0].status).toBe('outside-scope');
    expect(o.results[0].statusClause).toBe('ACI 318-19 6.6.4.6.2(a) (δs from Q > 1.5)');
    const u = await runCli([...ACI_LOAD, '--stability-index', '1', '--json']);
    expect(u.code).toBe(1);
    expect(JSON.parse(u.stdout).results[0].status).toBe('unstable');
  });
  it('--loads with M2s, M1s and per-load Q or storey sums; a load file without them takes the member flags', async () => {
    const loads = file('aci-loads.csv', ['id,Pu,Mu,M2,M1,M2s,Q,storeyPu,storeyPc', 'W1,400,50,50,-25,100,0.2,,', 'W2,400,50,50,-25,100,,3000,16000', 'G1,400,50,50,-25,0,,,'].join('\n'));
    const r = await runCli([...ACI, '--loads', loads, '--sway', '--stability-index', '0.1', '--klu-braced', '144', '--json']);
    const res = new Map<string, { slenderness: { steps: { key: string; value: number }[] } }>(JSON.parse(r.stdout).results.map((x: { id: string }) => [x.id, x]));
    const ds = (id: string) => res.get(id)!.slenderness.steps.find((s) => s.key === 'delta-s')!.value;
    expectClose(ds('W1'), 1.25, 1e-6);
    expectClose(ds('W2'), 4 / 3, 1e-6); // ΣPu/(0.75·ΣPc) = 3000/12,000 (6.6.4.6.2(b))
    expectClose(ds('G1'), 1 / 0.9, 1e-6); // the member's --stability-index 0.1
  });
  it('exit 2 naming the flag or CSV column of a bad or missing value', async () => {
    const cases: [string[], RegExp][] = [
      [[...ACI_LOAD.filter((a) => a !== '--sway')], /^pmchart: --m2-sway: applies to a sway column: add --sway\n$/],
      [[...ACI_LOAD], /^pmchart: --stability-index: or --storey-pu with --storey-pc is required with --sway/],
      [[...ACI_LOAD, '--stability-index', '-0.1'], /^pmchart: --stability-index: /],
      [[...ACI_LOAD, '--stability-index', 'abc'], /^pmchart: --stability-index: .*is not a number/],
      [[...ACI_LOAD, '--storey-pu', '3000'], /^pmchart: --storey-pc: is required with the other storey sum/],
      [[...ACI_LOAD, '--storey-pu', '0', '--storey-pc', '16000'], /^pmchart: --storey-pu: 0 must be greater than 0/],
      [[...ACI_LOAD, '--stability-index', '0.2', '--k1', '1', '--k2', '1'], /^pmchart: --k1: does not apply to ACI 318-19 6\.6\.4\.6/],
      [[...ACI, '--pu', '400', '--mu', '50', '--sway', '--m02-sway', '100', '--stability-index', '0.2'], /^pmchart: --m02-sway: is not the sway-moment flag of ACI 318-19/],
      [[...ACI, '--pu', '400', '--mu', '50', '--sway', '--stability-index', '0.2'], /^pmchart: --m2-sway: is required with --sway/],
    ];
    for (const [args, err] of cases) {
      const r = await runCli(args);
      expect(r.code, args.join(' ')).toBe(2);
      expect(r.stderr).toMatch(err);
    }
    const bad = file('bad-q.csv', 'id,Pu,Mu,M2s,Q\nW1,400,50,100,-1\n');
    const q = await runCli([...ACI, '--loads', bad, '--sway', '--json']);
    expect(q.code).toBe(2);
    expect(q.stderr).toMatch(/^pmchart: --loads line 2 Q: -1 is not a stability index within 0–10/);
    const sums = file('bad-sum.csv', 'id,Pu,Mu,M2s,storeyPu,storeyPc\nW1,400,50,100,-3000,16000\n');
    expect((await runCli([...ACI, '--loads', sums, '--sway', '--json'])).stderr).toMatch(/^pmchart: --loads line 2 storeyPu: .*must be greater than 0/);
    const en = file('en-cols.csv', 'id,Pu,Mu,M02s\nW1,400,50,100\n');
    expect((await runCli([...ACI, '--loads', en, '--sway', '--stability-index', '0.2', '--json'])).stderr).toMatch(/^pmchart: --loads M02s column: is not a sway-moment column of ACI 318-19: use M1s, M2s, M1sy, M2sy/);
    const braced = file('braced.csv', 'id,Pu,Mu,M2s\nW1,400,50,100\n');
    expect((await runCli([...ACI, '--loads', braced, '--json'])).stderr).toMatch(/^pmchart: --loads M2s column: applies to a sway column: add --sway/);
  });
});

describe('check --sway (EN 1992-1-1: l0 by Eq. 5.16, --m02-sway)', () => {
  // the EN hand calculation: 400 × 400 mm, fck = 30, fyk = 500, 8 Ø20 at γ = 0.75, NEd = 1500 kN, φef = 1,
  // ℓ = 4.0 m, k1 = 0.5, k2 = 1.0: l0 = 8326.66 mm; M02 = 40 + 50 = 90 kN·m; MEd = 265.115 kN·m
  const EN = ['check', '--code', 'en1992-1-1', '--fc', '30', '--fy', '500', '--b', '400', '--h', '400', '--arrangement', 'four-faces', '--bars-per-face', '3', '--gamma', '0.75', '--rho', String((8 * 314.159) / 160000), '--proposals', '0', '--creep', '1', '--pu', '1500', '--mu', '40', '--m02', '40', '--m01', '20'];
  it('--lu 4m --k1 0.5 --k2 1: l0 = 8326.66 mm and MEd = 265.11 kN·m', async () => {
    const r = await runCli([...EN, '--sway', '--lu', '4m', '--k1', '0.5', '--k2', '1', '--m02-sway', '50', '--json']);
    const x = JSON.parse(r.stdout).results[0].slenderness;
    expect(x.method).toBe('EN 1992-1-1 5.8.8 nominal curvature (unbraced)');
    const l0 = x.steps.find((s: { key: string }) => s.key === 'l0');
    expect(l0.clause).toBe('5.8.3.2(3)');
    expectClose(l0.value, 8326.664, 1e-6);
    expectClose(x.magnifiedMoment, 265.11455, 1e-5);
  });
  it('refuses --lu with --klu, --lu without --k2, and the storey flags EN has no use for', async () => {
    expect((await runCli([...EN, '--sway', '--lu', '4m', '--klu', '8m', '--k1', '1', '--k2', '1'])).stderr).toMatch(/^pmchart: --lu: and --klu both give the length/);
    expect((await runCli([...EN, '--sway', '--lu', '4m', '--k1', '1'])).stderr).toMatch(/^pmchart: --k2: is required with --lu/);
    const q = await runCli([...EN, '--sway', '--klu', '8m', '--stability-index', '0.1']);
    expect(q.code).toBe(2);
    expect(q.stderr).toMatch(/^pmchart: --stability-index: does not apply to EN 1992-1-1 5\.8\.8 nominal curvature \(unbraced\)/);
    expect((await runCli([...EN, '--sway', '--klu', '8m', '--k1', '1', '--k2', '-1'])).stderr).toMatch(/^pmchart: --k2: /);
  });
  it('requires --m02-sway (0 allowed): --mu is the non-sway part, so a sway part left out would be a lateral moment forgotten', async () => {
    const r = await runCli([...EN, '--sway', '--klu', '8m']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/^pmchart: --m02-sway: is required with --sway/);
    const zero = await runCli([...EN, '--sway', '--klu', '8m', '--m02-sway', '0', '--json']);
    expect(zero.code, zero.stderr).toBeLessThan(2);
  });
});

describe('schedule with a sway column', () => {
  it('a mark with sway, klu_braced and stability_index equals the single check; a bad sway cell names its column', async () => {
    const sched = file('sway-schedule.csv', ['mark,code,units,fc,fy,b,h,arrangement,bars_per_face,bar,cover,tie,klu,beta_dns,sway,klu_braced,stability_index', 'S1,aci318-19,us,4,60,16,16,four-faces,3,#8,1.5,#3,240,0.6,yes,144,0.2'].join('\n'));
    const loads = file('sway-schedule-loads.csv', 'mark,id,Pu,Mu,M2,M1,M2s\nS1,W1,400,50,50,-25,100\n');
    const s = await runCli(['schedule', sched, '--loads', loads, '--json']);
    expect(s.code, s.stderr).toBeLessThan(2);
    const mark = JSON.parse(s.stdout).columns[0];
    const one = await runCli(['check', '--code', 'aci318-19', '--units', 'us', '--fc', '4', '--fy', '60', '--b', '16', '--h', '16', '--arrangement', 'four-faces', '--bars-per-face', '3', '--bar', '#8', '--cover', '1.5', '--tie', '#3', '--klu', '240', '--beta-dns', '0.6', '--sway', '--klu-braced', '144', '--stability-index', '0.2', '--loads', file('one.csv', 'id,Pu,Mu,M2,M1,M2s\nW1,400,50,50,-25,100\n'), '--proposals', '0', '--json']);
    const single = JSON.parse(one.stdout).results[0];
    expect(mark.utilisation).toBe(single.utilisation);
    expect(single.slenderness.method).toBe('ACI 318-19 6.6.4.6 moment magnification (sway)');
    const bad = file('sway-bad.csv', ['mark,code,units,fc,fy,b,h,arrangement,bars_per_face,bar,cover,tie,klu,beta_dns,sway,stability_index', 'S1,aci318-19,us,4,60,16,16,four-faces,3,#8,1.5,#3,240,0.6,maybe,0.2'].join('\n'));
    const b = await runCli(['schedule', bad, '--loads', loads]);
    expect(b.code).toBe(2);
    expect(b.stderr).toMatch(/line 2 sway: maybe is not yes or no/);
  });
});
