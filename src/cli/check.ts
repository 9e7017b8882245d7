/**
 * `pmchart check`: a thin adapter over the check engine (src/design/column-check.ts). It parses the
 * flags into a `ColumnCheckInput`, calls `checkColumn`, prints a view of the one result
 * (src/report/check-view.ts) and sets the exit status: 0 when every load passes, 1 when any load fails,
 * is not possible, unstable or outside the method's scope (2 bad input, 3 internal or I/O error).
 * A load file of more than STREAM_ABOVE_LOADS loads goes through `rankColumnCheck` instead and is
 * printed load by load (`writeCheck`), with the same bytes and flat memory.
 */
import { extname } from 'node:path';
import type { Command } from 'commander';
import { checkColumn, describeCheck, prepareColumnCheck, rankColumnCheck, type ColumnCheck } from '../design/column-check.js';
import { ERROR_CODES, PmError } from '../errors.js';
import { checkFileTarget, ioError, writeFileAtomic, writePieces, writePiecesAtomic } from '../io/files.js';
import { CAUTION } from '../report/caution.js';
import { checkAssumptions, checkJson, checkJsonPieces, checkReportPieces, checkReportText, checkText, checkTextPieces, textSizer } from '../report/check-view.js';
import { generatorLabel } from '../version.js';
import { reportDate } from '../flags/format.js';
import { addSectionOptions, withFlagNames } from '../flags/section-flags.js';
import { addEffectsOptions } from '../flags/check-effects.js';
import { isDrawn, resolveCheckOptions, type CheckOptions, type ResolvedCheck } from '../flags/check-flags.js';
export * from '../flags/check-flags.js';
import { addOfficeOptions, resolveOfficeFlags, withOfficeSection, type ResolvedOffice } from '../flags/office-flags.js';

/** The office file under the flags: the report's title block and logo, and --units and --code where not given. */
function withOffice(o: CheckOptions): { o: CheckOptions; office: ResolvedOffice } {
  const office = resolveOfficeFlags(o);
  return { o: withOfficeSection(o, office.file, false), office };
}

/**
 * Above this many loads the command ranks the loads first and then prints (and writes .txt and .json
 * reports) one result at a time, each computed again: memory stays flat for the largest load file.
 * At or below it the whole result is held and printed at once (one pass of the engine). The bytes are
 * the same either way.
 */
export const STREAM_ABOVE_LOADS = 5000;

/** Prints the chosen view and sets the exit status from the result. */
function finish(rc: ResolvedCheck, check: ColumnCheck): string {
  if (check.exitCode !== 0) process.exitCode = check.exitCode;
  return rc.json ? checkJson(check, generatorLabel()) : checkText(check);
}

const isJsonReport = (file: string): boolean => extname(file).toLowerCase() === '.json';

/**
 * Runs the command and returns what it prints; writes a .txt or .json report when asked. PDF and SVG
 * reports are drawn, which is asynchronous: `runCheckAsync` writes every format.
 */
export function runCheck(o: CheckOptions): string {
  if (o.report !== undefined && isDrawn(o.report)) {
    throw new PmError(ERROR_CODES.invalidValue, '--report', 'is a drawn report; write PDF and SVG reports with runCheckAsync', { value: o.report });
  }
  return runResolved(resolveCheckOptions(withOffice(o).o));
}

function runResolved(rc: ResolvedCheck): string {
  const check = withFlagNames(() => checkColumn(rc.input));
  if (rc.report !== undefined) {
    const body = isJsonReport(rc.report) ? checkJson(check, generatorLabel()) : checkReportText(check, generatorLabel());
    writeAtomic(rc.report, body);
  }
  return finish(rc, check);
}

/** The command with every report format, the drawn ones through the lazily imported renderer; returns what it prints. */
export async function runCheckAsync(given: CheckOptions): Promise<string> {
  const { o, office } = withOffice(given);
  return runResolvedAsync(o, resolveCheckOptions(o), office);
}

async function runResolvedAsync(o: CheckOptions, rc: ResolvedCheck, of: ResolvedOffice): Promise<string> {
  if (rc.report === undefined || !isDrawn(rc.report)) return runResolved(rc);
  const check = withFlagNames(() => checkColumn(rc.input));
  const date = reportDate(o.date);
  const { writeCheckReport } = await import('../sheet/check-report-file.js');
  const { logoRef } = await import('../sheet/logo.js');
  const logo = of.logo ? await logoRef(of.logo, o.logo !== undefined ? '--logo' : '--office-file logo') : undefined;
  await writeCheckReport(rc.report, {
    check,
    assumptions: checkAssumptions(check),
    caution: CAUTION,
    date,
    ...(o.project !== undefined ? { project: o.project } : {}),
    ...(of.office !== undefined ? { office: of.office } : {}),
    ...(o.mark !== undefined ? { mark: o.mark } : {}),
    ...(of.preparedBy !== undefined ? { preparedBy: of.preparedBy } : {}),
    ...(of.checkedBy !== undefined ? { checkedBy: of.checkedBy } : {}),
    ...(of.revision !== undefined ? { revision: of.revision } : {}),
    ...(logo ? { logo } : {}),
    generator: generatorLabel(),
  });
  return finish(rc, check);
}

/**
 * The command as the CLI runs it: prints to `out`. A load file above `streamAbove` loads is checked
 * once to rank the loads (keeping a few numbers per load), then printed in ranked order with each
 * result computed again, in chunks that wait for the reader; drawn reports (at most
 * MAX_DRAWN_REPORT_LOADS loads, src/input/limits.ts) need the whole result and take the held path.
 */
export async function writeCheck(given: CheckOptions, out: NodeJS.WritableStream = process.stdout, streamAbove = STREAM_ABOVE_LOADS): Promise<void> {
  const { o, office } = withOffice(given);
  const rc = resolveCheckOptions(o);
  for (const n of rc.notes) process.stderr.write(`pmchart: note: ${n}\n`);
  const report = rc.report;
  if (report !== undefined) reportError(report, () => checkFileTarget(report));
  if (rc.input.loads.length <= streamAbove || (rc.report !== undefined && isDrawn(rc.report))) {
    await writePieces(out, [await runResolvedAsync(o, rc, office)]);
    return;
  }
  const ctx = withFlagNames(() => prepareColumnCheck(rc.input));
  const text = !rc.json || (rc.report !== undefined && !isJsonReport(rc.report));
  const sizer = text ? textSizer(describeCheck(ctx)) : undefined;
  const ranked = withFlagNames(() => rankColumnCheck(ctx, sizer?.visit));
  const sizes = sizer?.finish(ranked.governing);
  if (rc.report !== undefined) {
    const file = rc.report;
    const pieces = isJsonReport(file) ? checkJsonPieces(ranked, generatorLabel()) : checkReportPieces(ranked, generatorLabel(), sizes);
    reportError(file, () => writePiecesAtomic(file, pieces));
  }
  if (ranked.check.exitCode !== 0) process.exitCode = ranked.check.exitCode;
  await writePieces(out, rc.json ? checkJsonPieces(ranked, generatorLabel()) : checkTextPieces(ranked, sizes));
}

/** Writes through a temporary file and a rename, so a failed run leaves no half-written file. */
export function writeAtomic(file: string, body: string): void {
  reportError(file, () => writeFileAtomic(file, body));
}

/** A report's file error as one line naming --report: 2 for a place the user can change, 3 for a fault (the file module classes it). */
function reportError(file: string, write: () => void): void {
  try {
    write();
  } catch (e) {
    const err = ioError(file, e);
    throw new PmError(err.code, '--report', err.message.replace(/^[^:]*: /, ''), { value: file }, err.exitCode);
  }
}

/** Exit statuses, for --help and the README. */
export const EXIT_STATUS_HELP = `
Exit status:
  0  every load passes
  1  a load fails, breaks a detailing rule (steel limits, clear spacing, cover), is not possible within the ρg limits, is unstable, or is outside the method's scope
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
    .option('--columns <map>', 'read an analysis export: its headers for our fields, e.g. "id=Story+Combo,Pu=P,Mu=M3,Muy=M2" (other columns ignored, listed in a note)')
    .option('--compression <sign>', 'sign of axial compression in --loads: positive (default) or negative (most frame-analysis exports)')
    .option('--ignore-columns <names>', 'comma list of --loads columns to skip (any other column pmchart does not read is an error)')
    .option('--thousands <dot|none>', 'in a ";" load file with decimal commas, a dot is a thousands separator (dot: 1.500 = 1500) or a decimal point (none)')
    .option('--rho <ratio>', 'given ρg to check (utilisation); beyond the basis limits the load status is detailing')
    .option('--aggregate <length>', 'maximum aggregate size for the clear-spacing rule of the given bars and of proposals (default: the basis assumption, 3/4 in or 19–20 mm)')
    .option('--chart-gamma-step <step>', 'γ step of the emulated chart sheets', '0.05')
    .option('--chart-axial-step <step>', 'axial-level step (P/(f′c·Ag), ν for EN) of the emulated biaxial sheets read for loads with Muy', '0.1')
    .option('--proposals <n>', 'how many bar layouts to propose (0 for none)', '5')
    .option('--json', 'print JSON instead of the table')
    .option('--report <file>', 'also write a report: .txt, .json, or a one-page calculation sheet as .pdf or .svg')
    .option('--project <text>', 'project name for the title block of a PDF/SVG report')
    .option('--office <text>', 'office name for the title block of a PDF/SVG report')
    .option('--date <yyyy-mm-dd>', 'date of a PDF/SVG report and its PDF metadata (default SOURCE_DATE_EPOCH, else today)')
    .option('--mark <text>', 'column mark for the title block of a PDF/SVG report, e.g. C-14');
  addOfficeOptions(cmd, 'a PDF/SVG report').action((opts: CheckOptions) => run(() => writeCheck(opts)));
}
