/**
 * pmchart library API. Start reading at analysis/family.ts (`computeFamily`): basis → section →
 * one sweep in neutral-axis depth → a family of normalised ρg curves with key points.
 */
export * from './errors.js';
export * from './units/index.js';
export * from './materials/index.js';
export * from './codes/index.js';
export * from './section/index.js';
export * from './analysis/index.js';
export { GENERATOR } from './version.js';
