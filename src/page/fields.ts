/**
 * The page's input fields, named after the CLI flags they stand for (same names as `pmchart sheet` and
 * `pmchart check`), so presets, messages and copyable command lines map one to one. Shared by the
 * markup (build time) and the browser code.
 */
import { BASIS_IDS, DESIGN_CODE_LIST } from '../codes/registry.js';

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
const f = (key: string, label: string, kind: FieldKind, extra: Partial<FieldDef> = {}): FieldDef => ({ key, flag: kebab(key), label, kind, ...extra });

export const FIELD_GROUPS: readonly FieldGroup[] = [
  {
    id: 'basis',
    title: 'Basis and materials',
    fields: [
      f('code', 'Design basis', 'select', { options: DESIGN_CODE_LIST.map((c) => [c.id, c.title] as const) }),
      f('units', 'Units', 'select', { options: [['', "basis's first"], ['us', 'US (kip, in, ksi)'], ['si', 'SI (kN, mm, MPa)']] }),
      f('fc', 'f′c (fck)', 'text', { placeholder: 'e.g. 5ksi, 35MPa', hint: 'a stress; a plain number is in the unit system’s stress unit' }),
      f('fy', 'fy (fyk)', 'text', { placeholder: 'e.g. 60ksi, 500MPa' }),
    ],
  },
  {
    id: 'section',
    title: 'Section',
    fields: [
      f('shape', 'Shape', 'select', { options: [['rectangle', 'rectangle'], ['circle', 'circle']] }),
      f('gamma', 'γ', 'text', { hint: 'outer-row centre spacing ÷ depth, 0.3–0.95' }),
      f('gammaB', 'γB', 'text', { placeholder: 'same cover', hint: 'outer-column centre spacing ÷ width b, 0.3–0.95 (rectangles)' }),
      f('arrangement', 'Arrangement', 'select', { options: [['two-faces', 'two faces'], ['four-faces', 'four faces'], ['side-faces', 'side faces'], ['ring', 'ring']] }),
      f('barsPerFace', 'Bars per face', 'text', { placeholder: 'default', hint: 'four faces: one count, or nb,nh (on each b face, on each h face)' }),
      f('bars', 'Bars (ring)', 'int', { placeholder: 'default 8' }),
      f('transverse', 'Transverse', 'select', { options: [['tied', 'tied'], ['spiral', 'spiral']] }),
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
      f('concreteLaw', 'Concrete law', 'select', { options: [['', 'basis default'], ['parabola-rectangle', 'parabola-rectangle'], ['rectangular-block', 'rectangular block']] }),
      f('steelBranch', 'Steel branch', 'select', { options: [['', 'basis default'], ['horizontal', 'horizontal'], ['inclined', 'inclined']] }),
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
      f('loads', 'or paste CSV', 'text', { hint: 'columns id,Pu,Mu (Muy optional), as `pmchart check --loads` reads' }),
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
