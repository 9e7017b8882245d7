/** Title fitting (issue 25): cutting a long text to a width takes a logarithmic number of measurements, not one per character. */
import { describe, expect, it } from 'vitest';
import { estWidth, truncate } from '../../src/chart/sheet-data.js';

describe('truncate', () => {
  it('cuts 20,000 characters with a few dozen measurements (was one per character: 42 s through the canvas)', () => {
    let calls = 0;
    const measure = (s: string, fs: number) => {
      calls++;
      return estWidth(s, fs);
    };
    const long = 'Column C-14 level 3 '.repeat(1000);
    const cut = truncate(long, 200, 10, measure);
    expect(calls).toBeLessThan(40);
    // the longest cut that fits: one more character would not (common practice of an ellipsis cut)
    expect(measure(cut, 10)).toBeLessThanOrEqual(200);
    // the same cut as a plain search from the end down (the old way, one measurement per character)
    let n = long.length;
    while (n > 1 && estWidth(`${long.slice(0, n).trimEnd()}…`, 10) > 200) n--;
    expect(cut).toBe(`${long.slice(0, n).trimEnd()}…`);
    expect(cut.endsWith('…')).toBe(true);
  });
  it('keeps text that fits, and cuts to one character and an ellipsis at the least', () => {
    expect(truncate('short', 1000, 10)).toBe('short');
    expect(truncate('abcdef', 0.1, 10)).toBe('a…');
  });
});
