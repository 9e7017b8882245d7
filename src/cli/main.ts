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
  registerPage(program, runAction);
  return program;
}

export async function main(argv: string[]): Promise<void> {
  // `pmchart table … | head` closes the pipe early; that is the reader's choice, not an error.
  process.stdout.on('error', (e: NodeJS.ErrnoException) => {
    if (e.code === 'EPIPE') process.exit(0);
    throw e;
  });
  const program = buildProgram();
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
