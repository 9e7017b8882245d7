/**
 * `pmchart check` through runCheck (no parser) and through the CLI in-process (runCli) for exit codes; the built binary is smoke-tested in built-binary.test.ts.
 * Loads: the issue-4 hand-check (common practice, worked by hand).
 */
import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it, vi } from 'vitest';
import { parseLoadsCsv, runCheck, type CheckOptions } from '../../src/cli/check.js';
import { PmError } from '../../src/errors.js';
import { clearFaults, faults } from '../helpers/fs-faults.mjs';
import { runCli } from '../helpers/run-cli.js';
import { cli as inProcess } from '../helpers/run-cli.js';

// a full disk is injected by a test-only mock of node:fs (tests/helpers/fs-faults.mjs)
vi.mock('node:fs', async (importOriginal) => (await import('../helpers/fs-faults.mjs')).faultyFs(await importOriginal<typeof import('node:fs')>()));

const base: CheckOptions = { fc: '4', fy: '60', b: '24', h: '24', gamma: String(20 / 24), pu: '900', mu: '600' };
const dir = mkdtempSync(join(tmpdir(), 'pmchart-check-'));

describe('runCheck --json', () => {
  const out = JSON.parse(runCheck({ ...base, json: true }));

  it('keeps the stable field names of every result', () => {
    const r = out.results[0];
    for (const key of ['id', 'rhoRequired', 'rhoFromChart', 'rhoRoundedDown', 'normalised', 'strain', 'utilisation', 'extraSteelRoundedDown', 'governing', 'notes']) {
      expect(r).toHaveProperty(key);
    }
    expect(Object.keys(r.normalised)).toEqual(['P', 'M', 'eOverH']);
    expect(r.strain).toMatchObject({ class: 'compression-controlled', phi: 0.65 });
    expect(out).toHaveProperty('bars');
    expect(out).toHaveProperty('caution');
    expect(out.governing).toBe('load');
  });

  it('gives the hand-check values: traditional 0.03, exact lower', () => {
    const r = out.results[0];
    expect(r.rhoRoundedDown).toBe(0.03);
    expect(r.rhoRequired).toBeLessThan(0.03);
    expect(r.extraSteelRoundedDown).toBeCloseTo((0.03 - r.rhoRequired) * 576, 3);
    expect(r.normalised.P).toBeCloseTo(1.5625, 6);
  });

  it('reports utilisation for a given ρg: above 1 at 0.02, below 1 at 0.03', () => {
    const at = (rho: string) => JSON.parse(runCheck({ ...base, gamma: '0.75', rho, json: true })).results[0].utilisation;
    expect(at('0.02')).toBeGreaterThan(1);
    expect(at('0.03')).toBeLessThan(1);
  });

  it('checks a given bar layout: 12 #11, 6 per face, with 2.5 in to the bar centres', () => {
    const r = JSON.parse(runCheck({ fc: '4', fy: '60', b: '24', h: '24', cover: '1.5', tie: '#3', bar: '#11', barsPerFace: '6', pu: '900', mu: '600', json: true }));
    expect(r.checked.kind).toBe('layout');
    expect(r.checked.rho).toBeCloseTo((12 * 1.56) / 576, 9);
    expect(r.results[0].utilisation).toBeLessThan(1);
  });
});

describe('load files', () => {
  const file = join(dir, 'loads.csv');
  writeFileSync(file, 'id,Pu,Mu\nlight,200,50\nheavy,900,600\ntension,-100kip,80\n');

  it('reports the governing load first', () => {
    const out = JSON.parse(runCheck({ ...base, pu: undefined, mu: undefined, loads: file, json: true }));
    expect(out.results.map((r: { id: string }) => r.id)).toEqual(['heavy', 'tension', 'light']);
    expect(out.results[0].governing).toBe(true);
    expect(out.results[1].governing).toBe(false);
  });

  it('accepts unit suffixes and negative (tension) Pu', () => {
    const loads = parseLoadsCsv('id,Mu,Pu\na,100kN-m,-50kN\n', 'si');
    expect(loads).toEqual([{ id: 'a', Pu: -50_000, Mu: 100e6 }]);
  });

  it('names the line and field of a bad cell', () => {
    expect(() => parseLoadsCsv('id,Pu,Mu\na,12,\n', 'us')).toThrow(/--loads line 2 Mu/);
    expect(() => parseLoadsCsv('name,P,M\n', 'us')).toThrow(PmError);
  });
});

describe('text output and reports', () => {
  it('prints a readable table with the caution', () => {
    const text = runCheck(base);
    expect(text).toMatch(/ρg req/);
    expect(text).toMatch(/qualified engineers/);
  });

  it('writes a text report with inputs, clauses, results and caution, and no temp file left', () => {
    const file = join(dir, 'report.txt');
    runCheck({ ...base, report: file });
    const text = readFileSync(file, 'utf8');
    for (const s of ['INPUTS', 'ASSUMPTIONS AND CODE CLAUSES', '22.4.2.1', 'RESULTS', 'CAUTION', 'local codes']) expect(text).toContain(s);
    expect(readdirSync(dir).filter((f) => f.endsWith('.tmp'))).toEqual([]);
  });

  it('writes a JSON report equal to --json output', () => {
    const file = join(dir, 'report.json');
    const printed = runCheck({ ...base, json: true, report: file });
    expect(readFileSync(file, 'utf8')).toBe(printed);
  });
});

describe('bad input', () => {
  it.each([
    [{ ...base, pu: 'abc' }, /--pu/],
    [{ ...base, mu: undefined }, /--mu/],
    // beyond the basis limits (0.01–0.08) the check runs and reports `detailing` (issue 19); beyond what the maths takes it is bad input
    [{ ...base, rho: '0.3' }, /--rho: 0.3 is outside 0.0001–0.25/],
    [{ ...base, b: undefined, h: undefined }, /--b\/--h/],
    [{ ...base, report: 'x.docx' }, /--report/],
    [{ ...base, chartGammaStep: '0' }, /--chart-gamma-step/],
  ])('throws a PmError naming the field (%#)', (opts, re) => {
    expect(() => runCheck(opts as CheckOptions)).toThrow(re);
  });

  it('exits 2 with one line and no stack trace', async () => {
    const r = await inProcess(['check', '--fc', '4', '--fy', '60', '--b', '24', '--h', '24', '--gamma', '0.8', '--pu', '900', '--mu', '600', '--rho', '0.5']);
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/^pmchart: --rho/);
    const ok = (await inProcess(['check', '--fc', '4', '--fy', '60', '--b', '24', '--h', '24', '--gamma', '0.8', '--pu', '900', '--mu', '600', '--json'])).stdout;
    expect(JSON.parse(ok).results[0]).toHaveProperty('rhoFromChart');
  });
});

describe('check exit status (0 pass, 1 a load does not pass, 2 bad input, 3 I/O error)', () => {
  const run = (args: string[]) => inProcess(['check', ...args]);
  // issue-4 hand-check section (common practice, worked by hand): 24 × 24 in, f′c 4 ksi, fy 60 ksi, γ 0.75
  const section = ['--fc', '4', '--fy', '60', '--b', '24', '--h', '24', '--gamma', '0.75', '--bars-per-face', '2', '--proposals', '0'];
  it('0 when every load passes, with the summary line', async () => {
    const r = await run([...section, '--pu', '900', '--mu', '600', '--rho', '0.04']);
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('Summary: all 1 load pass');
  });
  it('1 when a load fails, and the row says FAILS', async () => {
    const r = await run([...section, '--pu', '900', '--mu', '600', '--rho', '0.01']);
    expect(r.status).toBe(1);
    expect(r.stdout).toMatch(/FAILS/);
    expect(r.stdout).toContain('1 of 1 load does not pass (1 fails)');
  });
  it('1 when a load is unstable (ACI 318-19 6.6.4.5.2: Pu ≥ 0.75·Pc, Pc = 373 kip by hand)', async () => {
    const r = await run(['--fc', '6', '--fy', '60', '--b', '20', '--h', '20', '--cover', '1.5', '--tie', '#4', '--bar', '#10', '--arrangement', 'four-faces', '--bars-per-face', '3', '--pu', '700', '--mu', '180', '--m1', '-90', '--klu', '52ft', '--beta-dns', '0.6']);
    expect(r.status).toBe(1);
    expect(r.stdout).toContain('UNSTABLE');
    expect(r.stdout).not.toContain('not possible (ρg');
  });
  it('2 for bad input, one line naming the flag', async () => {
    const r = await run([...section, '--pu', '900', '--mu', 'abc']);
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toContain('--mu');
  });
  it('3 when the report cannot be written (a full disk, injected), and no temporary file is left', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'pmchart-exit3-'));
    const file = join(dir, 'c.txt');
    faults.write = 'c.txt';
    const r = await runCli(['check', ...section, '--pu', '900', '--mu', '600', '--report', file]);
    clearFaults();
    expect(r.code).toBe(3);
    expect(r.stderr).toBe(`pmchart: --report: ${file} cannot be written (ENOSPC)\n`);
    expect(readdirSync(dir)).toEqual([]);
  });
});
