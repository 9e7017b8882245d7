/**
 * Binding a book with our PDF writer (src/render/pdf-writer.ts, on pdf-lib): a cover, an index of every
 * sheet with its parameters and page number, the sheet pages (page contents from the render chunks, in
 * order), one outline entry per sheet, and fixed metadata so that the same set gives the same bytes.
 * DejaVu Sans (regular and bold) is embedded once for the whole book, subset to the glyphs of every page.
 */
import { PDFArray, PDFDocument, PDFName, PDFNumber, PDFHexString, rgb, type PDFPage, type PDFRef, type RGB } from 'pdf-lib';
import type { PageContent } from '../render/pdf-canvas.js';
import type { PdfPages } from '../render/renderer.js';
import type { Painter, PainterFont } from '../render/pdf-writer.js';
import { describeArrangement, describeShape, describeTransverse, fmt, stressText, gammaText } from '../config/describe.js';
import { RATIO_SYMBOL, type ResolvedChartSet } from '../config/types.js';
import type { Basis, BasisSymbols } from '../codes/types.js';
import { COLOURS } from '../chart/style.js';
import { normalisationText, wrap } from '../chart/sheet-data.js';

export interface BookInput {
  set: ResolvedChartSet;
  /** the sheet pages in sheet order (from the render chunks) */
  pages: readonly PageContent[];
  generator: string;
  /** the first sheet's basis title (PDF metadata) */
  basisTitle: string;
  /** the code's symbols (specified strengths, resistances) */
  symbols: BasisSymbols;
  /** basis titles (with a group's options) with the sheet numbers using each, in sheet order */
  titleGroups: readonly SheetGroupText[];
  /** the factors on resistance (Basis.factorSummary) with the sheet numbers using each, in sheet order */
  factorGroups: readonly SheetGroupText[];
  /** how values are normalised, per group, e.g. "ν = NRd/(fcd·Ag), μ = MRd/(fcd·Ag·h), fcd = 40 MPa" */
  normalisationGroups: readonly SheetGroupText[];
  /** basis notes: those of every sheet (sheets = all), then those of some sheets only */
  noteGroups: readonly SheetGroupText[];
  /** per sheet, the basis parameters that differ between the set's sheets ("α2 0.79 · γ2 0.86"); absent when none differ */
  sheetValues?: readonly string[];
  /** the office logo as PNG bytes (src/sheet/logo.ts raster), drawn top right on the cover and the index */
  logoPng?: Uint8Array;
}

/** A text shared by some sheets of a set (their 1-based numbers). */
export interface SheetGroupText {
  summary: string;
  sheets: readonly number[];
}

/** Groups sheets by a text, in sheet order. */
export function groupBy(texts: readonly string[], numbers: readonly number[]): SheetGroupText[] {
  const out: { summary: string; sheets: number[] }[] = [];
  texts.forEach((t, i) => {
    const g = out.find((x) => x.summary === t);
    if (g) g.sheets.push(numbers[i]!);
    else out.push({ summary: t, sheets: [numbers[i]!] });
  });
  return out;
}

/**
 * What the cover and the index say of each sheet's own basis: titles, factors, normalisation and notes grouped by
 * the sheets that share them, and per sheet the basis parameters that differ across the set (so a mixed set is
 * never described by its first group alone).
 */
export function perSheetBasis(set: ResolvedChartSet, bases: readonly Basis[], design: boolean): Pick<BookInput, 'titleGroups' | 'factorGroups' | 'normalisationGroups' | 'noteGroups' | 'sheetValues'> {
  const numbers = set.sheets.map((s) => s.index);
  const norm = bases.map((b) => {
    const sy = b.symbols;
    return normalisationText(set, sy, design ? sy.designAxial : sy.nominalAxial, design ? sy.designMoment : sy.nominalMoment, b.normalisingStress);
  });
  const everywhere = bases[0]!.notes.filter((n) => bases.every((b) => b.notes.includes(n)));
  const own = bases.map((b) => b.notes.filter((n) => !everywhere.includes(n)));
  const noteGroups: SheetGroupText[] = everywhere.map((n) => ({ summary: n, sheets: numbers }));
  const seen = new Set<string>();
  own.forEach((list) => {
    for (const n of list) {
      if (seen.has(n)) continue;
      seen.add(n);
      noteGroups.push({ summary: n, sheets: numbers.filter((_, i) => own[i]!.includes(n)) });
    }
  });
  const text = (v: unknown) => (typeof v === 'number' ? fmt(v, 4) : String(v));
  const keys = Object.keys(bases[0]!.parameters).filter((k) => bases.some((b) => text(b.parameters[k]) !== text(bases[0]!.parameters[k])));
  const sheetValues = keys.length > 0 ? bases.map((b) => keys.map((k) => `${k} ${text(b.parameters[k])}`).join(' · ')) : undefined;
  return {
    titleGroups: groupBy(bases.map((b) => b.title), numbers),
    factorGroups: groupBy(bases.map((b) => b.factorSummary), numbers),
    normalisationGroups: groupBy(norm, numbers),
    noteGroups,
    ...(sheetValues ? { sheetValues } : {}),
  };
}

/** The office logo as the cover and index draw it: PNG bytes and their pixel size. */
interface LogoImage {
  readonly png: Uint8Array;
  readonly width: number;
  readonly height: number;
}

/** A PNG's size from its IHDR chunk (bytes 16–23, big-endian; ISO/IEC 15948 11.2.2). */
function logoImage(png: Uint8Array): LogoImage {
  const v = new DataView(png.buffer, png.byteOffset, png.byteLength);
  return { png, width: v.getUint32(16), height: v.getUint32(20) };
}

/** "1–10, 12" from sorted sheet numbers. */
export function sheetRanges(n: readonly number[]): string {
  const out: string[] = [];
  for (let i = 0; i < n.length; ) {
    let j = i;
    while (j + 1 < n.length && n[j + 1] === n[j]! + 1) j++;
    out.push(j === i ? String(n[i]) : `${n[i]}–${n[j]}`);
    i = j + 1;
  }
  return out.join(', ');
}

const hex = (h: string): RGB => rgb(parseInt(h.slice(1, 3), 16) / 255, parseInt(h.slice(3, 5), 16) / 255, parseInt(h.slice(5, 7), 16) / 255);

export const INDEX_ROWS_PER_PAGE = (heightPt: number): number => Math.max(10, Math.floor((heightPt - 170) / 15));

/** Pages before the first sheet: the cover and the index pages. */
export function frontMatterPages(set: ResolvedChartSet): number {
  return 1 + Math.ceil(set.sheets.length / INDEX_ROWS_PER_PAGE(set.paper.heightPt));
}

export async function bindBook(input: BookInput): Promise<Uint8Array> {
  const { set } = input;
  const { PdfWriter } = await import('../render/pdf-writer.js');
  const writer = await PdfWriter.create();
  const doc = writer.doc;
  const W = set.paper.widthPt;
  const H = set.paper.heightPt;
  const front = frontMatterPages(set);

  const logo = input.logoPng ? logoImage(input.logoPng) : undefined;
  const coverPainter = writer.painter(W, H);
  drawCover(coverPainter, input, coverPainter.regular, coverPainter.bold, front, logo);
  const cover = coverPainter.finish();
  const rowsPerPage = INDEX_ROWS_PER_PAGE(H);
  const indexPages: PDFPage[] = [];
  for (let start = 0, p = 0; start < set.sheets.length; start += rowsPerPage, p++) {
    const page = writer.painter(W, H);
    drawIndex(page, input, page.regular, page.bold, start, Math.min(set.sheets.length, start + rowsPerPage), front, p + 2, front, logo);
    indexPages.push(page.finish());
  }

  const sheetPages: PDFPage[] = input.pages.map((p) => writer.addPage(p));
  if (sheetPages.length !== set.sheets.length) throw new Error(`book: ${sheetPages.length} sheet pages for ${set.sheets.length} sheets`);

  addOutline(doc, [
    { title: 'Cover', page: cover },
    { title: 'Index of sheets', page: indexPages[0]! },
    ...set.sheets.map((s, i) => ({ title: `Sheet ${s.index}: ${s.title}`, page: sheetPages[i]! })),
  ]);

  const date = new Date(`${set.titleBlock.date}T00:00:00Z`);
  doc.setTitle(`${set.titleBlock.project}: interaction chart set ${set.name}`);
  doc.setAuthor(set.titleBlock.office);
  doc.setSubject(`Normalised P–M interaction charts, ${input.basisTitle}, ${set.sheets.length} sheets`);
  doc.setKeywords(['interaction chart', 'reinforced concrete column', input.basisTitle, set.name]);
  doc.setCreator(input.generator);
  doc.setProducer(`${input.generator} (pdf-lib)`);
  doc.setCreationDate(date);
  doc.setModificationDate(date);
  return writer.save();
}

/** The office logo in a box whose top-right corner is (right, top), as large as its aspect allows. */
function drawLogoBox(page: Painter, logo: LogoImage | undefined, right: number, top: number, w: number, h: number): void {
  if (!logo) return;
  const k = Math.min(w / logo.width, h / logo.height);
  const dw = logo.width * k;
  const dh = logo.height * k;
  page.drawImage(logo.png, { x: right - dw, y: top - dh, width: dw, height: dh });
}

/** "summary" for one group; "summary: sheets 1–4" for each of several. */
const groupLines = (groups: readonly SheetGroupText[]): string[] =>
  groups.map((g) => (groups.length === 1 ? g.summary : `${g.summary}: sheet${g.sheets.length === 1 ? '' : 's'} ${sheetRanges(g.sheets)}`));

function drawCover(page: Painter, input: BookInput, regular: PainterFont, bold: PainterFont, front: number, logo: LogoImage | undefined): void {
  const { set } = input;
  const { width: W, height: H } = page.getSize();
  const u = Math.min(W, H) / 100 + 0.8;
  const m = 5 * u;
  const tb = set.titleBlock;
  page.drawRectangle({ x: 0, y: 0, width: 2.2 * u, height: H, color: hex(COLOURS.accent) });
  const logoW = logo ? 24 * u : 0;
  drawLogoBox(page, logo, W - m, H - m, logoW, 9 * u);
  let y = H - m - 3 * u;
  const line = (text: string, size: number, font: PainterFont, colour: string = COLOURS.ink, gap = 1.5, x = m + 2 * u, w = W - 2 * m - 4 * u) => {
    for (const l of wrap(text, w, size, (t, f) => font.widthOfTextAtSize(t, f))) {
      page.drawText(l, { x, y, size, font, color: hex(colour) });
      y -= size * gap;
    }
  };
  // the office, project and set name keep clear of the logo
  const headW = W - 2 * m - 4 * u - (logo ? logoW + 2 * u : 0);
  line(tb.office, 1.5 * u, regular, COLOURS.muted, 1.5, m + 2 * u, headW);
  y -= 2 * u;
  line(tb.project, 3.4 * u, bold, COLOURS.ink, 1.25, m + 2 * u, headW);
  y -= 0.5 * u;
  line(`Interaction chart set “${set.name}”`, 2.2 * u, regular, COLOURS.accent, 1.5, m + 2 * u, headW);
  y -= 2.5 * u;
  const sheets = set.sheets.length;
  const fcs = [...new Set(set.sheets.map((s) => stressText(s.fc, set.units)))].join(', ');
  const fys = [...new Set(set.sheets.map((s) => stressText(s.fy, set.units)))].join(', ');
  const gammas = [...new Set(set.sheets.map((s) => gammaText(s.gamma)))].join(', ');
  const grouped = (label: string, groups: readonly SheetGroupText[]): [string, string][] => groupLines(groups).map((t, k): [string, string] => [k === 0 ? label : '', t]);
  const facts: [string, string][] = [
    ...grouped('Design basis', input.titleGroups),
    ['Sheets', `${sheets} (index on page 2, sheets from page ${front + 1})`],
    [`Concrete ${input.symbols.concreteStrength}`, fcs],
    [`Bars ${input.symbols.steelStrength}`, fys],
    ['γ', gammas],
    [`${RATIO_SYMBOL[set.ratios.kind]} family`, set.ratios.values.map((r) => fmt(r, 4)).join(', ') + (set.ratios.kind === 'omega' ? '  (ω = As·fyd/(Ac·fcd); ρg per sheet)' : '')],
    ['Curves', set.families === 'both' ? `${input.symbols.nominalFamily} and ${input.symbols.designFamily}` : set.families === 'design' ? input.symbols.designFamily : input.symbols.nominalFamily],
    ...biaxialCoverLine(set, input.symbols),
    ...grouped('Factors', input.factorGroups),
    ...grouped('Normalisation', input.normalisationGroups),
    ...(input.sheetValues ? [['Per sheet', `${[...new Set(input.sheetValues.flatMap((v) => v.split(' · ').map((p) => p.slice(0, p.lastIndexOf(' ')))))].join(', ')} differ between sheets: the index gives each sheet’s values`] as [string, string]] : []),
    ['Prepared · checked', [tb.preparedBy, tb.checkedBy].filter(Boolean).join(' · ') || '—'],
    ['Revision · date', `${tb.revision} · ${tb.date}`],
    ['Generated by', input.generator],
  ];
  const vx = m + 20 * u;
  const vw = W - m - 2 * u - vx;
  for (const [k, v] of facts) {
    if (k) page.drawText(k, { x: m + 2 * u, y, size: 0.8 * u, font: regular, color: hex(COLOURS.muted) });
    const lines = wrap(v, vw, 1.1 * u, (t, f) => regular.widthOfTextAtSize(t, f));
    lines.forEach((l, i) => page.drawText(l, { x: vx, y: y - i * 1.45 * u, size: 1.1 * u, font: regular, color: hex(COLOURS.ink) }));
    y -= 1.9 * u + (lines.length - 1) * 1.45 * u;
  }
  y -= 1.5 * u;
  page.drawText('Assumptions of the basis', { x: m + 2 * u, y, size: 1.1 * u, font: bold, color: hex(COLOURS.accent) });
  y -= 1.7 * u;
  for (const n of input.noteGroups) line(`•  ${n.sheets.length === sheets ? '' : `Sheet${n.sheets.length === 1 ? '' : 's'} ${sheetRanges(n.sheets)}: `}${n.summary}`, 0.95 * u, regular, COLOURS.ink, 1.4);
  const caution =
    'For use by qualified engineers only. The sheets are aids to design: check every value against the governing code edition, the project specification and local practice. They do not replace the judgement of the engineer of record.';
  const cl = wrap(caution, W - 2 * m - 8 * u, 1.05 * u);
  const ch = cl.length * 1.05 * u * 1.4 + 2 * u;
  page.drawRectangle({ x: m + 2 * u, y: m, width: W - 2 * m - 4 * u, height: ch, color: hex('#fbf1ef'), borderColor: hex(COLOURS.caution), borderWidth: 0.7 });
  let cy = m + ch - 1.0 * u - 1.05 * u;
  for (const l of cl) {
    page.drawText(l, { x: m + 3 * u, y: cy, size: 1.05 * u, font: bold, color: hex(COLOURS.caution) });
    cy -= 1.05 * u * 1.4;
  }
}

/** Smallest index type, as a share of the row size, before a cell goes to two lines. */
const INDEX_MIN_SHRINK = 0.78;

/**
 * One index cell, whole: at the row size, shrunk to fit, or in two lines of smaller type broken after "-", "_" or a
 * space (file names are long); never cut. Returns nothing: drawn at (x, y) within width `cw`.
 */
function indexCell(page: Painter, text: string, font: PainterFont, size: number, x: number, y: number, cw: number, right: boolean, colour: RGB): void {
  const width = (t: string, f: number) => font.widthOfTextAtSize(t, f);
  const at = (t: string, f: number, yy: number) => page.drawText(t, { x: right ? x + cw - width(t, f) : x, y: yy, size: f, font, color: colour });
  const w0 = width(text, size);
  if (w0 <= cw) return at(text, size, y);
  if (w0 * INDEX_MIN_SHRINK <= cw) return at(text, size * (cw / w0), y);
  // two lines: the break nearest the middle at a soft point
  const soft = [...text.matchAll(/[-_\s·]/g)].map((mm) => mm.index! + 1);
  const mid = text.length / 2;
  const cut = soft.length > 0 ? soft.reduce((a, b) => (Math.abs(b - mid) < Math.abs(a - mid) ? b : a)) : Math.ceil(mid);
  const lines = [text.slice(0, cut).trimEnd(), text.slice(cut).trimStart()];
  const f = Math.min(size * 0.8, ...lines.map((l) => (size * cw) / width(l, size)));
  at(lines[0]!, f, y + 0.55 * f);
  at(lines[1]!, f, y - 0.5 * f);
}

function drawIndex(page: Painter, input: BookInput, regular: PainterFont, bold: PainterFont, from: number, to: number, front: number, pageNo: number, frontCount: number, logo: LogoImage | undefined): void {
  const { set } = input;
  const { width: W, height: H } = page.getSize();
  const u = Math.min(W, H) / 100 + 0.8;
  const m = 4 * u;
  page.drawRectangle({ x: 0, y: 0, width: 1.0 * u, height: H, color: hex(COLOURS.accent) });
  drawLogoBox(page, logo, W - m, H - m + 0.5 * u, 16 * u, 5 * u);
  page.drawText('Index of sheets', { x: m, y: H - m - 1.5 * u, size: 2.2 * u, font: bold, color: hex(COLOURS.ink) });
  page.drawText(`${set.titleBlock.project} · ${set.name} · page ${pageNo} of ${frontCount + set.sheets.length}`, {
    x: m,
    y: H - m - 4 * u,
    size: 1.0 * u,
    font: regular,
    color: hex(COLOURS.muted),
  });
  const withGammaB = set.sheets.some((s) => s.gammaB !== undefined);
  const values = input.sheetValues;
  const cols: [string, number, 'l' | 'r'][] = [
    ['sheet', 4, 'r'],
    ['shape', 9, 'l'],
    [input.symbols.concreteStrength, 6, 'r'],
    [input.symbols.steelStrength, 6, 'r'],
    // γB, where a sheet has one, gets its own place beside γ
    withGammaB ? ['γ · γB', 7, 'r'] : ['γ', 4.5, 'r'],
    ['bars', 26, 'l'],
    ['transverse', 7, 'l'],
    // the basis values that differ between sheets (a mixed set), where there are any
    ...(values ? [['basis values', 14, 'l'] as [string, number, 'l']] : []),
    ['file', 34, 'l'],
    ['page', 4.5, 'r'],
  ];
  const total = cols.reduce((s, c) => s + c[1], 0);
  const scale = (W - 2 * m) / total;
  const size = 0.95 * u;
  let y = H - m - 8 * u;
  const row = (cells: string[], font: PainterFont, colour: string) => {
    let x = m;
    cells.forEach((t, k) => {
      const [, w, al] = cols[k]!;
      const cw = w * scale;
      indexCell(page, t, font, size, x, y, cw - 0.8 * u, al === 'r', hex(colour));
      x += cw;
    });
  };
  row(cols.map((c) => c[0]), bold, COLOURS.ink);
  page.drawLine({ start: { x: m, y: y - 0.5 * u }, end: { x: W - m, y: y - 0.5 * u }, thickness: 0.7, color: hex(COLOURS.faint) });
  y -= 15;
  for (let i = from; i < to; i++) {
    const s = set.sheets[i]!;
    if ((i - from) % 2 === 1) page.drawRectangle({ x: m, y: y - 0.45 * u, width: W - 2 * m, height: 15, color: hex('#f3f5f7') });
    row(
      [
        String(s.index),
        describeShape(s.shape),
        stressText(s.fc, set.units),
        stressText(s.fy, set.units),
        withGammaB ? `${gammaText(s.gamma)} · ${s.gammaB === undefined ? '—' : gammaText(s.gammaB)}` : gammaText(s.gamma),
        describeArrangement(s.arrangement) + biaxialIndexText(s),
        describeTransverse(s.transverse),
        ...(values ? [values[i]!] : []),
        s.fileStem,
        String(front + i + 1),
      ],
      regular,
      COLOURS.ink,
    );
    y -= 15;
  }
}

/** A flat PDF outline (ISO 32000-1 12.3.3): one item per entry, each opening its page. */
export function addOutline(doc: PDFDocument, entries: { title: string; page: PDFPage }[]): void {
  const ctx = doc.context;
  const rootRef = ctx.nextRef();
  const refs: PDFRef[] = entries.map(() => ctx.nextRef());
  entries.forEach((e, i) => {
    const dict: Record<string, unknown> = {
      Title: PDFHexString.fromText(e.title),
      Parent: rootRef,
      Dest: ctx.obj([e.page.ref, PDFName.of('Fit')]) as PDFArray,
    };
    if (i > 0) dict.Prev = refs[i - 1];
    if (i < entries.length - 1) dict.Next = refs[i + 1];
    ctx.assign(refs[i]!, ctx.obj(dict as never));
  });
  ctx.assign(rootRef, ctx.obj({ Type: 'Outlines', First: refs[0]!, Last: refs[refs.length - 1]!, Count: PDFNumber.of(entries.length) } as never));
  doc.catalog.set(PDFName.of('Outlines'), rootRef);
  doc.catalog.set(PDFName.of('PageMode'), PDFName.of('UseOutlines'));
}

/** Writes drawn pages as one PDF with fixed metadata (the dates are the set's, never the clock's). */
export async function fixPdfMetadata(pdf: PdfPages, m: { title: string; subject: string; date: string; generator: string }): Promise<Uint8Array> {
  return pdf.toBytes((doc: PDFDocument) => {
    const date = new Date(`${m.date}T00:00:00Z`);
    doc.setTitle(m.title);
    doc.setSubject(m.subject);
    doc.setCreator(m.generator);
    doc.setProducer(`${m.generator} (pdf-lib)`);
    doc.setCreationDate(date);
    doc.setModificationDate(date);
  });
}

/** The cover's line about biaxial sheets, where the set has any: how many, and that they show factored Mx–My contours. */
function biaxialCoverLine(set: BookInput['set'], symbols: BookInput['symbols']): [string, string][] {
  const n = set.sheets.filter((s) => s.chart === 'biaxial').length;
  return n === 0 ? [] : [['Biaxial sheets', `${n} of ${set.sheets.length}: ${symbols.designFamily} Mx–My contours per axial level`]];
}

/** A biaxial sheet's index entry names its kind and levels after the bars: " · Mx–My at 0–0.3". */
function biaxialIndexText(s: BookInput['set']['sheets'][number]): string {
  const lv = s.axialLevels;
  if (s.chart !== 'biaxial' || !lv || lv.length === 0) return '';
  return ` · Mx–My at ${lv.length > 1 ? `${fmt(lv[0]!)}–${fmt(lv[lv.length - 1]!)}` : fmt(lv[0]!)}`;
}
