/**
 * Writes the live page: one self-contained HTML file. The browser code (app.ts with the library it calls)
 * is bundled with esbuild together with vega, vega-lite and vega-interpreter; node-only modules are
 * replaced by the small stand-ins beside this file. The Content-Security-Policy allows exactly the one
 * inline script and the one inline style by their sha256 hashes, images from data: and blob:, and no
 * connections. Same presets → same bytes.
 */
import { createHash } from 'node:crypto';
import { existsSync } from 'node:fs';
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
/** A page module, as compiled (dist/page/*.js) or as source (src/page/*.ts under tsx). */
const sibling = (stem: string): string => {
  const self = dirname(fileURLToPath(import.meta.url));
  if (existsSync(join(self, `${stem}.ts`))) return join(self, `${stem}.ts`);
  return join(packageRoot(), 'dist', 'page', `${stem}.js`);
};

/** The browser bundle (IIFE), minified. */
export async function bundlePage(): Promise<string> {
  let esbuild: typeof import('esbuild');
  try {
    esbuild = await import('esbuild');
  } catch {
    throw new PmError(ERROR_CODES.environment, 'page', 'needs the esbuild dev dependency; run `npm install` in the pmchart folder', {}, 3);
  }
  const stubs = /\/(render\/renderer|render\/environment|sheet\/book|sheet\/files|io\/files|sheet\/check-report-file|sheet\/pipeline|cli\/contour-plot)\.(js|ts)$/;
  const result = await esbuild.build({
    entryPoints: [sibling('app')],
    // esbuild resolves alias targets (csv-parse's browser build) in the working folder: the package's own,
    // not the user's (from any other folder the page failed with "Could not resolve csv-parse/browser/esm/sync")
    absWorkingDir: packageRoot(),
    bundle: true,
    write: false,
    format: 'iife',
    platform: 'browser',
    target: 'es2020',
    minify: true,
    legalComments: 'eof',
    charset: 'utf8',
    logLevel: 'silent',
    // the page has no environment: a fixed date comes from its own field
    define: { 'process.env.NODE_ENV': '"production"', 'process.env.SOURCE_DATE_EPOCH': 'undefined' },
    // csv-parse's browser build carries its own Buffer; the Node build expects the global one
    alias: { 'node:fs': sibling('virtual-fs'), 'node:path': sibling('path-shim'), 'csv-parse/sync': 'csv-parse/browser/esm/sync' },
    plugins: [
      {
        name: 'pmchart-page-stubs',
        setup(b) {
          b.onResolve({ filter: /\.(js|ts)$/ }, (args) => {
            if (!args.path.startsWith('.')) return undefined;
            const full = new URL(args.path, `file://${args.resolveDir}/`).pathname;
            return stubs.test(full) ? { path: sibling('no-render') } : undefined;
          });
        },
      },
    ],
  });
  // `</script` inside the bundle would end the element early
  return result.outputFiles[0]!.text.replace(/<\/script/gi, '<\\/script');
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
