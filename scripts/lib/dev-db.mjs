// The private development MariaDB (var/mariadb), shared by `npm run dev` and `npm run db:start`.
import path from 'node:path';
import { ensureDatabase, instance, startMariaDB } from './mariadb.mjs';
import { root } from './proc.mjs';

export function devDbInstance(port = Number(process.env.DB_PORT ?? 3307)) {
  return instance(path.join(root, 'var', 'mariadb'), port);
}

/**
 * Start it (if it is not running) with the app's database and user, and return the DB_* variables.
 * The user may also create and drop the `wst_*` databases that each server test file makes, so
 * tests can run against this instance too (export its DB_* and run `npx vitest run <file>`).
 */
export async function startDevDatabase(db, env = process.env) {
  await startMariaDB(db);
  const dbEnv = {
    DB_HOST: '127.0.0.1',
    DB_PORT: String(db.port),
    DB_NAME: env.DB_NAME ?? 'wickstone',
    DB_USER: env.DB_USER ?? 'wickstone',
    DB_PASSWORD: env.DB_PASSWORD ?? 'wickstone-local',
  };
  ensureDatabase(db, {
    database: dbEnv.DB_NAME,
    user: dbEnv.DB_USER,
    password: dbEnv.DB_PASSWORD,
    alsoPattern: 'wst\\_%',
  });
  return dbEnv;
}
