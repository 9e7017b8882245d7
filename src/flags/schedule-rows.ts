/**
 * A schedule's rows read as `check` flags (issue 22): each row becomes the `CheckOptions` its cells
 * would be on the command line and goes through the same resolver (`resolveCheckOptions`), so a mark
 * is checked exactly as `pmchart check` would check that column. Errors name the schedule line and
 * column (a flag `--bars-per-face` in the resolver's words becomes the column `bars_per_face`).
 *
 *   schedule text ─▶ rows (src/input/schedule-csv.ts) ─▶ CheckOptions ─▶ resolveCheckOptions ─▶ ScheduleEntry
 *   loads text + --columns/--compression ─▶ loads by mark, bare numbers in each mark's units
 */
import type { FactoredLoad } from '../design/check.js';
import type { ColumnCheck } from '../design/column-check.js';
import { checkMark, matchMarks, rowFacts, type ScheduleEntry, type ScheduleRowFacts } from '../design/schedule.js';
import { ERROR_CODES, isPmError, PmError } from '../errors.js';
import { parseGroupedLoadsCsv } from '../input/loads-csv.js';
import type { UnitSystem } from '../units/index.js';
import { parseScheduleCsv, SCHEDULE_COLUMNS, type ScheduleColumn, type ScheduleRow } from '../input/schedule-csv.js';
import { exportOptions, resolveCheckOptions, signNote, type CheckOptions, type ResolvedCheck } from './check-flags.js';

/** The flag each schedule column stands for: `bars_per_face` → `--bars-per-face`. */
const flagOfColumn = (c: ScheduleColumn): string => `--${c.replace(/_/g, '-')}`;
const COLUMN_OF_FLAG = new Map(SCHEDULE_COLUMNS.map((c) => [flagOfColumn(c), c]));

/** A resolver's words about flags, as schedule columns ("--cover/--tie" → "cover/tie"). */
const asColumns = (text: string): string => text.replace(/--[a-z][a-z0-9-]*/g, (f) => COLUMN_OF_FLAG.get(f) ?? f);

/** Runs `fn` with its errors placed at `<at> line N <column>`. */
function atRow<T>(at: string, line: number, fn: () => T): T {
  try {
    return fn();
  } catch (e) {
    if (!isPmError(e)) throw e;
    const path = asColumns(e.path);
    throw new PmError(e.code, `${at} line ${line}${path ? ` ${path}` : ''}`, asColumns(e.detail), e.facts, e.exitCode);
  }
}

/** A yes/no cell (the schedule's `sway`): yes, true, 1 or no, false, 0, any case; else an error naming the column. */
function yesNo(cell: string): boolean {
  const t = cell.trim().toLowerCase();
  if (t === 'yes' || t === 'true' || t === '1') return true;
  if (t === 'no' || t === 'false' || t === '0') return false;
  throw new PmError(ERROR_CODES.invalidValue, '--sway', 'is not yes or no', { value: cell, allowed: 'yes, no' });
}

/** A row's cells as the `check` flags they stand for. */
export function rowOptions(row: ScheduleRow, proposals: number): CheckOptions {
  const c = row.cells;
  const pair = c.bars_per_face === undefined ? undefined : /^\s*(\d+)\s*[xX×]\s*(\d+)\s*$/.exec(c.bars_per_face);
  const o: CheckOptions = {
    proposals: String(proposals),
    ...(c.code !== undefined ? { code: c.code } : {}),
    ...(c.units !== undefined ? { units: c.units } : {}),
    ...(c.fc !== undefined ? { fc: c.fc } : {}),
    ...(c.fy !== undefined ? { fy: c.fy } : {}),
    ...(c.diameter !== undefined ? { shape: 'circle', diameter: c.diameter } : {}),
    ...(c.b !== undefined ? { b: c.b } : {}),
    ...(c.h !== undefined ? { h: c.h } : {}),
    ...(c.arrangement !== undefined ? { arrangement: c.arrangement } : {}),
    // pairs are written 3x5 in a schedule (`;` and `,` separate cells); the flag reads "3,5"
    ...(c.bars_per_face !== undefined ? { barsPerFace: pair ? `${pair[1]},${pair[2]}` : c.bars_per_face } : {}),
    ...(c.bars !== undefined ? { bars: c.bars } : {}),
    ...(c.bar !== undefined ? { bar: c.bar } : {}),
    ...(c.cover !== undefined ? { cover: c.cover } : {}),
    ...(c.tie !== undefined ? { tie: c.tie } : {}),
    ...(c.transverse !== undefined ? { transverse: c.transverse } : {}),
    ...(c.klu !== undefined ? { klu: c.klu } : {}),
    ...(c.klu_y !== undefined ? { kluY: c.klu_y } : {}),
    ...(c.beta_dns !== undefined ? { betaDns: c.beta_dns } : {}),
    ...(c.gamma !== undefined ? { gamma: c.gamma } : {}),
    ...(c.gamma_b !== undefined ? { gammaB: c.gamma_b } : {}),
    ...(c.creep !== undefined ? { creep: c.creep } : {}),
    ...(c.aggregate !== undefined ? { aggregate: c.aggregate } : {}),
    ...(c.sway !== undefined ? { sway: yesNo(c.sway) } : {}),
    ...(c.klu_braced !== undefined ? { kluBraced: c.klu_braced } : {}),
    ...(c.lu !== undefined ? { lu: c.lu } : {}),
    ...(c.k1 !== undefined ? { k1: c.k1 } : {}),
    ...(c.k2 !== undefined ? { k2: c.k2 } : {}),
    ...(c.stability_index !== undefined ? { stabilityIndex: c.stability_index } : {}),
    ...(c.storey_pu !== undefined ? { storeyPu: c.storey_pu } : {}),
    ...(c.storey_pc !== undefined ? { storeyPc: c.storey_pc } : {}),
  };
  return o;
}

/** A row resolved as `check` resolves its flags, with the mark's loads (none: the section alone). */
export function resolveRow(row: ScheduleRow, loads: readonly FactoredLoad[], proposals: number, at = 'schedule'): ResolvedCheck {
  return atRow(at, row.line, () => {
    const c = row.cells;
    // gamma replaces the detailing that gives γ (the bar size stays, for the bars' area)
    if (c.gamma !== undefined && (c.cover !== undefined || c.tie !== undefined)) {
      throw new PmError(ERROR_CODES.conflict, 'gamma', `and ${c.cover !== undefined ? 'cover' : 'tie'} both set γ; give gamma, or cover and tie`);
    }
    if (c.bars_per_face === undefined && c.bars === undefined) throw new PmError(ERROR_CODES.missing, 'bars_per_face', 'is required (or bars for a ring): the schedule checks the bars it gives');
    return resolveCheckOptions(rowOptions(row, proposals), { loads });
  });
}

/** The unit system a row's bare numbers are in: its `units`, else its basis's first. */
export function rowUnits(row: ScheduleRow, at = 'schedule'): UnitSystem {
  return resolveRow(row, [], 0, at).section.units;
}

/** Loads by mark from a load file's text, bare numbers in each mark's units (the first mark's for marks not in the schedule). */
export function readScheduleLoads(
  text: string,
  rows: readonly ScheduleRow[],
  o: { columns?: string; compression?: string },
  at = '--loads',
  onNote?: (n: string) => void,
  scheduleAt = 'schedule',
): Map<string, FactoredLoad[]> {
  const units = new Map<string, UnitSystem>();
  for (const r of rows) units.set(r.mark, rowUnits(r, scheduleAt));
  const first = units.get(rows[0]!.mark)!;
  const grouped = parseGroupedLoadsCsv(text, first, at, {
    ...exportOptions(o, ['mark']),
    group: 'mark',
    duplicates: 'number',
    unitsOf: (mark) => units.get(mark) ?? first,
    ...(onNote ? { onNote } : {}),
  });
  const sign = signNote(grouped.map((g) => g.load), o.compression, at);
  if (sign !== null) onNote?.(sign);
  const out = new Map<string, FactoredLoad[]>();
  for (const g of grouped) {
    const list = out.get(g.group);
    if (list) list.push(g.load);
    else out.set(g.group, [g.load]);
  }
  return out;
}

/** Every row resolved with its loads: the library's schedule entries (section and bars, loads apart). */
export function scheduleEntries(rows: readonly ScheduleRow[], loads: ReadonlyMap<string, readonly FactoredLoad[]>, proposals: number, at = 'schedule'): ScheduleEntry[] {
  return rows.map((row) => {
    const rc = resolveRow(row, loads.get(row.mark) ?? [], proposals, at);
    const { loads: _given, ...input } = rc.input;
    return { mark: row.mark, input };
  });
}

/** One mark's row for the views: the engine's figures and the mark's design basis. */
export type MarkRow = ScheduleRowFacts & { code: string; title: string };

/** The rows of `rows` (schedule rows with loads), checked one at a time in the order given; what `--jobs` hands each process. */
export function* checkRows(rows: readonly ScheduleRow[], loads: ReadonlyMap<string, readonly FactoredLoad[]>, proposals: number, at = 'schedule', readings = true): Generator<MarkRow & { check: ColumnCheck }> {
  for (const row of rows) {
    const [entry] = scheduleEntries([row], loads, proposals, at);
    const r = checkMark(entry!, loads.get(row.mark)!, { readings });
    yield { ...rowFacts(r.mark, r.check), code: r.check.basis.code, title: r.check.basis.title, check: r.check };
  }
}

/** A schedule and its loads read from their texts, marks matched: what a front end checks, mark by mark. */
export interface ReadSchedule {
  /** schedule rows with loads, in mark order */
  rows: ScheduleRow[];
  loads: Map<string, FactoredLoad[]>;
  /** notes on how the input was read (ignored export columns, a sign, skipped marks) */
  notes: string[];
}

/**
 * Reads a schedule's text and its loads' text (with the export map and sign convention) and matches the
 * marks (`loadsText` may be a function, read after the schedule parses); every input error is found here, named at `at` (the schedule) or `loadsAt` (the loads). The one
 * reader of `pmchart schedule` and the page's schedule panel.
 */
export function readSchedule(
  scheduleText: string,
  loadsText: string | (() => string),
  o: { columns?: string; compression?: string; allowMissing?: boolean; proposals: number },
  at = 'schedule',
  loadsAt = '--loads',
): ReadSchedule {
  const rows = parseScheduleCsv(scheduleText, at);
  const notes: string[] = [];
  const loads = readScheduleLoads(typeof loadsText === 'string' ? loadsText : loadsText(), rows, o, loadsAt, (n) => notes.push(n), at);
  // each row resolved with its loads: a bad cell or a load column of the wrong convention is an error here
  const entries = scheduleEntries(rows, loads, o.proposals, at);
  const { entries: kept, missing } = matchMarks(entries, loads, { allowMissing: o.allowMissing === true });
  if (missing.withoutLoads.length > 0) notes.push(`marks of the schedule with no loads, not checked: ${missing.withoutLoads.join(', ')}`);
  if (missing.notInSchedule.length > 0) notes.push(`marks of the loads not in the schedule, ignored: ${missing.notInSchedule.join(', ')}`);
  if (kept.length === 0) throw new PmError(ERROR_CODES.missing, loadsAt, 'has loads for no mark of the schedule');
  const byMark = new Map(rows.map((r) => [r.mark, r]));
  return { rows: kept.map((e) => byMark.get(e.mark)!), loads, notes };
}
