/**
 * Pages (PageContent from pdf-canvas.ts) → one PDF with pdf-lib, each font embedded and subset once
 * for the whole document. Content streams name glyphs by the font's own glyph ids (CIDs); the subset
 * renumbers glyphs, and each CIDFontType2's /CIDToGIDMap stream maps one to the other (ISO 32000-1
 * §9.7.4.2), so pages written in other processes, before the book knew its glyphs, need no rewriting.
 * /ToUnicode CMaps (§9.10.3) keep the text searchable and copyable.
 *
 * A mark's drawing (a segment, see pdf-canvas.ts) that occurs more than once in the document is written
 * once as a form XObject and drawn by reference; one that occurs once stays in its page's stream.
 *
 * The bytes depend only on the pages and their order: glyph sets are unions sorted by id, resources
 * are named from their values, and the subset tag is a hash of the subset.
 */
import { createHash } from 'node:crypto';
import { deflateSync } from 'node:zlib';
import { PDFDocument, PDFName, PDFNumber, PDFString, type PDFPage, type PDFRef, type RGB } from 'pdf-lib';
import { FontEngine, type FontKey } from './font-engine.js';
import { alphaResource, FONT_RESOURCE, formResource, imageResource, PdfCanvas, SEGMENT_MARK, type PageContent } from './pdf-canvas.js';

const FACES: readonly FontKey[] = ['regular', 'bold'];

export class PdfWriter {
  private readonly glyphs: Record<FontKey, Map<number, string>> = { regular: new Map(), bold: new Map() };
  private readonly alphas = new Set<number>();
  private readonly images = new Map<string, string>();
  /** segments by key, and how often the pages draw each */
  private readonly segments = new Map<string, { body: string; uses: number }>();
  /** page streams waiting for the segment counts */
  private readonly streams: { ref: PDFRef; stream: string }[] = [];
  private readonly fontRefs: Record<FontKey, PDFRef>;
  private readonly resourcesRef: PDFRef;
  private finished = false;

  private constructor(
    readonly doc: PDFDocument,
    private readonly engine: FontEngine,
  ) {
    this.fontRefs = { regular: doc.context.nextRef(), bold: doc.context.nextRef() };
    this.resourcesRef = doc.context.nextRef();
  }

  static async create(): Promise<PdfWriter> {
    return new PdfWriter(await PDFDocument.create({ updateMetadata: false }), FontEngine.get());
  }

  /** Appends a page; its resources are the document's shared dictionary (fonts, alphas, images). */
  addPage(p: PageContent): PDFPage {
    if (this.finished) throw new Error('PdfWriter: pages added after the fonts were written');
    const page = this.doc.addPage([p.width, p.height]);
    const ctx = this.doc.context;
    const ref = ctx.nextRef();
    this.streams.push({ ref, stream: p.stream });
    page.node.set(PDFName.of('Contents'), ref);
    page.node.set(PDFName.of('Resources'), this.resourcesRef);
    const parts = p.stream.split(SEGMENT_MARK);
    for (let i = 1; i < parts.length; i += 2) {
      const key = parts[i]!;
      const seg = this.segments.get(key);
      if (seg) seg.uses++;
      else this.segments.set(key, { body: p.segments[key]!, uses: 1 });
    }
    for (const k of FACES) {
      const used = this.glyphs[k];
      for (const [g, ch] of p.glyphs[k]) {
        const had = used.get(g);
        if (had === undefined || (ch !== '' && (had === '' || ch < had))) used.set(g, ch);
      }
    }
    for (const a of p.alphas) this.alphas.add(a);
    for (const im of p.images) this.images.set(im.key, im.png);
    return page;
  }

  /** A page drawn here with a canvas-like painter (cover, index, summary pages). */
  painter(width: number, height: number): Painter {
    return new Painter(new PdfCanvas(width, height, this.engine), this);
  }

  /** Writes fonts, transparency states and images once, then the file. */
  async save(): Promise<Uint8Array> {
    if (!this.finished) {
      this.finished = true;
      const ctx = this.doc.context;
      const fonts: Record<string, PDFRef> = {};
      for (const k of FACES) {
        if (this.glyphs[k].size === 0) continue;
        await this.writeFont(k);
        fonts[FONT_RESOURCE[k]] = this.fontRefs[k];
      }
      const gs: Record<string, unknown> = {};
      for (const a of [...this.alphas].sort((x, y) => x - y)) gs[alphaResource(a)] = ctx.obj({ Type: 'ExtGState', CA: PDFNumber.of(a / 1000), ca: PDFNumber.of(a / 1000) });
      const xo: Record<string, PDFRef> = {};
      for (const [key, png] of [...this.images].sort((x, y) => (x[0] < y[0] ? -1 : 1))) {
        const img = await this.doc.embedPng(Buffer.from(png, 'base64'));
        xo[imageResource(key)] = img.ref;
      }
      // recurring marks: one form XObject each, in the page's coordinates (vega's, under the page's flip)
      for (const [key, seg] of [...this.segments].sort((x, y) => (x[0] < y[0] ? -1 : 1))) {
        if (seg.uses < 2) continue;
        xo[formResource(key)] = ctx.register(
          ctx.stream(deflateSync(Buffer.from(seg.body, 'latin1')), { Type: 'XObject', Subtype: 'Form', BBox: [-1e4, -1e4, 1e4, 1e4], Resources: this.resourcesRef, Filter: 'FlateDecode' } as never),
        );
      }
      for (const { ref, stream } of this.streams) {
        const parts = stream.split(SEGMENT_MARK);
        for (let i = 1; i < parts.length; i += 2) {
          const seg = this.segments.get(parts[i]!)!;
          parts[i] = seg.uses < 2 ? `q\n${seg.body}\nQ` : `/${formResource(parts[i]!)} Do`;
        }
        ctx.assign(ref, ctx.stream(deflateSync(Buffer.from(parts.join(''), 'latin1')), { Filter: 'FlateDecode' } as never));
      }
      this.streams.length = 0;
      const res: Record<string, unknown> = { ProcSet: ['PDF', 'Text', 'ImageB', 'ImageC', 'ImageI'] };
      if (Object.keys(fonts).length) res.Font = ctx.obj(fonts);
      if (Object.keys(gs).length) res.ExtGState = ctx.obj(gs as never);
      if (Object.keys(xo).length) res.XObject = ctx.obj(xo);
      ctx.assign(this.resourcesRef, ctx.obj(res as never));
    }
    return this.doc.save({ useObjectStreams: true });
  }

  /** One Type0 font (Identity-H) over a CIDFontType2 holding the subset of the glyphs the document draws. */
  private async writeFont(k: FontKey): Promise<void> {
    const ctx = this.doc.context;
    const face = this.engine.faces[k];
    const font = face.font;
    const used = [...this.glyphs[k]].sort((a, b) => a[0] - b[0]);
    const subset = font.createSubset();
    const newId = new Map<number, number>();
    for (const [g] of used) newId.set(g, subset.includeGlyph(g));
    const file = await new Promise<Uint8Array>((resolve, reject) => {
      const parts: Uint8Array[] = [];
      const s = subset.encodeStream() as unknown as { on(e: string, f: (d?: unknown) => void): unknown };
      s.on('data', (d) => parts.push(d as Uint8Array));
      s.on('end', () => resolve(Buffer.concat(parts)));
      s.on('error', (e) => reject(e as Error));
    });
    const scale = 1000 / face.unitsPerEm;
    const tag = [...createHash('sha1').update(`${k}:${used.map((u) => u[0]).join(',')}`).digest()]
      .slice(0, 6)
      .map((b) => String.fromCharCode(65 + (b % 26)))
      .join('');
    const name = `${tag}+${(font.postscriptName ?? 'DejaVuSans').replace(/[^A-Za-z0-9-]/g, '')}`;
    const maxCid = used.length ? used[used.length - 1]![0] : 0;
    const map = new Uint8Array(2 * (maxCid + 1));
    for (const [g, n] of newId) {
      map[2 * g] = n >> 8;
      map[2 * g + 1] = n & 0xff;
    }
    const flate = (b: Uint8Array, extra: Record<string, unknown> = {}) => ctx.register(ctx.stream(deflateSync(b), { Filter: 'FlateDecode', ...extra } as never));
    const fileRef = flate(file, { Length1: file.length });
    const mapRef = flate(map);
    const toUnicodeRef = flate(Buffer.from(toUnicodeCMap(used), 'latin1'));
    const W: unknown[] = [];
    for (const [g] of used) W.push(g, [Math.round(font.getGlyph(g).advanceWidth * scale * 1000) / 1000]);
    const bbox = font.bbox;
    const os2 = (font as unknown as { 'OS/2'?: { capHeight?: number } })['OS/2'];
    const descriptor = ctx.register(
      ctx.obj({
        Type: 'FontDescriptor',
        FontName: name,
        Flags: 4,
        FontBBox: [bbox.minX, bbox.minY, bbox.maxX, bbox.maxY].map((v) => Math.round(v * scale)),
        ItalicAngle: font.italicAngle,
        Ascent: Math.round(font.ascent * scale),
        Descent: Math.round(font.descent * scale),
        CapHeight: Math.round((os2?.capHeight || font.ascent) * scale),
        StemV: k === 'bold' ? 120 : 80,
        FontFile2: fileRef,
      } as never),
    );
    const cid = ctx.register(
      ctx.obj({
        Type: 'Font',
        Subtype: 'CIDFontType2',
        BaseFont: name,
        CIDSystemInfo: { Registry: PDFString.of('Adobe'), Ordering: PDFString.of('Identity'), Supplement: 0 },
        FontDescriptor: descriptor,
        W,
        CIDToGIDMap: mapRef,
      } as never),
    );
    ctx.assign(this.fontRefs[k], ctx.obj({ Type: 'Font', Subtype: 'Type0', BaseFont: name, Encoding: 'Identity-H', DescendantFonts: [cid], ToUnicode: toUnicodeRef } as never));
  }
}

/** A ToUnicode CMap (Adobe Technical Note #5411 layout): each glyph id → the UTF-16BE text it stands for. */
function toUnicodeCMap(used: readonly [number, string][]): string {
  const entries = used.filter(([, s]) => s !== '');
  const lines = [
    '/CIDInit /ProcSet findresource begin',
    '12 dict begin',
    'begincmap',
    '/CIDSystemInfo << /Registry (Adobe) /Ordering (UCS) /Supplement 0 >> def',
    '/CMapName /Adobe-Identity-UCS def',
    '/CMapType 2 def',
    '1 begincodespacerange',
    '<0000> <ffff>',
    'endcodespacerange',
  ];
  for (let i = 0; i < entries.length; i += 100) {
    const block = entries.slice(i, i + 100);
    lines.push(`${block.length} beginbfchar`);
    for (const [g, s] of block) {
      let hex = '';
      for (let j = 0; j < s.length; j++) hex += s.charCodeAt(j).toString(16).padStart(4, '0');
      lines.push(`<${g.toString(16).padStart(4, '0')}> <${hex}>`);
    }
    lines.push('endbfchar');
  }
  lines.push('endcmap', 'CMapName currentdict /CMap defineresource pop', 'end', 'end');
  return lines.join('\n');
}

/** A font as the painter's callers use it (pdf-lib's `widthOfTextAtSize`), measured by the font engine. */
export interface PainterFont {
  readonly bold: boolean;
  widthOfTextAtSize(text: string, size: number): number;
}

const css = (c: RGB): string => `rgb(${Math.round(c.red * 255)}, ${Math.round(c.green * 255)}, ${Math.round(c.blue * 255)})`;

/**
 * pdf-lib's page drawing calls (y up from the bottom left) on a writer page, so cover, index and summary
 * pages share the book's fonts: drawText, drawRectangle, drawLine, drawImage.
 */
export class Painter {
  readonly regular: PainterFont;
  readonly bold: PainterFont;

  constructor(
    readonly canvas: PdfCanvas,
    private readonly writer: PdfWriter,
  ) {
    const engine = FontEngine.get();
    this.regular = { bold: false, widthOfTextAtSize: (t, s) => engine.width(t, s, false) };
    this.bold = { bold: true, widthOfTextAtSize: (t, s) => engine.width(t, s, true) };
  }

  getSize(): { width: number; height: number } {
    return { width: this.canvas.width, height: this.canvas.height };
  }

  drawText(text: string, o: { x: number; y: number; size: number; font: PainterFont; color?: RGB }): void {
    const c = this.canvas;
    c.font = `${o.font.bold ? 'bold ' : ''}${o.size}px sans-serif`;
    c.fillStyle = o.color ? css(o.color) : '#000000';
    c.globalAlpha = 1;
    c.textAlign = 'left';
    c.fillText(text, o.x, this.canvas.height - o.y);
  }

  drawRectangle(o: { x: number; y: number; width: number; height: number; color?: RGB; borderColor?: RGB; borderWidth?: number }): void {
    const c = this.canvas;
    c.globalAlpha = 1;
    c.beginPath();
    c.rect(o.x, this.canvas.height - o.y - o.height, o.width, o.height);
    if (o.color) {
      c.fillStyle = css(o.color);
      c.fill();
    }
    if (o.borderColor && (o.borderWidth ?? 1) > 0) {
      c.strokeStyle = css(o.borderColor);
      c.lineWidth = o.borderWidth ?? 1;
      c.setLineDash([]);
      c.stroke();
    }
  }

  drawLine(o: { start: { x: number; y: number }; end: { x: number; y: number }; thickness?: number; color?: RGB }): void {
    const c = this.canvas;
    c.globalAlpha = 1;
    c.beginPath();
    c.moveTo(o.start.x, this.canvas.height - o.start.y);
    c.lineTo(o.end.x, this.canvas.height - o.end.y);
    c.strokeStyle = o.color ? css(o.color) : '#000000';
    c.lineWidth = o.thickness ?? 1;
    c.lineCap = 'butt';
    c.setLineDash([]);
    c.stroke();
  }

  /** A PNG (bytes as they are, embedded once per document) in the box (x, y) bottom left, width × height. */
  drawImage(png: Uint8Array, o: { x: number; y: number; width: number; height: number }): void {
    const c = this.canvas;
    c.globalAlpha = 1;
    c.drawImage({ src: png, width: o.width, height: o.height }, o.x, this.canvas.height - o.y - o.height, o.width, o.height);
  }

  /** Ends the page and adds it to the writer. */
  finish(): PDFPage {
    return this.writer.addPage(this.canvas.finish());
  }
}
