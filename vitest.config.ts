import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { parseEnv } from 'node:util';
import { defineConfig } from 'vitest/config';

// The environment `npm run test:env` wrote (test MariaDB, fake SMTP): loaded when present, so a
// plain `npx vitest run <file>` reaches them. Variables already set win (`npm test` sets its own).
const testEnvFile = fileURLToPath(new URL('./var/test-env.env', import.meta.url));
if (existsSync(testEnvFile)) {
  for (const [key, value] of Object.entries(parseEnv(readFileSync(testEnvFile, 'utf8')))) {
    process.env[key] ??= value;
  }
}

// One run over every workspace, so `npm test` ends with one summary. Each project has its own
// vitest.config.ts beside its code.
export default defineConfig({
  test: {
    // Each API test file makes its own database, so files run in parallel, two at a time on two cores.
    maxWorkers: 2,
    projects: ['packages/*/vitest.config.ts', 'apps/*/vitest.config.ts', 'tests/vitest.config.ts'],
  },
});
