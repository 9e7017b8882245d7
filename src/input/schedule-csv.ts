/**
 * Column schedule files (`pmchart schedule`, issue 22): CSV, one row per column mark, read with
 * csv-parse like load files. Each cell stays text here (its form is checked by the section flags' own
 * zod schema when the row is resolved, src/flags/schedule-rows.ts); this reader checks the header,
 * the marks and the size, and keeps each row's line for errors. Browser-safe.
 *
 *   mark, code, units, fc, fy, b, h | diameter, arrangement, bars_per_face | bars, bar, cover, tie
 *   optional: transverse, klu, klu_y, beta_dns, gamma (replaces cover and tie), gamma_b, creep, aggregate,
 *   sway (yes/no), klu_braced, lu, k1, k2, stability_index, storey_pu, storey_pc
 */
import { parse } from 'csv-parse/sync';
import { z } from 'zod';
import { ERROR_CODES, PmError } from '../errors.js';
import { parseOrThrow, text } from './fields.js';
import { detectSeparator } from './loads-csv.js';
import { MAX_FLAG_CHARS, MAX_MARK_CHARS, MAX_SCHEDULE_BYTES, MAX_SCHEDULE_MARKS } from './limits.js';

/** Every column a schedule may have, in the order the README lists them. */
export const SCHEDULE_COLUMNS = [
  'mark',
  'code',
  'units',
  'fc',
  'fy',
  'b',
  'h',
  'diameter',
  'arrangement',
  'bars_per_face',
  'bars',
  'bar',
  'cover',
  'tie',
  'transverse',
  'klu',
  'klu_y',
  'beta_dns',
  'gamma',
  'gamma_b',
  'creep',
  'aggregate',
  // a sway (unbraced) column (issue 24): per column, the storey data as member values (per load in the loads file)
  'sway',
  'klu_braced',
  'lu',
  'k1',
  'k2',
  'stability_index',
  'storey_pu',
  'storey_pc',
] as const;
export type ScheduleColumn = (typeof SCHEDULE_COLUMNS)[number];
/** Columns every schedule names (the others are optional or depend on the shape and detailing). */
export const REQUIRED_SCHEDULE_COLUMNS = ['mark', 'code', 'fc', 'fy', 'arrangement', 'bar'] as const;

/** One row: its file line and its cells by column (absent or empty cells left out). */
export interface ScheduleRow {
  readonly line: number;
  readonly mark: string;
  readonly cells: Readonly<Partial<Record<ScheduleColumn, string>>>;
}

const RowSchema = z.object({
  mark: text(MAX_MARK_CHARS).trim().min(1, { message: 'is empty' }),
  ...Object.fromEntries(SCHEDULE_COLUMNS.filter((c) => c !== 'mark').map((c) => [c, text(MAX_FLAG_CHARS).optional()])),
}) as unknown as z.ZodType<Partial<Record<ScheduleColumn, string>> & { mark: string }>;

/** Reads a schedule's text; `at` names it in errors ("schedule", or the file name). */
export function parseScheduleCsv(textIn: string, at = 'schedule'): ScheduleRow[] {
  if (textIn.length > MAX_SCHEDULE_BYTES) throw new PmError(ERROR_CODES.invalidValue, at, `is larger than ${MAX_SCHEDULE_BYTES} bytes`);
  const delimiter = detectSeparator(textIn.replace(/^\uFEFF/, ''));
  let records: string[][];
  try {
    records = parse(textIn, {
      bom: true,
      delimiter,
      relax_column_count: true,
      skip_empty_lines: true,
      comment: '#',
      comment_no_infix: true,
      to: MAX_SCHEDULE_MARKS + 2,
      on_record: (record: string[], context: { lines: number }) => [String(context.lines), ...record],
    });
  } catch (e) {
    const err = e as Error & { lines?: number };
    throw new PmError(ERROR_CODES.invalidValue, `${at} line ${err.lines ?? '?'}`, `is not valid CSV (${err.message.split('\n')[0]})`);
  }
  records = records.filter((r) => r.slice(1).some((c) => c.trim() !== ''));
  if (records.length === 0) throw new PmError(ERROR_CODES.invalidValue, at, 'is empty; it needs a header (mark, code, fc, fy, …) and one row per column mark');
  if (records.length > MAX_SCHEDULE_MARKS + 1) throw new PmError(ERROR_CODES.outOfRange, at, `has more than ${MAX_SCHEDULE_MARKS} marks`, { allowed: `1–${MAX_SCHEDULE_MARKS} rows` });

  // header: our column names (any letter case), each once; unknown columns are refused
  const head = records[0]!;
  const headLine = Number(head[0]);
  const index = new Map<ScheduleColumn, number>();
  head.slice(1).forEach((cell, i) => {
    const name = cell.trim().toLowerCase().replace(/[\s-]+/g, '_');
    const col = SCHEDULE_COLUMNS.find((c) => c === name);
    if (col === undefined) throw new PmError(ERROR_CODES.invalidValue, `${at} line ${headLine}`, `has the unknown column "${cell.trim()}"`, { allowed: SCHEDULE_COLUMNS.join(', ') });
    const before = index.get(col);
    if (before !== undefined) throw new PmError(ERROR_CODES.conflict, `${at} line ${headLine}`, `names the column "${col}" twice (columns ${before + 1} and ${i + 1})`);
    index.set(col, i);
  });
  for (const c of REQUIRED_SCHEDULE_COLUMNS) {
    if (!index.has(c)) throw new PmError(ERROR_CODES.missing, `${at} header`, `must name the column ${c}`, { value: head.slice(1).join(delimiter) });
  }
  if (records.length === 1) throw new PmError(ERROR_CODES.invalidValue, at, 'has a header but no column marks');

  // rows: text cells by column, marks once each
  const marks = new Map<string, number>();
  const rows: ScheduleRow[] = [];
  for (const r of records.slice(1)) {
    const line = Number(r[0]);
    const cells: Partial<Record<ScheduleColumn, string>> = {};
    for (const [c, i] of index) {
      const v = r[i + 1]?.trim();
      if (v !== undefined && v !== '') cells[c] = delimiter === ';' && /^[-+]?\d+,\d+/.test(v) ? v.replace(',', '.') : v;
    }
    if (r.length - 1 > index.size && r.slice(index.size + 1).some((c) => c.trim() !== '')) {
      throw new PmError(ERROR_CODES.invalidValue, `${at} line ${line}`, `has ${r.length - 1} cells and the header names ${index.size} columns`);
    }
    const row = parseOrThrow(RowSchema, { mark: cells.mark ?? '', ...cells }, (path) => `${at} line ${line}${path.length ? ` ${String(path[0])}` : ''}`, true);
    // a required cell left empty would fall back to a flag default (two-faces, ACI 318-19): refused instead
    for (const c of REQUIRED_SCHEDULE_COLUMNS) if (cells[c] === undefined) throw new PmError(ERROR_CODES.missing, `${at} line ${line} ${c}`, 'is empty');
    const first = marks.get(row.mark);
    if (first !== undefined) throw new PmError(ERROR_CODES.conflict, `${at} line ${line} mark`, `repeats the mark of line ${first}`, { value: JSON.stringify(row.mark) });
    marks.set(row.mark, line);
    rows.push({ line, mark: row.mark, cells });
  }
  return rows;
}
