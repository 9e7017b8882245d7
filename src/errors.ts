/**
 * Problems are data: a code, a path (flag or config field) and the facts.
 * Turning them into one line of text happens in `formatError` only.
 */
export const ERROR_CODES = {
  outOfRange: 'out-of-range',
  invalidValue: 'invalid-value',
  invalidUnit: 'invalid-unit',
  missing: 'missing',
  conflict: 'conflict',
  io: 'io',
  environment: 'environment',
  notPossible: 'not-possible',
} as const;
export type ErrorCode = (typeof ERROR_CODES)[keyof typeof ERROR_CODES];

export interface ErrorFacts {
  /** the value given, as the user wrote it */
  value?: unknown;
  /** allowed range or set, as text, e.g. "0.3–0.95" */
  allowed?: string;
  [key: string]: unknown;
}

/** The one error type commands throw; the CLI handler prints `message` and exits with `exitCode`. */
export class PmError extends Error {
  readonly code: ErrorCode;
  readonly path: string;
  readonly facts: ErrorFacts;
  readonly exitCode: number;
  /** the sentence after the path, as given */
  readonly detail: string;

  constructor(code: ErrorCode, path: string, detail: string, facts: ErrorFacts = {}, exitCode = 2) {
    super(formatError(path, detail, facts));
    this.name = 'PmError';
    this.code = code;
    this.path = path;
    this.facts = facts;
    this.exitCode = exitCode;
    this.detail = detail;
  }

  /** The same problem named at another path (a front end's flag or config field for a core field key). */
  at(path: string): PmError {
    return new PmError(this.code, path, this.detail, this.facts, this.exitCode);
  }
}

/** A core field key (`alphaCc`, `klu`, `fc`): front ends map it to their own flag or path. */
export const isFieldKey = (path: string): boolean => /^[a-z][A-Za-z0-9]*$/.test(path);

/** Characters of a value echoed in an error line; longer values are cut with "…" (a 1 MB cell is not echoed). */
export const MAX_SHOWN_CHARS = 80;

/** Control characters as visible \uXXXX escapes: an error line never carries a terminal escape or a NUL. */
export const visibleControls = (t: string): string => t.replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f]/g, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);

/** One line: "<path>: <value> <detail> (allowed: …)"; `detail` may already name the range. */
export function formatError(path: string, detail: string, facts: ErrorFacts): string {
  const value = facts.value === undefined ? '' : String(facts.value);
  const shown = facts.value === undefined ? '' : `${value.length > MAX_SHOWN_CHARS ? `${value.slice(0, MAX_SHOWN_CHARS)}…` : value} `;
  const allowed = facts.allowed === undefined || detail.includes(facts.allowed) ? '' : ` (allowed: ${facts.allowed})`;
  const where = path ? `${path.length > 4 * MAX_SHOWN_CHARS ? `${path.slice(0, 4 * MAX_SHOWN_CHARS)}…` : path}: ` : '';
  return visibleControls(`${where}${shown}${detail}${allowed}`.replace(/\s+/g, ' ').trim());
}

/** Throws an out-of-range error unless lo ≤ value ≤ hi. */
export function requireInRange(path: string, value: number, lo: number, hi: number, unit = ''): number {
  if (!Number.isFinite(value) || value < lo || value > hi) {
    const u = unit ? ` ${unit}` : '';
    const allowed = `${lo}–${hi}${u}`;
    throw new PmError(ERROR_CODES.outOfRange, path, `is outside ${allowed}`, { value: `${value}${u}`, allowed });
  }
  return value;
}

export function isPmError(e: unknown): e is PmError {
  return e instanceof PmError;
}
