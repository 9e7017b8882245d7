import { defineConfig } from 'vitest/config';

// node-canvas segfaults in worker threads, so tests stay on the default `forks` pool.
export default defineConfig({
  test: {
    include: ['tests/**/*.test.ts'],
    pool: 'forks',
    setupFiles: ['tests/helpers/fast-check-setup.ts'],
    testTimeout: 60_000,
  },
});
