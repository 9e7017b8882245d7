/**
 * Issue 20, items 4, 5, 7 and 8, on what is drawn: title blocks, headers, covers and indexes never cut a value
 * ('…') nor upper-case a symbol (γ → Γ, ρg → ΡG); mixed sets are described per group; the office logo appears in
 * every title block, the cover and the index, as a cleaned SVG in SVG output and a raster in PDF; the calculation
 * sheet keeps every figure and all six slenderness rows. Demo data invented.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildBiaxialSheet } from '../../src/chart/biaxial-sheet.js';
import { buildSheet, type LogoRef, type SheetData } from '../../src/chart/sheet-data.js';
import type { SheetLayout } from '../../src/chart/layout.js';
import { readChartSet } from '../../src/config/read.js';
import type { ResolvedChartSet } from '../../src/config/types.js';
import { computeCheck } from '../../src/cli/check.js';
import { CAUTION } from '../../src/cli/table.js';
import { nodeFileAccess } from '../../src/io/read.js';
import { SheetRenderer } from '../../src/render/renderer.js';
import { checkAssumptions } from '../../src/report/check-view.js';
import { buildCheckReport } from '../../src/sheet/check-report.js';
import { biaxialFamilyForSheet, familyForSheet, groupExtents } from '../../src/sheet/curves.js';
import { logoRef } from '../../src/sheet/logo.js';
import { makeChartSet } from '../../src/sheet/pipeline.js';
import { renderSheet } from '../../src/sheet/render-sheet.js';

// Α … Ω but Σ: none of the trade symbols is a capital (γ, ρ, φ, ε, ν, μ, ω); Σ is the summation sign of the sway
// storey sums (ΣPu, ΣPc: ACI 318-19 6.6.4.6.2(b)), not an upper-cased σ
const UPPER_GREEK = /[\u0391-\u03A2\u03A4-\u03A9]/;
const demo = (file: string, over: (d: any) => void = () => {}): ResolvedChartSet => {
  const d = JSON.parse(readFileSync(join('charts-config', file), 'utf8'));
  over(d);
  return readChartSet(JSON.stringify(d), { files: nodeFileAccess, baseDir: 'charts-config' });
};
const squash = (s: string) => s.replace(/\s+/g, '');

let renderer: SheetRenderer;
beforeAll(async () => {
  renderer = await SheetRenderer.create();
});
afterAll(() => renderer.finalize());

/** Texts of the title block and the header (page regions of the layout; rows hold points from the plot origin). */
function identityTexts(data: SheetData, L: SheetLayout): string[] {
  const inBox = (y: number, b: { y: number; h: number }) => y + L.plot.y >= b.y - 1 && y + L.plot.y <= b.y + b.h + 1;
  return data.texts.filter((t) => inBox(t.y, L.titleBlock) || inBox(t.y, L.header)).map((t) => t.text);
}

describe('title blocks and headers of every demo sheet', () => {
  const cases: [string, string, (d: any) => void][] = [
    ['demo.json', 'its tabloid', () => {}],
    ['demo.json', 'letter portrait (five title-block rows)', (d) => (d.paper = { size: 'letter', orientation: 'portrait' })],
    ['demo-eu.json', 'its A3', () => {}],
    ['demo-au.json', 'A4', (d) => (d.paper = { size: 'a4' })],
  ];
  for (const [file, paper, over] of cases) {
    it(`${file} on ${paper}: no '…', no capital Greek, every title whole, the logo where the set has one`, async () => {
      const set = demo(file, over);
      const ext = groupExtents(set);
      const logo: LogoRef | undefined = set.titleBlock.logo ? await logoRef(set.titleBlock.logo) : undefined;
      for (const sheet of set.sheets) {
        const common = { set, sheet, sheetNumber: sheet.index, sheetCount: set.sheets.length, generator: 'pmchart test', measureText: renderer.measureText, ...(logo ? { logo } : {}) };
        const built = sheet.chart === 'biaxial' ? buildBiaxialSheet({ ...common, family: biaxialFamilyForSheet(set, sheet) }) : buildSheet({ ...common, family: familyForSheet(set, sheet), extent: ext[sheet.origin]! });
        const texts = identityTexts(built.data, built.template.layout);
        for (const t of texts) {
          expect(t, `sheet ${sheet.index}`).not.toContain('…');
          expect(t, `sheet ${sheet.index}`).not.toMatch(UPPER_GREEK);
        }
        // the title (with a biaxial sheet's axial levels) is there whole, in the header and in the title block
        const all = squash(texts.join(''));
        expect(all.split(squash(sheet.title)).length - 1, `sheet ${sheet.index}`).toBeGreaterThanOrEqual(2);
        expect(texts).toEqual(expect.arrayContaining(['office', 'project', 'sheet title']));
        if (logo) {
          expect(built.template.logo).toBeDefined();
          expect(built.data.images).toHaveLength(1);
        } else expect(built.data.images ?? []).toHaveLength(0);
      }
    }, 120_000);
  }
});

describe('the logo in each output', () => {
  it('SVG: an <image> with the cleaned SVG as a data URI (no script, no external reference, not repeated in an aria label)', async () => {
    const set = demo('demo.json');
    const biaxial = set.sheets.find((s) => s.chart === 'biaxial')!;
    const svg = (await renderSheet(set, biaxial.index, 'svg')) as string;
    const images = svg.match(/<image[^>]*>/g) ?? [];
    expect(images).toHaveLength(1);
    expect(images[0]).not.toContain('aria-label');
    const uri = /href="data:image\/svg\+xml;base64,([^"]+)"/.exec(images[0]!)![1]!;
    const logo = Buffer.from(uri, 'base64').toString('utf8');
    expect(logo).toContain('<circle');
    expect(logo).not.toMatch(/<script|\son\w+=/i);
  }, 60_000);
  it('PDF: drawn as an image (the PNG raster) on the sheet', async () => {
    const set = demo('demo.json');
    const pdf = Buffer.from((await renderSheet(set, 1, 'pdf')) as Uint8Array);
    expect(pdf.toString('latin1')).toMatch(/\/Subtype\s*\/Image/);
  }, 60_000);
});

describe('cover and index of a mixed set', () => {
  it('give each group its own values, name each sheet’s differing basis values, carry the logo, and cut nothing', async () => {
    // EN 1992-1-1 3.1.6(1): fcd = αcc·fck/γc; fck 60 MPa, γc 1.5: αcc 1.0 → 40 MPa, αcc 0.85 → 34 MPa
    const set = demo('demo-eu.json', (d) => {
      d.sheets[0].gamma = 0.8;
      d.sheets[0].arrangement = d.sheets[0].arrangement[0];
      d.outputs = { pdf: true, svg: false, png: false, tables: false };
      d.officeFile = 'office-larchmere.json';
      d.name = 'kaiserhafen-mixed-with-a-long-set-name-for-the-index';
    });
    const out = mkdtempSync(join(tmpdir(), 'pmchart-mixed-'));
    const made = await makeChartSet(set, { outDir: out, generator: 'pmchart test', jobs: 1 });
    const text = (first: number, last: number) => spawnSync('pdftotext', ['-f', String(first), '-l', String(last), made.book!, '-'], { encoding: 'utf8' }).stdout;
    const cover = text(1, 1);
    const index = text(2, 2);
    expect(cover.replace(/\s+/g, ' ')).toMatch(/fcd = 40 MPa: sheet 1/);
    expect(cover.replace(/\s+/g, ' ')).toMatch(/fcd = 34 MPa: sheet 2/);
    expect(cover).toContain('differ between sheets');
    expect(index).toContain('basis values');
    expect(index).toMatch(/αcc 0\.85/);
    for (const t of [cover, index]) {
      expect(t).not.toContain('…');
      expect(t).not.toMatch(UPPER_GREEK);
    }
    // every file name whole in the index (it may stand in two lines)
    for (const s of set.sheets) expect(squash(index)).toContain(squash(s.fileStem));
    // the logo on the cover and the index: two page images besides the sheets'
    const images = spawnSync('pdfimages', ['-list', '-f', '1', '-l', '2', made.book!], { encoding: 'utf8' }).stdout;
    expect(images.split('\n').filter((l) => /^\s+[12]\s+\d+\s+image/.test(l))).toHaveLength(2);
  }, 120_000);
});

describe('the calculation sheet', () => {
  const dir = mkdtempSync(join(tmpdir(), 'pmchart-calc-'));
  it('keeps long figures whole and carries mark, people and revision in its title block', () => {
    const loads = join(dir, 'big.csv');
    // invented loads on an invented 900 × 1100 mm column, large enough for five-digit axial loads
    writeFileSync(loads, 'id,Pu,Mu\nULS01-gravity-max-long-combination,13850,1385\nULS02-wind-north,11200,1820\n');
    const { check } = computeCheck({ units: 'si', fc: '40', fy: '500', b: '900', h: '1100', arrangement: 'four-faces', barsPerFace: '6', bar: '32', gamma: '0.8', loads, proposals: '2' });
    const page = buildCheckReport({ check, assumptions: checkAssumptions(check), caution: CAUTION, date: '2026-03-02', generator: 'pmchart test', measureText: renderer.measureText, mark: 'C-14', preparedBy: 'T. Varga', checkedBy: 'M. Oduya', revision: 'B', office: 'Larchmere & Oduya Structural Studio (invented)', project: 'Quarry Lane Market Hall, podium columns (invented)' });
    const texts = page.data.texts.map((t) => t.text);
    for (const t of texts) expect(t).not.toContain('…');
    for (const t of texts) expect(t).not.toMatch(UPPER_GREEK);
    expect(texts).toEqual(expect.arrayContaining(['13850', '1385', '11200', '1820', 'C-14', 'T. Varga · M. Oduya', 'B', 'column mark', 'prepared · checked', 'rev.']));
    expect(page.title).toMatch(/^Column check C-14: /);
  });
  it('draws all six rows of the slenderness table (three loads, two axes: ACI 318-19 6.6.4)', () => {
    const loads = join(dir, 'c7.csv');
    writeFileSync(loads, readFileSync('charts-config/c7-loads.csv'));
    const { check } = computeCheck({ fc: '5', fy: '60', b: '18', h: '22', arrangement: 'four-faces', barsPerFace: '4', bar: '#9', gamma: '0.75', loads, klu: '18ft', kluY: '13ft', betaDns: '0.55', proposals: '0' } as never);
    const page = buildCheckReport({ check, assumptions: checkAssumptions(check), caution: CAUTION, date: '2026-03-01', generator: 'pmchart test', measureText: renderer.measureText });
    const texts = page.data.texts.map((t) => t.text);
    expect(texts.some((t) => t.startsWith('Slenderness: '))).toBe(true);
    expect(texts.filter((t) => t.includes('no room on this sheet'))).toEqual([]);
    // the axis column: one cell per row
    expect(texts.filter((t) => t === 'x' || t === 'y')).toHaveLength(6);
    expect(texts.filter((t) => /more rows/.test(t))).toEqual([]);
    for (const t of texts) expect(t).not.toContain('…');
  });
});
