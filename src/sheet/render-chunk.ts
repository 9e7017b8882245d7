/**
 * Stages "curves → chart spec → bytes → files" for a run of sheets. A chunk's sheets are drawn as PDF
 * page contents (streams and the glyphs they use, src/render/pdf-canvas.ts); the binder writes them in
 * order with the fonts once. Chunks are a fixed size and start from fresh views, so the book's bytes do
 * not depend on how many processes made it.
 */
import { join } from 'node:path';
import type { PageContent } from '../render/pdf-canvas.js';
import { tableCsv } from '../chart/lookup-table.js';
import { buildSheet, primaryFamily, type SheetData, type TemplateParams } from '../chart/sheet-data.js';
import type { ResolvedChartSet } from '../config/types.js';
import type { AxisExtent } from '../chart/axes.js';
import type { SheetRenderer } from '../render/renderer.js';
import { biaxialTableCsv } from '../chart/biaxial-table.js';
import { buildBiaxialSheet } from '../chart/biaxial-sheet.js';
import { biaxialFamilyForSheet, familyForSheet } from './curves.js';
import { writeFileAtomic } from './files.js';
import { logoRef } from './logo.js';
import { biaxialTableJson, tableJson } from './tables.js';

/** Sheets per chunk. */
export const CHUNK_SIZE = 50;

export interface ChunkTask {
  set: ResolvedChartSet;
  chunk: number;
  /** 0-based sheet positions */
  indices: number[];
  /** the set's staging folder */
  staging: string;
  generator: string;
  /** per sheet group (ResolvedSheet.origin): the envelope of its sheets' curves, so the group shares one scale */
  extents?: Record<string, AxisExtent>;
}

export function chunksOf(set: ResolvedChartSet, staging: string, generator: string, size = CHUNK_SIZE, extents?: Record<string, AxisExtent>): ChunkTask[] {
  const tasks: ChunkTask[] = [];
  for (let start = 0, k = 0; start < set.sheets.length; start += size, k++) {
    const indices = Array.from({ length: Math.min(size, set.sheets.length - start) }, (_, i) => start + i);
    tasks.push({ set, chunk: k, indices, staging, generator, ...(extents ? { extents } : {}) });
  }
  return tasks;
}

/** Renders one chunk; returns its PDF pages (when the set asks for a book). */
export async function renderChunk(task: ChunkTask, renderer: SheetRenderer, onSheet?: () => void): Promise<PageContent[] | undefined> {
  const { set, staging, generator } = task;
  const out = set.outputs;
  // Every chunk starts from fresh vega views. A reused view keeps the scene items of earlier sheets
  // (axis ticks and grid lines enter and exit), so its draw order, and with it the PDF content
  // stream, depended on which sheets the process had drawn before: --jobs changed the bytes.
  renderer.finalize();
  const pdf = out.pdf ? renderer.pdfPages() : undefined;
  const logo = set.titleBlock.logo ? await logoRef(set.titleBlock.logo) : undefined;
  for (const i of task.indices) {
    // a render process whose parent has gone stops between sheets (worker.ts exits on disconnect)
    if (process.send !== undefined && !process.connected) throw new Error('the parent process has gone');
    const sheet = set.sheets[i]!;
    const extent = task.extents?.[sheet.origin];
    const common = { set, sheet, sheetNumber: i + 1, sheetCount: set.sheets.length, generator, measureText: renderer.measureText, ...(extent ? { extent } : {}), ...(logo ? { logo } : {}) };
    let built: { template: TemplateParams; data: SheetData };
    if (sheet.chart === 'biaxial') {
      const family = biaxialFamilyForSheet(set, sheet);
      const b = buildBiaxialSheet({ ...common, family });
      if (out.tables) {
        writeFileAtomic(join(staging, 'tables', `${sheet.fileStem}.csv`), biaxialTableCsv(b.table));
        writeFileAtomic(join(staging, 'tables', `${sheet.fileStem}.json`), biaxialTableJson(set, sheet, family, b.table, generator));
      }
      built = b;
    } else {
      const family = familyForSheet(set, sheet);
      const b = buildSheet({ ...common, family });
      if (out.tables) {
        writeFileAtomic(join(staging, 'tables', `${sheet.fileStem}.csv`), tableCsv(b.table));
        writeFileAtomic(join(staging, 'tables', `${sheet.fileStem}.json`), tableJson(set, sheet, family.basis, b.table, primaryFamily(set), generator));
      }
      built = b;
    }
    const page = { template: built.template, data: built.data };
    if (out.svg) writeFileAtomic(join(staging, 'sheets', `${sheet.fileStem}.svg`), await renderer.svg(page));
    if (out.png) writeFileAtomic(join(staging, 'sheets', `${sheet.fileStem}.png`), await renderer.png(page, out.pngScale));
    if (pdf) await pdf.add(page);
    onSheet?.();
  }
  return pdf?.pages();
}
