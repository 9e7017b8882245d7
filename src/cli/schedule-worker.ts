/**
 * Child process of `pmchart schedule --jobs N`: checks the marks of each chunk it is given and sends
 * back their rows. Messages: parent → {type:'task', chunk, rows, loads, proposals, at} | {type:'exit'};
 * child → {type:'done', chunk, rows} | {type:'error', error}.
 */
import { isPmError } from '../errors.js';
import type { ChildError } from '../io/child-pool.js';
import type { FactoredLoad } from '../design/check.js';
import { checkRows, type MarkRow } from '../flags/schedule-rows.js';
import type { ScheduleRow } from '../input/schedule-csv.js';

export interface ScheduleTask {
  type: 'task';
  chunk: number;
  rows: ScheduleRow[];
  loads: [string, FactoredLoad[]][];
  proposals: number;
  at: string;
}
export type ScheduleWorkerMessage =
  | { type: 'done'; chunk: number; rows: MarkRow[] }
  | { type: 'error'; error: ChildError };

const send = (m: ScheduleWorkerMessage) => {
  if (process.connected) process.send?.(m);
};

process.on('disconnect', () => process.exit(0));
process.on('message', (msg: ScheduleTask | { type: 'exit' }) => {
  if (msg.type === 'exit') {
    process.disconnect?.();
    return;
  }
  try {
    const rows: MarkRow[] = [];
    for (const { check: _c, ...row } of checkRows(msg.rows, new Map(msg.loads), msg.proposals, msg.at, false)) rows.push(row);
    send({ type: 'done', chunk: msg.chunk, rows });
  } catch (e) {
    const err = e as Error;
    send({ type: 'error', error: { message: err.message, ...(isPmError(e) ? { pm: { code: e.code, path: e.path, detail: e.detail, facts: e.facts, exitCode: e.exitCode } } : {}) } });
  }
});
