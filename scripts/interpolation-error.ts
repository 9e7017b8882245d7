/**
 * Measures how far the emulated chart reading (rhoFromChart) falls from the exact ρg required, over
 * random loads inside the charted range. Run: npx tsx scripts/interpolation-error.ts [samples]
 * The README quotes the figure this prints; tests/design/properties.test.ts holds the bound.
 */
import { resolveBasis } from '../src/codes/registry.js';
import { checkOneLoad as checkLoad, prepareColumnCheck as prepareCheck } from '../src/design/column-check.js';
import type { Arrangement } from '../src/section/types.js';

const samples = Number(process.argv[2] ?? 4000);
let seed = 12345;
const rand = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648);
const shape = { kind: 'rectangle', b: 20, h: 20 } as const;
const cases: { label: string; arrangement: Arrangement; transverse: 'tied' | 'spiral'; fc: number; fy: number }[] = [
  { label: 'two-faces tied 4/60', arrangement: { kind: 'two-faces', barsPerFace: 3 }, transverse: 'tied', fc: 4, fy: 60 },
  { label: 'four-faces tied 5/60', arrangement: { kind: 'four-faces', barsPerFace: 3 }, transverse: 'tied', fc: 5, fy: 60 },
  { label: 'side-faces tied 4/60', arrangement: { kind: 'side-faces', barsPerFace: 3 }, transverse: 'tied', fc: 4, fy: 60 },
];
let worstAll = 0;
for (const c of cases) {
  const basis = resolveBasis('aci318-19', { units: 'us', fc: c.fc, fy: c.fy, transverse: c.transverse });
  let worst = 0;
  let sum = 0;
  let n = 0;
  for (let k = 0; k < samples / 40; k++) {
    const gamma = 0.6 + rand() * 0.3;
    const ctx = prepareCheck({ basis, shape, arrangement: c.arrangement, gamma, loads: [] });
    for (let j = 0; j < 40; j++) {
      const P = -0.5 + rand() * 4.5;
      const M = rand() * 1.6;
      const r = checkLoad(ctx, { id: 'x', Pu: P * 400, Mu: M * 8000 }, 0);
      if (r.rhoStatus !== 'ok' || r.rhoFromChart === null || r.governedBy !== 'curve') continue;
      if (r.chartSheets.some((s) => s.position !== 'between')) continue;
      const d = Math.abs(r.rhoFromChart - r.rhoRequired!);
      worst = Math.max(worst, d);
      sum += d;
      n++;
    }
  }
  worstAll = Math.max(worstAll, worst);
  console.log(`${c.label}: ${n} loads inside the charted range, mean |Δρg| = ${(sum / n).toExponential(2)}, max |Δρg| = ${worst.toExponential(2)}`);
}
console.log(`worst |rhoFromChart − rhoRequired| = ${worstAll.toExponential(3)}`);
