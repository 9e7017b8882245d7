/**
 * `pmchart check` and the detailing status (issue 19 U4), through runCheck and the CLI (in-process) run from
 * another directory. Hand calculations beside each case.
 */
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCheck, type CheckOptions } from '../../src/cli/check.js';
import { cli as inProcess } from '../helpers/run-cli.js';

const base: CheckOptions = { fc: '4', fy: '60', b: '16', h: '16', arrangement: 'four-faces', barsPerFace: '3', gamma: '0.7', pu: '300', mu: '25', proposals: '0', json: true };

describe('check --rho beyond the basis limits runs and reports detailing', () => {
  it('ACI 318-19 10.6.1.1: --rho 0.09 > 0.08 gives status detailing with the rule and clause, exit 1 (was refused, exit 2)', () => {
    const out = JSON.parse(runCheck({ ...base, rho: '0.09' }));
    const r = out.results[0];
    expect(r.status).toBe('detailing');
    expect(r.statusClause).toBe('10.6.1.1');
    expect(r.findings.find((f: { rule: string }) => f.rule === 'steel-max')).toMatchObject({ outcome: 'violated', value: 0.09, limit: 0.08 });
    expect(out.summary.detailing).toBe(1);
    expect(out.exitCode).toBe(1);
  });

  it('ACI 318-19 10.6.1.1 with 10.3.1.2: --rho 0.004 < 0.01·(Ag/2)/Ag = 0.005 gives detailing', () => {
    // Pu = 100 kip: Po = 0.85·4·(256 − 1.024) + 60·1.024 = 866.9 + 61.4 = 928.4 kip, φPn,max = 0.52·928.4 = 482.8 kip
    // (22.4.2.1): utilisation about 0.2 < 1/2, so the reduced effective area goes down to Ag/2 and no further
    const r = JSON.parse(runCheck({ ...base, pu: '100', rho: '0.004' })).results[0];
    expect(r.utilisation).toBeLessThan(0.5);
    expect(r.status).toBe('detailing');
    expect(r.findings.find((f: { rule: string }) => f.rule === 'steel-min')).toMatchObject({ outcome: 'violated', limit: 0.005 });
  });

  it('the text table names the status and the clause', () => {
    const text = runCheck({ ...base, rho: '0.09', json: false });
    expect(text).toMatch(/DETAILING/);
    expect(text).toMatch(/Ast ≤ 0\.08·Ag: 0\.09 > 0\.08 \[10\.6\.1\.1\]/);
  });
});

describe('a bar layout from cover, tie and bar', () => {
  // 16 × 24 in, 4 #14 per face on two faces, 1.5 in cover to #4 ties (ACI 318-19 25.2.3):
  // clear = (16 − 2·1.5 − 2·0.5 − 4·1.693)/3 = 5.228/3 = 1.743 in < max(1.5, 1.5·1.693, 4/3·0.75) = 2.540 in
  const layout: CheckOptions = { fc: '4', fy: '60', b: '16', h: '24', cover: '1.5', tie: '#4', bar: '#14', barsPerFace: '4', pu: '400', mu: '100', proposals: '0', json: true };

  it('4 #14 per face: detailing [25.2.3]; with the JSON gammaSource "bars"', () => {
    const out = JSON.parse(runCheck(layout));
    const r = out.results[0];
    expect(out.section.gammaSource).toBe('bars');
    expect(r.status).toBe('detailing');
    expect(r.statusClause).toBe('25.2.3');
    const f = r.findings.find((x: { rule: string }) => x.rule === 'clear-spacing');
    expect(f.value).toBeCloseTo(5.228 / 3, 4);
    expect(f.limit).toBeCloseTo(2.5395, 4);
    expect(out.detailing).toMatchObject({ aggregate: 0.75, aggregateAssumed: true });
  });

  it('--aggregate 2in raises the spacing rule to 4/3·2 = 2.667 in (ACI 318-19 25.2.3)', () => {
    const r = JSON.parse(runCheck({ ...layout, bar: '#8', aggregate: '2in' })).results[0];
    // 4 #8 per face: clear = (16 − 3 − 1 − 4·1.0)/3 = 2.667 in; required max(1.5, 1.5, 2.667) = 2.667 in: met (equal)
    const f = r.findings.find((x: { rule: string }) => x.rule === 'clear-spacing');
    expect(f.limit).toBeCloseTo(8 / 3, 6);
    expect(f.value).toBeCloseTo(8 / 3, 6);
    expect(f.outcome).toBe('met');
  });

  it('the CLI, run from another directory, exits 1 with status detailing', async () => {
    const args = ['check', '--fc', '4', '--fy', '60', '--b', '16', '--h', '24', '--cover', '1.5', '--tie', '#4', '--bar', '#14', '--bars-per-face', '4', '--pu', '400', '--mu', '100', '--proposals', '0', '--json'];
    const r = await inProcess([...args], { cwd: tmpdir() });
    expect(r.status).toBe(1);
    expect(JSON.parse(r.stdout).results[0].status).toBe('detailing');
  });
});
