// Runs a command as a child and reports wall time, its own CPU time and peak RSS. Node children get a
// preload that writes process.resourceUsage() to fd 2 on exit (no /usr/bin/time needed); other
// programs report their own CPU (scripts/bench/plot_baseline.py prints it).
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

export const root = fileURLToPath(new URL('../../..', import.meta.url));
export const bin = `${root}bin/pmchart.js`;

const MARK = '@@pmchart-bench-usage ';
const preload = `data:text/javascript,${encodeURIComponent(
  `import { writeSync } from 'node:fs'; process.on('exit', () => { const u = process.resourceUsage(); writeSync(2, '\\n${MARK}' + JSON.stringify({ cpu: (u.userCPUTime + u.systemCPUTime) / 1e6, rssMb: u.maxRSS / 1024 }) + '\\n'); });`,
)}`;

/** node <args> with usage: { wall s, cpu s, rssMb, stdout, stderr }; a failing run throws unless opts.allowFailure (then status and error) */
export function runNode(args, opts = {}) {
  const t0 = process.hrtime.bigint();
  const { allowFailure: _, ...spawnOpts } = opts;
  const r = spawnSync(process.execPath, ['--import', preload, ...args], { maxBuffer: 1 << 30, encoding: 'utf8', ...spawnOpts });
  const wall = Number(process.hrtime.bigint() - t0) / 1e9;
  const line = (r.stderr ?? '').split('\n').find((l) => l.startsWith(MARK));
  const usage = line ? JSON.parse(line.slice(MARK.length)) : { cpu: NaN, rssMb: NaN };
  if (r.status !== 0 && opts.allowFailure) return { wall, ...usage, status: r.status, error: (r.stderr ?? '').split('\n')[0], stdout: r.stdout, stderr: r.stderr };
  if (r.status !== 0) throw new Error(`bench: node ${args.slice(0, 3).join(' ')} … exited ${r.status}: ${(r.stderr ?? '').split('\n')[0]}`);
  return { wall, ...usage, stdout: r.stdout, stderr: r.stderr };
}

/** The best (lowest) of n runs by wall time, with that run's CPU and the largest RSS seen. */
export function bestOf(n, fn) {
  const runs = Array.from({ length: n }, fn);
  const best = runs.reduce((a, b) => (b.wall < a.wall ? b : a));
  return { ...best, rssMb: Math.max(...runs.map((r) => r.rssMb)) };
}

/**
 * A command run through bash, whose `times` reports the CPU of every process it waited for (children and their
 * children: the render and schedule worker processes), which process.resourceUsage() of one node process misses.
 * Returns { wall, cpu, status, stdoutBytes }.
 */
export function runTree(args, opts = {}) {
  const quoted = args.map((a) => `'${String(a).replace(/'/g, `'\\''`)}'`).join(' ');
  const script = `${quoted} >${opts.stdoutFile ?? '/dev/null'} 2>/dev/null; s=$?; times; exit $s`;
  const t0 = process.hrtime.bigint();
  const r = spawnSync('bash', ['-c', script], { encoding: 'utf8', maxBuffer: 1 << 20 });
  const wall = Number(process.hrtime.bigint() - t0) / 1e9;
  // `times`: line 1 the shell's user/system, line 2 its children's, as 0m1.234s
  const lines = r.stdout.trim().split('\n');
  const sec = (t) => {
    const m = /^(\d+)m([\d.]+)s$/.exec(t);
    return m ? Number(m[1]) * 60 + Number(m[2]) : NaN;
  };
  const [u, sys] = (lines[lines.length - 1] ?? '').trim().split(/\s+/);
  return { wall, cpu: sec(u) + sec(sys), status: r.status };
}
