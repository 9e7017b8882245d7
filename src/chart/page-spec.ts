/**
 * The live page's chart: the sheet template (spec.ts) and the sheet's own datasets, plus two things a
 * printed sheet does not carry — faint families of the printed sheets that bracket γ ("between sheets")
 * and the loads as marks. The template depends only on set-wide choices, so the page compiles it once
 * and swaps datasets on every input change. Plain JSON, like every spec here.
 */
import type { CurveFamily } from '../analysis/family.js';
import { fmt } from '../config/describe.js';
import type { ResolvedChartSet } from '../config/types.js';
import type { FamilyKind } from './lookup-table.js';
import { primaryFamily, SIMPLIFY_TOLERANCE_PT, type BuiltSheet, type SheetData, type TemplateParams } from './sheet-data.js';
import { simplifyIndices } from './simplify.js';
import { sheetTemplate, type VlSpec } from './spec.js';
import { COLOURS, round2 } from './style.js';

/** A curve of a bracketing print sheet, chart units. */
export interface SheetCurveRow {
  curve: string;
  i: number;
  M: number;
  P: number;
}

/** A load in chart units. */
export interface PageLoad {
  id: string;
  M: number;
  P: number;
  governing: boolean;
}

export interface PageLoadRow {
  id: string;
  M: number;
  P: number;
  governing: 0 | 1;
  z: number;
}

export interface PageChartInput {
  set: Pick<ResolvedChartSet, 'families'>;
  built: BuiltSheet;
  /** families of the bracketing print sheets, drawn faint under the exact family */
  sheets: readonly { gamma: number; family: CurveFamily }[];
  /** chart value × divisor = stress (the normalising stress on dimensionless charts, else 1) */
  divisor: number;
  loads: readonly PageLoad[];
  /** a line naming the bracketing sheets, set just above the plot of the whole sheet (exports) */
  sheetsCaption?: string;
}

export type PageChartData = SheetData & { sheetCurves: SheetCurveRow[]; pageLoads: PageLoadRow[] };

const r5 = (x: number): number => Math.round(x * 1e5) / 1e5 + 0;

/**
 * Drawing tolerance of the faint bracketing families, in sheet points: coarser than the exact family's
 * (a wide pale line hides it), and every point saved is one less for vega's expression interpreter.
 */
export const SHEET_CURVE_TOLERANCE_PT = 4 * SIMPLIFY_TOLERANCE_PT;

/** The page template: the sheet template with the bracketing-sheet and load layers; no datasets. */
export function pageChartTemplate(t: TemplateParams): VlSpec {
  const spec = sheetTemplate(t);
  const u = t.layout.u;
  const layers = spec.layer as Record<string, unknown>[];
  const x = { field: 'M', type: 'quantitative' };
  const y = { field: 'P', type: 'quantitative' };
  const z = { field: 'z', type: 'quantitative' };
  const gov = (v: 0 | 1) => [{ filter: `datum.governing === ${v}` }];
  layers.splice(layers.findIndex((l) => String(l.name).startsWith('curves_')), 0, {
    name: 'sheet_curves',
    data: { name: 'sheetCurves' },
    // clipped to the plot frame: a bracketing sheet's family can reach past the exact family's axis extents
    mark: { type: 'line', color: COLOURS.faint, strokeWidth: 1.8, opacity: 0.5, strokeJoin: 'round', clip: true },
    encoding: { x, y, detail: { field: 'curve' }, order: { field: 'i' } },
  });
  const label = (name: string, v: 0 | 1, extra: Record<string, unknown>) => ({
    name,
    data: { name: 'pageLoads' },
    transform: gov(v),
    mark: { type: 'text', align: 'left', baseline: 'middle', dx: round2(0.9 * u), dy: round2(-0.6 * u), fontSize: round2((v ? 0.9 : 0.78) * u), fontWeight: v ? 'bold' : 'normal', ...extra },
    encoding: { x, y, text: { field: 'id' }, order: z },
  });
  layers.push(
    {
      name: 'page_loads',
      data: { name: 'pageLoads' },
      transform: gov(0),
      mark: { type: 'point', shape: 'circle', filled: true, opacity: 1, size: round2(0.42 * u * u), color: COLOURS.ink, stroke: COLOURS.paper, strokeWidth: 0.5 },
      encoding: { x, y, order: z },
    },
    {
      name: 'page_load_governing',
      data: { name: 'pageLoads' },
      transform: gov(1),
      mark: { type: 'point', shape: 'diamond', filled: true, opacity: 1, size: round2(1.5 * u * u), color: COLOURS.caution, stroke: COLOURS.paper, strokeWidth: 0.8 },
      encoding: { x, y, order: z },
    },
    label('page_load_label_halo', 0, { stroke: COLOURS.paper, strokeWidth: 2.6, strokeJoin: 'round' }),
    label('page_load_labels', 0, { color: COLOURS.ink }),
    label('page_load_governing_halo', 1, { stroke: COLOURS.paper, strokeWidth: 3, strokeJoin: 'round' }),
    label('page_load_governing_label', 1, { color: COLOURS.caution }),
  );
  return spec;
}

/** The datasets of the page template: the sheet's, the bracketing sheets' curves and the loads. */
export function pageChartData(input: PageChartInput): PageChartData {
  const { built, divisor } = input;
  const fam: FamilyKind = primaryFamily(input.set as ResolvedChartSet);
  const sheetCurves: SheetCurveRow[] = [];
  // thinned as the sheet thins its own curves: within the drawing tolerance at the sheet's scale
  let mMax = 0;
  let pLo = 0;
  let pHi = 0;
  for (const f of built.data.frame) ((mMax = Math.max(mMax, f.M)), (pLo = Math.min(pLo, f.P)), (pHi = Math.max(pHi, f.P)));
  const L = built.template.layout.plot;
  const sx = L.w / (mMax || 1);
  const sy = L.h / (pHi - pLo || 1);
  for (const s of input.sheets) {
    for (const c of s.family.curves) {
      const P = fam === 'design' ? c.phiPn : c.Pn;
      const M = fam === 'design' ? c.phiMn : c.Mn;
      const id = `γ ${fmt(s.gamma)} ρg ${c.rho}`;
      const keep = simplifyIndices(Array.from(M, (v) => (v / divisor) * sx), Array.from(P, (v) => (v / divisor) * sy), SHEET_CURVE_TOLERANCE_PT);
      keep.forEach((i, j) => sheetCurves.push({ curve: id, i: j, M: r5(M[i]! / divisor), P: r5(P[i]! / divisor) }));
    }
  }
  const loads = input.loads.filter((l) => Number.isFinite(l.M) && Number.isFinite(l.P));
  const pageLoads: PageLoadRow[] = [...loads].reverse().map((l, z) => ({ id: l.id, M: r5(l.M), P: r5(l.P), governing: l.governing ? 1 : 0, z }));
  // the invisible frame grows to hold loads outside the family, so every mark stays on the plot
  const frame = [...built.data.frame, ...pageLoads.map((l) => ({ M: r5(l.M * 1.08), P: r5(l.P * 1.04) }))];
  const texts = input.sheetsCaption
    ? [...built.data.texts, { style: 'caption' as const, x: 0, y: round2(-0.5 * built.template.layout.u), text: input.sheetsCaption, z: built.data.texts.length }]
    : built.data.texts;
  return { ...built.data, texts, frame, sheetCurves, pageLoads };
}

/**
 * The on-screen view: the sheet's plot alone, larger and at the sheet's type size, with no title block,
 * lookup table or side panel (the page shows those facts as HTML; exports draw the whole sheet).
 * Redrawing only the plot keeps an input change well under the 50 ms the page aims for.
 */
export function liveTemplateParams(t: TemplateParams): TemplateParams {
  const u = t.layout.u;
  const w = Math.round(t.layout.page.w * 0.78);
  const plot = { x: 7.4 * u, y: 1.6 * u, w: w - 7.4 * u - 2.4 * u, h: 0 };
  plot.h = Math.round(plot.w * 0.6);
  const none = { x: 0, y: 0, w: 0, h: 0 };
  return { ...t, layout: { page: { w, h: plot.y + plot.h + 6.0 * u }, u, plot, header: none, table: none, side: none, titleBlock: none } };
}

/** The on-screen view's datasets: the plot's rows; decoration datasets are empty. */
export function liveData(d: PageChartData): PageChartData {
  return { ...d, texts: [], rects: [], rules: [], dots: [], rings: [] };
}
