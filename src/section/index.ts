export * from './types.js';
export * from './geometry.js';
export * from './arrangements.js';
export * from './bar-tables.js';
