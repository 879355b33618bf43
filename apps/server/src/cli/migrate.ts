import { loadConfig } from '../config.js';
import { createSequelize } from '../db/sequelize.js';
import { migrateUp } from '../db/migrator.js';

const config = loadConfig();
const sequelize = createSequelize(config.db);
try {
  const applied = await migrateUp(sequelize);
  console.log(applied.length ? `migrations applied: ${applied.join(', ')}` : 'migrations: up to date');
} finally {
  await sequelize.close();
}
