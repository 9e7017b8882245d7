/**
 * Biaxial sheets as data (src/chart/biaxial-sheet.ts, biaxial-table.ts) and their tables
 * (src/sheet/tables.ts): the CSV interface, the JSON fit values, what a sheet prints (levels, caution,
 * assumptions, title block), the panel grid, and byte-stable output.
 */
import { describe, expect, it } from 'vitest';
import { BIAXIAL_TABLE_COLUMNS, biaxialTable, biaxialTableCsv } from '../../src/chart/biaxial-table.js';
import { buildBiaxialSheet, panelGrid } from '../../src/chart/biaxial-sheet.js';
import { SHEET_CAUTION } from '../../src/chart/sheet-data.js';
import { readChartSet } from '../../src/config/read.js';
import { biaxialFamilyForSheet } from '../../src/sheet/curves.js';
import { biaxialTableJson } from '../../src/sheet/tables.js';
import { expectClose } from '../helpers/tolerance.js';

const setOf = (over: Record<string, unknown> = {}, group: Record<string, unknown> = {}) =>
  readChartSet(
    JSON.stringify({
      name: 'corner',
      titleBlock: { office: 'Halden Reach Engineers (invented)', project: 'Millrace Depot, corner columns (invented)', date: '2026-01-05' },
      units: 'us',
      basis: { code: 'aci318-19' },
      rhoG: [0.01, 0.02, 0.04],
      sheets: [{ fc: 5, fy: 60, gamma: 0.75, arrangement: { kind: 'four-faces', barsPerFace: 3 }, chart: 'biaxial', axialLevels: [0, 0.3, 0.6], ...group }],
      ...over,
    }),
  );

describe('tables/<sheet>.csv of a biaxial sheet', () => {
  const set = setOf();
  const sheet = set.sheets[0]!;
  const family = biaxialFamilyForSheet(set, sheet);
  const csv = biaxialTableCsv(biaxialTable(family, 1));
  const lines = csv.trimEnd().split('\n');
  it('has exactly the interface columns rho_g,axial_level,angle_deg,phiMx_norm,phiMy_norm', () => {
    expect(lines[0]).toBe('rho_g,axial_level,angle_deg,phiMx_norm,phiMy_norm');
    expect([...BIAXIAL_TABLE_COLUMNS]).toEqual(['rho_g', 'axial_level', 'angle_deg', 'phiMx_norm', 'phiMy_norm']);
  });
  it('one row per reachable contour and angle (0–90° in 5° steps: 19 each); ρg 0.01 and 0.02 are above their axial cap at 0.6', () => {
    // φPn,max/(f′c·Ag) = 0.8·0.65·(0.85·(1 − ρg) + ρg·fy/f′c) (ACI 318-19 22.4.2.1, 22.4.2.2): 0.500 at ρg 0.01, 0.558 at 0.02, 0.674 at 0.04
    const reachable = family.contours.flat().filter((c) => c.reachable).length;
    expect(reachable).toBe(7);
    expect(lines.length - 1).toBe(7 * 19);
  });
  it('every value finite; angle_deg is atan2(My, Mx) of the moments (square section: of the normalised columns too)', () => {
    for (const l of lines.slice(1)) {
      const [rho, level, angle, mx, my] = l.split(',').map(Number);
      for (const v of [rho, level, angle, mx, my]) expect(Number.isFinite(v)).toBe(true);
      if (mx! > 1e-9 || my! > 1e-9) expectClose(Math.atan2(my!, mx!) * (180 / Math.PI), angle!, 1e-5, 1e-4);
    }
  });
  it('dimensionless: the same points divided by f′c', () => {
    const d = biaxialTableCsv(biaxialTable(family, 5)).trimEnd().split('\n');
    const [a, b] = [lines[5]!.split(',').map(Number), d[5]!.split(',').map(Number)];
    expectClose(b[3]!, a[3]! / 5, 1e-5);
    expectClose(b[4]!, a[4]! / 5, 1e-5, 1e-9);
  });
});

describe('tables/<sheet>.json of a biaxial sheet', () => {
  const set = setOf();
  const sheet = set.sheets[0]!;
  const family = biaxialFamilyForSheet(set, sheet);
  const doc = JSON.parse(biaxialTableJson(set, sheet, family, biaxialTable(family, 1), 'pmchart 0.1.0'));
  it('carries the sheet parameters, the CSV columns and per ρg and level Mxo, Myo, α and misfit (null beyond reach)', () => {
    expect(doc.sheet).toMatchObject({ chart: 'biaxial', fc: 5, fy: 60, gamma: 0.75, axial_levels: [0, 0.3, 0.6], transverse: 'tied' });
    expect(doc.csvColumns).toEqual([...BIAXIAL_TABLE_COLUMNS]);
    expect(doc.curves).toHaveLength(3);
    const at = (k: number, i: number) => doc.curves[k].levels[i];
    expect(at(0, 2)).toEqual({ axial_level: 0.6, reachable: false, Mxo_norm: null, Myo_norm: null, alpha: null, misfit: null });
    const c = family.contours[2]![0]!;
    expect(at(2, 1).reachable).toBe(true);
    expectClose(at(1, 1).alpha, family.contours[1]![1]!.alpha, 1e-5);
    expect(c.reachable).toBe(false);
    // the square's Mxo and Myo agree (doubly symmetric layout)
    expect(at(2, 1).Mxo_norm).toBe(at(2, 1).Myo_norm);
    expect(JSON.stringify(doc)).not.toMatch(/NaN|Infinity/);
  });
});

describe('buildBiaxialSheet', () => {
  const set = setOf();
  const sheet = set.sheets[0]!;
  const family = biaxialFamilyForSheet(set, sheet);
  const built = buildBiaxialSheet({ set, sheet, family, sheetNumber: 1, sheetCount: 1, generator: 'pmchart 0.1.0' });
  const texts = built.data.texts.map((t) => t.text);
  it('prints each level in its panel, the fit explanation, the caution and the code edition', () => {
    for (const lv of ['0.00', '0.30', '0.60']) expect(texts).toContain(`P/(f′c·Ag) = ${lv}`);
    expect(texts.join(' ')).toContain('Bresler 1960 load contour');
    expect(texts.join(' ')).toContain('ACI 318-19');
    // the caution, wrapped into lines: every word there
    const side = texts.join(' ');
    for (const w of SHEET_CAUTION.split(' ')) expect(side).toContain(w);
    expect(texts.some((t) => t.startsWith('ρg 0.01, 0.02: above the axial cap'))).toBe(true);
  });
  it('draws one line per reachable contour (first quadrant: open), in points inside the panels area', () => {
    const ids = new Set(built.data.curves.map((r) => r.curve));
    expect(ids.size).toBe(7);
    const { w, h } = built.template.layout.plot;
    for (const r of built.data.curves) {
      expect(r.M).toBeGreaterThanOrEqual(0);
      expect(r.M).toBeLessThanOrEqual(w);
      expect(r.P).toBeGreaterThanOrEqual(0);
      expect(r.P).toBeLessThanOrEqual(h);
    }
    expect(built.template.panels).toBe(true);
  });
  it('is deterministic: the same input gives the same data', () => {
    const again = buildBiaxialSheet({ set, sheet, family: biaxialFamilyForSheet(set, sheet), sheetNumber: 1, sheetCount: 1, generator: 'pmchart 0.1.0' });
    expect(JSON.stringify(again.data)).toBe(JSON.stringify(built.data));
  });
  it('the dimensionless set names f′c in the axes', () => {
    const d = setOf({ normalisation: 'dimensionless' });
    const b = buildBiaxialSheet({ set: d, sheet: d.sheets[0]!, family: biaxialFamilyForSheet(d, d.sheets[0]!), sheetNumber: 1, sheetCount: 1, generator: 'pmchart 0.1.0' });
    expect(b.data.texts.map((t) => t.text)).toContain('φMnx / (f′c·Ag·h) →');
  });
});

describe('panelGrid', () => {
  it('picks the grid whose plots are largest: three levels side by side on a wide area, six as 3 × 2', () => {
    expect(panelGrid(3, 800, 400, 8)).toMatchObject({ cols: 3, rows: 1 });
    expect(panelGrid(6, 800, 520, 8)).toMatchObject({ cols: 3, rows: 2 });
    expect(panelGrid(2, 400, 800, 8)).toMatchObject({ cols: 1, rows: 2 });
  });
});

describe('layouts not symmetric about both axes: all four quadrants', () => {
  it('draws closed contours through all four quadrants, axes through the origin, with the level named at the top left', async () => {
    const { biaxialContour, contourAngles } = await import('../../src/analysis/biaxial-family.js');
    const { prepareBiaxial } = await import('../../src/analysis/biaxial.js');
    const set = setOf();
    const sheet = set.sheets[0]!;
    const base = biaxialFamilyForSheet(set, sheet);
    // the square's bars with the top row doubled: symmetric about y only (an invented custom layout)
    const shape = { kind: 'rectangle' as const, b: 1, h: 1 };
    const contours = base.levels.map((level) =>
      base.rhos.map((rho) => {
        const bars = base.bars.map((b) => ({ ...b, area: b.area * rho * (b.y > 0.3 ? 2 : 1) }));
        return biaxialContour(prepareBiaxial(base.basis, shape, bars), level * base.basis.normalisingStress, contourAngles('all', 5), 'design', rho, level);
      }),
    );
    const family = { ...base, quadrants: 'all' as const, contours };
    const built = buildBiaxialSheet({ set, sheet, family, sheetNumber: 1, sheetCount: 1, generator: 'pmchart 0.1.0' });
    const first = built.data.curves.filter((r) => r.curve === 'level-0-rho-2');
    expect(first).toHaveLength(72 + 1);
    expect(first[0]!.M).toBe(first[72]!.M);
    expect(first[0]!.P).toBe(first[72]!.P);
    // the unequal faces show: Mx toward +y (compressing the doubled row) differs from Mx toward −y
    const c = family.contours[0]![2]!;
    const up = c.mx[0]!;
    const down = c.mx[36]!;
    expect(Math.abs(up + down)).toBeGreaterThan(0.01 * Math.abs(up));
    expect(built.data.texts.some((t) => t.text === 'P/(f′c·Ag) = 0.00')).toBe(true);
    const csv = biaxialTableCsv(biaxialTable(family, 1)).trimEnd().split('\n');
    expect(csv.slice(1).some((l) => Number(l.split(',')[3]) < 0 && Number(l.split(',')[4]) < 0)).toBe(true);
  });
});

describe('the panels heading', () => {
  it('keeps the φ of "φ-factored" lower case (Φ is another symbol) and capitalises a word ("Design")', () => {
    const set = setOf();
    const aci = buildBiaxialSheet({ set, sheet: set.sheets[0]!, family: biaxialFamilyForSheet(set, set.sheets[0]!), sheetNumber: 1, sheetCount: 1, generator: 'pmchart 0.1.0' });
    expect(aci.data.texts.map((t) => t.text)).toContain('φ-factored Mx–My contours');
    const en = setOf({ units: 'si', basis: { code: 'en1992-1-1' } }, { fc: 30, fy: 500 });
    const b = buildBiaxialSheet({ set: en, sheet: en.sheets[0]!, family: biaxialFamilyForSheet(en, en.sheets[0]!), sheetNumber: 1, sheetCount: 1, generator: 'pmchart 0.1.0' });
    expect(b.data.texts.map((t) => t.text)).toContain('Design Mx–My contours');
  });
});
