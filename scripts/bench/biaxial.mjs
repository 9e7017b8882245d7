// Biaxial bench (issue 6): one exact biaxial check warm (target ≤ 5 ms), the three-method check, a contour.
import { performance } from 'node:perf_hooks';

export const name = 'biaxial';

export async function run() {
  const { ACI_318_19 } = await import('../../dist/codes/aci318.js');
  const { layoutBars } = await import('../../dist/section/arrangements.js');
  const { prepareBiaxial, capacityAlongRay, contourAtAxial } = await import('../../dist/analysis/biaxial.js');
  const { checkBiaxial } = await import('../../dist/design/biaxial.js');
  const basis = ACI_318_19.resolve({ units: 'us', fc: 4, fy: 60, transverse: 'tied' });
  const shape = { kind: 'rectangle', b: 20, h: 28 };
  const bars = layoutBars(shape, { kind: 'four-faces', barsPerFace: 5 }, 0.02 * 560, { gamma: 0.8 });
  const sec = prepareBiaxial(basis, shape, bars);
  // loads spread over directions and axial levels
  const loads = [];
  for (let i = 0; i < 64; i++) {
    const psi = (i / 64) * 2 * Math.PI;
    loads.push([100 + 8 * (i % 50), 3000 * Math.cos(psi), 2000 * Math.sin(psi)]);
  }
  const time = (fn, n) => {
    for (let i = 0; i < Math.min(n, 50); i++) fn(i); // warm
    const t = performance.now();
    for (let i = 0; i < n; i++) fn(i);
    return (performance.now() - t) / n;
  };
  const exact = time((i) => capacityAlongRay(sec, ...loads[i % 64]), 640);
  const three = time((i) => {
    const [Pu, Mux, Muy] = loads[i % 64];
    checkBiaxial(sec, { Pu, Mux, Muy });
  }, 320);
  const contour = time(() => contourAtAxial(sec, 400, 72), 20);
  // issue 15: a biaxial sheet's family (8 ρg × 7 levels, first quadrant at 5°) and the sheet reading of a load
  const { computeBiaxialFamily } = await import('../../dist/analysis/biaxial-family.js');
  const { BiaxialCharts } = await import('../../dist/design/biaxial-chart-reading.js');
  const family = time(
    () =>
      computeBiaxialFamily({
        basis,
        shape: { kind: 'rectangle', b: 20 / 28, h: 1 },
        arrangement: { kind: 'four-faces', barsPerFace: [3, 5] },
        gamma: 0.8,
        rhos: [0.01, 0.02, 0.03, 0.04, 0.05, 0.06, 0.07, 0.08],
        levels: [0, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6],
      }),
    3,
  );
  const charts = new BiaxialCharts({ basis, shape, arrangement: { kind: 'four-faces', barsPerFace: 5 }, gamma: 0.8, rhoLimits: basis.rhoLimits });
  for (const l of loads) charts.read(...l); // every level these loads touch, computed once
  const reading = time((i) => charts.read(...loads[i % 64]), 640);
  return [
    { figure: 'biaxial sheet family: 8 ρg × 7 levels × 19 directions', value: family, unit: 'ms', target: '≤ 1000 ms' },
    { figure: 'biaxial sheet reading of one load (levels cached)', value: reading, unit: 'ms', target: '≤ 0.1 ms' },
    { figure: 'exact biaxial check (angle + depth search), warm', value: exact, unit: 'ms', target: '≤ 5 ms' },
    { figure: 'three-method biaxial check (exact, Bresler, contour)', value: three, unit: 'ms', target: '' },
    { figure: 'Mx–My contour, 72 angles', value: contour, unit: 'ms', target: '' },
  ];
}
