/**
 * Stands in for `node:fs` in the browser bundle only (scripts/bundle.mjs aliases it). The page has no disk:
 * text the user pasted is offered under a made-up file name, so the CLI's own readers (which read files)
 * run unchanged on it and nothing is parsed twice. The page sends nothing; its address keeps the inputs (state.ts).
 * Goes away when the check takes loads as data (issue 9) and the CSV reader is browser-safe (issue 14).
 */
const files = new Map<string, string>();

/** Offers `text` as the contents of `name` to the next `readFileSync(name)`. */
export function putVirtualFile(name: string, text: string): void {
  files.set(name, text);
}

export function readFileSync(name: string): string {
  const text = files.get(String(name));
  if (text === undefined) throw Object.assign(new Error(`${String(name)}: no such file in the page`), { code: 'ENOENT' });
  return text;
}

const noDisk = (): never => {
  throw Object.assign(new Error('the page writes no files'), { code: 'EROFS' });
};
export const writeFileSync = noDisk;
export const renameSync = noDisk;
export const rmSync = noDisk;
export const existsSync = (name: string): boolean => files.has(String(name));
/** Size checks of the readers (input/limits.ts caps) see the pasted text's bytes. */
export function statSync(name: string): { size: number } {
  return { size: new TextEncoder().encode(readFileSync(name)).length };
}
/** The bounded reader (src/io/read.ts) opens, reads in chunks and closes: the same over the pasted text's bytes. */
const open = new Map<number, { bytes: Uint8Array; pos: number }>();
let nextFd = 3;
export function openSync(name: string): number {
  const fd = nextFd++;
  open.set(fd, { bytes: new TextEncoder().encode(readFileSync(name)), pos: 0 });
  return fd;
}
export function readSync(fd: number, buf: Uint8Array, offset: number, length: number): number {
  const f = open.get(fd);
  if (!f) throw Object.assign(new Error('bad file descriptor'), { code: 'EBADF' });
  const n = Math.min(length, f.bytes.length - f.pos);
  buf.set(f.bytes.subarray(f.pos, f.pos + n), offset);
  f.pos += n;
  return n;
}
export function closeSync(fd: number): void {
  open.delete(fd);
}
export default { readFileSync, writeFileSync, renameSync, rmSync, existsSync, statSync, openSync, readSync, closeSync };
