import { printFloor } from './style.js';

/** Page regions of a sheet, in PDF points from the page's top-left corner. */
export interface Box {
  x: number;
  y: number;
  w: number;
  h: number;
}

export interface SheetLayout {
  page: { w: number; h: number };
  /** type unit: text sizes in TEXT_STYLES are multiples of it */
  u: number;
  header: Box;
  plot: Box;
  table: Box;
  side: Box;
  titleBlock: Box;
  /** rows of the title block: 3, or 5 on narrow pages */
  titleRows?: number;
  /** the print floor: no text smaller, in points (style.ts printFloor) */
  minText?: number;
}

/**
 * Plot top-left, lookup table under it, a side column (pictogram, basis, notes) on the right,
 * title block across the foot, sheet title across the head. On narrow pages (portrait) the side
 * column stands beside the plot only and the table takes the full width under both; the title block
 * splits its crowded rows (`titleRows` 5 instead of 3).
 */
export function sheetLayout(pageW: number, pageH: number, tableRows: number): SheetLayout {
  const u = Math.min(pageW, pageH) / 100 * 1.0 + 0.8;
  const m = 3.2 * u;
  const narrow = pageW < pageH;
  const header: Box = { x: m, y: m, w: pageW - 2 * m, h: 4.2 * u };
  const titleRows = narrow ? 5 : 3;
  const tbH = titleRows * (narrow ? 3.1 : 3.4) * u; // sheet; materials and people; factors and normalisation
  const titleBlock: Box = { x: m, y: pageH - m - tbH, w: pageW - 2 * m, h: tbH };
  const gap = 2.2 * u;
  const bodyTop = header.y + header.h + gap;
  const bodyBottom = titleBlock.y - gap;
  const tableH = (tableRows + 4.6) * 1.32 * u;
  const sideW = narrow ? Math.max(24 * u, 0.32 * pageW) : Math.max(26 * u, 0.27 * pageW);
  const sideBottom = narrow ? bodyBottom - tableH - gap : bodyBottom;
  const side: Box = { x: pageW - m - sideW, y: bodyTop, w: sideW, h: sideBottom - bodyTop };
  const leftW = side.x - gap - m;
  const table: Box = narrow ? { x: m, y: bodyBottom - tableH, w: pageW - 2 * m, h: tableH } : { x: m, y: bodyBottom - tableH, w: leftW, h: tableH };
  const axisLeft = 6.2 * u;
  const axisBottom = 5.2 * u;
  const plotTop = bodyTop + 1.2 * u;
  const plot: Box = { x: m + axisLeft, y: plotTop, w: leftW - axisLeft - 1.0 * u, h: table.y - gap - axisBottom - plotTop };
  return { page: { w: pageW, h: pageH }, u, header, plot, table, side, titleBlock, titleRows, minText: printFloor(pageW, pageH) };
}
