import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { createApp } from '@wickstone/server/app';
import { createLogger } from '@wickstone/server/logger';
import { createTestDatabase, type TestDatabase } from '@wickstone/server/testing';

export interface RunningApp {
  url: string;
  db: TestDatabase;
  stop(): Promise<void>;
}

/** The real app (built dashboard included) on a free loopback port, over a fresh test database. */
export async function startApp(env: NodeJS.ProcessEnv = {}): Promise<RunningApp> {
  const db = await createTestDatabase(env);
  const app = createApp({ config: db.config, sequelize: db.sequelize, logger: createLogger(db.config) });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    db,
    async stop() {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await db.drop();
    },
  };
}
