/**
 * Writes the live page: one self-contained HTML file. The browser code (app.ts with the library it calls,
 * vega, vega-lite and vega-interpreter) is bundled once by `npm run build` (scripts/bundle.mjs) into
 * dist/page/browser.js; here it is only read and wrapped with the presets, so an installed pmchart writes
 * pages from any folder and needs no bundler. The Content-Security-Policy allows exactly the one inline
 * script and the one inline style by their sha256 hashes, images from data: and blob:, and no
 * connections. Same presets → same bytes.
 */
import { createHash } from 'node:crypto';
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ERROR_CODES, PmError } from '../errors.js';
import { generatorLabel } from '../version.js';
import { PAGE_CSS, esc, pageBody } from './markup.js';

export interface PagePresets {
  /** field values by option key, as the flags gave them */
  fields: Record<string, string | boolean>;
  /** γ grid of the "between sheets" view */
  grid?: number;
  /** date on the chart's title block */
  date: string;
}

/** The package root: the nearest folder above this module holding package.json (this module may run from src/page, dist/page or the CLI bundle in dist/bundle). */
function packageRoot(): string {
  let dir = dirname(fileURLToPath(import.meta.url));
  while (!existsSync(join(dir, 'package.json')) && dirname(dir) !== dir) dir = dirname(dir);
  return dir;
}

/** Where `npm run build` writes the page's browser bundle, relative to the package root. */
export const PAGE_BUNDLE = 'dist/page/browser.js';

/** The browser bundle (IIFE, minified, `</script` already escaped), as `npm run build` wrote it. */
export function bundlePage(): string {
  const file = join(packageRoot(), PAGE_BUNDLE);
  try {
    return readFileSync(file, 'utf8');
  } catch (e) {
    throw new PmError(ERROR_CODES.environment, 'page', `the page's browser code ${PAGE_BUNDLE} cannot be read (${(e as NodeJS.ErrnoException).code ?? 'error'}); run \`npm run build\` in the pmchart folder`, { value: file }, 3);
  }
}

const sha256 = (text: string): string => `'sha256-${createHash('sha256').update(text, 'utf8').digest('base64')}'`;

/** The whole page around a bundle. */
export function pageHtml(bundle: string, presets: PagePresets, caution: string): string {
  const css = PAGE_CSS;
  const json = JSON.stringify(presets).replace(/</g, '\\u003c');
  const csp = [
    "default-src 'none'",
    "connect-src 'none'",
    `script-src ${sha256(bundle)}`,
    `style-src ${sha256(css)}`,
    'img-src data: blob:',
    "base-uri 'none'",
    "form-action 'none'",
  ].join('; ');
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="${esc(csp)}">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="generator" content="${esc(generatorLabel())}">
<title>pmchart live chart</title>
<style>${css}</style>
</head>
<body>
${pageBody(caution)}
<script type="application/json" id="pmchart-presets">${json}</script>
<script>${bundle}</script>
</body>
</html>
`;
}
