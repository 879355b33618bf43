import { defineConfig } from 'vitest/config';

// One run over every workspace, so `npm test` ends with one summary. Each project has its own
// vitest.config.ts beside its code.
export default defineConfig({
  test: {
    projects: ['packages/*/vitest.config.ts', 'apps/*/vitest.config.ts', 'tests/vitest.config.ts'],
  },
});
