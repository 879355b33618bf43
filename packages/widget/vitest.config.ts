import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    name: 'widget',
    include: ['src/**/*.test.ts'],
  },
});
