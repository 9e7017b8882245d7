/**
 * A chart set with a biaxial group end to end (makeChartSet): the files each sheet writes, the tables'
 * interface and the book's page count. Values are checked in tests/analysis/biaxial-family.test.ts.
 */
import { mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { PDFDocument } from 'pdf-lib';
import { makeChartSet } from '../../src/sheet/pipeline.js';
import { referenceSet } from '../helpers/chart-set.js';

describe('makeChartSet with a biaxial group', () => {
  it('writes the P–M sheet and two biaxial sheets (nine levels 0–0.8: 5 + 4) with their tables, SVG, PNG and book pages', async () => {
    const set = referenceSet({
      rhoG: [0.01, 0.03],
      outputs: { pdf: true, svg: true, png: true, pngScale: 0.5, tables: true },
      sheets: [
        { fc: 4, fy: 60, gamma: 0.8, arrangement: { kind: 'two-faces', barsPerFace: 3 } },
        { fc: 4, fy: 60, gamma: 0.8, arrangement: { kind: 'four-faces', barsPerFace: 3 }, chart: 'biaxial', axialLevels: { from: 0, to: 0.8, step: 0.1 } },
      ],
    });
    const out = mkdtempSync(join(tmpdir(), 'pmchart-biaxial-'));
    const made = await makeChartSet(set, { outDir: out, generator: 'pmchart 0.1.0', jobs: 1, onNote: () => {} });
    expect(made.sheets).toBe(3);
    const tables = readdirSync(join(made.dir, 'tables')).sort();
    expect(tables).toEqual([
      '1-square-fc-4ksi-fy-60ksi-gamma-0.80-two-faces-3-per-face-tied.csv',
      '1-square-fc-4ksi-fy-60ksi-gamma-0.80-two-faces-3-per-face-tied.json',
      '2-square-fc-4ksi-fy-60ksi-gamma-0.80-four-faces-3-per-face-tied-biaxial-levels-0-to-0.4.csv',
      '2-square-fc-4ksi-fy-60ksi-gamma-0.80-four-faces-3-per-face-tied-biaxial-levels-0-to-0.4.json',
      '3-square-fc-4ksi-fy-60ksi-gamma-0.80-four-faces-3-per-face-tied-biaxial-levels-0.5-to-0.8.csv',
      '3-square-fc-4ksi-fy-60ksi-gamma-0.80-four-faces-3-per-face-tied-biaxial-levels-0.5-to-0.8.json',
    ]);
    const csv = readFileSync(join(made.dir, 'tables', tables[2]!), 'utf8').trimEnd().split('\n');
    expect(csv[0]).toBe('rho_g,axial_level,angle_deg,phiMx_norm,phiMy_norm');
    // 2 ρg × 5 levels × 19 directions, all below the caps: φPn,max/(f′c·Ag) = 0.8·0.65·(0.85·(1 − ρg) + ρg·fy/f′c)
    // = 0.516 at ρg 0.01 and 0.663 at 0.03 (ACI 318-19 22.4.2.1, 22.4.2.2)
    expect(csv.length - 1).toBe(2 * 5 * 19);
    const json = JSON.parse(readFileSync(join(made.dir, 'tables', tables[5]!), 'utf8'));
    expect(json.sheet.axial_levels).toEqual([0.5, 0.6, 0.7, 0.8]);
    expect(json.curves[0].levels.map((l: { reachable: boolean }) => l.reachable)).toEqual([true, false, false, false]);
    expect(json.curves[1].levels.map((l: { reachable: boolean }) => l.reachable)).toEqual([true, true, false, false]);
    expect(readdirSync(join(made.dir, 'sheets')).filter((f) => f.includes('biaxial'))).toHaveLength(4);
    const svg = readFileSync(join(made.dir, 'sheets', tables[2]!.replace('.csv', '.svg')), 'utf8');
    expect(svg).toContain('P/(f′c·Ag) = 0.40');
    const book = await PDFDocument.load(readFileSync(made.book!));
    expect(book.getPageCount()).toBeGreaterThanOrEqual(3 + 2);
  }, 120_000);
});
