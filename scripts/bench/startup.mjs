// Start-up figures (issues 12 and 21): `pmchart --help` and a one-load check, CPU (user + system) of a fresh
// process, the lowest of 9 (7) runs, with a bare `node -e 0` for reference. Targets are CPU seconds: the
// shared machine makes wall times noisy (issue 21, Clarifications).
import { bin, runNode } from './lib/measure.mjs';
import { scaled } from './lib/quick.mjs';

const bestOf = (n, fn) => Array.from({ length: n }, fn).reduce((a, b) => (b.cpu < a.cpu ? b : a));

export const name = 'startup';

const SECTION = ['--fc', '5', '--fy', '60', '--b', '24', '--h', '24', '--cover', '1.5', '--tie', '#4', '--bar', '#9'];

export async function run() {
  const n = scaled(9, 3);
  const bare = bestOf(n, () => runNode(['-e', '0']));
  const help = bestOf(n, () => runNode([bin, '--help']));
  const check = bestOf(n, () => runNode([bin, 'check', ...SECTION, '--pu', '400', '--mu', '200']));
  const noProposals = bestOf(n, () => runNode([bin, 'check', ...SECTION, '--pu', '400', '--mu', '200', '--proposals', '0']));
  return [
    { figure: `\`node -e 0\` (reference): CPU, lowest of ${n}`, value: bare.cpu, unit: 's', target: '(about 0.1 s)' },
    { figure: `\`pmchart --help\`: CPU, lowest of ${n}`, value: help.cpu, unit: 's', target: '≤ 0.2 s' },
    { figure: `one-load \`pmchart check\` (5 bar proposals, the default): CPU, lowest of ${n}`, value: check.cpu, unit: 's', target: '≤ 0.25 s' },
    { figure: '  same: wall, peak RSS', value: `${check.wall.toFixed(2)} s, ${check.rssMb.toFixed(0)} MB`, unit: '', target: '' },
    { figure: '  same with --proposals 0: CPU', value: noProposals.cpu, unit: 's', target: '(reported)' },
  ];
}
