/**
 * `pmchart schedule <schedule.csv> --loads <loads.csv>` (issue 22): every column mark of a building
 * checked against the combinations of an analysis export, in one run. A thin adapter:
 *
 *   schedule file ─▶ rows (src/input/schedule-csv.ts) ─┐
 *   loads file + --columns/--compression ─▶ loads by mark (src/flags/schedule-rows.ts)
 *     ─▶ marks matched (src/design/schedule.ts) ─▶ each mark through `checkColumn` (here, or over --jobs processes)
 *     ─▶ text table or JSON (src/report/schedule-view.ts); --report: summary page + each mark's calculation sheet
 *
 * Exit status as `check`: 0 every load of every mark passes, 1 any does not, 2 bad input, 3 internal or I/O error.
 */
import { readFileSync, statSync } from 'node:fs';
import { basename, extname } from 'node:path';
import type { Command } from 'commander';
import type { FactoredLoad } from '../design/check.js';
import { summariseSchedule } from '../design/schedule.js';
import { ERROR_CODES, PmError } from '../errors.js';
import { reportDate } from '../flags/format.js';
import { checkRows, readSchedule, type MarkRow } from '../flags/schedule-rows.js';
import { MAX_LOADS_BYTES, MAX_SCHEDULE_BYTES, SCHEDULE_JOBS_RANGE } from '../input/limits.js';
import type { ScheduleRow } from '../input/schedule-csv.js';
import { ioError } from '../io/files.js';
import { scheduleJson, scheduleText, type ScheduleHead } from '../report/schedule-view.js';
import { generatorLabel } from '../version.js';
import { EXIT_STATUS_HELP } from './check.js';

export interface ScheduleOptions {
  loads?: string;
  columns?: string;
  compression?: string;
  allowMissing?: boolean;
  json?: boolean;
  report?: string;
  jobs?: string;
  proposals?: string;
  project?: string;
  office?: string;
  date?: string;
}

/** Marks at or above which progress goes to standard error. */
export const PROGRESS_ABOVE_MARKS = 200;

/** A file's text; a file the user named that cannot be read is bad input (exit 2). */
function readText(file: string, flag: string, maxBytes: number): string {
  try {
    if (statSync(file).size > maxBytes) throw new PmError(ERROR_CODES.invalidValue, flag, `is larger than ${maxBytes} bytes`, { value: file });
    return readFileSync(file, 'utf8');
  } catch (e) {
    if (e instanceof PmError) throw e;
    throw new PmError(ERROR_CODES.io, flag, `cannot be read (${(e as NodeJS.ErrnoException).code ?? 'error'})`, { value: file });
  }
}

function wholeOption(flag: string, text: string | undefined, fallback: number, range: readonly [number, number]): number {
  if (text === undefined) return fallback;
  const v = Number(text);
  if (!/^\s*\d+\s*$/.test(text) || v < range[0] || v > range[1]) throw new PmError(ERROR_CODES.outOfRange, flag, `must be a whole number in ${range[0]}–${range[1]}`, { value: text, allowed: `${range[0]}–${range[1]}` });
  return v;
}

/** Everything a run has read and resolved before any mark is checked. */
export interface PreparedSchedule {
  /** schedule rows with loads, in mark order */
  rows: ScheduleRow[];
  loads: Map<string, FactoredLoad[]>;
  proposals: number;
  jobs: number;
  notes: string[];
  at: string;
}

/** Reads both files and the options, matches the marks; every input error is found here (exit 2). */
export function prepareSchedule(file: string, o: ScheduleOptions): PreparedSchedule {
  if (o.loads === undefined) throw new PmError(ERROR_CODES.missing, '--loads', 'is required: the load combinations of every mark (CSV with mark, id, Pu, Mu columns, or an export with --columns)');
  if (o.report !== undefined && extname(o.report).toLowerCase() !== '.pdf') throw new PmError(ERROR_CODES.invalidValue, '--report', 'must end in .pdf', { value: o.report });
  if (o.date !== undefined) reportDate(o.date);
  const proposals = wholeOption('--proposals', o.proposals, 0, [0, 20]);
  const jobs = wholeOption('--jobs', o.jobs, 1, SCHEDULE_JOBS_RANGE);
  const at = basename(file);
  const read = readSchedule(readText(file, 'schedule file', MAX_SCHEDULE_BYTES), () => readText(o.loads!, '--loads', MAX_LOADS_BYTES), { ...o, proposals }, at, '--loads');
  return { ...read, proposals, jobs, at };
}

/** Progress lines on standard error for long runs: every tenth of the marks. */
function progress(total: number): (done: number) => void {
  if (total < PROGRESS_ABOVE_MARKS) return () => {};
  const step = Math.ceil(total / 10);
  return (done) => {
    if (done % step === 0 || done === total) process.stderr.write(`pmchart: schedule: ${done}/${total} marks checked\n`);
  };
}

/** The mark rows, in mark order: here, or spread over `jobs` processes (the same rows either way). */
export async function markRows(p: PreparedSchedule, onMark?: (done: number) => void): Promise<MarkRow[]> {
  if (p.jobs > 1 && p.rows.length > 1) {
    const { rowsInChildren } = await import('./schedule-jobs.js');
    return rowsInChildren(p, onMark);
  }
  const out: MarkRow[] = [];
  // the table and JSON need no chart readings (the sheets of --report do): the same rows, a fraction of the work
  for (const { check: _c, ...row } of checkRows(p.rows, p.loads, p.proposals, p.at, false)) {
    out.push(row);
    onMark?.(out.length);
  }
  return out;
}

/** The head of every view: the bases in mark order, the notes, the proposals asked. */
export function headOf(rows: readonly MarkRow[], p: PreparedSchedule): ScheduleHead {
  const bases: { code: string; title: string }[] = [];
  for (const r of rows) if (!bases.some((b) => b.title === r.title)) bases.push({ code: r.code, title: r.title });
  return { bases, notes: p.notes, proposals: p.proposals };
}

/** Runs the command; returns what it prints and sets the exit status. */
export async function runSchedule(file: string, o: ScheduleOptions): Promise<string> {
  const p = prepareSchedule(file, o);
  const tick = progress(p.rows.length);
  let rows: MarkRow[];
  if (o.report !== undefined) {
    const { writeScheduleReport } = await import('../sheet/schedule-report.js');
    const meta = { date: reportDate(o.date), generator: generatorLabel(), ...(o.project !== undefined ? { project: o.project } : {}), ...(o.office !== undefined ? { office: o.office } : {}) };
    // the sheets are drawn here, one mark at a time as it is checked (--jobs spreads text and JSON runs)
    rows = await writeScheduleReport(o.report, checkRows(p.rows, p.loads, p.proposals, p.at), (r) => headOf(r, p), meta, tick).catch((e: unknown) => {
      if (e instanceof PmError) throw e;
      const err = ioError(o.report!, e);
      throw new PmError(err.code, '--report', err.message.replace(/^[^:]*: /, ''), { value: o.report }, err.exitCode);
    });
  } else rows = await markRows(p, tick);
  const { summary, exitCode } = summariseSchedule(rows);
  if (exitCode !== 0) process.exitCode = exitCode;
  const head = headOf(rows, p);
  return o.json ? scheduleJson(rows, summary, exitCode, head, generatorLabel()) : scheduleText(rows, summary, head);
}

export function registerSchedule(program: Command, run: (fn: () => Promise<void> | void) => Promise<void>): void {
  program
    .command('schedule <file>')
    .description("check every column mark of a schedule against an analysis export's load combinations")
    .addHelpText('after', EXIT_STATUS_HELP.replace('every load passes', 'every load of every mark passes'))
    .option('--loads <file>', 'CSV of loads: mark, id, Pu, Mu (Muy, end moments optional), one row per mark and combination')
    .option('--columns <map>', 'read an analysis export: its headers for our fields, e.g. "mark=Column,id=Story+Combo,Pu=P,Mu=M3,Muy=M2" (other columns ignored, listed in a note)')
    .option('--compression <sign>', 'sign of axial compression in --loads: positive (default) or negative (most frame-analysis exports)')
    .option('--allow-missing', 'skip marks found in only one of the files (listed in a note) instead of stopping')
    .option('--proposals <n>', 'bar layouts to propose per mark (default 0: none)')
    .option('--jobs <n>', 'processes checking marks (default 1); the output does not depend on it')
    .option('--json', 'print JSON instead of the table')
    .option('--report <file.pdf>', 'also write a bound report: a summary page, then the calculation sheet of every mark, one bookmark per mark')
    .option('--project <text>', 'project name for the title blocks of the report')
    .option('--office <text>', 'office name for the title blocks of the report')
    .option('--date <yyyy-mm-dd>', 'date of the report and its PDF metadata (default SOURCE_DATE_EPOCH, else today)')
    .action((file: string, opts: ScheduleOptions) =>
      run(async () => {
        process.stdout.write(await runSchedule(file, opts));
      }),
    );
}
