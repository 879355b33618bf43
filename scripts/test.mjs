// `npm test`: the same set-up as `npm start` (plus Debian's Chromium), then formatting, changesets,
// lint, typecheck and every test against a private test MariaDB and the fake SMTP server; stops all
// it started and exits with the test runner's code.
// `npm test -- <vitest args>` (a file, `-t <name>`) passes the arguments to Vitest with the same
// set-up and skips the static checks, which only a full run makes.
import { ensureMariaDBInstalled, stopMariaDB } from './lib/mariadb.mjs';
import { log, runStatus, startChild, stopPid, waitForHttp } from './lib/proc.mjs';
import { build, ensureChromium, ensureNodeModules, ensurePdfTools } from './lib/setup.mjs';
import { staticChecks } from './lib/checks.mjs';
import { startTestDatabase, stopTestEnv, testDbInstance, testEnv, testPorts } from './lib/test-env.mjs';
import { startFakePayments } from './lib/payments.mjs';

const vitestArgs = process.argv.slice(2);
const ports = testPorts();
const db = testDbInstance(ports);
const children = [];

async function cleanup() {
  for (const child of children.reverse()) await stopPid(child.pid, 5_000);
  await stopMariaDB(db, { quiet: true });
}
process.on('SIGINT', () => void cleanup().then(() => process.exit(130)));
process.on('SIGTERM', () => void cleanup().then(() => process.exit(143)));

let code = 1;
try {
  ensureNodeModules();
  ensureChromium();
  ensurePdfTools();
  ensureMariaDBInstalled();
  if (vitestArgs.length === 0) staticChecks();
  build();

  // A running `npm run test:env` shares the data folder and ports: stop it, then start afresh.
  await stopTestEnv();
  await startTestDatabase(db, { fresh: true });
  const env = { ...process.env, ...testEnv(ports) };
  children.push(
    startChild('mail', 'node', ['scripts/fake-smtp.mjs'], {
      env: { ...env, FAKE_MAIL_HTTP_PORT: String(ports.mailHttp) },
    }),
  );
  await waitForHttp(`${env.FAKE_MAIL_API_URL}/messages`);
  const payments = await startFakePayments({ port: ports.payments });
  children.push(payments.child);
  Object.assign(env, payments.env);

  log(`running ${vitestArgs.length ? `vitest run ${vitestArgs.join(' ')}` : 'every test (vitest run)'}`);
  code = runStatus('npx', ['vitest', 'run', ...vitestArgs], { env });
} catch (err) {
  console.error(`[wickstone] test set-up failed: ${err instanceof Error ? err.message : err}`);
  code = typeof err?.exitCode === 'number' && err.exitCode !== 0 ? err.exitCode : 1;
} finally {
  await cleanup();
}
process.exit(code);
