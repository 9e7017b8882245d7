/**
 * The live page's chart spec (pure): the sheet template plus the bracketing-sheet and load layers, the
 * plot-only on-screen layout, and the datasets. The bracketing families are checked against the
 * Po/Ag hand value (ACI 318-19 22.4.2.2: Po = 0.85·f′c·(Ag − Ast) + fy·Ast, worked by hand).
 */
import { compile } from 'vega-lite';
import { describe, expect, it } from 'vitest';
import { computeFamily } from '../../src/analysis/family.js';
import { liveData, liveTemplateParams, pageChartData, pageChartTemplate, SHEET_CURVE_TOLERANCE_PT } from '../../src/chart/page-spec.js';
import { buildSheet } from '../../src/chart/sheet-data.js';
import { sheetShape, familyForSheet, basisForSheet } from '../../src/sheet/curves.js';
import { referenceSet } from '../helpers/chart-set.js';
import { expectClose } from '../helpers/tolerance.js';

const set = referenceSet({ rhoG: [0.02, 0.04] });
const sheet = set.sheets[0]!;
const family = familyForSheet(set, sheet);
const built = buildSheet({ set, sheet, family, sheetNumber: 1, sheetCount: 1, generator: 'pmchart 0.1.0' });
const basis = basisForSheet(set, sheet);
const at = (gamma: number) => ({ gamma, family: computeFamily({ basis, shape: sheetShape(sheet), arrangement: sheet.arrangement, gamma, rhos: [0.02, 0.04] }) });

describe('page chart spec', () => {
  it('puts the bracketing sheets under the exact curves and the loads on top', () => {
    const names = (pageChartTemplate(built.template).layer as { name: string }[]).map((l) => l.name);
    expect(names.indexOf('sheet_curves')).toBeLessThan(names.indexOf('curves_design'));
    expect(names.indexOf('page_load_governing')).toBeGreaterThan(names.indexOf('curves_design'));
    expect(names.at(-1)).toBe('page_load_governing_label');
  });

  it('clips the bracketing families to the plot frame (a lower-γ sheet can reach past the exact family’s axes)', () => {
    const data = pageChartData({ set, built, sheets: [at(0.75), at(0.8)], divisor: 1, loads: [] });
    const vg = compile({ ...pageChartTemplate(built.template), datasets: data } as never).spec as { marks?: { name?: string; clip?: unknown; marks?: unknown[] }[] };
    const all = (ms: { name?: string; type?: string; clip?: unknown; marks?: unknown[] }[] = []): { name?: string; type?: string; clip?: unknown }[] => ms.flatMap((m) => [m, ...all(m.marks as never)]);
    // the lines themselves (vega-lite wraps them in a group per curve, as wide and high as the plot)
    const marks = all(vg.marks).filter((m) => String(m.name).startsWith('sheet_curves') && m.type === 'line');
    expect(marks.length).toBeGreaterThan(0);
    for (const m of marks) expect(m.clip).toBe(true);
  });

  it('shows the plot alone on screen at the sheet’s type size, and keeps the decoration for exports', () => {
    const live = liveTemplateParams(built.template).layout;
    expect(live.u).toBe(built.template.layout.u);
    expect(live.plot.w).toBeGreaterThan(built.template.layout.plot.w);
    expect(live.titleBlock.w).toBe(0);
    const data = pageChartData({ set, built, sheets: [], divisor: 1, loads: [] });
    expect(data.texts.length).toBeGreaterThan(10);
    expect(liveData(data).texts).toEqual([]);
    expect(liveData(data).curves).toBe(data.curves);
  });

  it('draws the bracketing families thinned but through their pure-compression points (Po/Ag hand value)', () => {
    const data = pageChartData({ set, built, sheets: [at(0.75), at(0.8)], divisor: 1, loads: [] });
    const curves = new Set(data.sheetCurves.map((r) => r.curve));
    expect(curves.size).toBe(4);
    expect(data.sheetCurves.length).toBeLessThan(4 * family.curves[0]!.Pn.length);
    // φ·0.80·Po/Ag for ρg 0.04 at f′c 4, fy 60: 0.65·0.80·(0.85·4·0.96 + 60·0.04) = 0.52·5.664 = 2.94528 ksi (ACI 318-19 22.4.2.1–2)
    const top = Math.max(...data.sheetCurves.filter((r) => r.curve.endsWith('ρg 0.04')).map((r) => r.P));
    expectClose(top, 2.94528, 1e-4);
    expect(SHEET_CURVE_TOLERANCE_PT).toBeGreaterThan(0);
  });

  it('grows the frame so a load outside the family stays on the plot; governing load flagged', () => {
    const data = pageChartData({ set, built, sheets: [], divisor: 1, loads: [{ id: 'far', M: 40, P: 9, governing: true }, { id: 'near', M: 0.2, P: 1, governing: false }] });
    expect(Math.max(...data.frame.map((f) => f.M))).toBeGreaterThan(40);
    expect(data.pageLoads.find((l) => l.id === 'far')!.governing).toBe(1);
    expect(data.pageLoads.find((l) => l.id === 'near')!.governing).toBe(0);
  });

  it('names the bracketing sheets in a caption above the plot when asked', () => {
    const data = pageChartData({ set, built, sheets: [], divisor: 1, loads: [], sheetsCaption: 'sheets γ 0.75 and 0.8' });
    const row = data.texts.at(-1)!;
    expect(row.text).toBe('sheets γ 0.75 and 0.8');
    expect(row.y).toBeLessThan(0);
  });
});
