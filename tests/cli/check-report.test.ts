/**
 * `pmchart check --report FILE.pdf|svg` (the one-page calculation sheet) and `pmchart contour --out FILE.svg|pdf`.
 * Loads: the issue-4 hand-check (common practice, worked by hand): 24 × 24 in, bars on two faces, f′c = 4 ksi,
 * fy = 60 ksi, ACI 318-19, Pu = 900 kip, Mu = 600 kip-ft → Pu/(b·h) = 1.5625 ksi, Mu/(b·h²) = 0.5208 ksi; with
 * 2 in to the bar centres γ = 20/24, and the traditional reading (next lower sheet, next curve out) is ρg = 0.03.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PDFDocument } from 'pdf-lib';
import { describe, expect, it } from 'vitest';
import { computeCheck, runCheck, runCheckAsync, type CheckOptions } from '../../src/cli/check.js';
import { checkAssumptions } from '../../src/report/check-view.js';
import { runContour, runContourPlot } from '../../src/cli/contour.js';
import { CAUTION } from '../../src/cli/table.js';
import { buildCheckReport } from '../../src/sheet/check-report.js';
import { expectClose } from '../helpers/tolerance.js';
import { markGroup } from '../helpers/svg.js';
import { cli as inProcess } from '../helpers/run-cli.js';

const root = new URL('../../', import.meta.url).pathname;
const cli = (args: string[]) => inProcess(args);
const dir = mkdtempSync(join(tmpdir(), 'pmchart-report-'));
const hand: CheckOptions = { fc: '4', fy: '60', b: '24', h: '24', gamma: String(20 / 24), pu: '900', mu: '600', date: '2026-03-01', project: 'Quillon Street Depot (invented)' };
const pdftotext = (file: string) => spawnSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8' }).stdout;

const count = (s: string, re: RegExp) => (s.match(re) ?? []).length;

describe('check --report FILE.pdf', () => {
  const file = join(dir, 'hand.pdf');
  const json = JSON.parse(runCheck({ ...hand, json: true }));
  const r = json.results[0];

  it('writes one page whose text holds the inputs, the results, the clauses and the caution', async () => {
    await runCheckAsync({ ...hand, report: file });
    const doc = await PDFDocument.load(readFileSync(file));
    expect(doc.getPageCount()).toBe(1);
    const text = pdftotext(file);
    for (const s of ['Column check', 'ACI 318-19', '24 × 24 in', 'Quillon Street Depot (invented)', '2026-03-01', '22.4.2.1', 'Table 21.2.2', 'qualified engineers', 'local codes and licensed engineering judgement']) {
      expect(text).toContain(s);
    }
    // hand-check: normalised point 1.5625 ksi / 0.5208 ksi, traditional reading 0.03, exact lower, the steel saved
    expect(text).toContain('1.563');
    expect(text).toContain('0.5208');
    expect(r.rhoRoundedDown).toBe(0.03);
    expect(r.rhoRequired).toBeLessThan(0.03);
    for (const v of [r.rhoRequired, r.rhoFromChart]) expect(text).toContain(String(Number(v.toPrecision(4))));
    expect(text).toContain(String(Number(((0.03 - r.rhoRequired) * 576).toPrecision(4))));
    expect(text).toMatch(/compression/);
    expect(readdirSync(dir).filter((f) => f.endsWith('.tmp'))).toEqual([]);
  });

  it('gives identical bytes on a second run (fixed date)', async () => {
    const again = join(dir, 'hand-again.pdf');
    await runCheckAsync({ ...hand, report: again });
    expect(Buffer.compare(readFileSync(file), readFileSync(again))).toBe(0);
  });

  it('still prints the table (or JSON) on standard output', async () => {
    const printed = await runCheckAsync({ ...hand, json: true, report: join(dir, 'printed.pdf') });
    expect(JSON.parse(printed).results[0].rhoRequired).toBe(r.rhoRequired);
  });
});

describe('check --report FILE.svg', () => {
  it('marks each load at its normalised point (hand-check values), the governing one apart, with labels', async () => {
    const { check } = computeCheck(hand);
    const page = buildCheckReport({ check, assumptions: checkAssumptions(check), caution: CAUTION, date: '2026-03-01', generator: 'pmchart test' });
    const mark = page.data.loadMarks![0]!;
    expectClose(mark.P, 900 / 576, 1e-5); // Pu/(b·h) = 1.5625 ksi
    expectClose(mark.M, (600 * 12) / (576 * 24), 1e-4); // Mu/(b·h²) = 0.5208 ksi
    expect(mark.governing).toBe(1);
    // the dashed curve at ρg required passes through the load (capacity at ρg required equals the demand)
    expect(page.data.extraCurves!.length).toBeGreaterThan(50);
  });

  it('labels the curves where the load is: in the compression zone near its axial level, clear of its mark (issue: reports labelled only the tension branch)', () => {
    const { check } = computeCheck(hand);
    const page = buildCheckReport({ check, assumptions: checkAssumptions(check), caution: CAUTION, date: '2026-03-01', generator: 'pmchart test' });
    const mark = page.data.loadMarks![0]!;
    const { domainM, domainP } = page.template.overlay!;
    const L = page.template.layout;
    const X = (M: number) => ((M - domainM[0]) / (domainM[1] - domainM[0])) * L.plot.w;
    const Y = (P: number) => ((domainP[1] - P) / (domainP[1] - domainP[0])) * L.plot.h;
    // the ρg curves (labels "ρg 0.0x"), each labelled in the compression zone; the nearest label to the load
    // (Pu/Ag = 1.5625 ksi) within a fifth of the plot height of it
    const comp = page.data.curveLabels.filter((l) => /^ρg 0\.\d+$/.test(l.text) && l.P > 0);
    expect(new Set(comp.map((l) => l.text)).size).toBe(check.chart.rhos.length);
    const near = Math.min(...comp.map((l) => Math.abs(Y(l.P) - Y(mark.P))));
    expect(near).toBeLessThan(0.2 * L.plot.h);
    // no label box over the load's mark (its ring, 0.9 type units across)
    for (const l of comp) {
      const [x0, y0, w, h] = /^M(-?[\d.]+),(-?[\d.]+)h(-?[\d.]+)v(-?[\d.]+)/.exec(l.knock!)!.slice(1).map(Number) as [number, number, number, number];
      const dx = X(mark.M) - X(l.M);
      const dy = Y(mark.P) - Y(l.P);
      expect(dx < x0 || dx > x0 + w || dy < y0 || dy > y0 + h, l.text).toBe(true);
    }
  });

  it('writes SVG with one mark per load, one governing diamond, the id labels and the contour of the governing load', async () => {
    const loads = join(dir, 'loads.csv');
    writeFileSync(loads, 'id,Pu,Mu,Muy\nG1-gravity,900,300,80\nW2-wind,700,600,150\nU3-uplift,-60,200,20\n');
    const file = join(dir, 'three.svg');
    await runCheckAsync({ ...hand, pu: undefined, mu: undefined, loads, rho: '0.03', proposals: '0', report: file });
    const svg = readFileSync(file, 'utf8');
    expect(count(markGroup(svg, 'load_marks_marks'), /<path /g)).toBe(2);
    expect(count(markGroup(svg, 'load_governing_marks'), /<path /g)).toBe(1);
    for (const id of ['G1-gravity', 'W2-wind', 'U3-uplift']) expect(svg).toContain(`>${id}</text>`);
    // the governing label is in the governing layer
    const gov = JSON.parse(runCheck({ ...hand, pu: undefined, mu: undefined, loads, rho: '0.03', proposals: '0', json: true })).governing;
    expect(markGroup(svg, 'load_governing_label_marks')).toContain(`>${gov}</text>`);
    // biaxial results bring the Mx–My contour inset: one closed path
    expect(svg).toContain('Mx–My contour at Pu of');
    expect(count(markGroup(svg, 'contour_marks'), /aria-roledescription="line mark" d="M/g)).toBe(1);
    expect(svg).toContain('Biaxial bending');
    expect(svg).toContain('qualified engineers');
    const again = join(dir, 'three-again.svg');
    await runCheckAsync({ ...hand, pu: undefined, mu: undefined, loads, rho: '0.03', proposals: '0', report: again });
    expect(readFileSync(again, 'utf8')).toBe(svg);
  });
});

describe('bad report input', () => {
  it('runCheck refuses drawn formats (they are asynchronous) and unknown extensions, naming --report', () => {
    expect(() => runCheck({ ...hand, report: join(dir, 'x.pdf') })).toThrow(/--report/);
    expect(() => runCheck({ ...hand, report: join(dir, 'x.docx') })).toThrow(/--report/);
  });

  it('exits 2 with one line and leaves no file for a bad extension or date', async () => {
    const args = ['check', '--fc', '4', '--fy', '60', '--b', '24', '--h', '24', '--gamma', '0.8', '--pu', '900', '--mu', '600'];
    const bad = join(dir, 'bad.docx');
    const r = await cli([...args, '--report', bad]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/^pmchart: --report: .*bad\.docx has an unknown extension/);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(existsSync(bad)).toBe(false);
    const pdf = join(dir, 'bad-date.pdf');
    const d = await cli([...args, '--report', pdf, '--date', '2026-13-45']);
    expect(d.status).toBe(2);
    expect(d.stderr).toMatch(/^pmchart: --date/);
    expect(existsSync(pdf)).toBe(false);
  });

  it('writes a PDF report through the CLI, exit 0', async () => {
    const out = join(dir, 'bin.pdf');
    const r = await cli(['check', '--fc', '4', '--fy', '60', '--b', '24', '--h', '24', '--gamma', '0.8', '--pu', '900', '--mu', '600', '--report', out, '--date', '2026-03-01']);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(readFileSync(out).subarray(0, 5).toString()).toBe('%PDF-');
  });
});

describe('contour --out FILE.svg|pdf', () => {
  const flags = { fc: '4', fy: '60', b: '20', h: '20', arrangement: 'four-faces', barsPerFace: '4', gamma: '0.75', rho: '0.02', pu: '300', mu: '150', muy: '90', date: '2026-03-01' };

  it('draws one path for the contour, the load point, axis titles with units, and the caution', async () => {
    const file = join(dir, 'c.svg');
    await runContourPlot({ ...flags, out: file });
    const svg = readFileSync(file, 'utf8');
    expect(count(markGroup(svg, 'contour_marks'), /aria-roledescription="line mark" d="M/g)).toBe(1);
    expect(count(markGroup(svg, 'contour_governing_marks'), /<path /g)).toBe(1);
    expect(svg).toContain('Mx = φMn about x, bends the depth h   (kip-ft)');
    expect(svg).toContain('My = φMn about y, bends the width b   (kip-ft)');
    expect(svg).toContain('qualified engineers');
    expect(svg).toContain('Mx–My contour at Pu = 300 kip');
  });

  it('plots the contour the CSV gives: θ = 0 is the uniaxial Mx, and θ = 90° gives the same My (square, four faces, first principles)', async () => {
    const rows = runContour({ ...flags, points: '8' }).trim().split('\n').slice(1).map((l) => l.split(',').map(Number));
    const { resolveSectionFlags } = await import('../../src/cli/section-flags.js');
    const { actualBars, biaxialSectionOf } = await import('../../src/cli/actual-bars.js');
    const { contourPlot } = await import('../../src/chart/contour-plot.js');
    const section = resolveSectionFlags(flags, true);
    const sec = biaxialSectionOf(section, actualBars(section, flags.rho).bars);
    const plot = contourPlot(sec, 300, [], 'us', { page: { w: 400, h: 400 }, plot: { x: 40, y: 10, w: 340, h: 340 }, u: 5 }, 8);
    expectClose(plot.contour[0]!.Mx, rows[0]![5]!, 1e-6); // the CSV keeps seven digits
    expectClose(plot.contour[2]!.My, plot.contour[0]!.Mx, 1e-6);
    expect(plot.contour.at(-1)).toMatchObject({ Mx: plot.contour[0]!.Mx, My: plot.contour[0]!.My }); // closed
    expect(plot.extent).toBeGreaterThan(Math.abs(plot.contour[0]!.Mx));
  });

  it('prints the exact moment utilisation at Pu that check reports for the same load', async () => {
    const file = join(dir, 'cu.pdf');
    await runContourPlot({ ...flags, out: file });
    const chk = JSON.parse(runCheck({ fc: '4', fy: '60', b: '20', h: '20', arrangement: 'four-faces', barsPerFace: '4', gamma: '0.75', rho: '0.02', pu: '300', mu: '150', muy: '90', proposals: '0', json: true }));
    const mu = chk.results[0].biaxial.details.exact.momentUtilisationAtPu as number;
    expect(pdftotext(file)).toContain(`Moment utilisation at Pu (exact): ${Number(mu.toPrecision(3))}`);
  });

  it('writes a one-page PDF with identical bytes on a rerun, and refuses other extensions', async () => {
    const a = join(dir, 'c1.pdf');
    const b = join(dir, 'c2.pdf');
    await runContourPlot({ ...flags, out: a });
    await runContourPlot({ ...flags, out: b });
    expect(Buffer.compare(readFileSync(a), readFileSync(b))).toBe(0);
    expect((await PDFDocument.load(readFileSync(a))).getPageCount()).toBe(1);
    expect(pdftotext(a)).toContain('Moment utilisation at Pu (exact)');
    await expect(runContourPlot({ ...flags, out: join(dir, 'c.png') })).rejects.toThrow(/--out/);
    expect(() => runContour({ ...flags, out: join(dir, 'c3.svg') })).toThrow(/--out/);
  });
});

describe('check --report notes', () => {
  it('says on the drawn report, as in the text table, when EN 1992-1-1 6.1(4) raises the moment (e0 = max(h/30, 20 mm))', async () => {
    // 400 mm column: e0 = max(13.3, 20) = 20 mm, so 2000 kN needs at least 40 kN·m; 10 kN·m is raised
    const file = join(dir, 'en-min-moment.pdf');
    await runCheckAsync({ code: 'en1992-1-1', fc: '30', fy: '500', b: '400', h: '400', gamma: '0.75', arrangement: 'four-faces', barsPerFace: '3', pu: '2000kN', mu: '10kN-m', proposals: '0', report: file });
    // the note column wraps (issue 20: text cells go to more lines, never cut): read the text in reading order
    const plain = spawnSync('pdftotext', [file, '-'], { encoding: 'utf8' }).stdout.replace(/\s+/g, ' ');
    expect(plain).toContain('MEd raised to minimum');
  });
});
