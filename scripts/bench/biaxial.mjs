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
  return [
    { figure: 'exact biaxial check (angle + depth search), warm', value: exact, unit: 'ms', target: '≤ 5 ms' },
    { figure: 'three-method biaxial check (exact, Bresler, contour)', value: three, unit: 'ms', target: '' },
    { figure: 'Mx–My contour, 72 angles', value: contour, unit: 'ms', target: '' },
  ];
}
