/** File writing (issue 14): temporary files removed on every failure path; errors classed as place (2) or I/O (3). */
import { mkdirSync, mkdtempSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ioError, writeFileAtomic } from '../../src/sheet/files.js';

describe('writeFileAtomic', () => {
  it('a report written onto a folder name: exit 2 naming the path, no *.PID.tmp left behind', () => {
    const dir = mkdtempSync(join(tmpdir(), 'pmchart-files-'));
    const target = join(dir, 'report.pdf');
    mkdirSync(target);
    let err: { message: string; exitCode: number } | undefined;
    try {
      writeFileAtomic(target, 'bytes');
    } catch (e) {
      err = e as typeof err;
    }
    expect(err?.message).toMatch(/report\.pdf: .*report\.pdf exists and is a folder, not a regular file; pmchart replaces only a regular file$/); // issue 25: refused before any write
    expect(err?.exitCode).toBe(2);
    expect(readdirSync(dir)).toEqual(['report.pdf']);
  });
});

describe('ioError', () => {
  it('names the place for errors the user can fix (exit 2) and the fault for I/O errors (exit 3)', () => {
    for (const code of ['EACCES', 'EPERM', 'EROFS', 'ENOTDIR', 'EISDIR']) expect(ioError('out/x', Object.assign(new Error(code), { code })).exitCode).toBe(2);
    for (const code of ['ENOSPC', 'EIO', 'EDQUOT']) {
      const e = ioError('out/x', Object.assign(new Error(code), { code }));
      expect(e.exitCode).toBe(3);
      expect(e.message).toBe(`out/x: cannot be written (${code})`);
    }
  });
});
