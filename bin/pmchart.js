#!/usr/bin/env node
// Thin launcher: the CLI runs from the production bundle in dist/bundle/ (npm run build: tsc, then
// scripts/bundle.mjs). With PMCHART_DEBUG=1 stack traces are printed, mapped back to src/.
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const entry = new URL('../dist/bundle/pmchart.js', import.meta.url);
if (!existsSync(fileURLToPath(entry))) {
  process.stderr.write('pmchart: dist/bundle/ is missing; run `npm run build` (or `npm test`, which builds) first\n');
  process.exit(2);
}
if (process.env.PMCHART_DEBUG) process.setSourceMapsEnabled(true);
const { main } = await import(entry.href);
await main(process.argv);
