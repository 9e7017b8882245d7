/**
 * Bars of an actual (sized) section for commands that analyse the real column (contour, check):
 * from `--rho` (ρg·Ag spread over the arrangement) or from the named `--bar` (count × bar area).
 */
import { parseDecimal } from '../input/limits.js';
import { prepareBiaxial, type BiaxialSection } from '../analysis/biaxial.js';
import { ERROR_CODES, PmError, requireInRange } from '../errors.js';
import { barCount, layoutBars } from '../section/arrangements.js';
import { grossArea } from '../section/geometry.js';
import type { Bar } from '../section/types.js';
import type { ResolvedSection } from './section-flags.js';

export interface ActualBars {
  bars: Bar[];
  steelArea: number;
  rhoG: number;
  /** "ρg = 0.02" or "8 × #9" */
  source: string;
}

export function actualBars(section: ResolvedSection, rhoText: string | undefined, path = '--rho'): ActualBars {
  if (!section.sized) throw new PmError(ERROR_CODES.missing, '--b/--h', 'is required (actual section size)');
  const ag = grossArea(section.shape);
  const opts = { gamma: section.gamma, ...(section.gammaB !== undefined ? { gammaX: section.gammaB } : {}) };
  if (rhoText !== undefined) {
    const rho = parseDecimal(rhoText) ?? NaN;
    if (!Number.isFinite(rho)) throw new PmError(ERROR_CODES.invalidValue, path, 'is not a number', { value: rhoText, allowed: '0.001–0.1' });
    requireInRange(path, rho, 0.001, 0.1);
    const bars = layoutBars(section.shape, section.arrangement, rho * ag, opts);
    return { bars, steelArea: rho * ag, rhoG: rho, source: `ρg = ${rho}` };
  }
  if (section.bar) {
    const n = barCount(section.arrangement);
    const ast = n * section.bar.area;
    const bars = layoutBars(section.shape, section.arrangement, ast, opts);
    return { bars, steelArea: ast, rhoG: ast / ag, source: `${n} × ${section.bar.name}` };
  }
  throw new PmError(ERROR_CODES.missing, path, 'is required (a single ρg, e.g. 0.02), or give --bar to use the arrangement’s bars');
}

export function biaxialSectionOf(section: ResolvedSection, bars: readonly Bar[]): BiaxialSection {
  return prepareBiaxial(section.basis, section.shape, bars, section.capContext);
}
