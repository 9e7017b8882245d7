/**
 * Child process for rendering chunks (node-canvas crashes in worker threads, so sets parallelise
 * across processes). Messages: parent → {type:'task', task}; child → {type:'sheet'} per sheet,
 * {type:'done', chunk, pages} per chunk (the PDF page contents; the parent writes the fonts once),
 * {type:'error', error}.
 */
import { isPmError } from '../errors.js';
import type { ChildError } from '../io/child-pool.js';
import type { PageContent } from '../render/pdf-canvas.js';
import { SheetRenderer } from '../render/renderer.js';
import { renderChunk, type ChunkTask } from './render-chunk.js';

export type WorkerMessage =
  | { type: 'sheet' }
  | { type: 'done'; chunk: number; pages: PageContent[] | undefined; maxRssKb: number }
  | { type: 'error'; error: ChildError };

const send = (m: WorkerMessage) => {
  if (process.connected) process.send?.(m);
};
let renderer: Promise<SheetRenderer> | undefined;
let exiting = false;

// The parent is gone (killed, even by SIGKILL) or said goodbye: stop at once, writing nothing more.
process.on('disconnect', () => {
  if (!exiting) process.exit(1);
});

process.on('message', (msg: { type: 'task'; task: ChunkTask } | { type: 'exit' }) => {
  if (msg.type === 'exit') {
    exiting = true;
    process.disconnect?.();
    return;
  }
  void (async () => {
    try {
      renderer ??= SheetRenderer.create();
      const pages = await renderChunk(msg.task, await renderer, () => send({ type: 'sheet' }));
      send({ type: 'done', chunk: msg.task.chunk, pages, maxRssKb: process.resourceUsage().maxRSS });
    } catch (e) {
      const err = e as Error;
      send({
        type: 'error',
        error: {
          message: err.message,
          ...(isPmError(e) ? { pm: { code: e.code, path: e.path, facts: e.facts, exitCode: e.exitCode, detail: e.message } } : {}),
        },
      });
    }
  })();
});
