/**
 * Runs `pmchart …` in this process through `main`, the entry bin/pmchart.js calls, capturing stdout,
 * stderr and the exit code. Fast enough for thousands of generated cases.
 */
import { main } from '../../src/cli/main.js';

export interface CliRun {
  code: number;
  stdout: string;
  stderr: string;
}

export async function runCli(args: string[]): Promise<CliRun> {
  const out: string[] = [];
  const err: string[] = [];
  const ow = process.stdout.write.bind(process.stdout);
  const ew = process.stderr.write.bind(process.stderr);
  process.stdout.write = ((chunk: string | Uint8Array) => (out.push(String(chunk)), true)) as typeof process.stdout.write;
  process.stderr.write = ((chunk: string | Uint8Array) => (err.push(String(chunk)), true)) as typeof process.stderr.write;
  process.exitCode = 0;
  try {
    await main(['node', 'pmchart', ...args]);
  } finally {
    process.stdout.write = ow;
    process.stderr.write = ew;
  }
  const code = Number(process.exitCode ?? 0);
  process.exitCode = 0;
  return { code, stdout: out.join(''), stderr: err.join('') };
}
