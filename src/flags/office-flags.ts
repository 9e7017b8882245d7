/**
 * The office flags shared by `sheet` and `check`: `--office-file` (the office defaults file of chart sets'
 * `officeFile`), `--logo`, and the title-block people and revision. Precedence: a flag > the office file; paths
 * in the office file are relative to it, `--logo` to the working directory. Reading only.
 */
import type { Command } from 'commander';
import type { ResolvedLogo } from '../config/logo.js';
import { readLogo, readOfficeFile } from '../config/office.js';
import type { OfficeFile } from '../config/schema.js';
import { parseFlags } from '../input/flags.js';
import { text } from '../input/fields.js';
import { MAX_TEXT_CHARS } from '../input/limits.js';
import { nodeFileAccess } from '../io/read.js';
import { z } from 'zod';

export interface OfficeFlags {
  officeFile?: string;
  logo?: string;
  office?: string;
  preparedBy?: string;
  checkedBy?: string;
  revision?: string;
}

/** Title-block people and revision: the chart-set file's limit, plain text. */
const PeopleFlagsSchema = z.object({
  preparedBy: text(MAX_TEXT_CHARS).optional(),
  checkedBy: text(MAX_TEXT_CHARS).optional(),
  revision: text(MAX_TEXT_CHARS).optional(),
  mark: text(MAX_TEXT_CHARS).optional(),
});

export function addOfficeOptions(cmd: Command, what: string): Command {
  return cmd
    .option('--office-file <file>', `office defaults file (office name, logo, people, paper, units, basis code) for ${what}; flags win over it`)
    .option('--logo <file>', `office logo for the title block of ${what}: an SVG or PNG file of at most 1 MB`)
    .option('--prepared-by <text>', `preparer's initials or name for the title block of ${what}`)
    .option('--checked-by <text>', `checker's initials or name for the title block of ${what}`)
    .option('--revision <text>', `revision mark for the title block of ${what}`);
}

export interface ResolvedOffice {
  office?: string;
  preparedBy?: string;
  checkedBy?: string;
  revision?: string;
  logo?: ResolvedLogo;
  /** the office file's own fields (paper, units, basis), for the command to take where its flags are unset */
  file?: OfficeFile;
}

/** Reads --office-file and --logo and merges the title-block flags over the office file's values. */
export function resolveOfficeFlags(o: OfficeFlags & { mark?: string }): ResolvedOffice {
  parseFlags(PeopleFlagsSchema, { preparedBy: o.preparedBy, checkedBy: o.checkedBy, revision: o.revision, mark: o.mark });
  const read = o.officeFile !== undefined ? readOfficeFile(nodeFileAccess, o.officeFile, '.', '--office-file') : undefined;
  const f = read?.file;
  const logo = o.logo !== undefined ? readLogo(nodeFileAccess, o.logo, '.', '--logo') : read?.logo;
  const pick = <T>(flag: T | undefined, file: T | undefined): { v?: T } => (flag !== undefined ? { v: flag } : file !== undefined ? { v: file } : {});
  const office = pick(o.office, f?.office).v;
  const preparedBy = pick(o.preparedBy, f?.preparedBy).v;
  const checkedBy = pick(o.checkedBy, f?.checkedBy).v;
  return {
    ...(office !== undefined ? { office } : {}),
    ...(preparedBy !== undefined ? { preparedBy } : {}),
    ...(checkedBy !== undefined ? { checkedBy } : {}),
    ...(o.revision !== undefined ? { revision: o.revision } : {}),
    ...(logo ? { logo } : {}),
    ...(f ? { file: f } : {}),
  };
}

/** The section flags with the office file's units, basis code and paper where the command line leaves them unset. */
export function withOfficeSection<T extends { units?: string; code?: string; paper?: string; portrait?: boolean }>(o: T, file: OfficeFile | undefined, paper = true): T {
  if (!file) return o;
  if (!paper) return { ...o, ...(o.units === undefined && file.units !== undefined ? { units: file.units } : {}), ...(o.code === undefined && file.basis !== undefined ? { code: file.basis.code } : {}) };
  return {
    ...o,
    ...(o.units === undefined && file.units !== undefined ? { units: file.units } : {}),
    ...(o.code === undefined && file.basis !== undefined ? { code: file.basis.code } : {}),
    ...(o.paper === undefined && file.paper?.size !== undefined ? { paper: file.paper.size } : {}),
    ...(o.portrait === undefined && file.paper?.orientation === 'portrait' ? { portrait: true } : {}),
  };
}
