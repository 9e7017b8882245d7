/**
 * Load files: CSV with a header naming id, Pu and Mu (any order; Muy and the end moments M1, M2, M1y, M2y (ACI)
 * or M01, M02, M01y, M02y (EN 1992-1-1, CSA) optional), one row per load combination.
 * Every cell is accounted for: a column the reader does not know is an error unless the caller names it
 * in `ignoreColumns` (`--ignore-columns`) or maps the file with `columns` (`--columns`, which ignores the
 * columns it leaves unnamed and lists them in one note); a non-empty cell beyond the header's columns or
 * under a blank header cell is an error (an unquoted comma in an id shifts a row); in a `;` file with
 * decimal commas a dot is ambiguous (1.500) and an error unless `thousands` says how to read it.
 *
 *   text ──1 size, separator──▶ csv-parse records ──2 header──▶ columns and units ──3 rows (zod)──▶ loads
 *
 * - A header may carry a unit: `Pu kip`, `Mu [kN·m]`, `Mu (kip-ft)`; bare cells in that column are
 *   read in it and converted to the run's units, as flag suffixes are.
 * - `;` separates cells when the header has more `;` than `,` (spreadsheets in many locales); decimal
 *   commas are then read as points, and a dot only as `thousands` says: 'dot' (1.234,5 = 1234.5, the dots
 *   between groups of three digits) or 'none' (a dot is a decimal point too: 1.5 = 1.5).
 * - Duplicate columns and duplicate ids are refused with their line numbers; `#` starts a comment line.
 * - Analysis exports (issue 22, `LoadsCsvOptions`): a header map (`--columns`, src/input/column-map.ts),
 *   the export's sign of compression, a group column (a schedule's `mark`, bare numbers in each group's
 *   units) and repeated ids kept as loads numbered #2, #3 …; headers in a basis's action symbols (NEd, Pf,
 *   N*) name Pu and Mu. An optional `beta_dns` column gives a load its own sustained-load ratio.
 * - A sway column (issue 24): the sway parts M2s, M1s (ACI, AS refuses them) or M02s, M01s (EN, CSA), `…y`
 *   about y, and the storey's Q or storeyPu with storeyPc per load.
 * Every problem is one PmError naming `<at> line N <column>`. Browser-safe: the live page passes
 * pasted text; the CLI passes the file's text.
 */
import { parse } from 'csv-parse/sync';
import { z } from 'zod';
import { ERROR_CODES, PmError } from '../errors.js';
import { DISPLAY_UNITS, parseQuantity, splitQuantity, unitSuffixes, type QuantityKind, type UnitSystem } from '../units/index.js';
import type { FactoredLoad } from '../design/check.js';
import { parseOrThrow, quantityText, text } from './fields.js';
import { ID_JOIN, ignoredNote, planHeader, type ColumnMap, type CompressionSign } from './column-map.js';
import { LOAD_MAX_ABS, MAX_LOAD_ID_CHARS, MAX_LOAD_ROWS, MAX_LOADS_BYTES, parseDecimal, STABILITY_INDEX_MAX } from './limits.js';

/** A load in internal units: the check engine's own load type. */
export type LoadRow = FactoredLoad;

const COLUMNS = {
  id: null,
  Pu: 'force',
  Mu: 'moment',
  Muy: 'moment',
  M1: 'moment',
  M2: 'moment',
  M1y: 'moment',
  M2y: 'moment',
  M01: 'moment',
  M02: 'moment',
  M01y: 'moment',
  M02y: 'moment',
  beta_dns: null,
  // a sway column's sway parts of the end moments and its storey's data (issue 24)
  M2s: 'moment',
  M1s: 'moment',
  M2sy: 'moment',
  M1sy: 'moment',
  M02s: 'moment',
  M01s: 'moment',
  M02sy: 'moment',
  M01sy: 'moment',
  Q: null,
  storeyPu: 'force',
  storeyPc: 'force',
} as const satisfies Record<string, QuantityKind | null>;
type Column = keyof typeof COLUMNS;
const OPTIONAL_MOMENTS = ['Muy', 'M1', 'M2', 'M1y', 'M2y', 'M01', 'M02', 'M01y', 'M02y', 'M2s', 'M1s', 'M2sy', 'M1sy', 'M02s', 'M01s', 'M02sy', 'M01sy'] as const;
/** The storey sums of a sway column: forces, greater than 0. */
const STOREY_FORCES = ['storeyPu', 'storeyPc'] as const;

/** One row's cells by column, as text: the form of each cell is checked here, units after. */
const RowSchema = z.object({
  id: text(MAX_LOAD_ID_CHARS).trim().min(1, { message: 'is empty' }),
  Pu: z.string().trim().min(1, { message: 'is empty' }).pipe(quantityText('force')),
  Mu: z.string().trim().min(1, { message: 'is empty' }).pipe(quantityText('moment')),
  ...Object.fromEntries(OPTIONAL_MOMENTS.map((k) => [k, z.string().trim().pipe(z.union([z.literal(''), quantityText('moment')])).optional()])),
  // a load's own βdns (ACI 318-19 6.6.4.4.4; βd of AS 3600 and CSA A23.3): a plain ratio 0–1, empty for the member's
  beta_dns: z
    .string()
    .trim()
    .transform((t, ctx) => {
      if (t === '') return undefined;
      const v = parseDecimal(t);
      if (v === undefined || !(v >= 0 && v <= 1)) {
        ctx.addIssue({ code: 'custom', message: 'is not a ratio within 0–1', input: t });
        return z.NEVER;
      }
      return v;
    })
    .optional(),
  // a sway column's stability index Q (ACI 318-19 6.6.4.4.1): a plain number from 0 to STABILITY_INDEX_MAX, empty for the member's
  Q: z
    .string()
    .trim()
    .transform((t, ctx) => {
      if (t === '') return undefined;
      const v = parseDecimal(t);
      if (v === undefined || !(v >= 0 && v <= STABILITY_INDEX_MAX)) {
        ctx.addIssue({ code: 'custom', message: `is not a stability index within 0–${STABILITY_INDEX_MAX}`, input: t });
        return z.NEVER;
      }
      return v;
    })
    .optional(),
  ...Object.fromEntries(STOREY_FORCES.map((k) => [k, z.string().trim().pipe(z.union([z.literal(''), quantityText('force')])).optional()])),
}) as unknown as z.ZodType<Partial<Record<Column, string>>>;

interface HeaderColumn {
  name: Column;
  index: number;
  /** unit suffix from the header, lower case, "" when none */
  unit: string;
}

/** "Mu [kN·m]", "Pu kip", "Mu (kip-ft)", "Pu" → name and unit. */
function headerCell(cell: string): { name: string; unit: string } {
  const t = cell.trim();
  const m = /^([A-Za-z][A-Za-z0-9]*)\s*(?:\[([^\]]*)\]|\(([^)]*)\)|\s([^\s].*))?$/.exec(t);
  if (!m) return { name: t, unit: '' };
  return { name: m[1]!, unit: (m[2] ?? m[3] ?? m[4] ?? '').trim() };
}

/** The separator: ";" when the first content line has more semicolons than commas. */
export function detectSeparator(text: string): ',' | ';' {
  for (const line of text.split(/\r?\n/, 50)) {
    const t = line.trim();
    if (t === '' || t.startsWith('#')) continue;
    const count = (c: string) => t.split(c).length - 1;
    return count(';') > count(',') ? ';' : ',';
  }
  return ',';
}

/** How a `;` file's dots read: thousands separators ('dot') or decimal points ('none'). */
export const THOUSANDS = ['dot', 'none'] as const;
export type Thousands = (typeof THOUSANDS)[number];

/** A cell of a `;` file (decimal commas) as a plain decimal, or an error naming the cell. */
function decimalCommaCell(v: string, thousands: Thousands | undefined, where: string): string {
  if (!v.includes('.')) return v.replace(',', '.');
  if (thousands === 'none') {
    if (v.includes(',')) throw new PmError(ERROR_CODES.invalidValue, where, 'has both a decimal comma and a decimal point (--thousands none)', { value: v });
    return v;
  }
  if (thousands === 'dot') {
    // the number part: sign, groups of three after the first, an optional decimal comma part
    const m = /^(\s*[-+]?)(\d{1,3}(?:\.\d{3})+)(,\d*)?(\s*[^\d.,\s].*)?$/.exec(v);
    if (!m) throw new PmError(ERROR_CODES.invalidValue, where, 'is not a number with dots between groups of three digits (--thousands dot)', { value: v });
    return `${m[1]}${m[2]!.replaceAll('.', '')}${(m[3] ?? '').replace(',', '.')}${m[4] ?? ''}`;
  }
  throw new PmError(
    ERROR_CODES.invalidValue,
    where,
    `has a dot in a file with decimal commas (a thousands separator?); say --thousands dot (${v.trim()} = ${v.trim().replaceAll('.', '')}) or --thousands none (${v.trim()} = ${Number(v.trim()) || v.trim()})`,
    { value: v },
  );
}

/** The fields a load file may fill (for `--columns`), the schedule's `mark` beside them. */
export const LOAD_FIELDS: readonly string[] = Object.keys(COLUMNS);

/** How an export is read (issue 22): its header map, its sign of compression, the grouping column, duplicates. */
export interface LoadsCsvOptions {
  /** `--columns`: source headers → our fields (src/input/column-map.ts); absent: our own headers */
  columns?: ColumnMap;
  /** the file's sign of axial compression (default positive: ours) */
  compression?: CompressionSign;
  /** a further required text column that groups the rows (the schedule's `mark`) */
  group?: string;
  /** the unit system of a group's bare numbers (default: the `units` argument) */
  unitsOf?: (group: string, at: string) => UnitSystem;
  /** a repeated id (within a group): refused (default), or kept as a separate load numbered " #2", " #3" … */
  duplicates?: 'refuse' | 'number';
  /** receives the one note on columns a map leaves unread */
  onNote?: (text: string) => void;
  /** header names (any letter case, unit left off) of columns to skip; any other unknown column is an error (without `columns`) */
  ignoreColumns?: readonly string[];
  /** how a dot reads in a `;` file with decimal commas; absent, a dot there is an error */
  thousands?: Thousands;
}

/** A load with the group it belongs to (`LoadsCsvOptions.group`). */
export interface GroupedLoad {
  group: string;
  load: LoadRow;
  line: number;
}

/** Parses a load file's text; `at` names it in errors (a flag such as --loads, or "pasted loads"). */
export function parseLoadsCsv(textIn: string, units: UnitSystem, at = '--loads', opts: LoadsCsvOptions = {}): LoadRow[] {
  return readLoads(textIn, units, at, opts).map((g) => g.load);
}

/** Parses a load file whose rows carry a group column (`opts.group`, e.g. the schedule's mark). */
export function parseGroupedLoadsCsv(textIn: string, units: UnitSystem, at: string, opts: LoadsCsvOptions & { group: string }): GroupedLoad[] {
  return readLoads(textIn, units, at, opts);
}

function readLoads(textIn: string, units: UnitSystem, at: string, opts: LoadsCsvOptions): GroupedLoad[] {
  // 1. size and separator, then csv-parse (quotes, CRLF, BOM)
  if (textIn.length > MAX_LOADS_BYTES) throw new PmError(ERROR_CODES.invalidValue, at, `is larger than ${MAX_LOADS_BYTES} bytes`);
  const delimiter = detectSeparator(textIn.replace(/^\uFEFF/, ''));
  if (opts.thousands === 'dot' && delimiter !== ';') {
    throw new PmError(ERROR_CODES.conflict, '--thousands', `dot applies to files separated by ";" with decimal commas; ${at} is separated by ","`);
  }
  let lastLine = 0;
  let records: { record: string[]; info: { lines: number } }[];
  try {
    // each record is kept as [line, ...cells]: csv-parse's `info` objects would triple the memory of a big file
    const raw = parse(textIn, {
      bom: true,
      delimiter,
      relax_column_count: true,
      skip_empty_lines: true,
      comment: '#',
      comment_no_infix: true,
      to: MAX_LOAD_ROWS + 2,
      on_record: (record: string[], context: { lines: number }) => {
        lastLine = context.lines;
        return [String(context.lines), ...record];
      },
    });
    records = raw.map((r) => ({ record: r.slice(1), info: { lines: Number(r[0]) } }));
  } catch (e) {
    const err = e as Error & { code?: string; lines?: number };
    if (err.code === 'CSV_QUOTE_NOT_CLOSED') {
      throw new PmError(ERROR_CODES.invalidValue, `${at} line ${lastLine + 1}`, `has a quote (") that is not closed by the end of the file (line ${err.lines ?? '?'})`);
    }
    throw new PmError(ERROR_CODES.invalidValue, `${at} line ${err.lines ?? lastLine + 1}`, `is not valid CSV (${err.message.split('\n')[0]})`);
  }
  records = records.filter((r) => r.record.some((c) => c.trim() !== ''));
  if (records.length === 0) throw new PmError(ERROR_CODES.invalidValue, at, 'is empty; it needs a header id,Pu,Mu and one row per load');
  if (records.length > MAX_LOAD_ROWS + 1) throw new PmError(ERROR_CODES.outOfRange, at, `has more than ${MAX_LOAD_ROWS} load rows`, { allowed: `1–${MAX_LOAD_ROWS} rows` });

  // 2. header: known columns, each once, with an optional unit of its kind
  const head = records[0]!;
  const headLine = head.info.lines;
  const columns = new Map<Column, HeaderColumn>();
  const seen = new Map<string, number>();
  const group = opts.group;
  let groupIndex = -1;
  const ignore = new Map((opts.ignoreColumns ?? []).map((n) => [n.trim().toLowerCase(), n.trim()]));
  const ignoredUsed = new Set<string>();
  /** columns whose cells must be empty: blank header cells */
  const blank: number[] = [];
  /** the first unknown column, reported once id, Pu and Mu are known to be there (else the header is not one) */
  let unknown: (() => never) | undefined;
  for (const [key, name] of ignore) {
    if (key === 'id' || key === 'pu' || key === 'mu') throw new PmError(ERROR_CODES.conflict, '--ignore-columns', `"${name}" names a column every load needs (id, Pu, Mu)`);
  }
  const plan = planHeader(head.record, opts.columns, headerCell, at);
  const note = ignoredNote(plan, at);
  if (note !== null) opts.onNote?.(note);
  head.record.forEach((cell, index) => {
    const planned = plan.columns[index];
    if (planned === null || planned === undefined) return;
    const { field: name, unit } = planned;
    if (group !== undefined && name.toLowerCase() === group.toLowerCase()) {
      if (groupIndex >= 0) throw new PmError(ERROR_CODES.conflict, `${at} line ${headLine}`, `names the column "${group}" twice (columns ${groupIndex + 1} and ${index + 1})`);
      groupIndex = index;
      return;
    }
    if (plan.idParts !== null && name === 'id' && index !== plan.idParts[0]) return;
    const known = (Object.keys(COLUMNS) as Column[]).find((c) => c.toLowerCase() === name.toLowerCase());
    const key = known ?? cell.trim().toLowerCase();
    const before = seen.get(key);
    if (before !== undefined && key !== '') {
      throw new PmError(ERROR_CODES.conflict, `${at} line ${headLine}`, `names the column "${known ?? cell.trim()}" twice (columns ${before + 1} and ${index + 1})`);
    }
    seen.set(key, index);
    const skip = [name.toLowerCase(), cell.trim().toLowerCase()].find((k) => ignore.has(k));
    if (skip !== undefined) {
      ignoredUsed.add(skip);
      return;
    }
    if (cell.trim() === '') {
      blank.push(index);
      return;
    }
    if (!known) {
      unknown ??= () => {
        throw new PmError(
          ERROR_CODES.invalidValue,
          `${at} line ${headLine} column ${index + 1}`,
          `${JSON.stringify(cell.trim().slice(0, 40))} is not a column pmchart reads (${Object.keys(COLUMNS).join(', ')}); rename it${at.startsWith('--') ? ', name it in --ignore-columns to skip it, or map the file with --columns' : ''}`,
        );
      };
      return;
    }
    const kind = COLUMNS[known];
    const u = unit.toLowerCase().replace('·', '-').replace('²', '2');
    if (u !== '' && (kind === null || !unitSuffixes(kind).includes(u))) {
      throw new PmError(ERROR_CODES.invalidUnit, `${at} line ${headLine} ${known}`, kind === null ? 'takes no unit' : `has a unit that is not a ${kind} unit`, {
        value: unit,
        ...(kind ? { allowed: unitSuffixes(kind).join(', ') } : {}),
      });
    }
    columns.set(known, { name: known, index, unit: u });
  });
  for (const [key, name] of ignore) {
    if (!ignoredUsed.has(key)) throw new PmError(ERROR_CODES.invalidValue, '--ignore-columns', `"${name}" is not a column of the header of ${at}`);
  }
  if (!columns.has('id') || !columns.has('Pu') || !columns.has('Mu') || (group !== undefined && groupIndex < 0)) {
    const need = `${group !== undefined ? `${group}, ` : ''}id, Pu and Mu`;
    throw new PmError(ERROR_CODES.invalidValue, `${at} header`, `must name the columns ${need}${opts.columns ? ' (through --columns)' : ''}`, { value: head.record.join(delimiter) });
  }
  if (unknown) unknown();
  if (records.length === 1) throw new PmError(ERROR_CODES.invalidValue, at, 'has a header but no load rows');

  // 3. rows: form by the zod row schema, then units, finiteness and the magnitude cap
  const ids = new Map<string, number>();
  const repeats = new Map<string, number>();
  const loads: GroupedLoad[] = [];
  const sign = opts.compression === 'negative' ? -1 : 1;
  for (let r = 1; r < records.length; r++) {
    const { record, info } = records[r]!;
    const line = info.lines;
    // every cell accounted for: nothing beyond the header's columns, nothing under a blank header cell
    for (let k = head.record.length; k < record.length; k++) {
      if (record[k]!.trim() !== '') {
        throw new PmError(ERROR_CODES.invalidValue, `${at} line ${line} column ${k + 1}`, `is a cell beyond the ${head.record.length} columns of the header (an unquoted comma in an id? quote the id)`, {
          value: JSON.stringify(record[k]!.slice(0, 24)).slice(1, -1),
        });
      }
    }
    for (const k of blank) {
      if ((record[k] ?? '').trim() !== '') {
        throw new PmError(ERROR_CODES.invalidValue, `${at} line ${line} column ${k + 1}`, 'is a cell under a blank header cell', { value: JSON.stringify(record[k]!.slice(0, 24)).slice(1, -1) });
      }
    }
    const cells: Partial<Record<Column, string>> = {};
    for (const c of columns.values()) {
      const v = record[c.index];
      cells[c.name] =
        v === undefined
          ? c.name === 'id' || c.name === 'Pu' || c.name === 'Mu'
            ? ''
            : undefined
          : delimiter === ';' && c.name !== 'id'
            ? decimalCommaCell(v, opts.thousands, `${at} line ${line} ${c.name}`)
            : v;
    }
    // an id from several source columns (`id=Story+Combo`), joined
    if (plan.idParts !== null) cells.id = plan.idParts.map((i) => (record[i] ?? '').trim()).join(ID_JOIN);
    const groupValue = group === undefined ? '' : (record[groupIndex] ?? '').trim();
    if (group !== undefined && groupValue === '') throw new PmError(ERROR_CODES.invalidValue, `${at} line ${line} ${group}`, 'is empty');
    const rowUnits = group !== undefined && opts.unitsOf ? opts.unitsOf(groupValue, `${at} line ${line} ${group}`) : units;
    const row = parseOrThrow(RowSchema, cells, (path) => `${at} line ${line}${path.length ? ` ${String(path[0])}` : ''}`, true);
    const value = (name: Column, kind: QuantityKind): number => {
      const cell = row[name]!;
      const col = columns.get(name)!;
      const split = splitQuantity(cell);
      if (col.unit !== '' && split && split.unit !== '') {
        throw new PmError(ERROR_CODES.conflict, `${at} line ${line} ${name}`, `has a unit while the header gives ${col.unit}`, { value: cell });
      }
      const v = parseQuantity(col.unit === '' ? cell : `${cell}${col.unit}`, kind, rowUnits, `${at} line ${line} ${name}`);
      const shown = Math.abs(v / parseQuantity('1', kind, rowUnits, name));
      if (!(shown <= LOAD_MAX_ABS)) {
        throw new PmError(ERROR_CODES.outOfRange, `${at} line ${line} ${name}`, `is beyond ±${LOAD_MAX_ABS} ${DISPLAY_UNITS[rowUnits][kind]}`, { value: cell });
      }
      return v;
    };
    let id = row.id!;
    const key = `${groupValue}\u0000${id}`;
    const first = ids.get(key);
    if (first !== undefined) {
      if (opts.duplicates !== 'number') throw new PmError(ERROR_CODES.conflict, `${at} line ${line} id`, `repeats the id of line ${first}`, { value: JSON.stringify(id) });
      // an export repeats a combination per station: each row is its own load, numbered #2, #3 …
      let n = repeats.get(key) ?? 1;
      // the next number whose id the file does not already use
      while (ids.has(`${groupValue}\u0000${id} #${++n}`));
      repeats.set(key, n);
      id = `${id} #${n}`;
      ids.set(`${groupValue}\u0000${id}`, line);
    } else ids.set(key, line);
    // the file's sign of compression made ours (positive); `|| 0` keeps −0 out
    const load: LoadRow = { id, Pu: sign * value('Pu', 'force') || 0, Mu: value('Mu', 'moment') };
    for (const name of OPTIONAL_MOMENTS) {
      if (!columns.has(name)) continue;
      const cell = row[name];
      if (cell !== undefined && cell !== '') load[name] = value(name, 'moment');
      else if (name === 'Muy') load.Muy = 0;
    }
    const beta = (row as Record<string, unknown>).beta_dns;
    if (typeof beta === 'number') load.betaDns = beta;
    const q = (row as Record<string, unknown>).Q;
    if (typeof q === 'number') load.Q = q;
    for (const name of STOREY_FORCES) {
      const cell = row[name];
      if (!columns.has(name) || cell === undefined || cell === '') continue;
      const v = value(name, 'force');
      if (!(v > 0)) throw new PmError(ERROR_CODES.outOfRange, `${at} line ${line} ${name}`, 'must be greater than 0 (a storey sum of compression)', { value: cell });
      load[name] = v;
    }
    loads.push({ group: groupValue, load, line });
  }
  return loads;
}

/** A single load quantity from a flag (--pu, --mu): finite and within ±LOAD_MAX_ABS display units. */
export function parseLoadQuantity(textIn: string, kind: 'force' | 'moment', units: UnitSystem, at: string): number {
  const v = parseQuantity(textIn, kind, units, at);
  if (!(Math.abs(v / parseQuantity('1', kind, units, at)) <= LOAD_MAX_ABS)) {
    throw new PmError(ERROR_CODES.outOfRange, at, `is beyond ±${LOAD_MAX_ABS} ${DISPLAY_UNITS[units][kind]}`, { value: textIn });
  }
  return v;
}
