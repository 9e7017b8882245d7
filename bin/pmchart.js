#!/usr/bin/env node
// Thin launcher: the compiled CLI lives in dist/ (npm run build).
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

const entry = new URL('../dist/cli/main.js', import.meta.url);
if (!existsSync(fileURLToPath(entry))) {
  process.stderr.write('pmchart: dist/ is missing; run `npm run build` (or `npm test`, which builds) first\n');
  process.exit(2);
}
const { main } = await import(entry.href);
await main(process.argv);
