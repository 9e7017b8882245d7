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

  /**
   * Renders pages into one vector PDF (page size from the first template). `onPage` reports progress.
   * Metadata is left to the binder (src/sheet/book.ts), which fixes dates for deterministic output.
   */
  async pdf(pages: Iterable<SheetPage> | AsyncIterable<SheetPage>, onPage?: (n: number) => void): Promise<Buffer> {
    let canvas: import('canvas').Canvas | undefined;
    let ctx: import('canvas').CanvasRenderingContext2D | undefined;
    let n = 0;
    for await (const page of pages) {
      const { w, h } = page.template.layout.page;
      if (!canvas || !ctx) {
        canvas = this.env.canvas.createCanvas(w, h, 'pdf');
        ctx = canvas.getContext('2d');
      } else {
        (ctx as unknown as { addPage(w: number, h: number): void }).addPage(w, h);
      }
      ctx.textDrawingMode = 'glyph';
      const view = await this.show(page);
      ctx.save();
      await view.toCanvas(1, { externalContext: ctx } as never);
      ctx.restore();
      onPage?.(++n);
    }
    if (!canvas) throw new Error('pdf() needs at least one page');
    return canvas.toBuffer('application/pdf');
  }

  finalize(): void {
    for (const v of this.views.values()) v.finalize();
    this.views.clear();
    this.current = undefined;
  }
}
