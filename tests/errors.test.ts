/** Error lines (issue 25): echoed values are capped and control characters shown as escapes. */
import { describe, expect, it } from 'vitest';
import { PmError } from '../src/errors.js';

describe('formatError', () => {
  it('does not echo 1 MB of NUL bytes, nor a raw control character', () => {
    const e = new PmError('invalid-value', 'set.json', 'is not valid JSON', { value: '\u0000'.repeat(1 << 20) });
    expect(e.message.length).toBeLessThan(1000);
    expect(e.message).not.toMatch(/[\u0000-\u001f]/);
    expect(e.message.startsWith('set.json: \\u0000\\u0000')).toBe(true);
    expect(new PmError('invalid-value', '--office', 'is odd', { value: 'A\u001b[2J' }).message).toBe('--office: A\\u001b[2J is odd');
  });
});
