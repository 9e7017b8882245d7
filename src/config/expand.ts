import { ERROR_CODES, PmError } from '../errors.js';

/** A list, a single value, or {from, to, step} → values (rounded to 1e-9 so 0.7 + 3·0.05 prints as 0.85). */
export function expandNumbers(v: number | number[] | { from: number; to: number; step: number }, path: string): number[] {
  if (typeof v === 'number') return [v];
  if (Array.isArray(v)) return v;
  if (!(v.step > 0)) throw new PmError(ERROR_CODES.outOfRange, `${path}.step`, 'must be greater than 0', { value: v.step });
  if (v.to < v.from) throw new PmError(ERROR_CODES.conflict, `${path}.to`, `must not be less than from (${v.from})`, { value: v.to });
  const n = Math.floor((v.to - v.from) / v.step + 1e-9);
  if (n > 1000) throw new PmError(ERROR_CODES.outOfRange, path, 'gives more than 1000 values', { value: n + 1 });
  return Array.from({ length: n + 1 }, (_, i) => Number((v.from + i * v.step).toFixed(9)));
}
