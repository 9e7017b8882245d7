export * from './style.js';
export * from './layout.js';
export * from './lookup-table.js';
export * from './sheet-data.js';
export * from './spec.js';
export * from './axes.js';
export * from './labels.js';
