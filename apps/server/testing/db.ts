import { randomBytes } from 'node:crypto';
import * as mariadb from 'mariadb';
import type { Sequelize } from 'sequelize';
import { loadConfig, type Config } from '../src/config.js';
import { createSequelize } from '../src/db/sequelize.js';
import { initModels } from '../src/db/models/index.js';
import { migrateUp } from '../src/db/migrator.js';

export interface TestDatabase {
  config: Config;
  sequelize: Sequelize;
  /** Close the pool and drop the database. */
  drop(): Promise<void>;
}

async function admin<T>(config: Config, fn: (conn: mariadb.Connection) => Promise<T>): Promise<T> {
  const conn = await mariadb.createConnection({
    host: config.db.host,
    port: config.db.port,
    user: config.db.user,
    password: config.db.password,
  });
  try {
    return await fn(conn);
  } finally {
    await conn.end();
  }
}

/** A database name no other test file uses: `wst_` (what the test user may create), time, random. */
export const testDatabaseName = (): string =>
  `wst_${Date.now().toString(36)}_${randomBytes(3).toString('hex')}`;

/**
 * A fresh, migrated database on the test MariaDB that `npm test` started, private to the caller,
 * so test files can run in parallel without seeing each other's rows. `name` when the caller must
 * know it beforehand (the replica test sets up replication of it first).
 */
export async function createTestDatabase(
  overrides: NodeJS.ProcessEnv = {},
  name = testDatabaseName(),
): Promise<TestDatabase> {
  const config = loadConfig({
    ...process.env,
    NODE_ENV: 'test',
    LOG_LEVEL: 'silent',
    ...overrides,
    DB_NAME: name,
  });
  await admin(config, (c) =>
    c.query(`CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`),
  );
  const sequelize = createSequelize(config.db);
  initModels(sequelize);
  await migrateUp(sequelize);
  return {
    config,
    sequelize,
    async drop() {
      await sequelize.close();
      await admin(config, (c) => c.query(`DROP DATABASE IF EXISTS \`${name}\``));
    },
  };
}
