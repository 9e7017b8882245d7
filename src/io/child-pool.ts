/**
 * Tasks handed to `jobs` child processes as each becomes free (node-canvas cannot run in worker threads),
 * shared by chart-set rendering (src/sheet/pipeline.ts) and `schedule --jobs` (src/cli/schedule-jobs.ts).
 * Results come back by task index, so their order never depends on the number of processes.
 *
 * Messages: parent → the caller's task message, then {type:'exit'}; child → {type:'done', chunk, …} per
 * task, {type:'error', error} on a failure, anything else passed to `onProgress`. A child is done only
 * when told to exit; stopping before that, in any way, is a failure. Any failure stops the others, and
 * the pool waits for them to exit before it throws (callers then remove what the children wrote into).
 */
import { fork, type ChildProcess } from 'node:child_process';
import { ERROR_CODES, PmError, type ErrorCode } from '../errors.js';

/** A child's failure as it sends it: the message, and the PmError's parts where it was one. */
export interface ChildError {
  message: string;
  pm?: { code: string; path: string; facts: Record<string, unknown>; exitCode: number; detail: string };
}

export interface ChildPoolOptions<T, M extends { type: string }, R> {
  /** the worker module's file */
  workerPath: string;
  tasks: readonly T[];
  jobs: number;
  /** the message that hands one task to a child */
  taskMessage: (task: T) => unknown;
  /** a task's result from its {type:'done'} message: its index and value */
  result: (m: M & { type: 'done' }) => { chunk: number; value: R };
  /** any other message a child sends (progress) */
  onProgress?: (m: M) => void;
  /** the running children, for a caller that stops them on a signal */
  live?: Set<ChildProcess>;
  /** how a child is named in errors, e.g. "render process" */
  label: string;
  /** the error path of a child that cannot run or stops (a flag, or '') and its exit status */
  failure: { path: string; exitCode: number };
  /** whether a child's PmError keeps its path and facts (else the path is `failure.path`, no facts) */
  keepErrorPath: boolean;
}

/** Runs every task in the children; results by task index. */
export async function runInChildren<T, M extends { type: string }, R>(o: ChildPoolOptions<T, M, R>): Promise<R[]> {
  const execArgv = o.workerPath.endsWith('.ts') ? ['--import', 'tsx'] : [];
  const results: R[] = new Array(o.tasks.length);
  let next = 0;
  const children = Array.from({ length: Math.min(o.jobs, o.tasks.length) }, () => fork(o.workerPath, [], { execArgv, stdio: ['ignore', 'inherit', 'inherit', 'ipc'] }));
  for (const c of children) o.live?.add(c);
  try {
    await Promise.all(
      children.map(
        (child, k) =>
          new Promise<void>((resolveChild, reject) => {
            let finished = false;
            const give = () => {
              const t = o.tasks[next++];
              if (t !== undefined) child.send(o.taskMessage(t) as object);
              else {
                finished = true;
                child.send({ type: 'exit' });
                resolveChild();
              }
            };
            child.on('message', (m: M | { type: 'error'; error: ChildError }) => {
              if (m.type === 'done') {
                const r = o.result(m as M & { type: 'done' });
                results[r.chunk] = r.value;
                give();
              } else if (m.type === 'error') {
                const { error } = m as { type: 'error'; error: ChildError };
                const pm = error.pm;
                reject(pm ? new PmError(pm.code as ErrorCode, o.keepErrorPath ? pm.path : o.failure.path, pm.detail, o.keepErrorPath ? pm.facts : {}, pm.exitCode) : new Error(error.message));
              } else o.onProgress?.(m as M);
            });
            child.on('error', (e) =>
              reject(new PmError(ERROR_CODES.environment, o.failure.path, `${o.label} ${k + 1} cannot be run (${(e as NodeJS.ErrnoException).code ?? e.message})`, {}, o.failure.exitCode)),
            );
            child.on('exit', (code, signal) => {
              o.live?.delete(child);
              if (!finished) reject(new PmError(ERROR_CODES.environment, o.failure.path, `${o.label} ${k + 1} stopped (${signal ?? `exit code ${code}`})`, {}, o.failure.exitCode));
            });
            give();
          }),
      ),
    );
  } catch (e) {
    // stop the others, and wait for them, before the caller cleans up what they write into
    for (const c of children) if (c.exitCode === null && c.signalCode === null) c.kill('SIGTERM');
    await Promise.all(children.map((c) => (c.exitCode !== null || c.signalCode !== null ? undefined : new Promise((r) => c.once('exit', r)))));
    throw e;
  } finally {
    for (const c of children) if (c.connected) c.disconnect();
  }
  return results;
}
