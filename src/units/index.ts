/**
 * Unit systems. The core works in one consistent set per system:
 *   us: kip, in, ksi (= kip/in²), kip·in
 *   si: N, mm, MPa (= N/mm²), N·mm
 * Conversion happens only at the edges (CLI flags, config files, printed output).
 */
import { ERROR_CODES, PmError } from '../errors.js';

export const UNIT_SYSTEMS = ['us', 'si'] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];
export const isUnitSystem = (s: unknown): s is UnitSystem => UNIT_SYSTEMS.includes(s as UnitSystem);

export type QuantityKind = 'stress' | 'length' | 'force' | 'moment';

/** Exact conversion factors (NIST SP 811, Appendix B). */
export const MPA_PER_KSI = 6.894757293168361;
export const MM_PER_IN = 25.4;
export const N_PER_KIP = 4448.2216152605;

/** Labels of the units a system prints by default. */
export interface UnitLabels {
  stress: string;
  length: string;
  force: string;
  moment: string;
}

export const DISPLAY_UNITS: Record<UnitSystem, UnitLabels> = {
  us: { stress: 'ksi', length: 'in', force: 'kip', moment: 'kip-ft' },
  si: { stress: 'MPa', length: 'mm', force: 'kN', moment: 'kN-m' },
};

/** Factor from each accepted suffix to the *internal* unit of its system, plus the system it belongs to. */
interface SuffixDef {
  kind: QuantityKind;
  system: UnitSystem;
  toInternal: number;
}

const SUFFIXES: Record<string, SuffixDef> = {
  ksi: { kind: 'stress', system: 'us', toInternal: 1 },
  psi: { kind: 'stress', system: 'us', toInternal: 1e-3 },
  mpa: { kind: 'stress', system: 'si', toInternal: 1 },
  'n/mm2': { kind: 'stress', system: 'si', toInternal: 1 },
  gpa: { kind: 'stress', system: 'si', toInternal: 1e3 },
  in: { kind: 'length', system: 'us', toInternal: 1 },
  ft: { kind: 'length', system: 'us', toInternal: 12 },
  mm: { kind: 'length', system: 'si', toInternal: 1 },
  cm: { kind: 'length', system: 'si', toInternal: 10 },
  m: { kind: 'length', system: 'si', toInternal: 1000 },
  kip: { kind: 'force', system: 'us', toInternal: 1 },
  kips: { kind: 'force', system: 'us', toInternal: 1 },
  lb: { kind: 'force', system: 'us', toInternal: 1e-3 },
  n: { kind: 'force', system: 'si', toInternal: 1 },
  kn: { kind: 'force', system: 'si', toInternal: 1e3 },
  mn: { kind: 'force', system: 'si', toInternal: 1e6 },
  'kip-ft': { kind: 'moment', system: 'us', toInternal: 12 },
  'kip-in': { kind: 'moment', system: 'us', toInternal: 1 },
  'kn-m': { kind: 'moment', system: 'si', toInternal: 1e6 },
  knm: { kind: 'moment', system: 'si', toInternal: 1e6 },
  'n-mm': { kind: 'moment', system: 'si', toInternal: 1 },
};

/** Internal-unit factor of the default (bare-number) unit of each kind. */
const DEFAULT_FACTOR: Record<UnitSystem, Record<QuantityKind, number>> = {
  us: { stress: 1, length: 1, force: 1, moment: 12 }, // bare moment = kip-ft
  si: { stress: 1, length: 1, force: 1e3, moment: 1e6 }, // bare force = kN, bare moment = kN·m
};

/** Factor from `from` system's internal unit of `kind` to `to` system's internal unit. */
export function systemFactor(kind: QuantityKind, from: UnitSystem, to: UnitSystem): number {
  if (from === to) return 1;
  const usToSi: Record<QuantityKind, number> = {
    stress: MPA_PER_KSI,
    length: MM_PER_IN,
    force: N_PER_KIP,
    moment: N_PER_KIP * MM_PER_IN,
  };
  return from === 'us' ? usToSi[kind] : 1 / usToSi[kind];
}

/**
 * Parses "4", "4ksi", "4000psi", "28MPa", "600mm", "800kN-m" into the internal unit of `system`.
 * A bare number means the system's default unit for that kind (see DISPLAY_UNITS).
 */
export function parseQuantity(text: string | number, kind: QuantityKind, system: UnitSystem, path: string): number {
  if (typeof text === 'number') return finite(text * DEFAULT_FACTOR[system][kind], text, kind, path);
  // refused before any scanning: the cap keeps every parse short (MAX_QUANTITY_CHARS in src/input/limits.ts)
  if (text.length > MAX_QUANTITY_CHARS) {
    throw new PmError(ERROR_CODES.invalidValue, path, `is longer than ${MAX_QUANTITY_CHARS} characters`, { value: `${JSON.stringify(text.slice(0, 12))}…` });
  }
  const raw = text.trim();
  const split = splitQuantity(raw);
  if (!split) {
    throw new PmError(ERROR_CODES.invalidValue, path, 'is not a number with an optional unit', {
      value: JSON.stringify(raw),
      allowed: `a number, optionally with a ${kind} unit such as ${exampleUnits(kind)}`,
    });
  }
  const value = Number(split.number);
  const suffix = split.unit.toLowerCase().replace('·', '-').replace('²', '2');
  if (suffix === '') return finite(value * DEFAULT_FACTOR[system][kind], raw, kind, path);
  const def = SUFFIXES[suffix];
  if (!def || def.kind !== kind) {
    throw new PmError(ERROR_CODES.invalidUnit, path, `has a unit that is not a ${kind} unit`, {
      value: raw,
      allowed: exampleUnits(kind),
    });
  }
  return finite(value * def.toInternal * systemFactor(kind, def.system, system), raw, kind, path);
}

/** Quantity text is limited to this many characters (the one limits module repeats it). */
export const MAX_QUANTITY_CHARS = 64;

function finite(v: number, raw: unknown, kind: QuantityKind, path: string): number {
  if (!Number.isFinite(v)) throw new PmError(ERROR_CODES.invalidValue, path, `is not a finite ${kind}`, { value: String(raw) });
  return v;
}

const isDigit = (c: number) => c >= 48 && c <= 57;
const UNIT_CHARS = /^[a-z/·\-0-9²]*$/i;

/**
 * One left-to-right scan (no backtracking): [sign] digits [. digits] [e [sign] digits], blanks, unit.
 * Returns undefined when the text is not of that form.
 */
export function splitQuantity(raw: string): { number: string; unit: string } | undefined {
  let i = 0;
  const n = raw.length;
  if (raw[i] === '+' || raw[i] === '-') i++;
  const intStart = i;
  while (i < n && isDigit(raw.charCodeAt(i))) i++;
  let digits = i - intStart;
  if (raw[i] === '.') {
    i++;
    const fracStart = i;
    while (i < n && isDigit(raw.charCodeAt(i))) i++;
    digits += i - fracStart;
  }
  if (digits === 0) return undefined;
  if (raw[i] === 'e' || raw[i] === 'E') {
    let j = i + 1;
    if (raw[j] === '+' || raw[j] === '-') j++;
    const expStart = j;
    while (j < n && isDigit(raw.charCodeAt(j))) j++;
    // "e" not followed by digits is no exponent: it may start a unit, which the unit check then refuses
    if (j > expStart) i = j;
  }
  const number = raw.slice(0, i);
  while (i < n && (raw[i] === ' ' || raw[i] === '\t')) i++;
  const unit = raw.slice(i);
  return UNIT_CHARS.test(unit) ? { number, unit } : undefined;
}

/** The unit suffixes accepted for a kind, in lower case ("ksi", "psi", "mpa", …). */
export function unitSuffixes(kind: QuantityKind): string[] {
  return Object.entries(SUFFIXES)
    .filter(([, d]) => d.kind === kind)
    .map(([s]) => s);
}

function exampleUnits(kind: QuantityKind): string {
  return Object.entries(SUFFIXES)
    .filter(([, d]) => d.kind === kind)
    .map(([s]) => s)
    .join(', ');
}

/** Converts an internal value of `kind` to the system's display unit (kip-ft, kN, kN·m …). */
export function toDisplay(value: number, kind: QuantityKind, system: UnitSystem): number {
  return value / DEFAULT_FACTOR[system][kind];
}

/** Converts a display-unit value to the internal unit. */
export function fromDisplay(value: number, kind: QuantityKind, system: UnitSystem): number {
  return value * DEFAULT_FACTOR[system][kind];
}

/** Converts an internal stress of `system` to MPa (used by code formulas written in MPa). */
export const stressToMPa = (stress: number, system: UnitSystem): number => stress * systemFactor('stress', system, 'si');
/** Converts an internal length of `system` to mm. */
export const lengthToMm = (length: number, system: UnitSystem): number => length * systemFactor('length', system, 'si');
