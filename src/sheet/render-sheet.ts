/**
 * One chart sheet of a resolved chart set, drawn to SVG, PNG or PDF bytes (the library's single-sheet
 * rendering; `pmchart sheet` writes what this returns). Render modules are imported lazily.
 */
import { computeFamily } from '../analysis/family.js';
import { buildSheet } from '../chart/sheet-data.js';
import type { CapContext } from '../codes/types.js';
import type { ResolvedChartSet } from '../config/types.js';
import { ERROR_CODES, PmError } from '../errors.js';
import { generatorLabel } from '../version.js';
import { buildBiaxialSheet } from '../chart/biaxial-sheet.js';
import { basisForSheet, biaxialFamilyForSheet, SHEET_BASE_POINTS, sheetRhos, sheetShape } from './curves.js';

export const SHEET_FORMATS = ['svg', 'png', 'pdf'] as const;
export type SheetFormat = (typeof SHEET_FORMATS)[number];

/**
 * Draws sheet number `sheetNumber` of the set, counted from 1 as on the sheet ("sheet 1 of 14") and in
 * `ResolvedSheet.index`; SVG as text, PNG and PDF as bytes (PDF dates fixed to the set's date). Any other
 * number (0, 15 of 14, 1.5, NaN) is a PmError naming `sheet`.
 */
export async function renderSheet(set: ResolvedChartSet, sheetNumber = 1, format: SheetFormat = 'pdf', opts: { capContext?: CapContext } = {}): Promise<string | Uint8Array> {
  const count = set?.sheets?.length ?? 0;
  if (!Number.isInteger(sheetNumber) || sheetNumber < 1 || sheetNumber > count) {
    throw new PmError(ERROR_CODES.outOfRange, 'sheet', `is not a sheet of the set (sheets are numbered 1–${count})`, { value: sheetNumber, allowed: `1–${count}` });
  }
  if (!(SHEET_FORMATS as readonly string[]).includes(format)) throw new PmError(ERROR_CODES.invalidValue, 'format', 'is not one of the allowed values', { value: String(format), allowed: SHEET_FORMATS.join(', ') });
  const index = sheetNumber - 1;
  const sheet = set.sheets[index]!;
  const basis = basisForSheet(set, sheet);
  const { SheetRenderer } = await import('../render/renderer.js');
  const renderer = await SheetRenderer.create();
  try {
    const { logoRef } = await import('./logo.js');
    const logo = set.titleBlock.logo ? await logoRef(set.titleBlock.logo) : undefined;
    const common = { set, sheet, sheetNumber: index + 1, sheetCount: set.sheets.length, generator: generatorLabel(), measureText: renderer.measureText, ...(logo ? { logo } : {}) };
    const built =
      sheet.chart === 'biaxial'
        ? buildBiaxialSheet({ ...common, family: biaxialFamilyForSheet(set, sheet) })
        : buildSheet({
            ...common,
            family: computeFamily({ basis, shape: sheetShape(sheet), arrangement: sheet.arrangement, gamma: sheet.gamma, ...(sheet.gammaB !== undefined ? { gammaX: sheet.gammaB } : {}), rhos: sheetRhos(set, basis), capContext: opts.capContext ?? {}, basePoints: SHEET_BASE_POINTS }),
          });
    const page = { template: built.template, data: built.data };
    if (format === 'svg') return await renderer.svg(page);
    if (format === 'png') return await renderer.png(page, 2);
    const pdf = renderer.pdfPages();
    await pdf.add(page);
    const { fixPdfMetadata } = await import('./book.js');
    return await fixPdfMetadata(pdf, { title: sheet.title, date: set.titleBlock.date, generator: generatorLabel(), subject: basis.title });
  } finally {
    renderer.finalize();
  }
}
