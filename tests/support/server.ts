import type { AddressInfo } from 'node:net';
import { createServer, type Server } from 'node:http';
import { createApp } from '@wickstone/server/app';
import { createLogger } from '@wickstone/server/logger';
import { createTestDatabase, type TestDatabase } from '@wickstone/server/testing';

export interface RunningApp {
  url: string;
  db: TestDatabase;
  stop(): Promise<void>;
}

function listen(server: Server): Promise<number> {
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => resolve((server.address() as AddressInfo).port));
  });
}

/**
 * The real app (built dashboard included) on a free loopback port, over a fresh test database.
 * The port is taken before the config is built, so links the app e-mails (built from PORT or
 * PUBLIC_URL) point back at this very server; `env` overrides anything else in the config.
 */
export async function startApp(env: NodeJS.ProcessEnv = {}): Promise<RunningApp> {
  const server = createServer();
  const port = await listen(server);
  const url = `http://127.0.0.1:${port}`;
  let db: TestDatabase;
  try {
    db = await createTestDatabase({ HOST: '127.0.0.1', PORT: String(port), PUBLIC_URL: url, ...env });
  } catch (err) {
    server.close();
    throw err;
  }
  // Nothing can have connected yet (nobody knows the port): the app takes over every request from here.
  server.on(
    'request',
    createApp({ config: db.config, sequelize: db.sequelize, logger: createLogger(db.config) }),
  );
  return {
    url,
    db,
    async stop() {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await db.drop();
    },
  };
}

/** The fake SMTP server and its mailbox API that `npm test` / `test:env` started, for an app that sends mail. */
export function mailEnv(): NodeJS.ProcessEnv {
  return {
    SMTP_HOST: process.env.SMTP_HOST ?? '127.0.0.1',
    SMTP_PORT: process.env.SMTP_PORT,
    FAKE_MAIL_API_URL: process.env.FAKE_MAIL_API_URL,
  };
}
