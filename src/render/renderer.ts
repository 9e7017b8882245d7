/**
 * Spec → bytes. One compiled vega View per distinct template; each sheet only swaps its datasets
 * (compiling costs ~45 ms, a data swap a few). Vector PDF pages go into one node-canvas PDF surface
 * through `externalContext`, with text kept as glyphs so the PDF stays searchable.
 */
import type { View } from 'vega';
import { datasetNames, sheetTemplate, type VlSpec } from '../chart/spec.js';
import type { SheetData, TemplateParams } from '../chart/sheet-data.js';
import { renderEnvironment, type RenderEnvironment } from './environment.js';
import { FONT_FAMILY } from '../chart/style.js';

type Row = Record<string, string | number>;
interface ViewEntry {
  view: View;
  /** the tuples vega holds per dataset, in row order */
  rows: Map<string, Row[]>;
}

/** Rows hold primitives only, so a shallow comparison decides. */
function sameRow(a: Row, b: Row): boolean {
  for (const k in b) if (a[k] !== b[k]) return false;
  return true;
}

export interface SheetPage {
  template: TemplateParams;
  data: SheetData;
}

/** A standalone spec (data inline, `autosize: none`) drawn with its top-left corner at (x, y) of a page. */
export interface Inset {
  spec: VlSpec;
  x: number;
  y: number;
}

export class SheetRenderer {
  private readonly views = new Map<string, ViewEntry>();
  private current: { entry: ViewEntry; data: SheetData } | undefined;

  private constructor(readonly env: RenderEnvironment) {}

  static async create(): Promise<SheetRenderer> {
    return new SheetRenderer(await renderEnvironment());
  }

  private measureCtx: import('canvas').CanvasRenderingContext2D | undefined;
  /** Text widths in points with the sheet typeface, as vega measures them (chart/ labels.ts MeasureText). */
  readonly measureText = (text: string, fontSize: number, bold: boolean): number => {
    this.measureCtx ??= this.env.canvas.createCanvas(10, 10).getContext('2d');
    this.measureCtx.font = `${bold ? 'bold ' : ''}${fontSize}px "${FONT_FAMILY}"`;
    return this.measureCtx.measureText(text).width;
  };

  /** Runs the view of this template on this sheet's data. */
  async show(page: SheetPage): Promise<View> {
    const spec = sheetTemplate(page.template);
    const key = JSON.stringify(spec);
    let entry = this.views.get(key);
    if (!entry) {
      const { vega, vegaLite } = this.env;
      const compiled = vegaLite.compile({ ...spec, datasets: Object.fromEntries(datasetNames(page.template).map((n) => [n, []])) } as never).spec;
      entry = { view: new vega.View(vega.parse(compiled), { renderer: 'none' }), rows: new Map() };
      this.views.set(key, entry);
    }
    if (this.current?.entry !== entry || this.current.data !== page.data) {
      for (const name of datasetNames(page.template)) this.update(entry, name, (page.data[name] ?? []) as unknown as Row[]);
      await entry.view.runAsync();
      this.current = { entry, data: page.data };
    }
    return entry.view;
  }

  /**
   * Sends vega only the rows that changed since the last sheet on this view: consecutive sheets share
   * most of their decoration (notes, captions, grid of the table), and unchanged tuples cost nothing.
   */
  private update(entry: ViewEntry, name: string, next: readonly Row[]): void {
    const prev = entry.rows.get(name) ?? [];
    const kept: Row[] = [];
    const remove: Row[] = [];
    const insert: Row[] = [];
    const n = Math.max(prev.length, next.length);
    for (let i = 0; i < n; i++) {
      const a = prev[i];
      const b = next[i];
      if (a && b && sameRow(a, b)) kept.push(a);
      else {
        if (a) remove.push(a);
        if (b) {
          const t = { ...b }; // vega tags ingested tuples, so it gets its own copy
          insert.push(t);
          kept.push(t);
        }
      }
    }
    entry.rows.set(name, kept);
    if (remove.length > 0 || insert.length > 0) entry.view.change(name, this.env.vega.changeset().remove(remove).insert(insert));
  }

  async svg(page: SheetPage, insets: readonly Inset[] = []): Promise<string> {
    const view = await this.show(page);
    let svg = await view.toSVG();
    for (const inset of insets) {
      const inner = await this.specView(inset.spec);
      const body = await inner.toSVG();
      inner.finalize();
      // a nested <svg> is its own viewport; the translate puts it in place
      const end = svg.lastIndexOf('</svg>');
      svg = `${svg.slice(0, end)}<g transform="translate(${inset.x},${inset.y})">${body}</g>${svg.slice(end)}`;
    }
    return svg;
  }

  /** A view of a standalone spec, run once (contour plots: one per file, nothing to reuse). */
  async specView(spec: VlSpec): Promise<View> {
    const { vega, vegaLite } = this.env;
    const view = new vega.View(vega.parse(vegaLite.compile(spec as never).spec), { renderer: 'none' });
    await view.runAsync();
    return view;
  }

  async specSvg(spec: VlSpec): Promise<string> {
    const view = await this.specView(spec);
    try {
      return await view.toSVG();
    } finally {
      view.finalize();
    }
  }

  async png(page: SheetPage, scale: number): Promise<Buffer> {
    const view = await this.show(onCanvas(page));
    const canvas = (await view.toCanvas(scale)) as unknown as import('canvas').Canvas;
    return canvas.toBuffer('image/png', { compressionLevel: 6 });
  }

  /** A vector PDF surface that takes pages one by one (see PdfPages). */
  pdfPages(): PdfPages {
    return new PdfPages(this);
  }

  finalize(): void {
    for (const v of this.views.values()) v.view.finalize();
    this.views.clear();
    this.current = undefined;
  }
}

/**
 * Many sheets on one node-canvas PDF surface: each page is drawn through `externalContext` between
 * save/restore, with text kept as glyphs so the PDF stays searchable. Metadata is left to the binder
 * (src/sheet/book.ts), which fixes the dates for deterministic output.
 */
export class PdfPages {
  private canvas: import('canvas').Canvas | undefined;
  private ctx: import('canvas').CanvasRenderingContext2D | undefined;
  count = 0;

  constructor(private readonly renderer: SheetRenderer) {}

  private newPage(w: number, h: number): import('canvas').CanvasRenderingContext2D {
    if (!this.canvas || !this.ctx) {
      this.canvas = this.renderer.env.canvas.createCanvas(w, h, 'pdf');
      this.ctx = this.canvas.getContext('2d');
      skipRepeatedCompositeMode(this.ctx);
    } else {
      (this.ctx as unknown as { addPage(w: number, h: number): void }).addPage(w, h);
    }
    this.ctx.textDrawingMode = 'glyph';
    this.count++;
    return this.ctx;
  }

  /** Draws a view at (x, y): vega scales and translates an external context from its current transform. */
  private async draw(ctx: import('canvas').CanvasRenderingContext2D, view: View, x = 0, y = 0): Promise<void> {
    ctx.save();
    if (x !== 0 || y !== 0) ctx.translate(x, y);
    await view.toCanvas(1, { externalContext: ctx } as never);
    ctx.restore();
  }

  async add(page: SheetPage, insets: readonly Inset[] = []): Promise<void> {
    const { w, h } = page.template.layout.page;
    const ctx = this.newPage(w, h);
    await this.draw(ctx, await this.renderer.show(onCanvas(page)));
    for (const inset of insets) {
      const view = await this.renderer.specView(inset.spec);
      await this.draw(ctx, view, inset.x, inset.y);
      view.finalize();
    }
  }

  /** A page holding one standalone spec of the given size. */
  async addSpec(spec: VlSpec, w: number, h: number): Promise<void> {
    const ctx = this.newPage(w, h);
    const view = await this.renderer.specView(spec);
    await this.draw(ctx, view);
    view.finalize();
  }

  toBuffer(): Buffer {
    if (!this.canvas) throw new Error('PdfPages: no page was added');
    return this.canvas.toBuffer('application/pdf');
  }
}

/**
 * Canvas outputs (PNG, PDF through node-canvas) draw the logo's `raster` (a PNG at print resolution, src/sheet/logo.ts):
 * cairo would draw an SVG image as a bitmap at its own small size. SVG output keeps `url` (the cleaned SVG itself).
 */
function onCanvas(page: SheetPage): SheetPage {
  const images = page.data.images;
  if (!images || images.length === 0) return page;
  return { template: page.template, data: { ...page.data, images: images.map((r) => ({ ...r, url: r.raster })) } };
}

/**
 * vega sets globalCompositeOperation before every item it draws; on a cairo context each set costs a
 * native call. Sheets never blend, so repeated sets of the same value are skipped.
 */
function skipRepeatedCompositeMode(ctx: object): void {
  const proto = Object.getPrototypeOf(ctx) as object;
  const desc = Object.getOwnPropertyDescriptor(proto, 'globalCompositeOperation');
  if (!desc?.set || !desc.get) return;
  let current: unknown = desc.get.call(ctx);
  Object.defineProperty(ctx, 'globalCompositeOperation', {
    configurable: true,
    get: () => current,
    set(v: unknown) {
      if (v === current) return;
      current = v;
      desc.set!.call(ctx, v);
    },
  });
  // restore() brings back the saved mode inside cairo; read it back so the cache stays true
  const c = ctx as { restore(): void };
  const restore = c.restore.bind(ctx);
  c.restore = () => {
    restore();
    current = desc.get!.call(ctx);
  };
}
