import { defineConfig } from 'vitest/config';

// One run over every workspace, so `npm test` ends with one summary. Each project has its own
// vitest.config.ts beside its code.
export default defineConfig({
  test: {
    // Each API test file makes its own database, so files run in parallel, two at a time on two cores.
    maxWorkers: 2,
    projects: ['packages/*/vitest.config.ts', 'apps/*/vitest.config.ts', 'tests/vitest.config.ts'],
  },
});
