// Side by side (issue 12): the same 192 φ-factored families as a pmchart vector book made by one render
// process, and as plain vector PDF pages from the numpy + matplotlib script an engineer would write
// (scripts/bench/plot_baseline.py, run with Debian's /usr/bin/python3). Both are timed in this run as a
// user would start them (interpreter start-up and imports included); the figure is CPU per sheet.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { bin, root, runNode } from './lib/measure.mjs';

export const name = 'compare';

const PYTHON = '/usr/bin/python3';
const FC = [4, 5, 6];
const FY = [60, 80];
const GAMMAS = [0.55, 0.6, 0.65, 0.7, 0.75, 0.8, 0.85, 0.9];
const LAYOUTS = [
  { kind: 'two-faces', barsPerFace: 2 },
  { kind: 'two-faces', barsPerFace: 3 },
  { kind: 'four-faces', barsPerFace: 3 },
  { kind: 'four-faces', barsPerFace: 4 },
];

function pythonReady() {
  if (!existsSync(PYTHON)) return `${PYTHON} is missing`;
  const r = spawnSync(PYTHON, ['-c', 'import numpy, matplotlib'], { encoding: 'utf8' });
  return r.status === 0 ? null : 'python3-numpy or python3-matplotlib is missing (apt-get install python3-numpy python3-matplotlib)';
}

export async function run() {
  const dir = mkdtempSync(join(tmpdir(), 'pmchart-bench-'));
  try {
    const setFile = join(dir, 'compare.json');
    writeFileSync(
      setFile,
      JSON.stringify({
        name: 'bench-compare',
        titleBlock: { office: 'Bench Office (invented)', project: 'Bench Project (invented)', date: '2026-01-01' },
        units: 'us',
        basis: { code: 'aci318-19' },
        outputs: { pdf: true, svg: false, png: false, tables: false },
        sheets: [{ fc: FC, fy: FY, gamma: GAMMAS, arrangement: LAYOUTS }],
      }),
    );
    const sheets = FC.length * FY.length * GAMMAS.length * LAYOUTS.length;
    const pm = runNode([bin, 'set', setFile, '--out', dir, '--jobs', '1', '--no-progress']);
    const pmPerSheet = (pm.cpu / sheets) * 1000;
    const rows = [
      { figure: `pmchart vector book, ${sheets} sheets, 1 render process: CPU per sheet`, value: pmPerSheet, unit: 'ms', target: '≤ ¼ of the script below' },
      { figure: '  same book: wall, peak RSS', value: `${pm.wall.toFixed(1)} s, ${pm.rssMb.toFixed(0)} MB`, unit: '', target: '' },
    ];
    const missing = pythonReady();
    if (missing) {
      rows.push({ figure: 'numpy + matplotlib script, same families: skipped', value: '—', unit: '', target: missing });
      return rows;
    }
    const spec = [];
    for (const fc of FC) for (const fy of FY) for (const gamma of GAMMAS) for (const l of LAYOUTS) spec.push({ fc, fy, gamma, faces: l.kind === 'two-faces' ? 2 : 4, perFace: l.barsPerFace });
    const specFile = join(dir, 'baseline.json');
    writeFileSync(specFile, JSON.stringify(spec));
    const t0 = process.hrtime.bigint();
    const py = spawnSync(PYTHON, [join(root, 'scripts/bench/plot_baseline.py'), specFile, join(dir, 'baseline.pdf')], { encoding: 'utf8' });
    const pyWall = Number(process.hrtime.bigint() - t0) / 1e9;
    if (py.status !== 0) throw new Error(`bench: plot_baseline.py failed: ${py.stderr.split('\n').slice(-2).join(' ')}`);
    const { cpu } = JSON.parse(py.stdout.trim().split('\n').pop());
    const pyPerSheet = (cpu / sheets) * 1000;
    rows.push(
      { figure: `numpy + matplotlib script, same ${sheets} families (no table or title block): CPU per sheet`, value: pyPerSheet, unit: 'ms', target: '(baseline)' },
      { figure: '  script wall', value: pyWall, unit: 's', target: '' },
      { figure: 'ratio: script CPU per sheet ÷ pmchart CPU per sheet', value: pyPerSheet / pmPerSheet, unit: '×', target: '≥ 4×' },
    );
    return rows;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
