/**
 * `pmchart set` with the other bases through the CLI in-process: the European demo (EN 1992-1-1, ω families,
 * an αcc variant) and a CSA A23.3-19 fixture (tests/fixtures/csa-set.json, invented office and project).
 * Checks the book's front matter and sheets say what the basis is (pdftotext), and the ω-keyed tables.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PDFDocument } from 'pdf-lib';
import { describe, expect, it } from 'vitest';
import { cli as inProcess } from '../helpers/run-cli.js';

const root = new URL('../../', import.meta.url).pathname;
const tmp = mkdtempSync(join(tmpdir(), 'pmchart-set-codes-'));
const set = (file: string) => inProcess(['set', file, '--out', tmp, '--no-progress', '--jobs', '1']);
const pdfText = (pdf: string, first: number, last = first) => execFileSync('pdftotext', ['-f', String(first), '-l', String(last), '-layout', pdf, '-'], { encoding: 'utf8' });

describe('pmchart set with EN 1992-1-1 and CSA A23.3-19', () => {
  it('makes the European demo book: fck/fyk, factors per sheet group, ν/μ, ω families', async () => {
    const r = await set(join(root, 'charts-config/demo-eu.json'));
    expect(r.status, r.stderr).toBe(0);
    const dir = join(tmp, 'kaiserhafen-lofts-block-d');
    const pdf = join(dir, 'book.pdf');
    const doc = await PDFDocument.load(readFileSync(pdf));
    expect(doc.getPageCount()).toBe(2 + 11);
    const cover = pdfText(pdf, 1);
    expect(cover).toContain('Concrete fck'); // labels in the case written: symbols are never upper-cased (issue 20)
    expect(cover).toContain('αcc 1 · γc 1.5 · γs 1.15 (recommended): sheets 1–10');
    expect(cover).toContain('αcc 0.85 · γc 1.5 · γs 1.15 (not all recommended: check the NA): sheet 11');
    expect(cover).toContain('ν = NRd/(fcd·Ag), μ = MRd/(fcd·Ag·h), fcd = 40 MPa');
    expect(cover).toMatch(/ω family\s+0\.1, 0\.2/); // was "Ω FAMILY": ω upper-cased to Ω (issue 20)
    const index = pdfText(pdf, 2);
    expect(index).toMatch(/sheet\s+shape\s+fck\s+fyk/);
    const variant = pdfText(pdf, 13);
    expect(variant).toContain('αcc 0.85');
    expect(variant).toContain('fcd = 34 MPa');
    expect(variant).not.toContain('f′c');
    const csv = readFileSync(join(dir, 'tables', '01-square-fc-60mpa-fy-500mpa-gamma-0.70-two-faces-3-per-face-tied.csv'), 'utf8');
    expect(csv.split('\n')[1]).toMatch(/^0\.0092\d*,.*,pure-compression,"[^"]*",0\.1$/); // ρ = 0.1·40/434.78 = 0.0092
    const json = JSON.parse(readFileSync(join(dir, 'tables', '11-square-fc-60mpa-fy-500mpa-gamma-0.80-four-faces-3-per-face-tied-alphacc-0.85.json'), 'utf8'));
    expect(json.curvesBy).toBe('omega');
    expect(json.sheet.basisOptions).toEqual({ alphaCc: 0.85 });
    expect(json.curves[0].omega).toBe(0.1);
  }, 60_000);

  it('makes a CSA book with f′c/fy, φc, φs, α1, β1 and Pr in the title block', async () => {
    const r = await set(join(root, 'tests/fixtures/csa-set.json'));
    expect(r.status, r.stderr).toBe(0);
    const pdf = join(tmp, 'birchwater-depot-csa', 'book.pdf');
    const sheet = pdfText(pdf, 3);
    // α1 = 0.85 − 0.0015·35 = 0.7975, β1 = 0.97 − 0.0025·35 = 0.8825 (10.1.7)
    expect(sheet).toContain('φc 0.65 · φs 0.85 · α1 0.7975 · β1 0.8825');
    expect(sheet).toContain('f′c 35 MPa · fy 400 MPa');
    expect(sheet).toContain('Pr/Ag and Mr/(Ag·h) in MPa');
    expect(pdfText(pdf, 1)).toContain('CSA A23.3-19');
  }, 60_000);
});
