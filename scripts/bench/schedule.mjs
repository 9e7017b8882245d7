// Schedule scale (issues 22 and 21): 1,000 invented column marks × 50 load combinations (half of them with
// Muy), `pmchart schedule --json --jobs 2` as on the 2-core reference machine. The figure is the CPU of the
// whole process tree (the parent and its worker processes, through bash's `times`), target ≤ 10 s; memory
// flat in marks: the parent's peak RSS at a quarter of the marks and at all of them.
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { bin, runNode, runTree } from './lib/measure.mjs';
import { QUICK, scaled } from './lib/quick.mjs';

export const name = 'schedule';

const COMBINATIONS = 50;

/** An invented schedule of n marks (three widths, three depths, three bar counts) and its loads. */
function writeInput(dir, n) {
  const marks = ['mark,code,units,fc,fy,b,h,diameter,arrangement,bars_per_face,bars,bar,cover,tie,transverse'];
  const loads = ['mark,id,Pu,Mu,Muy'];
  for (let i = 0; i < n; i++) {
    const mark = `M${String(i + 1).padStart(4, '0')}`;
    marks.push(`${mark},aci318-19,si,35MPa,420MPa,${[400, 500, 600][i % 3]},${[500, 600, 700][(i >> 1) % 3]},,four-faces,${3 + (i % 3)},,25,40,10,tied`);
    for (let k = 0; k < COMBINATIONS; k++) {
      const j = i * COMBINATIONS + k;
      loads.push(`${mark},ULS-${String(k + 1).padStart(2, '0')},${500 + ((j * 7919) % 4000)},${20 + ((j * 104729) % 300)},${k % 2 ? 5 + ((j * 15485863) % 120) : 0}`);
    }
  }
  const s = join(dir, `schedule-${n}.csv`);
  const l = join(dir, `loads-${n}.csv`);
  writeFileSync(s, marks.join('\n') + '\n');
  writeFileSync(l, loads.join('\n') + '\n');
  return [s, l];
}

export async function run() {
  const dir = mkdtempSync(join(tmpdir(), 'pmchart-bench-'));
  try {
    const n = scaled(1000, 100);
    const [s, l] = writeInput(dir, n);
    const [sq, lq] = writeInput(dir, n / 4);
    const args = (sf, lf) => [bin, 'schedule', sf, '--loads', lf, '--json', '--jobs', '2'];
    const tree = runTree([process.execPath, ...args(s, l)]);
    if (tree.status !== 0 && tree.status !== 1) throw new Error(`bench: schedule exited ${tree.status}`);
    // the parent's peak RSS (the workers hold one mark at a time), at a quarter and at all of the marks
    const full = runNode(args(s, l), { allowFailure: true, stdio: ['ignore', 'ignore', 'pipe'] });
    const quarter = runNode(args(sq, lq), { allowFailure: true, stdio: ['ignore', 'ignore', 'pipe'] });
    const q = QUICK ? ` (quick: ${n} marks; the target is for 1,000)` : '';
    return [
      { figure: `schedule, ${n.toLocaleString('en')} marks × ${COMBINATIONS} combinations, --json --jobs 2: CPU of all processes${q}`, value: tree.cpu, unit: 's', target: '≤ 10 s' },
      { figure: '  same: wall', value: tree.wall, unit: 's', target: '(2 cores)' },
      { figure: `  parent peak RSS at ${n / 4} marks → at ${n} marks`, value: `${quarter.rssMb.toFixed(0)} → ${full.rssMb.toFixed(0)}`, unit: 'MB', target: 'flat in marks' },
    ];
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
