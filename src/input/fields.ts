/**
 * zod building blocks shared by the chart-set schema (src/config), the flag schema (flags.ts), load
 * CSV rows (loads-csv.ts) and custom-bar files (custom-bars.ts). Every check that does not depend on
 * units or basis lives here, so it is also in the generated JSON Schema. Messages are written once:
 * `issueLine` turns a zod issue into the words after "<place>: ". Browser-safe.
 */
import { z } from 'zod';
import { ERROR_CODES, PmError } from '../errors.js';
import { unitSuffixes, type QuantityKind } from '../units/index.js';
import { DATE_PATTERN, isCalendarDate, MAX_LIST, MAX_QUANTITY_CHARS, quantityPattern, rangeText } from './limits.js';

/** A finite number in [lo, hi]; the message names the range. */
export const ranged = (range: readonly [number, number], unit = '') =>
  z
    .number()
    .min(range[0], { message: `is outside ${rangeText(range, unit)}` })
    .max(range[1], { message: `is outside ${rangeText(range, unit)}` });

/** A whole number in [lo, hi]. */
export const rangedInt = (range: readonly [number, number]) => ranged(range).int({ message: `is not a whole number (allowed: ${rangeText(range)})` });

/** A quantity of `kind` as text: decimal number and an optional unit of that kind, at most MAX_QUANTITY_CHARS. */
export const quantityText = (kind: QuantityKind) =>
  z
    .string()
    .max(MAX_QUANTITY_CHARS, { message: `is longer than ${MAX_QUANTITY_CHARS} characters` })
    .regex(new RegExp(quantityPattern(kind)), { message: `is not a number with an optional ${kind} unit (${unitSuffixes(kind).join(', ')})` });

/** A number in the set's unit system, or a string with a unit: 7, "7ksi", "48MPa". */
export const quantity = (kind: QuantityKind) => z.union([z.number(), quantityText(kind)]);

/** A non-empty list of at most `max` entries. */
export const list = <T extends z.ZodType>(t: T, max = MAX_LIST) =>
  z
    .array(t)
    .min(1, { message: 'must hold at least one value' })
    .max(max, { message: `holds more than ${max} values` });

/** C0 and C1 control characters (and DEL): refused in every text field, so no SVG or terminal line carries them. */
export const CONTROL_CHARS = /[\u0000-\u001f\u007f-\u009f]/;

/** Text of at most `max` characters, with no control characters (tab and newline included). */
export const text = (max: number) =>
  z
    .string()
    .max(max, { message: `is longer than ${max} characters` })
    .regex(/^[^\u0000-\u001f\u007f-\u009f]*$/, { message: 'has a control character (plain text only)' });

/** An issue date YYYY-MM-DD that is a real calendar date. */
export const calendarDate = () =>
  z
    .string()
    .regex(new RegExp(DATE_PATTERN), { message: 'is not a date in the form YYYY-MM-DD' })
    .refine(isCalendarDate, { message: 'is not a calendar date' });

type Issue = z.core.$ZodIssue;

/**
 * In a union, the branch that got furthest says most about what was meant: the deepest issue, and
 * at equal depth one about the value rather than its type.
 */
export function deepestIssue(issues: readonly Issue[]): Issue {
  let best = issues[0]!;
  for (const i of issues) {
    if (i.code === 'invalid_union' && i.errors.length > 0) {
      const inner = i.errors.map((branch) => deepestIssue(branch.map((b) => ({ ...b, path: [...i.path, ...b.path] }) as Issue)));
      const rank = (x: Issue) => x.path.length * 2 + (x.code === 'invalid_type' || x.code === 'invalid_union' ? 0 : 1);
      const deepest = inner.reduce((a, b) => (rank(b) > rank(a) ? b : a));
      if (rank(deepest) > i.path.length * 2) return deepest;
    }
    if (i.path.length > best.path.length) best = i;
  }
  return best;
}

/** The words after "<place>: " for one issue. */
export function describeIssue(i: Issue): string {
  switch (i.code) {
    case 'invalid_type':
      return `must be ${i.expected === 'array' ? 'a list' : i.expected === 'object' ? 'an object' : `a ${i.expected}`}`;
    case 'unrecognized_keys':
      return `has unknown field${i.keys.length > 1 ? 's' : ''} ${i.keys.map((k) => `"${k}"`).join(', ')}`;
    case 'invalid_value':
      if (!i.message.startsWith('Invalid')) return i.message;
      return `must be one of ${i.values.map((v) => JSON.stringify(v)).join(', ')}`;
    case 'invalid_union':
      if (!i.message.startsWith('Invalid')) return i.message;
      return 'has the wrong form (see charts-config/chart-set.schema.json)';
    default:
      return i.message;
  }
}

/**
 * The value an issue is about, shown before the words when it is short and plain. Config files
 * quote strings as JSON does; flags show them as typed (`raw`).
 */
export function shownInput(i: Issue, raw = false): string | undefined {
  const v = (i as { input?: unknown }).input;
  if (i.code === 'too_small' || i.code === 'too_big') {
    if (typeof v === 'number') return String(v);
    return undefined;
  }
  if (i.code === 'invalid_format' || i.code === 'custom' || (raw && i.code === 'invalid_value')) {
    if (typeof v === 'string') return v.length > 24 ? `${JSON.stringify(v.slice(0, 12))}…` : raw && v.trim() !== '' && !/\s/.test(v) && !CONTROL_CHARS.test(v) ? v : JSON.stringify(v);
  }
  return undefined;
}

/** ["sheets", 3, "gamma"] → "sheets[3].gamma" */
export function formatPath(path: readonly PropertyKey[]): string {
  let out = '';
  for (const p of path) out += typeof p === 'number' ? `[${p}]` : out ? `.${String(p)}` : String(p);
  return out || '(file)';
}

/**
 * safeParse with the first (deepest) issue turned into one PmError. `place` maps the issue's path
 * (the field key) to what the user wrote: a config path, a flag, a CSV line and column.
 */
export function parseOrThrow<T extends z.ZodType>(schema: T, value: unknown, place: (path: readonly PropertyKey[]) => string = formatPath, raw = false): z.output<T> {
  const r = schema.safeParse(value, { reportInput: true });
  if (r.success) return r.data;
  const issue = deepestIssue(r.error.issues);
  const shown = shownInput(issue, raw);
  throw new PmError(ERROR_CODES.invalidValue, place(issue.path), describeIssue(issue), shown === undefined ? {} : { value: shown });
}
