/**
 * `--code as3600-2018` through table, sheet, set and check (AS 3600-2018; invented office and project in
 * tests/fixtures/au-set.json). Values by hand from the AS 3600-2018 formulas (from memory) as cited.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCheck, runCheckAsync } from '../../src/cli/check.js';
import { runTable } from '../../src/cli/table.js';
import { expectClose } from '../helpers/tolerance.js';
import { cli as inProcess } from '../helpers/run-cli.js';

const root = new URL('../../', import.meta.url).pathname;
const tmp = mkdtempSync(join(tmpdir(), 'pmchart-as3600-'));
const pdfText = (pdf: string, page: number) => execFileSync('pdftotext', ['-f', String(page), '-l', String(page), '-layout', pdf, '-'], { encoding: 'utf8' });

describe('pmchart with AS 3600-2018', () => {
  it('table: the last row is Nuo/(b·D) = 0.85·40·0.98 + 500·0.02 = 43.32 MPa (10.6.2.2)', () => {
    const rows = runTable({ code: 'as3600-2018', fc: '40', fy: '500', gamma: '0.8', rho: '0.02' }).trim().split('\n');
    const head = rows[0]!.split(',');
    expectClose(Number(rows[rows.length - 1]!.split(',')[head.indexOf('Pn_norm')]), 43.32, 1e-6);
  });
  it('table refuses US units with one line', () => {
    expect(() => runTable({ code: 'as3600-2018', units: 'us', fc: '6', fy: '60', gamma: '0.8', rho: '0.02' })).toThrow(/--units/);
  });
  it('check: N*, M* headings, D500N proposals, the 0.05·D minimum moment (10.1.2)', () => {
    const text = runCheck({ code: 'as3600-2018', fc: '40', fy: '500', b: '400', h: '600', arrangement: 'four-faces', barsPerFace: '3', gamma: '0.8', pu: '3000', mu: '50' });
    expect(text).toMatch(/N\* kN\s+M\* kN-m/);
    expect(text).toMatch(/ N(20|24|28|32|36) /);
    const out = JSON.parse(runCheck({ code: 'as3600-2018', fc: '40', fy: '500', b: '400', h: '600', gamma: '0.8', pu: '3000', mu: '50', proposals: '0', json: true }));
    // M* raised to N*·0.05·D = 3000 kN · 0.03 m = 90 kN·m: 90e6/(400·600²) = 0.625 MPa
    expectClose(out.results[0].normalised.M, 0.625, 1e-9);
  });
  it('a drawn report of a slender column bent about x alone (no y step) is written (regression: a null y step crashed the drawing)', async () => {
    const file = join(tmp, 'slender.pdf');
    await runCheckAsync({ code: 'as3600-2018', fc: '40', fy: '500', b: '400', h: '600', arrangement: 'four-faces', barsPerFace: '3', gamma: '0.8', pu: '3000', mu: '400', klu: '6000mm', betaDns: '0.6', m1: '-200', m2: '400', report: file, date: '2026-05-20' });
    expect(existsSync(file)).toBe(true);
    const page = pdfText(file, 1);
    expect(page).toContain('AS 3600-2018 10.4 moment magnifier');
    expect(page).toContain('Le/r');
  }, 60_000);
  it('sheet and set: γ₂, fsy and φNu on the page', async () => {
    const pdf = join(tmp, 'one.pdf');
    const r = await inProcess(['sheet', '--code', 'as3600-2018', '--fc', '40', '--fy', '500', '--gamma', '0.8', '--rho', '0.01:0.04:0.01', '--out', pdf, '--date', '2026-05-01']);
    expect(r.status, r.stderr).toBe(0);
    const page = pdfText(pdf, 1);
    expect(page).toContain('AS 3600-2018');
    expect(page).toContain('fsy 500 MPa');
    expect(page).toContain('γ₂');
    expect(page).toContain('φNu');
    const s = await inProcess(['set', join(root, 'tests/fixtures/au-set.json'), '--out', tmp, '--no-progress', '--jobs', '1']);
    expect(s.status, s.stderr).toBe(0);
    const book = join(tmp, 'gumtree-flat-au', 'book.pdf');
    expect(pdfText(book, 1)).toContain('AS 3600-2018');
    expect(readFileSync(join(tmp, 'gumtree-flat-au', 'tables', '1-square-fc-40mpa-fy-500mpa-gamma-0.80-two-faces-2-per-face-tied.csv'), 'utf8')).toContain('pure-compression');
  }, 60_000);
});
