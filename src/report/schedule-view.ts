/**
 * Views of a schedule check (issue 22): the text table and the JSON document, one row per mark, from
 * the figures `src/design/schedule.ts` reads off each mark's check. Every figure is the engine's;
 * rounding and words are made here once (`fmt`/`num`, STATUS_WORDS). Every view carries the basis
 * editions, the assumptions and the caution.
 */
import type { ScheduleRowFacts, ScheduleSummary } from '../design/schedule.js';
import { CAUTION } from './caution.js';
import { STATUS_WORDS } from './check-view.js';
import { cell, num } from './format.js';
import { textTable, type ViewColumn } from './view-table.js';

/** What every schedule view prints around the rows. */
export interface ScheduleHead {
  /** each design basis the marks use, by title (edition), in first-use order by mark */
  readonly bases: readonly { readonly code: string; readonly title: string }[];
  /** notes on how the input was read (ignored export columns, skipped marks) */
  readonly notes: readonly string[];
  /** bar proposals asked per mark (0: none) */
  readonly proposals: number;
}

/** Assumptions of the schedule run, beside each mark's own (its calculation sheet lists them). */
export function scheduleAssumptions(head: ScheduleHead): string[] {
  return [
    `Each mark is checked as \`pmchart check\` checks that column with its loads: the same engine (${head.bases.map((b) => b.title).join('; ')}), the same statuses and the same exit status.`,
    'Utilisation is the governing load’s measure: the larger of the uniaxial and exact biaxial utilisations of the scheduled bars, every effect included (slenderness where klu is given, minimum moment, both signs, ring orientations); — when the load is unstable or not possible.',
    'ρg required is the governing load’s, solved exactly at the mark’s γ with its bars smeared in its arrangement (the exact biaxial figure where the load has Muy on a rectangle); ρg provided is that of the scheduled bars.',
    'Loads: axial compression positive as read (--compression negative turns an export’s sign); bare numbers are in each mark’s units; repeated combinations of a mark are separate loads (#2, #3 …).',
    'Short columns unless the schedule gives klu: factored moments are then taken as given (non-sway); a mark with sway = yes is a sway (unbraced) column checked by its basis\'s sway method, its sway moments from the loads file (M2s, M02s) and its storey data from the schedule or per load.',
    head.proposals > 0 ? `Bar proposals: ${head.proposals} per mark, re-verified against every load.` : 'No bar proposals (--proposals N to ask).',
  ];
}

/** The schedule's table, one row per mark: the text table and the page's table render these columns. */
export const SCHEDULE_TABLE: readonly ViewColumn<ScheduleRowFacts>[] = [
  { key: 'mark', heading: 'mark', unit: null, align: 'left', cell: (r) => r.mark },
  { key: 'governing', heading: 'governing load', unit: null, align: 'left', cell: (r) => r.governing },
  { key: 'status', heading: 'status', unit: null, align: 'left', cell: (r) => STATUS_WORDS[r.status] },
  { key: 'utilisation', heading: 'utilisation', unit: null, align: 'right', cell: (r) => cell(r.utilisation, 3) },
  { key: 'rhoProvided', heading: 'ρg provided', unit: null, align: 'right', cell: (r) => cell(r.rhoProvided, 4) },
  { key: 'rhoRequired', heading: 'ρg required', unit: null, align: 'right', cell: (r) => cell(r.rhoRequired, 4) },
];

/** The text table: head lines, one row per mark (marks sorted), the summary, notes, assumptions and the caution. */
export function scheduleText(rows: readonly ScheduleRowFacts[], summary: ScheduleSummary, head: ScheduleHead): string {
  const out = [
    `Column schedule: ${head.bases.map((b) => b.title).join('; ')}`,
    '',
    ...textTable(SCHEDULE_TABLE, rows),
    '',
    summary.text,
  ];
  if (head.notes.length > 0) out.push('', 'Notes:', ...head.notes.map((n) => `- ${n}`));
  out.push('', 'Assumptions:', ...scheduleAssumptions(head).map((a) => `- ${a}`), '', CAUTION, '');
  return out.join('\n');
}

/** One mark as JSON (stable fields: mark, status, utilisation, governing, rhoProvided, rhoRequired). */
export function scheduleRowJson(r: ScheduleRowFacts, code: string) {
  const n = (x: number | null) => (x === null ? null : num(x));
  return { mark: r.mark, status: r.status, utilisation: n(r.utilisation), governing: r.governing, rhoProvided: n(r.rhoProvided), rhoRequired: n(r.rhoRequired), code, loads: r.loads };
}

/** The whole schedule as JSON: columns sorted by mark, summary counts by status, exit status, assumptions and caution. */
export function scheduleJson(rows: readonly (ScheduleRowFacts & { code: string })[], summary: ScheduleSummary, exitCode: number, head: ScheduleHead, generator: string): string {
  const doc = {
    generator,
    bases: head.bases,
    columns: rows.map((r) => scheduleRowJson(r, r.code)),
    summary: { total: summary.total, ...summary.counts, text: summary.text },
    exitCode,
    notes: head.notes,
    assumptions: scheduleAssumptions(head),
    caution: CAUTION,
  };
  return `${JSON.stringify(doc, null, 1)}\n`;
}
