#!/usr/bin/env node
// `npm run bench`: prints speed and memory figures side by side. Never asserts; tests do not time anything.
// Each file in scripts/bench/ exports `name` and `run()`, which returns rows { figure, value, unit, target }.
import { readdirSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

const here = fileURLToPath(new URL('.', import.meta.url));
execFileSync('npm', ['run', '--silent', 'build'], { cwd: `${here}/..`, stdio: 'inherit' });

const only = process.argv[2];
const files = readdirSync(`${here}/bench`).filter((f) => f.endsWith('.mjs')).sort();
const rows = [];
for (const f of files) {
  const mod = await import(`./bench/${f}`);
  if (only && !mod.name.includes(only)) continue;
  process.stderr.write(`bench: ${mod.name}…\n`);
  for (const r of await mod.run()) rows.push({ group: mod.name, ...r });
}
const w = (s, n) => String(s).padEnd(n);
console.log(`${w('group', 10)} ${w('figure', 58)} ${w('value', 12)} ${w('unit', 10)} target`);
for (const r of rows) {
  const v = typeof r.value === 'number' ? (Math.abs(r.value) >= 100 ? r.value.toFixed(0) : r.value.toPrecision(3)) : r.value;
  console.log(`${w(r.group, 10)} ${w(r.figure, 58)} ${w(v, 12)} ${w(r.unit, 10)} ${r.target ?? ''}`);
}
console.log(`peak RSS of the bench process: ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB`);
