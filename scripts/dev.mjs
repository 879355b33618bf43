// `npm run dev`: the server from its TypeScript source with watch (tsx), the dashboard on Vite's
// dev server (proxying /api and /releases to it), the engine and contracts rebuilt on change, the
// fake SMTP server, all against the development MariaDB. Ctrl-C stops everything this started.
//   PORT (server, 5180)  DASHBOARD_PORT (5173)  DB_PORT (3307)  SMTP_PORT (2525)  FAKE_MAIL_HTTP_PORT (8025)
import path from 'node:path';
import { ensureMariaDBInstalled, stopMariaDB } from './lib/mariadb.mjs';
import { isAlive, log, readPid, root, run, startChild, supervisor, waitForHttp } from './lib/proc.mjs';
import { ensureNodeModules } from './lib/setup.mjs';
import { devDbInstance, startDevDatabase } from './lib/dev-db.mjs';

const port = Number(process.env.PORT ?? 5180);
const dashboardPort = Number(process.env.DASHBOARD_PORT ?? 5173);
const smtpPort = Number(process.env.SMTP_PORT ?? 2525);
const mailHttpPort = Number(process.env.FAKE_MAIL_HTTP_PORT ?? 8025);
const db = devDbInstance();
// Each tool straight from node_modules/.bin (not through npx), so stopping its pid stops it.
const bin = (name) => path.join(root, 'node_modules', '.bin', name);
const running = supervisor();

try {
  ensureNodeModules();
  ensureMariaDBInstalled();
  // The server imports the engine's and contracts' builds and serves the widget's releases.
  run('npx', [
    'turbo',
    'run',
    'build',
    '--filter=@wickstone/calc-core',
    '--filter=@wickstone/contracts',
    '--filter=@wickstone/widget',
    '--output-logs=errors-only',
  ]);
  if (!isAlive(readPid(db.pidFile))) running.onStop(() => stopMariaDB(db));
  const env = {
    ...process.env,
    ...(await startDevDatabase(db)),
    NODE_ENV: 'development',
    PORT: String(port),
    HOST: '127.0.0.1',
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(smtpPort),
    FAKE_MAIL_API_URL: `http://127.0.0.1:${mailHttpPort}`,
  };
  run('npx', ['tsx', 'apps/server/src/cli/migrate.ts'], { env });

  const { default: pretty } = await import('pino-pretty');
  const watch = (name, pkg) =>
    startChild(name, bin('tsc'), ['-p', `${pkg}/tsconfig.build.json`, '--watch', '--preserveWatchOutput'], {
      env,
    });
  running.add(watch('calc-core', 'packages/calc-core'));
  running.add(watch('contracts', 'packages/contracts'));
  running.add(
    startChild('mail', 'node', ['scripts/fake-smtp.mjs'], {
      env: { ...env, FAKE_MAIL_HTTP_PORT: String(mailHttpPort) },
    }),
  );
  // The server's JSON log lines, made readable.
  const server = running.add(
    startChild('app', bin('tsx'), ['watch', '--clear-screen=false', 'apps/server/src/index.ts'], { env }),
  );
  server.stdout.removeAllListeners('data');
  server.stdout.pipe(pretty({ colorize: process.stdout.isTTY, sync: true }));
  await waitForHttp(`http://127.0.0.1:${port}/api/v1/health`, 120_000);
  running.add(
    startChild('dashboard', bin('vite'), ['--port', String(dashboardPort), '--strictPort'], {
      cwd: path.join(root, 'apps', 'dashboard'),
      env: { ...env, WICKSTONE_API_URL: `http://127.0.0.1:${port}` },
    }),
  );
  await waitForHttp(`http://127.0.0.1:${dashboardPort}/`, 120_000);
  log(`dashboard (Vite, hot reload): http://127.0.0.1:${dashboardPort}   API: http://127.0.0.1:${port}`);
  log('the server restarts when its source changes; Ctrl-C stops everything');
} catch (err) {
  console.error(`[wickstone] dev failed: ${err instanceof Error ? err.message : err}`);
  await running.stop(1);
}
