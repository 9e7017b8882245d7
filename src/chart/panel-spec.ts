/**
 * The vega-lite template of sheets drawn wholly in page points (biaxial sheets' small multiples): every
 * layer uses `scale: null`, so x and y are points from the panels area's origin (`layout.plot`) and one
 * compiled view serves any number of panels. Same datasets as P–M sheets (spec.ts DATASET_NAMES).
 */
import type { TemplateParams } from './sheet-data.js';
import { logoLayer, type VlSpec } from './spec.js';
import { chartConfig, COLOURS, pageFrame, round2, TEXT_STYLES, textLayer, textPt, type TextStyle } from './style.js';

/** Font size of the contour labels on biaxial panels, in type units (biaxial-sheet.ts measures with it). */
export const PANEL_LABEL_EM = 0.72;

const raw = (field: string) => ({ field, type: 'quantitative' as const, scale: null });
const lit = (field: string) => ({ field, type: 'nominal' as const, scale: null });
const z = { field: 'z', type: 'quantitative' as const };

export function panelTemplate(t: TemplateParams): VlSpec {
  const L = t.layout;
  const u = L.u;
  const labelMark = { type: 'text', align: 'center', baseline: 'middle', fontSize: textPt(PANEL_LABEL_EM, u, L.minText ?? 0), fontWeight: 'bold' };
  return {
    ...pageFrame(L),
    config: { ...chartConfig(u, L.minText ?? 0), view: { stroke: null } },
    layer: [
      { name: 'rects', data: { name: 'rects' }, mark: { type: 'rect' }, encoding: { x: raw('x'), x2: { field: 'x2' }, y: raw('y'), y2: { field: 'y2' }, fill: lit('fill'), stroke: lit('stroke'), strokeWidth: raw('strokeWidth'), order: z } },
      { name: 'rules', data: { name: 'rules' }, mark: { type: 'rule' }, encoding: { x: raw('x'), x2: { field: 'x2' }, y: raw('y'), y2: { field: 'y2' }, stroke: lit('stroke'), strokeWidth: raw('strokeWidth'), order: z } },
      {
        name: 'contours',
        data: { name: 'curves' },
        mark: { type: 'line', strokeWidth: 1.4, strokeJoin: 'round' },
        encoding: { x: raw('M'), y: raw('P'), detail: { field: 'curve' }, order: { field: 'i' }, stroke: lit('colour') },
      },
      { name: 'contour_label_halo', data: { name: 'curveLabels' }, mark: { ...labelMark, stroke: COLOURS.paper, strokeWidth: 2.6, strokeJoin: 'round' }, encoding: { x: raw('M'), y: raw('P'), text: { field: 'text' }, order: z } },
      { name: 'contour_labels', data: { name: 'curveLabels' }, mark: labelMark, encoding: { x: raw('M'), y: raw('P'), text: { field: 'text' }, fill: lit('colour'), order: z } },
      { name: 'rings', data: { name: 'rings' }, mark: { type: 'point', shape: 'circle', filled: false, strokeWidth: 1.1 }, encoding: { x: raw('x'), y: raw('y'), size: raw('size'), stroke: lit('fill'), order: z } },
      { name: 'dots', data: { name: 'dots' }, mark: { type: 'point', shape: 'circle', filled: true, opacity: 1 }, encoding: { x: raw('x'), y: raw('y'), size: raw('size'), fill: lit('fill'), order: z } },
      ...(Object.keys(TEXT_STYLES) as TextStyle[]).map((s) => textLayer(s, u, L.minText ?? 0)),
      ...logoLayer(t),
    ],
  };
}
