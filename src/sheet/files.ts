/** File writing for sets: every file is written to a temporary name and renamed, so none is ever half-written. */
import { existsSync, mkdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { ERROR_CODES, PmError } from '../errors.js';

export function writeFileAtomic(path: string, data: string | Uint8Array): void {
  try {
    mkdirSync(dirname(path), { recursive: true });
    const tmp = `${path}.${process.pid}.tmp`;
    writeFileSync(tmp, data);
    renameSync(tmp, path);
  } catch (e) {
    throw new PmError(ERROR_CODES.io, path, `cannot be written (${(e as Error).message.split('\n')[0]})`, {}, 3);
  }
}

/** Replaces `target` with the finished `staging` folder; the old folder is removed only after the swap. */
export function swapInFolder(staging: string, target: string): void {
  try {
    mkdirSync(dirname(target), { recursive: true });
    let old: string | undefined;
    if (existsSync(target)) {
      old = `${target}.old-${process.pid}`;
      renameSync(target, old);
    }
    renameSync(staging, target);
    if (old) rmSync(old, { recursive: true, force: true });
  } catch (e) {
    throw new PmError(ERROR_CODES.io, target, `cannot be written (${(e as Error).message.split('\n')[0]})`, {}, 3);
  }
}
