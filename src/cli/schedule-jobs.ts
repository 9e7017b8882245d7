/**
 * `schedule --jobs N`: the marks in fixed chunks, handed to N child processes as they become free
 * (as chart sets spread sheets, src/sheet/pipeline.ts). Rows come back by chunk and are joined in chunk
 * order, so the output does not depend on N. Any child that fails stops the others.
 */
import { dirname, extname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { MarkRow } from '../flags/schedule-rows.js';
import { runInChildren } from '../io/child-pool.js';
import type { PreparedSchedule } from './schedule.js';
import type { ScheduleTask, ScheduleWorkerMessage } from './schedule-worker.js';

/** Marks per chunk handed to a process. */
export const SCHEDULE_CHUNK = 16;

export async function rowsInChildren(p: PreparedSchedule, onMark?: (done: number) => void): Promise<MarkRow[]> {
  const tasks: ScheduleTask[] = [];
  for (let start = 0, k = 0; start < p.rows.length; start += SCHEDULE_CHUNK, k++) {
    const rows = p.rows.slice(start, start + SCHEDULE_CHUNK);
    tasks.push({ type: 'task', chunk: k, rows, loads: rows.map((r) => [r.mark, p.loads.get(r.mark)!]), proposals: p.proposals, at: p.at });
  }
  const here = fileURLToPath(import.meta.url);
  let done = 0;
  const results = await runInChildren<ScheduleTask, ScheduleWorkerMessage, MarkRow[]>({
    workerPath: join(dirname(here), `schedule-worker${extname(here)}`),
    tasks,
    jobs: p.jobs,
    taskMessage: (t) => t,
    result: (m) => {
      for (let i = 0; i < m.rows.length; i++) onMark?.(++done);
      return { chunk: m.chunk, value: m.rows };
    },
    label: 'process',
    failure: { path: '--jobs', exitCode: 3 },
    keepErrorPath: true,
  });
  return results.flat();
}
