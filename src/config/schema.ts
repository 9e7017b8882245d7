/**
 * The chart-set file as written: one zod schema is the source of the TypeScript types and of the
 * JSON Schema committed as charts-config/chart-set.schema.json (regenerate with `npm run schema`).
 * Ranges and cross-field rules are checked after resolution (src/config/rules.ts), so that errors
 * can name the allowed range in the trade's terms.
 */
import { BASIS_IDS } from '../codes/registry.js';
import { z } from 'zod';
import { calendarDate, list, quantity, ranged, rangedInt, text } from '../input/fields.js';
import {
  ALPHA_CC_RANGE,
  ASPECT_RANGE,
  AXIAL_LEVEL_RANGE,
  BARS_PER_FACE_RANGE,
  CONCRETE_LAWS,
  ECCENTRICITY_RANGE,
  GAMMA_B_RANGE,
  GAMMA_C_RANGE,
  GAMMA_RANGE,
  GAMMA_S_RANGE,
  MAX_AXIAL_LEVELS,
  MAX_LIST,
  MAX_NAME_CHARS,
  MAX_PATH_CHARS,
  MAX_TEXT_CHARS,
  MAX_TITLE_PATTERN_CHARS,
  NAME_PATTERN,
  OMEGA_RANGE,
  PNG_SCALE_RANGE,
  RHO_RANGE,
  RING_BARS_RANGE,
  SET_CURVES_RANGE,
  STEEL_BRANCHES,
  STEEL_EPS_UK_RANGE,
  STEEL_K_RANGE,
} from '../input/limits.js';

/** A stress in the set's unit system, or a string with a unit: 7, "7ksi", "48MPa". */
const Quantity = quantity('stress');
/** A strength by class name where the basis has classes (EN 1992-1-1 Table 3.1 "C50/60", steel "B500B"); the rule stage checks the basis. */
const ConcreteStrength = z.union([Quantity, z.string().regex(/^C\d{2,3}\/\d{2,3}$/, { message: 'is not a strength class such as C50/60' })]);
const SteelStrength = z.union([Quantity, z.string().regex(/^B\d{3}[A-C]?$/, { message: 'is not a steel grade such as B500B' })]);

/** An inclusive range with a step, inside `range`; the count of values is checked before expanding. */
const NumberRange = (range: readonly [number, number]) =>
  z
    .object({
      from: ranged(range).describe('first value'),
      to: ranged(range).describe('last value (included when the steps reach it)'),
      step: z.number().positive({ message: 'must be greater than 0' }).describe('step between values'),
    })
    .strict();

const oneOrMany = <T extends z.ZodType>(t: T) => z.union([t, list(t)]);

/** Options some bases read (src/codes/types.ts BasisOptions); the others ignore them. */
const BasisOptions = z
  .object({
    alphaCc: ranged(ALPHA_CC_RANGE).describe('EN 1992-1-1 αcc (3.1.6(1)); recommended 1.0').optional(),
    gammaC: ranged(GAMMA_C_RANGE).describe('EN 1992-1-1 γc (2.4.2.4); recommended 1.5').optional(),
    gammaS: ranged(GAMMA_S_RANGE).describe('EN 1992-1-1 γs (2.4.2.4); recommended 1.15').optional(),
    concreteLaw: z.enum(CONCRETE_LAWS).describe('where the basis offers both; default "parabola-rectangle"').optional(),
    steelBranch: z.enum(STEEL_BRANCHES).describe('EN 1992-1-1 3.2.7(2) top branch; default "horizontal"').optional(),
    steelK: ranged(STEEL_K_RANGE).describe('EN 1992-1-1 inclined branch k = (ft/fy)k; default 1.08 (class B)').optional(),
    steelEpsUk: ranged(STEEL_EPS_UK_RANGE).describe('EN 1992-1-1 inclined branch εuk; default 0.05 (class B)').optional(),
    lapZoneRhoMax: ranged([0.04, 0.08]).describe('EN 1992-1-1 9.5.2(3): a lap zone with As,max = this ratio·Ac, 0.04–0.08 (0.08 recommended)').optional(),
    columnUse: z
      .enum(['gravity', 'special-seismic'])
      .describe('ACI 318 bar-grade limit by use (Table 20.2.2.4(a)): "gravity" (default) or "special-seismic" (special moment frames and special walls)')
      .optional(),
  })
  .strict();

export const PAPER_SIZES = ['a4', 'a3', 'letter', 'tabloid'] as const;
/** How sheets draw bar-entry steps (`referenceLines.barEntry`). */
export const BAR_ENTRY_DRAWINGS = ['inner', 'steps', 'chord'] as const;
export type BarEntryDrawing = (typeof BAR_ENTRY_DRAWINGS)[number];
export type PaperSize = (typeof PAPER_SIZES)[number];
export const ORIENTATIONS = ['landscape', 'portrait'] as const;
export const NORMALISATIONS = ['stress', 'dimensionless'] as const;
export type Normalisation = (typeof NORMALISATIONS)[number];
export const CHART_KINDS = ['uniaxial', 'biaxial'] as const;
export type ChartKind = (typeof CHART_KINDS)[number];
export const FAMILY_CHOICES = ['design', 'nominal', 'both'] as const;
export type FamilyChoice = (typeof FAMILY_CHOICES)[number];

const Shape = z.union([
  z.literal('rectangle').describe('square section (b = h)'),
  z.literal('circle'),
  z
    .object({
      kind: z.literal('rectangle'),
      aspect: ranged(ASPECT_RANGE).describe('width over depth, b/h; default 1').optional(),
    })
    .strict(),
  z.object({ kind: z.literal('circle') }).strict(),
]);

const Arrangement = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('two-faces'), barsPerFace: rangedInt(BARS_PER_FACE_RANGE['two-faces']).describe('bars in each of the two faces parallel to the bending axis') }).strict(),
  z
    .object({
      kind: z.literal('four-faces'),
      barsPerFace: z
        .xor(
          [
          rangedInt(BARS_PER_FACE_RANGE['four-faces']).describe('bars along each of the four faces, corners counted on both'),
          z
            .tuple([rangedInt(BARS_PER_FACE_RANGE['four-faces']), rangedInt(BARS_PER_FACE_RANGE['four-faces'])], { message: 'must be one count, or two counts [nb, nh]' })
            .describe('[nb, nh]: nb bars on each face of width b (perpendicular to the bending plane), nh on each face of depth h; corners counted on both'),
          ],
          { message: 'must be one count, or two counts [nb, nh]' },
        )
        .describe('bars per face: one count for all four faces, or [nb, nh]'),
    })
    .strict(),
  z.object({ kind: z.literal('side-faces'), barsPerFace: rangedInt(BARS_PER_FACE_RANGE['side-faces']).describe('bars along each of the two faces perpendicular to the bending axis') }).strict(),
  z.object({ kind: z.literal('ring'), bars: rangedInt(RING_BARS_RANGE).describe('bars equally spaced on a circle of diameter γ·h') }).strict(),
]);

/** One entry of `sheets`: every list field multiplies (cross product); a single value makes one sheet. */
const SheetGroup = z
  .object({
    shape: oneOrMany(Shape).describe('section shape(s); default "rectangle"').optional(),
    fc: oneOrMany(ConcreteStrength).describe('specified concrete strength(s): f′c, or fck for EN 1992-1-1; e.g. "7ksi" or 48 (set units)'),
    fy: oneOrMany(SteelStrength).describe('specified yield strength(s) of the bars: fy, or fyk for EN 1992-1-1; e.g. "80ksi"'),
    gamma: z.union([ranged(GAMMA_RANGE), list(ranged(GAMMA_RANGE)), NumberRange(GAMMA_RANGE)]).describe('γ: centre-to-centre distance of the outer bar rows over h'),
    gammaB: ranged(GAMMA_B_RANGE).describe('γB: centre-to-centre distance of the outer bar columns over b (rectangles); default: the same cover as γ gives on h').optional(),
    arrangement: oneOrMany(Arrangement).describe('bar arrangement(s)'),
    transverse: oneOrMany(z.enum(['tied', 'spiral'])).describe('transverse reinforcement; default "tied"').optional(),
    chart: z
      .enum(CHART_KINDS)
      .describe('"uniaxial": P–M interaction sheets (default); "biaxial": Mx–My contour sheets of the factored ρg family at each of `axialLevels` (rectangles only)')
      .optional(),
    axialLevels: z
      .union([ranged(AXIAL_LEVEL_RANGE), list(ranged(AXIAL_LEVEL_RANGE), MAX_AXIAL_LEVELS), NumberRange(AXIAL_LEVEL_RANGE)])
      .describe(`biaxial groups only (and required there): factored axial load over (normalising stress · Ag), P/(f′c·Ag) or ν for EN 1992-1-1; a list or {from, to, step}, at most ${MAX_AXIAL_LEVELS} levels; up to six levels per sheet, more continue on further sheets`)
      .optional(),
    basisOptions: BasisOptions.describe('basis options for these sheets only, over the set’s basis.options (e.g. a National Annex variant); the sheet titles name them').optional(),
    axes: z
      .object({
        P: z.tuple([z.number(), z.number()]).describe('axial axis [low, high] in the sheet’s normalised units').optional(),
        M: z.tuple([z.number(), z.number()]).describe('moment axis [low, high] in the sheet’s normalised units').optional(),
      })
      .strict()
      .describe('fixed axis limits for these sheets; default: the next round values beyond the envelope of the group’s curves')
      .optional(),
  })
  .strict();

/** Paper size and orientation, in a chart set or an office file. */
const Paper = z
  .object({
    size: z.enum(PAPER_SIZES).describe('default "tabloid" for US units, "a3" for SI').optional(),
    orientation: z.enum(ORIENTATIONS).describe('default "landscape"').optional(),
  })
  .strict();

const UnitsField = z.enum(['us', 'si']).describe('unit system: "us" (kip, in, ksi) or "si" (N, mm, MPa)');

const Basis = z
  .object({
    code: z.string().describe(`design basis and edition, one of: ${BASIS_IDS.join(', ')}`),
    options: BasisOptions.describe('options some bases read (EN 1992-1-1 partial factors and laws); default: each basis’s recommended values').optional(),
  })
  .strict();

/** A logo file path: an SVG or PNG file of at most 1 MB. */
const LogoPath = text(MAX_PATH_CHARS).describe('office logo: an SVG or PNG file (at most 1 MB), drawn in a fixed box of the title block of every sheet, the cover, the index and check reports; SVG is cleaned of scripts and external references');

/**
 * The office defaults file (`officeFile` in a chart set, `--office-file` on the command line): what every book
 * and check sheet of an office shares. A chart set's own fields win over it, flags over both; paths in it are
 * relative to the office file.
 */
export const OfficeFileSchema = z
  .object({
    $schema: text(1000).describe('path of this JSON Schema, for editors').optional(),
    office: text(MAX_TEXT_CHARS).describe('office name on every sheet (a chart set’s titleBlock.office wins)').optional(),
    logo: LogoPath.describe('office logo, relative to this office file: an SVG or PNG file of at most 1 MB').optional(),
    preparedBy: text(MAX_TEXT_CHARS).describe('initials or name of the preparer (a chart set’s titleBlock.preparedBy wins)').optional(),
    checkedBy: text(MAX_TEXT_CHARS).describe('initials or name of the checker (a chart set’s titleBlock.checkedBy wins)').optional(),
    paper: Paper.describe('the office’s paper; a chart set’s paper fields win field by field').optional(),
    units: UnitsField.optional(),
    basis: Basis.describe('the office’s usual design basis; a chart set’s basis wins as a whole').optional(),
  })
  .strict();
export type OfficeFile = z.infer<typeof OfficeFileSchema>;

export const ChartSetFileSchema = z
  .object({
    $schema: text(1000).describe('path of this JSON Schema, for editors').optional(),
    officeFile: text(MAX_PATH_CHARS)
      .describe('office defaults file (office name, logo, people, paper, units, basis), relative to this chart set; this file’s own fields win over it')
      .optional(),
    name: text(MAX_NAME_CHARS)
      .regex(new RegExp(NAME_PATTERN), { message: 'must be 1–80 letters, digits, "-" or "_", starting with a letter or digit' })
      .describe('set name; also the output folder name (letters, digits, "-", "_")'),
    titleBlock: z
      .object({
        office: text(MAX_TEXT_CHARS).describe('office name on every sheet'),
        project: text(MAX_TEXT_CHARS).describe('project name on every sheet'),
        preparedBy: text(MAX_TEXT_CHARS).describe('initials or name; default ""').optional(),
        checkedBy: text(MAX_TEXT_CHARS).describe('initials or name; default ""').optional(),
        revision: text(MAX_TEXT_CHARS).describe('revision mark; default "0"').optional(),
        date: calendarDate().describe('issue date YYYY-MM-DD printed on sheets and used as the PDF dates; default: SOURCE_DATE_EPOCH, else today (UTC)').optional(),
        logo: LogoPath.describe('office logo, relative to this chart set: an SVG or PNG file (at most 1 MB) drawn in a fixed box of every title block, the cover and the index; SVG is cleaned of scripts and external references').optional(),
      })
      .strict()
      .describe('title-block text; office, preparedBy, checkedBy and logo may come from the officeFile instead'),
    paper: Paper.optional(),
    units: UnitsField.describe('unit system: "us" (kip, in, ksi) or "si" (N, mm, MPa); required here or in the officeFile'),
    basis: Basis.describe('design basis; required here or in the officeFile'),
    normalisation: z.enum(NORMALISATIONS).describe('"stress": P/Ag and M/(Ag·h) in the stress unit; "dimensionless": also divided by the basis’s normalising stress (f′c, or fcd for EN 1992-1-1: ν and μ); default "stress"').optional(),
    families: z.enum(FAMILY_CHOICES).describe('curves to draw: "design" (φ-factored), "nominal" or "both"; default "design"').optional(),
    rhoG: z.union([list(ranged(RHO_RANGE), SET_CURVES_RANGE[1]), NumberRange(RHO_RANGE)]).describe('ρg family (geometric ratio As/Ag); default 0.01 to 0.08 in 0.01 steps; give this or omega').optional(),
    omega: z
      .union([list(ranged(OMEGA_RANGE), SET_CURVES_RANGE[1]), NumberRange(OMEGA_RANGE)])
      .describe('instead of rhoG: family of mechanical ratios ω = As·fyd/(Ac·fcd) (fy/f′c for ACI 318, φs·fy/f′c for CSA A23.3), customary on European charts; each sheet converts ω to ρg with its own design strengths')
      .optional(),
    referenceLines: z
      .object({
        strainStates: z.boolean().describe('lines through the basis’s strain states (εt = 0, εt = εty, tension-controlled limit); default true').optional(),
        eccentricities: list(ranged(ECCENTRICITY_RANGE), 20).describe('radial lines of constant e/h; default [0.1, 0.25, 0.5, 1]').optional(),
        axialCap: z.boolean().describe('line through the points where each curve meets its axial cap; default true').optional(),
        barEntry: z
          .union([z.enum(BAR_ENTRY_DRAWINGS), z.boolean()])
          .describe('how a bar-entry step (a bar row entering the rectangular stress block drops P and M at one neutral-axis depth) is drawn: "inner" the inner (conservative) branch, the least moment the computed curve reaches at each axial level, never crossing itself, which the check\'s chart reading also reads; "steps" as computed, folds included; "chord" a chord on the inner side of each step; tables keep the computed values; true and false, its earlier values, read as "steps" and "chord"; default "inner"')
          .optional(),
      })
      .strict()
      .optional(),
    sheetTitle: text(MAX_TITLE_PATTERN_CHARS)
      .describe('office pattern for sheet titles with {shape} {fcSymbol} {fc} {fySymbol} {fy} {gamma} {gammaB} {arrangement} {transverse} {family} {options} {index} ({gamma} includes γB when given; {fcSymbol}, {fySymbol}: the basis’s symbols, f′c/fy or fck/fyk; {options}: a sheet group’s own basisOptions, appended when the pattern leaves it out); default spells the parameters out')
      .optional(),
    outputs: z
      .object({
        pdf: z.boolean().describe('bound book.pdf; default true').optional(),
        svg: z.boolean().describe('sheets/*.svg; default false').optional(),
        png: z.boolean().describe('sheets/*.png; default false').optional(),
        pngScale: ranged(PNG_SCALE_RANGE).describe('PNG pixels per point; default 2').optional(),
        tables: z.boolean().describe('tables/*.csv and *.json; default true').optional(),
      })
      .strict()
      .optional(),
    sheets: list(SheetGroup, MAX_LIST).describe('sheet groups; each is the cross product of its lists'),
  })
  .strict();

/** The chart-set file as written (before defaults and units are resolved). */
export type ChartSetFile = z.infer<typeof ChartSetFileSchema>;
export type SheetGroupFile = z.infer<typeof SheetGroup>;
export type ShapeFile = z.infer<typeof Shape>;
export type ArrangementFile = z.infer<typeof Arrangement>;
export type BasisOptionsFile = z.infer<typeof BasisOptions>;

/** JSON Schema of the office defaults file (draft 2020-12), as committed in charts-config/office.schema.json. */
export function officeJsonSchema(): Record<string, unknown> {
  const schema = z.toJSONSchema(OfficeFileSchema, { io: 'input' }) as Record<string, unknown>;
  return {
    ...schema,
    $id: 'https://pmchart.invalid/charts-config/office.schema.json',
    title: 'pmchart office defaults',
    description: 'What every chart set and check sheet of an office shares: office name, logo, people, paper, units and basis. A chart set names it with officeFile, a command with --office-file; flags win over the chart set, the chart set over this file.',
  };
}

/** JSON Schema of the file format (draft 2020-12), as committed in charts-config/. */
export function chartSetJsonSchema(): Record<string, unknown> {
  const schema = z.toJSONSchema(ChartSetFileSchema, { io: 'input' }) as Record<string, unknown>;
  return {
    ...schema,
    $id: 'https://pmchart.invalid/charts-config/chart-set.schema.json',
    title: 'pmchart chart set',
    description: 'A chart set: title-block text, basis, ρg or ω family, reference lines, outputs and the sheets (cross products of f′c × fy × γ × arrangement × transverse × shape).',
  };
}
