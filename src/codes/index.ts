export * from './types.js';
export * from './aci318.js';
export * from './registry.js';
export * from './en1992.js';
export * from './csa-a23.js';
export * from './mechanical-ratio.js';
export * from './as3600.js';
