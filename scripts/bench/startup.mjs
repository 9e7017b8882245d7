// Start-up figures (issue 12): `pmchart --help` and a one-load check, wall time of a fresh process
// (best of 9), with a bare `node -e 0` for reference. CPU is the child's own user + system time.
import { bestOf, bin, runNode } from './lib/measure.mjs';

export const name = 'startup';

const SECTION = ['--fc', '5', '--fy', '60', '--b', '24', '--h', '24', '--cover', '1.5', '--tie', '#4', '--bar', '#9'];

export async function run() {
  const bare = bestOf(9, () => runNode(['-e', '0']));
  const help = bestOf(9, () => runNode([bin, '--help']));
  const check = bestOf(7, () => runNode([bin, 'check', ...SECTION, '--pu', '400', '--mu', '200']));
  return [
    { figure: '`node -e 0` (reference), wall, best of 9', value: bare.wall, unit: 's', target: '(about 0.1 s)' },
    { figure: '`pmchart --help`, wall, best of 9', value: help.wall, unit: 's', target: '≤ 0.2 s' },
    { figure: '`pmchart --help`, CPU of that run', value: help.cpu, unit: 's', target: '' },
    { figure: 'one-load `pmchart check`, wall, best of 7', value: check.wall, unit: 's', target: '≤ 0.25 s' },
    { figure: 'one-load `pmchart check`, CPU of that run', value: check.cpu, unit: 's', target: '' },
  ];
}
