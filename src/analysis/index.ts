export * from './section-forces.js';
export * from './prepared-section.js';
export * from './family.js';
export * from './solve.js';
export { gaussLegendre } from './gauss.js';
export * from './biaxial-family.js';
