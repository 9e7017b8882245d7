/** Draws the check report (src/sheet/check-report.ts) and writes it whole: SVG, or PDF with fixed metadata. */
import { extname } from 'node:path';
import { SheetRenderer } from '../render/renderer.js';
import { fixPdfMetadata } from './book.js';
import { buildCheckReport, type CheckReportInput } from './check-report.js';
import { writeFileAtomic } from './files.js';

export async function writeCheckReport(file: string, input: CheckReportInput): Promise<void> {
  const renderer = await SheetRenderer.create();
  try {
    const page = buildCheckReport({ ...input, measureText: renderer.measureText });
    const sheet = { template: page.template, data: page.data };
    if (extname(file).toLowerCase() === '.svg') {
      writeFileAtomic(file, await renderer.svg(sheet, page.insets));
      return;
    }
    const pdf = renderer.pdfPages();
    await pdf.add(sheet, page.insets);
    const b = input.check.basis;
    writeFileAtomic(file, await fixPdfMetadata(pdf, { title: page.title, subject: `Column check, ${b.title}`, date: input.date, generator: input.generator }));
  } finally {
    renderer.finalize();
  }
}
