/** The check's effect flags live in src/flags/check-effects.ts; re-exported for the commands. */
export * from '../flags/check-effects.js';
