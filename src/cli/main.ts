#!/usr/bin/env node
/**
 * pmchart command line. All commands are registered here; each action calls a typed `run…(options)`
 * that tests can call without the parser. Commands throw PmError; `runAction` is the one handler
 * that prints it on one line and sets the exit code.
 */
import { Command, CommanderError } from 'commander';
import { isPmError } from '../errors.js';
import { GENERATOR } from '../version.js';
import { registerCheck } from './check.js';
import { registerContour } from './contour.js';
import { registerPage } from './page.js';
import { registerSchedule } from './schedule.js';
import { registerSet } from './set.js';
import { registerSheet } from './sheet.js';
import { registerTable } from './table.js';

/** The single error handler: one line on stderr, exit code from the error (2 bad input, 3 I/O), 3 for an internal error, no stack trace. */
export async function runAction(fn: () => Promise<void> | void): Promise<void> {
  try {
    await fn();
  } catch (e) {
    if (isPmError(e)) {
      process.stderr.write(`pmchart: ${e.message}\n`);
      process.exitCode = e.exitCode;
      return;
    }
    const msg = e instanceof Error ? e.message.split('\n')[0] : String(e);
    process.stderr.write(`pmchart: internal error: ${msg}\n`);
    if (process.env.PMCHART_DEBUG && e instanceof Error) process.stderr.write(`${e.stack}\n`);
    // internal or I/O error (exit codes: 2 bad input, 1 failing loads or a stopped render, 3 internal or I/O)
    process.exitCode = 3;
  }
}

export function buildProgram(): Command {
  const program = new Command();
  program
    .name(GENERATOR.name)
    .description('Normalised P–M interaction charts, chart books and column checks for reinforced-concrete columns.\nResults are for qualified engineers; local codes and licensed practice govern.')
    .version(GENERATOR.version)
    .exitOverride()
    .showHelpAfterError(false)
    .configureOutput({ outputError: (str, write) => write(`pmchart: ${str.replace(/^error: /, '').trim()}\n`) });
  registerTable(program, runAction);
  registerCheck(program, runAction);
  registerContour(program, runAction);
  registerSet(program, runAction);
  registerSheet(program, runAction);
  registerSchedule(program, runAction);
  registerPage(program, runAction);
  return program;
}

let watching = false;
/**
 * `pmchart table … | head` closes the pipe early; that is the reader's choice, not an error: exit 0.
 * Any other failure of standard output (ENOSPC on a full disk, EIO) is one line and exit 3.
 */
function watchStdout(): void {
  if (watching) return;
  watching = true;
  process.stdout.on('error', (e: NodeJS.ErrnoException) => {
    if (e.code === 'EPIPE') process.exit(0);
    process.stderr.write(`pmchart: standard output cannot be written (${e.code ?? e.message.split('\n')[0]})\n`);
    process.exit(3);
  });
}

/**
 * The first long option given twice on the command line (`--fc 4 --fc 5`), read with the command's
 * own option list so that values are skipped; undefined when none repeats.
 */
export function repeatedOption(program: Command, argv: readonly string[]): string | undefined {
  const args = argv.slice(2);
  const cmd = program.commands.find((c) => c.name() === args[0] || c.aliases().includes(args[0] ?? ''));
  if (!cmd) return undefined;
  const seen = new Set<string>();
  for (let i = 1; i < args.length; i++) {
    const a = args[i]!;
    if (a === '--') break;
    if (!a.startsWith('--')) continue;
    const name = a.includes('=') ? a.slice(0, a.indexOf('=')) : a;
    const opt = cmd.options.find((o) => o.long === name);
    const key = opt ? opt.attributeName() : name;
    if (seen.has(key)) return name;
    seen.add(key);
    if (opt && (opt.required || opt.optional) && !a.includes('=') && !(opt.optional && (args[i + 1] ?? '-').startsWith('-'))) i++;
  }
  return undefined;
}

export async function main(argv: string[]): Promise<void> {
  watchStdout();
  const program = buildProgram();
  const twice = repeatedOption(program, argv);
  if (twice !== undefined) {
    process.stderr.write(`pmchart: ${twice}: is given more than once; give it once\n`);
    process.exitCode = 2;
    return;
  }
  try {
    await program.parseAsync(argv);
  } catch (e) {
    if (e instanceof CommanderError) {
      process.exitCode = e.exitCode === 0 ? 0 : 2;
      return;
    }
    throw e;
  }
}

/** What one in-process run of the CLI gave: its exit code and what it wrote. */
export interface CliRun {
  code: number;
  stdout: string;
  stderr: string;
}

/**
 * Runs `pmchart <args>` in this process, as bin/pmchart.js does, and returns its exit code and what it
 * wrote to standard output and standard error (the tests' way in: the source is tested, not a bundle).
 * It borrows `process.stdout.write`, `process.stderr.write` and `process.exitCode` for the run, so runs
 * must not overlap.
 */
export async function runCli(args: readonly string[]): Promise<CliRun> {
  const out: string[] = [];
  const err: string[] = [];
  const ow = process.stdout.write;
  const ew = process.stderr.write;
  const capture =
    (into: string[]) =>
    (chunk: string | Uint8Array, enc?: BufferEncoding | ((e?: Error | null) => void), cb?: (e?: Error | null) => void): boolean => {
      into.push(typeof chunk === 'string' ? chunk : Buffer.from(chunk).toString('utf8'));
      const done = typeof enc === 'function' ? enc : cb;
      if (done) queueMicrotask(() => done());
      return true;
    };
  const before = process.exitCode;
  process.stdout.write = capture(out) as typeof process.stdout.write;
  process.stderr.write = capture(err) as typeof process.stderr.write;
  process.exitCode = 0;
  try {
    await main(['node', 'pmchart', ...args]);
  } finally {
    process.stdout.write = ow;
    process.stderr.write = ew;
  }
  const code = Number(process.exitCode ?? 0);
  process.exitCode = before;
  return { code, stdout: out.join(''), stderr: err.join('') };
}
