/**
 * The one bounded reader (issue 25): reads in chunks and stops at its limit whatever the file kind. Before,
 * the size limit looked only at the reported size, so /dev/zero (size 0) or a pipe grew to gigabytes.
 */
import { execFileSync, spawn } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readInputText } from '../../src/io/read.js';

const failure = (fn: () => unknown) => {
  try {
    fn();
  } catch (e) {
    return e as { message: string; exitCode: number };
  }
  return undefined;
};

describe('readInputText', () => {
  it('stops /dev/zero at the limit: exit 2 naming the input', () => {
    const err = failure(() => readInputText('/dev/zero', 1 << 16, '--loads'));
    expect(err?.exitCode).toBe(2);
    expect(err?.message).toBe('--loads: /dev/zero is larger than 65536 bytes');
  });
  it('stops an endless pipe at the limit', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'pmchart-read-'));
    const fifo = join(dir, 'yes.csv');
    execFileSync('mkfifo', [fifo]);
    const writer = spawn('sh', ['-c', `yes A,1,2 > '${fifo}'`], { stdio: 'ignore' });
    try {
      const err = failure(() => readInputText(fifo, 1 << 16, '--loads'));
      expect(err?.message).toBe(`--loads: ${fifo} is larger than 65536 bytes`);
    } finally {
      writer.kill();
    }
  });
  it('reads a small file, refuses a folder, a missing file and text that is not UTF-8', () => {
    const dir = mkdtempSync(join(tmpdir(), 'pmchart-read-'));
    writeFileSync(join(dir, 'a.csv'), 'id,Pu,Mu\n');
    expect(readInputText(join(dir, 'a.csv'), 100, '--loads')).toBe('id,Pu,Mu\n');
    expect(failure(() => readInputText(dir, 100, '--loads'))?.message).toBe(`--loads: ${dir} cannot be read (EISDIR)`);
    expect(failure(() => readInputText(join(dir, 'none.csv'), 100, '--loads'))?.exitCode).toBe(2);
    writeFileSync(join(dir, 'latin1.csv'), Buffer.from([0x69, 0x64, 0xe9, 0x0a]));
    expect(failure(() => readInputText(join(dir, 'latin1.csv'), 100, '--loads'))?.message).toBe(`--loads: ${join(dir, 'latin1.csv')} is not UTF-8 text`);
  });
});
