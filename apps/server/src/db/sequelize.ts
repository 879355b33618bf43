import * as mariadb from 'mariadb';
import { Sequelize } from 'sequelize';
import type { Config } from '../config.js';

/**
 * One pool per process. Timeouts are short so that a database outage answers 503 within seconds
 * instead of holding requests for the pool's one-minute default.
 *
 * Always give `sequelize.query` a `type` (QueryTypes.SELECT, ...): with the mariadb 3 connector an
 * untyped raw query fails inside Sequelize 6 ("Cannot delete property 'meta'").
 */
export function createSequelize(db: Config['db']): Sequelize {
  return new Sequelize({
    dialect: 'mariadb',
    // Handed over explicitly so Sequelize uses this package's pinned connector, wherever npm put it.
    dialectModule: mariadb,
    host: db.host,
    port: db.port,
    database: db.name,
    username: db.user,
    password: db.password,
    logging: false,
    timezone: '+00:00',
    pool: { max: db.poolMax, min: 0, acquire: 5_000, idle: 10_000, evict: 5_000 },
    dialectOptions: { connectTimeout: 3_000 },
    define: { underscored: true },
  });
}

/**
 * The pool for reads that may come from the read replica (`DB_READ_HOST`): Sequelize's read/write
 * replication, so its SELECTs outside a transaction go to the replica and anything else it is asked
 * to do goes to the primary. Only the reads that can stand a replica's lag take it (usage
 * summaries, the runs list and export: what visitors' reports add, never what the signed-in user
 * has just changed); everything else uses the primary's own pool, so a dashboard that writes and
 * reads back sees its write at once. Without a replica: null, and those reads use the primary.
 */
export function createReadSequelize(db: Config['db']): Sequelize | null {
  if (!db.read) return null;
  return new Sequelize({
    dialect: 'mariadb',
    dialectModule: mariadb,
    database: db.name,
    replication: {
      read: [{ host: db.read.host, port: db.read.port, username: db.read.user, password: db.read.password }],
      write: { host: db.host, port: db.port, username: db.user, password: db.password },
    },
    logging: false,
    timezone: '+00:00',
    pool: { max: db.poolMax, min: 0, acquire: 5_000, idle: 10_000, evict: 5_000 },
    dialectOptions: { connectTimeout: 3_000 },
    define: { underscored: true },
  });
}
