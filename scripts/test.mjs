// `npm test`: the same set-up as `npm start` (plus Debian's Chromium), then lint, typecheck and
// every test against a private test MariaDB and the fake SMTP server; stops all it started and
// exits with the test runner's code.
import path from 'node:path';
import { rmSync } from 'node:fs';
import {
  ensureDatabase,
  ensureMariaDBInstalled,
  instance,
  sql,
  startMariaDB,
  stopMariaDB,
} from './lib/mariadb.mjs';
import { log, root, run, runStatus, startChild, stopPid, waitForHttp } from './lib/proc.mjs';
import { build, ensureChromium, ensureNodeModules } from './lib/setup.mjs';
import { startFakePayments } from './lib/payments.mjs';

const dbPort = Number(process.env.TEST_DB_PORT ?? 3308);
const smtpPort = Number(process.env.TEST_SMTP_PORT ?? 2526);
const mailHttpPort = Number(process.env.TEST_FAKE_MAIL_HTTP_PORT ?? 8026);
const db = instance(path.join(root, 'var', 'mariadb-test'), dbPort);
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
  ensureMariaDBInstalled();
  log('lint and typecheck (turbo run lint typecheck)');
  run('npx', ['turbo', 'run', 'lint', 'typecheck', '--output-logs=errors-only']);
  build();

  // A fresh test database server every run: nothing left from an earlier run can change a result.
  await stopMariaDB(db, { quiet: true });
  rmSync(db.dir, { recursive: true, force: true });
  await startMariaDB(db);
  const dbEnv = {
    DB_HOST: '127.0.0.1',
    DB_PORT: String(dbPort),
    DB_NAME: 'wickstone_test',
    DB_USER: 'wickstone_test',
    DB_PASSWORD: 'wickstone-test',
  };
  // Tests make a database per file, so the test user may create databases.
  ensureDatabase(db, {
    database: dbEnv.DB_NAME,
    user: dbEnv.DB_USER,
    password: dbEnv.DB_PASSWORD,
    allDatabases: true,
  });
  sql(db, 'SELECT 1');

  const env = {
    ...process.env,
    ...dbEnv,
    NODE_ENV: 'test',
    LOG_LEVEL: 'silent',
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(smtpPort),
    FAKE_MAIL_API_URL: `http://127.0.0.1:${mailHttpPort}`,
    CHROMIUM_PATH: '/usr/bin/chromium',
  };
  children.push(
    startChild('mail', 'node', ['scripts/fake-smtp.mjs'], {
      env: { ...env, FAKE_MAIL_HTTP_PORT: String(mailHttpPort) },
    }),
  );
  await waitForHttp(`http://127.0.0.1:${mailHttpPort}/messages`);
  const payments = await startFakePayments({ port: Number(process.env.TEST_FAKE_PAYMENTS_PORT ?? 12111) });
  children.push(payments.child);
  Object.assign(env, payments.env);

  log('running every test (vitest run)');
  code = runStatus('npx', ['vitest', 'run'], { env });
} catch (err) {
  console.error(`[wickstone] test set-up failed: ${err instanceof Error ? err.message : err}`);
  code = typeof err?.exitCode === 'number' && err.exitCode !== 0 ? err.exitCode : 1;
} finally {
  await cleanup();
}
process.exit(code);
