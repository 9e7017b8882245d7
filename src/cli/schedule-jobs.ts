/**
 * `schedule --jobs N`: the marks in fixed chunks, handed to N child processes as they become free
 * (as chart sets spread sheets, src/sheet/pipeline.ts). Rows come back by chunk and are joined in chunk
 * order, so the output does not depend on N. Any child that fails stops the others.
 */
import { fork } from 'node:child_process';
import { dirname, extname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { ERROR_CODES, PmError, type ErrorCode } from '../errors.js';
import type { MarkRow } from '../flags/schedule-rows.js';
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
  const ext = extname(here);
  const workerPath = join(dirname(here), `schedule-worker${ext}`);
  const execArgv = ext === '.ts' ? ['--import', 'tsx'] : [];
  const jobs = Math.min(p.jobs, tasks.length);
  const results: MarkRow[][] = new Array(tasks.length);
  let next = 0;
  let done = 0;
  const children = Array.from({ length: jobs }, () => fork(workerPath, [], { execArgv, stdio: ['ignore', 'inherit', 'inherit', 'ipc'] }));
  try {
    await Promise.all(
      children.map(
        (child, k) =>
          new Promise<void>((resolveChild, reject) => {
            let finished = false;
            const give = () => {
              const t = tasks[next++];
              if (t) child.send(t);
              else {
                finished = true;
                child.send({ type: 'exit' });
                resolveChild();
              }
            };
            child.on('message', (m: ScheduleWorkerMessage) => {
              if (m.type === 'done') {
                results[m.chunk] = m.rows;
                for (let i = 0; i < m.rows.length; i++) onMark?.(++done);
                give();
              } else {
                const pm = m.error.pm;
                reject(pm ? new PmError(pm.code as ErrorCode, pm.path, pm.detail, pm.facts, pm.exitCode) : new Error(m.error.message));
              }
            });
            child.on('error', (e) => reject(new PmError(ERROR_CODES.environment, '--jobs', `process ${k + 1} cannot be run (${(e as NodeJS.ErrnoException).code ?? e.message})`, {}, 3)));
            child.on('exit', (code, signal) => {
              if (!finished) reject(new PmError(ERROR_CODES.environment, '--jobs', `process ${k + 1} stopped (${signal ?? `exit code ${code}`})`, {}, 3));
            });
            give();
          }),
      ),
    );
  } catch (e) {
    for (const c of children) if (c.exitCode === null && c.signalCode === null) c.kill('SIGTERM');
    throw e;
  } finally {
    for (const c of children) if (c.connected) c.disconnect();
  }
  return results.flat();
}
