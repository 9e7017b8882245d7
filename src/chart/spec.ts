/**
 * Sheet → vega-lite spec (plain JSON). The template depends only on TemplateParams; the sheet's
 * content travels in named `datasets`, so a renderer can compile once and swap data per sheet.
 * Decoration layers use `scale: null` so their x/y are points from the plot origin; `autosize: none`
 * and `padding` make the view exactly one page.
 */
import type { SheetData, TemplateParams } from './sheet-data.js';
import { minorValues, tickFormat, tickValues, type SheetAxes } from './axes.js';
import { chartConfig, COLOURS, LINE_KINDS, MINOR_GRID, pageFrame, round2, TEXT_STYLES, textLayer, textPt, type TextStyle } from './style.js';
import { CURVE_LABEL_EM, REF_LABEL_EM } from './sheet-data.js';
import { panelTemplate } from './panel-spec.js';

export type VlSpec = Record<string, unknown>;
export const DATASET_NAMES = ['curves', 'curveLabels', 'refs', 'refLabels', 'frame', 'texts', 'rects', 'rules', 'dots', 'rings'] as const satisfies readonly (keyof SheetData)[];
/** Datasets of report plots (TemplateParams.overlay). */
export const OVERLAY_DATASET_NAMES = ['extraCurves', 'loadMarks', 'loadLabels'] as const satisfies readonly (keyof SheetData)[];

/** The datasets a template reads. */
export function datasetNames(t: TemplateParams): readonly (keyof SheetData)[] {
  const names: (keyof SheetData)[] = t.overlay ? [...DATASET_NAMES, ...OVERLAY_DATASET_NAMES] : [...DATASET_NAMES];
  if (t.logo) names.push('images');
  return names;
}

/**
 * The office logo (TemplateParams.logo): one image mark centred in its title-block box, as large as its
 * aspect allows. Rows carry `url` (SVG output: the cleaned SVG or the PNG as a data URI) and `raster` (a
 * PNG at print resolution, which the canvas outputs draw: src/render/renderer.ts swaps it in).
 */
export function logoLayer(t: TemplateParams): Record<string, unknown>[] {
  if (!t.logo) return [];
  return [
    {
      name: 'logo',
      data: { name: 'images' },
      mark: { type: 'image', width: t.logo.w, height: t.logo.h, align: 'center', baseline: 'middle', aspect: true, aria: false },
      encoding: { x: raw('x'), y: raw('y'), url: { field: 'url', type: 'nominal' }, order: z },
    },
  ];
}

const q = (field: string, title?: string) => ({ field, type: 'quantitative' as const, ...(title !== undefined ? { title } : {}) });
const raw = (field: string) => ({ field, type: 'quantitative' as const, scale: null });
const lit = (field: string) => ({ field, type: 'nominal' as const, scale: null });
/** drawing order within a layer */
const z = { field: 'z', type: 'quantitative' as const };

export function sheetTemplate(t: TemplateParams): VlSpec {
  if (t.panels) return panelTemplate(t);
  const { layout: L } = t;
  const u = L.u;
  const mt = L.minText ?? 0;
  const o = t.overlay;
  const a = t.axes;
  const x = { field: 'M', type: 'quantitative', scale: o ? { domain: o.domainM, nice: false, zero: false } : a ? { domain: a.M.domain, nice: false, zero: false } : { zero: true, nice: true } };
  const y = { field: 'P', type: 'quantitative', scale: o ? { domain: o.domainP, nice: false, zero: false } : a ? { domain: a.P.domain, nice: false, zero: false } : { zero: true, nice: true } };
  const plotLine = (name: string, kind: string, mark: Record<string, unknown>) => ({
    name,
    data: { name: 'refs' },
    transform: [{ filter: `datum.kind === '${kind}'` }],
    mark: { type: 'line', ...mark },
    encoding: { x, y, detail: { field: 'line' }, order: { field: 'i' } },
  });

  const layers: Record<string, unknown>[] = [
    { name: 'frame', data: { name: 'frame' }, mark: { type: 'point', opacity: 0 }, encoding: { x, y } },
    { name: 'rects', data: { name: 'rects' }, mark: { type: 'rect' }, encoding: { x: raw('x'), x2: { field: 'x2' }, y: raw('y'), y2: { field: 'y2' }, fill: lit('fill'), stroke: lit('stroke'), strokeWidth: raw('strokeWidth'), order: z } },
    ...(a && !o ? minorGrid(a) : []),
    plotLine('rays', 'ray', { color: COLOURS.ray, strokeWidth: LINE_KINDS.ray.width, strokeDash: [...LINE_KINDS.ray.dash] }),
    plotLine('zero', 'zero', { color: COLOURS.muted, strokeWidth: 0.8 }),
    plotLine('strain_lines', 'strain', { color: COLOURS.strain, strokeWidth: LINE_KINDS.strain.width, strokeDash: [...LINE_KINDS.strain.dash] }),
    plotLine('cap_line', 'cap', { color: COLOURS.cap, strokeWidth: LINE_KINDS.cap.width, strokeDash: [...LINE_KINDS.cap.dash] }),
  ];
  for (const fam of t.families) {
    const design = fam === 'design';
    const kind = LINE_KINDS[design ? 'design' : 'nominal'];
    layers.push({
      name: `curves_${fam}`,
      data: { name: 'curves' },
      transform: [{ filter: `datum.family === '${fam}'` }],
      mark: { type: 'line', strokeWidth: kind.width, ...(kind.dash.length ? { strokeDash: [...kind.dash] } : {}), strokeJoin: 'round' },
      encoding: { x, y, detail: { field: 'curve' }, order: { field: 'i' }, stroke: lit('colour') },
    });
  }
  // knockouts: a paper box under every plot label, above every line, so no line runs through a label
  const knock = (name: string, data: string) => ({
    name,
    data: { name: data },
    transform: [{ filter: 'datum.knock' }],
    mark: { type: 'point', filled: true, opacity: 1, size: 4, color: COLOURS.paper, strokeWidth: 0 },
    encoding: { x, y, shape: { field: 'knock', type: 'nominal' as const, scale: null }, order: z },
  });
  layers.push(knock('ref_label_knockouts', 'refLabels'), knock('curve_label_knockouts', 'curveLabels'));
  const refLabel = (kind: string, colour: string, dx: number, dy: number) => ({
    name: `labels_${kind}`,
    data: { name: 'refLabels' },
    transform: [{ filter: `datum.kind === '${kind}'` }],
    mark: { type: 'text', align: 'left', baseline: 'middle', dx, dy, fontSize: textPt(REF_LABEL_EM, u, mt), color: colour },
    encoding: { x, y, text: { field: 'text' }, order: z },
  });
  layers.push(
    refLabel('ray', COLOURS.muted, 2, -2),
    refLabel('strain', COLOURS.strain, 0, 0),
    refLabel('cap', COLOURS.cap, 0, 0),
    ...([1, 0] as const).map((b) => ({
      name: b ? 'curve_labels' : 'curve_labels_regular',
      data: { name: 'curveLabels' },
      transform: [{ filter: b ? 'datum.bold !== 0' : 'datum.bold === 0' }],
      mark: { type: 'text', align: 'center', baseline: 'middle', fontSize: textPt(CURVE_LABEL_EM, u, mt), fontWeight: b ? 'bold' : 'normal' },
      encoding: { x, y, text: { field: 'text' }, fill: lit('colour'), order: z },
    })),
    { name: 'rules', data: { name: 'rules' }, mark: { type: 'rule' }, encoding: { x: raw('x'), x2: { field: 'x2' }, y: raw('y'), y2: { field: 'y2' }, stroke: lit('stroke'), strokeWidth: raw('strokeWidth'), order: z } },
    { name: 'rings', data: { name: 'rings' }, mark: { type: 'point', shape: 'circle', filled: false, strokeWidth: 1.1 }, encoding: { x: raw('x'), y: raw('y'), size: raw('size'), stroke: lit('fill'), order: z } },
    { name: 'dots', data: { name: 'dots' }, mark: { type: 'point', shape: 'circle', filled: true, opacity: 1 }, encoding: { x: raw('x'), y: raw('y'), size: raw('size'), fill: lit('fill'), order: z } },
    ...(Object.keys(TEXT_STYLES) as TextStyle[]).map((s) => textLayer(s, u, mt)),
    ...logoLayer(t),
  );
  if (o) {
    // load lines and marks under the label knockouts, load labels (placed clear of curve labels) on top
    const ov = overlayLayers(x, y, u, o.loadRays !== false);
    const isLabel = (l: Record<string, unknown>) => String(l.name).includes('label');
    layers.splice(layers.findIndex((l) => l.name === 'ref_label_knockouts'), 0, ...ov.filter((l) => !isLabel(l)));
    layers.splice(layers.findIndex((l) => l.name === 'rules'), 0, ...ov.filter(isLabel));
  }

  return {
    ...pageFrame(L),
    config: chartConfig(u, mt),
    encoding: {
      x: { ...x, axis: { title: t.xTitle, orient: 'bottom', ...(a && !o ? { values: tickValues(a.M), format: tickFormat(a.M) } : { tickCount: 12 }) } },
      y: { ...y, axis: { title: t.yTitle, ...(a && !o ? { values: tickValues(a.P), format: tickFormat(a.P) } : { tickCount: 14 }) } },
    },
    layer: layers,
  };
}

/** The minor grid of a chart sheet: fine lines between the major grid lines (axes.ts minorValues), under every mark. */
function minorGrid(a: SheetAxes): Record<string, unknown>[] {
  const mark = { type: 'rule', color: MINOR_GRID, strokeWidth: 0.3 };
  const xs = minorValues(a.M);
  const ys = minorValues(a.P);
  const scale = (d: [number, number]) => ({ domain: d, nice: false, zero: false });
  return [
    ...(xs.length ? [{ name: 'minor_grid_M', data: { values: xs.map((v) => ({ v })) }, mark, encoding: { x: { field: 'v', type: 'quantitative', scale: scale(a.M.domain) } } }] : []),
    ...(ys.length ? [{ name: 'minor_grid_P', data: { values: ys.map((v) => ({ v })) }, mark, encoding: { y: { field: 'v', type: 'quantitative', scale: scale(a.P.domain) } } }] : []),
  ];
}

/** How the report's caption names the load marks (src/sheet/check-report.ts). */
export const LOAD_MARK_WORDS = { mark: 'ringed crosses', governing: 'red ringed cross', ray: 'thin lines from the origin: their load rays' } as const;

/** A plus sign as a vega symbol path (unit size), stroked: the cross inside a load's ring. */
const CROSS = 'M-1,0L1,0M0,-1L0,1';

/**
 * Load marks over the curves: the curve at the governing ρg required (ink, dashed); each load a ringed
 * cross (a ring with a plus sign through its centre: our own mark), the governing load larger and in
 * caution red; optionally each load's ray from the origin; labels with a paper halo.
 */
function overlayLayers(x: object, y: object, u: number, rays: boolean): Record<string, unknown>[] {
  const gov = (v: 0 | 1) => [{ filter: `datum.governing === ${v}` }];
  const label = (name: string, v: 0 | 1, extra: Record<string, unknown>) => ({
    name,
    data: { name: 'loadLabels' },
    transform: gov(v),
    mark: { type: 'text', align: 'left', baseline: 'middle', fontSize: round2((v ? 0.86 : 0.76) * u), fontWeight: v ? 'bold' : 'normal', ...extra },
    encoding: { x: raw('x'), y: raw('y'), text: { field: 'text' }, order: z },
  });
  const ring = (name: string, v: 0 | 1, size: number, colour: string, width: number) => ({
    name,
    data: { name: 'loadMarks' },
    transform: gov(v),
    mark: { type: 'point', shape: 'circle', filled: false, opacity: 1, size: round2(size * u * u), color: colour, strokeWidth: width },
    encoding: { x, y, order: z },
  });
  const cross = (name: string, v: 0 | 1, size: number, colour: string, width: number) => ({
    name,
    data: { name: 'loadMarks' },
    transform: gov(v),
    mark: { type: 'point', shape: CROSS, filled: false, opacity: 1, size: round2(size * u * u), color: colour, strokeWidth: width },
    encoding: { x, y, order: z },
  });
  return [
    {
      name: 'extra_curves',
      data: { name: 'extraCurves' },
      mark: { type: 'line', color: COLOURS.ink, strokeWidth: 1.3, strokeDash: [6, 3], strokeJoin: 'round' },
      encoding: { x, y, detail: { field: 'curve' }, order: { field: 'i' } },
    },
    ...(rays
      ? [
          {
            name: 'load_rays',
            data: { name: 'loadMarks' },
            mark: { type: 'rule', color: COLOURS.muted, strokeWidth: 0.45, opacity: 0.8 },
            encoding: { x: { datum: 0, type: 'quantitative' }, y: { datum: 0, type: 'quantitative' }, x2: { field: 'M' }, y2: { field: 'P' } },
          },
        ]
      : []),
    ring('load_marks', 0, 0.9, COLOURS.ink, 0.9),
    cross('load_marks_cross', 0, 1.6, COLOURS.ink, 0.8),
    ring('load_governing', 1, 2.0, COLOURS.caution, 1.4),
    cross('load_governing_cross', 1, 3.6, COLOURS.caution, 1.1),
    label('load_label_halo', 0, { stroke: COLOURS.paper, strokeWidth: 2.6, strokeJoin: 'round' }),
    label('load_labels', 0, { color: COLOURS.ink }),
    label('load_governing_label_halo', 1, { stroke: COLOURS.paper, strokeWidth: 3, strokeJoin: 'round' }),
    label('load_governing_label', 1, { color: COLOURS.caution }),
  ];
}

/** The full spec of one sheet: the template plus its datasets. */
export function sheetSpec(t: TemplateParams, data: SheetData): VlSpec {
  return { ...sheetTemplate(t), datasets: data };
}

