import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import type { Sequelize } from 'sequelize';
import { createApp } from '@wickstone/server/app';
import { loadConfig } from '@wickstone/server/config';
import { createLogger } from '@wickstone/server/logger';
import { createSequelize, initModels, migrateUp } from '@wickstone/server/db';
import {
  ensureDatabase,
  instance,
  startMariaDB,
  stopMariaDB,
  type MariaDBInstance,
} from '../../scripts/lib/mariadb.mjs';

/**
 * A fault test's own MariaDB, so stopping or killing it harms no other test (fault-test files run
 * one at a time, so they share its port; TEST_FAULT_DB_PORT moves it for several checkouts), and
 * the app over it on a free loopback port.
 */
export interface FaultServer {
  inst: MariaDBInstance;
  sequelize: Sequelize;
  /** `http://127.0.0.1:<port>/api/v1` */
  api: string;
  close(): Promise<void>;
}

export async function startFaultServer(name: string, opts: { migrate?: boolean } = {}): Promise<FaultServer> {
  const port = process.env.TEST_FAULT_DB_PORT ?? '3399';
  const dir = mkdtempSync(path.join(tmpdir(), `wst-${name}-`));
  const inst = instance(dir, Number(port));
  await startMariaDB(inst, { quiet: true });
  ensureDatabase(inst, { database: name, user: name, password: `${name}-pass` });
  const config = loadConfig({
    DB_PORT: port,
    DB_NAME: name,
    DB_USER: name,
    DB_PASSWORD: `${name}-pass`,
    LOG_LEVEL: 'silent',
    NODE_ENV: 'test',
    BCRYPT_COST: '4',
  });
  const sequelize = createSequelize(config.db);
  if (opts.migrate) {
    initModels(sequelize);
    await migrateUp(sequelize);
  }
  const app = createApp({ config, sequelize, logger: createLogger(config) });
  const server: Server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  return {
    inst,
    sequelize,
    api: `http://127.0.0.1:${(server.address() as AddressInfo).port}/api/v1`,
    async close() {
      server.closeAllConnections();
      await new Promise((r) => server.close(r));
      await sequelize.close();
      await stopMariaDB(inst, { quiet: true });
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
