// Book figures: a 500-sheet vector book (φ family of 8 curves per sheet, lookup table, title block),
// PDF only, rendered by 2 child processes as on the 2-core reference machine. Targets (issue 12):
// ≤ 5 s wall, peak RSS ≤ 400 MB. The one-process CPU per sheet is in compare.mjs.
import { mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { readChartSet } from '../../dist/config/read.js';
import { makeChartSet } from '../../dist/sheet/pipeline.js';
import { generatorLabel } from '../../dist/version.js';

export const name = 'book';

/** 5 f′c × 2 fy × 10 γ × 5 arrangements = 500 sheets. */
const bookSet = (sheets) =>
  readChartSet(
    JSON.stringify({
      name: 'bench-book',
      titleBlock: { office: 'Bench Office (invented)', project: 'Bench Project (invented)', date: '2026-01-01' },
      units: 'us',
      basis: { code: 'aci318-19' },
      outputs: { pdf: true, svg: false, png: false, tables: false },
      sheets,
    }),
  );

const arrangements = [
  { kind: 'two-faces', barsPerFace: 2 },
  { kind: 'two-faces', barsPerFace: 3 },
  { kind: 'two-faces', barsPerFace: 4 },
  { kind: 'four-faces', barsPerFace: 3 },
  { kind: 'four-faces', barsPerFace: 4 },
];

async function timed(set, jobs) {
  const dir = mkdtempSync(join(tmpdir(), 'pmchart-bench-'));
  const t0 = process.hrtime.bigint();
  const made = await makeChartSet(set, { outDir: dir, generator: generatorLabel(), jobs });
  const s = Number(process.hrtime.bigint() - t0) / 1e9;
  const bytes = statSync(made.book).size;
  rmSync(dir, { recursive: true, force: true });
  return { s, made, bytes };
}

export async function run() {
  const big = bookSet([{ fc: [4, 5, 6, 7, 8], fy: [60, 80], gamma: { from: 0.5, to: 0.95, step: 0.05 }, arrangement: arrangements }]);
  const small = bookSet([{ fc: 7, fy: 80, gamma: [0.7, 0.8], arrangement: arrangements.slice(0, 1) }]);
  await timed(small, 1); // warm the file cache and fonts
  const two = await timed(big, 2);
  const n = big.sheets.length;
  // issue 15: biaxial sheets, 5 sections × levels 0–0.6 (two sheets each), one process
  const biaxial = bookSet([{ fc: [4, 5, 6, 7, 8], fy: 80, gamma: 0.75, arrangement: { kind: 'four-faces', barsPerFace: [3, 5] }, chart: 'biaxial', axialLevels: { from: 0, to: 0.6, step: 0.1 } }]);
  const bx = await timed(biaxial, 1);
  return [
    { figure: `biaxial book of ${biaxial.sheets.length} sheets (8 ρg × 3–4 levels), 1 process, per sheet`, value: (bx.s / biaxial.sheets.length) * 1000, unit: 'ms', target: '' },
    { figure: `vector book of ${n} sheets (8 φ curves, table, title block), 2 processes, wall`, value: two.s, unit: 's', target: '≤ 5 s' },
    { figure: 'same book: sheets per second', value: n / two.s, unit: 'sheets/s', target: '≥ 100' },
    { figure: 'same book: peak RSS (largest of parent and children)', value: two.made.peakRssMb, unit: 'MB', target: '≤ 400 MB' },
    { figure: 'same book: PDF size', value: two.bytes / 1e6, unit: 'MB', target: '' },
  ];
}
