/** Deterministic number and CSV formatting, number lists and report dates shared by the flag readers and the commands. */
import { issueDate } from '../input/limits.js';
import { fmt } from '../report/format.js';

export { fmt, num } from '../report/format.js';

const csvCell = (v: string | number): string => {
  const s = typeof v === 'number' ? fmt(v) : v;
  return /[",\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
};

export function csvLine(cells: readonly (string | number)[]): string {
  return cells.map(csvCell).join(',');
}

/** Parses "0.01:0.08:0.01" (inclusive range) or "0.01,0.02,0.04" into a sorted list. */
export function parseNumberList(text: string): number[] | null {
  const t = text.trim();
  const range = /^([^:]+):([^:]+):([^:]+)$/.exec(t);
  if (range) {
    const [a, b, s] = [Number(range[1]), Number(range[2]), Number(range[3])];
    if (![a, b, s].every(Number.isFinite) || s <= 0 || b < a) return null;
    const n = Math.floor((b - a) / s + 1e-9);
    if (n > 10_000) return null;
    return Array.from({ length: n + 1 }, (_, i) => Number((a + i * s).toPrecision(12)));
  }
  const parts = t.split(',').map((p) => Number(p.trim()));
  if (parts.length === 0 || !parts.every(Number.isFinite)) return null;
  return parts;
}

/** --date, else SOURCE_DATE_EPOCH, else today (as `pmchart sheet`): the PDF dates are this day at 00:00 UTC. */
export function reportDate(text: string | undefined): string {
  return issueDate(text, '--date', process.env.SOURCE_DATE_EPOCH);
}

