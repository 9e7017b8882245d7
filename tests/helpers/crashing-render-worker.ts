/**
 * A test-only render worker: the real one (src/sheet/worker.ts), except that it kills itself with
 * SIGKILL when it is handed chunk 2. tests/sheet/faults.test.ts puts its path into the child pool
 * through a module mock, so shipped code holds no way to crash on request. The real worker is imported
 * first (statically), so that its listener is there for the first task; this one runs after it, before
 * the chunk's render can finish.
 */
import '../../src/sheet/worker.js';

process.on('message', (msg: { type: string; task?: { chunk: number } }) => {
  if (msg.type === 'task' && msg.task?.chunk === 2) process.kill(process.pid, 'SIGKILL');
});
