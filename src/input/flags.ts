/**
 * The section flags as a zod schema: every flag value arrives as text and leaves as a checked
 * number, enum or quantity text. Field keys are the option names (`barsPerFace`); the command line
 * maps a key to its flag (`--bars-per-face`) with `flagOf`. Ranges come from limits.ts, so the CLI
 * and chart-set files share them. Cross-field rules (shape ↔ arrangement, γ from detailing) and
 * everything that needs units or a basis stay in src/cli/section-flags.ts.
 */
import { z } from 'zod';
import { COLUMN_USES, TRANSVERSE_TYPES } from '../codes/types.js';
import { ARRANGEMENTS, SHAPES } from '../section/types.js';
import { UNIT_SYSTEMS, type QuantityKind } from '../units/index.js';
import { parseOrThrow, quantityText, ranged, rangedInt, text } from './fields.js';
import {
  ALPHA_CC_RANGE,
  CONCRETE_LAWS,
  GAMMA_B_RANGE,
  GAMMA_C_RANGE,
  GAMMA_RANGE,
  GAMMA_S_RANGE,
  MAX_FLAG_CHARS,
  MAX_TEXT_CHARS,
  parseDecimal,
  rangeText,
  STEEL_BRANCHES,
} from './limits.js';

/** "barsPerFace" → "--bars-per-face" */
export const flagOf = (key: PropertyKey): string => `--${String(key).replace(/[A-Z]/g, (c) => `-${c.toLowerCase()}`)}`;

/** A flag holding a plain decimal number (no hex "0x1", no "", no "Infinity"), then `then` checks it. */
export const decimalFlag = <T extends z.ZodType<number, number>>(then: T) =>
  z
    .string()
    .transform((t, ctx) => {
      const v = parseDecimal(t);
      if (v === undefined) {
        ctx.addIssue({ code: 'custom', message: 'is not a decimal number', input: t });
        return z.NEVER;
      }
      return v;
    })
    .pipe(then);

/** A flag holding a whole number in `range`. */
export const wholeFlag = (range: readonly [number, number]) =>
  z
    .string()
    .transform((t, ctx) => {
      if (!/^\s*\d{1,9}\s*$/.test(t)) {
        ctx.addIssue({ code: 'custom', message: `is not a whole number (allowed: ${rangeText(range)})`, input: t });
        return z.NEVER;
      }
      return Number(t);
    })
    .pipe(rangedInt(range));

/** A flag holding one whole number, or two separated by a comma ("3,5": a four-faces pair [nb, nh]); ranges are checked per arrangement. */
export const countsFlag = () =>
  z.string().transform((t, ctx) => {
    const m = /^\s*(\d{1,9})\s*(?:,\s*(\d{1,9})\s*)?$/.exec(t);
    if (!m) {
      ctx.addIssue({ code: 'custom', message: 'is not a whole number or two whole numbers "nb,nh"', input: t });
      return z.NEVER;
    }
    return m[2] === undefined ? Number(m[1]) : ([Number(m[1]), Number(m[2])] as [number, number]);
  });

/** A flag naming one of `values`. */
export const enumFlag = <const T extends readonly [string, ...string[]]>(values: T) =>
  z.enum(values, { message: `is not one of the allowed values (allowed: ${values.join(', ')})` });

const quantityFlag = (kind: QuantityKind) => quantityText(kind);
const textFlag = () => z.string().max(MAX_FLAG_CHARS, { message: `is longer than ${MAX_FLAG_CHARS} characters` });

/** The shared section flags as given (all optional; requirements depend on other flags). */
export const SectionFlagsSchema = z.object({
  code: textFlag().optional(),
  units: enumFlag(UNIT_SYSTEMS).optional(),
  // strengths by class name where the basis has classes (EN 1992-1-1 "C50/60", "B500B"); the basis checks them
  fc: z.union([quantityFlag('stress'), z.string().regex(/^C\d{2,3}\/\d{2,3}$/)], { message: 'is not a stress (e.g. 4, 4ksi, 28MPa) or a strength class (C50/60)' }).optional(),
  fy: z.union([quantityFlag('stress'), z.string().regex(/^B\d{3}[A-C]?$/)], { message: 'is not a stress (e.g. 60, 420MPa) or a steel grade (B500B)' }).optional(),
  shape: enumFlag(SHAPES).optional(),
  b: quantityFlag('length').optional(),
  h: quantityFlag('length').optional(),
  diameter: quantityFlag('length').optional(),
  gamma: decimalFlag(ranged(GAMMA_RANGE)).optional(),
  gammaB: decimalFlag(ranged(GAMMA_B_RANGE)).optional(),
  cover: quantityFlag('length').optional(),
  tie: textFlag().optional(),
  bar: textFlag().optional(),
  arrangement: enumFlag(ARRANGEMENTS).optional(),
  /** one count, or "nb,nh" for four-faces; ranges per arrangement are checked in src/flags/section-flags.ts */
  barsPerFace: countsFlag().optional(),
  bars: wholeFlag([1, 1e9]).optional(),
  customBars: textFlag().optional(),
  transverse: enumFlag(TRANSVERSE_TYPES).optional(),
  alphaCc: decimalFlag(ranged(ALPHA_CC_RANGE)).optional(),
  gammaC: decimalFlag(ranged(GAMMA_C_RANGE)).optional(),
  gammaS: decimalFlag(ranged(GAMMA_S_RANGE)).optional(),
  concreteLaw: enumFlag(CONCRETE_LAWS).optional(),
  steelBranch: enumFlag(STEEL_BRANCHES).optional(),
  // ranges are checked by the basis that reads them (EN 1992-1-1 names these flags in its errors)
  steelK: decimalFlag(z.number()).optional(),
  steelEpsUk: decimalFlag(z.number()).optional(),
  lapZoneRhoMax: decimalFlag(ranged([0.04, 0.08])).optional(),
  columnUse: enumFlag(COLUMN_USES).optional(),
});
export type CheckedSectionFlags = z.output<typeof SectionFlagsSchema>;

/** Title-block text flags (`--office`, `--project`) of sheet, check, contour and page: the chart-set file's limit (MAX_TEXT_CHARS), plain text. */
export const TitleFlagsSchema = z.object({ office: text(MAX_TEXT_CHARS).optional(), project: text(MAX_TEXT_CHARS).optional() });
export const checkTitleFlags = (o: { office?: string | undefined; project?: string | undefined }): void => {
  parseFlags(TitleFlagsSchema, { office: o.office, project: o.project });
};

/** Checks flag values; the first problem is one PmError naming the flag. */
export function parseFlags<T extends z.ZodType>(schema: T, flags: unknown): z.output<T> {
  return parseOrThrow(schema, flags, (path) => (path.length > 0 ? flagOf(path[0]!) : 'flags'), true);
}
