import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    name: 'server',
    include: ['src/**/*.test.ts'],
    // API tests share one MariaDB; each file makes its own database, so files may run in parallel,
    // but the machine has two cores and bcrypt is CPU-bound.
    maxWorkers: 2,
    testTimeout: 30_000,
    hookTimeout: 60_000,
  },
});
