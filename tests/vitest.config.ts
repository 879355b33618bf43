import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

// The server's test helpers are not part of its build or exports (apps/server/testing/): these tests
// take them, and the app they set up, from the server's TypeScript source, so the models the
// helpers initialise are the very ones the app uses (one copy of each module).
const server = fileURLToPath(new URL('../apps/server/', import.meta.url));

export default defineConfig({
  resolve: {
    alias: [
      { find: /^@wickstone\/server\/testing$/, replacement: `${server}testing/index.ts` },
      { find: /^@wickstone\/server\/(app|config|logger)$/, replacement: `${server}src/$1.ts` },
      { find: /^@wickstone\/server\/db$/, replacement: `${server}src/db/index.ts` },
    ],
  },
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
