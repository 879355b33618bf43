// What the usage benchmark's two scripts share: the private database they run in, and the one
// invented organisation the million runs belong to.
import { parseArgs } from 'node:util';
import * as mariadb from 'mariadb';
import type { Sequelize } from 'sequelize';
import { loadConfig, type Config } from '../src/config.js';
import { createSequelize } from '../src/db/sequelize.js';
import { initModels, Organization } from '../src/db/models/index.js';
import { migrateUp } from '../src/db/migrator.js';

export const BENCH_ORG_SLUG = 'bench-brackenridge-ground';

export const args = parseArgs({
  options: {
    db: { type: 'string', default: 'wst_bench_usage' },
    runs: { type: 'string', default: '1000000' },
    batch: { type: 'string', default: '2000' },
    iterations: { type: 'string', default: '20' },
    // A plain GROUP BY over a million rows takes minutes here: fewer timed runs of those.
    'raw-iterations': { type: 'string', default: '5' },
    fresh: { type: 'boolean', default: false },
  },
  strict: true,
}).values;

/** The configured MariaDB, but a database of the benchmark's own (never the app's or the tests'). */
export async function openBenchDatabase(
  opts: { fresh?: boolean; db?: string } = {},
): Promise<{ sequelize: Sequelize; config: Config }> {
  const config = loadConfig({ ...process.env, LOG_LEVEL: 'silent', DB_NAME: opts.db ?? args.db });
  const admin = await mariadb.createConnection({
    host: config.db.host,
    port: config.db.port,
    user: config.db.user,
    password: config.db.password,
  });
  try {
    if (opts.fresh) await admin.query(`DROP DATABASE IF EXISTS \`${config.db.name}\``);
    await admin.query(
      `CREATE DATABASE IF NOT EXISTS \`${config.db.name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
    );
  } finally {
    await admin.end();
  }
  const sequelize = createSequelize(config.db);
  initModels(sequelize);
  await migrateUp(sequelize);
  return { sequelize, config };
}

export async function benchOrganization(): Promise<Organization | null> {
  return Organization.findOne({ where: { slug: BENCH_ORG_SLUG } });
}

export const seconds = (ms: number): string => `${(ms / 1000).toFixed(1)} s`;
