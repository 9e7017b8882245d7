/**
 * Big inputs within the caps finish with bounded memory (issue 14). Memory is measured by running
 * the built CLI under a V8 heap cap (--max-old-space-size), never by timing: before the fix the
 * 2,000-curve table built one string of every row (and a c/h sweep of 6,374 rows per curve),
 * the 200k-row load file went through a hand-written splitter and spread arguments, and `check`
 * held every result and one string of its whole output (it died under the 128 MB cap below).
 */
import { closeSync, existsSync, mkdtempSync, openSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { spawn, spawnSync } from 'node:child_process';
import { createInterface } from 'node:readline';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { bin, requireFreshBuild } from '../helpers/built.js';
import { MAX_DRAWN_REPORT_LOADS } from '../../src/input/limits.js';

const dist = new URL('../../dist/input/loads-csv.js', import.meta.url).pathname;
const dir = mkdtempSync(join(tmpdir(), 'pmchart-big-'));

/** 200,000 invented loads: Pu = 100 + (i mod 500) kip, Mu = 50 + (i mod 300) kip-ft. */
let bigLoadsFile: string | undefined;
function bigLoads(): string {
  if (bigLoadsFile) return bigLoadsFile;
  const rows = ['id,Pu kip,Mu [kip-ft]'];
  for (let i = 0; i < 200_000; i++) rows.push(`L${i},${100 + (i % 500)},${50 + (i % 300)}`);
  bigLoadsFile = join(dir, 'loads.csv');
  writeFileSync(bigLoadsFile, `${rows.join('\n')}\n`);
  return bigLoadsFile;
}

/** Runs the built CLI with a heap cap, handing each line of its output to `line` as it comes (nothing is held). */
function runLines(heapMB: number, args: string[], line: (l: string) => void): Promise<{ status: number | null; signal: string | null; stderr: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [`--max-old-space-size=${heapMB}`, bin, ...args], { stdio: ['ignore', 'pipe', 'pipe'] });
    let stderr = '';
    child.stderr.setEncoding('utf8').on('data', (d: string) => (stderr += d.slice(0, 2000)));
    createInterface({ input: child.stdout }).on('line', line);
    child.on('close', (status, signal) => resolve({ status, signal, stderr }));
  });
}

/** A short column check: 20 × 20 in, two faces, γ = 0.8, no bar proposals (the per-load work stays small). */
const CHECK = ['check', '--fc', '4', '--fy', '60', '--b', '20', '--h', '20', '--gamma', '0.8', '--proposals', '0'];

describe('big inputs within the caps', () => {
  beforeAll(requireFreshBuild);
  it('a 2,000-value ρg table streams under a 48 MB heap, CSV and JSON', () => {
    const rhos = Array.from({ length: 2000 }, (_, i) => Number((0.001 + i * 0.0000495).toFixed(7)));
    for (const format of ['csv', 'json']) {
      const file = join(dir, `table.${format}`);
      const fd = openSync(file, 'w');
      const r = spawnSync(process.execPath, ['--max-old-space-size=48', bin, 'table', '--fc', '4', '--fy', '60', '--gamma', '0.8', '--rho', rhos.join(','), '--format', format], { stdio: ['ignore', fd, 'pipe'], encoding: 'utf8' });
      closeSync(fd);
      expect(r.stderr).toBe('');
      expect(r.status).toBe(0);
      expect(statSync(file).size).toBeGreaterThan(50e6);
      if (format === 'csv') {
        const text = readFileSync(file, 'utf8');
        const last = text.slice(text.lastIndexOf('\n', text.length - 2) + 1).trim().split(',').map(Number);
        expect(last[0]).toBe(rhos[1999]);
        expect(last.every(Number.isFinite)).toBe(true);
      }
    }
  }, 300_000);

  it('a 200,000-row load file is read under a 160 MB heap, every load finite', () => {
    const file = bigLoads();
    const script = `import { readFileSync } from 'node:fs';
      const { parseLoadsCsv } = await import(${JSON.stringify(dist)});
      const loads = parseLoadsCsv(readFileSync(${JSON.stringify(file)}, 'utf8'), 'us');
      process.stdout.write(String(loads.length) + ' ' + loads.every((l) => Number.isFinite(l.Pu) && Number.isFinite(l.Mu)));`;
    const r = spawnSync(process.execPath, ['--max-old-space-size=160', '--input-type=module', '-e', script], { encoding: 'utf8' });
    expect(r.stderr).toBe('');
    expect(r.stdout).toBe('200000 true');
  }, 300_000);

  // Before check streamed, 200k loads took 0.83 GB RSS for the table and 1.8 GB for --json, and both
  // died under this heap cap. L1499 has the largest Pu (599 kip) and the largest Mu (349 kip-ft) of
  // the file, in the compression-controlled range, so it needs the most steel (common practice: above
  // the balanced point the capacity curve falls as P rises); L2999, L4499, … repeat it and follow in
  // input order.
  it('a 200,000-row load file: the check table streams under a 128 MB heap, governing load first', async () => {
    let rows = 0;
    const first: string[] = [];
    let summary = '';
    const r = await runLines(128, [...CHECK, '--loads', bigLoads()], (l) => {
      const m = /^(\* )?(L\d+) /.exec(l);
      if (m) {
        rows++;
        if (first.length < 3) first.push(`${m[1] ?? ''}${m[2]}`);
      } else if (l.startsWith('Summary: ')) summary = l;
    });
    expect(r.stderr).toBe('');
    expect(r.signal).toBe(null);
    expect(r.status).toBe(0);
    expect(rows).toBe(200_000);
    expect(first).toEqual(['* L1499', 'L2999', 'L4499']);
    expect(summary).toBe('Summary: all 200000 loads pass; governing L1499.');
  }, 300_000);

  it('a 200,000-row load file: the check JSON streams under a 128 MB heap and parses', async () => {
    const head: string[] = [];
    const tail: string[] = [];
    const firstTwo: string[][] = [];
    let part: 'head' | 'results' | 'tail' = 'head';
    let elements = 0;
    const r = await runLines(128, [...CHECK, '--loads', bigLoads(), '--json'], (l) => {
      if (part === 'head') {
        head.push(l);
        if (l === ' "results": [') part = 'results';
      } else if (part === 'results') {
        if (l === ' ],') {
          part = 'tail';
          tail.push(',');
        } else {
          if (l === '  {') elements++;
          if (elements <= 2) (firstTwo[elements - 1] ??= []).push(l);
        }
      } else tail.push(l);
    });
    expect(r.stderr).toBe('');
    expect(r.signal).toBe(null);
    expect(r.status).toBe(0);
    expect(elements).toBe(200_000);
    // the document without its results array, and its first two results, each parse as JSON
    const doc = JSON.parse(`${head.join('\n')}]${tail.join('\n')}`);
    expect(doc.summary.total).toBe(200_000);
    expect(doc.governing).toBe('L1499');
    expect(doc.exitCode).toBe(0);
    const [a, b] = firstTwo.map((lines) => JSON.parse(lines.join('\n').replace(/,$/, '')));
    expect([a.id, a.governing, b.id, b.governing]).toEqual(['L1499', true, 'L2999', false]);
    expect(a.rhoRequired).toBe(b.rhoRequired);
  }, 300_000);

  it('a drawn report above its load cap is refused in one line, exit 2, before any check', () => {
    const rows = ['id,Pu,Mu'];
    for (let i = 0; i <= MAX_DRAWN_REPORT_LOADS; i++) rows.push(`L${i},100,50`);
    const file = join(dir, 'drawn.csv');
    writeFileSync(file, `${rows.join('\n')}\n`);
    const report = join(dir, 'drawn.pdf');
    const r = spawnSync(process.execPath, [bin, 'check', '--fc', '4', '--fy', '60', '--b', '20', '--h', '20', '--gamma', '0.8', '--loads', file, '--report', report], { encoding: 'utf8' });
    expect(r.stderr).toBe(`pmchart: --report: draws at most ${MAX_DRAWN_REPORT_LOADS} loads and --loads has ${MAX_DRAWN_REPORT_LOADS + 1}; write a .txt or .json report for every load\n`);
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(existsSync(report)).toBe(false);
  }, 120_000);

  it('one row beyond the cap is refused before any check', () => {
    const rows = ['id,Pu,Mu'];
    for (let i = 0; i <= 200_000; i++) rows.push(`L${i},1,1`);
    const file = join(dir, 'too-many.csv');
    writeFileSync(file, `${rows.join('\n')}\n`);
    const r = spawnSync(process.execPath, [bin, 'check', '--fc', '4', '--fy', '60', '--b', '20', '--h', '20', '--gamma', '0.8', '--loads', file], { encoding: 'utf8' });
    expect(r.stderr).toBe('pmchart: --loads: has more than 200000 load rows (allowed: 1–200000 rows)\n');
    expect(r.status).toBe(2);
  }, 120_000);
});
