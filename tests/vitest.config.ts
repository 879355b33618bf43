import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    name: 'tests',
    include: ['**/*.test.ts'],
    exclude: ['node_modules/**'],
    // Browser and fault tests each start servers and Chromium: one file at a time on two cores.
    fileParallelism: false,
    testTimeout: 60_000,
    hookTimeout: 120_000,
  },
});
