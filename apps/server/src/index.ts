import { loadConfig } from './config.js';
import { createLogger } from './logger.js';
import { createReadSequelize, createSequelize } from './db/sequelize.js';
import { initModels } from './db/models/index.js';
import { createApp } from './app.js';
import { createRetentionService } from './retention/service.js';
import { startRetentionSchedule } from './retention/schedule.js';
import { releaseDirsOf } from './releases/paths.js';
import { createReleaseService } from './releases/service.js';
import { followReleasePins } from './widgets/service.js';

const config = loadConfig();
const logger = createLogger(config);
const sequelize = createSequelize(config.db);
initModels(sequelize);
// The read replica's pool, when one is configured: summaries and runs lists and exports.
const reads = createReadSequelize(config.db);
const app = createApp({ config, sequelize, reads: reads ?? sequelize, logger });
// Daily purge by each organisation's retention setting; tests call the service directly instead.
const retentionSchedule = startRetentionSchedule(
  createRetentionService({ sequelize, chunkSize: config.retention.chunkSize }),
  logger,
  {
    intervalMs: config.retention.purgeIntervalMs,
    firstDelayMs: config.retention.firstPurgeDelayMs,
  },
);

// Widgets pinned to a minor line move to its newest release, which can only have arrived with this deployment.
const releaseDirs = releaseDirsOf(config);
followReleasePins(createReleaseService(releaseDirs.build, config.publicUrl, releaseDirs.published)).then(
  (moved) => {
    if (moved) logger.info({ moved }, 'widgets moved to the newest release of their pinned line');
  },
  (err: unknown) => logger.error({ err }, 'following release pins failed'),
);

const server = app.listen(config.port, config.host, () => {
  logger.info({ url: `http://${config.host}:${config.port}` }, 'wickstone server listening');
});

let stopping = false;
async function shutdown(signal: string): Promise<void> {
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, 'shutting down');
  retentionSchedule.stop();
  // Stop taking connections, let requests in flight finish, then close the pool.
  server.close(async () => {
    await sequelize.close().catch(() => undefined);
    await reads?.close().catch(() => undefined);
    process.exit(0);
  });
  server.closeIdleConnections();
  setTimeout(() => process.exit(1), 10_000).unref();
}

process.on('SIGTERM', () => void shutdown('SIGTERM'));
process.on('SIGINT', () => void shutdown('SIGINT'));
