/**
 * Runs `pmchart …` in this process through `runCli` (src/cli/main.ts), the entry bin/pmchart.js's `main`
 * sits behind: the source is tested, never a stale bundle. `cli` gives the shape of `spawnSync`'s result
 * (`status`, `stdout`, `stderr`) and can run in another folder or with extra environment variables.
 * Only tests/cli/built-binary.test.ts and the tests that need a process of their own (heap caps,
 * signals, worker pools, the installed package) spawn bin/pmchart.js.
 */
import { runCli, type CliRun } from '../../src/cli/main.js';

export { runCli, type CliRun };

export interface CliResult {
  status: number;
  stdout: string;
  stderr: string;
}

/** `pmchart <args>` in this process, in folder `cwd` (default: this one) with `env` added to the environment. */
export async function cli(args: readonly string[], o: { cwd?: string; env?: Record<string, string> } = {}): Promise<CliResult> {
  const here = process.cwd();
  const saved = Object.fromEntries(Object.keys(o.env ?? {}).map((k) => [k, process.env[k]]));
  Object.assign(process.env, o.env ?? {});
  if (o.cwd) process.chdir(o.cwd);
  try {
    const r = await runCli(args);
    return { status: r.code, stdout: r.stdout, stderr: r.stderr };
  } finally {
    if (o.cwd) process.chdir(here);
    for (const [k, v] of Object.entries(saved)) {
      if (v === undefined) delete process.env[k];
      else process.env[k] = v;
    }
  }
}
