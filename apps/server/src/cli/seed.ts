import { loadConfig } from '../config.js';
import { createSequelize } from '../db/sequelize.js';
import { initModels } from '../db/models/index.js';
import { seedDemo } from '../db/seed/demo.js';

const config = loadConfig();
const sequelize = createSequelize(config.db);
initModels(sequelize);
try {
  const summary = await seedDemo(sequelize);
  console.log(summary);
} finally {
  await sequelize.close();
}
