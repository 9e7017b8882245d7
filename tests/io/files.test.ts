/**
 * The one atomic writer (issue 25): only a regular file or nothing is replaced; a symbolic link is written
 * through (the file it names is replaced, the link stays), as a shell's `>` does. Before, a FIFO (or a
 * character device such as /dev/null when run as root) at the target was replaced by a regular file.
 * The tests use a FIFO in a temporary folder: never /dev/null, which the old code would have replaced.
 */
import { execFileSync } from 'node:child_process';
import { lstatSync, mkdtempSync, readdirSync, readFileSync, readlinkSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { checkFileTarget, writeFileAtomic, writePiecesAtomic } from '../../src/io/files.js';

const fresh = () => mkdtempSync(join(tmpdir(), 'pmchart-io-'));
const fifo = (dir: string) => {
  const p = join(dir, 'pipe.svg');
  execFileSync('mkfifo', [p]);
  return p;
};
const failure = (fn: () => void) => {
  try {
    fn();
  } catch (e) {
    return e as { message: string; exitCode: number };
  }
  return undefined;
};

describe('writeFileAtomic and writePiecesAtomic', () => {
  it('refuse a FIFO at the target (exit 2) and leave it a FIFO, with no temporary file', () => {
    const dir = fresh();
    const p = fifo(dir);
    const err = failure(() => writeFileAtomic(p, 'bytes', '--out'));
    expect(err?.exitCode).toBe(2);
    expect(err?.message).toBe(`--out: ${p} exists and is a FIFO, not a regular file; pmchart replaces only a regular file`);
    expect(lstatSync(p).isFIFO()).toBe(true);
    expect(failure(() => writePiecesAtomic(p, ['a', 'b']))?.exitCode).toBe(2);
    expect(lstatSync(p).isFIFO()).toBe(true);
    expect(readdirSync(dir)).toEqual(['pipe.svg']);
    expect(failure(() => checkFileTarget(p, '--report'))?.message).toMatch(/^--report: .* exists and is a FIFO/);
  });
  it('refuse a folder at the target', () => {
    const dir = fresh();
    expect(failure(() => writeFileAtomic(dir, 'x', '--out'))?.message).toBe(`--out: ${dir} exists and is a folder, not a regular file; pmchart replaces only a regular file`);
  });
  it('write through a symbolic link: the file it names is replaced and the link stays', () => {
    const dir = fresh();
    writeFileSync(join(dir, 'real.txt'), 'old');
    symlinkSync('real.txt', join(dir, 'link.txt'));
    writeFileAtomic(join(dir, 'link.txt'), 'new');
    expect(readlinkSync(join(dir, 'link.txt'))).toBe('real.txt');
    expect(readFileSync(join(dir, 'real.txt'), 'utf8')).toBe('new');
    expect(readdirSync(dir).sort()).toEqual(['link.txt', 'real.txt']);
  });
  it('refuse a link to a FIFO and a link to nothing (exit 2)', () => {
    const dir = fresh();
    const p = fifo(dir);
    symlinkSync(p, join(dir, 'to-pipe.svg'));
    expect(failure(() => writeFileAtomic(join(dir, 'to-pipe.svg'), 'x'))?.exitCode).toBe(2);
    expect(lstatSync(p).isFIFO()).toBe(true);
    symlinkSync(join(dir, 'nowhere', 'x.svg'), join(dir, 'dangling.svg'));
    const err = failure(() => writeFileAtomic(join(dir, 'dangling.svg'), 'x', '--out'));
    expect(err?.exitCode).toBe(2);
    expect(err?.message).toMatch(/^--out: .*dangling\.svg is a symbolic link to nothing/);
  });
  it('replace a regular file and create an absent one', () => {
    const dir = fresh();
    writeFileAtomic(join(dir, 'a.txt'), 'one');
    writeFileAtomic(join(dir, 'a.txt'), 'two');
    writePiecesAtomic(join(dir, 'b.txt'), ['x', 'y']);
    expect(readFileSync(join(dir, 'a.txt'), 'utf8')).toBe('two');
    expect(readFileSync(join(dir, 'b.txt'), 'utf8')).toBe('xy');
  });
});
