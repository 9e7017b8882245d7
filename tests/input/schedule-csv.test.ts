/** Column schedule files (issue 22): required cells, read as text (the invented marks U1). */
import { describe, expect, it } from 'vitest';

const problem = (fn: () => unknown): string => {
  try {
    fn();
  } catch (e) {
    return (e as Error).message;
  }
  return 'accepted';
};

describe('schedule rows', () => {
  it('refuse an empty required cell rather than take a flag default', async () => {
    const { parseScheduleCsv } = await import('../../src/input/schedule-csv.js');
    const head = 'mark,code,units,fc,fy,b,h,arrangement,bars_per_face,bar,cover,tie';
    expect(problem(() => parseScheduleCsv(`${head}\nU1,aci318-19,us,5,60,20,20,,4,#9,1.5,#4\n`, 's.csv'))).toBe('s.csv line 2 arrangement: is empty');
    expect(problem(() => parseScheduleCsv(`${head}\nU1,,us,5,60,20,20,four-faces,4,#9,1.5,#4\n`, 's.csv'))).toBe('s.csv line 2 code: is empty');
  });
});
