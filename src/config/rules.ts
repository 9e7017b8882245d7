/**
 * Stage 4 of reading a chart set: named rule checks on the resolved set. Problems are data
 * (PmError with code, path and facts); the reader throws the first error.
 */
import { rhoFromOmega } from '../codes/mechanical-ratio.js';
import { DESIGN_CODES, parseStrength } from '../codes/registry.js';
import type { Basis, BasisOptions, DesignCode } from '../codes/types.js';
import { ERROR_CODES, PmError, isPmError } from '../errors.js';
import { DISPLAY_UNITS } from '../units/index.js';
import { expandNumbers } from './expand.js';
import { ASPECT_RANGE, AXIAL_LEVEL_RANGE, BARS_PER_FACE_RANGE, ECCENTRICITY_RANGE, GAMMA_B_RANGE, GAMMA_RANGE, isCalendarDate, MAX_SHEETS, OMEGA_RANGE, PNG_SCALE_RANGE, RHO_RANGE, RING_BARS_RANGE, SET_CURVES_RANGE } from '../input/limits.js';
import type { ChartSetFile } from './schema.js';
import type { ResolvedChartSet } from './types.js';

export { ASPECT_RANGE, ECCENTRICITY_RANGE, GAMMA_RANGE, MAX_SHEETS, OMEGA_RANGE, PNG_SCALE_RANGE, RHO_RANGE } from '../input/limits.js';

export interface RuleReport {
  errors: PmError[];
  warnings: string[];
}

const outside = (path: string, value: number, [lo, hi]: readonly [number, number], unit = ''): PmError => {
  const u = unit ? ` ${unit}` : '';
  return new PmError(ERROR_CODES.outOfRange, path, `is outside ${lo}–${hi}${u}`, { value: `${value}${u}`, allowed: `${lo}–${hi}${u}` });
};
const inRange = (v: number, [lo, hi]: readonly [number, number]) => Number.isFinite(v) && v >= lo && v <= hi;

export function checkRules(set: ResolvedChartSet, file: ChartSetFile): RuleReport {
  const errors: PmError[] = [];
  const warnings: string[] = [];

  if (!/^[A-Za-z0-9][A-Za-z0-9_-]{0,79}$/.test(set.name)) {
    errors.push(new PmError(ERROR_CODES.invalidValue, 'name', 'must be 1–80 letters, digits, "-" or "_", starting with a letter or digit', { value: JSON.stringify(set.name) }));
  }
  if (!isCalendarDate(set.titleBlock.date)) {
    errors.push(new PmError(ERROR_CODES.invalidValue, 'titleBlock.date', 'is not a date in the form YYYY-MM-DD', { value: set.titleBlock.date }));
  }
  const { kind, values } = set.ratios;
  const range = kind === 'omega' ? OMEGA_RANGE : RHO_RANGE;
  const list = kind === 'omega' ? file.omega : file.rhoG;
  values.forEach((r, k) => {
    const path = Array.isArray(list) ? `${kind}[${k}]` : kind;
    if (!inRange(r, range)) errors.push(outside(path, r, range));
    else if (k > 0 && !(r > values[k - 1]!)) errors.push(new PmError(ERROR_CODES.invalidValue, path, 'must be larger than the value before it', { value: r }));
  });
  if (values.length === 0) errors.push(new PmError(ERROR_CODES.missing, kind, 'must hold at least one value'));
  if (values.length > SET_CURVES_RANGE[1]) errors.push(outside(kind, values.length, SET_CURVES_RANGE, 'curves'));
  set.referenceLines.eccentricities.forEach((e, k) => {
    if (!inRange(e, ECCENTRICITY_RANGE)) errors.push(outside(`referenceLines.eccentricities[${k}]`, e, ECCENTRICITY_RANGE));
  });
  if (!inRange(set.outputs.pngScale, PNG_SCALE_RANGE)) errors.push(outside('outputs.pngScale', set.outputs.pngScale, PNG_SCALE_RANGE));
  const o = set.outputs;
  if (!o.pdf && !o.svg && !o.png && !o.tables) errors.push(new PmError(ERROR_CODES.missing, 'outputs', 'asks for no output; turn on at least one of pdf, svg, png, tables'));

  const code = DESIGN_CODES[set.code];
  if (!code) {
    errors.push(new PmError(ERROR_CODES.invalidValue, 'basis.code', 'is not available in this build', { value: set.code, allowed: Object.keys(DESIGN_CODES).join(', ') }));
  }
  const su = DISPLAY_UNITS[set.units].stress;
  if (code && !code.unitSystems.includes(set.units)) {
    // named first: every strength would otherwise look out of range in the wrong units
    errors.push(new PmError(ERROR_CODES.invalidValue, 'units', `is not a unit system of ${code.title ?? set.code}`, { value: set.units, allowed: code.unitSystems.join(', ') }));
    return { errors, warnings };
  }

  file.sheets.forEach((g, gi) => {
    const at = `sheets[${gi}]`;
    const each = <T>(v: T | T[], name: string, f: (x: T, path: string) => void) =>
      (Array.isArray(v) ? v : [v]).forEach((x, k) => f(x, Array.isArray(v) ? `${at}.${name}[${k}]` : `${at}.${name}`));
    const gammas = expandNumbers(g.gamma, `${at}.gamma`);
    gammas.forEach((gm, k) => {
      if (!inRange(gm, GAMMA_RANGE)) errors.push(outside(Array.isArray(g.gamma) ? `${at}.gamma[${k}]` : `${at}.gamma`, gm, GAMMA_RANGE));
    });
    if (code) {
      const lim = code.limits(set.units);
      each(g.fc, 'fc', (q, path) => {
        const v = parseStrength(code, q, 'concrete', set.units, path);
        if (!inRange(v, lim.fc)) errors.push(outside(path, Number(v.toFixed(4)), lim.fc, su));
      });
      each(g.fy, 'fy', (q, path) => {
        const v = parseStrength(code, q, 'steel', set.units, path);
        if (!inRange(v, lim.fy)) errors.push(outside(path, Number(v.toFixed(4)), lim.fy, su));
      });
    }
    const shapes = Array.isArray(g.shape) ? g.shape : [g.shape ?? 'rectangle'];
    const hasCircle = shapes.some((s) => s === 'circle' || (typeof s === 'object' && s.kind === 'circle'));
    if (g.gammaB !== undefined) {
      if (!inRange(g.gammaB, GAMMA_B_RANGE)) errors.push(outside(`${at}.gammaB`, g.gammaB, GAMMA_B_RANGE));
      if (hasCircle) errors.push(new PmError(ERROR_CODES.conflict, `${at}.gammaB`, 'applies to rectangles only (a ring takes its diameter from γ)', { value: g.gammaB }));
    }
    each(g.shape ?? 'rectangle', 'shape', (s, path) => {
      if (typeof s === 'object' && s.kind === 'rectangle' && s.aspect !== undefined && !inRange(s.aspect, ASPECT_RANGE)) errors.push(outside(`${path}.aspect`, s.aspect, ASPECT_RANGE));
    });
    if (g.chart === 'biaxial') {
      // a round section has the same capacity in every direction but for its bars' orientation: no Mx–My family to chart
      each(g.shape ?? 'rectangle', 'shape', (s, path) => {
        if (s === 'circle' || (typeof s === 'object' && s.kind === 'circle')) errors.push(new PmError(ERROR_CODES.conflict, path, 'has no biaxial sheets; they are for rectangular sections', { value: 'circle' }));
      });
      if (g.axialLevels !== undefined) {
        const levels = expandNumbers(g.axialLevels, `${at}.axialLevels`);
        levels.forEach((v, k) => {
          const path = Array.isArray(g.axialLevels) ? `${at}.axialLevels[${k}]` : `${at}.axialLevels`;
          if (!inRange(v, AXIAL_LEVEL_RANGE)) errors.push(outside(path, v, AXIAL_LEVEL_RANGE));
          else if (k > 0 && !(v > levels[k - 1]!)) errors.push(new PmError(ERROR_CODES.invalidValue, path, 'must be larger than the level before it', { value: v }));
        });
      }
    }
    each(g.arrangement, 'arrangement', (a, path) => {
      if (a.kind === 'ring') {
        if (!inRange(a.bars, RING_BARS_RANGE)) errors.push(outside(`${path}.bars`, a.bars, RING_BARS_RANGE));
      } else {
        const range = BARS_PER_FACE_RANGE[a.kind];
        const counts = typeof a.barsPerFace === 'number' ? [a.barsPerFace] : a.barsPerFace;
        counts.forEach((n, k) => {
          if (!inRange(n, range)) errors.push(outside(typeof a.barsPerFace === 'number' ? `${path}.barsPerFace` : `${path}.barsPerFace[${k}]`, n, range));
        });
        if (hasCircle) errors.push(new PmError(ERROR_CODES.conflict, `${path}.kind`, 'cannot be used with a circular shape; use "ring"', { value: a.kind }));
      }
    });
  });
  if (code && errors.length === 0) errors.push(...basisChecks(set, file, code));
  if (set.sheets.length === 0) errors.push(new PmError(ERROR_CODES.missing, 'sheets', 'must describe at least one sheet'));
  if (set.sheets.length > MAX_SHEETS) errors.push(outside('sheets', set.sheets.length, [1, MAX_SHEETS], 'sheets'));
  const stems = new Set<string>();
  for (const s of set.sheets) {
    if (stems.has(s.fileStem.replace(/^\d+-/, ''))) warnings.push(`${s.origin}: sheet ${s.index} repeats an earlier sheet`);
    stems.add(s.fileStem.replace(/^\d+-/, ''));
  }
  return { errors, warnings };
}

/** "--alpha-cc" → "alphaCc": the basis reports option problems by flag; a set names the config field. */

/**
 * Rules that need each sheet's basis: the basis options (ranges live in the basis, reported here with
 * the config path that set them) and, for ω families, the ρg each sheet's conversion gives.
 */
function basisChecks(set: ResolvedChartSet, file: ChartSetFile, code: DesignCode): PmError[] {
  const errors: PmError[] = [];
  const seen = new Map<string, Basis | null>();
  for (const s of set.sheets) {
    const key = JSON.stringify([s.fc, s.fy, s.transverse, s.basisOptions]);
    if (!seen.has(key)) {
      try {
        seen.set(key, code.resolve({ units: set.units, fc: s.fc, fy: s.fy, transverse: s.transverse, options: s.basisOptions }));
      } catch (e) {
        if (!isPmError(e)) throw e;
        seen.set(key, null);
        // the basis names the field by its key (alphaCc, units): say where this file set it
        const field = e.path as keyof BasisOptions;
        const at = field in s.variantOptions ? `${s.origin}.basisOptions.${field}` : field in (file.basis.options ?? {}) ? `basis.options.${field}` : e.path;
        errors.push(e.at(at));
        break;
      }
    }
    const basis = seen.get(key);
    if (!basis || set.ratios.kind !== 'omega') continue;
    for (const [k, w] of set.ratios.values.entries()) {
      const rho = rhoFromOmega(basis, w);
      if (!inRange(rho, RHO_RANGE)) {
        const path = Array.isArray(file.omega) ? `omega[${k}]` : 'omega';
        errors.push(
          new PmError(ERROR_CODES.outOfRange, path, `gives ρg ${Number(rho.toPrecision(3))} on sheet ${s.index} (${s.origin}), outside ${RHO_RANGE[0]}–${RHO_RANGE[1]}`, { value: w }),
        );
        return errors;
      }
    }
  }
  return errors;
}
