/** Issue dates from flags and SOURCE_DATE_EPOCH are real calendar dates (issue 14). */
import { afterEach, describe, expect, it } from 'vitest';
import { reportDate } from '../../src/cli/format.js';
import { issueDate } from '../../src/input/limits.js';
import { runCli } from '../helpers/run-cli.js';

afterEach(() => {
  delete process.env.SOURCE_DATE_EPOCH;
});

describe('issue dates', () => {
  it('refuses impossible dates from a flag', () => {
    expect(() => issueDate('2026-13-01', '--date', undefined)).toThrow('--date: 2026-13-01 is not a calendar date');
    expect(() => issueDate('2026-02-30', '--date', undefined)).toThrow('--date: 2026-02-30 is not a calendar date');
    expect(() => issueDate('1 May', '--date', undefined)).toThrow('--date: 1 May is not a date in the form YYYY-MM-DD');
    // 2024 is a leap year (Gregorian rule: divisible by 4, not by 100 unless by 400); 1900 is not
    expect(issueDate('2024-02-29', '--date', undefined)).toBe('2024-02-29');
    expect(() => issueDate('1900-02-29', '--date', undefined)).toThrow(/not a calendar date/);
  });
  it('reads SOURCE_DATE_EPOCH as seconds since 1970-01-01 UTC, and names it when it is not', () => {
    // 1767225600 s = 2026-01-01T00:00:00Z (reproducible-builds.org SOURCE_DATE_EPOCH specification)
    expect(issueDate(undefined, '--date', '1767225600')).toBe('2026-01-01');
    process.env.SOURCE_DATE_EPOCH = 'abc';
    expect(() => reportDate(undefined)).toThrow('SOURCE_DATE_EPOCH: "abc" is not a count of seconds since 1970-01-01 (UTC) up to year 9999');
    expect(reportDate('2026-03-02')).toBe('2026-03-02');
  });
  it('sheet: SOURCE_DATE_EPOCH=abc is exit 2 naming the variable, not an internal error', async () => {
    process.env.SOURCE_DATE_EPOCH = 'abc';
    const r = await runCli(['sheet', '--fc', '4', '--fy', '60', '--gamma', '0.8', '--out', '/tmp/pmchart-never-written.svg']);
    expect(r.stderr).toBe('pmchart: SOURCE_DATE_EPOCH: "abc" is not a count of seconds since 1970-01-01 (UTC) up to year 9999\n');
    expect(r.code).toBe(2);
  });
});
