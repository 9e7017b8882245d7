/**
 * Section flags through the zod flag schema (issue 14): one line naming the flag, exit 2, the same
 * limits as chart-set files, repeated flags refused, custom-bar files checked entry by entry.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers/run-cli.js';

const base = ['table', '--fc', '4', '--fy', '60', '--rho', '0.02'];
const dir = mkdtempSync(join(tmpdir(), 'pmchart-flags-'));
const manyBars = join(dir, 'many.json');
const file = (name: string, text: string) => {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
};

describe('flag problems: one line naming the flag, exit 2', () => {
  const cases: [string, string[], string][] = [
    ['hex γ is not read as 1', [...base, '--gamma', '0x1'], 'pmchart: --gamma: 0x1 is not a decimal number'],
    ['empty γ is not 0', [...base, '--gamma', ''], 'pmchart: --gamma: "" is not a decimal number'],
    ['γ Infinity', [...base, '--gamma', 'Infinity'], 'pmchart: --gamma: Infinity is not a decimal number'],
    ['repeated flag', [...base, '--gamma', '0.8', '--fc', '5'], 'pmchart: --fc: is given more than once; give it once'],
    ['repeated flag with =', ['table', '--fc=4', '--fy', '60', '--fc=5', '--gamma', '0.8'], 'pmchart: --fc: is given more than once; give it once'],
    ['bars per face beyond the chart-set limit', [...base, '--gamma', '0.8', '--bars-per-face', '25'], 'pmchart: --bars-per-face: 25 is outside 1–20'],
    ['ring bars beyond the chart-set limit', [...base, '--gamma', '0.8', '--shape', 'circle', '--arrangement', 'ring', '--bars', '50'], 'pmchart: --bars: 50 is outside 4–48'],
    ['bars per face not whole', [...base, '--gamma', '0.8', '--bars-per-face', '2.5'], 'pmchart: --bars-per-face: 2.5 is not a whole number or two whole numbers "nb,nh"'],
    ['long quantity', ['table', '--fc', '1'.repeat(4000), '--fy', '60', '--gamma', '0.8'], 'pmchart: --fc: is longer than 64 characters'],
    ['ρg not increasing', [...base.slice(0, 5), '--rho', '0.05,0.01', '--gamma', '0.8'], 'pmchart: --rho: 0.01 must be larger than the value before it'],
    ['ρg repeated', [...base.slice(0, 5), '--rho', '0.02,0.02', '--gamma', '0.8'], 'pmchart: --rho: 0.02 must be larger than the value before it'],
    ['γc out of range', [...base, '--code', 'en1992-1-1', '--gamma', '0.8', '--gamma-c', '3'], 'pmchart: --gamma-c: 3 is outside 1–2'],
    ['custom bars [null, null]', [...base, '--arrangement', 'custom', '--custom-bars', file('nulls.json', '[null,null]')], 'pmchart: --custom-bars[0]: must be an object'],
    ['custom bar share 1e308', [...base, '--arrangement', 'custom', '--custom-bars', file('huge.json', '[{"y":-0.4,"share":1e308},{"y":0.4}]')], 'pmchart: --custom-bars[0].share: 1e+308 is above 1000000'],
    [
      '200k custom bars',
      [...base, '--arrangement', 'custom', '--custom-bars', file(manyBars.slice(dir.length + 1), JSON.stringify(Array.from({ length: 200_000 }, (_, i) => ({ y: (i % 2) - 0.5 })).map((b) => ({ y: b.y * 0.8 }))))],
      `pmchart: --custom-bars: ${manyBars} is larger than 1048576 bytes`,
    ],
    ['2,000 custom bars', [...base, '--arrangement', 'custom', '--custom-bars', file('k2.json', JSON.stringify(Array.from({ length: 2000 }, (_, i) => ({ y: i % 2 ? 0.4 : -0.4 }))))], 'pmchart: --custom-bars: holds more than 1000 values'],
  ];
  for (const [what, args, line] of cases) {
    it(what, async () => {
      const r = await runCli(args);
      expect(r.stderr).toBe(`${line}\n`);
      expect(r.code).toBe(2);
      expect(r.stdout).toBe('');
    });
  }
});

describe('table work is bounded before it starts', () => {
  it('refuses 9,901 curves (--rho 0.001:0.1:0.00001)', async () => {
    const r = await runCli(['table', '--fc', '4', '--fy', '60', '--gamma', '0.8', '--rho', '0.001:0.1:0.00001', '--points', '20000']);
    expect(r.stderr).toBe('pmchart: --rho: gives 9901 curves, beyond 2000 (allowed: 1–2000)\n');
    expect(r.code).toBe(2);
  });
  it('refuses curves × points beyond the row cap (1,981 curves × 2,000 points)', async () => {
    const r = await runCli(['table', '--fc', '4', '--fy', '60', '--gamma', '0.8', '--rho', '0.001:0.1:0.00005', '--points', '2000']);
    expect(r.stderr).toBe('pmchart: --points: 2000 × 1981 curves gives 3962000 rows, beyond 1000000 (allowed: curves × points ≤ 1000000)\n');
    expect(r.code).toBe(2);
  });
});
