/**
 * One chart sheet of a resolved chart set, drawn to SVG, PNG or PDF bytes (the library's single-sheet
 * rendering; `pmchart sheet` writes what this returns). Render modules are imported lazily.
 */
import { computeFamily } from '../analysis/family.js';
import { buildSheet } from '../chart/sheet-data.js';
import type { CapContext } from '../codes/types.js';
import type { ResolvedChartSet } from '../config/types.js';
import { generatorLabel } from '../version.js';
import { buildBiaxialSheet } from '../chart/biaxial-sheet.js';
import { basisForSheet, biaxialFamilyForSheet, SHEET_BASE_POINTS, sheetRhos, sheetShape } from './curves.js';

export type SheetFormat = 'svg' | 'png' | 'pdf';

/** Draws sheet `index` of the set; SVG as text, PNG and PDF as bytes (PDF dates fixed to the set's date). */
export async function renderSheet(set: ResolvedChartSet, index = 0, format: SheetFormat = 'pdf', opts: { capContext?: CapContext } = {}): Promise<string | Uint8Array> {
  const sheet = set.sheets[index];
  if (!sheet) throw new RangeError(`sheet ${index} is not in the set (it has ${set.sheets.length})`);
  const basis = basisForSheet(set, sheet);
  const { SheetRenderer } = await import('../render/renderer.js');
  const renderer = await SheetRenderer.create();
  try {
    const common = { set, sheet, sheetNumber: index + 1, sheetCount: set.sheets.length, generator: generatorLabel(), measureText: renderer.measureText };
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
    return await fixPdfMetadata(pdf.toBuffer(), { title: sheet.title, date: set.titleBlock.date, generator: generatorLabel(), subject: basis.title });
  } finally {
    renderer.finalize();
  }
}
