export { createReadSequelize, createSequelize } from './sequelize.js';
export { createMigrator, migrateUp } from './migrator.js';
export { initModels } from './models/index.js';
