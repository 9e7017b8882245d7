export * from './types.js';
export * from './aci318.js';
export * from './registry.js';
