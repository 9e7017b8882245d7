/**
 * pmchart's sheet look, designed for print: one typeface, a cool ink, and a curve palette of our own that
 * alternates two lightness steps (CIE L* about 34 and 56) along a hue sequence (blue, ochre, wine, green,
 * indigo, coral, deep teal, olive), so neighbouring curves differ in grayscale as well as in hue, and every
 * colour used for text is at least 3:1 on white. Line kinds differ by dash and weight, not colour alone:
 * design curves solid and heavy, nominal curves dashed and lighter in weight, strain-state lines
 * dash-dot, the axial-cap line long dashes, e/h rays fine sparse dots (LINE_KINDS).
 */

/** The only typeface on sheets and in books (DejaVu Sans, shipped by the dejavu-fonts-ttf package). */
export const FONT_FAMILY = 'DejaVu Sans';

export const COLOURS = {
  ink: '#1f2a33',
  muted: '#56616b',
  faint: '#9aa6b0',
  rule: '#c9d1d8',
  panel: '#f3f5f7',
  accent: '#3d4f86',
  strain: '#6b4a2e',
  cap: '#1f2a33',
  ray: '#7c8894',
  caution: '#9b2c2c',
  paper: '#ffffff',
} as const;

/** The minor grid's colour: lighter than the major grid (gridColor in chartConfig). */
export const MINOR_GRID = '#eff2f5';

/**
 * Curve colours in order: dark and mid lightness steps alternate (L* 34, 56; ΔL* 22 between neighbours),
 * hues step around the circle so that curves two apart differ in hue too. Lab values chosen for pmchart,
 * converted to sRGB (D65).
 */
export const CURVE_PALETTE = ['#005587', '#b37a3a', '#7f325f', '#509464', '#4e477c', '#cf6859', '#005961', '#838c3b'] as const;

/** Colour of curve k of n: the palette in order (repeating past eight curves, still alternating in lightness). */
export function curveColour(k: number, _n: number): string {
  return CURVE_PALETTE[k % CURVE_PALETTE.length]!;
}

/** Stroke dash and width of each line kind (dash in points, [] solid); told apart without colour. */
export const LINE_KINDS = {
  design: { dash: [] as number[], width: 1.6 },
  nominal: { dash: [4.5, 2.5], width: 1.0 },
  strain: { dash: [8, 2.5, 1.5, 2.5], width: 0.85 },
  cap: { dash: [12, 3], width: 1.1 },
  ray: { dash: [0.9, 3.2], width: 0.8 },
} as const;

/** WCAG 2 relative luminance of a #rrggbb colour. */
export function relativeLuminance(hex: string): number {
  const c = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255).map((v) => (v <= 0.04045 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4));
  return 0.2126 * c[0]! + 0.7152 * c[1]! + 0.0722 * c[2]!;
}

/** WCAG 2 contrast ratio of two colours (1 to 21). */
export function contrastRatio(a: string, b: string): number {
  const [x, y] = [relativeLuminance(a), relativeLuminance(b)].sort((p, q) => q - p);
  return (x! + 0.05) / (y! + 0.05);
}

/** CIE L* of a colour (its grayscale lightness, 0 black to 100 white). */
export function lightness(hex: string): number {
  const Y = relativeLuminance(hex);
  return Y > 0.008856 ? 116 * Math.cbrt(Y) - 16 : 903.3 * Y;
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

/** A text size in points: `em` type units, never under the page's print floor `min` (SheetLayout.minText). */
export const textPt = (em: number, u: number, min = 0): number => round2(Math.max(em * u, min));

/**
 * The smallest text size on a page of w × h points such that text stays at least 5 pt when the page is
 * fitted to Letter or to A4, whichever shrinks it more (offices print books on either): 5 pt divided by
 * that scale, rounded up to 0.05 pt. Tabloid (→ Letter, × 0.647) gives 7.75 pt, A3 (× 0.665) 7.55 pt,
 * Letter and A4 themselves 5.15 and 5.35 pt. The 5 pt floor for printed text is common practice.
 */
export function printFloor(w: number, h: number): number {
  const [pw, ph] = [Math.min(w, h), Math.max(w, h)];
  const fit = (tw: number, th: number) => Math.min(1, tw / pw, th / ph);
  const scale = Math.min(fit(612, 792), fit(595.28, 841.89));
  return Math.ceil((5 / scale) * 20 - 1e-9) / 20;
}

/** The page-level vega-lite config every chart of ours shares (font, plot frame, axes); `u` is the text unit in pt, `min` the print floor. */
export function chartConfig(u: number, min = 0) {
  return {
    font: FONT_FAMILY,
    view: { stroke: COLOURS.faint, strokeWidth: 0.7 },
    axis: {
      labelFont: FONT_FAMILY,
      titleFont: FONT_FAMILY,
      labelFontSize: textPt(0.82, u, min),
      titleFontSize: textPt(0.95, u, min),
      titleFontWeight: 'normal',
      titleColor: COLOURS.ink,
      labelColor: COLOURS.muted,
      gridColor: '#d5dce2',
      gridWidth: 0.55,
      domainColor: COLOURS.faint,
      tickColor: COLOURS.faint,
      titlePadding: round2(0.8 * u),
    },
  };
}

/** A vega-lite layer drawing the `texts` rows of one style, in page points (`scale: null`); sheets, panels and contour plots share it. */
export function textLayer(style: TextStyle, u: number, min = 0) {
  const s = TEXT_STYLES[style];
  return {
    name: `text_${style}`,
    data: { name: 'texts' },
    transform: [{ filter: `datum.style === '${style}'` }],
    mark: { type: 'text', align: s.align, baseline: 'alphabetic', fontSize: textPt(s.size, u, min), fontWeight: s.weight, color: s.colour },
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
