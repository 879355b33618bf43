// npm run test:env | test:env:stop: the test MariaDB and fake SMTP server left running for the
// inner loop (`npx vitest run <file>` reads var/test-env.env through the root vitest.config.ts).
import { ensureMariaDBInstalled } from './lib/mariadb.mjs';
import { build, ensureNodeModules } from './lib/setup.mjs';
import { startTestEnv, stopTestEnv } from './lib/test-env.mjs';

const cmd = process.argv[2];
if (cmd === 'start') {
  ensureNodeModules();
  ensureMariaDBInstalled();
  // Tests import the other workspaces' builds (and e2e tests the built dashboard and widget);
  // turbo's cache makes this quick when nothing changed.
  build();
  await startTestEnv();
} else if (cmd === 'stop') {
  await stopTestEnv();
} else {
  console.error('usage: node scripts/test-env.mjs start|stop');
  process.exit(2);
}
