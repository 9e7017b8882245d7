/** The atomic writer syncs the temporary file to disk before the rename (issue 25), seen through a test-only mock of node:fs. */
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it, vi } from 'vitest';

const calls: string[] = [];
vi.mock('node:fs', async (importOriginal) => {
  const fs = await importOriginal<typeof import('node:fs')>();
  const spy =
    <A extends unknown[], R>(name: string, fn: (...a: A) => R) =>
    (...a: A): R => {
      calls.push(name);
      return fn(...a);
    };
  const mocked = { ...fs, fsyncSync: spy('fsync', fs.fsyncSync), renameSync: spy('rename', fs.renameSync), closeSync: spy('close', fs.closeSync) };
  return { ...mocked, default: mocked };
});

const { writeFileAtomic, writePiecesAtomic } = await import('../../src/io/files.js');

describe('atomic writes sync before the rename', () => {
  it('writeFileAtomic: fsync, close, rename', () => {
    const dir = mkdtempSync(join(tmpdir(), 'pmchart-fsync-'));
    calls.length = 0;
    writeFileAtomic(join(dir, 'a.txt'), 'bytes');
    expect(calls.slice(0, 3)).toEqual(['fsync', 'close', 'rename']);
    expect(readFileSync(join(dir, 'a.txt'), 'utf8')).toBe('bytes');
  });
  it('writePiecesAtomic: fsync, close, rename', () => {
    const dir = mkdtempSync(join(tmpdir(), 'pmchart-fsync-'));
    calls.length = 0;
    writePiecesAtomic(join(dir, 'b.txt'), ['a', 'b']);
    expect(calls.slice(0, 3)).toEqual(['fsync', 'close', 'rename']);
  });
});
