import { loadConfig } from '../config.js';
import { createSequelize } from '../db/sequelize.js';
import { migrateUp } from '../db/migrator.js';

const config = loadConfig();
const sequelize = createSequelize(config.db);
try {
  const applied = await migrateUp(sequelize);
  // One short line: how many ran and the newest (the full list is in the SequelizeMeta table).
  console.log(
    applied.length
      ? `migrations: ${applied.length} applied, newest ${applied[applied.length - 1]}`
      : 'migrations: up to date',
  );
} finally {
  await sequelize.close();
}
