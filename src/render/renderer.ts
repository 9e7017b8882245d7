/**
 * Spec → bytes. One compiled vega View per distinct template; each sheet only swaps its datasets
 * (compiling costs ~45 ms, a data swap a few). PDF pages are written by our own writer: vega's canvas
 * renderer draws the scenegraph into a PdfCanvas (pdf-canvas.ts) through `externalContext`, and
 * pdf-writer.ts binds the pages with each font subset once. SVG is vega's SVG renderer; node-canvas
 * draws PNG only.
 */
import type { View } from 'vega';
import { datasetNames, sheetTemplate, type VlSpec } from '../chart/spec.js';
import type { SheetData, TemplateParams } from '../chart/sheet-data.js';
import { renderEnvironment, type RenderEnvironment } from './environment.js';
import { FontEngine } from './font-engine.js';
import { PdfCanvas, type PageContent } from './pdf-canvas.js';
import { PdfWriter } from './pdf-writer.js';

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

  private readonly engine = FontEngine.get();
  /** Text widths in points with the sheet typeface, as vega measures and the PDF writer draws them (chart/ labels.ts MeasureText). */
  readonly measureText = (text: string, fontSize: number, bold: boolean): number => this.engine.width(text, fontSize, bold);

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
 * Vector pages from vega views: each page is vega's scenegraph drawn into a PdfCanvas (our writer's
 * Canvas 2D front). `pages()` hands the pages on as data (a render process sends them to the book
 * writer); `toBytes()` writes them as one PDF, fonts subset once. Metadata is left to the caller.
 */
export class PdfPages {
  private readonly done: PageContent[] = [];

  constructor(private readonly renderer: SheetRenderer) {
    markSegments(renderer.env.vega);
  }

  get count(): number {
    return this.done.length;
  }

  /** Draws a view at (x, y): vega scales and translates an external context from its current transform. */
  private async draw(ctx: PdfCanvas, view: View, x = 0, y = 0): Promise<void> {
    ctx.save();
    if (x !== 0 || y !== 0) ctx.translate(x, y);
    await view.toCanvas(1, { externalContext: ctx } as never);
    ctx.restore();
  }

  async add(page: SheetPage, insets: readonly Inset[] = []): Promise<void> {
    const { w, h } = page.template.layout.page;
    const ctx = new PdfCanvas(w, h);
    await this.draw(ctx, await this.renderer.show(onCanvas(page)));
    for (const inset of insets) {
      const view = await this.renderer.specView(inset.spec);
      await this.draw(ctx, view, inset.x, inset.y);
      view.finalize();
    }
    this.done.push(ctx.finish());
  }

  /** A page holding one standalone spec of the given size. */
  async addSpec(spec: VlSpec, w: number, h: number): Promise<void> {
    const ctx = new PdfCanvas(w, h);
    const view = await this.renderer.specView(spec);
    await this.draw(ctx, view);
    view.finalize();
    this.done.push(ctx.finish());
  }

  /** The pages drawn so far, as data. */
  pages(): PageContent[] {
    return [...this.done];
  }

  /** The pages as one PDF document (fonts once); `meta` sets its fixed metadata. */
  async toBytes(meta?: (doc: PdfWriter['doc']) => void): Promise<Uint8Array> {
    if (this.done.length === 0) throw new Error('PdfPages: no page was added');
    const writer = await PdfWriter.create();
    for (const p of this.done) writer.addPage(p);
    meta?.(writer.doc);
    return writer.save();
  }
}

/**
 * Canvas and PDF outputs draw the logo's `raster` (a PNG at print resolution, src/sheet/logo.ts): node-canvas
 * would load an SVG image as a bitmap at its own small size. SVG output keeps `url` (the cleaned SVG itself).
 */
function onCanvas(page: SheetPage): SheetPage {
  const images = page.data.images;
  if (!images || images.length === 0) return page;
  return { template: page.template, data: { ...page.data, images: images.map((r) => ({ ...r, url: r.raster })) } };
}

/**
 * Each mark vega draws into a PdfCanvas becomes a segment (pdf-canvas.ts), which the writer can share
 * between pages as a form XObject. vega's canvas renderer draws every mark through `draw`; a PNG's cairo
 * context passes through untouched.
 */
function markSegments(vega: RenderEnvironment['vega']): void {
  type Draw = (this: unknown, ctx: unknown, scene: { marktype: string }, ...rest: unknown[]) => void;
  const proto = (vega as unknown as { CanvasRenderer: { prototype: { draw: Draw; pmchartSegments?: true } } }).CanvasRenderer.prototype;
  if (proto.pmchartSegments) return;
  const draw = proto.draw;
  proto.draw = function (this: unknown, ctx, scene, ...rest) {
    if (!(ctx instanceof PdfCanvas) || scene.marktype === 'group') return draw.call(this, ctx, scene, ...rest);
    ctx.beginSegment();
    try {
      draw.call(this, ctx, scene, ...rest);
    } finally {
      ctx.endSegment();
    }
  };
  proto.pmchartSegments = true;
}
