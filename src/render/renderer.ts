/**
 * Spec → bytes. One compiled vega View per distinct template; each sheet only swaps its datasets
 * (compiling costs ~45 ms, a data swap a few). Vector PDF pages go into one node-canvas PDF surface
 * through `externalContext`, with text kept as glyphs so the PDF stays searchable.
 */
import type { View } from 'vega';
import { DATASET_NAMES, sheetTemplate } from '../chart/spec.js';
import type { SheetData, TemplateParams } from '../chart/sheet-data.js';
import { renderEnvironment, type RenderEnvironment } from './environment.js';

export interface SheetPage {
  template: TemplateParams;
  data: SheetData;
}

export class SheetRenderer {
  private readonly views = new Map<string, View>();
  private current: { view: View; data: SheetData } | undefined;

  private constructor(readonly env: RenderEnvironment) {}

  static async create(): Promise<SheetRenderer> {
    return new SheetRenderer(await renderEnvironment());
  }

  /** Runs the view of this template on this sheet's data. */
  async show(page: SheetPage): Promise<View> {
    const spec = sheetTemplate(page.template);
    const key = JSON.stringify(spec);
    let view = this.views.get(key);
    if (!view) {
      const { vega, vegaLite } = this.env;
      const compiled = vegaLite.compile({ ...spec, datasets: Object.fromEntries(DATASET_NAMES.map((n) => [n, []])) } as never).spec;
      view = new vega.View(vega.parse(compiled), { renderer: 'none' });
      this.views.set(key, view);
    }
    if (this.current?.view !== view || this.current.data !== page.data) {
      // vega tags ingested tuples, so each swap gets fresh row objects
      for (const name of DATASET_NAMES) view.data(name, page.data[name].map((r) => ({ ...r })));
      await view.runAsync();
      this.current = { view, data: page.data };
    }
    return view;
  }

  async svg(page: SheetPage): Promise<string> {
    const view = await this.show(page);
    return view.toSVG();
  }

  async png(page: SheetPage, scale: number): Promise<Buffer> {
    const view = await this.show(page);
    const canvas = (await view.toCanvas(scale)) as unknown as import('canvas').Canvas;
    return canvas.toBuffer('image/png', { compressionLevel: 6 });
  }

  /** A vector PDF surface that takes pages one by one (see PdfPages). */
  pdfPages(): PdfPages {
    return new PdfPages(this);
  }

  finalize(): void {
    for (const v of this.views.values()) v.finalize();
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

  async add(page: SheetPage): Promise<void> {
    const { w, h } = page.template.layout.page;
    if (!this.canvas || !this.ctx) {
      this.canvas = this.renderer.env.canvas.createCanvas(w, h, 'pdf');
      this.ctx = this.canvas.getContext('2d');
    } else {
      (this.ctx as unknown as { addPage(w: number, h: number): void }).addPage(w, h);
    }
    const ctx = this.ctx;
    ctx.textDrawingMode = 'glyph';
    const view = await this.renderer.show(page);
    ctx.save();
    await view.toCanvas(1, { externalContext: ctx } as never);
    ctx.restore();
    this.count++;
  }

  toBuffer(): Buffer {
    if (!this.canvas) throw new Error('PdfPages: no page was added');
    return this.canvas.toBuffer('application/pdf');
  }
}
