// npm run db:start | db:stop — the private development database on its own (start.mjs uses the same code).
import path from 'node:path';
import { ensureDatabase, instance, startMariaDB, stopMariaDB } from './lib/mariadb.mjs';
import { root } from './lib/proc.mjs';

const port = Number(process.env.DB_PORT ?? 3307);
const inst = instance(path.join(root, 'var', 'mariadb'), port);
const cmd = process.argv[2];
if (cmd === 'start') {
  await startMariaDB(inst);
  ensureDatabase(inst, {
    database: process.env.DB_NAME ?? 'wickstone',
    user: process.env.DB_USER ?? 'wickstone',
    password: process.env.DB_PASSWORD ?? 'wickstone-local',
  });
} else if (cmd === 'stop') {
  await stopMariaDB(inst);
} else {
  console.error('usage: node scripts/db.mjs start|stop');
  process.exit(2);
}
