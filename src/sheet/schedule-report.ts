/**
 * `pmchart schedule --report FILE.pdf` (issue 22): a bound report of a column schedule.
 *
 *   marks (each with its check) ──1──▶ each mark's calculation sheet (the check's own, check-report.ts)
 *                               ──2──▶ summary pages (our PDF writer, fonts shared with the sheets): one row per mark with its page
 *                               ──3──▶ one PDF: summary, then the sheets; one bookmark per mark; fixed metadata
 *
 * Every figure is read from the marks' rows and checks (the report computes nothing). The summary page
 * carries the basis editions, the schedule's assumptions and the caution; each sheet carries its own.
 */
import { rgb, type PDFPage, type RGB } from 'pdf-lib';
import { wrap } from '../chart/sheet-data.js';
import { COLOURS } from '../chart/style.js';
import type { ColumnCheck } from '../design/column-check.js';
import { summariseSchedule, type ScheduleRowFacts } from '../design/schedule.js';
import { CAUTION } from '../report/caution.js';
import { checkAssumptions, STATUS_WORDS } from '../report/check-view.js';
import { cell } from '../report/format.js';
import { scheduleAssumptions, type ScheduleHead } from '../report/schedule-view.js';
import { SheetRenderer } from '../render/renderer.js';
import type { PageContent } from '../render/pdf-canvas.js';
import { PdfWriter, type Painter, type PainterFont } from '../render/pdf-writer.js';
import { addOutline } from './book.js';
import { buildCheckReport, reportPaper } from './check-report.js';
import { writeFileAtomic } from './files.js';

/** A mark's row with its check and basis, as the report reads it. */
export type ReportMark<R extends ScheduleRowFacts = ScheduleRowFacts> = R & { code: string; title: string; check: ColumnCheck };

export interface ScheduleReportMeta {
  date: string;
  generator: string;
  project?: string;
  office?: string;
}

const hex = (h: string): RGB => rgb(parseInt(h.slice(1, 3), 16) / 255, parseInt(h.slice(3, 5), 16) / 255, parseInt(h.slice(5, 7), 16) / 255);

/** Rows of the summary table on a page of height H points: the first page also holds the summary, notes, assumptions and caution. */
const firstPageRows = (H: number): number => Math.max(5, Math.floor((H - 480) / 14));
const otherPageRows = (H: number): number => Math.max(10, Math.floor((H - 160) / 14));

/**
 * Draws every mark's sheet as it is checked (one check held at a time), then binds the report and
 * writes it whole. Returns the marks' rows without their checks.
 */
export async function writeScheduleReport<R extends ScheduleRowFacts>(
  file: string,
  marks: Iterable<ReportMark<R>>,
  headOf: (rows: readonly (R & { code: string; title: string })[]) => ScheduleHead,
  meta: ScheduleReportMeta,
  onMark?: (done: number) => void,
): Promise<(R & { code: string; title: string })[]> {
  const rows: (R & { code: string; title: string })[] = [];
  const renderer = await SheetRenderer.create();
  let sheets: PageContent[];
  let paper = reportPaper('us');
  try {
    const pdf = renderer.pdfPages();
    for (const m of marks) {
      const { check, ...row } = m;
      if (rows.length === 0) paper = reportPaper(check.units);
      const page = buildCheckReport({
        check,
        assumptions: checkAssumptions(check),
        caution: CAUTION,
        date: meta.date,
        generator: meta.generator,
        project: meta.project !== undefined ? `${meta.project} · mark ${row.mark}` : `Column mark ${row.mark}`,
        ...(meta.office !== undefined ? { office: meta.office } : {}),
        // the calculation sheet's own column-mark field (issue 20)
        mark: row.mark,
      });
      await pdf.add({ template: page.template, data: page.data }, page.insets);
      rows.push(row as unknown as R & { code: string; title: string });
      onMark?.(rows.length);
    }
    sheets = pdf.pages();
  } finally {
    renderer.finalize();
  }
  const head = headOf(rows);
  const writer = await PdfWriter.create();
  const doc = writer.doc;
  const first = firstPageRows(paper.h);
  const other = otherPageRows(paper.h);
  const spans: [number, number][] = [[0, Math.min(rows.length, first)]];
  for (let start = first; start < rows.length; start += other) spans.push([start, Math.min(rows.length, start + other)]);
  const summaryPages: PDFPage[] = [];
  spans.forEach(([from, to], k) => {
    const page = writer.painter(paper.w, paper.h);
    drawSummary(page, { rows, head, meta, from, to, pageNo: k + 1, pages: spans.length + rows.length, first: spans.length + 1 }, page.regular, page.bold);
    summaryPages.push(page.finish());
  });
  const sheetPages: PDFPage[] = sheets.map((p) => writer.addPage(p));
  if (sheetPages.length !== rows.length) throw new Error(`schedule report: ${sheetPages.length} sheet pages for ${rows.length} marks`);
  addOutline(doc, [
    { title: 'Summary', page: summaryPages[0]! },
    ...rows.map((r, i) => ({ title: `${r.mark}: ${STATUS_WORDS[r.status]}${r.utilisation !== null ? ` ${cell(r.utilisation, 3)}` : ''}`, page: sheetPages[i]! })),
  ]);
  const date = new Date(`${meta.date}T00:00:00Z`);
  doc.setTitle(`${meta.project ?? 'Column schedule'}: column schedule check`);
  if (meta.office !== undefined) doc.setAuthor(meta.office);
  doc.setSubject(`Column schedule check, ${head.bases.map((b) => b.title).join('; ')}, ${rows.length} marks`);
  doc.setCreator(meta.generator);
  doc.setProducer(`${meta.generator} (pdf-lib)`);
  doc.setCreationDate(date);
  doc.setModificationDate(date);
  writeFileAtomic(file, await writer.save());
  return rows;
}

interface SummaryPage<R extends ScheduleRowFacts> {
  rows: readonly R[];
  head: ScheduleHead;
  meta: ScheduleReportMeta;
  from: number;
  to: number;
  pageNo: number;
  pages: number;
  /** page number of the first mark's sheet */
  first: number;
}

function drawSummary<R extends ScheduleRowFacts>(page: Painter, s: SummaryPage<R>, regular: PainterFont, bold: PainterFont): void {
  const { width: W, height: H } = page.getSize();
  const u = Math.min(W, H) / 100 + 0.8;
  const m = 4 * u;
  page.drawRectangle({ x: 0, y: 0, width: 1.0 * u, height: H, color: hex(COLOURS.accent) });
  let y = H - m - 1.5 * u;
  page.drawText(`Column schedule${s.meta.project !== undefined ? ` · ${s.meta.project}` : ''}`, { x: m, y, size: 2.2 * u, font: bold, color: hex(COLOURS.ink) });
  y -= 2.5 * u;
  const sub = [s.meta.office, s.meta.date, `page ${s.pageNo} of ${s.pages}`, s.meta.generator].filter((t) => t !== undefined).join(' · ');
  page.drawText(sub, { x: m, y, size: 1.0 * u, font: regular, color: hex(COLOURS.muted) });
  y -= 1.8 * u;
  page.drawText(`Design basis: ${s.head.bases.map((b) => b.title).join('; ')}`, { x: m, y, size: 1.0 * u, font: regular, color: hex(COLOURS.ink) });
  y -= 2.6 * u;
  const cols: [string, number, 'l' | 'r'][] = [
    ['mark', 10, 'l'],
    ['governing load', 30, 'l'],
    ['status', 12, 'l'],
    ['utilisation', 9, 'r'],
    ['ρg provided', 9, 'r'],
    ['ρg required', 9, 'r'],
    ['page', 6, 'r'],
  ];
  const total = cols.reduce((a, c) => a + c[1], 0);
  const scale = (W - 2 * m) / total;
  const size = 0.95 * u;
  const row = (cells: string[], font: PainterFont, colour: string) => {
    let x = m;
    cells.forEach((t, k) => {
      const [, w, al] = cols[k]!;
      const cw = w * scale;
      let text = t;
      while (text.length > 1 && font.widthOfTextAtSize(text, size) > cw - 0.8 * u) text = `${text.slice(0, -2)}…`;
      const tw = font.widthOfTextAtSize(text, size);
      page.drawText(text, { x: al === 'r' ? x + cw - 0.8 * u - tw : x, y, size, font, color: hex(colour) });
      x += cw;
    });
  };
  row(cols.map((c) => c[0]), bold, COLOURS.ink);
  page.drawLine({ start: { x: m, y: y - 0.5 * u }, end: { x: W - m, y: y - 0.5 * u }, thickness: 0.7, color: hex(COLOURS.faint) });
  y -= 14;
  for (let i = s.from; i < s.to; i++) {
    const r = s.rows[i]!;
    if ((i - s.from) % 2 === 1) page.drawRectangle({ x: m, y: y - 0.45 * u, width: W - 2 * m, height: 14, color: hex('#f3f5f7') });
    row([r.mark, r.governing, STATUS_WORDS[r.status], cell(r.utilisation, 3), cell(r.rhoProvided, 4), cell(r.rhoRequired, 4), String(s.first + i)], regular, r.status === 'ok' ? COLOURS.ink : COLOURS.caution);
    y -= 14;
  }
  if (s.pageNo !== 1) return;
  // the first page also holds the summary, the notes, the assumptions and the caution
  y -= 1.2 * u;
  const line = (text: string, sz: number, font: PainterFont, colour: string = COLOURS.ink) => {
    for (const l of wrap(text, W - 2 * m, sz)) {
      page.drawText(l, { x: m, y, size: sz, font, color: hex(colour) });
      y -= sz * 1.4;
    }
  };
  line(summariseSchedule(s.rows).summary.text, 1.1 * u, bold);
  y -= 0.6 * u;
  for (const n of s.head.notes) line(`Note: ${n}`, 0.9 * u, regular, COLOURS.muted);
  y -= 0.6 * u;
  line('Assumptions', 1.0 * u, bold, COLOURS.accent);
  for (const a of scheduleAssumptions(s.head)) line(`•  ${a}`, 0.9 * u, regular);
  const cl = wrap(CAUTION, W - 2 * m - 2 * u, 1.05 * u);
  const ch = cl.length * 1.05 * u * 1.4 + 2 * u;
  page.drawRectangle({ x: m, y: m, width: W - 2 * m, height: ch, color: hex('#fbf1ef'), borderColor: hex(COLOURS.caution), borderWidth: 0.7 });
  let cy = m + ch - 1.0 * u - 1.05 * u;
  for (const l of cl) {
    page.drawText(l, { x: m + u, y: cy, size: 1.05 * u, font: bold, color: hex(COLOURS.caution) });
    cy -= 1.05 * u * 1.4;
  }
}
