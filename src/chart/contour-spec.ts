/**
 * The factored Mx–My contour of an actual section at one axial load → vega-lite spec (plain JSON).
 * Equal scales on both axes (a square plot over the same domain), so the contour's shape reads true.
 * Used standalone (`pmchart contour --out FILE.svg|pdf`, with page text) and as an inset of the check report.
 */
import type { Box } from './layout.js';
import type { TextRow } from './sheet-data.js';
import type { VlSpec } from './spec.js';
import { chartConfig, COLOURS, round2, textLayer, type TextStyle } from './style.js';

export interface ContourPoint { i: number; Mx: number; My: number }
export interface ContourLoad { id: string; Mx: number; My: number; governing: 0 | 1 }

export interface ContourPlot {
  page: { w: number; h: number };
  /** the square plot area in points from the page's top-left corner */
  plot: Box;
  /** type unit (TEXT_STYLES sizes are multiples of it) */
  u: number;
  /** half-width of the square domain, display moment units */
  extent: number;
  xTitle: string;
  yTitle: string;
  contour: ContourPoint[];
  loads: ContourLoad[];
  /** page text in points from the plot origin (standalone pages) */
  texts: TextRow[];
}

const r2 = round2;
const r5 = (v: number) => Math.round(v * 1e5) / 1e5 + 0;

/** A round half-width above `max`: 1, 2, 2.5 or 5 × 10^k, so the ticks land on round moments. */
export function contourExtent(max: number): number {
  if (!(max > 0)) return 1;
  const target = max * 1.08;
  const p = 10 ** Math.floor(Math.log10(target));
  for (const k of [1, 1.2, 1.5, 2, 2.5, 3, 4, 5, 6, 8, 10]) if (k * p >= target) return k * p;
  return 10 * p;
}

export function contourSpec(c: ContourPlot): VlSpec {
  const u = c.u;
  const dom = [-c.extent, c.extent];
  const x = { field: 'Mx', type: 'quantitative', scale: { domain: dom, nice: false, zero: false } };
  const y = { field: 'My', type: 'quantitative', scale: { domain: dom, nice: false, zero: false } };
  const gov = (v: 0 | 1) => [{ filter: `datum.governing === ${v}` }];
  const styles = [...new Set(c.texts.map((t) => t.style))].sort() as TextStyle[];
  const label = (name: string, v: 0 | 1, extra: Record<string, unknown>) => ({
    name,
    data: { name: 'loads' },
    transform: gov(v),
    mark: { type: 'text', align: 'left', baseline: 'middle', dx: 6, dy: -6, fontSize: r2((v ? 0.9 : 0.8) * u), fontWeight: v ? 'bold' : 'normal', ...extra },
    encoding: { x, y, text: { field: 'id' } },
  });
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    width: r2(c.plot.w),
    height: r2(c.plot.h),
    autosize: { type: 'none' },
    padding: { left: r2(c.plot.x), top: r2(c.plot.y), right: r2(c.page.w - c.plot.x - c.plot.w), bottom: r2(c.page.h - c.plot.y - c.plot.h) },
    background: COLOURS.paper,
    config: chartConfig(u),
    encoding: {
      x: { ...x, axis: { title: c.xTitle, tickCount: 8 } },
      y: { ...y, axis: { title: c.yTitle, tickCount: 8 } },
    },
    datasets: {
      axes: [
        { a: 'x', i: 0, Mx: -c.extent, My: 0 },
        { a: 'x', i: 1, Mx: c.extent, My: 0 },
        { a: 'y', i: 0, Mx: 0, My: -c.extent },
        { a: 'y', i: 1, Mx: 0, My: c.extent },
      ],
      contour: c.contour.map((p) => ({ i: p.i, Mx: r5(p.Mx), My: r5(p.My) })),
      loads: c.loads.map((l) => ({ ...l, Mx: r5(l.Mx), My: r5(l.My) })),
      texts: c.texts,
    },
    layer: [
      { name: 'zero_axes', data: { name: 'axes' }, mark: { type: 'line', color: COLOURS.muted, strokeWidth: 0.7 }, encoding: { x, y, detail: { field: 'a' }, order: { field: 'i' } } },
      {
        name: 'contour',
        data: { name: 'contour' },
        mark: { type: 'line', color: COLOURS.accent, strokeWidth: 1.6, strokeJoin: 'round' },
        encoding: { x, y, order: { field: 'i' } },
      },
      {
        name: 'contour_loads',
        data: { name: 'loads' },
        transform: gov(0),
        mark: { type: 'point', shape: 'circle', filled: true, opacity: 1, size: r2(0.5 * u * u), color: COLOURS.ink, stroke: COLOURS.paper, strokeWidth: 0.5 },
        encoding: { x, y },
      },
      {
        name: 'contour_governing',
        data: { name: 'loads' },
        transform: gov(1),
        mark: { type: 'point', shape: 'diamond', filled: true, opacity: 1, size: r2(1.6 * u * u), color: COLOURS.caution, stroke: COLOURS.paper, strokeWidth: 0.8 },
        encoding: { x, y },
      },
      label('contour_label_halo', 0, { stroke: COLOURS.paper, strokeWidth: 2.6, strokeJoin: 'round' }),
      label('contour_labels', 0, { color: COLOURS.ink }),
      label('contour_governing_halo', 1, { stroke: COLOURS.paper, strokeWidth: 3, strokeJoin: 'round' }),
      label('contour_governing_label', 1, { color: COLOURS.caution }),
      ...styles.map((s) => textLayer(s, u)),
    ],
  };
}
