/**
 * The PDF writer (src/render/pdf-canvas.ts, pdf-writer.ts) against node-canvas drawing the same
 * scenegraph: a sheet rasterised from our PDF (poppler's pdftoppm, 2 px per pt) and the canvas PNG of the
 * same view (scale 2) agree tile by tile (8 × 8 pt) within a small grey-level tolerance; a sheet with one
 * curve fewer does not. (Today's cairo PDF surface, rasterised the same way, strays further: it dropped
 * the white halos vega strokes behind curve labels.) Also: text stays real text, found once by pdftotext; each face is embedded once however many
 * pages; the page content needs only the fonts' glyphs that were drawn. Pixel tolerances are common
 * practice for comparing two anti-aliasing rasterisers (edges differ by a pixel, areas do not).
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildBiaxialSheet } from '../../src/chart/biaxial-sheet.js';
import { buildSheet } from '../../src/chart/sheet-data.js';
import { readChartSet } from '../../src/config/read.js';
import { FontEngine } from '../../src/render/font-engine.js';
import { num, parseColour, PdfCanvas } from '../../src/render/pdf-canvas.js';
import { SheetRenderer, type SheetPage } from '../../src/render/renderer.js';
import { biaxialFamilyForSheet, familyForSheet } from '../../src/sheet/curves.js';
import { referenceSet } from '../helpers/chart-set.js';

let renderer: SheetRenderer;
let dir: string;
beforeAll(async () => {
  renderer = await SheetRenderer.create();
  dir = mkdtempSync(join(tmpdir(), 'pmchart-writer-'));
});
afterAll(() => {
  renderer.finalize();
  rmSync(dir, { recursive: true, force: true });
});

const uniaxial = (over: Record<string, unknown> = {}): SheetPage => {
  const set = referenceSet({ families: 'both', ...over });
  const sheet = set.sheets[0]!;
  const b = buildSheet({ set, sheet, family: familyForSheet(set, sheet), sheetNumber: 1, sheetCount: 1, generator: 'pmchart 0.1.0', measureText: renderer.measureText });
  return { template: b.template, data: b.data };
};

const biaxial = (): SheetPage => {
  const set = readChartSet(
    JSON.stringify({
      name: 'corner',
      titleBlock: { office: 'Halden Reach Engineers (invented)', project: 'Millrace Depot, corner columns (invented)', date: '2026-01-05' },
      units: 'us',
      basis: { code: 'aci318-19' },
      rhoG: [0.01, 0.02, 0.04],
      sheets: [{ fc: 5, fy: 60, gamma: 0.75, arrangement: { kind: 'four-faces', barsPerFace: 3 }, chart: 'biaxial', axialLevels: [0, 0.2, 0.4] }],
    }),
  );
  const sheet = set.sheets[0]!;
  const b = buildBiaxialSheet({ set, sheet, family: biaxialFamilyForSheet(set, sheet), sheetNumber: 1, sheetCount: 1, generator: 'pmchart 0.1.0', measureText: renderer.measureText });
  return { template: b.template, data: b.data };
};

interface Grey {
  w: number;
  h: number;
  v: Float64Array;
}

/** PNG bytes → grey levels 0–255 over white (ITU-R BT.601 luma weights). */
async function grey(png: Buffer): Promise<Grey> {
  const { createCanvas, loadImage } = await import('canvas');
  const img = await loadImage(png);
  const c = createCanvas(img.width, img.height);
  const g = c.getContext('2d');
  g.fillStyle = '#ffffff';
  g.fillRect(0, 0, img.width, img.height);
  g.drawImage(img, 0, 0);
  const d = g.getImageData(0, 0, img.width, img.height).data;
  const v = new Float64Array(img.width * img.height);
  for (let i = 0; i < v.length; i++) v[i] = 0.299 * d[4 * i]! + 0.587 * d[4 * i + 1]! + 0.114 * d[4 * i + 2]!;
  return { w: img.width, h: img.height, v };
}

/** The largest difference of mean grey over 16 × 16 px tiles, and the mean per-pixel difference. */
function compare(a: Grey, b: Grey): { tile: number; mean: number } {
  // vega's canvas may round the view's height down a pixel; the page is compared where both have one
  expect(Math.abs(a.w - b.w) + Math.abs(a.h - b.h)).toBeLessThanOrEqual(1);
  const W = Math.min(a.w, b.w);
  const H = Math.min(a.h, b.h);
  const T = 16;
  let tile = 0;
  let sum = 0;
  for (let ty = 0; ty < H; ty += T)
    for (let tx = 0; tx < W; tx += T) {
      let da = 0;
      let n = 0;
      for (let y = ty; y < Math.min(H, ty + T); y++)
        for (let x = tx; x < Math.min(W, tx + T); x++) {
          const p = a.v[y * a.w + x]!;
          const q = b.v[y * b.w + x]!;
          da += p - q;
          sum += Math.abs(p - q);
          n++;
        }
      tile = Math.max(tile, Math.abs(da / n));
    }
  return { tile, mean: sum / (W * H) };
}

async function pdfRaster(page: SheetPage, name: string): Promise<{ pdf: string; raster: Grey }> {
  const pdf = renderer.pdfPages();
  await pdf.add(page);
  const file = join(dir, `${name}.pdf`);
  writeFileSync(file, await pdf.toBytes());
  execFileSync('pdftoppm', ['-r', '144', '-png', '-singlefile', file, join(dir, name)]);
  return { pdf: file, raster: await grey(readFileSync(join(dir, `${name}.png`))) };
}

describe('PDF writer against the canvas drawing of the same scenegraph', () => {
  // A ρg curve drawn or not changes tiles along it by tens of grey levels (about 70 here); the two
  // rasterisers' anti-aliased edges differ by about 11 levels over a tile at most, 3 per pixel on average.
  const TILE_TOLERANCE = 16;

  it.each([
    ['uniaxial', uniaxial],
    ['biaxial', biaxial],
  ])('a %s sheet looks the same, tile by tile', async (name, make) => {
    const page = make();
    const { raster } = await pdfRaster(page, name);
    const canvas = await grey(await renderer.png(page, 2));
    const d = compare(raster, canvas);
    expect(d.tile).toBeLessThan(TILE_TOLERANCE);
    expect(d.mean).toBeLessThan(4);
  });

  it('tells a sheet with a curve fewer apart (the comparison can fail)', async () => {
    const { raster } = await pdfRaster(uniaxial(), 'four');
    const fewer = await grey(await renderer.png(uniaxial({ rhoG: [0.01, 0.02, 0.04] }), 2));
    expect(compare(raster, fewer).tile).toBeGreaterThan(3 * TILE_TOLERANCE);
  });

  it('keeps text as text: the title and axis titles are found once by pdftotext', async () => {
    const { pdf } = await pdfRaster(uniaxial(), 'text');
    const text = execFileSync('pdftotext', [pdf, '-'], { encoding: 'utf8' });
    const count = (s: string) => text.split(s).length - 1;
    expect(count('Test Bay Annex (invented)')).toBe(1);
    expect(count('φMn / (Ag · h)')).toBe(1);
    expect(count('qualified engineers')).toBe(1);
    for (const rho of ['ρg 0.01', 'ρg 0.08']) expect(text).toContain(rho);
  });

  it('embeds each face once for a document of many pages (pdffonts)', async () => {
    const pdf = renderer.pdfPages();
    await pdf.add(uniaxial());
    await pdf.add(biaxial());
    await pdf.add(uniaxial({ rhoG: [0.015, 0.03] }));
    const file = join(dir, 'three.pdf');
    writeFileSync(file, await pdf.toBytes());
    const rows = execFileSync('pdffonts', [file], { encoding: 'utf8' }).trim().split('\n').slice(2);
    expect(rows).toHaveLength(2);
    for (const r of rows) expect(r).toMatch(/^[A-Z]{6}\+DejaVuSans(-Bold)?\s+CID TrueType\s+Identity-H\s+yes yes yes/);
  });

  it('draws marks that recur on other pages once, as form XObjects, and the pages still look the same', async () => {
    const pdf = renderer.pdfPages();
    const last = uniaxial({ rhoG: [0.015, 0.03] });
    await pdf.add(uniaxial());
    await pdf.add(last);
    const file = join(dir, 'shared.pdf');
    const bytes = Buffer.from(await pdf.toBytes());
    writeFileSync(file, bytes);
    // title-block frame and labels, notes, caution, axis rules: the same on both sheets
    expect(bytes.toString('latin1').split('/Subtype /Form').length - 1).toBeGreaterThan(3);
    execFileSync('pdftoppm', ['-r', '144', '-png', '-singlefile', '-f', '2', '-l', '2', file, join(dir, 'shared')]);
    const d = compare(await grey(readFileSync(join(dir, 'shared.png'))), await grey(await renderer.png(last, 2)));
    expect(d.tile).toBeLessThan(16);
    expect(execFileSync('pdftotext', ['-f', '2', '-l', '2', file, '-'], { encoding: 'utf8' }).split('qualified engineers').length - 1).toBe(1);
  });
});

describe('image marks (a title-block logo)', () => {
  it('embeds a PNG once however often it is drawn, and rasterises an SVG at 288 dpi (pdfimages)', async () => {
    const { createCanvas } = await import('canvas');
    const c = createCanvas(40, 20);
    const g = c.getContext('2d');
    g.fillStyle = '#2c7a7b';
    g.fillRect(0, 0, 40, 20);
    const png = `data:image/png;base64,${c.toBuffer('image/png').toString('base64')}`;
    const svg = `data:image/svg+xml;base64,${Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" width="40" height="20"><rect width="40" height="20" fill="#b4533a"/></svg>').toString('base64')}`;
    const spec = {
      $schema: 'https://vega.github.io/schema/vega-lite/v5.json',
      width: 200,
      height: 100,
      autosize: 'none',
      data: { values: [{ x: 10, y: 10, u: png }, { x: 10, y: 60, u: png }, { x: 100, y: 30, u: svg }] },
      mark: { type: 'image', width: 80, height: 40, align: 'left', baseline: 'top' },
      encoding: { x: { field: 'x', type: 'quantitative', scale: null }, y: { field: 'y', type: 'quantitative', scale: null }, url: { field: 'u' } },
    };
    const view = await renderer.specView(spec as never);
    const canvas = (await view.toCanvas(2)) as unknown as import('canvas').Canvas;
    view.finalize();
    const pdf = renderer.pdfPages();
    await pdf.addSpec(spec as never, canvas.width / 2, canvas.height / 2);
    const file = join(dir, 'images.pdf');
    writeFileSync(file, await pdf.toBytes());
    const rows = execFileSync('pdfimages', ['-list', file], { encoding: 'utf8' }).trim().split('\n').slice(2).map((r) => r.trim().split(/\s+/));
    // one row per drawing (page num type width height color comp bpc enc interp object …): the PNG twice at
    // its own 40 × 20 px from one object, the SVG at 80 × 40 pt × 4
    expect(rows.map((r) => [r[3], r[4]])).toEqual([
      ['40', '20'],
      ['40', '20'],
      ['320', '160'],
    ]);
    expect(rows[0]![10]).toBe(rows[1]![10]);
    expect(rows[2]![10]).not.toBe(rows[0]![10]);
    // where the canvas draws the logos, the PDF does too (poppler covers an image's partial edge pixels, one
    // pixel more than cairo: up to ~18 levels in a corner tile; a logo missing would differ by ~150)
    execFileSync('pdftoppm', ['-r', '144', '-png', '-singlefile', file, join(dir, 'images')]);
    const d = compare(await grey(readFileSync(join(dir, 'images.png'))), await grey(canvas.toBuffer('image/png')));
    expect(d.tile).toBeLessThan(24);
  });
});

describe('PdfCanvas details', () => {
  it('writes numbers with at most 3 decimals, no exponent and no negative zero', () => {
    expect([num(1 / 3), num(-0.0001), num(1e-9), num(12.5), num(-2.0004)]).toEqual(['0.333', '0', '0', '12.5', '-2']);
  });

  it('reads hex, rgb() and rgba() colours and refuses what it cannot read', () => {
    expect(parseColour('#1f2a33')).toEqual({ r: 0x1f / 255, g: 0x2a / 255, b: 0x33 / 255, a: 1 });
    expect(parseColour('#fff')).toEqual({ r: 1, g: 1, b: 1, a: 1 });
    expect(parseColour('rgba(255, 0, 0, 0.5)')).toEqual({ r: 1, g: 0, b: 0, a: 0.5 });
    expect(parseColour('transparent').a).toBe(0);
    expect(() => parseColour('papayawhip')).toThrow(/colour "papayawhip"/);
  });

  it('centres and right-aligns text by the font engine width', () => {
    const engine = FontEngine.get();
    const c = new PdfCanvas(200, 100);
    c.font = 'bold 10px "DejaVu Sans"';
    c.textAlign = 'right';
    c.fillText('ρg 0.02', 100, 50);
    const w = engine.width('ρg 0.02', 10, true);
    const stream = c.finish().stream;
    // text matrix: glyphs up in a y-down page, origin at x = 100 − w, y = 50
    expect(stream).toContain(`/FB 10 Tf 1 0 0 -1 ${num(100 - w)} 50 Tm`);
  });
});
