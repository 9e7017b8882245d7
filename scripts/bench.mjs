#!/usr/bin/env node
// `npm run bench`: prints speed and memory figures side by side. Never asserts; tests do not time anything.
// Each file in scripts/bench/ exports `name` and `run()`, which returns rows { figure, value, unit, target }.
// `npm run bench -- <group>` runs the groups whose name contains <group>; PMCHART_BENCH_QUICK=1 (or --quick)
// runs reduced batches (scripts/bench/lib/quick.mjs). The last column says whether a numeric target is met.
import { readdirSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import { QUICK } from './bench/lib/quick.mjs';
import { fileURLToPath } from 'node:url';

const here = fileURLToPath(new URL('.', import.meta.url));
execFileSync('npm', ['run', '--silent', 'build'], { cwd: `${here}/..`, stdio: 'inherit' });

const only = process.argv.slice(2).find((a) => !a.startsWith('--'));
const files = readdirSync(`${here}/bench`).filter((f) => f.endsWith('.mjs')).sort();
const rows = [];
for (const f of files) {
  const mod = await import(`./bench/${f}`);
  if (only && !only.split(',').some((o) => mod.name.includes(o))) continue;
  process.stderr.write(`bench: ${mod.name}…\n`);
  for (const r of await mod.run()) rows.push({ group: mod.name, ...r });
}
/** 'met' or 'MISSED' for a numeric value against a target written '≤ x' or '≥ x' in the row's unit; '' otherwise. */
function verdict(r) {
  if (QUICK) return '(quick run)';
  const m = /^([≤≥])\s*([\d.,]+)\s*(\S*)$/.exec(String(r.target ?? '').trim());
  if (!m || typeof r.value !== 'number' || !Number.isFinite(r.value)) return '';
  if (m[3] && m[3] !== r.unit && !(m[3] === 's' && r.unit === 's')) return '';
  const limit = Number(m[2].replace(/,/g, ''));
  return (m[1] === '≤' ? r.value <= limit : r.value >= limit) ? 'met' : 'MISSED';
}
const w = (s, n) => String(s).padEnd(n);
console.log(`${w('group', 10)} ${w('figure', 70)} ${w('value', 12)} ${w('unit', 10)} ${w('target', 26)} verdict`);
for (const r of rows) {
  const v = typeof r.value === 'number' ? (Math.abs(r.value) >= 100 ? r.value.toFixed(0) : r.value.toPrecision(3)) : r.value;
  console.log(`${w(r.group, 10)} ${w(r.figure, 70)} ${w(v, 12)} ${w(r.unit, 10)} ${w(r.target ?? '', 26)} ${verdict(r)}`);
}
console.log(`peak RSS of the bench process: ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB`);
