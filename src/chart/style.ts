/**
 * pmchart's sheet look: one typeface, a cool ink, a sage-to-deep-blue ramp for the ρg family,
 * warm brick for strain states, violet for the axial cap, pale slate for e/h rays.
 */

/** The only typeface on sheets and in books (DejaVu Sans, shipped by the dejavu-fonts-ttf package). */
export const FONT_FAMILY = 'DejaVu Sans';

export const COLOURS = {
  ink: '#1f2a33',
  muted: '#5f6b76',
  faint: '#9aa6b0',
  rule: '#c9d1d8',
  panel: '#f3f5f7',
  accent: '#2c7a7b',
  strain: '#b4533a',
  cap: '#6e4c9e',
  ray: '#8e9aa6',
  caution: '#9b2c2c',
  paper: '#ffffff',
} as const;

/** Ramp stops for the ρg family, light (small ρg) to dark (large ρg). */
const RAMP: [number, number, number][] = [
  [0x86, 0xb8, 0x9a],
  [0x2f, 0x8a, 0x8f],
  [0x1c, 0x3f, 0x75],
];

/** Colour of curve k of n along the ramp. */
export function curveColour(k: number, n: number): string {
  const t = n <= 1 ? 1 : k / (n - 1);
  const seg = Math.min(RAMP.length - 2, Math.floor(t * (RAMP.length - 1)));
  const u = t * (RAMP.length - 1) - seg;
  const a = RAMP[seg]!;
  const b = RAMP[seg + 1]!;
  const hex = (i: number) => Math.round(a[i]! + (b[i]! - a[i]!) * u).toString(16).padStart(2, '0');
  return `#${hex(0)}${hex(1)}${hex(2)}`;
}

/** Text classes: one vega-lite text layer each (font weight and alignment are mark properties). */
export const TEXT_STYLES = {
  sheetTitle: { size: 2.0, weight: 'bold', align: 'left', colour: COLOURS.ink },
  /** long titles on narrow pages: smaller, then in two lines */
  sheetTitleMid: { size: 1.5, weight: 'bold', align: 'left', colour: COLOURS.ink },
  sheetTitleSmall: { size: 1.15, weight: 'bold', align: 'left', colour: COLOURS.ink },
  headerRight: { size: 1.25, weight: 'normal', align: 'right', colour: COLOURS.muted },
  heading: { size: 1.0, weight: 'bold', align: 'left', colour: COLOURS.accent },
  caption: { size: 0.68, weight: 'normal', align: 'left', colour: COLOURS.muted },
  value: { size: 0.98, weight: 'normal', align: 'left', colour: COLOURS.ink },
  valueBold: { size: 0.98, weight: 'bold', align: 'left', colour: COLOURS.ink },
  /** a title-block value too long for its cell at full size */
  valueSmall: { size: 0.8, weight: 'normal', align: 'left', colour: COLOURS.ink },
  valueBoldSmall: { size: 0.8, weight: 'bold', align: 'left', colour: COLOURS.ink },
  body: { size: 0.8, weight: 'normal', align: 'left', colour: COLOURS.ink },
  /** notes in a crowded side column */
  bodySmall: { size: 0.72, weight: 'normal', align: 'left', colour: COLOURS.ink },
  bodyTiny: { size: 0.64, weight: 'normal', align: 'left', colour: COLOURS.ink },
  caution: { size: 0.86, weight: 'bold', align: 'left', colour: COLOURS.caution },
  cellRight: { size: 0.82, weight: 'normal', align: 'right', colour: COLOURS.ink },
  cellRho: { size: 0.82, weight: 'bold', align: 'left', colour: COLOURS.ink },
  cellHead: { size: 0.74, weight: 'bold', align: 'center', colour: COLOURS.ink },
  cellSub: { size: 0.7, weight: 'normal', align: 'center', colour: COLOURS.muted },
  dim: { size: 0.78, weight: 'normal', align: 'center', colour: COLOURS.muted },
  dimLeft: { size: 0.78, weight: 'normal', align: 'left', colour: COLOURS.muted },
} as const;
export type TextStyle = keyof typeof TEXT_STYLES;

/** Average advance of DejaVu Sans over mixed text, in em (for wrapping and truncation estimates). */
export const AVG_CHAR_EM = 0.56;

/** Rounds page coordinates to 0.01 pt so specs stay small and byte-stable. */
export const round2 = (v: number): number => Math.round(v * 100) / 100;

/** The page-level vega-lite config every chart of ours shares (font, plot frame, axes); `u` is the text unit in pt. */
export function chartConfig(u: number) {
  return {
    font: FONT_FAMILY,
    view: { stroke: COLOURS.faint, strokeWidth: 0.7 },
    axis: {
      labelFont: FONT_FAMILY,
      titleFont: FONT_FAMILY,
      labelFontSize: round2(0.82 * u),
      titleFontSize: round2(0.95 * u),
      titleFontWeight: 'normal',
      titleColor: COLOURS.ink,
      labelColor: COLOURS.muted,
      gridColor: '#e4e9ed',
      gridWidth: 0.5,
      domainColor: COLOURS.faint,
      tickColor: COLOURS.faint,
      titlePadding: round2(0.8 * u),
    },
  };
}

/** A vega-lite layer drawing the `texts` rows of one style, in page points (`scale: null`); sheets, panels and contour plots share it. */
export function textLayer(style: TextStyle, u: number) {
  const s = TEXT_STYLES[style];
  return {
    name: `text_${style}`,
    data: { name: 'texts' },
    transform: [{ filter: `datum.style === '${style}'` }],
    mark: { type: 'text', align: s.align, baseline: 'alphabetic', fontSize: round2(s.size * u), fontWeight: s.weight, color: s.colour },
    encoding: { x: { field: 'x', type: 'quantitative' as const, scale: null }, y: { field: 'y', type: 'quantitative' as const, scale: null }, text: { field: 'text' }, order: { field: 'z', type: 'quantitative' as const } },
  };
}

/** The top of a sheet's vega-lite spec: the plot area placed on the page by padding, on paper. */
export function pageFrame(L: { plot: { x: number; y: number; w: number; h: number }; page: { w: number; h: number } }) {
  return {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    width: round2(L.plot.w),
    height: round2(L.plot.h),
    autosize: { type: 'none' },
    padding: {
      left: round2(L.plot.x),
      top: round2(L.plot.y),
      right: round2(L.page.w - L.plot.x - L.plot.w),
      bottom: round2(L.page.h - L.plot.y - L.plot.h),
    },
    background: COLOURS.paper,
  };
}
