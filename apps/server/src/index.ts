import { loadConfig } from './config.js';
import { createLogger } from './logger.js';
import { createSequelize } from './db/sequelize.js';
import { initModels } from './db/models/index.js';
import { createApp } from './app.js';

const config = loadConfig();
const logger = createLogger(config);
const sequelize = createSequelize(config.db);
initModels(sequelize);
const app = createApp({ config, sequelize, logger });

const server = app.listen(config.port, config.host, () => {
  logger.info({ url: `http://${config.host}:${config.port}` }, 'wickstone server listening');
});

let stopping = false;
async function shutdown(signal: string): Promise<void> {
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, 'shutting down');
  // Stop taking connections, let requests in flight finish, then close the pool.
  server.close(async () => {
    await sequelize.close().catch(() => undefined);
    process.exit(0);
  });
  server.closeIdleConnections();
  setTimeout(() => process.exit(1), 10_000).unref();
}

process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('SIGINT', () => void shutdown('SIGINT'));
