/**
 * Header mapping for load files taken straight from a frame analysis export (issue 22): which source
 * column fills which of our fields, and which headers name our fields in a basis's own symbols.
 *
 *   --columns "mark=Column,id=Story+Combo,Pu=P,Mu=M3,Muy=M2"  ─▶  ColumnMap
 *   header row + ColumnMap (or none)                          ─▶  HeaderPlan: per source column, the field it fills
 *
 * - Headers match case-insensitively with inner spaces kept ("Output Case"); a header's unit
 *   ("P kN", "P [kN]") may follow the name and is read as the loads reader reads it.
 * - Several source columns make one id (`id=Story+Combo`), joined with " / ".
 * - A mapped source column is read only as its mapped field (an export's M2 mapped to Muy is never
 *   an end moment); with a map, every source column it does not name is ignored and listed once.
 * - Without a map, a header in a basis's own action symbols (NEd and MEd, Pf and Mf, N* and M*) names Pu or Mu:
 *   the symbols come from every code in the registry (`DesignCode.symbols`), never from a list here.
 * Browser-safe.
 */
import { DESIGN_CODES } from '../codes/registry.js';
import { ERROR_CODES, PmError } from '../errors.js';
import { MAX_FLAG_CHARS } from './limits.js';

/** How the source file signs axial compression; ours is positive. */
export const COMPRESSION_SIGNS = ['positive', 'negative'] as const;
export type CompressionSign = (typeof COMPRESSION_SIGNS)[number];

/** Reads `--compression`: positive (default) or negative. */
export function parseCompression(text: string | undefined, at = '--compression'): CompressionSign {
  if (text === undefined) return 'positive';
  const t = text.trim().toLowerCase();
  if ((COMPRESSION_SIGNS as readonly string[]).includes(t)) return t as CompressionSign;
  throw new PmError(ERROR_CODES.invalidValue, at, 'is not one of the allowed values', { value: text, allowed: COMPRESSION_SIGNS.join(', ') });
}

/** Our field → the source headers (lower case, trimmed) that fill it, in order; more than one only for id. */
export interface ColumnMap {
  readonly fields: ReadonlyMap<string, readonly string[]>;
}

/** Fields whose value may be joined from several source columns. */
const JOINABLE = new Set(['id']);
/** The separator of a joined id. */
export const ID_JOIN = ' / ';

const norm = (s: string): string => s.trim().replace(/\s+/g, ' ').toLowerCase();

/**
 * Reads a `--columns` value: comma-separated `field=Source` pairs; `fields` are the fields a reader
 * knows (matched case-insensitively, returned in their own spelling).
 */
export function parseColumnMap(text: string, fields: readonly string[], at = '--columns'): ColumnMap {
  if (text.length > MAX_FLAG_CHARS) throw new PmError(ERROR_CODES.invalidValue, at, `is longer than ${MAX_FLAG_CHARS} characters`);
  const out = new Map<string, string[]>();
  const sources = new Map<string, string>();
  const pairs = text.split(',').map((p) => p.trim()).filter((p) => p !== '');
  if (pairs.length === 0) throw new PmError(ERROR_CODES.invalidValue, at, 'is empty; give field=Source pairs, e.g. "id=Combo,Pu=P,Mu=M3"');
  for (const pair of pairs) {
    const eq = pair.indexOf('=');
    if (eq <= 0 || eq === pair.length - 1) throw new PmError(ERROR_CODES.invalidValue, at, 'is not a list of field=Source pairs', { value: pair });
    const given = pair.slice(0, eq).trim();
    const field = fields.find((f) => f.toLowerCase() === given.toLowerCase());
    if (field === undefined) throw new PmError(ERROR_CODES.invalidValue, at, `names the field "${given}", which is not one of ours`, { allowed: fields.join(', ') });
    if (out.has(field)) throw new PmError(ERROR_CODES.conflict, at, `maps the field ${field} twice`);
    const parts = pair.slice(eq + 1).split('+').map(norm);
    if (parts.some((p) => p === '')) throw new PmError(ERROR_CODES.invalidValue, at, `has an empty source column for ${field}`, { value: pair });
    if (parts.length > 1 && !JOINABLE.has(field)) throw new PmError(ERROR_CODES.invalidValue, at, `joins several source columns for ${field}; only ${[...JOINABLE].join(', ')} may be joined`, { value: pair });
    for (const p of parts) {
      const before = sources.get(p);
      if (before !== undefined) throw new PmError(ERROR_CODES.conflict, at, `reads the source column "${p}" for both ${before} and ${field}; a source column fills one field`);
      sources.set(p, field);
    }
    out.set(field, parts);
  }
  return { fields: out };
}

/** Alias headers in each basis's own action symbols ("NEd" → Pu, "MEd" → Mu), from the registry. */
export function symbolAliases(): ReadonlyMap<string, 'Pu' | 'Mu'> {
  const out = new Map<string, 'Pu' | 'Mu'>();
  for (const code of Object.values(DESIGN_CODES)) {
    if (!code) continue;
    const { actionAxial, actionMoment } = code.symbols;
    if (actionAxial) out.set(actionAxial.toLowerCase(), 'Pu');
    if (actionMoment) out.set(actionMoment.toLowerCase(), 'Mu');
  }
  return out;
}

/** A header cell as name and unit: "P [kN]", "N* (kN)" (bracketed), "Pu kip" (after a space), "Output Case". */
export function splitHeader(cell: string): { name: string; unit: string; bracketed: boolean } {
  const t = cell.trim();
  const m = /^(.*?)\s*(?:\[([^\]]*)\]|\(([^)]*)\))$/.exec(t);
  if (m && m[1] !== '') return { name: m[1]!, unit: (m[2] ?? m[3] ?? '').trim(), bracketed: true };
  const sp = /^(\S+)\s+(\S+)$/.exec(t);
  if (sp) return { name: sp[1]!, unit: sp[2]!, bracketed: false };
  return { name: t, unit: '', bracketed: false };
}

/** What each source column fills. */
export interface HeaderPlan {
  /** per source column: our field (or the header's name as written, for the reader to judge) and its unit ("" none); null when a map leaves it unread */
  readonly columns: readonly ({ field: string; unit: string } | null)[];
  /** source column indexes of a joined id, in map order; null when the id is one column */
  readonly idParts: readonly number[] | null;
  /** source headers a map leaves unread (empty without a map) */
  readonly ignored: readonly string[];
}

/**
 * Plans the header row. Without a map: each cell as the reader reads it (`own(cell)`: our field name
 * or the cell's name as written, and its unit), and a cell named in a basis's action symbols as Pu or
 * Mu. With a map: only the named source columns, each as its field; a named source column the file
 * does not have is an error.
 */
export function planHeader(header: readonly string[], map: ColumnMap | undefined, own: (cell: string) => { name: string; unit: string }, at: string): HeaderPlan {
  if (!map) {
    const aliases = symbolAliases();
    return {
      columns: header.map((cell) => {
        const s = splitHeader(cell);
        const alias = aliases.get(s.name.toLowerCase()) ?? aliases.get(cell.trim().toLowerCase());
        if (alias) return aliases.has(s.name.toLowerCase()) ? { field: alias, unit: s.unit } : { field: alias, unit: '' };
        const h = own(cell);
        return { field: h.name, unit: h.unit };
      }),
      idParts: null,
      ignored: [],
    };
  }
  const columns: ({ field: string; unit: string } | null)[] = header.map(() => null);
  const whole = header.map(norm);
  const split = header.map(splitHeader);
  const find = (source: string): { index: number; unit: string } => {
    const i = whole.indexOf(source);
    // the whole header named: its unit only when bracketed ("P (kN)"); "Output Case" keeps its space
    if (i >= 0) return { index: i, unit: split[i]!.bracketed ? split[i]!.unit : '' };
    const j = split.findIndex((s) => norm(s.name) === source);
    return { index: j, unit: j >= 0 ? split[j]!.unit : '' };
  };
  let idParts: number[] | null = null;
  for (const [field, sources] of map.fields) {
    const found = sources.map((s) => {
      const f = find(s);
      if (f.index < 0) throw new PmError(ERROR_CODES.missing, `${at} header`, `has no column "${s}" (${field} in --columns)`, { value: header.join(',') });
      return f;
    });
    for (const f of found) columns[f.index] = { field, unit: f.unit };
    if (found.length > 1) idParts = found.map((f) => f.index);
  }
  const ignored = header.filter((_, i) => columns[i] === null).map((c) => c.trim());
  return { columns, idParts, ignored };
}

/** The one note listing the columns a map leaves unread; null when none. */
export function ignoredNote(plan: HeaderPlan, at: string): string | null {
  return plan.ignored.length === 0 ? null : `${at}: columns not named in --columns are ignored: ${plan.ignored.map((c) => `"${c}"`).join(', ')}`;
}
