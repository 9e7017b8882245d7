/**
 * `makeChartSet` end to end: book structure (pages, outline, metadata, extractable text via
 * poppler's pdftotext), tables equal to the core's key points, and byte-identical reruns.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { PDFDict, PDFDocument, PDFHexString, PDFName, PDFString, type PDFRef } from 'pdf-lib';
import { beforeAll, describe, expect, it } from 'vitest';
import { makeChartSet } from '../../src/sheet/pipeline.js';
import { familyForSheet } from '../../src/sheet/curves.js';
import { referenceSet } from '../helpers/chart-set.js';

const set = referenceSet({
  rhoG: [0.01, 0.02, 0.04],
  outputs: { pdf: true, svg: true, png: true, pngScale: 0.5, tables: true },
  sheets: [{ fc: 4, fy: 60, gamma: [0.7, 0.8], arrangement: { kind: 'two-faces', barsPerFace: 3 } }, { shape: 'circle', fc: 5, fy: 60, gamma: 0.75, arrangement: { kind: 'ring', bars: 8 }, transverse: 'spiral' }],
});
const generator = 'pmchart 0.1.0';
const tmp = mkdtempSync(join(tmpdir(), 'pmchart-book-'));
const files = (dir: string) => readdirSync(dir, { recursive: true, withFileTypes: true }).filter((e) => e.isFile()).map((e) => join(e.parentPath, e.name).slice(dir.length + 1)).sort();

let dirA = '';
let dirB = '';
beforeAll(async () => {
  dirA = (await makeChartSet(set, { outDir: join(tmp, 'a'), generator, jobs: 1 })).dir;
  dirB = (await makeChartSet(set, { outDir: join(tmp, 'b'), generator, jobs: 1 })).dir;
}, 120_000);

const outlineTitles = (doc: PDFDocument): string[] => {
  const outlines = doc.catalog.lookup(PDFName.of('Outlines'), PDFDict);
  const titles: string[] = [];
  let item = outlines.lookup(PDFName.of('First')) as PDFDict | undefined;
  while (item) {
    const t = item.lookup(PDFName.of('Title')) as PDFHexString | PDFString;
    titles.push(t.decodeText());
    const dest = item.lookup(PDFName.of('Dest')) as unknown as { get(i: number): PDFRef };
    expect(doc.getPages().some((p) => p.ref === dest.get(0))).toBe(true);
    item = item.lookup(PDFName.of('Next')) as PDFDict | undefined;
  }
  return titles;
};

describe('makeChartSet', () => {
  it('writes book.pdf, an SVG and a PNG per sheet, and a CSV and JSON table per sheet', () => {
    const f = files(dirA);
    expect(f).toContain('book.pdf');
    for (const s of set.sheets) {
      for (const p of [`sheets/${s.fileStem}.svg`, `sheets/${s.fileStem}.png`, `tables/${s.fileStem}.csv`, `tables/${s.fileStem}.json`]) expect(f).toContain(p);
    }
    expect(f).toHaveLength(1 + 4 * set.sheets.length);
    expect(readdirSync(join(tmp, 'a'))).toEqual(['reference']); // no staging or chunk files left behind
  });

  it('binds a cover, an index page and one page per sheet, with one outline entry each', async () => {
    const doc = await PDFDocument.load(readFileSync(join(dirA, 'book.pdf')), { updateMetadata: false });
    expect(doc.getPageCount()).toBe(2 + set.sheets.length);
    expect(outlineTitles(doc)).toEqual(['Cover', 'Index of sheets', ...set.sheets.map((s) => `Sheet ${s.index}: ${s.title}`)]);
    expect(doc.getCreationDate()?.toISOString()).toBe('2026-01-05T00:00:00.000Z');
    expect(doc.getModificationDate()?.toISOString()).toBe('2026-01-05T00:00:00.000Z');
    expect(doc.getCreator()).toBe(generator);
    expect(doc.getAuthor()).toBe('Fenwick Hollow Engineers (invented)');
    const [w, h] = [doc.getPage(2).getWidth(), doc.getPage(2).getHeight()];
    expect([w, h]).toEqual([792, 612]); // Letter landscape
  });

  it('has searchable text: axis titles, table values, title block and index (pdftotext)', () => {
    const text = (first: number, last = first) => execFileSync('pdftotext', ['-f', String(first), '-l', String(last), '-layout', join(dirA, 'book.pdf'), '-'], { encoding: 'utf8' });
    const cover = text(1);
    expect(cover).toContain('Test Bay Annex (invented)');
    expect(cover).toContain('qualified engineers');
    const index = text(2);
    set.sheets.forEach((s, i) => {
      expect(index).toContain(s.fileStem);
      expect(index).toMatch(new RegExp(`${s.fileStem}\\s+${3 + i}\\s`));
    });
    const sheet2 = text(4);
    expect(sheet2).toContain('φPn / Ag');
    expect(sheet2).toContain('φMn / (Ag · h)');
    expect(sheet2).toContain('sheet 2 of 3');
    expect(sheet2).toContain('Fenwick Hollow Engineers (invented)');
    expect(sheet2).toContain('ACI 318-19');
    expect(sheet2).toContain('ρg 0.04');
    const family = familyForSheet(set, set.sheets[1]!);
    for (const c of family.curves) expect(sheet2).toContain(c.keyPoints.find((p) => p.id === 'balanced')!.design!.P.toFixed(3));
  });

  it('writes tables equal to the core key points', () => {
    const s = set.sheets[2]!;
    const json = JSON.parse(readFileSync(join(dirA, 'tables', `${s.fileStem}.json`), 'utf8'));
    const family = familyForSheet(set, s);
    expect(json.curves).toHaveLength(family.curves.length);
    family.curves.forEach((c, k) => {
      expect(json.curves[k].rho_g).toBe(c.rho);
      c.keyPoints.forEach((kp, j) => {
        const got = json.curves[k].key_points[j];
        expect(got.id).toBe(kp.id);
        for (const [fam, key, P, M] of [['nominal', 'nominal', 'Pn_norm', 'Mn_norm'], ['design', 'factored', 'phiPn_norm', 'phiMn_norm']] as const) {
          const v = kp[fam];
          if (v === null) expect(got[key]).toBeNull();
          else {
            expect(got[key][P]).toBeCloseTo(v.P, 4);
            expect(got[key][M]).toBeCloseTo(v.M, 4);
            expect(got[key].c_over_h).toBeCloseTo(v.cOverH, 4);
            expect(got[key].phi).toBeCloseTo(v.phi, 4);
          }
        }
      });
    });
    const csv = readFileSync(join(dirA, 'tables', `${s.fileStem}.csv`), 'utf8').trim().split('\n');
    expect(csv[0]).toBe('rho_g,c_over_h,eps_t,phi,Pn_norm,Mn_norm,phiPn_norm,phiMn_norm,point,point_label');
    // one row per key point, two where the nominal and factored curves reach it at different depths
    expect(csv.length - 1).toBeGreaterThanOrEqual(family.curves.length * family.curves[0]!.keyPoints.length);
  });

  it('gives byte-identical SVG, PNG, CSV, JSON and PDF on a second run', () => {
    for (const f of files(dirA)) expect(Buffer.compare(readFileSync(join(dirA, f)), readFileSync(join(dirB, f))), f).toBe(0);
  });

  it('gives the same book from two child processes as from one (fixed chunks)', async () => {
    const small = { ...set, outputs: { ...set.outputs, svg: false, png: false, tables: false } };
    const one = await makeChartSet(small, { outDir: join(tmp, 'c'), generator, jobs: 1, chunkSize: 1 });
    const two = await makeChartSet(small, { outDir: join(tmp, 'd'), generator, jobs: 2, chunkSize: 1 });
    expect(Buffer.compare(readFileSync(one.book!), readFileSync(two.book!))).toBe(0);
  }, 120_000);

  it('reports a failing sheet from a child process as one PmError and leaves no folder behind', async () => {
    const bad = { ...set, outputs: { ...set.outputs, svg: false, png: false }, sheets: set.sheets.map((s, i) => (i === 2 ? { ...s, fc: 100 } : s)) };
    await expect(makeChartSet(bad, { outDir: join(tmp, 'e'), generator, jobs: 2, chunkSize: 1 })).rejects.toThrow(/^sheets\[1\]\.fc: 100 ksi is outside 2\.5–20 ksi$/);
    expect(readdirSync(join(tmp, 'e'))).toEqual([]);
  }, 60_000);

  it('replaces an earlier folder of the same set', async () => {
    writeFileSync(join(dirB, 'stale.txt'), 'old');
    await makeChartSet({ ...set, outputs: { ...set.outputs, png: false, svg: false } }, { outDir: join(tmp, 'b'), generator, jobs: 1 });
    expect(files(dirB)).not.toContain('stale.txt');
    expect(readdirSync(join(tmp, 'b'))).toEqual(['reference']);
  }, 60_000);
});
