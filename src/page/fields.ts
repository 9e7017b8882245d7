/**
 * The page's input fields, named after the CLI flags they stand for (same names as `pmchart sheet` and
 * `pmchart check`), so presets, messages and copyable command lines map one to one. Shared by the
 * markup (build time) and the browser code.
 */
import { BASIS_IDS, DESIGN_CODE_LIST } from '../codes/registry.js';
import { formatError, type ErrorFacts } from '../errors.js';
import { TRANSVERSE_TYPES } from '../codes/types.js';
import { CONCRETE_LAWS, STEEL_BRANCHES } from '../input/limits.js';
import { ARRANGEMENTS, SHAPES } from '../section/types.js';
import { DISPLAY_UNITS, UNIT_SYSTEMS } from '../units/index.js';

export type FieldKind = 'text' | 'select' | 'int' | 'checkbox';

export interface FieldDef {
  /** commander's option key (camelCase) */
  key: string;
  /** the flag as typed on the command line */
  flag: string;
  label: string;
  kind: FieldKind;
  /** select choices; '' is "the CLI's default" */
  options?: readonly (readonly [string, string])[];
  placeholder?: string;
  hint?: string;
}

export interface FieldGroup {
  id: string;
  title: string;
  fields: readonly FieldDef[];
  /** collapsed by default */
  folded?: boolean;
}

const kebab = (key: string): string => `--${key.replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`)}`;
/** A select's choices from one of the library's lists: the value, with hyphens as spaces for the words. */
const choices = (values: readonly string[]): readonly (readonly [string, string])[] => values.map((v) => [v, v.replace(/-/g, ' ')] as const);
/** The unit systems, each with its units in words: "us (kip, in, ksi)". */
const unitChoices = UNIT_SYSTEMS.map((u) => [u, `${u.toUpperCase()} (${DISPLAY_UNITS[u].force}, ${DISPLAY_UNITS[u].length}, ${DISPLAY_UNITS[u].stress})`] as const);
/** The arrangements the page can describe: all but 'custom', which reads a bar file the page has no field for. */
export const PAGE_ARRANGEMENTS = ARRANGEMENTS.filter((a) => a !== 'custom');

const f = (key: string, label: string, kind: FieldKind, extra: Partial<FieldDef> = {}): FieldDef => ({ key, flag: kebab(key), label, kind, ...extra });

export const FIELD_GROUPS: readonly FieldGroup[] = [
  {
    id: 'basis',
    title: 'Basis and materials',
    fields: [
      f('code', 'Design basis', 'select', { options: DESIGN_CODE_LIST.map((c) => [c.id, c.title] as const) }),
      f('units', 'Units', 'select', { options: [['', "basis's first"], ...unitChoices] }),
      f('fc', 'f′c (fck)', 'text', { placeholder: 'e.g. 5ksi, 35MPa', hint: 'a stress; a plain number is in the unit system’s stress unit' }),
      f('fy', 'fy (fyk)', 'text', { placeholder: 'e.g. 60ksi, 500MPa' }),
    ],
  },
  {
    id: 'section',
    title: 'Section',
    fields: [
      f('shape', 'Shape', 'select', { options: choices(SHAPES) }),
      f('gamma', 'γ', 'text', { hint: 'outer-row centre spacing ÷ depth, 0.3–0.95' }),
      f('gammaB', 'γB', 'text', { placeholder: 'same cover', hint: 'outer-column centre spacing ÷ width b, 0.3–0.95 (rectangles)' }),
      f('arrangement', 'Arrangement', 'select', { options: choices(PAGE_ARRANGEMENTS) }),
      f('barsPerFace', 'Bars per face', 'text', { placeholder: 'default', hint: 'four faces: one count, or nb,nh (on each b face, on each h face)' }),
      f('bars', 'Bars (ring)', 'int', { placeholder: 'default 8' }),
      f('transverse', 'Transverse', 'select', { options: choices(TRANSVERSE_TYPES) }),
    ],
  },
  {
    id: 'family',
    title: 'Family',
    fields: [
      f('ratioKind', 'Curves by', 'select', { options: [['rho', 'ρg list'], ['omega', 'ω list']] }),
      f('ratios', 'List', 'text', { placeholder: '0.01:0.08:0.01', hint: 'start:stop:step or a comma list' }),
      f('families', 'Families', 'select', { options: [['design', 'design'], ['nominal', 'nominal'], ['both', 'both']] }),
      f('dimensionless', 'Dimensionless', 'checkbox'),
      f('eccentricities', 'e/h lines', 'text', { placeholder: '0.1,0.25,0.5,1' }),
    ],
  },
  {
    id: 'options',
    title: 'Basis options (read where the basis has them)',
    folded: true,
    fields: [
      f('alphaCc', 'αcc', 'text', { placeholder: 'basis default' }),
      f('gammaC', 'γc', 'text', { placeholder: 'basis default' }),
      f('gammaS', 'γs', 'text', { placeholder: 'basis default' }),
      f('concreteLaw', 'Concrete law', 'select', { options: [['', 'basis default'], ...choices(CONCRETE_LAWS)] }),
      f('steelBranch', 'Steel branch', 'select', { options: [['', 'basis default'], ...choices(STEEL_BRANCHES)] }),
    ],
  },
  {
    id: 'loads',
    title: 'Loads (need b·h or D)',
    fields: [
      f('b', 'b', 'text', { placeholder: 'e.g. 24in, 600mm' }),
      f('h', 'h', 'text', { placeholder: 'e.g. 24in, 600mm' }),
      f('diameter', 'D (circle)', 'text'),
      f('pu', 'Pu', 'text', { placeholder: 'compression +' }),
      f('mu', 'Mu', 'text'),
      f('muy', 'Muy', 'text', { placeholder: 'optional' }),
      f('loads', 'or paste CSV', 'text', { hint: 'columns id,Pu,Mu (Muy optional), read as the command line reads a load file' }),
    ],
  },
];

export const ALL_FIELDS: readonly FieldDef[] = FIELD_GROUPS.flatMap((g) => g.fields);

/** Initial values when no flag presets them. */
export const FIELD_DEFAULTS: Readonly<Record<string, string | boolean>> = {
  code: BASIS_IDS[0]!,
  units: '',
  fc: '5ksi',
  fy: '60ksi',
  shape: 'rectangle',
  gamma: '0.75',
  arrangement: 'four-faces',
  barsPerFace: '3',
  transverse: 'tied',
  ratioKind: 'rho',
  ratios: '0.01:0.08:0.01',
  families: 'design',
  dimensionless: false,
};

/** The field a message belongs to: "--b/--h: …" → b, "--loads line 3 Pu" → loads, "--rho"/"--omega" → ratios. */
export function fieldForPath(path: string): string | null {
  const flag = path.split(/[\s/]/)[0] ?? '';
  if (flag === '--rho' || flag === '--omega') return 'ratios';
  return ALL_FIELDS.find((d) => d.flag === flag)?.key ?? null;
}

/**
 * The page's name for each flag a message can carry: the field's label, or a name of its own where the
 * label is not a noun. The one place the CLI's flag words become the page's words.
 */
const PAGE_NAMES: Readonly<Record<string, string>> = {
  ...Object.fromEntries(ALL_FIELDS.map((d) => [d.flag, d.label])),
  '--rho': 'ρg list',
  '--omega': 'ω list',
  '--loads': 'pasted loads',
  '--diameter': 'D',
  '--grid': 'γ grid',
  '--chart-gamma-step': 'γ grid',
  '--columns': 'column map',
  '--compression': 'compression sign',
};

/** A flag in the page's words: its field name, or the flag without its dashes when the page has no such field. */
const pageName = (flag: string): string => PAGE_NAMES[flag] ?? flag.slice(2);

/** Replaces every `--flag` in a CLI message by the page's name for it ("--loads line 3 Pu" → "pasted loads line 3 Pu", "give --rho" → "give ρg list"). */
export const pageWords = (text: string): string => text.replace(/--[a-z][a-z0-9-]*/g, pageName);

/** A problem as the page says it: "<field>: <value> <detail> (allowed: …)", in field names, not flags. */
export function pageMessage(e: { path: string; detail: string; facts: ErrorFacts }): string {
  return formatError(pageWords(e.path), pageWords(e.detail), e.facts);
}
