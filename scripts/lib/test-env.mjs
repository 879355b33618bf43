// The test environment shared by `npm test` and `npm run test:env`: a private test MariaDB
// (var/mariadb-test) and the fake SMTP server, and the environment the tests read. `test:env`
// leaves both running and writes that environment to var/test-env.env, which the root
// vitest.config.ts loads, so a plain `npx vitest run <file>` finds them.
import { existsSync, mkdirSync, openSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { spawn } from 'node:child_process';
import { ensureDatabase, instance, sql, startMariaDB, stopMariaDB } from './mariadb.mjs';
import { isAlive, log, readPid, root, stopPid, waitForHttp } from './proc.mjs';

export const testEnvFile = path.join(root, 'var', 'test-env.env');
const smtpPidFile = path.join(root, 'var', 'test-env-smtp.pid');
const smtpLogFile = path.join(root, 'var', 'test-env-smtp.log');
const paymentsPidFile = path.join(root, 'var', 'test-env-payments.pid');

/**
 * Ports from TEST_DB_PORT, TEST_SMTP_PORT, TEST_FAKE_MAIL_HTTP_PORT and TEST_FAKE_PAYMENTS_PORT
 * (several checkouts can test at once).
 */
export function testPorts(env = process.env) {
  return {
    db: Number(env.TEST_DB_PORT ?? 3308),
    smtp: Number(env.TEST_SMTP_PORT ?? 2526),
    mailHttp: Number(env.TEST_FAKE_MAIL_HTTP_PORT ?? 8026),
    payments: Number(env.TEST_FAKE_PAYMENTS_PORT ?? 12111),
  };
}

export function testDbInstance(ports) {
  return instance(path.join(root, 'var', 'mariadb-test'), ports.db);
}

/** Everything a test process needs to reach the test database and the fake mailbox. */
export function testEnv(ports, env = process.env) {
  return {
    DB_HOST: '127.0.0.1',
    DB_PORT: String(ports.db),
    DB_NAME: 'wickstone_test',
    DB_USER: 'wickstone_test',
    DB_PASSWORD: 'wickstone-test',
    NODE_ENV: 'test',
    LOG_LEVEL: 'silent',
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(ports.smtp),
    FAKE_MAIL_API_URL: `http://127.0.0.1:${ports.mailHttp}`,
    // The payments provider's fake (scripts/fake-payments.mjs); tests make their own accounts in it.
    PAYMENTS_API_URL: `http://127.0.0.1:${ports.payments}`,
    CHROMIUM_PATH: '/usr/bin/chromium',
    ...(env.TEST_FAULT_DB_PORT ? { TEST_FAULT_DB_PORT: env.TEST_FAULT_DB_PORT } : {}),
    ...(env.TEST_REPLICA_DB_PORT ? { TEST_REPLICA_DB_PORT: env.TEST_REPLICA_DB_PORT } : {}),
  };
}

/**
 * The test MariaDB writes a binary log (row events, GTIDs), so the read-replica test
 * (tests/scale/replica.test.ts) can start a replica of it. Kept a day at most: the instance is
 * recreated by every `npm test` anyway.
 */
export const TEST_PRIMARY_ARGS = [
  '--log-bin=binlog',
  '--server-id=1',
  '--binlog-format=ROW',
  '--binlog-expire-logs-seconds=86400',
];

/**
 * Start the test MariaDB (from an empty data folder when `fresh`, so nothing left from an earlier
 * run can change a result) and its user, who may create databases: every test file makes its own.
 */
export async function startTestDatabase(db, { fresh }) {
  if (fresh) {
    await stopMariaDB(db, { quiet: true });
    rmSync(db.dir, { recursive: true, force: true });
  }
  await startMariaDB(db, { args: TEST_PRIMARY_ARGS });
  ensureDatabase(db, {
    database: 'wickstone_test',
    user: 'wickstone_test',
    password: 'wickstone-test',
    allDatabases: true,
  });
  sql(db, 'SELECT 1');
}

/** The fake SMTP server as a detached process that outlives this script; its pid goes to var/. */
async function startDetachedFakeSmtp(ports) {
  const known = readPid(smtpPidFile);
  if (known && isAlive(known)) return known;
  mkdirSync(path.dirname(smtpPidFile), { recursive: true });
  const out = openSync(smtpLogFile, 'a');
  const child = spawn('node', ['scripts/fake-smtp.mjs'], {
    cwd: root,
    detached: true,
    stdio: ['ignore', out, out],
    env: { ...process.env, SMTP_PORT: String(ports.smtp), FAKE_MAIL_HTTP_PORT: String(ports.mailHttp) },
  });
  child.unref();
  writeFileSync(smtpPidFile, `${child.pid}\n`);
  await waitForHttp(`http://127.0.0.1:${ports.mailHttp}/messages`);
  return child.pid;
}

/** The payments provider's fake, detached like the fake SMTP server (its state in memory). */
async function startDetachedFakePayments(ports) {
  const known = readPid(paymentsPidFile);
  if (known && isAlive(known)) return known;
  const out = openSync(path.join(root, 'var', 'test-env-payments.log'), 'a');
  const child = spawn('node', ['scripts/fake-payments.mjs'], {
    cwd: root,
    detached: true,
    stdio: ['ignore', out, out],
    env: { ...process.env, FAKE_PAYMENTS_PORT: String(ports.payments) },
  });
  child.unref();
  writeFileSync(paymentsPidFile, `${child.pid}\n`);
  await waitForHttp(`http://127.0.0.1:${ports.payments}/_fake/health`);
  return child.pid;
}

/** `npm run test:env`: start them, keep them running, write the environment file. */
export async function startTestEnv(ports = testPorts()) {
  await startTestDatabase(testDbInstance(ports), { fresh: false });
  const smtpPid = await startDetachedFakeSmtp(ports);
  await startDetachedFakePayments(ports);
  const env = testEnv(ports);
  writeFileSync(
    testEnvFile,
    `# Written by \`npm run test:env\`; the root vitest.config.ts loads it. Stop: npm run test:env:stop\n${Object.entries(
      env,
    )
      .map(([k, v]) => `${k}=${v}`)
      .join('\n')}\n`,
  );
  log(
    `test MariaDB on 127.0.0.1:${ports.db}, fake SMTP on ${ports.smtp} (pid ${smtpPid}), fake payments on ${ports.payments}`,
  );
  log(`environment written to ${path.relative(root, testEnvFile)}: now run  npx vitest run <file>`);
}

/** Stop what `startTestEnv` left running (the ports are read back from its file) and remove the file. */
export async function stopTestEnv() {
  const written = existsSync(testEnvFile) ? readEnvFile(testEnvFile) : {};
  const port = Number(written.DB_PORT ?? testPorts().db);
  await stopPid(readPid(smtpPidFile), 5_000);
  rmSync(smtpPidFile, { force: true });
  await stopPid(readPid(paymentsPidFile), 5_000);
  rmSync(paymentsPidFile, { force: true });
  await stopMariaDB(testDbInstance({ db: port }), { quiet: true });
  rmSync(testEnvFile, { force: true });
}

function readEnvFile(file) {
  return Object.fromEntries(
    readFileSync(file, 'utf8')
      .split('\n')
      .filter((l) => l && !l.startsWith('#') && l.includes('='))
      .map((l) => [l.slice(0, l.indexOf('=')), l.slice(l.indexOf('=') + 1)]),
  );
}
