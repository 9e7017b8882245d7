/**
 * `pmchart check`: a thin adapter over the check engine (src/design/column-check.ts). It parses the
 * flags into a `ColumnCheckInput`, calls `checkColumn`, prints a view of the one result
 * (src/report/check-view.ts) and sets the exit status: 0 when every load passes, 1 when any load fails,
 * is not possible, unstable or outside the method's scope (2 bad input, 3 internal or I/O error).
 */
import { extname } from 'node:path';
import type { Command } from 'commander';
import type { ColumnCheck } from '../design/column-check.js';
import { ERROR_CODES, PmError } from '../errors.js';
import { ioError, writeFileAtomic } from '../io/files.js';
import { CAUTION } from '../report/caution.js';
import { checkAssumptions, checkJson, checkReportText, checkText } from '../report/check-view.js';
import { generatorLabel } from '../version.js';
import { reportDate } from '../flags/format.js';
import { addSectionOptions } from '../flags/section-flags.js';
import { addEffectsOptions } from '../flags/check-effects.js';
import { computeCheck, isDrawn, type CheckOptions, type ResolvedCheck } from '../flags/check-flags.js';
export * from '../flags/check-flags.js';

/** Prints the chosen view and sets the exit status from the result. */
function finish(rc: ResolvedCheck, check: ColumnCheck): string {
  if (check.exitCode !== 0) process.exitCode = check.exitCode;
  return rc.json ? checkJson(check, generatorLabel()) : checkText(check);
}

/**
 * Runs the command and returns what it prints; writes a .txt or .json report when asked. PDF and SVG
 * reports are drawn, which is asynchronous: `runCheckAsync` (what the CLI calls) writes every format.
 */
export function runCheck(o: CheckOptions): string {
  if (o.report !== undefined && isDrawn(o.report)) {
    throw new PmError(ERROR_CODES.invalidValue, '--report', 'is a drawn report; write PDF and SVG reports with runCheckAsync', { value: o.report });
  }
  const { rc, check } = computeCheck(o);
  if (rc.report !== undefined) {
    const body = extname(rc.report).toLowerCase() === '.json' ? checkJson(check, generatorLabel()) : checkReportText(check, generatorLabel());
    writeAtomic(rc.report, body);
  }
  return finish(rc, check);
}

/** The command as the CLI runs it: every report format, the drawn ones through the lazily imported renderer. */
export async function runCheckAsync(o: CheckOptions): Promise<string> {
  if (o.report === undefined || !isDrawn(o.report)) return runCheck(o);
  const { rc, check } = computeCheck(o);
  const date = reportDate(o.date);
  const { writeCheckReport } = await import('../sheet/check-report-file.js');
  await writeCheckReport(rc.report!, {
    check,
    assumptions: checkAssumptions(check),
    caution: CAUTION,
    date,
    ...(o.project !== undefined ? { project: o.project } : {}),
    ...(o.office !== undefined ? { office: o.office } : {}),
    generator: generatorLabel(),
  });
  return finish(rc, check);
}

/** Writes through a temporary file and a rename, so a failed run leaves no half-written file. */
export function writeAtomic(file: string, body: string): void {
  try {
    writeFileAtomic(file, body);
  } catch (e) {
    // the file module names the place and classes the error: 2 for a place the user can change, 3 for a fault
    const err = ioError(file, e);
    throw new PmError(err.code, '--report', err.message.replace(/^[^:]*: /, ''), { value: file }, err.exitCode);
  }
}

/** Exit statuses, for --help and the README. */
export const EXIT_STATUS_HELP = `
Exit status:
  0  every load passes
  1  a load fails, is not possible within the ρg limits, is unstable, or is outside the method's scope
  2  bad input (one line names the flag, field or CSV line)
  3  internal or I/O error`;

export function registerCheck(program: Command, run: (fn: () => Promise<void> | void) => Promise<void>): void {
  const cmd = program
    .command('check')
    .description('check factored loads on a sized column: exact ρg required, chart readings, utilisation, status, bar proposals')
    .addHelpText('after', EXIT_STATUS_HELP);
  addEffectsOptions(addSectionOptions(cmd))
    .option('--pu <force>', 'factored axial load, compression positive (default unit kip or kN)')
    .option('--mu <moment>', 'factored moment (default unit kip-ft or kN-m)')
    .option('--loads <file>', 'CSV of load combinations with columns id,Pu,Mu (tension negative Pu)')
    .option('--rho <ratio>', 'given ρg to check (utilisation)')
    .option('--aggregate <length>', 'maximum aggregate size, for the clear-spacing rule')
    .option('--chart-gamma-step <step>', 'γ step of the emulated chart sheets', '0.05')
    .option('--chart-axial-step <step>', 'axial-level step (P/(f′c·Ag), ν for EN) of the emulated biaxial sheets read for loads with Muy', '0.1')
    .option('--proposals <n>', 'how many bar layouts to propose (0 for none)', '5')
    .option('--json', 'print JSON instead of the table')
    .option('--report <file>', 'also write a report: .txt, .json, or a one-page calculation sheet as .pdf or .svg')
    .option('--project <text>', 'project name for the title block of a PDF/SVG report')
    .option('--office <text>', 'office name for the title block of a PDF/SVG report')
    .option('--date <yyyy-mm-dd>', 'date of a PDF/SVG report and its PDF metadata (default SOURCE_DATE_EPOCH, else today)')
    .action((opts: CheckOptions) => run(async () => void process.stdout.write(await runCheckAsync(opts))));
}
