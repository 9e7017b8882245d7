// Input figures: the quantity parser on a 1 MB string (refused by the length cap before any scan) and
// the one-pass scan on a worst case at the cap; the load-file reader on 200,000 rows.
import { parseQuantity, splitQuantity } from '../../dist/units/index.js';
import { parseLoadsCsv } from '../../dist/input/loads-csv.js';

export const name = 'input';

const ms = (fn) => {
  const t0 = process.hrtime.bigint();
  fn();
  return Number(process.hrtime.bigint() - t0) / 1e6;
};

export async function run() {
  const mb = '1'.repeat(1 << 20) + 'x';
  const refused = ms(() => {
    try {
      parseQuantity(mb, 'stress', 'us', '--fc');
    } catch {
      /* refused: longer than the cap */
    }
  });
  const scan = ms(() => splitQuantity(mb));
  const rows = ['id,Pu,Mu'];
  for (let i = 0; i < 200_000; i++) rows.push(`L${i},${100 + (i % 500)},${50 + (i % 300)}`);
  const text = rows.join('\n');
  const csv = ms(() => parseLoadsCsv(text, 'us'));
  return [
    { figure: 'parseQuantity, 1 MB text (refused by the 64-char cap)', value: refused, unit: 'ms', target: '< 5' },
    { figure: 'one-pass number/unit scan over 1 MB (no cap)', value: scan, unit: 'ms', target: 'linear' },
    { figure: 'parseLoadsCsv, 200,000 rows', value: csv, unit: 'ms', target: '' },
  ];
}
