// `npm start`: install, build, start a private MariaDB, migrate, seed the demo, then run the fake
// SMTP server and the app until Ctrl-C, which stops everything this script started.
import path from 'node:path';
import {
  ensureDatabase,
  ensureMariaDBInstalled,
  instance,
  startMariaDB,
  stopMariaDB,
} from './lib/mariadb.mjs';
import { isAlive, log, readPid, root, run, startChild, stopPid, waitForHttp } from './lib/proc.mjs';
import { build, ensureNodeModules } from './lib/setup.mjs';
import { startFakePayments } from './lib/payments.mjs';
import { ensureSessionSecret } from './lib/secrets.mjs';

const port = Number(process.env.PORT ?? 5180);
const dbPort = Number(process.env.DB_PORT ?? 3307);
const smtpPort = Number(process.env.SMTP_PORT ?? 2525);
const mailHttpPort = Number(process.env.FAKE_MAIL_HTTP_PORT ?? 8025);
const demoPort = Number(process.env.DEMO_SITE_PORT ?? 5181);
const demoSnippets = path.join(root, 'var', 'demo-site.json');

const db = instance(path.join(root, 'var', 'mariadb'), dbPort);
const children = [];
let startedDb = false;

async function shutdown(code = 0) {
  for (const child of children.reverse()) await stopPid(child.pid, 10_000);
  if (startedDb) await stopMariaDB(db);
  process.exit(code);
}
process.on('SIGINT', () => void shutdown(0));
process.on('SIGTERM', () => void shutdown(0));

try {
  ensureNodeModules();
  ensureMariaDBInstalled();
  build();

  const wasRunning = isAlive(readPid(db.pidFile));
  await startMariaDB(db);
  startedDb = !wasRunning;
  const dbEnv = {
    DB_HOST: '127.0.0.1',
    DB_PORT: String(dbPort),
    DB_NAME: 'wickstone',
    DB_USER: 'wickstone',
    DB_PASSWORD: 'wickstone-local',
  };
  ensureDatabase(db, { database: dbEnv.DB_NAME, user: dbEnv.DB_USER, password: dbEnv.DB_PASSWORD });

  const env = {
    ...process.env,
    ...dbEnv,
    NODE_ENV: 'development',
    JWT_SECRET: process.env.JWT_SECRET ?? ensureSessionSecret(path.join(root, 'var')),
    PORT: String(port),
    HOST: '127.0.0.1',
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(smtpPort),
    FAKE_MAIL_API_URL: `http://127.0.0.1:${mailHttpPort}`,
    DEMO_SITE_PORT: String(demoPort),
    DEMO_SITE_FILE: demoSnippets,
  };
  const payments = await startFakePayments({
    port: Number(process.env.FAKE_PAYMENTS_PORT ?? 12110),
    stateFile: path.join(root, 'var', 'payments', 'state.json'),
    webhookUrl: `http://127.0.0.1:${port}/api/v1/billing/webhook`,
  });
  children.push(payments.child);
  Object.assign(env, payments.env);
  run('node', ['apps/server/dist/cli/migrate.js'], { env });
  run('node', ['apps/server/dist/cli/seed.js'], { env });

  children.push(
    startChild('mail', 'node', ['scripts/fake-smtp.mjs'], {
      env: {
        ...env,
        FAKE_MAIL_HTTP_PORT: String(mailHttpPort),
        FAKE_MAIL_FILE: path.join(root, 'var', 'mail', 'messages.jsonl'),
      },
    }),
  );
  // Calm by default: no line per request (errors still show). LOG_LEVEL=info brings the request log back.
  const server = startChild('app', 'node', ['apps/server/dist/index.js'], {
    env: { ...env, LOG_LEVEL: process.env.LOG_LEVEL ?? 'error' },
  });
  children.push(server);
  server.on('exit', (code) => {
    if (code !== 0 && code !== null) {
      log(`the app exited with ${code}`);
      void shutdown(1);
    }
  });

  await waitForHttp(`http://127.0.0.1:${port}/api/v1/health`);
  children.push(
    startChild('site', 'node', ['scripts/demo-site.mjs'], {
      env: { ...env, DEMO_SITE_SNIPPETS: demoSnippets },
    }),
  );
  await waitForHttp(`http://127.0.0.1:${demoPort}/`);
  // Everything a person needs, together and last: where to go and how to sign in.
  const { demoUsers } = await import('../apps/server/dist/db/seed/demo.js');
  console.log(
    [
      '',
      `Wickstone is running (Ctrl-C stops everything)`,
      `  dashboard        http://127.0.0.1:${port}`,
      `  demo firm's site http://localhost:${demoPort}  (two embedded widgets)`,
      `  fake mailbox     http://127.0.0.1:${port}/dev/mail`,
      'Demo sign-ins (invented staff of an invented firm):',
      ...demoUsers.map((u) => `  ${u.role.padEnd(10)} ${u.email}  ${u.password}`),
      '',
    ].join('\n'),
  );
} catch (err) {
  console.error(`[wickstone] start failed: ${err instanceof Error ? err.message : err}`);
  await shutdown(1);
}
