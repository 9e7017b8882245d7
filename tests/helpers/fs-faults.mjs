/**
 * Test-only file-system faults (CI runs as root, which ignores a read-only folder's permissions, so
 * failures are injected). Shipped code reads no switch for them: a test replaces `node:fs` with
 * `faultyFs(real)` through `vi.mock`, or a spawned CLI loads `fs-faults-preload.mjs` with `--import`.
 *
 * - `faults.write = '<part of a path>'`: a write to a file whose path holds it writes 16 bytes, then
 *   fails with ENOSPC (a full disk);
 * - `faults.swapRename = true`: renaming a set's staging folder (`<set>.partial-PID`) fails with EIO;
 * - `faults.swapPauseMs = N`: after a set folder is moved aside (`<set>.old-PID`), wait N ms, so a test
 *   can kill the run between the two renames of the swap.
 */
export const faults = { write: undefined, swapRename: false, swapPauseMs: 0 };

const failure = (code, op, path) => Object.assign(new Error(`${code}: injected fault, ${op} '${path}'`), { code });
const sleepSync = (ms) => Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, ms);

/** The functions of `fs` that carry faults; every other export is `fs`'s own. */
export function faultyFunctions(fs) {
  const real = { openSync: fs.openSync, closeSync: fs.closeSync, writeSync: fs.writeSync, renameSync: fs.renameSync };
  const paths = new Map();
  return {
    openSync(path, ...rest) {
      const fd = real.openSync(path, ...rest);
      paths.set(fd, String(path));
      return fd;
    },
    closeSync(fd) {
      paths.delete(fd);
      return real.closeSync(fd);
    },
    writeSync(fd, data, ...rest) {
      const path = paths.get(fd);
      if (faults.write !== undefined && path !== undefined && path.includes(faults.write)) {
        real.writeSync(fd, typeof data === 'string' ? data.slice(0, 16) : data.subarray(0, 16));
        throw failure('ENOSPC', 'write', path);
      }
      return real.writeSync(fd, data, ...rest);
    },
    renameSync(from, to) {
      if (faults.swapRename && /\.partial-\d+$/.test(String(from))) throw failure('EIO', 'rename', String(from));
      const r = real.renameSync(from, to);
      if (faults.swapPauseMs > 0 && /\.old-\d+$/.test(String(to))) sleepSync(faults.swapPauseMs);
      return r;
    },
  };
}

/** `node:fs` as a module namespace with the faulty functions, for `vi.mock('node:fs', …)`. */
export function faultyFs(fsModule) {
  const patched = faultyFunctions(fsModule);
  return { ...fsModule, ...patched, default: { ...fsModule.default, ...patched } };
}

/** Clears every fault (call in afterEach). */
export function clearFaults() {
  faults.write = undefined;
  faults.swapRename = false;
  faults.swapPauseMs = 0;
}
