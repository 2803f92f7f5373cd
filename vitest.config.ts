import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts'],
    setupFiles: ['test/support/boolean-engine.ts'],
    testTimeout: 60_000,
    pool: 'forks',
  },
});
