/**
 * The office logo as the renderers take it (chart/sheet-data.ts LogoRef): `url` for SVG output (the cleaned SVG,
 * or the PNG, as a data URI: the SVG stays vector there) and `raster`, a PNG at print resolution that canvas
 * outputs (PNG sheets, node-canvas PDF pages) and pdf-lib pages (cover, index) draw. node-canvas would draw an
 * SVG image as a bitmap at the SVG's own size, so the SVG is drawn once at LOGO_RASTER_PX here and scaled down
 * on the page. A writer that draws SVG as vectors can take `url` instead (see README, "Office identity").
 */
import type { LogoRef } from '../chart/sheet-data.js';
import type { ResolvedLogo } from '../config/logo.js';
import { ERROR_CODES, PmError } from '../errors.js';
import { renderEnvironment } from '../render/environment.js';

/**
 * Longer side of the raster, pixels: the title block's logo box is at most about 160 pt wide (tabloid), so
 * 1200 px is about 540 dpi there, and over 300 dpi in any box up to 4 in wide.
 */
export const LOGO_RASTER_PX = 1200;

const made = new Map<string, Promise<LogoRef>>();

/** The logo as URL and raster; a file canvas cannot decode is exit 2 naming `at` (`titleBlock.logo`, `--logo`). */
export function logoRef(logo: ResolvedLogo, at = 'titleBlock.logo'): Promise<LogoRef> {
  let p = made.get(logo.dataUri);
  if (!p) {
    p = rasterise(logo, at);
    made.set(logo.dataUri, p);
    p.catch(() => made.delete(logo.dataUri));
  }
  return p;
}

async function rasterise(logo: ResolvedLogo, at: string): Promise<LogoRef> {
  if (logo.kind === 'png') return { url: logo.dataUri, raster: logo.dataUri };
  const { canvas } = await renderEnvironment();
  const k = LOGO_RASTER_PX / Math.max(logo.width, logo.height);
  const w = Math.max(1, Math.round(logo.width * k));
  const h = Math.max(1, Math.round(logo.height * k));
  // the SVG drawn at the raster's size (its width and height set so), not a small bitmap scaled up
  const svg = Buffer.from(logo.dataUri.slice(logo.dataUri.indexOf(',') + 1), 'base64').toString('utf8');
  const sized = svg.replace(/<svg\b([^>]*)>/i, (_, attrs: string) => `<svg${attrs.replace(/\s(width|height)\s*=\s*("[^"]*"|'[^']*')/gi, '')} width="${w}" height="${h}">`);
  let img: import('canvas').Image;
  try {
    img = await canvas.loadImage(Buffer.from(sized, 'utf8'));
  } catch (e) {
    throw new PmError(ERROR_CODES.invalidValue, at, `is an SVG that cannot be drawn (${(e as Error).message})`);
  }
  const c = canvas.createCanvas(w, h);
  c.getContext('2d').drawImage(img, 0, 0, w, h);
  return { url: logo.dataUri, raster: `data:image/png;base64,${c.toBuffer('image/png', { compressionLevel: 9 }).toString('base64')}` };
}

/** Checks that the logo draws (before any work is written), so a broken file is exit 2, not a failed book. */
export async function checkLogo(logo: ResolvedLogo | undefined, at = 'titleBlock.logo'): Promise<void> {
  if (!logo) return;
  const ref = await logoRef(logo, at);
  if (logo.kind === 'png') {
    const { canvas } = await renderEnvironment();
    try {
      await canvas.loadImage(ref.raster);
    } catch (e) {
      throw new PmError(ERROR_CODES.invalidValue, at, `is a PNG that cannot be read (${(e as Error).message})`);
    }
  }
}
