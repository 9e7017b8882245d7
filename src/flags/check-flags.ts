/**
 * The flags of `pmchart check` read into one `ColumnCheckInput`: section, loads (flags or a CSV file),
 * reinforcement, bar selection and effects. `computeCheck` then calls the engine; the command and the
 * page both go through here, so they read input alike.
 */
import { readInputText } from '../io/read.js';
import { extname } from 'node:path';
import type { Detailing } from '../design/bar-selection.js';
import type { FactoredLoad } from '../design/check.js';
import { checkColumn, type ColumnCheck, type ColumnCheckInput } from '../design/column-check.js';
import { ERROR_CODES, PmError, requireInRange } from '../errors.js';
import { MAX_DRAWN_REPORT_LOADS, parseDecimal } from '../input/limits.js';
import { LOAD_FIELDS, parseLoadQuantity, parseLoadsCsv as readLoadsCsv, THOUSANDS, type LoadsCsvOptions, type Thousands } from '../input/loads-csv.js';
import { parseColumnMap, parseCompression } from '../input/column-map.js';
import { CONTROL_CHARS } from '../input/fields.js';
import { checkTitleFlags } from '../input/flags.js';
import { MAX_LIST, MAX_LOAD_ID_CHARS, MAX_LOADS_BYTES } from '../input/limits.js';
import { CHART_AXIAL_STEP_RANGE, CHART_GAMMA_STEP_RANGE, CHECK_RHO_RANGE } from '../input/limits.js';
import { barSet } from '../section/bar-tables.js';
import { barCount } from '../section/arrangements.js';
import { faceCounts, type Arrangement } from '../section/types.js';
import { DISPLAY_UNITS, parseQuantity, systemFactor, type UnitSystem } from '../units/index.js';
import { reportDate } from './format.js';
import type { OfficeFlags } from './office-flags.js';
import { resolveSectionFlags, withFlagNames, type ResolvedSection, type SectionFlags } from './section-flags.js';
import { resolveEffects, type EffectsFlags } from './check-effects.js';

export interface CheckOptions extends SectionFlags, EffectsFlags, OfficeFlags {
  pu?: string;
  mu?: string;
  loads?: string;
  /** `--columns`: an export's headers → ours (src/input/column-map.ts) */
  columns?: string;
  /** `--compression`: the load file's sign of axial compression, positive (default) or negative */
  compression?: string;
  /** comma list of load-file columns to skip (any other unknown column is an error) */
  ignoreColumns?: string;
  /** how a dot reads in a `;` load file with decimal commas: dot (thousands) or none (decimal point) */
  thousands?: string;
  rho?: string;
  aggregate?: string;
  chartGammaStep?: string;
  chartAxialStep?: string;
  proposals?: string;
  json?: boolean;
  report?: string;
  /** title block of a PDF/SVG report (with OfficeFlags: --office-file, --logo, --prepared-by, --checked-by, --revision) */
  project?: string;
  office?: string;
  /** the column mark for the report's title block (e.g. "C-14") */
  mark?: string;
  date?: string;
}

export const REPORT_FORMATS = ['.txt', '.json', '.pdf', '.svg'] as const;
/** Report formats drawn by the sheet renderer (imported only when asked for). */
export const DRAWN_REPORT_FORMATS = ['.pdf', '.svg'] as const;
export const isDrawn = (file: string): boolean => (DRAWN_REPORT_FORMATS as readonly string[]).includes(extname(file).toLowerCase());

/** Smallest practical longitudinal bar: #5 (US) or 12 mm (SI), common practice. */
const MIN_PRACTICAL_BAR = { us: 0.625, si: 12 } as const;

export interface ResolvedCheck {
  section: ResolvedSection;
  input: ColumnCheckInput;
  json: boolean;
  report?: string;
  /** notes on how the input was read (columns a --columns map leaves unread), for standard error */
  notes: string[];
}

/** Load files are read by src/input/loads-csv.ts (csv-parse; header units, ";" files, duplicates refused). */
export function parseLoadsCsv(text: string, units: UnitSystem, path = '--loads', options: LoadsCsvOptions = {}): FactoredLoad[] {
  return readLoadsCsv(text, units, path, options);
}

/** `--ignore-columns` and `--thousands` → the load reader's options; both need --loads. */
export function loadsCsvOptions(o: Pick<CheckOptions, 'loads' | 'ignoreColumns' | 'thousands'>): LoadsCsvOptions {
  const options: LoadsCsvOptions = {};
  for (const flag of ['ignoreColumns', 'thousands'] as const) {
    if (o[flag] !== undefined && o.loads === undefined) throw new PmError(ERROR_CODES.conflict, flag === 'thousands' ? '--thousands' : '--ignore-columns', 'reads a load file; give it with --loads');
  }
  if (o.ignoreColumns !== undefined) {
    const names = o.ignoreColumns.split(',').map((n) => n.trim());
    if (names.length > MAX_LIST || names.some((n) => n === '' || n.length > MAX_LOAD_ID_CHARS || CONTROL_CHARS.test(n))) {
      throw new PmError(ERROR_CODES.invalidValue, '--ignore-columns', `is not a comma list of column names (each 1–${MAX_LOAD_ID_CHARS} characters)`);
    }
    options.ignoreColumns = names;
  }
  if (o.thousands !== undefined) {
    if (!(THOUSANDS as readonly string[]).includes(o.thousands)) {
      throw new PmError(ERROR_CODES.invalidValue, '--thousands', 'is not one of the allowed values', { value: JSON.stringify(o.thousands), allowed: THOUSANDS.join(', ') });
    }
    options.thousands = o.thousands as Thousands;
  }
  return options;
}

/**
 * A note when every axial load read is tension and no sign was stated: an export giving compression as
 * negative read without `--compression negative` turns every compression load into tension (issue 22).
 */
export function signNote(loads: readonly FactoredLoad[], compression: string | undefined, at = '--loads'): string | null {
  if (compression !== undefined || loads.length === 0 || !loads.every((l) => l.Pu < 0)) return null;
  return `${at}: every axial load is tension (negative Pu); if the file gives compression as negative, add --compression negative`;
}

/** `--columns` and `--compression` as load-file options (shared by `check --loads` and `schedule`); `fields` adds the schedule's mark. */
export function exportOptions(o: { columns?: string; compression?: string }, extraFields: readonly string[] = []): LoadsCsvOptions {
  const compression = parseCompression(o.compression);
  return {
    ...(o.columns !== undefined ? { columns: parseColumnMap(o.columns, [...extraFields, ...LOAD_FIELDS]), duplicates: 'number' as const } : {}),
    compression,
  };
}

/**
 * Reads the flags into one `ResolvedCheck`. `given` supplies loads already read (a schedule's loads of
 * one mark, src/flags/schedule-rows.ts): they stand for a load file (end moments as columns).
 */
export function resolveCheckOptions(given0: CheckOptions, given?: { loads: readonly FactoredLoad[] }): ResolvedCheck {
  const o0 = given0;
  if (o0.report !== undefined) {
    const ext = extname(o0.report).toLowerCase();
    if (!(REPORT_FORMATS as readonly string[]).includes(ext)) {
      throw new PmError(ERROR_CODES.invalidValue, '--report', 'has an unknown extension', { value: o0.report, allowed: REPORT_FORMATS.join(', ') });
    }
  }
  if (o0.date !== undefined) reportDate(o0.date);
  checkTitleFlags(o0);
  const o = given0;
  const section = resolveSectionFlags(o, true);
  const u = section.units;
  const { basis } = section;

  let loads: FactoredLoad[];
  const notes: string[] = [];
  if (given === undefined && o.loads === undefined && (o.columns !== undefined || o.compression !== undefined)) {
    throw new PmError(ERROR_CODES.conflict, o.columns !== undefined ? '--columns' : '--compression', 'applies to --loads; --pu is compression positive');
  }
  const csvOptions = loadsCsvOptions(o);
  if (given !== undefined) {
    // read already (a schedule's loads of one mark)
    loads = given.loads.map((l) => ({ ...l }));
  } else if (o.loads !== undefined) {
    if (o.pu !== undefined || o.mu !== undefined) throw new PmError(ERROR_CODES.conflict, '--loads', 'and --pu/--mu both give loads; use one of them');
    const text = readInputText(o.loads, MAX_LOADS_BYTES, '--loads');
    loads = parseLoadsCsv(text, u, '--loads', { ...exportOptions(o), ...csvOptions, onNote: (n) => notes.push(n) });
    const sign = signNote(loads, o.compression);
    if (sign !== null) notes.push(sign);
    if (o.report !== undefined && isDrawn(o.report) && loads.length > MAX_DRAWN_REPORT_LOADS) {
      throw new PmError(ERROR_CODES.outOfRange, '--report', `draws at most ${MAX_DRAWN_REPORT_LOADS} loads and --loads has ${loads.length}; write a .txt or .json report for every load`);
    }
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
    ...(section.gammaB !== undefined ? { gammaB: section.gammaB } : {}),
    gammaSource: section.gammaSource,
    capContext: section.capContext,
    loads,
  };
  if (o.chartGammaStep !== undefined) {
    const step = parseDecimal(o.chartGammaStep) ?? NaN;
    input.chartGammaStep = requireInRange('--chart-gamma-step', Number.isFinite(step) ? step : NaN, ...CHART_GAMMA_STEP_RANGE);
  }
  if (o.chartAxialStep !== undefined) {
    const step = parseDecimal(o.chartAxialStep) ?? NaN;
    input.chartAxialStep = requireInRange('--chart-axial-step', Number.isFinite(step) ? step : NaN, ...CHART_AXIAL_STEP_RANGE);
  }
  if (o.rho !== undefined) {
    // beyond the basis's limits the check runs and reports `detailing` (issue 19); only what the maths takes is refused
    const rho = parseDecimal(o.rho) ?? NaN;
    input.rho = requireInRange('--rho', Number.isFinite(rho) ? rho : NaN, ...CHECK_RHO_RANGE);
  } else if (section.bar && (o.barsPerFace !== undefined || o.bars !== undefined) && section.arrangement.kind !== 'custom') {
    const count = barCount(section.arrangement);
    input.layout = {
      arrangement: section.arrangement,
      area: count * section.bar.area,
      gamma: section.gamma,
      description: `${/^\d+(\.\d+)?$/.test(section.bar.name) ? `${count} × ${section.bar.name} mm` : `${count} ${section.bar.name}`}${faceText(section.arrangement)}`,
    };
  }

  let aggregate: number | undefined;
  if (o.aggregate !== undefined) {
    aggregate = requireInRange('--aggregate', parseQuantity(o.aggregate, 'length', u, '--aggregate'), u === 'us' ? 0.25 : 5, u === 'us' ? 3 : 75, DISPLAY_UNITS[u].length);
  }
  // what the detailing rules need of the given bars beyond their area (src/design/detailing.ts)
  input.detailingInput = {
    ...(section.bar ? { bar: { name: section.bar.name, diameter: section.bar.diameter } } : {}),
    ...(section.cover !== undefined ? { cover: section.cover, tieDiameter: section.tieDiameter ?? 0 } : {}),
    ...(aggregate !== undefined ? { aggregate } : {}),
  };
  const proposals = o.proposals === undefined ? 5 : (parseDecimal(o.proposals) ?? NaN);
  if (!Number.isInteger(proposals)) throw new PmError(ERROR_CODES.invalidValue, '--proposals', 'is not a whole number', { value: o.proposals, allowed: '0–20' });
  requireInRange('--proposals', proposals, 0, 20);
  if (proposals > 0) {
    const set = barSet(basis.barSet);
    const k = systemFactor('length', set.units, u);
    const sizes = set.sizes
      .map((s) => ({ name: s.name, diameter: s.diameter * k, area: s.area * k * k }))
      .filter((s) => s.diameter >= MIN_PRACTICAL_BAR[u] - 1e-9);
    const detailing: Detailing =
      section.cover !== undefined
        ? { kind: 'cover', cover: section.cover, tieDiameter: section.tieDiameter ?? 0 }
        : { kind: 'gamma', gamma: section.gamma, ...(section.gammaB !== undefined ? { gammaB: section.gammaB } : {}) };
    input.barSelection = { detailing, sizes, count: proposals, ...(aggregate !== undefined ? { aggregate } : {}) };
  }
  const fx = resolveEffects(o, section, input, given === undefined && o.loads === undefined);
  input.loads = fx.loads;
  if (fx.slenderness) input.slenderness = fx.slenderness;
  return { section, input, json: o.json === true, ...(o.report !== undefined ? { report: o.report } : {}), notes };
}

/** " (3 on each b face, 5 on each h face)" for unequal four-faces counts; "" otherwise. */
function faceText(a: Arrangement): string {
  if (a.kind !== 'four-faces') return '';
  const [nb, nh] = faceCounts(a.barsPerFace);
  return nb === nh ? '' : ` (${nb} on each b face, ${nh} on each h face)`;
}

/** Resolves the flags and checks every load (no output). */
export function computeCheck(o: CheckOptions): { rc: ResolvedCheck; check: ColumnCheck } {
  const rc = resolveCheckOptions(o);
  return { rc, check: withFlagNames(() => checkColumn(rc.input)) };
}

