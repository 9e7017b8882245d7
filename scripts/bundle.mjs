#!/usr/bin/env node
// Production bundle of the CLI (issue 12), made by `npm run build` after tsc:
//   dist/bundle/pmchart.js   the CLI entry (bin/pmchart.js imports it)
//   dist/bundle/worker.js    the render-process entry
//   dist/bundle/chunk-*.js   code split at every `await import`: drawing, chart-set reading and the
//                            report writers load only when a command reaches them. A single file
//                            (no splitting) was measured too: it compiles the render code and zod on
//                            every start and costs ~20 ms more CPU per `--help` (README, Speed).
//   dist/bundle/vendor/*.js  vega, vega-lite, pdf-lib, fontkit, zod and cli-progress, bundled once
//                            (vega + vega-lite load in ~150 ms instead of ~400 ms from node_modules)
// node-canvas is native and stays external. Source maps point at src/ (bin/pmchart.js turns them on
// with PMCHART_DEBUG=1, the only time a stack trace is printed). dist/bundle/meta.json says which
// sources went into which file; a test reads it to check what `--help`, `table` and `check` load.
// The library build (tsc → dist/index.js + .d.ts) is separate and unchanged.
import { build } from 'esbuild';
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));
const outdir = `${root}dist/bundle`;
/** Packages only drawing, chart-set files or the progress bar need: each becomes dist/bundle/vendor/<name>.js. */
const LAZY_PACKAGES = { vega: 'vega', 'vega-lite': 'vega-lite', 'pdf-lib': 'pdf-lib', '@pdf-lib/fontkit': 'fontkit', 'cli-progress': 'cli-progress', zod: 'zod' };

const common = {
  absWorkingDir: root,
  bundle: true,
  format: 'esm',
  platform: 'node',
  target: 'node20',
  minify: true,
  keepNames: true,
  sourcemap: 'linked',
  sourcesContent: false,
  legalComments: 'linked',
  external: ['canvas'],
  metafile: true,
  // CommonJS dependencies (commander, fontkit, cli-progress) call require(); ESM output has none of its own
  banner: { js: "import{createRequire as __pmRequire}from'node:module';const require=__pmRequire(import.meta.url);" },
  logLevel: 'warning',
};

/** Our code imports a lazy package → the vendor file, left as an import for Node to load when reached. */
const vendorPlugin = {
  name: 'pmchart-vendor',
  setup(b) {
    const names = Object.keys(LAZY_PACKAGES).map((n) => n.replace(/[/@.-]/g, '\\$&'));
    b.onResolve({ filter: new RegExp(`^(${names.join('|')})$`) }, (args) => ({ path: `./vendor/${LAZY_PACKAGES[args.path]}.js`, external: true }));
  },
};

rmSync(outdir, { recursive: true, force: true });
const cli = await build({
  ...common,
  outdir,
  entryPoints: { pmchart: 'src/cli/main.ts', worker: 'src/sheet/worker.ts', 'schedule-worker': 'src/cli/schedule-worker.ts' },
  splitting: true,
  chunkNames: 'chunk-[hash]',
  plugins: [vendorPlugin],
});
const vendor = await build({
  ...common,
  outdir: `${outdir}/vendor`,
  entryPoints: Object.fromEntries(Object.entries(LAZY_PACKAGES).map(([pkg, file]) => [file, pkg])),
  splitting: true,
  chunkNames: 'shared-[hash]',
  // the ESM builds, so that named imports (PDFDocument, View …) exist
  mainFields: ['module', 'main'],
});
writeFileSync(`${outdir}/meta.json`, JSON.stringify({ outputs: { ...cli.metafile.outputs, ...vendor.metafile.outputs } }));

// The live page's browser code (issue 23): src/page/app.ts with the library it calls, vega, vega-lite and
// vega-interpreter, one minified IIFE in dist/page/browser.js. `pmchart page` only reads this file and fills
// in the presets, so an installed pmchart writes pages from any folder without esbuild (a dev dependency).
// Node-only modules are replaced by the small stand-ins in src/page/ (no-render, virtual-fs, path-shim).
const pageSrc = `${root}src/page`;
const pageStubs = /\/(render\/renderer|render\/environment|sheet\/book|sheet\/files|io\/files|sheet\/check-report-file|sheet\/pipeline|cli\/contour-plot)\.(js|ts)$/;
const page = await build({
  absWorkingDir: root,
  entryPoints: [`${pageSrc}/app.ts`],
  bundle: true,
  write: false,
  format: 'iife',
  platform: 'browser',
  target: 'es2020',
  minify: true,
  legalComments: 'eof',
  charset: 'utf8',
  logLevel: 'warning',
  // the page has no environment: a fixed date comes from its own field
  define: { 'process.env.NODE_ENV': '"production"', 'process.env.SOURCE_DATE_EPOCH': 'undefined' },
  // csv-parse's browser build carries its own Buffer; the Node build expects the global one
  alias: { 'node:fs': `${pageSrc}/virtual-fs.ts`, 'node:path': `${pageSrc}/path-shim.ts`, 'csv-parse/sync': 'csv-parse/browser/esm/sync' },
  plugins: [
    {
      name: 'pmchart-page-stubs',
      setup(b) {
        b.onResolve({ filter: /\.(js|ts)$/ }, (args) => {
          if (!args.path.startsWith('.')) return undefined;
          const full = new URL(args.path, `file://${args.resolveDir}/`).pathname;
          return pageStubs.test(full) ? { path: `${pageSrc}/no-render.ts` } : undefined;
        });
      },
    },
  ],
});
mkdirSync(`${root}dist/page`, { recursive: true });
// `</script` inside the bundle would end the page's script element early
writeFileSync(`${root}dist/page/browser.js`, page.outputFiles[0].text.replace(/<\/script/gi, '<\\/script'));
