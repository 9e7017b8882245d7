/**
 * The flags of `pmchart sheet` (and of the page) read into a one-sheet chart set. Reading only; render
 * modules stay out (the set's config helpers load lazily).
 */
import { issueDate } from '../input/limits.js';
import { checkTitleFlags } from '../input/flags.js';
import type { ResolvedChartSet } from '../config/types.js';
import { ERROR_CODES, PmError, requireInRange } from '../errors.js';
import { sectionDepth, sectionWidth } from '../section/geometry.js';
import { parseNumberList } from './format.js';
import { resolveSectionFlags, type SectionFlags } from './section-flags.js';
import { parseOmegaList, parseRhoList } from './table-flags.js';
import type { OfficeFlags, ResolvedOffice } from './office-flags.js';

export interface SheetOptions extends SectionFlags, OfficeFlags {
  rho?: string;
  omega?: string;
  out?: string;
  families?: string;
  dimensionless?: boolean;
  paper?: string;
  portrait?: boolean;
  office?: string;
  project?: string;
  date?: string;
  eccentricities?: string;
}

/** Builds a one-sheet chart set from section flags (pure apart from reading --custom-bars). */
/**
 * `office`: the title block and logo with the flags over the --office-file (office-flags.ts resolveOfficeFlags, which
 * the command line applies first, with the office file's units, code and paper under the flags: the live page reads
 * no office file).
 */
export async function sheetSetFromFlags(o: SheetOptions, office: ResolvedOffice = {}): Promise<{ set: ResolvedChartSet; basis: ReturnType<typeof resolveSectionFlags>['basis']; capContext: ReturnType<typeof resolveSectionFlags>['capContext'] }> {
  const section = resolveSectionFlags(o);
  if (section.arrangement.kind === 'custom') {
    throw new PmError(ERROR_CODES.invalidValue, '--arrangement', 'custom is not available for sheets yet', { value: 'custom', allowed: 'two-faces, four-faces, side-faces, ring' });
  }
  const { PAPER_POINTS } = await import('../config/types.js');
  const { PAPER_SIZES, FAMILY_CHOICES } = await import('../config/schema.js');
  const { DEFAULT_TITLE_PATTERN, fileStemFor, fillPattern, titleFields } = await import('../config/describe.js');
  if (o.omega !== undefined && o.rho !== undefined) throw new PmError(ERROR_CODES.conflict, '--omega', 'and --rho both set the curves; give one of them');
  const ratioFlag = o.omega !== undefined ? '--omega' : '--rho';
  const ratios = o.omega !== undefined ? { kind: 'omega' as const, values: parseOmegaList(o.omega, section.basis).omegas } : { kind: 'rhoG' as const, values: parseRhoList(o.rho) };
  if (ratios.values.length > 20) throw new PmError(ERROR_CODES.outOfRange, ratioFlag, 'gives more than 20 curves', { value: ratios.values.length, allowed: '1–20' });
  const families = o.families ?? 'design';
  if (!(FAMILY_CHOICES as readonly string[]).includes(families)) throw new PmError(ERROR_CODES.invalidValue, '--families', 'is not one of the allowed values', { value: families, allowed: FAMILY_CHOICES.join(', ') });
  const size = o.paper ?? (section.units === 'us' ? 'tabloid' : 'a3');
  if (!(PAPER_SIZES as readonly string[]).includes(size)) throw new PmError(ERROR_CODES.invalidValue, '--paper', 'is not one of the allowed values', { value: size, allowed: PAPER_SIZES.join(', ') });
  checkTitleFlags(o);
  const date = issueDate(o.date, '--date', process.env.SOURCE_DATE_EPOCH);
  const ecc = o.eccentricities === undefined ? [0.1, 0.25, 0.5, 1] : parseNumberList(o.eccentricities);
  if (!ecc) throw new PmError(ERROR_CODES.invalidValue, '--eccentricities', 'is not a comma list of e/h values', { value: o.eccentricities });
  for (const e of ecc) requireInRange('--eccentricities', e, 0.01, 10);
  const [pw, ph] = PAPER_POINTS[size as keyof typeof PAPER_POINTS];
  const shape = section.shape.kind === 'circle' ? ({ kind: 'circle' } as const) : ({ kind: 'rectangle', aspect: sectionWidth(section.shape) / sectionDepth(section.shape) } as const);
  const partial = {
    index: 1,
    origin: 'flags',
    shape,
    fc: section.basis.fc,
    fy: section.basis.fy,
    gamma: section.gamma,
    ...(section.gammaB !== undefined ? { gammaB: section.gammaB } : {}),
    arrangement: section.arrangement,
    transverse: section.basis.transverse,
    basisOptions: {},
    variantOptions: {},
  };
  const fam = families === 'both' ? 'nominal and factored' : families;
  const set: ResolvedChartSet = {
    name: 'sheet',
    titleBlock: { office: office.office ?? '', project: o.project ?? '', preparedBy: office.preparedBy ?? '', checkedBy: office.checkedBy ?? '', revision: office.revision ?? '—', date, ...(office.logo ? { logo: office.logo } : {}) },
    paper: { size: size as ResolvedChartSet['paper']['size'], orientation: o.portrait ? 'portrait' : 'landscape', widthPt: o.portrait ? pw : ph, heightPt: o.portrait ? ph : pw },
    units: section.units,
    code: section.code,
    basisOptions: {},
    normalisation: o.dimensionless ? 'dimensionless' : 'stress',
    families: families as ResolvedChartSet['families'],
    ratios,
    referenceLines: { strainStates: true, eccentricities: ecc, axialCap: true },
    outputs: { pdf: true, svg: false, png: false, pngScale: 2, tables: false },
    sheets: [{ ...partial, title: (() => { const t = fillPattern(DEFAULT_TITLE_PATTERN, titleFields(partial, section.units, fam, section.basis.symbols)); return t.charAt(0).toUpperCase() + t.slice(1); })(), fileStem: fileStemFor(partial, section.units, 1) }],
  };
  return { set, basis: section.basis, capContext: section.capContext };
}

