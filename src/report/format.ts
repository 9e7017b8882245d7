/** Deterministic number formatting shared by every view (text, JSON, CSV, sheets, the page). */

/** Seven significant digits, no −0, no exponent noise below 1e-12 in magnitude. */
export function fmt(x: number, digits = 7): string {
  if (!Number.isFinite(x)) return x > 0 ? 'inf' : x < 0 ? '-inf' : '';
  if (Math.abs(x) < 1e-12) return '0';
  return String(Number(x.toPrecision(digits)));
}

/** A number rounded as `fmt` shows it, for JSON; null for a non-finite value. */
export function num(x: number, digits = 7): number | null {
  if (!Number.isFinite(x)) return null;
  if (Math.abs(x) < 1e-12) return 0;
  return Number(x.toPrecision(digits));
}

/** A table cell: `fmt` to `d` digits, "—" for null, undefined or NaN, "∞" for +Infinity. */
export const cell = (x: number | null | undefined, d = 4): string =>
  x === null || x === undefined || Number.isNaN(x) ? '—' : Number.isFinite(x) ? fmt(x, d) : x > 0 ? '∞' : '—';
