export * from './ray.js';
export * from './rho-required.js';
export * from './chart-reading.js';
export * from './bar-selection.js';
export * from './check.js';
