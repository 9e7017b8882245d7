/**
 * The library's inputs (src/index.ts: `checkColumn`, `computeFamily`, `computeBiaxialFamily`, `makeChartSet`)
 * checked by zod schemas built from the same fields and limits (limits.ts) as the CLI and chart-set files,
 * so a caller gets a PmError naming the field path (`loads[0].Pu`, `shape.b`) instead of "ok" for NaN, a
 * negative size, γ 1.5, or a count that would hang. Internal units (kip/in/ksi or N/mm/MPa) are not known
 * here: sizes and loads are held to finite, positive (sizes) and bounded magnitudes that keep every product
 * of the check finite; the ranges that need a basis (ρg limits) are checked against the basis given.
 */
import { z } from 'zod';
import { ERROR_CODES, PmError } from '../errors.js';
import { CustomBarsSchema } from './custom-bars.js';
import { list, parseOrThrow, ranged, rangedInt, text } from './fields.js';
import {
  AXIAL_LEVEL_RANGE,
  BARS_PER_FACE_RANGE,
  CHART_AXIAL_STEP_RANGE,
  CHART_GAMMA_STEP_RANGE,
  GAMMA_B_RANGE,
  GAMMA_RANGE,
  MAX_AXIAL_LEVELS,
  MAX_LOAD_ID_CHARS,
  MAX_LOAD_ROWS,
  MAX_SHEETS,
  RHO_RANGE,
  STABILITY_INDEX_MAX,
  RING_BARS_RANGE,
  TABLE_CURVES_MAX,
  TABLE_POINTS_RANGE,
  TABLE_ROWS_MAX,
} from './limits.js';

/** Largest section size in internal units (in or mm): far beyond any column (6,000 mm is the CLI's limit). */
export const LIBRARY_SIZE_MAX = 1e5;
/** Largest load magnitude in internal units: 10⁹ kN·m is 10¹⁵ N·mm, the CLI's cap in SI (LOAD_MAX_ABS). */
export const LIBRARY_LOAD_MAX_ABS = 1e15;
/** basePoints of a family: from a coarse sweep to `table --points`' largest. */
export const BASE_POINTS_RANGE = [16, TABLE_POINTS_RANGE[1]] as const;
/** Angle step of biaxial contours, degrees. */
export const ANGLE_STEP_RANGE = [0.5, 45] as const;
/** Render processes and sheets per chunk of `makeChartSet`. */
export const JOBS_RANGE = [1, 64] as const;
export const CHUNK_SIZE_RANGE = [1, MAX_SHEETS] as const;

const finite = z.number({ message: 'must be a number' }).refine(Number.isFinite, { message: 'must be a finite number' });
const size = finite.refine((v) => v > 0 && v <= LIBRARY_SIZE_MAX, { message: `must be greater than 0 and at most ${LIBRARY_SIZE_MAX}` });
const load = finite.refine((v) => Math.abs(v) <= LIBRARY_LOAD_MAX_ABS, { message: `is beyond ±${LIBRARY_LOAD_MAX_ABS}` });
const count = (range: readonly [number, number]) => z.number({ message: 'must be a number' }).pipe(rangedInt(range));

const BasisSchema = z.custom<object>(
  (b) => typeof b === 'object' && b !== null && typeof (b as { profile?: unknown }).profile === 'function' && typeof (b as { rhoLimits?: unknown }).rhoLimits === 'object',
  { message: 'must be a design basis (from designCode(…).basis(…) or the registry)' },
);

export const ShapeSchema = z.discriminatedUnion(
  'kind',
  [z.looseObject({ kind: z.literal('rectangle'), b: size, h: size }), z.looseObject({ kind: z.literal('circle'), diameter: size })],
  { message: 'must be {kind: "rectangle", b, h} or {kind: "circle", diameter}' },
);

export const ArrangementSchema = z.discriminatedUnion(
  'kind',
  [
    z.looseObject({ kind: z.literal('two-faces'), barsPerFace: count(BARS_PER_FACE_RANGE['two-faces']) }),
    z.looseObject({ kind: z.literal('four-faces'), barsPerFace: z.union([count(BARS_PER_FACE_RANGE['four-faces']), z.tuple([count(BARS_PER_FACE_RANGE['four-faces']), count(BARS_PER_FACE_RANGE['four-faces'])])]) }),
    z.looseObject({ kind: z.literal('side-faces'), barsPerFace: count(BARS_PER_FACE_RANGE['side-faces']) }),
    z.looseObject({ kind: z.literal('ring'), bars: count(RING_BARS_RANGE) }),
    z.looseObject({ kind: z.literal('custom'), bars: CustomBarsSchema }),
  ],
  { message: 'must be an arrangement {kind: "two-faces" | "four-faces" | "side-faces" | "ring" | "custom", …}' },
);

const gamma = z.number({ message: 'must be a number' }).pipe(ranged(GAMMA_RANGE));
const gammaB = z.number({ message: 'must be a number' }).pipe(ranged(GAMMA_B_RANGE));

/** A section as every entry point takes it; a circle takes a ring or custom bars. */
const sectionFields = { basis: BasisSchema, shape: ShapeSchema, arrangement: ArrangementSchema, gamma };
const circleBars = (r: { shape: { kind: string }; arrangement: { kind: string } }, ctx: z.RefinementCtx) => {
  if (r.shape.kind === 'circle' && r.arrangement.kind !== 'ring' && r.arrangement.kind !== 'custom') {
    ctx.addIssue({ code: 'custom', path: ['arrangement', 'kind'], message: 'cannot be used with a circular shape; use "ring"', input: r.arrangement.kind });
  }
};

const LoadSchema = z.looseObject({
  id: text(MAX_LOAD_ID_CHARS).refine((t) => t.trim() !== '', { message: 'is empty' }),
  Pu: load,
  Mu: load,
  Muy: load.optional(),
  M1: load.optional(),
  M2: load.optional(),
  M1y: load.optional(),
  M2y: load.optional(),
  // a sway column (issue 24): sway parts of the end moments and the storey's data per load
  ...Object.fromEntries(['M01', 'M02', 'M01y', 'M02y', 'M2s', 'M1s', 'M2sy', 'M1sy', 'M02s', 'M01s', 'M02sy', 'M01sy'].map((k) => [k, load.optional()])),
  Q: z.number({ message: 'must be a number' }).pipe(ranged([0, STABILITY_INDEX_MAX])).optional(),
  storeyPu: load.refine((v) => v > 0, { message: 'must be greater than 0' }).optional(),
  storeyPc: load.refine((v) => v > 0, { message: 'must be greater than 0' }).optional(),
});

export const CheckInputSchema = z
  .looseObject({
    ...sectionFields,
    gammaB: gammaB.optional(),
    loads: list(LoadSchema, MAX_LOAD_ROWS),
    rho: finite.optional(),
    layout: z.looseObject({ arrangement: ArrangementSchema, area: size, gamma, description: z.string() }).optional(),
    slenderness: z.union([z.looseObject({}), z.null()]).optional(),
    chartGammaStep: z.number({ message: 'must be a number' }).pipe(ranged(CHART_GAMMA_STEP_RANGE)).optional(),
    chartAxialStep: z.number({ message: 'must be a number' }).pipe(ranged(CHART_AXIAL_STEP_RANGE)).optional(),
    barSelection: z
      .looseObject({
        detailing: z.looseObject({ kind: z.enum(['cover', 'gamma']) }),
        sizes: list(z.looseObject({ diameter: size, area: size }), 100),
        aggregate: size.optional(),
        count: count([0, 20]).optional(),
      })
      .optional(),
  })
  .superRefine(circleBars);

const rhos = list(z.number({ message: 'must be a number' }).pipe(ranged(RHO_RANGE)), TABLE_CURVES_MAX);

export const FamilyRequestSchema = z
  .looseObject({ ...sectionFields, gammaX: gammaB.optional(), rhos, basePoints: count(BASE_POINTS_RANGE).optional() })
  .superRefine(circleBars)
  .superRefine((r, ctx) => {
    if (r.rhos.length * (r.basePoints ?? 400) > TABLE_ROWS_MAX) {
      ctx.addIssue({ code: 'custom', path: ['rhos'], message: `× basePoints is more than ${TABLE_ROWS_MAX} points; compute fewer curves at a time`, input: r.rhos.length });
    }
  });

export const BiaxialRequestSchema = z
  .looseObject({
    ...sectionFields,
    gammaX: gammaB.optional(),
    rhos: list(z.number({ message: 'must be a number' }).pipe(ranged(RHO_RANGE)), 20),
    levels: list(z.number({ message: 'must be a number' }).pipe(ranged(AXIAL_LEVEL_RANGE)), MAX_AXIAL_LEVELS),
    model: z.enum(['design', 'nominal']).optional(),
    angleStepDeg: z.number({ message: 'must be a number' }).pipe(ranged(ANGLE_STEP_RANGE)).optional(),
  })
  .superRefine(circleBars);

export const MakeSetOptionsSchema = z.looseObject({
  outDir: text(4096).optional(),
  jobs: count(JOBS_RANGE).optional(),
  chunkSize: count(CHUNK_SIZE_RANGE).optional(),
  generator: text(200),
});

/** Checks a library input; the first problem is a PmError naming the field path (`loads[2].Pu`, `shape.b`). */
export function checkLibraryInput<T extends z.ZodType>(schema: T, value: unknown, what: string): void {
  if (typeof value !== 'object' || value === null) throw new PmError(ERROR_CODES.invalidValue, what, 'must be an object', { value: value === null ? 'null' : typeof value });
  parseOrThrow(schema, value);
}

/** ρ given to the check: within the basis's column limits, as `check --rho` (src/flags/check-flags.ts). */
export function checkGivenRho(rho: number | undefined, limits: { min: number; max: number }): void {
  if (rho === undefined) return;
  if (!(rho >= limits.min && rho <= limits.max)) {
    throw new PmError(ERROR_CODES.outOfRange, 'rho', `is outside ${limits.min}–${limits.max}`, { value: rho, allowed: `${limits.min}–${limits.max}` });
  }
}
