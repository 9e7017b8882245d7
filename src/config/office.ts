/**
 * The office defaults file and the logo, read while a chart set is read. Precedence: flags (the front ends
 * apply theirs over the result) > the chart set > the office file. Paths are relative to the file that names
 * them: a chart set's officeFile and titleBlock.logo to the chart set, the office file's logo to the office file.
 * Pure: files come through a FileAccess (src/io/read.ts nodeFileAccess on the command line).
 */
import { ERROR_CODES, PmError } from '../errors.js';
import { formatPath, parseOrThrow } from '../input/fields.js';
import { MAX_LOGO_BYTES, MAX_OFFICE_FILE_BYTES } from '../input/limits.js';
import { logoFromBytes, type ResolvedLogo } from './logo.js';
import { OfficeFileSchema, type OfficeFile } from './schema.js';

/** Reads a file named by a chart set or an office file, relative to a directory; errors name `at` (exit 2). */
export interface FileAccess {
  read(path: string, relativeTo: string, limit: number, at: string): { bytes: Uint8Array; dir: string };
}

/** An office file as read: its fields, and its logo already read (relative to the office file). */
export interface ReadOffice {
  file: OfficeFile;
  logo?: ResolvedLogo;
}

/** Reads and checks an office defaults file; `at` names it in errors (`officeFile`, `--office-file`). */
export function readOfficeFile(files: FileAccess, path: string, relativeTo: string, at: string): ReadOffice {
  const { bytes, dir } = files.read(path, relativeTo, MAX_OFFICE_FILE_BYTES, at);
  let json: unknown;
  try {
    json = JSON.parse(new TextDecoder('utf-8', { fatal: true }).decode(bytes).replace(/^\uFEFF/, ''));
  } catch (e) {
    throw new PmError(ERROR_CODES.invalidValue, at, `is not valid JSON (${(e as Error).message})`, { value: path });
  }
  const file = parseOrThrow(OfficeFileSchema, json, (p) => (p.length > 0 ? `${at} ${formatPath(p)}` : at));
  const logoAt = `${at} logo`;
  return { file, ...(file.logo !== undefined ? { logo: readLogo(files, file.logo, dir, logoAt) } : {}) };
}

/** Reads a logo file (SVG or PNG, at most 1 MB); `at` names the field or flag. */
export function readLogo(files: FileAccess, path: string, relativeTo: string, at: string): ResolvedLogo {
  const { bytes } = files.read(path, relativeTo, MAX_LOGO_BYTES, at);
  return logoFromBytes(bytes, at, path);
}

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/**
 * The chart-set JSON with the office file's values where the chart set has none (before the schema check, so a
 * field the office file gives is no longer missing): titleBlock office, preparedBy, checkedBy; paper field by
 * field; units; basis as a whole.
 */
export function withOfficeDefaults(json: unknown, office: OfficeFile): unknown {
  if (!isObject(json)) return json;
  const out: Record<string, unknown> = { ...json };
  const tb = isObject(json.titleBlock) ? { ...json.titleBlock } : json.titleBlock === undefined ? {} : json.titleBlock;
  if (isObject(tb)) {
    if (tb.office === undefined && office.office !== undefined) tb.office = office.office;
    if (tb.preparedBy === undefined && office.preparedBy !== undefined) tb.preparedBy = office.preparedBy;
    if (tb.checkedBy === undefined && office.checkedBy !== undefined) tb.checkedBy = office.checkedBy;
  }
  out.titleBlock = tb;
  if (office.paper !== undefined) out.paper = isObject(json.paper) ? { ...office.paper, ...json.paper } : json.paper ?? office.paper;
  if (json.units === undefined && office.units !== undefined) out.units = office.units;
  if (json.basis === undefined && office.basis !== undefined) out.basis = office.basis;
  return out;
}
