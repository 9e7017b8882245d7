/**
 * The page's biaxial view: a small vega-lite spec of its own (one panel per axial level read, side by side,
 * shared scales) and the rows it draws from a `BiaxialView` of engine.ts. Formatting only: every value drawn
 * is a contour point, capacity or load the engine returned; this file moves them into rows and picks
 * colours and words. Plain JSON, no expressions beyond filters, so vega's interpreter runs it under the
 * page's CSP.
 *
 *   BiaxialView ─▶ biaxialRows: contours, ρg labels, loads, the read load's ray, an invisible frame
 *               ─▶ biaxialTemplate: facet by panel (level), layers filtered by row kind
 */
import type { BiaxialContour } from '../analysis/biaxial-family.js';
import { chartConfig, COLOURS, curveColour, FONT_FAMILY, round2 } from '../chart/style.js';
import type { BiaxialView } from './engine.js';

/** Text unit of the panels, px. */
const U = 12;
/** Side of one square panel, px. */
export const BIAXIAL_PANEL = 360;
/** More loads than this: only the read and the governing load are labelled. */
const MAX_LABELS = 12;

export interface BiaxialRow {
  kind: 'contour' | 'label' | 'load' | 'ray' | 'frame';
  /** the panel's heading (one per axial level) */
  panel: string;
  level: number;
  x: number;
  y: number;
  x2?: number;
  y2?: number;
  /** contour: ρg and point order; label: the text */
  rho?: number;
  i?: number;
  colour?: string;
  text?: string;
  /** loads: the governing load, the load whose levels are drawn, drawn last on top */
  governing?: 0 | 1;
  shown?: 0 | 1;
  z?: number;
}

export interface BiaxialWords {
  /** the axial level in the basis's words: "ν" or "P/(f′c·Ag)" */
  levelName: string;
  /** axis titles */
  x: string;
  y: string;
}

const r5 = (x: number): number => Math.round(x * 1e5) / 1e5 + 0;
const fmt = (x: number, d = 3): string => String(Number(x.toPrecision(d)));

/** The heading of a level's panel. */
export const panelTitle = (levelName: string, level: number): string => `${levelName} = ${fmt(level, 4).replace(/^-/, '−')}`;

/** Index of the contour point nearest the direction `deg`. */
function nearest(c: BiaxialContour, deg: number): number {
  let best = 0;
  c.angleDeg.forEach((a, i) => {
    if (Math.abs(a - deg) < Math.abs(c.angleDeg[best]! - deg)) best = i;
  });
  return best;
}

/**
 * The rows of the biaxial panels. `divisor` is 1, or the normalising stress on dimensionless charts.
 * First-quadrant families (doubly symmetric layouts) draw the loads at (|mx|, |my|); four-quadrant
 * families draw them with their signs, as the sheet reading reads them.
 */
export function biaxialRows(v: BiaxialView, words: BiaxialWords, divisor: number): BiaxialRow[] {
  const rows: BiaxialRow[] = [];
  const first = v.family.quadrants === 'first';
  const fold = (x: number) => (first ? Math.abs(x) : x) / divisor;
  const n = v.family.rhos.length;
  let xMax = 0;
  let yMax = 0;
  v.family.levels.forEach((level, li) => {
    const panel = panelTitle(words.levelName, level);
    for (const c of v.family.contours[li]!) {
      if (!c.reachable) continue;
      const k = v.family.rhos.indexOf(c.rho);
      const colour = curveColour(k, n);
      // a closed loop when all four quadrants are drawn
      const idx = first ? c.mx.map((_, i) => i) : [...c.mx.map((_, i) => i), 0];
      idx.forEach((j, i) => {
        const x = c.mx[j]! / divisor;
        const y = c.my[j]! / divisor;
        xMax = Math.max(xMax, Math.abs(x));
        yMax = Math.max(yMax, Math.abs(y));
        rows.push({ kind: 'contour', panel, level, x: r5(x), y: r5(y), rho: c.rho, i, colour });
      });
      // the ρg label just outside the contour's 45° point
      const j = nearest(c, 45);
      rows.push({ kind: 'label', panel, level, x: r5(c.mx[j]! / divisor), y: r5(c.my[j]! / divisor), text: String(c.rho), colour, rho: c.rho });
    }
  });
  const labelled = v.loads.length <= MAX_LABELS;
  const loads = [...v.loads].sort((a, b) => Number(a.id === v.id) - Number(b.id === v.id) || Number(a.governing) - Number(b.governing));
  v.family.levels.forEach((level) => {
    const panel = panelTitle(words.levelName, level);
    loads.forEach((l, z) => {
      const x = fold(l.mx);
      const y = fold(l.my);
      xMax = Math.max(xMax, Math.abs(x));
      yMax = Math.max(yMax, Math.abs(y));
      const shown = l.id === v.id ? 1 : 0;
      // a load read on other levels carries its own level in brackets
      const text = labelled || shown || l.governing ? (shown ? l.id : `${l.id} (${fmt(l.level, 2).replace(/^-/, '−')})`) : '';
      rows.push({ kind: 'load', panel, level, x: r5(x), y: r5(y), text, governing: l.governing ? 1 : 0, shown, z });
      // the moment direction the reading follows, from the origin through the read load
      if (shown) rows.push({ kind: 'ray', panel, level, x: 0, y: 0, x2: r5(x), y2: r5(y) });
    });
  });
  // an invisible frame: shared scales with a margin, the origin in view, symmetric when four quadrants are drawn
  const fx = r5(xMax * 1.06 || 1);
  const fy = r5(yMax * 1.06 || 1);
  for (const level of v.family.levels) {
    const panel = panelTitle(words.levelName, level);
    rows.push({ kind: 'frame', panel, level, x: fx, y: fy }, { kind: 'frame', panel, level, x: first ? 0 : -fx, y: first ? 0 : -fy });
  }
  return rows;
}

/** The biaxial panels' template: depends only on the axis words, so the page compiles it once per basis and units. */
export function biaxialTemplate(words: BiaxialWords): Record<string, unknown> {
  const u = U;
  const axis = { tickCount: 6, labelOverlap: true };
  const x = { field: 'x', type: 'quantitative', title: words.x, scale: { zero: true, nice: true }, axis };
  const y = { field: 'y', type: 'quantitative', title: words.y, scale: { zero: true, nice: true }, axis };
  const only = (kind: BiaxialRow['kind'], extra = '') => [{ filter: `datum.kind === '${kind}'${extra}` }];
  const loadLabel = (name: string, gov: 0 | 1, mark: Record<string, unknown>) => ({
    name,
    transform: only('load', ` && datum.governing === ${gov} && datum.text !== ''`),
    mark: { type: 'text', align: 'left', baseline: 'middle', dx: round2(0.8 * u), dy: round2(-0.6 * u), fontSize: round2((gov ? 0.95 : 0.82) * u), fontWeight: gov ? 'bold' : 'normal', font: FONT_FAMILY, ...mark },
    encoding: { x, y, text: { field: 'text' }, order: { field: 'z' } },
  });
  const curveLabel = (name: string, mark: Record<string, unknown>) => ({
    name,
    transform: only('label'),
    mark: { type: 'text', align: 'left', baseline: 'bottom', dx: round2(0.25 * u), dy: round2(-0.2 * u), fontSize: round2(0.78 * u), font: FONT_FAMILY, ...mark },
    encoding: { x, y, text: { field: 'text' }, ...(mark.stroke ? {} : { color: { field: 'colour', type: 'nominal', scale: null } }) },
  });
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    data: { name: 'biax' },
    config: { ...chartConfig(u), header: { labelFont: FONT_FAMILY, labelFontSize: round2(1.0 * u), labelColor: COLOURS.accent, labelFontWeight: 'bold', labelPadding: round2(0.4 * u) } },
    background: COLOURS.paper,
    padding: { left: 6, right: 12, top: 6, bottom: 6 },
    facet: { column: { field: 'panel', type: 'nominal', title: null, sort: { field: 'level', op: 'min' } } },
    spacing: round2(2.2 * u),
    spec: {
      width: BIAXIAL_PANEL,
      height: BIAXIAL_PANEL,
      layer: [
        { name: 'biax_frame', transform: only('frame'), mark: { type: 'point', opacity: 0 }, encoding: { x, y } },
        // the axes through the origin (one frame row per panel sits at the far corner)
        { name: 'biax_zero_x', transform: only('frame', ' && datum.x > 0'), mark: { type: 'rule', color: COLOURS.faint, strokeWidth: 0.7 }, encoding: { x: { datum: 0, type: 'quantitative' } } },
        { name: 'biax_zero_y', transform: only('frame', ' && datum.x > 0'), mark: { type: 'rule', color: COLOURS.faint, strokeWidth: 0.7 }, encoding: { y: { datum: 0, type: 'quantitative' } } },
        {
          name: 'biax_contours',
          transform: only('contour'),
          mark: { type: 'line', strokeWidth: 1.6, strokeJoin: 'round' },
          encoding: { x, y, detail: { field: 'rho', type: 'nominal' }, order: { field: 'i', type: 'quantitative' }, color: { field: 'colour', type: 'nominal', scale: null } },
        },
        curveLabel('biax_curve_label_halo', { stroke: COLOURS.paper, strokeWidth: 2.6, strokeJoin: 'round' }),
        curveLabel('biax_curve_labels', {}),
        {
          name: 'biax_ray',
          transform: only('ray'),
          mark: { type: 'rule', color: COLOURS.caution, strokeWidth: 0.9, strokeDash: [4, 3] },
          encoding: { x, y, x2: { field: 'x2' }, y2: { field: 'y2' } },
        },
        {
          name: 'biax_loads',
          transform: only('load', ' && datum.governing === 0'),
          mark: { type: 'point', shape: 'circle', filled: true, opacity: 1, size: round2(0.42 * u * u), color: COLOURS.ink, stroke: COLOURS.paper, strokeWidth: 0.5 },
          encoding: { x, y, order: { field: 'z' } },
        },
        {
          name: 'biax_load_read',
          transform: only('load', ' && datum.shown === 1 && datum.governing === 0'),
          mark: { type: 'point', shape: 'circle', filled: false, opacity: 1, size: round2(1.6 * u * u), color: COLOURS.caution, strokeWidth: 1.2 },
          encoding: { x, y },
        },
        {
          name: 'biax_load_governing',
          transform: only('load', ' && datum.governing === 1'),
          mark: { type: 'point', shape: 'diamond', filled: true, opacity: 1, size: round2(1.5 * u * u), color: COLOURS.caution, stroke: COLOURS.paper, strokeWidth: 0.8 },
          encoding: { x, y },
        },
        loadLabel('biax_load_label_halo', 0, { stroke: COLOURS.paper, strokeWidth: 2.6, strokeJoin: 'round' }),
        loadLabel('biax_load_labels', 0, { color: COLOURS.ink }),
        loadLabel('biax_governing_halo', 1, { stroke: COLOURS.paper, strokeWidth: 3, strokeJoin: 'round' }),
        loadLabel('biax_governing_label', 1, { color: COLOURS.caution }),
      ],
    },
  };
}
