import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    name: 'calc-core',
    include: ['src/**/*.test.ts'],
    benchmark: { include: ['bench/**/*.bench.ts'] },
  },
});
