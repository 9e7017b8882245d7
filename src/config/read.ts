/**
 * Reading a chart set, in stages:
 *
 *   text ──1 parse──▶ JSON ──2 schema──▶ ChartSetFile ──3 resolve──▶ ResolvedChartSet ──4 rules──▶ checked set
 *
 * Every stage reports problems as PmError with the field path, e.g. `sheets[3].gamma: 1.2 is outside 0.3–0.95`.
 * Between 1 and 2 the office file (`officeFile`) fills what the chart set leaves out (config/office.ts); after 3
 * the logo is read. Pure: the caller reads the file and passes `files` for the files it names; `now` stands in
 * for the clock.
 */
import { DESIGN_CODES, parseStrength } from '../codes/registry.js';
import { BASIS_IDS } from '../codes/registry.js';
import type { CodeId } from '../codes/types.js';
import { ERROR_CODES, PmError } from '../errors.js';
import type { UnitSystem } from '../units/index.js';
import { formatPath, parseOrThrow } from '../input/fields.js';
import { issueDate, MAX_AXIAL_LEVELS, MAX_LEVELS_PER_SHEET, MAX_SHEETS } from '../input/limits.js';
import { biaxialStemPart, biaxialTitlePart, DEFAULT_TITLE_PATTERN, fileStemFor, fillPattern, titleFields } from './describe.js';
import { expandNumbers } from './expand.js';
import { checkRules } from './rules.js';
import { readLogo, readOfficeFile, withOfficeDefaults, type FileAccess, type ReadOffice } from './office.js';
import { ChartSetFileSchema, type BarEntryDrawing, type ChartSetFile, type SheetGroupFile, type ShapeFile } from './schema.js';
import { PAPER_POINTS, type ResolvedChartSet, type ResolvedShape, type ResolvedSheet } from './types.js';

export interface ReadOptions {
  /** shown in JSON syntax errors; default "chart set" */
  source?: string;
  /** the issue date when the file gives none and SOURCE_DATE_EPOCH is unset */
  now?: Date;
  /** SOURCE_DATE_EPOCH (seconds), when set */
  sourceDateEpoch?: string;
  /**
   * Reads the files the chart set names (officeFile, titleBlock.logo), relative to `baseDir`; absent, a chart
   * set naming one is refused (exit 2 naming the field)
   */
  files?: FileAccess;
  /** the chart set's directory (paths in it are relative to it); default "." */
  baseDir?: string;
}

/** Reads a chart set from its text: throws PmError on the first problem. */
export function readChartSet(text: string, opts: ReadOptions = {}): ResolvedChartSet {
  return readChartSetReport(text, opts).set;
}

/** As readChartSet, also returning the rule checks' warnings. */
export function readChartSetReport(text: string, opts: ReadOptions = {}): { set: ResolvedChartSet; warnings: string[] } {
  // 1. parse
  let json: unknown;
  try {
    // a byte-order mark (editors on Windows write one) is not part of the JSON
    json = JSON.parse(text.replace(/^\uFEFF/, ''));
  } catch (e) {
    throw new PmError(ERROR_CODES.invalidValue, opts.source ?? 'chart set', `is not valid JSON (${(e as Error).message})`);
  }
  // 1b. the office defaults file, under the chart set's own values
  let office: ReadOffice | undefined;
  const officePath = typeof json === 'object' && json !== null ? (json as { officeFile?: unknown }).officeFile : undefined;
  if (typeof officePath === 'string') {
    office = readOfficeFile(needFiles(opts, 'officeFile'), officePath, opts.baseDir ?? '.', 'officeFile');
    json = withOfficeDefaults(json, office.file);
  }
  // 2. schema
  const file = checkSchema(json);
  // 3. resolve
  const set = resolveChartSet(file, opts);
  const logo = file.titleBlock.logo !== undefined ? readLogo(needFiles(opts, 'titleBlock.logo'), file.titleBlock.logo, opts.baseDir ?? '.', 'titleBlock.logo') : office?.logo;
  if (logo) set.titleBlock.logo = logo;
  // 4. rules
  const { errors, warnings } = checkRules(set, file);
  if (errors.length > 0) throw errors[0]!;
  return { set, warnings };
}

function needFiles(opts: ReadOptions, at: string): FileAccess {
  if (!opts.files) throw new PmError(ERROR_CODES.invalidValue, at, 'names a file, and this reader was given no file access (ReadOptions.files)');
  return opts.files;
}

/** Stage 2: the schema check, with zod's first issue turned into one line naming the field. */
export function checkSchema(json: unknown): ChartSetFile {
  return parseOrThrow(ChartSetFileSchema, json);
}

export { formatPath };

/** How many values a list, a single value or {from, to, step} gives, without expanding it. */
function countOf(v: unknown): number {
  if (Array.isArray(v)) return v.length;
  if (v !== null && typeof v === 'object' && 'step' in v) {
    const r = v as { from: number; to: number; step: number };
    return r.step > 0 && r.to >= r.from ? Math.floor((r.to - r.from) / r.step + 1e-9) + 1 : 1;
  }
  return 1;
}

/**
 * Sheets needed for `levels` axial levels: at most MAX_LEVELS_PER_SHEET panels a sheet, the levels shared
 * evenly (7 levels: 4 + 3), earlier sheets taking the extra one.
 */
export function levelSheets(levels: number): number[] {
  const k = Math.max(1, Math.ceil(levels / MAX_LEVELS_PER_SHEET));
  return Array.from({ length: k }, (_, i) => Math.floor(levels / k) + (i < levels % k ? 1 : 0));
}

/**
 * A group's chart kind, checked before anything is expanded: `axialLevels` belongs to biaxial groups
 * and biaxial groups need it; returns the kind and the count of levels (1 for uniaxial groups).
 */
export function groupChart(g: SheetGroupFile, at: string): { chart: 'uniaxial' | 'biaxial'; levels: number } {
  const chart = g.chart ?? 'uniaxial';
  if (chart === 'uniaxial') {
    if (g.axialLevels !== undefined) throw new PmError(ERROR_CODES.conflict, `${at}.axialLevels`, 'is only for biaxial groups; add "chart": "biaxial" or remove it');
    return { chart, levels: 1 };
  }
  if (g.axialLevels === undefined) throw new PmError(ERROR_CODES.missing, `${at}.axialLevels`, 'is required for a biaxial group (e.g. {"from": 0, "to": 0.6, "step": 0.1})');
  if (g.axes !== undefined) throw new PmError(ERROR_CODES.conflict, `${at}.axes`, 'is for P–M sheets; biaxial sheets fit their scales to the group’s contours');
  const levels = countOf(g.axialLevels);
  if (levels > MAX_AXIAL_LEVELS) throw new PmError(ERROR_CODES.outOfRange, `${at}.axialLevels`, `gives ${levels} levels, beyond ${MAX_AXIAL_LEVELS}`, { allowed: `1–${MAX_AXIAL_LEVELS} levels` });
  return { chart, levels };
}

/** Sheets the groups describe, from list lengths only: refused before anything is expanded. */
export function countSheets(file: ChartSetFile): number {
  let total = 0;
  file.sheets.forEach((g, gi) => {
    const { chart, levels } = groupChart(g, `sheets[${gi}]`);
    const perSection = chart === 'biaxial' ? levelSheets(levels).length : 1;
    const n = [g.shape, g.fc, g.fy, g.gamma, g.arrangement, g.transverse].reduce<number>((p, v) => p * countOf(v), perSection);
    total += n;
    if (total > MAX_SHEETS) {
      throw new PmError(ERROR_CODES.outOfRange, gi === 0 ? 'sheets' : `sheets[${gi}]`, `describe ${total > 1e6 ? 'more than a million' : total} sheets, beyond ${MAX_SHEETS}`, { allowed: `1–${MAX_SHEETS} sheets` });
    }
  });
  return total;
}

/** Stage 3: defaults, units and cross products. */
export function resolveChartSet(file: ChartSetFile, opts: ReadOptions = {}): ResolvedChartSet {
  countSheets(file);
  const date = file.titleBlock.date ?? defaultDate(opts);
  const units = file.units;
  const code = file.basis.code as CodeId;
  if (!BASIS_IDS.includes(code)) {
    throw new PmError(ERROR_CODES.invalidValue, 'basis.code', 'is not a known design basis', { value: file.basis.code, allowed: BASIS_IDS.join(', ') });
  }
  const size = file.paper?.size ?? (units === 'us' ? 'tabloid' : 'a3');
  const orientation = file.paper?.orientation ?? 'landscape';
  const [pw, ph] = PAPER_POINTS[size];
  const families = file.families ?? 'design';
  const familyText = families === 'both' ? 'nominal and factored' : families === 'nominal' ? 'nominal' : 'factored';
  const pattern = file.sheetTitle ?? DEFAULT_TITLE_PATTERN;
  const symbols = DESIGN_CODES[code]?.symbols ?? { concreteStrength: 'f′c', steelStrength: 'fy', normalisingStress: 'f′c' };
  if (file.rhoG !== undefined && file.omega !== undefined) {
    throw new PmError(ERROR_CODES.conflict, 'omega', 'and rhoG both set the curves; give one of them');
  }
  const setOptions = { ...(file.basis.options ?? {}) };

  const partial: Omit<ResolvedSheet, 'title' | 'fileStem'>[] = [];
  file.sheets.forEach((g, gi) => {
    const at = `sheets[${gi}]`;
    const shapes = listOf(g.shape ?? 'rectangle').map(resolveShape);
    const dc = DESIGN_CODES[code]!;
    const fcs = listOf(g.fc).map((q, k) => parseStrength(dc, q, 'concrete', units, indexed(`${at}.fc`, g.fc, k)));
    const fys = listOf(g.fy).map((q, k) => parseStrength(dc, q, 'steel', units, indexed(`${at}.fy`, g.fy, k)));
    const gammas = expandNumbers(g.gamma, `${at}.gamma`);
    const arrangements = listOf(g.arrangement);
    const transverses = listOf(g.transverse ?? 'tied');
    const variantOptions = { ...(g.basisOptions ?? {}) };
    const basisOptions = { ...setOptions, ...variantOptions };
    const axes = g.axes ? { ...(g.axes.P ? { P: axisLimits(g.axes.P, `${at}.axes.P`) } : {}), ...(g.axes.M ? { M: axisLimits(g.axes.M, `${at}.axes.M`) } : {}) } : undefined;
    // biaxial groups: one sheet per run of levels (levelSheets), for every section of the cross product
    const levelRuns: (Pick<ResolvedSheet, 'chart' | 'axialLevels' | 'levelPart'> | undefined)[] = [undefined];
    if (g.chart === 'biaxial' && g.axialLevels !== undefined) {
      const levels = expandNumbers(g.axialLevels, `${at}.axialLevels`);
      const runs = levelSheets(levels.length);
      levelRuns.length = 0;
      let start = 0;
      runs.forEach((n, k) => {
        levelRuns.push({ chart: 'biaxial', axialLevels: levels.slice(start, start + n), levelPart: [k + 1, runs.length] });
        start += n;
      });
    }
    for (const shape of shapes)
      for (const fc of fcs)
        for (const fy of fys)
          for (const gamma of gammas)
            for (const arrangement of arrangements)
              for (const transverse of transverses)
                for (const run of levelRuns) partial.push({ index: partial.length + 1, origin: at, shape, fc, fy, gamma, ...(g.gammaB !== undefined ? { gammaB: g.gammaB } : {}), arrangement, transverse, basisOptions, variantOptions, ...(axes ? { axes } : {}), ...(run ?? {}) });
  });
  const sheets: ResolvedSheet[] = partial.map((s) => ({
    ...s,
    title: capitalise(fillPattern(pattern, titleFields(s, units, familyText, symbols))) + (s.chart === 'biaxial' ? biaxialTitlePart(s, symbols) : ''),
    fileStem: fileStemFor(s, units, partial.length) + (s.chart === 'biaxial' ? biaxialStemPart(s) : ''),
  }));

  return {
    name: file.name,
    titleBlock: {
      office: file.titleBlock.office,
      project: file.titleBlock.project,
      preparedBy: file.titleBlock.preparedBy ?? '',
      checkedBy: file.titleBlock.checkedBy ?? '',
      revision: file.titleBlock.revision ?? '0',
      date,
    },
    paper: { size, orientation, widthPt: orientation === 'landscape' ? ph : pw, heightPt: orientation === 'landscape' ? pw : ph },
    units,
    code,
    basisOptions: setOptions,
    normalisation: file.normalisation ?? 'stress',
    families,
    ratios:
      file.omega !== undefined
        ? { kind: 'omega', values: expandNumbers(file.omega, 'omega') }
        : { kind: 'rhoG', values: file.rhoG === undefined ? expandNumbers({ from: 0.01, to: 0.08, step: 0.01 }, 'rhoG') : expandNumbers(file.rhoG, 'rhoG') },
    referenceLines: {
      strainStates: file.referenceLines?.strainStates ?? true,
      eccentricities: file.referenceLines?.eccentricities ?? [0.1, 0.25, 0.5, 1],
      axialCap: file.referenceLines?.axialCap ?? true,
      barEntry: barEntryDrawing(file.referenceLines?.barEntry),
    },
    outputs: {
      pdf: file.outputs?.pdf ?? true,
      svg: file.outputs?.svg ?? false,
      png: file.outputs?.png ?? false,
      pngScale: file.outputs?.pngScale ?? 2,
      tables: file.outputs?.tables ?? true,
    },
    sheets,
  };
}

const listOf = <T>(v: T | T[]): T[] => (Array.isArray(v) ? v : [v]);
const indexed = (path: string, v: unknown, k: number): string => (Array.isArray(v) ? `${path}[${k}]` : path);
const capitalise = (s: string): string => s.charAt(0).toUpperCase() + s.slice(1);

function resolveShape(s: ShapeFile): ResolvedShape {
  if (s === 'circle' || (typeof s === 'object' && s.kind === 'circle')) return { kind: 'circle' };
  return { kind: 'rectangle', aspect: typeof s === 'object' && s.kind === 'rectangle' ? (s.aspect ?? 1) : 1 };
}

function defaultDate(opts: ReadOptions): string {
  return issueDate(undefined, 'titleBlock.date', opts.sourceDateEpoch, opts.now);
}

export type { UnitSystem };

/** A group's fixed axis limits: finite and increasing. */
function axisLimits(v: [number, number], path: string): [number, number] {
  if (!Number.isFinite(v[0]) || !Number.isFinite(v[1]) || !(v[1] > v[0])) {
    throw new PmError(ERROR_CODES.invalidValue, path, 'must be [low, high] with low below high', { value: JSON.stringify(v) });
  }
  return [v[0], v[1]];
}

/** `referenceLines.barEntry`: its earlier booleans read as the drawings they chose (true "steps", false "chord"). */
export function barEntryDrawing(v: BarEntryDrawing | boolean | undefined): BarEntryDrawing {
  return v === true ? 'steps' : v === false ? 'chord' : (v ?? 'inner');
}
