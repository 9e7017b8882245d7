/**
 * The page's state in the URL fragment (`#fc=5ksi&gamma=0.8&…`), so a reload or a shared link restores the
 * inputs, and the loads as a CSV file the command line reads back (`pmchart check --loads`). Pure: app.ts
 * reads and writes `location` and the download. The fragment never reaches a server, but a link someone
 * shares carries what is in it, pasted loads included; so its size is capped, and pasted loads that would
 * pass the cap stay out of it (the page says so).
 */
import type { PageLoads } from './engine.js';

/** Longest fragment the page writes, characters (common practice: well under the ~2000 characters old browsers and mail clients keep of a URL). */
export const FRAGMENT_CAP = 1800;

/** The form's values by field key (checkboxes true/false), and the γ grid. */
export interface PageState {
  values: Record<string, string | boolean>;
  grid?: number;
}

export interface EncodedState {
  /** without the leading '#'; '' when nothing fits */
  fragment: string;
  /** pasted loads were left out because the fragment would pass the cap */
  loadsLeftOut: boolean;
}

function params(values: Record<string, string | boolean>, grid: number | undefined, skip: string | null): string {
  const p = new URLSearchParams();
  for (const [k, v] of Object.entries(values)) {
    if (k === skip || v === false || v === '') continue;
    p.set(k, v === true ? '1' : v);
  }
  if (grid !== undefined) p.set('grid', String(grid));
  return p.toString();
}

/** The fragment for a state: every non-empty value; pasted loads only while the whole stays within `cap`. */
export function encodeState(state: PageState, cap = FRAGMENT_CAP): EncodedState {
  const all = params(state.values, state.grid, null);
  if (all.length <= cap) return { fragment: all, loadsLeftOut: false };
  const hasLoads = typeof state.values.loads === 'string' && state.values.loads !== '';
  const rest = params(state.values, state.grid, 'loads');
  return { fragment: rest.length <= cap ? rest : '', loadsLeftOut: hasLoads };
}

/**
 * The state a fragment holds, for the known fields only (`checkboxes` read '1' as true); anything else in
 * it is ignored. A fragment longer than the cap is not read at all (the page never writes one).
 */
export function decodeState(fragment: string, known: ReadonlySet<string>, checkboxes: ReadonlySet<string>, cap = FRAGMENT_CAP): PageState | null {
  const text = fragment.replace(/^#/, '');
  if (text === '' || text.length > cap) return null;
  const p = new URLSearchParams(text);
  const values: Record<string, string | boolean> = {};
  for (const [k, v] of p) {
    if (!known.has(k)) continue;
    values[k] = checkboxes.has(k) ? v === '1' : v;
  }
  const g = Number(p.get('grid'));
  return { values, ...(g === 0.05 || g === 0.1 ? { grid: g } : {}) };
}

const csvCell = (s: string): string => (/[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s);

/**
 * The loads as a CSV file `pmchart check --loads` reads: pasted text as it is (ending in one newline), a typed
 * load as one row `load` with the values as typed (units and all, which the reader accepts).
 */
export function loadsCsv(loads: PageLoads): string {
  if (loads.kind === 'csv') return `${loads.text.replace(/\s+$/, '')}\n`;
  const head = ['id', 'Pu', 'Mu', ...(loads.muy ? ['Muy'] : [])];
  const row = ['load', loads.pu, loads.mu, ...(loads.muy ? [loads.muy] : [])].map(csvCell);
  return `${head.join(',')}\n${row.join(',')}\n`;
}
