/**
 * File writing for sets and reports: every file is written to a temporary name and renamed, so none
 * is ever half-written, and the temporary file is removed on every failure path. A set is made in
 * `<set>.partial-PID` and swapped in at the end; a run that was killed leaves `.partial-PID` and
 * perhaps `.old-PID`, which the next run removes or puts back (`recoverStale`).
 */
import { closeSync, existsSync, fsyncSync, lstatSync, mkdirSync, openSync, readdirSync, realpathSync, renameSync, rmSync, statSync, writeSync, type Stats } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { ERROR_CODES, PmError } from '../errors.js';

/** Errors the user can fix by choosing another place (exit 2); others are I/O faults (exit 3). */
const USER_CODES = new Set(['EACCES', 'EPERM', 'EROFS', 'ENOTDIR', 'EISDIR', 'EEXIST', 'ENOTEMPTY', 'ENAMETOOLONG', 'ENOENT']);

/** A file-system error as one line naming the path: exit 2 when the place is the problem, 3 otherwise. */
export function ioError(path: string, e: unknown, verb = 'cannot be written'): PmError {
  if (e instanceof PmError) return e;
  const code = (e as NodeJS.ErrnoException).code;
  const why = code ?? (e as Error).message.split('\n')[0];
  return new PmError(ERROR_CODES.io, path, `${verb} (${why})`, {}, code !== undefined && USER_CODES.has(code) ? 2 : 3);
}

/** What stands at a path, in words for an error. */
function kindOf(st: Stats): string {
  if (st.isDirectory()) return 'a folder';
  if (st.isFIFO()) return 'a FIFO';
  if (st.isCharacterDevice()) return 'a character device';
  if (st.isBlockDevice()) return 'a block device';
  if (st.isSocket()) return 'a socket';
  return 'not a regular file';
}

/**
 * The file a write to `path` replaces: `path` itself when absent or a regular file, or the regular file a
 * symbolic link at `path` names (written through, as a shell's `>` does; the link stays). Anything else at
 * the target (a folder, a FIFO, a device such as /dev/null, a socket, a link to nothing) is refused with
 * exit 2 before anything is touched. `at` names the flag in the error.
 */
export function checkFileTarget(path: string, at = path): string {
  let st: Stats;
  try {
    st = lstatSync(path);
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code === 'ENOENT') return path;
    throw ioError(at, e, 'cannot be read');
  }
  let real = path;
  if (st.isSymbolicLink()) {
    try {
      real = realpathSync(path);
      st = statSync(real);
    } catch (e) {
      const code = (e as NodeJS.ErrnoException).code;
      if (code === 'ENOENT') throw new PmError(ERROR_CODES.conflict, at, 'is a symbolic link to nothing; pmchart writes through a link only to an existing regular file', { value: path }, 2);
      throw ioError(at, e, 'cannot be read');
    }
  }
  if (!st.isFile()) {
    const kind = kindOf(st);
    throw new PmError(ERROR_CODES.conflict, at, `exists and is ${kind === 'not a regular file' ? kind : `${kind}, not a regular file`}; pmchart replaces only a regular file`, { value: path }, 2);
  }
  return real;
}

/**
 * The one atomic writer: checks the target (`checkFileTarget`), writes a temporary file beside the file it
 * replaces with `fill`, syncs it to disk, closes it and renames it over the target; on any failure the
 * temporary file is removed and the target is as it was.
 */
function writeAtomic(path: string, at: string | undefined, fill: (fd: number, tmp: string) => void): void {
  const real = checkFileTarget(path, at ?? path);
  const tmp = `${real}.${process.pid}.tmp`;
  let fd: number | undefined;
  try {
    mkdirSync(dirname(real), { recursive: true });
    fd = openSync(tmp, 'w');
    fill(fd, tmp);
    fsyncSync(fd);
    closeSync(fd);
    fd = undefined;
    renameSync(tmp, real);
  } catch (e) {
    if (fd !== undefined) {
      try {
        closeSync(fd);
      } catch {
        /* the write error is the one to report */
      }
    }
    rmSync(tmp, { force: true, recursive: false, maxRetries: 0 });
    throw ioError(at ?? path, e);
  }
}

/** Writes `data` to `path` atomically (see `writeAtomic`); `at` names the flag in errors (default: the path). */
export function writeFileAtomic(path: string, data: string | Uint8Array, at?: string): void {
  writeAtomic(path, at, (fd) => {
    const bytes = typeof data === 'string' ? Buffer.from(data, 'utf8') : data;
    for (let off = 0; off < bytes.length; ) off += writeSync(fd, bytes, off, bytes.length - off);
  });
}

/**
 * `writeFileAtomic` for a text made in pieces (a check report of 200k loads): the pieces go to the
 * temporary file in chunks as they come, so the whole text is never held; renamed when complete.
 */
export function writePiecesAtomic(path: string, pieces: Iterable<string>, at?: string): void {
  writeAtomic(path, at, (fd) => {
    for (const chunk of chunked(pieces)) writeSync(fd, chunk);
  });
}

/** Joins small pieces into chunks of about 64 kB, so that output takes few writes. */
export function* chunked(pieces: Iterable<string>, size = 1 << 16): Generator<string> {
  let parts: string[] = [];
  let n = 0;
  for (const p of pieces) {
    parts.push(p);
    n += p.length;
    if (n >= size) {
      yield parts.join('');
      parts = [];
      n = 0;
    }
  }
  if (n > 0) yield parts.join('');
}

/** Writes pieces to a stream in chunks, waiting for it to drain when it asks (a pipe to a slow reader). */
export async function writePieces(out: NodeJS.WritableStream, pieces: Iterable<string>): Promise<void> {
  for (const chunk of chunked(pieces)) if (!out.write(chunk)) await new Promise((r) => out.once('drain', r));
}

/**
 * Checks the place a set goes before any work: the parent must be a folder (or creatable) and the
 * target, when it exists, a folder. Nothing the user did not ask to replace is touched.
 */
export function checkTarget(target: string, outFlag = '--out'): void {
  const parent = dirname(target);
  let p: ReturnType<typeof statSync> | undefined;
  try {
    p = statSync(parent);
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    if (code === 'ENOTDIR') throw new PmError(ERROR_CODES.invalidValue, outFlag, 'lies under a file, not a folder', { value: parent }, 2);
    if (code !== 'ENOENT') throw ioError(parent, e, 'cannot be read');
  }
  if (p && !p.isDirectory()) throw new PmError(ERROR_CODES.invalidValue, outFlag, 'is a file, not a folder', { value: parent }, 2);
  let t: ReturnType<typeof lstatSync> | undefined;
  try {
    t = lstatSync(target);
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code !== 'ENOENT') throw ioError(target, e, 'cannot be read');
  }
  if (t && !t.isDirectory()) {
    throw new PmError(ERROR_CODES.conflict, target, 'exists and is not a folder; pmchart replaces only a set folder (move the file or choose another --out)', {}, 2);
  }
}

const alive = (pid: number): boolean => {
  if (pid === process.pid) return true;
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM';
  }
};

/**
 * Cleans up after runs that were killed: `<set>.partial-PID` of a process that is gone is removed;
 * `<set>.old-PID` is put back when `<set>` is missing (the run stopped between the two renames of
 * its swap), removed otherwise. Runs still alive are left alone. Returns one note per action.
 */
export function recoverStale(target: string): string[] {
  const parent = dirname(target);
  const name = basename(target);
  let entries: string[];
  try {
    entries = readdirSync(parent);
  } catch {
    return [];
  }
  const notes: string[] = [];
  const stale = entries
    .map((e) => ({ e, m: new RegExp(`^${name.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}\\.(partial|old)-(\\d+)$`).exec(e) }))
    .filter((x): x is { e: string; m: RegExpExecArray } => x.m !== null && !alive(Number(x.m[2])));
  // an .old folder first: it is the user's previous set
  for (const { e, m } of stale.sort((a, b) => (a.m[1] === 'old' ? -1 : 0) - (b.m[1] === 'old' ? -1 : 0))) {
    const path = join(parent, e);
    try {
      if (m[1] === 'old' && !existsSync(target)) {
        renameSync(path, target);
        notes.push(`restored ${target} from ${e}, left by a run that stopped during its final swap`);
      } else {
        rmSync(path, { recursive: true, force: true });
        notes.push(`removed ${path}, left by a run that stopped (process ${m[2]})`);
      }
    } catch (err) {
      throw ioError(path, err, 'cannot be cleaned up');
    }
  }
  return notes;
}

/** Replaces `target` with the finished `staging` folder; the old folder is removed only after the swap. */
export function swapInFolder(staging: string, target: string): void {
  let old: string | undefined;
  try {
    mkdirSync(dirname(target), { recursive: true });
    if (existsSync(target)) {
      old = `${target}.old-${process.pid}`;
      renameSync(target, old);
    }
    renameSync(staging, target);
  } catch (e) {
    // put the previous set back: a failed swap leaves the user's folder as it was
    if (old !== undefined && !existsSync(target)) {
      try {
        renameSync(old, target);
      } catch {
        /* the next run restores it (recoverStale) */
      }
    }
    throw ioError(target, e);
  }
  if (old) rmSync(old, { recursive: true, force: true });
}
