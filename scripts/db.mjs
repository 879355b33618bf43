// npm run db:start | db:stop — the private development database on its own (`npm run dev` uses the same code).
import { stopMariaDB } from './lib/mariadb.mjs';
import { devDbInstance, startDevDatabase } from './lib/dev-db.mjs';

const inst = devDbInstance();
const cmd = process.argv[2];
if (cmd === 'start') {
  await startDevDatabase(inst);
} else if (cmd === 'stop') {
  await stopMariaDB(inst);
} else {
  console.error('usage: node scripts/db.mjs start|stop');
  process.exit(2);
}
