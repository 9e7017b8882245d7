/**
 * `pmchart check`: a thin adapter over the check engine (src/design/column-check.ts). It parses the
 * flags into a `ColumnCheckInput`, calls `checkColumn`, prints a view of the one result
 * (src/report/check-view.ts) and sets the exit status: 0 when every load passes, 1 when any load fails,
 * is not possible, unstable or outside the method's scope (2 bad input, 3 internal or I/O error).
 */
import { readFileSync } from 'node:fs';
import { ioError, writeFileAtomic } from '../io/files.js';
import { extname } from 'node:path';
import type { Command } from 'commander';
import type { Detailing } from '../design/bar-selection.js';
import type { FactoredLoad } from '../design/check.js';
import { checkColumn, type ColumnCheck, type ColumnCheckInput } from '../design/column-check.js';
import { ERROR_CODES, PmError, requireInRange } from '../errors.js';
import { CAUTION } from '../report/caution.js';
import { checkAssumptions, checkJson, checkReportText, checkText } from '../report/check-view.js';
import { parseLoadQuantity, parseLoadsCsv as readLoadsCsv } from '../input/loads-csv.js';
import { barSet } from '../section/bar-tables.js';
import { barCount } from '../section/arrangements.js';
import { DISPLAY_UNITS, parseQuantity, systemFactor, type UnitSystem } from '../units/index.js';
import { generatorLabel } from '../version.js';
import { reportDate } from './format.js';
import { addSectionOptions, resolveSectionFlags, type ResolvedSection, type SectionFlags } from './section-flags.js';
import { addEffectsOptions, resolveEffects, type EffectsFlags } from './check-effects.js';

export interface CheckOptions extends SectionFlags, EffectsFlags {
  pu?: string;
  mu?: string;
  loads?: string;
  rho?: string;
  aggregate?: string;
  chartGammaStep?: string;
  proposals?: string;
  json?: boolean;
  report?: string;
  /** title block of a PDF/SVG report */
  project?: string;
  office?: string;
  date?: string;
}

export const REPORT_FORMATS = ['.txt', '.json', '.pdf', '.svg'] as const;
/** Report formats drawn by the sheet renderer (imported only when asked for). */
export const DRAWN_REPORT_FORMATS = ['.pdf', '.svg'] as const;
const isDrawn = (file: string): boolean => (DRAWN_REPORT_FORMATS as readonly string[]).includes(extname(file).toLowerCase());

/** Smallest practical longitudinal bar: #5 (US) or 12 mm (SI), common practice. */
const MIN_PRACTICAL_BAR = { us: 0.625, si: 12 } as const;

export interface ResolvedCheck {
  section: ResolvedSection;
  input: ColumnCheckInput;
  json: boolean;
  report?: string;
}

/** Load files are read by src/input/loads-csv.ts (csv-parse; header units, ";" files, duplicates refused). */
export function parseLoadsCsv(text: string, units: UnitSystem, path = '--loads'): FactoredLoad[] {
  return readLoadsCsv(text, units, path);
}

export function resolveCheckOptions(o: CheckOptions): ResolvedCheck {
  if (o.report !== undefined) {
    const ext = extname(o.report).toLowerCase();
    if (!(REPORT_FORMATS as readonly string[]).includes(ext)) {
      throw new PmError(ERROR_CODES.invalidValue, '--report', 'has an unknown extension', { value: o.report, allowed: REPORT_FORMATS.join(', ') });
    }
  }
  if (o.date !== undefined) reportDate(o.date);
  const section = resolveSectionFlags(o, true);
  const u = section.units;
  const { basis } = section;

  let loads: FactoredLoad[];
  if (o.loads !== undefined) {
    if (o.pu !== undefined || o.mu !== undefined) throw new PmError(ERROR_CODES.conflict, '--loads', 'and --pu/--mu both give loads; use one of them');
    let text: string;
    try {
      text = readFileSync(o.loads, 'utf8');
    } catch (e) {
      throw new PmError(ERROR_CODES.io, '--loads', `cannot be read (${(e as NodeJS.ErrnoException).code ?? 'error'})`, { value: o.loads });
    }
    loads = parseLoadsCsv(text, u);
  } else {
    if (o.pu === undefined) throw new PmError(ERROR_CODES.missing, '--pu', `is required, or --loads FILE.csv (a force, default unit ${DISPLAY_UNITS[u].force}; tension negative)`);
    if (o.mu === undefined) throw new PmError(ERROR_CODES.missing, '--mu', `is required with --pu (a moment, default unit ${DISPLAY_UNITS[u].moment})`);
    loads = [{ id: 'load', Pu: parseLoadQuantity(o.pu, 'force', u, '--pu'), Mu: parseLoadQuantity(o.mu, 'moment', u, '--mu') }];
  }

  const input: ColumnCheckInput = {
    basis,
    shape: section.shape,
    arrangement: section.arrangement,
    gamma: section.gamma,
    gammaSource: section.gammaSource,
    capContext: section.capContext,
    loads,
  };
  if (o.chartGammaStep !== undefined) {
    const step = Number(o.chartGammaStep);
    input.chartGammaStep = requireInRange('--chart-gamma-step', Number.isFinite(step) ? step : NaN, 0.01, 0.2);
  }
  if (o.rho !== undefined) {
    const lim = basis.rhoLimits;
    const rho = Number(o.rho);
    input.rho = requireInRange('--rho', Number.isFinite(rho) ? rho : NaN, lim.min, lim.max);
  } else if (section.bar && (o.barsPerFace !== undefined || o.bars !== undefined) && section.arrangement.kind !== 'custom') {
    const count = barCount(section.arrangement);
    input.layout = {
      arrangement: section.arrangement,
      area: count * section.bar.area,
      gamma: section.gamma,
      description: /^\d+(\.\d+)?$/.test(section.bar.name) ? `${count} × ${section.bar.name} mm` : `${count} ${section.bar.name}`,
    };
  }

  let aggregate: number | undefined;
  if (o.aggregate !== undefined) {
    aggregate = requireInRange('--aggregate', parseQuantity(o.aggregate, 'length', u, '--aggregate'), u === 'us' ? 0.25 : 5, u === 'us' ? 3 : 75, DISPLAY_UNITS[u].length);
  }
  const proposals = o.proposals === undefined ? 5 : Number(o.proposals);
  if (!Number.isInteger(proposals)) throw new PmError(ERROR_CODES.invalidValue, '--proposals', 'is not a whole number', { value: o.proposals, allowed: '0–20' });
  requireInRange('--proposals', proposals, 0, 20);
  if (proposals > 0) {
    const set = barSet(basis.barSet);
    const k = systemFactor('length', set.units, u);
    const sizes = set.sizes
      .map((s) => ({ name: s.name, diameter: s.diameter * k, area: s.area * k * k }))
      .filter((s) => s.diameter >= MIN_PRACTICAL_BAR[u] - 1e-9);
    const detailing: Detailing =
      section.cover !== undefined ? { kind: 'cover', cover: section.cover, tieDiameter: section.tieDiameter ?? 0 } : { kind: 'gamma', gamma: section.gamma };
    input.barSelection = { detailing, sizes, count: proposals, ...(aggregate !== undefined ? { aggregate } : {}) };
  }
  const fx = resolveEffects(o, section, input, o.loads === undefined);
  input.loads = fx.loads;
  if (fx.slenderness) input.slenderness = fx.slenderness;
  return { section, input, json: o.json === true, ...(o.report !== undefined ? { report: o.report } : {}) };
}

/** Resolves the flags and checks every load (no output). */
export function computeCheck(o: CheckOptions): { rc: ResolvedCheck; check: ColumnCheck } {
  const rc = resolveCheckOptions(o);
  return { rc, check: checkColumn(rc.input) };
}

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
    .option('--proposals <n>', 'how many bar layouts to propose (0 for none)', '5')
    .option('--json', 'print JSON instead of the table')
    .option('--report <file>', 'also write a report: .txt, .json, or a one-page calculation sheet as .pdf or .svg')
    .option('--project <text>', 'project name for the title block of a PDF/SVG report')
    .option('--office <text>', 'office name for the title block of a PDF/SVG report')
    .option('--date <yyyy-mm-dd>', 'date of a PDF/SVG report and its PDF metadata (default SOURCE_DATE_EPOCH, else today)')
    .action((opts: CheckOptions) => run(async () => void process.stdout.write(await runCheckAsync(opts))));
}
