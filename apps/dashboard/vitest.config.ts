import { defineConfig } from 'vitest/config';

// Pure modules run in Node; component tests (`*.test.tsx`) ask for happy-dom in their first line.
export default defineConfig({
  test: { name: 'dashboard', include: ['src/**/*.test.ts', 'src/**/*.test.tsx'] },
});
