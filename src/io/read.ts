/**
 * The one bounded reader for every input file (chart sets, load files, custom bars): reads in chunks and
 * stops as soon as the text passes its limit, whatever the file is (a regular file, /dev/zero, a pipe such
 * as `<(yes …)`), so a size limit can never be skipped by a file that reports no size. Text must be UTF-8.
 * Errors name the input (`at`: a flag or a file) and exit 2.
 */
import { closeSync, openSync, readSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { ERROR_CODES, PmError } from '../errors.js';

const CHUNK = 1 << 16;
const sleepSync = (ms: number) => Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, ms);

/** The UTF-8 text of `file`, at most `limit` bytes; `at` names the input in errors. */
export function readInputText(file: string, limit: number, at: string): string {
  const bytes = readInputBytes(file, limit, at);
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    throw new PmError(ERROR_CODES.invalidValue, at, 'is not UTF-8 text', { value: file });
  }
}

/**
 * Files a chart set names (its officeFile, a logo), each relative to the directory of the file that names it,
 * read through the same bounded reader (config/read.ts FileAccess).
 */
export const nodeFileAccess = {
  read(path: string, relativeTo: string, limit: number, at: string): { bytes: Uint8Array; dir: string } {
    const full = resolve(relativeTo, path);
    return { bytes: readInputBytes(full, limit, at), dir: dirname(full) };
  },
};

/** The bytes of `file`, at most `limit`; `at` names the input in errors (a missing file is exit 2, as a bad path is the user's). */
export function readInputBytes(file: string, limit: number, at: string): Uint8Array {
  const failed = (e: unknown): PmError =>
    e instanceof PmError ? e : new PmError(ERROR_CODES.io, at, `cannot be read (${(e as NodeJS.ErrnoException).code ?? (e as Error).message.split('\n')[0]})`, { value: file });
  let fd: number;
  try {
    fd = openSync(file, 'r');
  } catch (e) {
    throw failed(e);
  }
  try {
    const chunks: Uint8Array[] = [];
    let total = 0;
    for (;;) {
      const buf = new Uint8Array(Math.min(CHUNK, limit + 1 - total));
      let n: number;
      try {
        n = readSync(fd, buf, 0, buf.length, null);
      } catch (e) {
        // a non-blocking pipe with nothing yet: wait a little and read again
        if ((e as NodeJS.ErrnoException).code === 'EAGAIN') {
          sleepSync(5);
          continue;
        }
        throw e;
      }
      if (n === 0) break;
      chunks.push(buf.subarray(0, n));
      total += n;
      if (total > limit) throw new PmError(ERROR_CODES.invalidValue, at, `is larger than ${limit} bytes`, { value: file });
    }
    const bytes = new Uint8Array(total);
    let off = 0;
    for (const c of chunks) {
      bytes.set(c, off);
      off += c.length;
    }
    return bytes;
  } catch (e) {
    throw failed(e);
  } finally {
    closeSync(fd);
  }
}
