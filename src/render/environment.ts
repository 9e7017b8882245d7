/**
 * The rendering environment: node-canvas with DejaVu Sans registered (it draws PNG pages), then vega
 * and vega-lite, whose text measuring is switched to the font engine (font-engine.ts) that the PDF
 * writer draws with. Without node-canvas there would be no PNG; we refuse instead.
 */
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { ERROR_CODES, PmError } from '../errors.js';
import { FONT_FAMILY } from '../chart/style.js';

type CanvasModule = typeof import('canvas');
type VegaModule = typeof import('vega');
type VegaLiteModule = typeof import('vega-lite');

export interface RenderEnvironment {
  canvas: CanvasModule;
  vega: VegaModule;
  vegaLite: VegaLiteModule;
  /** paths of the TTF files, for pdf-lib */
  fonts: { regular: string; bold: string };
}

let loading: Promise<RenderEnvironment> | undefined;

/** DejaVu Sans from the dejavu-fonts-ttf package: the same glyphs in PDF, PNG, SVG measurement and pdf-lib pages. */
export function fontPaths(): { regular: string; bold: string } {
  const require = createRequire(import.meta.url);
  const dir = join(dirname(require.resolve('dejavu-fonts-ttf/package.json')), 'ttf');
  return { regular: join(dir, 'DejaVuSans.ttf'), bold: join(dir, 'DejaVuSans-Bold.ttf') };
}

export function renderEnvironment(): Promise<RenderEnvironment> {
  loading ??= load();
  return loading;
}

async function load(): Promise<RenderEnvironment> {
  let canvas: CanvasModule;
  try {
    canvas = await import('canvas');
    if (typeof canvas.createCanvas !== 'function') throw new Error('createCanvas missing');
  } catch (e) {
    loading = undefined;
    throw new PmError(
      ERROR_CODES.environment,
      'canvas',
      `node-canvas could not be loaded (${(e as Error).message.split('\n')[0]}); sheets need it for text measurement and PNG/PDF output — reinstall with \`npm ci\` on a machine with the cairo libraries`,
      {},
      3,
    );
  }
  const fonts = fontPaths();
  canvas.registerFont(fonts.regular, { family: FONT_FAMILY, weight: 'normal' });
  canvas.registerFont(fonts.bold, { family: FONT_FAMILY, weight: 'bold' });
  const vega = await import('vega');
  const vegaLite = await import('vega-lite');
  // vega lays text out with the widths the PDF writer draws it with (font-engine.ts)
  const { FontEngine, installTextMetrics } = await import('./font-engine.js');
  installTextMetrics((vega as unknown as { textMetrics: never }).textMetrics, FontEngine.get());
  return { canvas, vega, vegaLite, fonts };
}
