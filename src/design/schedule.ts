/**
 * Column schedules (issue 22): every mark of a building checked by the one engine, `checkColumn`.
 *
 *   schedule (mark → section and bars) + loads (mark → factored loads)
 *     ─▶ 1. match marks (a mark on one side only is an error naming it, unless allowed)
 *     ─▶ 2. per mark, in mark order: checkColumn ─▶ the governing load's status, measure, ρg
 *     ─▶ 3. counts by status, exit status
 *
 * `scheduleMarks` yields one mark at a time (flat memory for big schedules; each result can be
 * dropped after its row is read); `checkSchedule` collects them. Nothing here is computed that the
 * engine does not give, except the exact biaxial ρg required of the governing load when bars are
 * given (the engine checks given bars by utilisation; `biaxialRhoRequired` is its own solver). No I/O.
 */
import { ERROR_CODES, PmError } from '../errors.js';
import type { FactoredLoad } from './check.js';
import { rhoLimitsFor } from './check.js';
import { biaxialRhoRequired, checkColumn, LOAD_STATUSES, type ColumnCheck, type ColumnCheckInput, type ColumnLoadResult, type LoadStatus } from './column-check.js';

/** One mark of a schedule: its section, bars and options; the loads come from the load file. */
export interface ScheduleEntry {
  readonly mark: string;
  readonly input: Omit<ColumnCheckInput, 'loads'>;
}

/** One mark's figures, read from its check. */
export interface ScheduleRowFacts {
  readonly mark: string;
  /** the governing load's status (the check's status list) */
  readonly status: LoadStatus;
  /** the check's governing measure (the larger of the uniaxial and exact biaxial utilisations); null when unstable or not possible */
  readonly utilisation: number | null;
  /** the governing load's id */
  readonly governing: string;
  /** ρg of the scheduled bars */
  readonly rhoProvided: number | null;
  /** ρg the governing load requires at the actual γ (the exact biaxial figure where it has Muy); null when not possible */
  readonly rhoRequired: number | null;
  /** loads checked */
  readonly loads: number;
  /** the mark's own check exit status (0 every load passes) */
  readonly exitCode: 0 | 1;
}

export interface ScheduleMarkResult extends ScheduleRowFacts {
  readonly check: ColumnCheck;
}

export interface ScheduleSummary {
  readonly total: number;
  readonly counts: Readonly<Record<LoadStatus, number>>;
  readonly text: string;
}

export interface ScheduleCheck {
  /** sorted by mark */
  readonly columns: readonly ScheduleMarkResult[];
  readonly summary: ScheduleSummary;
  readonly exitCode: 0 | 1;
  /** marks of the schedule with no loads, and marks of the loads not in the schedule (only with allowMissing) */
  readonly missing: { readonly withoutLoads: readonly string[]; readonly notInSchedule: readonly string[] };
}

export interface ScheduleOptions {
  /** a mark on one side only is skipped and listed instead of an error */
  allowMissing?: boolean;
  /**
   * false: each mark's check leaves out the emulated chart readings (`rhoFromChart` …), most of the work of a
   * check; statuses, measures, the governing load and ρg required are the same. Default true.
   */
  readings?: boolean;
}

/** Marks in natural order: "C2" before "C10"; digit runs by value, other text by code unit. */
export function compareMarks(a: string, b: string): number {
  const pa = a.match(/\d+|\D+/g) ?? [];
  const pb = b.match(/\d+|\D+/g) ?? [];
  for (let i = 0; i < Math.min(pa.length, pb.length); i++) {
    const x = pa[i]!;
    const y = pb[i]!;
    if (x === y) continue;
    const dx = /^\d/.test(x);
    const dy = /^\d/.test(y);
    if (dx && dy) {
      const d = Number(x) - Number(y);
      if (d !== 0) return d;
      return x.length - y.length;
    }
    return x < y ? -1 : 1;
  }
  return pa.length - pb.length || (a < b ? -1 : a > b ? 1 : 0);
}

/** Marks of the schedule that have loads, in mark order; a mark on one side only is an error unless allowed. */
export function matchMarks(schedule: readonly ScheduleEntry[], loads: ReadonlyMap<string, readonly FactoredLoad[]>, opts: ScheduleOptions = {}): { entries: ScheduleEntry[]; missing: ScheduleCheck['missing'] } {
  const names = new Set<string>();
  for (const e of schedule) {
    if (names.has(e.mark)) throw new PmError(ERROR_CODES.conflict, 'schedule mark', 'is given twice', { value: JSON.stringify(e.mark) });
    names.add(e.mark);
  }
  const withoutLoads = schedule.filter((e) => (loads.get(e.mark)?.length ?? 0) === 0).map((e) => e.mark).sort(compareMarks);
  const notInSchedule = [...loads.keys()].filter((m) => !names.has(m)).sort(compareMarks);
  if (!opts.allowMissing) {
    if (notInSchedule.length > 0) throw new PmError(ERROR_CODES.missing, 'loads mark', `is not in the schedule${notInSchedule.length > 1 ? ` (nor ${notInSchedule.slice(1, 6).map((m) => JSON.stringify(m)).join(', ')}${notInSchedule.length > 6 ? ' …' : ''})` : ''}; give --allow-missing to skip such marks`, { value: JSON.stringify(notInSchedule[0]) });
    if (withoutLoads.length > 0) throw new PmError(ERROR_CODES.missing, 'schedule mark', `has no loads in the load file${withoutLoads.length > 1 ? ` (nor ${withoutLoads.slice(1, 6).map((m) => JSON.stringify(m)).join(', ')}${withoutLoads.length > 6 ? ' …' : ''})` : ''}; give --allow-missing to skip such marks`, { value: JSON.stringify(withoutLoads[0]) });
  }
  const skip = new Set(withoutLoads);
  const entries = schedule.filter((e) => !skip.has(e.mark)).sort((a, b) => compareMarks(a.mark, b.mark));
  return { entries, missing: { withoutLoads, notInSchedule } };
}

/** One mark checked: the engine's check and the figures of its governing load. */
export function checkMark(entry: ScheduleEntry, loads: readonly FactoredLoad[], opts: Pick<ScheduleOptions, 'readings'> = {}): ScheduleMarkResult {
  const check = checkColumn({ ...entry.input, loads }, { readings: opts.readings ?? true });
  return { ...rowFacts(entry.mark, check), check };
}

/** The schedule row of one mark's check. */
export function rowFacts(mark: string, check: ColumnCheck): ScheduleRowFacts {
  const g = check.results[0]!;
  const noMeasure = g.status === 'unstable' || g.status === 'not-possible' || check.measure !== 'utilisation';
  return {
    mark,
    status: g.status,
    utilisation: noMeasure ? null : g.measureValue,
    governing: g.id,
    rhoProvided: check.checked?.rho ?? null,
    rhoRequired: requiredRho(check, g),
    loads: check.results.length,
    exitCode: check.exitCode,
  };
}

/**
 * ρg the governing load needs at the actual γ: the uniaxial figure (a circle's uses the resultant
 * moment), or for a rectangle under Mux and Muy the larger of it and the exact biaxial figure.
 */
function requiredRho(check: ColumnCheck, g: ColumnLoadResult): number | null {
  if (g.status === 'unstable' || g.rhoRequired === null) return null;
  if (g.Muy === null || g.Muy === 0 || check.shape.kind !== 'rectangle') return g.rhoRequired;
  const engine = g.biaxial?.rhoStatus != null ? g.biaxial.rhoRequired : undefined;
  const biax =
    engine !== undefined
      ? engine
      : biaxialRhoRequired(check.basis, check.shape, check.arrangement, check.gamma, check.capContext, { Pu: g.Pu, Mux: g.Mu, Muy: g.Muy }, rhoLimitsFor(check.basis, g.Pu, check.area), check.gammaB ?? undefined).rho;
  return biax === null ? null : Math.max(g.rhoRequired, biax);
}

/** Each mark checked, in mark order, one at a time. */
export function* scheduleMarks(entries: readonly ScheduleEntry[], loads: ReadonlyMap<string, readonly FactoredLoad[]>, opts: Pick<ScheduleOptions, 'readings'> = {}): Generator<ScheduleMarkResult> {
  for (const e of entries) yield checkMark(e, loads.get(e.mark)!, opts);
}

/** Counts by status (every status of the check's list, LOAD_STATUSES) and the exit status. */
export function summariseSchedule(rows: Iterable<Pick<ScheduleRowFacts, 'status' | 'exitCode'>>): { summary: ScheduleSummary; exitCode: 0 | 1 } {
  const counts = Object.fromEntries(LOAD_STATUSES.map((s) => [s, 0])) as Record<LoadStatus, number>;
  let total = 0;
  let exitCode: 0 | 1 = 0;
  for (const r of rows) {
    counts[r.status]++;
    total++;
    if (r.exitCode !== 0) exitCode = 1;
  }
  const parts = LOAD_STATUSES.filter((s) => counts[s] > 0).map((s) => `${counts[s]} ${s}`);
  const text = `${total} mark${total === 1 ? '' : 's'}: ${parts.join(', ')}`;
  return { summary: { total, counts, text }, exitCode };
}

/**
 * Checks every mark of a schedule against its loads (`loads` keyed by mark) with the one check engine;
 * each mark's figures are those `checkColumn` gives for that column and its loads. The result is frozen.
 */
export function checkSchedule(schedule: readonly ScheduleEntry[], loads: ReadonlyMap<string, readonly FactoredLoad[]>, opts: ScheduleOptions = {}): ScheduleCheck {
  const { entries, missing } = matchMarks(schedule, loads, opts);
  const columns = [...scheduleMarks(entries, loads, opts)];
  const { summary, exitCode } = summariseSchedule(columns);
  return Object.freeze({ columns, summary, exitCode, missing });
}
